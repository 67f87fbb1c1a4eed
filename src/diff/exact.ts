// Exact decimal arithmetic for the diff: decimal strings as BigInt mantissa and power of ten, so no comparison ever rounds.
import { dec } from "../numeric/decimal.js";
import { canonicalDecimal, isDecimalText } from "../report/figures.js";

/** The exact number m * 10^e. */
export interface Exact {
  readonly m: bigint;
  readonly e: number;
}

export const EXACT_ZERO: Exact = { m: 0n, e: 0 };

/** Largest power of ten accepted (keeps the BigInt alignment of two numbers small). */
export const MAX_EXPONENT = 10000;

const PARTS_RE = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;

/** Parses a decimal string (as `isDecimalText` accepts it) exactly; throws a RangeError on anything else. */
export function parseExact(text: string): Exact {
  const parts = isDecimalText(text) ? PARTS_RE.exec(text) : null;
  if (parts === null) throw new RangeError(`"${text}" is not a decimal number`);
  const [, sign, whole, frac = "", exp = "0"] = parts;
  const e = Number(exp) - frac.length;
  if (!Number.isSafeInteger(e) || Math.abs(e) > MAX_EXPONENT) throw new RangeError(`"${text}": exponent out of range (at most ${MAX_EXPONENT} in size)`);
  const m = BigInt((whole + frac).replace(/^0+(?=\d)/, "") || "0");
  return normalize({ m: sign === "-" ? -m : m, e });
}

/** Removes trailing zeros of the mantissa, so equal numbers have equal fields. */
function normalize(x: Exact): Exact {
  if (x.m === 0n) return EXACT_ZERO;
  let { m, e } = x;
  while (m % 10n === 0n) {
    m /= 10n;
    e += 1;
  }
  return { m, e };
}

/** The exact number of a safe integer. */
export function exactInt(n: number): Exact {
  if (!Number.isSafeInteger(n)) throw new RangeError(`exactInt: ${n} is not a safe integer`);
  return normalize({ m: BigInt(n), e: 0 });
}

/** Both mantissas over the smaller exponent. */
function align(a: Exact, b: Exact): [bigint, bigint, number] {
  const e = Math.min(a.e, b.e);
  return [a.m * 10n ** BigInt(a.e - e), b.m * 10n ** BigInt(b.e - e), e];
}

export function exactAdd(a: Exact, b: Exact): Exact {
  const [x, y, e] = align(a, b);
  return normalize({ m: x + y, e });
}

export function exactSub(a: Exact, b: Exact): Exact {
  const [x, y, e] = align(a, b);
  return normalize({ m: x - y, e });
}

export function exactMul(a: Exact, b: Exact): Exact {
  return normalize({ m: a.m * b.m, e: a.e + b.e });
}

/** -1, 0 or 1 as a < b, a = b, a > b. */
export function exactCompare(a: Exact, b: Exact): number {
  const [x, y] = align(a, b);
  return x < y ? -1 : x > y ? 1 : 0;
}

export function exactSign(a: Exact): number {
  return a.m < 0n ? -1 : a.m > 0n ? 1 : 0;
}

/** The canonical text of the report (`canonicalDecimal`: "0", "1.25e-10", "-3e+0"), with every digit kept. */
export function exactText(a: Exact): string {
  // decimal.js keeps every digit of a constructed value (only arithmetic rounds), so this is exact.
  return canonicalDecimal(dec(`${a.m}e${a.e}`));
}

/** True when two decimal strings spell the same number. */
export function sameDecimal(a: string, b: string): boolean {
  return exactCompare(parseExact(a), parseExact(b)) === 0;
}

/** a / b as a double (for display only: a relative change); null when b is 0. */
export function exactRatio(a: Exact, b: Exact): number | null {
  if (b.m === 0n) return null;
  return dec(`${a.m}e${a.e}`).div(dec(`${b.m}e${b.e}`)).toNumber();
}
