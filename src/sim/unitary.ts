// The full unitary of a circuit (up to 10 qubits): the state-vector kernels applied to all 2^n columns of the identity at once.
import type { Circuit } from "../ir/circuit.js";
import { identityMatrix, type CMatrix } from "../ir/gates.js";
import { circuitOps, inverseOps, type OpsOptions } from "./ops.js";
import { applyOps, simulationSizeError } from "./statevector.js";

/** Largest circuit whose unitary is built (1024 x 1024 complex: 16 MiB). */
export const MAX_UNITARY_QUBITS = 10;

/**
 * The circuit's unitary (row-major, qubit 0 = most significant bit of the row index). Row i of the
 * buffer is amplitude i of every column, so one kernel pass per gate updates all columns with
 * unit-stride inner loops. Throws a DiagnosticError for a non-unitary or too-large circuit.
 */
export function circuitUnitary(c: Circuit, opts: OpsOptions = {}): CMatrix {
  if (c.numQubits > MAX_UNITARY_QUBITS) throw simulationSizeError("unitary", c.numQubits, MAX_UNITARY_QUBITS);
  const ops = circuitOps(c, opts);
  const u = identityMatrix(2 ** c.numQubits);
  applyOps(u, c.numQubits, u.dim, ops);
  return u;
}

/**
 * A^dag B for two circuits on the same number of qubits, built by running B on the identity and then
 * A's gates inverted in reverse order. Only products of unitaries occur, so no cancellation creeps in
 * when A and B nearly agree, and no matrix product is needed.
 */
export function circuitAdjointTimes(a: Circuit, b: Circuit, opts: OpsOptions = {}): CMatrix {
  if (a.numQubits !== b.numQubits) throw new RangeError(`circuitAdjointTimes: ${a.numQubits} vs ${b.numQubits} qubits`);
  const n = a.numQubits;
  if (n > MAX_UNITARY_QUBITS) throw simulationSizeError("unitary", n, MAX_UNITARY_QUBITS);
  const opsB = circuitOps(b, opts);
  const invA = inverseOps(circuitOps(a, opts));
  const w = identityMatrix(2 ** n);
  applyOps(w, n, w.dim, opsB);
  applyOps(w, n, w.dim, invA);
  return w;
}
