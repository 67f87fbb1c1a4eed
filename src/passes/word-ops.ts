// Turn a one-qubit gate word into IR gate operations on one qubit, sharing one op object per (gate, qubit, location).
import type { GateOp, SourceLoc } from "../ir/circuit.js";
import type { Word } from "../synth/exact/word.js";

/**
 * Lowered circuits are large (a word of a hundred-odd T gates per rotation, 10^5 rotations), so the
 * ops of words are interned: every "t on qubit 5 from line 12" is the same immutable object. Only the
 * first op of a word may be fresh (`freshFirst`), so that a comment can be attached to it by identity.
 */
const interned = new Map<string, GateOp>();
const EMPTY: readonly never[] = Object.freeze([]);
const qubitLists: (readonly number[])[] = [];

function qubitList(q: number): readonly number[] {
  return (qubitLists[q] ??= Object.freeze([q]));
}

export function gateOp(name: string, q: number, loc: SourceLoc): GateOp {
  const key = `${name}\u0000${q}\u0000${loc.file}\u0000${loc.line}\u0000${loc.col}`;
  let op = interned.get(key);
  if (!op) {
    op = Object.freeze({ kind: "gate" as const, name, params: EMPTY, qubits: qubitList(q), ctrl: EMPTY, loc });
    if (interned.size > 1_000_000) interned.clear();
    interned.set(key, op);
  }
  return op;
}

/** The ops of `word` (circuit order) on qubit `q`, all carrying `loc`. */
export function wordOps(word: Word, q: number, loc: SourceLoc, freshFirst = false): GateOp[] {
  const out: GateOp[] = new Array(word.length);
  for (let i = 0; i < word.length; i++) out[i] = gateOp(word[i]!, q, loc);
  if (freshFirst && word.length > 0) out[0] = { kind: "gate", name: word[0]!, params: EMPTY, qubits: qubitList(q), ctrl: EMPTY, loc };
  return out;
}
