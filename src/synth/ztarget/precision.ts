// Reading the inputs of synthesis exactly: ε as an exact decimal, angles as fixed point at the precision ε needs, exact π/4 multiples.
import type { Angle } from "../../ir/angle.js";
import { divFloor, divRound, mod } from "../../numeric/bigint.js";
import { decimalToRational, fxFromRational, fxPi, parseDecimal } from "../../numeric/fixed.js";

/** ε read exactly, with the working precision it calls for. */
export interface EpsInfo {
  /** The exact rational ε = num/den. */
  readonly num: bigint;
  readonly den: bigint;
  /** ⌈log2(1/ε)⌉ (at least 1). */
  readonly log2InvEps: number;
  /** Working precision in bits: 6 log2(1/ε) + 128. */
  readonly prec: number;
  /** ε rounded up and ε² rounded down, fixed point at prec. */
  readonly epsUp: bigint;
  readonly eps2Down: bigint;
}

/** Parses ε (a positive decimal string) and derives the precision. Throws RangeError for ε ≤ 0 or a malformed string. */
export function readEps(eps: string): EpsInfo {
  let d;
  try {
    d = parseDecimal(eps);
  } catch {
    throw new RangeError(`eps must be a positive decimal number, got "${eps}"`);
  }
  if (d.m <= 0n) throw new RangeError(`eps must be positive, got "${eps}"`);
  const { num, den } = decimalToRational(d);
  // log2(1/ε) from the decimal exponent and the leading digits (no underflow for tiny ε)
  const digits = d.m.toString();
  const log10 = Math.log10(Number(digits.slice(0, 15))) + digits.length - Math.min(15, digits.length) + d.e;
  const log2InvEps = Math.max(1, Math.ceil(-log10 * Math.log2(10)));
  const prec = 6 * log2InvEps + 128;
  const P = BigInt(prec);
  const epsUp = -divFloor(-(num << P), den);
  const eps2Down = divFloor((num * num) << P, den * den);
  return { num, den, log2InvEps, prec, epsUp, eps2Down };
}

/**
 * The angle in fixed point at `prec` bits. A known π-multiple (num/den)π is first reduced exactly to
 * (-2π, 2π] (rz has period 4π); a decimal value is converted exactly as written (sine and cosine reduce
 * large arguments themselves with enough extra bits).
 */
export function angleToFixed(a: Angle, prec: number): bigint {
  if (a.pi !== null) {
    const { num, den } = a.pi;
    let r = mod(num, 4n * den); // [0, 4den)
    if (r > 2n * den) r -= 4n * den;
    const guard = 16;
    return divRound(r * fxPi(prec + guard), den << BigInt(guard));
  }
  const { num, den } = decimalToRational(parseDecimal(a.value));
  return fxFromRational(num, den, prec);
}

/** k in -7..8 when the angle is exactly kπ/4 (mod 4π), else null. Exactness is known, never guessed from the value. */
export function exactQuarterTurns(a: Angle): number | null {
  if (a.pi !== null) {
    if (4n % a.pi.den !== 0n) return null;
    let k = Number(mod((a.pi.num * 4n) / a.pi.den, 16n));
    if (k > 8) k -= 16;
    return k;
  }
  // A decimal literal is an exact multiple of π/4 only when it is zero.
  return parseDecimal(a.value).m === 0n ? 0 : null;
}
