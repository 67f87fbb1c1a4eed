// High-precision decimal reals (decimal.js, the library behind mathjs's BigNumber) configured once for the whole project.
import { Decimal as DecimalJs } from "decimal.js";

/** Significant digits of every intermediate high-precision computation (angles keep ANGLE_DIGITS of them). */
export const WORK_DIGITS = 140;

/**
 * The decimal constructor at WORK_DIGITS precision. It is mathjs's BigNumber class, loaded directly:
 * loading all of mathjs cost 0.9 s at every start of the command line and of every worker thread.
 */
export const Decimal = DecimalJs.clone({ precision: WORK_DIGITS });

export type Dec = DecimalJs;

/** A high-precision decimal from a decimal string, a safe integer or a bigint (exact when the input is). */
export function dec(v: string | number | bigint): Dec {
  return new Decimal(typeof v === "bigint" ? v.toString() : v);
}

/** pi to WORK_DIGITS significant digits. */
export const PI: Dec = Decimal.acos(-1);
