// Pass: every remaining rz becomes the synthesized Clifford+T word of its distinct angle, with its ledger note; applied while the peephole pass streams.
import type { GateOp } from "../ir/circuit.js";
import type { Word } from "../synth/exact/word.js";
import type { RotationCensus } from "./rotation-groups.js";
import type { Expander } from "./peephole.js";

/**
 * The replacement of each rz op counted in `census` by the word of its group, as an expander for
 * `peephole` (so the lowered circuit, tens of millions of gates for large programs, is built once).
 * `comment(groupIndex, op)` gives the ledger note the writer prints before the block.
 */
export function lowerRotations(
  census: RotationCensus,
  words: readonly Word[],
  comment: (group: number, op: GateOp) => string | undefined,
): Expander {
  return (op) => {
    if (op.name !== "rz") return null;
    const g = census.opGroup.get(op);
    if (g === undefined) throw new Error("internal: an rz op missed the rotation census");
    const note = comment(g, op);
    return note === undefined ? { word: words[g]! } : { word: words[g]!, note };
  };
}
