// The public synthesis API: one z-rotation or one arbitrary single-qubit gate to a Clifford+T word with its achieved error.
import type { Angle } from "../ir/angle.js";
import type { Word } from "./exact/word.js";
import { synthEuler } from "./euler.js";
import { type RzOptions, synthRzNumberTheoretic } from "./ztarget/rz.js";

export type { Word, Gate1 } from "./exact/word.js";

export interface SynthResult {
  /** The gate word, circuit order (first gate applied first). */
  readonly word: Word;
  readonly tCount: number;
  readonly cliffordCount: number;
  /** Achieved d(U, target) up to global phase: a decimal upper bound computed from the word's exact matrix ("0" when exact). */
  readonly error: string;
  /** Radians, decimal: matrix(word) · e^{i globalPhase} ≈ target (exactly equal when error is "0"). */
  readonly globalPhase: string;
  readonly method: "exact" | "number-theoretic" | "solovay-kitaev" | "euler";
  /** No candidate of a smaller T-count was skipped for hard factoring (the T-count is the least possible within eps). */
  readonly certifiedOptimal: boolean;
  /** Candidates skipped for hard factoring. */
  readonly skipped: number;
}

export interface SynthOptions {
  /** Seed of the only random choices (Pollard–Brent starting points); default 0. Same input and seed, same word. */
  readonly seed?: number;
  /** Multiplier of the factoring work limit per candidate (default 1): more effort, fewer skipped candidates. */
  readonly effort?: number;
  /**
   * "number-theoretic" (default) or "solovay-kitaev". The Solovay–Kitaev helper's src/synth/sk/ is
   * wired in by the lead: until then "solovay-kitaev" throws.
   */
  readonly method?: "number-theoretic" | "solovay-kitaev";
}

function rzOptions(opts: SynthOptions): RzOptions {
  return { seed: opts.seed, effort: opts.effort };
}

/** rz(theta) within eps (a positive decimal string, e.g. "1e-10"). Exact π/4 multiples give error "0". */
export function synthRz(theta: Angle, eps: string, opts: SynthOptions = {}): SynthResult {
  if (opts.method === "solovay-kitaev") return solovayKitaevRz(theta, eps, opts);
  return synthRzNumberTheoretic(theta, eps, rzOptions(opts));
}

/**
 * U(a, b, c) (OpenQASM 3's U gate) within eps by the Euler route: rz · H · rz · H · rz up to phase, the
 * budget shared by the inexact rotations (see src/synth/euler.ts for the split), exact parts exact.
 */
export function synthU(params: readonly [Angle, Angle, Angle], eps: string, opts: SynthOptions = {}): SynthResult {
  const rz = (theta: Angle, e: string): SynthResult => synthRz(theta, e, opts);
  return synthEuler(params, eps, rz, rzOptions(opts));
}

/** Dispatch point for the Solovay–Kitaev method (src/synth/sk/). */
function solovayKitaevRz(_theta: Angle, _eps: string, _opts: SynthOptions): SynthResult {
  throw new Error("solovay-kitaev synthesis is not wired into src/synth/index.ts yet");
}
