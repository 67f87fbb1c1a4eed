// Fixed-point reals on BigInt: x stands for x / 2^prec; exact parsing, pi, sine/cosine, square roots, decimal output.
import { divFloor, divRound, isqrt } from "./bigint.js";

// Every function takes the precision `prec` (bits after the binary point) explicitly; results are
// within a few units of 2^-prec of the true value unless stated otherwise.

/** a·b at the same precision (rounded toward -infinity). */
export function fxMul(a: bigint, b: bigint, prec: number): bigint {
  return (a * b) >> BigInt(prec);
}

/** a / b at the same precision (rounded to nearest). */
export function fxDiv(a: bigint, b: bigint, prec: number): bigint {
  return divRound(a << BigInt(prec), b);
}

/** ⌊√a⌋ at the same precision, a ≥ 0. */
export function fxSqrt(a: bigint, prec: number): bigint {
  return isqrt(a << BigInt(prec));
}

/** The integer n as a fixed-point number. */
export function fxFromInt(n: bigint, prec: number): bigint {
  return n << BigInt(prec);
}

/** num/den rounded to nearest (den ≠ 0). */
export function fxFromRational(num: bigint, den: bigint, prec: number): bigint {
  return divRound(num << BigInt(prec), den);
}

/** An exact decimal m·10^e (m, e integers). */
export interface ExactDecimal {
  readonly m: bigint;
  readonly e: number;
}

/** Parses a decimal string such as "-1.25e-7", "0.1", "3", "+.5E3" exactly; throws on anything else. */
export function parseDecimal(s: string): ExactDecimal {
  const t = s.trim();
  const match = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(t);
  if (!match || (match[2] === "" && (match[3] ?? "") === "")) throw new SyntaxError(`not a decimal number: "${s}"`);
  const frac = match[3] ?? "";
  const digits = (match[2] ?? "") + frac;
  let m = BigInt(digits === "" ? "0" : digits);
  if (match[1] === "-") m = -m;
  const e = (match[4] ? parseInt(match[4], 10) : 0) - frac.length;
  return { m, e };
}

/** An exact decimal as a rational num/den with den > 0 (den a power of ten). */
export function decimalToRational(d: ExactDecimal): { readonly num: bigint; readonly den: bigint } {
  return d.e >= 0 ? { num: d.m * 10n ** BigInt(d.e), den: 1n } : { num: d.m, den: 10n ** BigInt(-d.e) };
}

/** A decimal string as a fixed-point number, rounded to nearest. */
export function fxFromDecimal(s: string, prec: number): bigint {
  const { num, den } = decimalToRational(parseDecimal(s));
  return fxFromRational(num, den, prec);
}

const piCache = new Map<number, bigint>();

/** π (Machin: π = 16 arctan(1/5) - 4 arctan(1/239)), cached per precision. */
export function fxPi(prec: number): bigint {
  const hit = piCache.get(prec);
  if (hit !== undefined) return hit;
  const guard = 20;
  const p = prec + guard;
  const one = 1n << BigInt(p);
  const atanInv = (x: bigint): bigint => {
    // arctan(1/x) = sum (-1)^n / ((2n+1) x^(2n+1))
    let term = one / x;
    const x2 = x * x;
    let sum = 0n;
    let n = 1n;
    let sign = 1n;
    while (term !== 0n) {
      sum += (sign * term) / n;
      term /= x2;
      n += 2n;
      sign = -sign;
    }
    return sum;
  };
  const v = (16n * atanInv(5n) - 4n * atanInv(239n)) >> BigInt(guard);
  piCache.set(prec, v);
  return v;
}

/**
 * cos x and sin x for a fixed-point x (any size): reduction by the nearest multiple of π/2 with
 * extra bits for large |x|, then Taylor series on |r| ≤ π/4.
 */
export function fxCosSin(x: bigint, prec: number): { readonly cos: bigint; readonly sin: bigint } {
  const extra = Math.max(0, x.toString(2).length - prec) + 24;
  const p = prec + extra;
  const bx = x << BigInt(extra);
  const halfPi = fxPi(p) >> 1n;
  const q = divRound(bx, halfPi);
  const r = bx - q * halfPi; // |r| ≤ π/4 (plus rounding)
  const one = 1n << BigInt(p);
  const r2 = (r * r) >> BigInt(p);
  // cos r = sum (-1)^n r^(2n)/(2n)!, sin r = sum (-1)^n r^(2n+1)/(2n+1)!
  let c = 0n;
  let s = 0n;
  let termC = one;
  let termS = r;
  for (let n = 1n; termC !== 0n || termS !== 0n; n += 2n) {
    c += termC;
    s += termS;
    termC = -divFloor(termC * r2, (n * (n + 1n)) << BigInt(p));
    termS = -divFloor(termS * r2, ((n + 1n) * (n + 2n)) << BigInt(p));
  }
  const quadrant = Number(((q % 4n) + 4n) % 4n);
  const [cq, sq] = quadrant === 0 ? [c, s] : quadrant === 1 ? [-s, c] : quadrant === 2 ? [-c, -s] : [s, -c];
  const sh = BigInt(extra);
  return { cos: divRound(cq, 1n << sh), sin: divRound(sq, 1n << sh) };
}

/** A fixed-point number as a double (for display and heuristics only). */
export function fxToNumber(x: bigint, prec: number): number {
  if (x === 0n) return 0;
  const neg = x < 0n;
  const ax = neg ? -x : x;
  const len = ax.toString(2).length;
  const shift = Math.max(0, len - 60);
  const v = Number(ax >> BigInt(shift)) * 2 ** (shift - prec);
  return neg ? -v : v;
}

/**
 * A non-negative fixed-point number as a decimal string in scientific notation with `digits`
 * significant digits, rounded up (so the string is an upper bound of the value), e.g. "1.2345e-11".
 * Zero gives "0".
 */
export function fxToDecimalUp(x: bigint, prec: number, digits: number): string {
  if (x < 0n) throw new RangeError("fxToDecimalUp: negative value");
  if (x === 0n) return "0";
  const unit = 1n << BigInt(prec);
  // q = ceil(x · 10^s / 2^prec) with exactly `digits` decimal digits; the value is ≤ q · 10^-s.
  let s = digits - 1 - Math.floor(Math.log10(fxToNumber(x, prec)));
  for (;;) {
    const q = s >= 0 ? -divFloor(-x * 10n ** BigInt(s), unit) : -divFloor(-x, unit * 10n ** BigInt(-s));
    const len = q.toString().length;
    if (len > digits) {
      s--;
      continue;
    }
    if (len < digits) {
      s++;
      continue;
    }
    const str = q.toString().replace(/0+$/, "");
    const exp = digits - 1 - s;
    const mant = str.length > 1 ? `${str[0]}.${str.slice(1)}` : str;
    return exp === 0 ? mant : `${mant}e${exp}`;
  }
}

/** A fixed-point number as a decimal string with `digits` digits after the point (rounded to nearest). */
export function fxToFixedString(x: bigint, prec: number, digits: number): string {
  const scaled = divRound(x * 10n ** BigInt(digits), 1n << BigInt(prec));
  const neg = scaled < 0n;
  let str = (neg ? -scaled : scaled).toString().padStart(digits + 1, "0");
  const intPart = str.slice(0, str.length - digits);
  let fracPart = str.slice(str.length - digits).replace(/0+$/, "");
  str = fracPart === "" ? intPart : `${intPart}.${fracPart}`;
  if (str === "0") return "0";
  return neg ? `-${str}` : str;
}
