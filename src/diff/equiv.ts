// Are two compiled circuits the same program within their declared error bounds? Simulated distance against the sum of the bounds.
//
// Why the sum: if A was compiled from a source S with d(A, S) <= bA and B from the same S with
// d(B, S) <= bB, the triangle inequality gives d(A, B) <= bA + bB. So a distance above the sum
// proves that A and B do not implement the same source within their ledgers (up to the float
// tolerance below); a distance within it is what equal sources would give. A circuit with no
// declared bound (an OpenQASM source, say) counts 0.
//
// The simulation runs in float64: two circuits equal in exact arithmetic come out at a distance
// of rounding size, growing with the number of gates (measured: a random Clifford+T circuit against
// itself gives 1.3e-15 at 4 qubits and 1000 gates, 6.5e-15 at 6 qubits and 20000, 1.1e-14 at 8 qubits
// and 50000). `within` therefore allows `tolerance = 1e-12 + 1e-17 * (gates of A + gates of B)` on top
// of the sum: two orders of magnitude above that noise, and still far below any useful error budget
// (callers may set their own).
// Above 10 qubits the distance is a random-state lower bound: `within` then means "no state showed
// a larger distance", not a proof.
import type { Circuit } from "../ir/circuit.js";
import { dec } from "../numeric/decimal.js";
import { computeMetrics } from "../report/metrics.js";
import { circuitDistance } from "../sim/index.js";
import { exactAdd, exactText, parseExact, EXACT_ZERO, type Exact } from "./exact.js";

/** Absolute part of the default float tolerance. */
export const BASE_TOLERANCE = 1e-12;
/** Per-gate part of the default float tolerance (linear growth, far above the measured noise per gate). */
export const PER_GATE_TOLERANCE = 1e-17;

export interface EquivalenceOptions {
  /** Seed for the random states above 10 qubits (default: the simulator's). */
  readonly seed?: number;
  /** Number of random states above 10 qubits (default: the simulator's). */
  readonly states?: number;
  /** Float tolerance added to the bound sum (default: BASE_TOLERANCE + PER_GATE_TOLERANCE * gates). */
  readonly tolerance?: number;
}

export interface Equivalence {
  /** d(A, B) up to global phase in the operator norm when `exact`; otherwise a lower bound on it. */
  readonly distance: number;
  readonly exact: boolean;
  /** How the distance was obtained, in words (from the simulator). */
  readonly method: string;
  /** Random states used (0 when exact). */
  readonly states: number;
  readonly qubits: number;
  /** bA + bB, exact canonical decimal ("0" when neither side declares a bound). */
  readonly boundSum: string;
  /** The float tolerance allowed on top of `boundSum`. */
  readonly tolerance: number;
  /** distance <= boundSum + tolerance. */
  readonly within: boolean;
}

function bound(v: string | null, side: string): Exact {
  if (v === null) return EXACT_ZERO;
  const x = parseExact(v);
  if (x.m < 0n) throw new RangeError(`equivalence: declared bound of ${side} is negative (${v})`);
  return x;
}

/**
 * Simulates A and B (same qubit count, unitary statements only) and compares their distance with the
 * sum of the declared bounds (see the module comment). Throws the simulator's DiagnosticError for
 * different qubit counts, too many qubits or a statement that is not unitary (measure, reset, if, while).
 */
export function equivalence(a: Circuit, b: Circuit, declaredBounds: { readonly a: string | null; readonly b: string | null }, opts: EquivalenceOptions = {}): Equivalence {
  const sum = exactAdd(bound(declaredBounds.a, "a"), bound(declaredBounds.b, "b"));
  const r = circuitDistance(a, b, { ...(opts.seed === undefined ? {} : { seed: opts.seed }), ...(opts.states === undefined ? {} : { states: opts.states }) });
  const tolerance = opts.tolerance ?? BASE_TOLERANCE + PER_GATE_TOLERANCE * (computeMetrics(a).gates + computeMetrics(b).gates);
  if (!(tolerance >= 0) || !Number.isFinite(tolerance)) throw new RangeError(`equivalence: bad tolerance ${tolerance}`);
  const boundSum = exactText(sum);
  // The float distance and tolerance are written as their shortest decimals and compared with the exact sum.
  const within = Number.isFinite(r.distance) && dec(String(r.distance)).lessThanOrEqualTo(dec(boundSum).plus(dec(String(tolerance))));
  return { distance: r.distance, exact: r.exact, method: r.method, states: r.states, qubits: r.qubits, boundSum, tolerance, within };
}
