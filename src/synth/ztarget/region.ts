// The grid problem of one z-rotation target as a lattice problem: u ∈ Z[ω] with u/√2^k in the ε-cap and u•/√2^k in the unit disk.
import { type ZOmega } from "../rings/zomega.js";
import { type ZSqrt2, zsIsDoublyPositive } from "../rings/zsqrt2.js";
import { type ReducedForm, ellipsoidPoints, reduceForm } from "../../numeric/ellipsoid.js";
import { fxCosSin, fxDiv, fxMul, fxSqrt } from "../../numeric/fixed.js";

/**
 * Everything about one target rz(phi) and one ε that does not depend on the level k.
 *
 * Coordinates: u = a + bω + cω² + dω³ ↦ y = (Re u, Im u, Re u•, Im u•) embeds Z[ω] as a lattice of
 * covolume 4 in R⁴. At level k the admissible u satisfy y ∈ √2^k · (Cap × Disk), where
 * Cap = { z : |z| ≤ 1, Re(z · conj z0) ≥ 1 - ε²/2 } with z0 = e^{-i phi/2} (the top-left entry of
 * rz(phi)) and Disk is the closed unit disk. The cap sits in an ellipse E through its apex and both chord
 * ends; E × Disk sits in the ellipsoid { q_E + |y34|² ≤ 2 }, a fixed quadratic form G around a centre c0.
 * At level k the same form applies to v - √2^k c0 with bound 2 · 2^k: one LLL reduction serves all k.
 */
export interface TargetRegion {
  /** Fixed-point precision (bits) of every real below. */
  readonly prec: number;
  /** ε² in fixed point, rounded down (the acceptance bound: a candidate must have d² below it). */
  readonly eps2: bigint;
  /** cos(phi/2), sin(phi/2) in fixed point: z0 = cos - i sin. */
  readonly cosHalf: bigint;
  readonly sinHalf: bigint;
  /** 1/√2 and √2 in fixed point. */
  readonly invSqrt2: bigint;
  readonly sqrt2: bigint;
  /** The enclosing ellipsoid's centre at level 0, in lattice coordinates (a, b, c, d), fixed point. */
  readonly center0: readonly bigint[];
  /** The reduced quadratic form of the ellipsoid (Gram matrix in lattice coordinates). */
  readonly form: ReducedForm;
}

/** Bits after the binary point kept when the real Gram matrix is rounded to integers for LLL (see the error note below). */
const GRAM_FRACTION_BITS = 48;

/**
 * Prepares the region for the target angle `phi` (fixed point at `prec`) and ε given as ε² (fixed point,
 * rounded down) and ε (fixed point, rounded up).
 *
 * Rounding the Gram matrix to GRAM_FRACTION_BITS fractional bits perturbs the form by at most
 * 2^-49 (Σ|x_i|)² for a vector x; every point of the ellipsoid at level k has |x_i| ≤ 3·2^{k/2}, so the
 * perturbation is below 2^-40 of the bound 2^{k+1}. The enumeration loosens the bound by 2^-20, so no
 * point is lost; exact filtering afterwards removes the extras.
 */
export function prepareRegion(phi: bigint, epsUp: bigint, eps2Down: bigint, prec: number): TargetRegion {
  const P = BigInt(prec);
  const one = 1n << P;
  const half = fxCosSin(phi >> 1n, prec); // phi/2 (the shift loses at most 2^-prec)
  const cosHalf = half.cos;
  const sinHalf = half.sin;
  const sqrt2 = fxSqrt(2n << P, prec);
  const invSqrt2 = sqrt2 >> 1n;
  const sqrt3 = fxSqrt(3n << P, prec);

  // Cap of height h = ε²/2 with half chord s0 = sqrt(2h - h²). A large ε makes the cap a big part of
  // the disk: then use the unit disk itself as the ellipse.
  const eps2 = fxMul(epsUp, epsUp, prec);
  const h = eps2 >> 1n;
  const inflate = (x: bigint): bigint => x + (x >> 10n) + 1n;
  let centerR: bigint; // distance of the ellipse centre from 0 along z0
  let semiR: bigint; // radial semi-axis
  let semiS: bigint; // tangential semi-axis
  if (h >= one >> 3n) {
    centerR = 0n;
    semiR = inflate(one);
    semiS = inflate(one);
  } else {
    const s0 = fxSqrt(2n * h - fxMul(h, h, prec), prec) + 1n;
    centerR = one - (2n * h) / 3n;
    semiR = inflate((2n * h) / 3n + 1n);
    semiS = inflate(fxDiv(2n * s0, sqrt3, prec) + 1n);
  }
  // Unit vectors: radial e_r = (cos, -sin), tangential e_s = (sin, cos).
  const er = [cosHalf, -sinHalf];
  const es = [sinHalf, cosHalf];
  // E2 = e_r e_rᵀ / semiR² + e_s e_sᵀ / semiS²  (fixed point)
  const invR2 = fxDiv(one, fxMul(semiR, semiR, prec), prec);
  const invS2 = fxDiv(one, fxMul(semiS, semiS, prec), prec);
  const E2 = [0, 1].map((i) => [0, 1].map((j) => fxMul(fxMul(er[i]!, er[j]!, prec), invR2, prec) + fxMul(fxMul(es[i]!, es[j]!, prec), invS2, prec)));
  // Columns of the embedding for (a, b, c, d): (Re u, Im u) and (Re u•, Im u•).
  const r = invSqrt2;
  const m12 = [
    [one, 0n],
    [r, r],
    [0n, one],
    [-r, r],
  ];
  const m34 = [
    [one, 0n],
    [-r, -r],
    [0n, one],
    [r, -r],
  ];
  const gram: bigint[][] = [];
  const shift = BigInt(prec - GRAM_FRACTION_BITS);
  for (let i = 0; i < 4; i++) {
    const row: bigint[] = [];
    for (let j = 0; j < 4; j++) {
      let s = 0n;
      for (let p = 0; p < 2; p++) for (let q = 0; q < 2; q++) s += fxMul(fxMul(m12[i]![p]!, E2[p]![q]!, prec), m12[j]![q]!, prec);
      s += fxMul(m34[i]![0]!, m34[j]![0]!, prec) + fxMul(m34[i]![1]!, m34[j]![1]!, prec);
      row.push(s);
    }
    gram.push(row);
  }
  // symmetrize exactly and round to GRAM_FRACTION_BITS fractional bits
  const gInt: bigint[][] = gram.map((row, i) => row.map((_, j) => ((gram[i]![j]! + gram[j]![i]!) / 2n + (1n << (shift - 1n))) >> shift));
  const form = reduceForm(gInt, GRAM_FRACTION_BITS, prec);
  // Centre C = centerR · z0 = (centerR cos, -centerR sin); lattice coordinates of (C, 0):
  // a = Cx/2, c = Cy/2, b = (Cx + Cy)/(2√2), d = (Cy - Cx)/(2√2).
  const cx = fxMul(centerR, cosHalf, prec);
  const cy = -fxMul(centerR, sinHalf, prec);
  const center0 = [cx >> 1n, fxMul(cx + cy, invSqrt2, prec) >> 1n, cy >> 1n, fxMul(cy - cx, invSqrt2, prec) >> 1n];
  return { prec, eps2: eps2Down, cosHalf, sinHalf, invSqrt2, sqrt2, center0, form };
}

/** One admissible u at level k: ξ = 2^k - u†u is doubly positive and d(U, rz(phi))² = d2 ≤ ε². */
export interface Candidate {
  readonly k: number;
  readonly u: ZOmega;
  readonly xi: ZSqrt2;
  /** d² for any unitary with top-left entry u/√2^k and determinant 1, fixed point, rounded up. */
  readonly d2: bigint;
}

/**
 * d² = 2 - 2 Re(z e^{i phi/2}) for z = u/√2^k, computed stably as |z - z0|² + ξ/2^k (both terms ≥ 0),
 * rounded up by a safe margin. Fixed point at region.prec.
 */
export function capDistance2(region: TargetRegion, u: ZOmega, k: number, xi: ZSqrt2): bigint {
  const { prec, invSqrt2, sqrt2, cosHalf, sinHalf } = region;
  const P = BigInt(prec);
  const re = (u.a << P) + (u.b - u.d) * invSqrt2;
  const im = (u.c << P) + (u.b + u.d) * invSqrt2;
  const xiFx = (xi.a << P) + xi.b * sqrt2;
  const scale = (x: bigint): bigint => (k % 2 === 0 ? x >> BigInt(k / 2) : fxMul(x, invSqrt2, prec) >> BigInt((k - 1) / 2));
  const dr = scale(re) - cosHalf;
  const di = scale(im) + sinHalf;
  const d2 = fxMul(dr, dr, prec) + fxMul(di, di, prec) + (xiFx >> BigInt(k));
  // each term carries an error of a few units of 2^-prec; a margin of 2^32 units covers them with room
  return d2 + (1n << 32n);
}

/** A shared allowance of enumerated lattice points; `truncated` records that it ran out. */
export interface PointBudget {
  left: number;
  truncated: boolean;
}

/**
 * Every u at level k (u ∈ Z[ω] with |u|², |u•|² ≤ 2^k) whose d² ≤ ε², in the enumeration's
 * (deterministic) order, as a generator. `keep` filters u before the exact checks (level-specific
 * divisibility rules). With a budget, stops (and marks it truncated) after that many lattice points.
 */
export function* levelCandidateStream(region: TargetRegion, k: number, keep: (u: ZOmega) => boolean, budget?: PointBudget): Generator<Candidate> {
  const { prec, form, center0, invSqrt2 } = region;
  const P = BigInt(prec);
  const center = center0.map((c) => (k % 2 === 0 ? c << BigInt(k / 2) : fxMul(c, invSqrt2, prec) << BigInt((k + 1) / 2)));
  const r2 = 2n << (P + BigInt(k));
  const twoK = 1n << BigInt(k);
  for (const [a, b, c, d] of ellipsoidPoints(form, center, r2)) {
    if (budget !== undefined && --budget.left < 0) {
      budget.truncated = true;
      return;
    }
    const u: ZOmega = { a: a!, b: b!, c: c!, d: d! };
    if (!keep(u)) continue;
    // ξ = 2^k - u†u, with u†u = (a²+b²+c²+d²) + (ab + bc + cd - da)√2
    const xi: ZSqrt2 = { a: twoK - (a! * a! + b! * b! + c! * c! + d! * d!), b: -(a! * b! + b! * c! + c! * d! - d! * a!) };
    if (!zsIsDoublyPositive(xi)) continue;
    const d2 = capDistance2(region, u, k, xi);
    if (d2 > region.eps2) continue;
    yield { k, u, xi, d2 };
  }
}

/** All candidates of levelCandidateStream as an array. */
export function levelCandidates(region: TargetRegion, k: number, keep: (u: ZOmega) => boolean): Candidate[] {
  return [...levelCandidateStream(region, k, keep)];
}
