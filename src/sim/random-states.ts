// A lower bound on d(A, B) for circuits too large for their unitary (up to 22 qubits), from seeded random states.
//
// For a unit state psi and any phase phi, ||A psi - e^{i phi} B psi|| <= ||A - e^{i phi} B||; taking phi at the
// minimiser of the right-hand side shows min_phi ||A psi - e^{i phi} B psi|| <= d(A, B). Since A is unitary,
// ||A psi - e^{i phi} B psi|| = ||psi - e^{i phi} A^dag B psi||: each state is run through B and then A
// inverted, and compared with a copy of itself. The minimum over phi is sqrt(2 - 2 |<psi|A^dag B psi>|); we evaluate it as the norm of the
// difference vector psi - e^{i phi*} A^dag B psi at the best phase (no cancellation near zero).
// The maximum over several states is still only a lower bound: label it so wherever it is shown.
import type { Circuit } from "../ir/circuit.js";
import { circuitOps, inverseOps, type OpsOptions } from "./ops.js";
import { seededRng } from "./rng.js";
import { applyOps, MAX_STATE_QUBITS, simulationSizeError, type Amplitudes } from "./statevector.js";

export interface RandomStateOptions extends OpsOptions {
  /** Seed of the state generator (default 1). */
  readonly seed?: number;
  /** Number of random states (default 4). */
  readonly states?: number;
}

export interface StateLowerBound {
  /** max over the states of min_phi ||A psi - e^{i phi} B psi||: a lower bound on d(A, B), never an estimate of it. */
  readonly lowerBound: number;
  /** The per-state values, in generation order. */
  readonly perState: readonly number[];
  readonly states: number;
  readonly seed: number;
}

export const DEFAULT_STATES = 4;
export const DEFAULT_SEED = 1;

/** Seed of the i-th state of a run (distinct, deterministic). */
function stateSeed(seed: number, i: number): number {
  return (Math.imul(seed >>> 0, 0x9e3779b1) + Math.imul(i + 1, 0x85ebca77)) >>> 0;
}

/** Writes a Haar-random unit state (normalised complex Gaussian vector) for the given seed. */
function fillRandomState(amp: Amplitudes, seed: number): void {
  const rng = seededRng(seed);
  let norm2 = 0;
  for (let k = 0; k < amp.re.length; k++) {
    const [x, y] = rng.gaussianPair();
    amp.re[k] = x;
    amp.im[k] = y;
    norm2 += x * x + y * y;
  }
  const inv = 1 / Math.sqrt(norm2);
  for (let k = 0; k < amp.re.length; k++) {
    amp.re[k] *= inv;
    amp.im[k] *= inv;
  }
}

/** min_phi ||x - e^{i phi} y|| for two vectors, as the norm of the difference at the best phase. */
export function phaseAlignedDistance(x: Amplitudes, y: Amplitudes): number {
  const n = x.re.length;
  if (y.re.length !== n) throw new RangeError("phaseAlignedDistance: lengths differ");
  // <x|y> = sum conj(x_k) y_k; the best e^{i phi} is conj(<x|y>)/|<x|y>| (any phase when it is 0).
  let ir = 0;
  let ii = 0;
  for (let k = 0; k < n; k++) {
    ir += x.re[k] * y.re[k] + x.im[k] * y.im[k];
    ii += x.re[k] * y.im[k] - x.im[k] * y.re[k];
  }
  const mag = Math.hypot(ir, ii);
  const cr = mag === 0 ? 1 : ir / mag;
  const ci = mag === 0 ? 0 : -ii / mag;
  let s = 0;
  for (let k = 0; k < n; k++) {
    const dr = x.re[k] - (cr * y.re[k] - ci * y.im[k]);
    const di = x.im[k] - (cr * y.im[k] + ci * y.re[k]);
    s += dr * dr + di * di;
  }
  return Math.sqrt(s);
}

/**
 * The random-state lower bound on d(A, B) for two circuits on the same qubits (at most MAX_STATE_QUBITS).
 * Throws a DiagnosticError for non-unitary or too-large circuits.
 */
export function randomStateLowerBound(a: Circuit, b: Circuit, opts: RandomStateOptions = {}): StateLowerBound {
  if (a.numQubits !== b.numQubits) throw new RangeError(`randomStateLowerBound: ${a.numQubits} vs ${b.numQubits} qubits`);
  const n = a.numQubits;
  if (n > MAX_STATE_QUBITS) throw simulationSizeError("random-state check", n, MAX_STATE_QUBITS);
  const seed = opts.seed ?? DEFAULT_SEED;
  const states = opts.states ?? DEFAULT_STATES;
  if (!Number.isInteger(states) || states < 1) throw new RangeError(`randomStateLowerBound: states must be a positive integer, got ${states}`);
  const opsB = circuitOps(b, opts);
  const invA = inverseOps(circuitOps(a, opts));
  const dim = 2 ** n;
  const psi: Amplitudes = { re: new Float64Array(dim), im: new Float64Array(dim) };
  const work: Amplitudes = { re: new Float64Array(dim), im: new Float64Array(dim) };
  const perState: number[] = [];
  for (let i = 0; i < states; i++) {
    const s = stateSeed(seed, i);
    fillRandomState(psi, s);
    work.re.set(psi.re);
    work.im.set(psi.im);
    applyOps(work, n, 1, opsB);
    applyOps(work, n, 1, invA);
    perState.push(phaseAlignedDistance(psi, work));
  }
  return { lowerBound: Math.max(...perState), perState, states, seed };
}
