// Turn a one-qubit gate word into IR gate operations on one qubit.
import type { GateOp, SourceLoc } from "../ir/circuit.js";
import type { Word } from "../synth/exact/word.js";

/** The ops of `word` (circuit order) on qubit `q`, all carrying `loc`. */
export function wordOps(word: Word, q: number, loc: SourceLoc): GateOp[] {
  const out: GateOp[] = new Array(word.length);
  for (let i = 0; i < word.length; i++) out[i] = { kind: "gate", name: word[i]!, params: [], qubits: [q], ctrl: [], loc };
  return out;
}
