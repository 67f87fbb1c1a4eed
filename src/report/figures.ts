// How the report writes numbers: canonical decimal strings rounded in the safe direction, and angles in exact pi form.
import type { Angle, Rational } from "../ir/angle.js";
import type { SourceLoc } from "../ir/circuit.js";
import { dec, type Dec } from "../numeric/decimal.js";
import { FIGURE_DIGITS } from "./types.js";

/** Significant digits of an inexact angle's decimal value in a ledger row. */
export const ANGLE_REPORT_DIGITS = 20;

/** decimal.js rounding modes (the numeric values of Decimal.ROUND_CEIL and friends). */
const ROUND_CEIL = 2;
const ROUND_FLOOR = 3;
const ROUND_HALF_EVEN = 6;

/** A plain decimal number: optional sign, digits with an optional point, optional exponent. */
const DECIMAL_RE = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** True when `s` spells a finite decimal number (no hex, no Infinity/NaN, no spaces). */
export function isDecimalText(s: string): boolean {
  return DECIMAL_RE.test(s);
}

/** Parses a decimal string or passes a Dec through; throws a RangeError on anything else. */
export function toDec(v: string | Dec, what: string): Dec {
  if (typeof v !== "string") {
    if (!v.isFinite()) throw new RangeError(`${what}: not a finite number`);
    return v;
  }
  if (!isDecimalText(v)) throw new RangeError(`${what}: "${v}" is not a decimal number`);
  return dec(v);
}

/** The canonical text of a decimal: "0", or scientific notation with no trailing zeros ("1.25e-10", "3e+0"). */
export function canonicalDecimal(d: Dec): string {
  if (d.isZero()) return "0";
  return d.toExponential();
}

/** `d` rounded up (towards +infinity) to FIGURE_DIGITS significant digits, canonical text: an upper bound stays one. */
export function upperFigure(d: Dec): string {
  return canonicalDecimal(d.toSignificantDigits(FIGURE_DIGITS, ROUND_CEIL));
}

/** `d` rounded down (towards -infinity) to FIGURE_DIGITS significant digits, canonical text. */
export function lowerFigure(d: Dec): string {
  return canonicalDecimal(d.toSignificantDigits(FIGURE_DIGITS, ROUND_FLOOR));
}

/** `d` to `digits` significant digits, half-even, canonical text (for display only). */
export function shortFigure(d: Dec, digits: number): string {
  return canonicalDecimal(d.toSignificantDigits(digits, ROUND_HALF_EVEN));
}

/** The OpenQASM expression of (num/den) * pi: "0", "pi", "-pi/4", "3*pi/8", "2*pi". */
export function piForm(r: Rational): string {
  if (r.num === 0n) return "0";
  const sign = r.num < 0n ? "-" : "";
  const a = r.num < 0n ? -r.num : r.num;
  const head = a === 1n ? "pi" : `${a}*pi`;
  return sign + head + (r.den === 1n ? "" : `/${r.den}`);
}

/** The angle as a ledger shows it: decimal value (ANGLE_REPORT_DIGITS, exact decimals kept) and exact pi form. */
export function reportAngle(a: Angle): { readonly value: string; readonly pi: string | null } {
  const d = toDec(a.value, "angle");
  const value = d.isZero() ? "0" : d.toSignificantDigits(ANGLE_REPORT_DIGITS, ROUND_HALF_EVEN).toString();
  return { value, pi: a.pi === null ? null : piForm(a.pi) };
}

/** `file:line:col`. */
export function locationText(loc: SourceLoc): string {
  return `${loc.file}:${loc.line}:${loc.col}`;
}
