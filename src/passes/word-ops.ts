// Turn a one-qubit gate word into IR gate operations on one qubit, sharing one op object per (gate, qubit, location).
import type { GateOp, SourceLoc } from "../ir/circuit.js";
import type { Gate1, Word } from "../synth/exact/word.js";

/**
 * Lowered circuits are large (a word of a hundred-odd T gates per rotation, 10^5 rotations), so the
 * ops of words are interned: every "t on qubit 5 from line 12" is the same immutable object. Only the
 * first op of a word may be fresh (`freshFirst`), so that a comment can be attached to it by identity.
 * The table of one (qubit, location) is looked up once per word, not once per gate.
 */
const EMPTY: readonly never[] = Object.freeze([]);
const qubitLists: (readonly number[])[] = [];
const tables = new Map<string, Readonly<Record<Gate1, GateOp>>>();
const GATE_NAMES: readonly Gate1[] = ["h", "s", "sdg", "t", "tdg", "x", "y", "z"];

function qubitList(q: number): readonly number[] {
  return (qubitLists[q] ??= Object.freeze([q]));
}

/** The interned ops of every one-qubit gate on qubit q carrying loc. */
export function opTable(q: number, loc: SourceLoc): Readonly<Record<Gate1, GateOp>> {
  const key = `${q}\u0000${loc.line}\u0000${loc.col}\u0000${loc.file}`;
  let t = tables.get(key);
  if (!t) {
    const qs = qubitList(q);
    const rec = {} as Record<Gate1, GateOp>;
    for (const name of GATE_NAMES) rec[name] = Object.freeze({ kind: "gate" as const, name, params: EMPTY, qubits: qs, ctrl: EMPTY, loc });
    t = Object.freeze(rec);
    if (tables.size > 200_000) tables.clear();
    tables.set(key, t);
  }
  return t;
}

/** The ops of `word` (circuit order) on qubit `q`, all carrying `loc`, appended to `out`. */
export function pushWordOps(out: GateOp[], word: Word, q: number, loc: SourceLoc, freshFirst = false): void {
  if (word.length === 0) return;
  const t = opTable(q, loc);
  const start = out.length;
  for (let i = 0; i < word.length; i++) out.push(t[word[i]!]);
  if (freshFirst) out[start] = { kind: "gate", name: word[0]!, params: EMPTY, qubits: qubitList(q), ctrl: EMPTY, loc };
}

/** The ops of `word` (circuit order) on qubit `q`, all carrying `loc`. */
export function wordOps(word: Word, q: number, loc: SourceLoc, freshFirst = false): GateOp[] {
  const out: GateOp[] = [];
  pushWordOps(out, word, q, loc, freshFirst);
  return out;
}
