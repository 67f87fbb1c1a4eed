// One z-rotation to a Clifford+T word: exact π/4 multiples directly, everything else by the search, each answer re-measured from its exact matrix.
import type { Angle } from "../../ir/angle.js";
import type { SynthResult } from "../index.js";
import { type Word, simplifyWord, tCount, wordMatrix } from "../exact/word.js";
import { fxCosSin, fxPi, fxToDecimalUp, fxToFixedString } from "../../numeric/fixed.js";
import { angleToFixed, exactQuarterTurns, readEps, type EpsInfo } from "./precision.js";
import { DegenerateTargetError, type ZSearchOptions, searchRz } from "./search.js";
import { fxFromDecimal } from "../../numeric/fixed.js";
import { type FxMat2, distance2Up, exactToFx, fxSqrtUp } from "./distance.js";

/** Significant digits of the reported error (rounded up, so the string is an upper bound). */
export const ERROR_DIGITS = 12;
/** Digits after the point of the reported global phase. */
export const PHASE_DIGITS = 40;

/** rz(theta) in fixed point. */
export function rzFx(theta: bigint, prec: number): FxMat2 {
  const { cos, sin } = fxCosSin(theta >> 1n, prec);
  // theta >> 1 halves exactly up to one unit of 2^-prec
  return [
    { re: cos, im: -sin },
    { re: 0n, im: 0n },
    { re: 0n, im: 0n },
    { re: cos, im: sin },
  ];
}

/** The word for rz(kπ/4) = e^{-ikπ/8} T^k, with error 0. */
export function exactRzResult(k: number): SynthResult {
  const m = ((k % 8) + 8) % 8;
  const word: Word = simplifyWord(new Array<"t">(m).fill("t"));
  const prec = 200;
  const phase = (-BigInt(k) * fxPi(prec)) / 8n;
  return {
    word,
    tCount: tCount(word),
    cliffordCount: word.length - tCount(word),
    error: "0",
    globalPhase: fxToFixedString(phase, prec, PHASE_DIGITS),
    method: "exact",
    certifiedOptimal: true,
    skipped: 0,
  };
}

/**
 * d(word, target) from the word's exact matrix, as an upper bound in fixed point, checked against ε²:
 * throws when the word misses the bound (never returns a word that fails it).
 */
export function measureWord(word: Word, target: FxMat2, eps: EpsInfo): { readonly d2: bigint; readonly error: string } {
  const d2 = distance2Up(exactToFx(wordMatrix(word), eps.prec), target, eps.prec);
  if (d2 > eps.eps2Down) throw new Error("internal: a synthesized word misses its error bound");
  return { d2, error: fxToDecimalUp(fxSqrtUp(d2, eps.prec), eps.prec, ERROR_DIGITS) };
}

export interface RzOptions extends ZSearchOptions {}

/** rz(theta) within eps (a positive decimal string) by the number-theoretic method. */
export function synthRzNumberTheoretic(theta: Angle, epsText: string, opts: RzOptions = {}): SynthResult {
  const eps = readEps(epsText);
  const k = exactQuarterTurns(theta);
  if (k !== null) return exactRzResult(k);
  const phi = angleToFixed(theta, eps.prec);
  let found;
  try {
    found = searchRz(phi, eps.prec, eps.epsUp, eps.eps2Down, eps.log2InvEps, opts);
  } catch (e) {
    if (e instanceof DegenerateTargetError) return splitRotation(theta, phi, eps, opts);
    throw e;
  }
  const measured = measureWord(found.word, rzFx(phi, eps.prec), eps);
  const phase = (BigInt(found.phaseEighths) * fxPi(eps.prec)) / 8n;
  return {
    word: found.word,
    tCount: found.tCount,
    cliffordCount: found.word.length - found.tCount,
    error: measured.error,
    globalPhase: fxToFixedString(phase, eps.prec, PHASE_DIGITS),
    method: "number-theoretic",
    certifiedOptimal: found.certifiedOptimal,
    skipped: found.skipped,
  };
}

/**
 * Fallback for degenerate targets (a hair away from a multiple of π/4, where the lattice enumeration
 * meets sheets of candidates): rz(θ) = rz(θ - α) rz(α) with a generic α (1 rad, then 2 rad), ε/2 each.
 * About twice the T-count of a typical rotation; never certified optimal.
 */
function splitRotation(theta: Angle, phi: bigint, eps: EpsInfo, opts: RzOptions): SynthResult {
  // ε/2 = 5ε/10 exactly in decimal (ε = num/den with den a power of ten)
  const half = `${eps.num * 5n}e-${(eps.den * 10n).toString().length - 1}`;
  for (const alpha of ["1", "2", "3"]) {
    try {
      // theta - alpha in fixed point, written out with more digits than the precision carries
      // (this module stays free of the decimal library so worker threads start fast).
      const a: Angle = { pi: null, value: alpha };
      const rest: Angle = { pi: null, value: fxToFixedString(phi - BigInt(alpha) * (1n << BigInt(eps.prec)), eps.prec, Math.ceil(eps.prec * 0.302) + 5) };
      const r1 = synthRzNumberTheoretic(a, half, opts);
      const r2 = synthRzNumberTheoretic(rest, half, opts);
      const word = [...r1.word, ...r2.word];
      const measured = measureWord(word, rzFx(phi, eps.prec), eps);
      const phase = fxFromDecimal(r1.globalPhase, eps.prec) + fxFromDecimal(r2.globalPhase, eps.prec);
      const tc = tCount(word);
      return {
        word,
        tCount: tc,
        cliffordCount: word.length - tc,
        error: measured.error,
        globalPhase: fxToFixedString(phase, eps.prec, PHASE_DIGITS),
        method: "number-theoretic",
        certifiedOptimal: false,
        skipped: r1.skipped + r2.skipped,
      };
    } catch (e) {
      if (!(e instanceof DegenerateTargetError)) throw e;
    }
  }
  throw new DegenerateTargetError();
}
