// Rotations by exact multiples of π/4 (rz, rx, ry, p, U) as exact Clifford+T words at zero error, with the global phase recorded.
//
// Conventions (OpenQASM 3 stdgates): rz(θ) = diag(e^{-iθ/2}, e^{iθ/2}), rx(θ) = H rz(θ) H,
// ry(θ) = S H rz(θ) H S†, p(λ) = diag(1, e^{iλ}), U(θ, φ, λ) = p(φ) ry(θ) p(λ).
// For θ = kπ/4: rz(θ) = e^{-ikπ/8} T^k, so each gate equals e^{iπ·phase} times the word's matrix, where
// phase is a rational number (a multiple of 1/8) reduced into [0, 2).
import type { Rational } from "../../ir/angle.js";
import { type ExactU2 } from "./matrix.js";
import { exactSynthesize } from "./normal-form.js";
import { type Gate1, type Word, wordMatrix } from "./word.js";

/** A word and its global phase: gate = e^{iπ·phaseRadiansPiMultiple} · wordMatrix(word). */
export interface ExactRotation {
  readonly word: Word;
  /** The global phase in radians as a multiple of π, reduced, in [0, 2). */
  readonly phaseRadiansPiMultiple: Rational;
}

export type ExactRotationGate = "rz" | "rx" | "ry" | "p";

/** k with r = k/4, or null when r is not a multiple of 1/4 (r = num/den reduced, den > 0). */
function quarterMultiple(r: Rational): bigint | null {
  if (r.den <= 0n) throw new RangeError("exact angles: a Rational needs a positive denominator");
  const n = 4n * r.num;
  return n % r.den === 0n ? n / r.den : null;
}

function gcd(a: bigint, b: bigint): bigint {
  a = a < 0n ? -a : a;
  b = b < 0n ? -b : b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

/** The rational num/den reduced modulo 2 into [0, 2). */
function phaseMod2(num: bigint, den: bigint): Rational {
  const m = 2n * den;
  let n = num % m;
  if (n < 0n) n += m;
  const g = gcd(n, den) || 1n;
  return { num: n / g, den: den / g };
}

/** T^k written with the fewest gates (k taken mod 8). */
function tPower(k: bigint): Gate1[] {
  const m = Number(((k % 8n) + 8n) % 8n);
  return ([[], ["t"], ["s"], ["s", "t"], ["z"], ["z", "t"], ["sdg"], ["tdg"]] as Gate1[][])[m]!;
}

/**
 * Re-synthesize an exact matrix to a T-optimal normal-form word, folding the ω^j phase of the synthesis
 * into a phase given in eighths of π: gate = e^{iπ·eighths/8} · u.
 */
function optimize(u: ExactU2, eighths: bigint): ExactRotation {
  const r = exactSynthesize(u); // u = ω^j · word = e^{iπ j/4} · word
  return { word: r.word, phaseRadiansPiMultiple: phaseMod2(eighths + 2n * BigInt(r.phase), 8n) };
}

/** The circuit-order word and phase (in eighths of π) of a gate by kπ/4, before optimization. */
function rawRotation(gate: ExactRotationGate, k: bigint): { word: Gate1[]; eighths: bigint } {
  const tk = tPower(k);
  switch (gate) {
    case "rz":
      return { word: tk, eighths: -k };
    case "p":
      return { word: tk, eighths: 0n };
    case "rx":
      // rx = H rz H
      return { word: ["h", ...tk, "h"], eighths: -k };
    case "ry":
      // ry = S H rz H S†: circuit order sdg, h, rz, h, s
      return { word: ["sdg", "h", ...tk, "h", "s"], eighths: -k };
  }
}

/**
 * rz, rx, ry or p by the angle piMultiple·π as an exact T-optimal word with its global phase, or null
 * when the angle is not a multiple of π/4.
 */
export function exactRotationWord(gate: ExactRotationGate, piMultiple: Rational): ExactRotation | null {
  const k = quarterMultiple(piMultiple);
  if (k === null) return null;
  const raw = rawRotation(gate, k);
  return optimize(wordMatrix(raw.word), raw.eighths);
}

/**
 * U(θ, φ, λ) = p(φ) ry(θ) p(λ) (OpenQASM 3) as an exact T-optimal word with its global phase, or null
 * unless all three angles (given as multiples of π) are multiples of π/4.
 */
export function exactUWord(theta: Rational, phi: Rational, lambda: Rational): ExactRotation | null {
  const kt = quarterMultiple(theta);
  const kp = quarterMultiple(phi);
  const kl = quarterMultiple(lambda);
  if (kt === null || kp === null || kl === null) return null;
  const ry = rawRotation("ry", kt);
  // circuit order: p(λ) first, then ry(θ), then p(φ)
  const word: Gate1[] = [...tPower(kl), ...ry.word, ...tPower(kp)];
  return optimize(wordMatrix(word), ry.eighths);
}
