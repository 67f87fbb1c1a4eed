// Angles as the IR keeps them: an exact rational multiple of pi when known, always a high-precision decimal value.

/** A reduced fraction num/den with den > 0 and gcd(|num|, den) = 1. */
export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

/**
 * An angle in radians.
 * - `pi`: when the angle is known exactly as (num/den) * pi, that fraction; otherwise null.
 * - `value`: the angle in radians as a decimal string, exact when the source spells a
 *   decimal literal (e.g. "0.1"), else correct to at least ANGLE_DIGITS significant digits.
 * Floating point never decides whether an angle is exact: only `pi` does.
 */
export interface Angle {
  readonly pi: Rational | null;
  readonly value: string;
}

/** Significant decimal digits kept for angles that are not exact decimals (enough for eps = 1e-50). */
export const ANGLE_DIGITS = 120;
