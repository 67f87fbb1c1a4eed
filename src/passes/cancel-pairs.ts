// Pass: cancel adjacent inverse pairs of the decomposed basis on each qubit (h h, x x, y y, z z, s sdg, t tdg, cx cx), repeatedly, in one linear sweep.
import type { Circuit, GateOp, Stmt } from "../ir/circuit.js";

/** One-qubit basis gates and their exact inverses (each product is the identity matrix, not just up to phase). */
const INVERSE: ReadonlyMap<string, string> = new Map([
  ["h", "h"],
  ["x", "x"],
  ["y", "y"],
  ["z", "z"],
  ["s", "sdg"],
  ["sdg", "s"],
  ["t", "tdg"],
  ["tdg", "t"],
]);

/**
 * Remove every pair of adjacent mutually inverse gates, where adjacent means nothing acts on any of
 * the pair's qubits in between: a one-qubit gate followed by its inverse on the same qubit, or two
 * uncontrolled `cx` on the same control and target. Removal repeats through the pairs it exposes
 * (`h x x h` vanishes), using one stack per qubit of the indices of the live gates since the last
 * fence, so the sweep is linear in the number of statements. Every other gate (rz, U, controlled
 * ones) stays and blocks cancellation across it on its qubits. Measure, reset, barrier and delay fence
 * their qubits (all qubits when they list none); pragmas, annotations and if/while/box blocks fence
 * every qubit, and the pass recurses into the blocks' bodies. The unitary is unchanged exactly.
 * Meant to run after decompose and euler-split, so that merge-rotations sees `rz rz` where
 * `h rz h h rz h` stood.
 */
export function cancelPairs(circuit: Circuit): Circuit {
  return { ...circuit, body: cancelBody(circuit.body) };
}

function cancelBody(body: readonly Stmt[]): Stmt[] {
  // out[i] is null once statement i has been cancelled; every index on a stack is a live gate.
  const out: (Stmt | null)[] = new Array<Stmt | null>(body.length);
  const stacks = new Map<number, number[]>();
  const top = (q: number): number | undefined => {
    const st = stacks.get(q);
    return st === undefined || st.length === 0 ? undefined : st[st.length - 1];
  };
  const push = (q: number, i: number): void => {
    const st = stacks.get(q);
    if (st) st.push(i);
    else stacks.set(q, [i]);
  };
  const fence = (qubits: readonly number[]): void => {
    if (qubits.length === 0) stacks.clear();
    else for (const q of qubits) stacks.delete(q);
  };

  for (let i = 0; i < body.length; i++) {
    const s = body[i]!;
    out[i] = s;
    switch (s.kind) {
      case "gate":
        if (cancelsTop(s, out, top)) {
          for (const q of s.qubits) stacks.get(q)!.pop();
          out[i] = null;
          continue;
        }
        for (const q of s.qubits) push(q, i);
        break;
      case "measure":
      case "reset":
        fence([s.qubit]);
        break;
      case "barrier":
      case "delay":
        fence(s.qubits);
        break;
      case "pragma":
      case "annotation":
        stacks.clear();
        break;
      case "if":
        stacks.clear();
        out[i] = { ...s, then: cancelBody(s.then), else: cancelBody(s.else) };
        break;
      case "while":
      case "box":
        stacks.clear();
        out[i] = { ...s, body: cancelBody(s.body) };
        break;
    }
  }
  const kept: Stmt[] = [];
  for (const s of out) if (s !== null) kept.push(s);
  return kept;
}

/**
 * True when `g` is the inverse of the live gate on top of its qubits' stacks; that gate is then
 * marked cancelled (the caller pops the stacks).
 */
function cancelsTop(g: GateOp, out: (Stmt | null)[], top: (q: number) => number | undefined): boolean {
  if (g.ctrl.length > 0) return false;
  if (g.qubits.length === 1) {
    const inv = INVERSE.get(g.name);
    if (inv === undefined) return false;
    const j = top(g.qubits[0]!);
    if (j === undefined) return false;
    const prev = out[j] as GateOp;
    if (prev.name !== inv || prev.ctrl.length > 0 || prev.qubits.length !== 1) return false;
    out[j] = null;
    return true;
  }
  if (g.name === "cx" && g.qubits.length === 2) {
    const [c, t] = g.qubits as [number, number];
    if (c === t) return false;
    const j = top(c);
    if (j === undefined || top(t) !== j) return false;
    const prev = out[j] as GateOp;
    if (prev.name !== "cx" || prev.ctrl.length > 0 || prev.qubits[0] !== c || prev.qubits[1] !== t) return false;
    out[j] = null;
    return true;
  }
  return false;
}
