// High-precision decimal reals (mathjs's BigNumber, a decimal.js class) configured once for the whole project.
import { create, all, type BigNumber } from "mathjs";

/** Significant digits of every intermediate high-precision computation (angles keep ANGLE_DIGITS of them). */
export const WORK_DIGITS = 140;

const math = create(all, { number: "BigNumber", precision: WORK_DIGITS });

export type Dec = BigNumber;

/** The decimal.js constructor behind mathjs's BigNumber, at WORK_DIGITS precision. */
export const Decimal = (math.bignumber(0) as unknown as { constructor: new (v: string | number) => Dec }).constructor;

/** A high-precision decimal from a decimal string, a safe integer or a bigint (exact when the input is). */
export function dec(v: string | number | bigint): Dec {
  return new Decimal(typeof v === "bigint" ? v.toString() : v);
}

/** pi to WORK_DIGITS significant digits. */
export const PI: Dec = math.pi as unknown as Dec;
