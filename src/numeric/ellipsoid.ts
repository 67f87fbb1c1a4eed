// Lattice points in an ellipsoid: a reduced quadratic form, then Fincke–Pohst enumeration around a real centre in fixed point.
import { divCeil, divFloor, isqrt } from "./bigint.js";
import { inverseUnimodular, lllGram } from "./lll.js";

/**
 * A positive definite form Q(x) = xᵀ G x / 2^scale on Zⁿ, LLL-reduced once, ready to enumerate
 * { x ∈ Zⁿ : Q(x - c) ≤ r² } for many centres c and radii r.
 */
export interface ReducedForm {
  readonly n: number;
  /** Fixed-point precision (bits) of the Gram–Schmidt data below. */
  readonly prec: number;
  /** Rows: the reduced basis in original coordinates (unimodular). */
  readonly basis: readonly (readonly bigint[])[];
  /** Inverse of `basis` (exact integers). */
  readonly basisInv: readonly (readonly bigint[])[];
  /** Squared Gram–Schmidt lengths of the reduced basis, divided by 2^scale, in fixed point. */
  readonly gsLen: readonly bigint[];
  /** Gram–Schmidt coefficients mu[i][j] (j < i) in fixed point. */
  readonly mu: readonly (readonly bigint[])[];
  /** LLL swaps spent (cost measure). */
  readonly swaps: number;
}

/**
 * Reduces the form xᵀ G x / 2^scale (G an integer symmetric positive definite matrix) and prepares
 * fixed-point Gram–Schmidt data at `prec` bits.
 */
export function reduceForm(gram: readonly (readonly bigint[])[], scale: number, prec: number): ReducedForm {
  const n = gram.length;
  const r = lllGram(gram);
  const one = 1n << BigInt(prec);
  const gsLen: bigint[] = [];
  const mu: bigint[][] = [];
  for (let i = 0; i < n; i++) {
    // B_i = d[i+1]/d[i] / 2^scale
    gsLen.push(divFloor(r.d[i + 1]! << BigInt(prec), r.d[i]! << BigInt(scale)));
    const row: bigint[] = [];
    for (let j = 0; j < i; j++) row.push(divFloor(r.lambda[i]![j]! * one, r.d[j + 1]!));
    mu.push(row);
  }
  return { n, prec, basis: r.basis, basisInv: inverseUnimodular(r.basis), gsLen, mu, swaps: r.swaps };
}

/**
 * Every x ∈ Zⁿ (original coordinates) with Q(x - c) ≤ r2 (up to fixed-point rounding: the bound is
 * loosened by 2^-slackBits relative, so no point of the exact ellipsoid is lost; callers filter
 * exactly). `center` and `r2` are fixed point at the form's precision. A generator: the caller may stop
 * early; the order is deterministic (lexicographic in the reduced coordinates, last one outermost).
 */
export function* ellipsoidPoints(form: ReducedForm, center: readonly bigint[], r2: bigint, slackBits = 20): Generator<bigint[]> {
  const { n, prec, basis, basisInv, gsLen, mu } = form;
  const P = BigInt(prec);
  const one = 1n << P;
  // Centre in reduced coordinates: c_red = basisInvᵀ c  (c = basisᵀ c_red).
  const cr: bigint[] = [];
  for (let i = 0; i < n; i++) {
    let s = 0n;
    for (let j = 0; j < n; j++) s += basisInv[j]![i]! * center[j]!;
    cr.push(s);
  }
  const bound = r2 + (r2 >> BigInt(slackBits)) + 16n;
  const xs = new Array<bigint>(n).fill(0n);
  const ys = new Array<bigint>(n).fill(0n); // fixed point: x_i - cr_i

  function* visit(j: number, rem: bigint): Generator<bigint[]> {
    // centre of coordinate j given the outer ones
    let ctr = cr[j]!;
    for (let i = j + 1; i < n; i++) ctr -= (mu[i]![j]! * ys[i]!) >> P;
    const B = gsLen[j]!;
    // half width: sqrt(rem / B), in fixed point
    const hw = isqrt(divFloor(rem << (2n * P), B)) + 4n;
    const lo = divCeil(ctr - hw, one);
    const hi = divFloor(ctr + hw, one);
    for (let x = lo; x <= hi; x++) {
      const y = (x << P) - ctr;
      const next = rem - ((B * ((y * y) >> P)) >> P);
      if (next < -16n) continue;
      xs[j] = x;
      ys[j] = (x << P) - cr[j]!;
      if (j === 0) {
        const v: bigint[] = [];
        for (let c = 0; c < n; c++) {
          let s = 0n;
          for (let i = 0; i < n; i++) s += xs[i]! * basis[i]![c]!;
          v.push(s);
        }
        yield v;
      } else yield* visit(j - 1, next);
    }
  }
  yield* visit(n - 1, bound);
}

/** The points of ellipsoidPoints as an array, at most `limit` of them. */
export function enumerateEllipsoid(form: ReducedForm, center: readonly bigint[], r2: bigint, slackBits = 20, limit = Number.POSITIVE_INFINITY): bigint[][] {
  const out: bigint[][] = [];
  if (limit <= 0) return out;
  for (const v of ellipsoidPoints(form, center, r2, slackBits)) {
    out.push(v);
    if (out.length >= limit) break;
  }
  return out;
}
