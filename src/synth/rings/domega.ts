// The ring D[ω] = Z[ω][1/√2]: elements num/√2^k kept in a unique reduced form (least denominator exponent).
//
// Canonical form: { num, k } means num / √2^k with num not divisible by √2 in Z[ω]; so k may be negative
// (e.g. 2 is { num: 1, k: -2 }). Zero is { num: 0, k: 0 }. Two elements are equal iff their forms are equal.
import {
  type ZOmega,
  ZO_ZERO,
  ZO_ONE,
  zoAdd,
  zoBullet,
  zoConj,
  zoDivSqrt2,
  zoDivisibleBySqrt2,
  zoEq,
  zoIsZero,
  zoMul,
  zoMulOmega,
  zoMulSqrt2,
  zoNeg,
  zoToComplex,
  zoFromZSqrt2,
  zoToString,
} from "./zomega.js";
import type { ZSqrt2 } from "./zsqrt2.js";

/** num / √2^k in reduced form (see the module comment). */
export interface DOmega {
  readonly num: ZOmega;
  readonly k: number;
}

/** num / √2^k, reduced. */
export function dom(num: ZOmega, k: number = 0): DOmega {
  if (zoIsZero(num)) return DO_ZERO;
  while (zoDivisibleBySqrt2(num)) {
    num = zoDivSqrt2(num);
    k--;
  }
  return { num, k };
}

export const DO_ZERO: DOmega = { num: ZO_ZERO, k: 0 };
export const DO_ONE: DOmega = { num: ZO_ONE, k: 0 };
/** 1/√2. */
export const DO_INV_SQRT2: DOmega = { num: ZO_ONE, k: 1 };

/** An element of Z[√2] as an element of D[ω]. */
export function domFromZSqrt2(x: ZSqrt2): DOmega {
  return dom(zoFromZSqrt2(x), 0);
}

/** num · √2^m (m ≥ 0). */
function scaleUp(num: ZOmega, m: number): ZOmega {
  let r = num;
  for (let i = 0; i < m; i++) r = zoMulSqrt2(r);
  return r;
}

/** The numerator of x over the denominator √2^k, for any k ≥ lde(x): x = result / √2^k. */
export function domNumeratorAt(x: DOmega, k: number): ZOmega {
  if (k < x.k) throw new RangeError("domNumeratorAt: exponent below the least denominator exponent");
  return scaleUp(x.num, k - x.k);
}

/** x + y. */
export function domAdd(x: DOmega, y: DOmega): DOmega {
  if (zoIsZero(x.num)) return y;
  if (zoIsZero(y.num)) return x;
  const k = Math.max(x.k, y.k);
  return dom(zoAdd(scaleUp(x.num, k - x.k), scaleUp(y.num, k - y.k)), k);
}

/** -x. */
export function domNeg(x: DOmega): DOmega {
  return { num: zoNeg(x.num), k: x.k };
}

/** x - y. */
export function domSub(x: DOmega, y: DOmega): DOmega {
  return domAdd(x, domNeg(y));
}

/** x · y. */
export function domMul(x: DOmega, y: DOmega): DOmega {
  return dom(zoMul(x.num, y.num), x.k + y.k);
}

/** ω^j · x. */
export function domMulOmega(x: DOmega, j: number): DOmega {
  return { num: zoMulOmega(x.num, j), k: x.k };
}

/** Complex conjugate x†. */
export function domConj(x: DOmega): DOmega {
  return { num: zoConj(x.num), k: x.k };
}

/**
 * The • conjugation (√2 -> -√2). Since (√2)• = -√2, (num/√2^k)• = num• / (-√2)^k; the sign is folded
 * into the numerator (√2 | num• iff √2 | num, so the form stays reduced).
 */
export function domBullet(x: DOmega): DOmega {
  const nb = zoBullet(x.num);
  return { num: (x.k & 1) !== 0 ? zoNeg(nb) : nb, k: x.k };
}

/** x = y exactly. */
export function domEq(x: DOmega, y: DOmega): boolean {
  return x.k === y.k && zoEq(x.num, y.num);
}

/** x = 0. */
export function domIsZero(x: DOmega): boolean {
  return zoIsZero(x.num);
}

/** The least denominator exponent: the least k with √2^k x in Z[ω] (may be negative; 0 for zero). */
export function lde(x: DOmega): number {
  return x.k;
}

/** x as a complex number [re, im] in doubles, for display and tests only. */
export function domToComplex(x: DOmega): readonly [number, number] {
  const [re, im] = zoToComplex(x.num);
  const s = Math.pow(Math.SQRT2, -x.k);
  return [re * s, im * s];
}

/** Human-readable form, e.g. "(1+ω)/√2^3". */
export function domToString(x: DOmega): string {
  const n = zoToString(x.num);
  return x.k === 0 ? n : `(${n})/√2^${x.k}`;
}
