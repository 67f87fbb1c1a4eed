// Arithmetic on IR angles that keeps exactness: exact pi-multiples stay exact, values stay high-precision.
import { ANGLE_DIGITS, type Angle, type Rational } from "./angle.js";
import { dec, PI, type Dec } from "../numeric/decimal.js";

function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

/** The reduced fraction num/den (den must be non-zero). */
export function rational(num: bigint, den: bigint = 1n): Rational {
  if (den === 0n) throw new RangeError("rational: zero denominator");
  if (den < 0n) {
    num = -num;
    den = -den;
  }
  const g = gcd(num, den) || 1n;
  return { num: num / g, den: den / g };
}

export function ratAdd(a: Rational, b: Rational): Rational {
  return rational(a.num * b.den + b.num * a.den, a.den * b.den);
}

export function ratMul(a: Rational, b: Rational): Rational {
  return rational(a.num * b.num, a.den * b.den);
}

export function ratEq(a: Rational, b: Rational): boolean {
  return a.num === b.num && a.den === b.den;
}

/** A decimal string with at most ANGLE_DIGITS significant digits (exact decimals shorter than that stay as they are). */
export function decToAngleString(d: Dec): string {
  const s = d.toSignificantDigits(ANGLE_DIGITS).toString();
  return s === "-0" ? "0" : s;
}

/** The angle (num/den) * pi, exactly. */
export function anglePi(r: Rational): Angle {
  const v = PI.times(dec(r.num)).div(dec(r.den));
  return { pi: r, value: decToAngleString(v) };
}

/** The angle of a real value in radians (not known as a pi-multiple). */
export function angleReal(value: Dec): Angle {
  return { pi: null, value: decToAngleString(value) };
}

/** The angle spelled by a decimal literal, exactly (e.g. "0.1", "-2.5e-3"). */
export function angleDecimal(text: string): Angle {
  return { pi: null, value: dec(text).toString() };
}

export const ZERO_ANGLE: Angle = { pi: { num: 0n, den: 1n }, value: "0" };

export function angleValue(a: Angle): Dec {
  return dec(a.value);
}

export function angleAdd(a: Angle, b: Angle): Angle {
  if (a.pi && b.pi) return anglePi(ratAdd(a.pi, b.pi));
  return angleReal(angleValue(a).plus(angleValue(b)));
}

export function angleNeg(a: Angle): Angle {
  if (a.pi) return { pi: rational(-a.pi.num, a.pi.den), value: a.value.startsWith("-") ? a.value.slice(1) : a.value === "0" ? "0" : "-" + a.value };
  return angleReal(angleValue(a).neg());
}

export function angleSub(a: Angle, b: Angle): Angle {
  return angleAdd(a, angleNeg(b));
}

/** r * a for a rational r (exact when a is). */
export function angleScale(a: Angle, r: Rational): Angle {
  if (a.pi) return anglePi(ratMul(a.pi, r));
  return angleReal(angleValue(a).times(dec(r.num)).div(dec(r.den)));
}

/** True when the angle is known exactly to be (k/4) * pi for an integer k. */
export function isExactQuarterPi(a: Angle): boolean {
  return a.pi !== null && 4n % a.pi.den === 0n;
}

/** The angle as a double (for display and float simulation only; never for exact decisions). */
export function angleToNumber(a: Angle): number {
  return Number(a.value);
}

/** Structural equality of two angles (exact: same pi-fraction, or same decimal value). */
export function angleEq(a: Angle, b: Angle): boolean {
  if (a.pi || b.pi) return a.pi !== null && b.pi !== null && ratEq(a.pi, b.pi);
  return angleValue(a).eq(angleValue(b));
}
