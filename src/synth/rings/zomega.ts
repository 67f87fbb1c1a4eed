// The ring Z[ω] of cyclotomic integers, ω = e^{iπ/4}: exact arithmetic, conjugations, norms, Euclidean division.
//
// Coefficient convention: { a, b, c, d } is the element a + bω + cω² + dω³, with ω⁴ = -1.
// Useful facts: i = ω², √2 = ω - ω³, 1/√2 (1 + i) = ω. Re(x) = a + (b - d)/√2, Im(x) = c + (b + d)/√2.
import { type ZSqrt2, bigDivRound } from "./zsqrt2.js";

/** a + bω + cω² + dω³. Immutable; all coefficients are BigInt. */
export interface ZOmega {
  readonly a: bigint;
  readonly b: bigint;
  readonly c: bigint;
  readonly d: bigint;
}

/** a + bω + cω² + dω³. */
export function zo(a: bigint, b: bigint = 0n, c: bigint = 0n, d: bigint = 0n): ZOmega {
  return { a, b, c, d };
}

export const ZO_ZERO: ZOmega = { a: 0n, b: 0n, c: 0n, d: 0n };
export const ZO_ONE: ZOmega = { a: 1n, b: 0n, c: 0n, d: 0n };
/** ω = e^{iπ/4}. */
export const OMEGA: ZOmega = { a: 0n, b: 1n, c: 0n, d: 0n };
/** i = ω². */
export const ZO_I: ZOmega = { a: 0n, b: 0n, c: 1n, d: 0n };
/** √2 = ω - ω³. */
export const SQRT2_ZO: ZOmega = { a: 0n, b: 1n, c: 0n, d: -1n };
/** δ = 1 + ω, the prime above 2 (δ†δ = √2 λ, λ = 1 + √2). */
export const DELTA_ZO: ZOmega = { a: 1n, b: 1n, c: 0n, d: 0n };

/** x + y. */
export function zoAdd(x: ZOmega, y: ZOmega): ZOmega {
  return { a: x.a + y.a, b: x.b + y.b, c: x.c + y.c, d: x.d + y.d };
}

/** x - y. */
export function zoSub(x: ZOmega, y: ZOmega): ZOmega {
  return { a: x.a - y.a, b: x.b - y.b, c: x.c - y.c, d: x.d - y.d };
}

/** -x. */
export function zoNeg(x: ZOmega): ZOmega {
  return { a: -x.a, b: -x.b, c: -x.c, d: -x.d };
}

/** x · y (ω⁴ = -1). */
export function zoMul(x: ZOmega, y: ZOmega): ZOmega {
  const { a: x0, b: x1, c: x2, d: x3 } = x;
  const { a: y0, b: y1, c: y2, d: y3 } = y;
  return {
    a: x0 * y0 - x1 * y3 - x2 * y2 - x3 * y1,
    b: x0 * y1 + x1 * y0 - x2 * y3 - x3 * y2,
    c: x0 * y2 + x1 * y1 + x2 * y0 - x3 * y3,
    d: x0 * y3 + x1 * y2 + x2 * y1 + x3 * y0,
  };
}

/** n · x for an ordinary integer n. */
export function zoScale(x: ZOmega, n: bigint): ZOmega {
  return { a: x.a * n, b: x.b * n, c: x.c * n, d: x.d * n };
}

/** ω^k · x for any integer k (a coefficient rotation with sign flips; ω⁸ = 1). */
export function zoMulOmega(x: ZOmega, k: number): ZOmega {
  const m = ((k % 8) + 8) % 8;
  const { a, b, c, d } = x;
  switch (m) {
    case 0:
      return x;
    case 1:
      return { a: -d, b: a, c: b, d: c };
    case 2:
      return { a: -c, b: -d, c: a, d: b };
    case 3:
      return { a: -b, b: -c, c: -d, d: a };
    case 4:
      return { a: -a, b: -b, c: -c, d: -d };
    case 5:
      return { a: d, b: -a, c: -b, d: -c };
    case 6:
      return { a: c, b: d, c: -a, d: -b };
    default:
      return { a: b, b: c, c: d, d: -a };
  }
}

/** Complex conjugate x† (ω -> ω⁻¹ = -ω³). */
export function zoConj(x: ZOmega): ZOmega {
  return { a: x.a, b: -x.d, c: -x.c, d: -x.b };
}

/** The • conjugation (√2 -> -√2, i.e. ω -> -ω = ω⁵). */
export function zoBullet(x: ZOmega): ZOmega {
  return { a: x.a, b: -x.b, c: x.c, d: -x.d };
}

/** x†x = |x|² as an element of Z[√2]: (a² + b² + c² + d²) + (ab + bc + cd - da)√2. */
export function zoNormSq(x: ZOmega): ZSqrt2 {
  const { a, b, c, d } = x;
  return { a: a * a + b * b + c * c + d * d, b: a * b + b * c + c * d - d * a };
}

/** The absolute norm N(x) = |x|² · |x•|², a non-negative integer (multiplicative; 0 only for x = 0). */
export function zoNorm(x: ZOmega): bigint {
  const { a, b, c, d } = x;
  const p = a * a + b * b + c * c + d * d;
  const q = a * b + b * c + c * d - d * a;
  return p * p - 2n * q * q;
}

/** x = y exactly. */
export function zoEq(x: ZOmega, y: ZOmega): boolean {
  return x.a === y.a && x.b === y.b && x.c === y.c && x.d === y.d;
}

/** x = 0. */
export function zoIsZero(x: ZOmega): boolean {
  return x.a === 0n && x.b === 0n && x.c === 0n && x.d === 0n;
}

/** The element a + b√2 of Z[√2] inside Z[ω]: a + bω - bω³. */
export function zoFromZSqrt2(x: ZSqrt2): ZOmega {
  return { a: x.a, b: x.b, c: 0n, d: -x.b };
}

/** The Gaussian integer re + im·i. */
export function zoFromGaussian(re: bigint, im: bigint): ZOmega {
  return { a: re, b: 0n, c: im, d: 0n };
}

/** x as an element of Z[√2] when x is real (c = 0 and d = -b), else null. */
export function zoToZSqrt2(x: ZOmega): ZSqrt2 | null {
  if (x.c !== 0n || x.d !== -x.b) return null;
  return { a: x.a, b: x.b };
}

/** x is a real number. */
export function zoIsReal(x: ZOmega): boolean {
  return x.c === 0n && x.d === -x.b;
}

/** √2 · Re(x) = (b - d) + a√2, an element of Z[√2]. */
export function zoSqrt2Re(x: ZOmega): ZSqrt2 {
  return { a: x.b - x.d, b: x.a };
}

/** √2 · Im(x) = (b + d) + c√2, an element of Z[√2]. */
export function zoSqrt2Im(x: ZOmega): ZSqrt2 {
  return { a: x.b + x.d, b: x.c };
}

/**
 * The element x with √2·Re(x) = p and √2·Im(x) = q, or null when no such element of Z[ω] exists
 * (it exists exactly when p.a and q.a have the same parity).
 */
export function zoFromSqrt2ReIm(p: ZSqrt2, q: ZSqrt2): ZOmega | null {
  if (((p.a ^ q.a) & 1n) !== 0n) return null;
  return { a: p.b, b: (p.a + q.a) >> 1n, c: q.b, d: (q.a - p.a) >> 1n };
}

/** √2 divides x in Z[ω]: a ≡ c and b ≡ d (mod 2). */
export function zoDivisibleBySqrt2(x: ZOmega): boolean {
  return ((x.a ^ x.c) & 1n) === 0n && ((x.b ^ x.d) & 1n) === 0n;
}

/** x / √2; requires √2 | x. (x/√2 = x(ω - ω³)/2.) */
export function zoDivSqrt2(x: ZOmega): ZOmega {
  const { a, b, c, d } = x;
  if (((a ^ c) & 1n) !== 0n || ((b ^ d) & 1n) !== 0n) throw new RangeError("zoDivSqrt2: not divisible by √2");
  return { a: (b - d) >> 1n, b: (a + c) >> 1n, c: (b + d) >> 1n, d: (c - a) >> 1n };
}

/** x · √2 = x(ω - ω³). */
export function zoMulSqrt2(x: ZOmega): ZOmega {
  const { a, b, c, d } = x;
  return { a: b - d, b: a + c, c: b + d, d: c - a };
}

/** δ = 1 + ω divides x: a + b + c + d is even (ω ≡ 1 mod δ and Z[ω]/(δ) has two elements). */
export function zoDivisibleByDelta(x: ZOmega): boolean {
  return ((x.a + x.b + x.c + x.d) & 1n) === 0n;
}

/** The largest m ≥ 0 with √2^m | x (x ≠ 0). */
export function zoSqrt2Valuation(x: ZOmega): number {
  if (zoIsZero(x)) throw new RangeError("zoSqrt2Valuation of zero");
  let m = 0;
  while (zoDivisibleBySqrt2(x)) {
    x = zoDivSqrt2(x);
    m++;
  }
  return m;
}

/** x / y rounded coefficient-wise to a nearest element of Z[ω] (y ≠ 0). */
export function zoDivRound(x: ZOmega, y: ZOmega): ZOmega {
  // x / y = x · y† · (y†y)• / N(y), N(y) = (y†y)(y†y)•.
  const n2 = zoNormSq(y);
  const n = n2.a * n2.a - 2n * n2.b * n2.b;
  if (n === 0n) throw new RangeError("zoDivRound: division by zero");
  const p = zoMul(zoMul(x, zoConj(y)), zoFromZSqrt2({ a: n2.a, b: -n2.b }));
  return { a: bigDivRound(p.a, n), b: bigDivRound(p.b, n), c: bigDivRound(p.c, n), d: bigDivRound(p.d, n) };
}

/** Euclidean division: x = q·y + r with N(r) < N(y) (y ≠ 0). */
export function zoDivMod(x: ZOmega, y: ZOmega): { readonly q: ZOmega; readonly r: ZOmega } {
  const q = zoDivRound(x, y);
  return { q, r: zoSub(x, zoMul(q, y)) };
}

/** x / y when y divides x in Z[ω], else null (y ≠ 0). */
export function zoDivExact(x: ZOmega, y: ZOmega): ZOmega | null {
  const n2 = zoNormSq(y);
  const n = n2.a * n2.a - 2n * n2.b * n2.b;
  if (n === 0n) throw new RangeError("zoDivExact: division by zero");
  const p = zoMul(zoMul(x, zoConj(y)), zoFromZSqrt2({ a: n2.a, b: -n2.b }));
  if (p.a % n !== 0n || p.b % n !== 0n || p.c % n !== 0n || p.d % n !== 0n) return null;
  return { a: p.a / n, b: p.b / n, c: p.c / n, d: p.d / n };
}

/** y divides x in Z[ω] (0 divides only 0). */
export function zoDivides(y: ZOmega, x: ZOmega): boolean {
  if (zoIsZero(y)) return zoIsZero(x);
  return zoDivExact(x, y) !== null;
}

/** A greatest common divisor (defined up to a unit) by the Euclidean algorithm. gcd(0, 0) = 0. */
export function zoGcd(x: ZOmega, y: ZOmega): ZOmega {
  while (!zoIsZero(y)) {
    const r = zoDivMod(x, y).r;
    x = y;
    y = r;
  }
  return x;
}

/** x is a unit of Z[ω] (absolute norm 1). */
export function zoIsUnit(x: ZOmega): boolean {
  return zoNorm(x) === 1n;
}

/** x^n for n ≥ 0, by squaring. */
export function zoPow(x: ZOmega, n: number): ZOmega {
  if (!Number.isInteger(n) || n < 0) throw new RangeError("zoPow: exponent must be a non-negative integer");
  let result = ZO_ONE;
  let base = x;
  let e = n;
  while (e > 0) {
    if (e & 1) result = zoMul(result, base);
    e = Math.floor(e / 2);
    if (e > 0) base = zoMul(base, base);
  }
  return result;
}

/** x as a complex number [re, im] in doubles, for display and tests only. */
export function zoToComplex(x: ZOmega): readonly [number, number] {
  const s = Math.SQRT1_2;
  const a = Number(x.a);
  const b = Number(x.b);
  const c = Number(x.c);
  const d = Number(x.d);
  return [a + (b - d) * s, c + (b + d) * s];
}

/** Human-readable form, e.g. "1+2ω-ω³", "0". */
export function zoToString(x: ZOmega): string {
  const parts: string[] = [];
  const terms: readonly [bigint, string][] = [
    [x.a, ""],
    [x.b, "ω"],
    [x.c, "ω²"],
    [x.d, "ω³"],
  ];
  for (const [coef, sym] of terms) {
    if (coef === 0n) continue;
    let s: string;
    if (sym === "") s = coef.toString();
    else if (coef === 1n) s = sym;
    else if (coef === -1n) s = `-${sym}`;
    else s = `${coef}${sym}`;
    parts.push(parts.length > 0 && !s.startsWith("-") ? `+${s}` : s);
  }
  return parts.length === 0 ? "0" : parts.join("");
}
