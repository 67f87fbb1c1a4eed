// The public synthesis API: one z-rotation or one arbitrary single-qubit gate to a Clifford+T word with its achieved error.
import type { Angle } from "../ir/angle.js";
import { synthEuler } from "./euler.js";
import { synthRz, type SynthOptions, type SynthResult } from "./rz.js";

export type { Word, Gate1 } from "./exact/word.js";
export { synthRz, type SynthOptions, type SynthResult } from "./rz.js";

/**
 * U(a, b, c) (OpenQASM 3's U gate) within eps by the Euler route: rz · H · rz · H · rz up to phase, the
 * budget shared by the inexact rotations (see src/synth/euler.ts for the split), exact parts exact.
 */
export function synthU(params: readonly [Angle, Angle, Angle], eps: string, opts: SynthOptions = {}): SynthResult {
  const rz = (theta: Angle, e: string): SynthResult => synthRz(theta, e, opts);
  return synthEuler(params, eps, rz, { seed: opts.seed, effort: opts.effort });
}

