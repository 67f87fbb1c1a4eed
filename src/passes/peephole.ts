// Pass: clean up the Clifford+T circuit: simplify each run of one-qubit gates, cancel adjacent CX pairs; never changes the unitary (up to global phase).
import type { Circuit, GateOp, Stmt } from "../ir/circuit.js";
import { simplifyWord, type Gate1, type Word } from "../synth/exact/word.js";
import { pushWordOps } from "./word-ops.js";

const ONE_QUBIT = new Set<string>(["h", "s", "sdg", "t", "tdg", "x", "y", "z"]);

/** Replaces an op by a one-qubit word as the pass streams (how synthesized rotations enter the circuit). */
export type Expander = (op: GateOp) => { readonly word: Word; readonly note?: string } | null;

interface Run {
  gates: Gate1[];
  first: GateOp;
  notes: string[];
}

/**
 * For each qubit, gather the maximal run of one-qubit Clifford+T gates between other operations
 * on it, simplify the run (simplifyWord keeps its matrix), and emit it just before the operation
 * that ends the run. Gates on other qubits commute with the run, so moving it there is exact.
 * A CX directly following an identical CX on the same pair (nothing in between on either qubit)
 * cancels. `expand` turns ops (the rz of synthesized rotations) into words on the fly, so a
 * lowered circuit of tens of millions of gates is built once; its notes, like `comments` attached
 * to ops of a run, move to the first op emitted for the run (or, when the run vanishes, to the
 * next op emitted on that qubit).
 */
export function peephole(
  circuit: Circuit,
  comments: ReadonlyMap<GateOp, readonly string[]>,
  expand: Expander | null = null,
): { circuit: Circuit; comments: Map<GateOp, string[]> } {
  const outComments = new Map<GateOp, string[]>();
  const attach = (op: GateOp, notes: readonly string[]): void => {
    if (notes.length === 0) return;
    const cur = outComments.get(op);
    if (cur) for (const n of notes) cur.push(n);
    else outComments.set(op, notes.slice());
  };

  const visit = (body: readonly Stmt[]): Stmt[] => {
    const out: (Stmt | null)[] = [];
    let removed = 0;
    const runs = new Map<number, Run>();
    /** Index in `out` of the last op on each qubit, when that op is a CX (for cancellation). */
    const lastCx = new Map<number, number>();
    const dangling = new Map<number, string[]>();

    const flush = (q: number): void => {
      const run = runs.get(q);
      if (!run) return;
      runs.delete(q);
      const simplified: Word = simplifyWord(run.gates);
      const d = dangling.get(q);
      const notes = d ? [...d, ...run.notes] : run.notes;
      dangling.delete(q);
      if (simplified.length > 0) {
        const at = out.length;
        pushWordOps(out as GateOp[], simplified, q, run.first.loc, notes.length > 0);
        attach(out[at] as GateOp, notes);
        lastCx.delete(q);
      } else if (notes.length > 0) dangling.set(q, notes);
    };
    const emit = (s: Stmt, qubits: readonly number[]): void => {
      let carrier: Stmt = s;
      for (const q of qubits) {
        const d = dangling.get(q);
        if (d && s.kind === "gate") {
          // Notes attach by identity, and the same op object may stand at many places (the front end
          // and the word tables share ops): the notes get a fresh copy of the op of their own.
          if (carrier === s) carrier = { ...s };
          attach(carrier as GateOp, d);
          dangling.delete(q);
        }
        lastCx.delete(q);
      }
      out.push(carrier);
    };
    const flushAll = (): void => {
      for (const q of [...runs.keys()].sort((a, b) => a - b)) flush(q);
    };
    const addToRun = (q: number, first: GateOp, gates: readonly Gate1[], notes: readonly string[] | undefined): void => {
      let run = runs.get(q);
      if (!run) {
        run = { gates: [], first, notes: [] };
        runs.set(q, run);
      }
      for (let i = 0; i < gates.length; i++) run.gates.push(gates[i]!);
      if (notes) for (const n of notes) run.notes.push(n);
    };

    for (const s of body) {
      if (s.kind === "gate" && s.ctrl.length === 0) {
        const ex = expand?.(s) ?? null;
        if (ex) {
          addToRun(s.qubits[0]!, s, ex.word, ex.note === undefined ? undefined : [ex.note]);
          continue;
        }
        if (ONE_QUBIT.has(s.name)) {
          addToRun(s.qubits[0]!, s, [s.name as Gate1], comments.get(s));
          continue;
        }
        if (s.name === "cx") {
          const [a, b] = s.qubits as [number, number];
          flush(a);
          flush(b);
          const i = lastCx.get(a);
          const prev = i !== undefined ? (out[i] as GateOp | null) : null;
          if (i !== undefined && lastCx.get(b) === i && prev && prev.qubits[0] === a && prev.qubits[1] === b && !comments.has(s)) {
            out[i] = null;
            removed++;
            lastCx.delete(a);
            lastCx.delete(b);
            const moved = outComments.get(prev);
            if (moved) {
              outComments.delete(prev);
              // to one qubit only: given to both, they would be printed twice (and double at every further cancellation)
              dangling.set(a, (dangling.get(a) ?? []).concat(moved));
            }
            continue;
          }
          emit(s, [a, b]);
          lastCx.set(a, out.length - 1);
          lastCx.set(b, out.length - 1);
          continue;
        }
      }
      if (s.kind === "if" || s.kind === "while" || s.kind === "box") {
        flushAll();
        lastCx.clear();
        if (s.kind === "if") out.push({ ...s, then: visit(s.then), else: visit(s.else) });
        else out.push({ ...s, body: visit(s.body) });
        continue;
      }
      const qs = stmtQubits(s);
      if (qs === "all") {
        flushAll();
        lastCx.clear();
        out.push(s);
        continue;
      }
      for (const q of qs) flush(q);
      emit(s, qs);
    }
    flushAll();
    if (removed === 0) return out as Stmt[];
    // Compact in place: cancelled CX pairs left holes.
    let w = 0;
    for (let r = 0; r < out.length; r++) if (out[r] !== null) out[w++] = out[r]!;
    out.length = w;
    return out as Stmt[];
  };
  return { circuit: { ...circuit, body: visit(circuit.body) }, comments: outComments };
}

function stmtQubits(s: Stmt): readonly number[] | "all" {
  switch (s.kind) {
    case "gate":
    case "barrier":
    case "delay":
      return s.qubits.length === 0 ? "all" : s.qubits;
    case "measure":
    case "reset":
      return [s.qubit];
    default:
      return "all";
  }
}
