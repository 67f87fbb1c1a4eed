// Re-check a synthesis result from its word alone: the word's exact matrix must be within eps of rz(angle).
import type { SynthResult } from "./index.js";
import { GATES1, tCount, type Word } from "./exact/word.js";
import { angleToFixed, readEps } from "./ztarget/precision.js";
import { measureWord, rzFx } from "./ztarget/rz.js";

/** The smallest and largest eps the engine takes (decimal strings). */
export const MIN_EPS = "1e-50";
export const MAX_EPS = "0.1";
/** Solovay–Kitaev works in double precision: below this it cannot be relied on to reach eps. */
export const SK_MIN_EPS = "1e-14";

/** The smallest eps a method takes. */
export function minEps(method: SynthMethod): string {
  return method === "solovay-kitaev" ? SK_MIN_EPS : MIN_EPS;
}

export type SynthMethod = "number-theoretic" | "solovay-kitaev";

const VALID = new Set<string>(GATES1);

/**
 * Verify a (possibly stale or tampered) result for rz(angle) within eps: the word must consist of
 * known gates and its exact matrix must lie within eps of the target (measured in high precision).
 * Returns the result with its error, T-count and Clifford count recomputed from the word, or null.
 */
export function verifyRzResult(angle: string, eps: string, r: SynthResult): SynthResult | null {
  if (!r || !Array.isArray(r.word) || !r.word.every((g) => typeof g === "string" && VALID.has(g))) return null;
  try {
    const e = readEps(eps);
    const phi = angleToFixed({ pi: null, value: angle }, e.prec);
    const word = r.word as Word;
    const m = measureWord(word, rzFx(phi, e.prec), e);
    const t = tCount(word);
    return { ...r, word, error: m.error, tCount: t, cliffordCount: word.length - t };
  } catch {
    return null;
  }
}
