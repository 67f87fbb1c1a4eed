// The distance up to global phase d(U, V) = sqrt(2 - |tr(U†V)|) between an exact Clifford+T matrix and a target, in fixed point.
import type { ExactU2 } from "../exact/matrix.js";
import type { ZOmega } from "../rings/zomega.js";
import { fxMul, fxSqrt } from "../../numeric/fixed.js";
import { isqrt } from "../../numeric/bigint.js";

/** A complex number in fixed point. */
export interface FxComplex {
  readonly re: bigint;
  readonly im: bigint;
}

/** A 2×2 complex matrix in fixed point, row-major [m00, m01, m10, m11]. */
export type FxMat2 = readonly [FxComplex, FxComplex, FxComplex, FxComplex];

/** x/√2^k for x ∈ Z[ω], in fixed point (error a few units of 2^-prec for |x| ≲ √2^k). */
function zoToFx(x: ZOmega, k: number, prec: number, invSqrt2: bigint): FxComplex {
  const P = BigInt(prec);
  const re = (x.a << P) + (x.b - x.d) * invSqrt2;
  const im = (x.c << P) + (x.b + x.d) * invSqrt2;
  const scale = (v: bigint): bigint => (k >= 0 ? (k % 2 === 0 ? v >> BigInt(k / 2) : fxMul(v, invSqrt2, prec) >> BigInt((k - 1) / 2)) : v << BigInt(-k)); // k < 0 never occurs for unitaries
  return { re: scale(re), im: scale(im) };
}

/** The exact matrix in fixed point. */
export function exactToFx(m: ExactU2, prec: number): FxMat2 {
  const invSqrt2 = fxSqrt(2n << BigInt(prec), prec) >> 1n;
  return [zoToFx(m.a, m.k, prec, invSqrt2), zoToFx(m.b, m.k, prec, invSqrt2), zoToFx(m.c, m.k, prec, invSqrt2), zoToFx(m.d, m.k, prec, invSqrt2)];
}

/**
 * An upper bound of d(U, V)² = 2 - |tr(U†V)| for 2×2 unitaries given in fixed point (each entry within
 * a few units of 2^-prec of the truth): the computed value plus a margin of 2^16 · 2^-prec.
 */
export function distance2Up(u: FxMat2, v: FxMat2, prec: number): bigint {
  let re = 0n;
  let im = 0n;
  for (let i = 0; i < 4; i++) {
    const a = u[i]!;
    const b = v[i]!;
    // conj(a) · b
    re += fxMul(a.re, b.re, prec) + fxMul(a.im, b.im, prec);
    im += fxMul(a.re, b.im, prec) - fxMul(a.im, b.re, prec);
  }
  const absTr = isqrt(re * re + im * im); // fixed point at prec (floor)
  const d2 = (2n << BigInt(prec)) - absTr;
  const margin = 1n << 16n; // 2^16 units of 2^-prec: far above the accumulated rounding (tens of units)
  return (d2 < 0n ? 0n : d2) + margin;
}

/** ⌈√x⌉ at fixed point (x ≥ 0): an upper bound of the square root. */
export function fxSqrtUp(x: bigint, prec: number): bigint {
  const s = isqrt(x << BigInt(prec));
  return s + 1n;
}
