// Pass: replace every remaining rz by its synthesized Clifford+T word (one word per distinct angle), and remember where each came from.
import type { Circuit, GateOp, Stmt } from "../ir/circuit.js";
import type { Word } from "../synth/exact/word.js";
import type { RotationCensus } from "./rotation-groups.js";
import { wordOps } from "./word-ops.js";

/**
 * Rewrite `circuit`, replacing each rz op counted in `census` by the word of its group.
 * `comment(groupIndex, op)` may return a comment for the block; it is attached to the first op
 * of the block in the returned map (the writer prints it before that op).
 */
export function lowerRotations(
  circuit: Circuit,
  census: RotationCensus,
  words: readonly Word[],
  comment: (group: number, op: GateOp) => string | undefined,
): { circuit: Circuit; comments: Map<GateOp, string[]> } {
  const comments = new Map<GateOp, string[]>();
  const visit = (body: readonly Stmt[]): Stmt[] => {
    const out: Stmt[] = [];
    for (const s of body) {
      if (s.kind === "if") out.push({ ...s, then: visit(s.then), else: visit(s.else) });
      else if (s.kind === "while" || s.kind === "box") out.push({ ...s, body: visit(s.body) });
      else if (s.kind === "gate" && s.name === "rz") {
        const g = census.opGroup.get(s);
        if (g === undefined) throw new Error("internal: an rz op missed the rotation census");
        const text = comment(g, s);
        const ops = wordOps(words[g]!, s.qubits[0]!, s.loc, text !== undefined);
        if (text !== undefined) {
          // An empty word (the identity) still needs a carrier for its comment: a barrier-free
          // choice is to attach it to the next op, which the peephole pass does for dangling notes.
          if (ops.length > 0) comments.set(ops[0]!, [text]);
        }
        out.push(...ops);
      } else out.push(s);
    }
    return out;
  };
  return { circuit: { ...circuit, body: visit(circuit.body) }, comments };
}
