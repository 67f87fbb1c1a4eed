// One z-rotation to a Clifford+T word by the chosen method (kept apart from the Euler route so worker threads load only this).
import type { Angle } from "../ir/angle.js";
import type { Word } from "./exact/word.js";
import { type RzOptions, ERROR_DIGITS, exactRzResult, rzFx, synthRzNumberTheoretic } from "./ztarget/rz.js";
import { angleToFixed, exactQuarterTurns, readEps } from "./ztarget/precision.js";
import { distance2Up, exactToFx, fxSqrtUp } from "./ztarget/distance.js";
import { fxToDecimalUp } from "../numeric/fixed.js";
import { tCount, wordMatrix } from "./exact/word.js";
import { u2ToComplex } from "./exact/matrix.js";
import { skRz } from "./sk/solovay-kitaev.js";

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
   * "number-theoretic" (default) or "solovay-kitaev" (the baseline, down to about 1e-15).
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
 * rz(theta) by Solovay–Kitaev (src/synth/sk/, double precision, the baseline). The word's error is
 * then measured from its exact matrix like every other result; SK's floor is about 1e-15, and an eps
 * it cannot reach is an error rather than a word that misses it.
 */
function solovayKitaevRz(theta: Angle, eps: string, _opts: SynthOptions): SynthResult {
  const k = exactQuarterTurns(theta);
  if (k !== null) return exactRzResult(k);
  const info = readEps(eps);
  const sk = skRz(Number(theta.value), Number(eps));
  const phi = angleToFixed(theta, info.prec);
  const target = rzFx(phi, info.prec);
  const d2 = distance2Up(exactToFx(wordMatrix(sk.word), info.prec), target, info.prec);
  if (d2 > info.eps2Down)
    throw new RangeError(`Solovay–Kitaev did not reach eps ${eps} (best ${sk.error.toExponential(2)}; its floor is about 1e-15)`);
  // e^{i phase} = tr(W^dag Rz) / |tr(W^dag Rz)| for the word's matrix W.
  const w = u2ToComplex(wordMatrix(sk.word));
  const c = Math.cos(Number(theta.value) / 2);
  const s = Math.sin(Number(theta.value) / 2);
  // tr(W^dag Rz) = conj(W00) e^{-i t/2} + conj(W11) e^{i t/2}
  const [a, b] = w[0]![0]!;
  const [d, e] = w[1]![1]!;
  const re = a * c - b * s + (d * c + e * s);
  const im = -a * s - b * c + (d * s - e * c);
  const t = tCount(sk.word);
  return {
    word: sk.word,
    tCount: t,
    cliffordCount: sk.word.length - t,
    error: fxToDecimalUp(fxSqrtUp(d2, info.prec), info.prec, ERROR_DIGITS),
    globalPhase: Math.atan2(im, re).toFixed(16),
    method: "solovay-kitaev",
    certifiedOptimal: false,
    skipped: 0,
  };
}
