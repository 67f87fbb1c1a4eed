// The simulator's public face: a circuit's unitary, and the distance up to global phase between two circuits (exact or a stated lower bound).
import type { Circuit } from "../ir/circuit.js";
import type { CMatrix } from "../ir/gates.js";
import { DiagnosticError } from "../frontend/diagnostics.js";
import { distanceFromArc, halfDiamondFromArc, phaseArc } from "./distance.js";
import { randomStateLowerBound, DEFAULT_SEED, DEFAULT_STATES } from "./random-states.js";
import { MAX_STATE_QUBITS, simulationSizeError } from "./statevector.js";
import { circuitAdjointTimes, circuitUnitary as unitaryOf, MAX_UNITARY_QUBITS } from "./unitary.js";

export { distanceUpToPhase, distance2x2, distanceFromArc, halfDiamondFromArc, phaseArc, distanceToIdentity } from "./distance.js";
export { MAX_STATE_QUBITS, simulateState, zeroState, type Amplitudes } from "./statevector.js";
export { MAX_UNITARY_QUBITS, circuitAdjointTimes } from "./unitary.js";
export { randomStateLowerBound, type StateLowerBound } from "./random-states.js";
export { nonUnitaryStatement } from "./ops.js";

/** The unitary of a circuit of at most MAX_UNITARY_QUBITS qubits (qubit 0 = most significant bit). */
export function circuitUnitary(c: Circuit): CMatrix {
  return unitaryOf(c);
}

export interface CircuitDistanceOptions {
  /** Seed for the random states used above MAX_UNITARY_QUBITS (default 1). */
  readonly seed?: number;
  /** Number of random states used above MAX_UNITARY_QUBITS (default 4). */
  readonly states?: number;
}

export interface CircuitDistance {
  /** d(A, B) = min_phi ||A - e^{i phi} B|| when `exact`; otherwise a lower bound on it. */
  readonly distance: number;
  /** True when `distance` is the distance itself (up to rounding); false for a random-state lower bound. */
  readonly exact: boolean;
  /** How it was obtained, in words. */
  readonly method: string;
  readonly qubits: number;
  /** Half the diamond distance of the two channels, sin(arc/2) (capped at 1), when exact; else null. */
  readonly halfDiamond: number | null;
  /** Random states used (0 when exact). */
  readonly states: number;
}

/**
 * The distance up to global phase between two circuits on the same number of qubits: exact (eigenphases of
 * A^dag B) up to MAX_UNITARY_QUBITS qubits, a random-state lower bound up to MAX_STATE_QUBITS. Throws a
 * DiagnosticError for different qubit counts, too many qubits, or a statement that is not unitary.
 */
export function circuitDistance(a: Circuit, b: Circuit, opts: CircuitDistanceOptions = {}): CircuitDistance {
  if (a.numQubits !== b.numQubits) {
    throw new DiagnosticError([
      {
        severity: "error",
        file: "",
        line: 0,
        col: 0,
        message: `cannot compare circuits on ${a.numQubits} and ${b.numQubits} qubits`,
        hint: "both circuits must declare the same number of qubits",
      },
    ]);
  }
  const n = a.numQubits;
  if (n > MAX_STATE_QUBITS) throw simulationSizeError("distance check", n, MAX_STATE_QUBITS);
  if (n <= MAX_UNITARY_QUBITS) {
    const { arc, method } = phaseArc(circuitAdjointTimes(a, b));
    return {
      distance: distanceFromArc(arc),
      exact: true,
      method: `exact: eigenphase arc of A^dag B (${method})`,
      qubits: n,
      halfDiamond: halfDiamondFromArc(arc),
      states: 0,
    };
  }
  const seed = opts.seed ?? DEFAULT_SEED;
  const states = opts.states ?? DEFAULT_STATES;
  const r = randomStateLowerBound(a, b, { seed, states });
  return {
    distance: r.lowerBound,
    exact: false,
    method: `lower bound from ${r.states} random state${r.states === 1 ? "" : "s"} (seed ${r.seed})`,
    qubits: n,
    halfDiamond: null,
    states: r.states,
  };
}
