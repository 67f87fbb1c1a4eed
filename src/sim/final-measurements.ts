// The unitary part of a circuit that ends in measurements: measurements with nothing after them on their qubit are dropped.
import type { Circuit, Stmt } from "../ir/circuit.js";

function touched(s: Stmt, into: Set<number>, n: number): void {
  switch (s.kind) {
    case "gate":
    case "barrier":
    case "delay":
      if (s.kind !== "gate" && s.qubits.length === 0) for (let q = 0; q < n; q++) into.add(q);
      for (const q of s.qubits) into.add(q);
      return;
    case "measure":
    case "reset":
      into.add(s.qubit);
      return;
    case "if":
      for (const t of [...s.then, ...s.else]) touched(t, into, n);
      return;
    case "while":
    case "box":
      for (const t of s.body) touched(t, into, n);
      return;
    default:
      return;
  }
}

/**
 * A final measurement (no later statement acts on its qubit) does not change the unitary that
 * precedes it, so comparing two programs' unitary parts may drop it. Barriers count as acting on
 * their qubits only for ordering, never as gates; mid-circuit measurements are kept (and the
 * simulator then refuses the circuit, as it must).
 */
export function withoutFinalMeasurements(c: Circuit): { readonly circuit: Circuit; readonly removed: number } {
  const later = new Set<number>();
  const keep: Stmt[] = [];
  let removed = 0;
  for (let i = c.body.length - 1; i >= 0; i--) {
    const s = c.body[i]!;
    if (s.kind === "measure" && !later.has(s.qubit)) {
      removed++;
      continue;
    }
    if (s.kind !== "barrier") touched(s, later, c.numQubits);
    keep.push(s);
  }
  keep.reverse();
  return { circuit: removed === 0 ? c : { ...c, body: keep }, removed };
}
