// The ring Z[√2] = {a + b√2 : a, b integers}: exact arithmetic, exact sign and order, Euclidean division, units.
import { divFloor as bigDivFloor, divRound as bigDivRound, isqrt as bigIsqrt } from "../../numeric/bigint.js";

// Integer helpers shared with the rest of the project, under the names this ring module has always used.
export { bigDivFloor, bigDivRound, bigIsqrt };

/** The element a + b√2. Immutable; both coefficients are BigInt. */
export interface ZSqrt2 {
  readonly a: bigint;
  readonly b: bigint;
}

/** a + b√2. */
export function zs(a: bigint, b: bigint = 0n): ZSqrt2 {
  return { a, b };
}

/** An ordinary integer (bigint or safe integer number) as an element of Z[√2]. */
export function zsFromInt(n: bigint | number): ZSqrt2 {
  return { a: BigInt(n), b: 0n };
}

export const ZS_ZERO: ZSqrt2 = { a: 0n, b: 0n };
export const ZS_ONE: ZSqrt2 = { a: 1n, b: 0n };
export const ZS_TWO: ZSqrt2 = { a: 2n, b: 0n };
/** √2. */
export const ZS_SQRT2: ZSqrt2 = { a: 0n, b: 1n };
/** The fundamental unit λ = 1 + √2 (norm -1). */
export const LAMBDA: ZSqrt2 = { a: 1n, b: 1n };
/** λ⁻¹ = -1 + √2. */
export const LAMBDA_INV: ZSqrt2 = { a: -1n, b: 1n };

/** x + y. */
export function zsAdd(x: ZSqrt2, y: ZSqrt2): ZSqrt2 {
  return { a: x.a + y.a, b: x.b + y.b };
}

/** x - y. */
export function zsSub(x: ZSqrt2, y: ZSqrt2): ZSqrt2 {
  return { a: x.a - y.a, b: x.b - y.b };
}

/** -x. */
export function zsNeg(x: ZSqrt2): ZSqrt2 {
  return { a: -x.a, b: -x.b };
}

/** x · y. */
export function zsMul(x: ZSqrt2, y: ZSqrt2): ZSqrt2 {
  return { a: x.a * y.a + 2n * x.b * y.b, b: x.a * y.b + x.b * y.a };
}

/** n · x for an ordinary integer n. */
export function zsScale(x: ZSqrt2, n: bigint): ZSqrt2 {
  return { a: x.a * n, b: x.b * n };
}

/** x². */
export function zsSquare(x: ZSqrt2): ZSqrt2 {
  return { a: x.a * x.a + 2n * x.b * x.b, b: 2n * x.a * x.b };
}

/** The • conjugation (√2 -> -√2): a + b√2 -> a - b√2. */
export function zsConj(x: ZSqrt2): ZSqrt2 {
  return { a: x.a, b: -x.b };
}

/** The norm N(x) = x · x• = a² - 2b², an ordinary integer (multiplicative). */
export function zsNorm(x: ZSqrt2): bigint {
  return x.a * x.a - 2n * x.b * x.b;
}

/** x = y exactly. */
export function zsEq(x: ZSqrt2, y: ZSqrt2): boolean {
  return x.a === y.a && x.b === y.b;
}

/** x = 0. */
export function zsIsZero(x: ZSqrt2): boolean {
  return x.a === 0n && x.b === 0n;
}

function bigSign(n: bigint): -1 | 0 | 1 {
  return n > 0n ? 1 : n < 0n ? -1 : 0;
}

/** The exact sign (-1, 0 or 1) of the real number a + b√2, decided by integer comparison only. */
export function zsSign(x: ZSqrt2): -1 | 0 | 1 {
  const { a, b } = x;
  if (a >= 0n && b >= 0n) return a === 0n && b === 0n ? 0 : 1;
  if (a <= 0n && b <= 0n) return -1;
  // Opposite signs: the term of larger absolute value wins; compare a² with 2b² (never equal, √2 is irrational).
  const s = bigSign(a * a - 2n * b * b);
  return (a > 0n ? s : -s) as -1 | 1;
}

/** Exact comparison of the real numbers x and y: -1 if x < y, 0 if equal, 1 if x > y. */
export function zsCompare(x: ZSqrt2, y: ZSqrt2): -1 | 0 | 1 {
  return zsSign({ a: x.a - y.a, b: x.b - y.b });
}

/** x ≥ 0 and x• ≥ 0 (the condition for x to be a sum t†t with t in Z[ω]). */
export function zsIsDoublyPositive(x: ZSqrt2): boolean {
  return zsSign(x) >= 0 && zsSign({ a: x.a, b: -x.b }) >= 0;
}

/** |x| as a real number, exactly. */
export function zsAbs(x: ZSqrt2): ZSqrt2 {
  return zsSign(x) < 0 ? zsNeg(x) : x;
}

/** ⌊b√2⌋ exactly. */
function floorBSqrt2(b: bigint): bigint {
  if (b === 0n) return 0n;
  const r = bigIsqrt(2n * b * b); // < |b|√2 since 2b² is never a square for b ≠ 0
  return b > 0n ? r : -r - 1n;
}

/** ⌊x⌋: the largest integer not above the real number a + b√2 (exact). */
export function zsFloor(x: ZSqrt2): bigint {
  return x.a + floorBSqrt2(x.b);
}

/** ⌈x⌉: the least integer not below the real number a + b√2 (exact). */
export function zsCeil(x: ZSqrt2): bigint {
  return x.b === 0n ? x.a : zsFloor(x) + 1n;
}

/** x / y rounded coefficient-wise to the nearest element of Z[√2] (y ≠ 0). */
export function zsDivRound(x: ZSqrt2, y: ZSqrt2): ZSqrt2 {
  const n = zsNorm(y);
  if (n === 0n) throw new RangeError("zsDivRound: division by zero");
  // x / y = x · y• / N(y)
  const pa = x.a * y.a - 2n * x.b * y.b;
  const pb = x.b * y.a - x.a * y.b;
  return { a: bigDivRound(pa, n), b: bigDivRound(pb, n) };
}

/** Euclidean division: x = q·y + r with |N(r)| < |N(y)| (y ≠ 0). */
export function zsDivMod(x: ZSqrt2, y: ZSqrt2): { readonly q: ZSqrt2; readonly r: ZSqrt2 } {
  const q = zsDivRound(x, y);
  return { q, r: zsSub(x, zsMul(q, y)) };
}

/** x / y when y divides x in Z[√2], else null (y ≠ 0). */
export function zsDivExact(x: ZSqrt2, y: ZSqrt2): ZSqrt2 | null {
  const n = zsNorm(y);
  if (n === 0n) throw new RangeError("zsDivExact: division by zero");
  const pa = x.a * y.a - 2n * x.b * y.b;
  const pb = x.b * y.a - x.a * y.b;
  if (pa % n !== 0n || pb % n !== 0n) return null;
  return { a: pa / n, b: pb / n };
}

/** y divides x in Z[√2] (0 divides only 0). */
export function zsDivides(y: ZSqrt2, x: ZSqrt2): boolean {
  if (zsIsZero(y)) return zsIsZero(x);
  return zsDivExact(x, y) !== null;
}

/** A greatest common divisor (defined up to a unit) by the Euclidean algorithm. gcd(0, 0) = 0. */
export function zsGcd(x: ZSqrt2, y: ZSqrt2): ZSqrt2 {
  while (!zsIsZero(y)) {
    const r = zsDivMod(x, y).r;
    x = y;
    y = r;
  }
  return x;
}

/** x is a unit of Z[√2] (norm ±1). */
export function zsIsUnit(x: ZSqrt2): boolean {
  const n = zsNorm(x);
  return n === 1n || n === -1n;
}

/** x^n for n ≥ 0 (n a safe integer), by squaring. */
export function zsPow(x: ZSqrt2, n: number): ZSqrt2 {
  if (!Number.isInteger(n) || n < 0) throw new RangeError("zsPow: exponent must be a non-negative integer");
  let result = ZS_ONE;
  let base = x;
  let e = n;
  while (e > 0) {
    if (e & 1) result = zsMul(result, base);
    e = Math.floor(e / 2);
    if (e > 0) base = zsSquare(base);
  }
  return result;
}

/** λⁿ for any integer n (negative powers through λ⁻¹ = -1 + √2). */
export function zsLambdaPow(n: number): ZSqrt2 {
  return n >= 0 ? zsPow(LAMBDA, n) : zsPow(LAMBDA_INV, -n);
}

/** √2 divides x, i.e. a is even. */
export function zsDivisibleBySqrt2(x: ZSqrt2): boolean {
  return (x.a & 1n) === 0n;
}

/** x / √2 = b + (a/2)√2; requires √2 | x (a even). */
export function zsDivSqrt2(x: ZSqrt2): ZSqrt2 {
  if ((x.a & 1n) !== 0n) throw new RangeError("zsDivSqrt2: not divisible by √2");
  return { a: x.b, b: x.a >> 1n };
}

/** x · √2 = 2b + a√2. */
export function zsMulSqrt2(x: ZSqrt2): ZSqrt2 {
  return { a: 2n * x.b, b: x.a };
}

/** The largest m ≥ 0 with √2^m | x (x ≠ 0). */
export function zsSqrt2Valuation(x: ZSqrt2): number {
  if (zsIsZero(x)) throw new RangeError("zsSqrt2Valuation of zero");
  let m = 0;
  let { a, b } = x;
  while ((a & 1n) === 0n) {
    const na = b;
    b = a >> 1n;
    a = na;
    m++;
  }
  return m;
}

/**
 * The real number a + b√2 as a double, for display and heuristics only (never to decide anything exact).
 * Avoids cancellation when a and b have opposite signs by using x = N(x) / x•.
 */
export function zsToNumber(x: ZSqrt2): number {
  const { a, b } = x;
  if ((a >= 0n) === (b >= 0n) || a === 0n || b === 0n) return Number(a) + Number(b) * Math.SQRT2;
  const conj = Number(a) - Number(b) * Math.SQRT2; // same-sign terms: accurate
  return Number(a * a - 2n * b * b) / conj;
}

/** Human-readable form, e.g. "3+2√2", "-√2", "0". */
export function zsToString(x: ZSqrt2): string {
  const { a, b } = x;
  if (b === 0n) return a.toString();
  const rad = b === 1n ? "√2" : b === -1n ? "-√2" : `${b}√2`;
  if (a === 0n) return rad;
  return `${a}${b > 0n ? "+" : ""}${rad}`;
}
