// Compile-time values of classical expressions: exact rationals, exact rational multiples of pi, high-precision reals, booleans; and their conversion to IR angles.
import type { Angle, Rational } from "../ir/angle.js";
import { anglePi, angleReal, rational, ZERO_ANGLE } from "../ir/angle-ops.js";
import { dec, PI, type Dec } from "../numeric/decimal.js";

/**
 * - `rat`: an exact rational (integers, decimal literals, their exact arithmetic);
 * - `pi`: exactly r * pi for a non-zero rational r (zero is always `rat`);
 * - `real`: anything else numeric, to WORK_DIGITS significant digits (never decides an exact question);
 * - `bool`, `dur` (a duration literal, kept as written), `bits` (a bitstring literal).
 */
export type Value =
  | { readonly t: "rat"; readonly r: Rational }
  | { readonly t: "pi"; readonly r: Rational }
  | { readonly t: "real"; readonly d: Dec }
  | { readonly t: "bool"; readonly b: boolean }
  | { readonly t: "dur"; readonly text: string }
  | { readonly t: "bits"; readonly text: string };

export type NumValue = Extract<Value, { t: "rat" | "pi" | "real" }>;

/** Why an operation has no value: the caller turns it into a diagnostic at the operator. */
export class ValueError extends Error {
  constructor(
    message: string,
    readonly hint?: string,
  ) {
    super(message);
  }
}

export const ZERO: NumValue = { t: "rat", r: { num: 0n, den: 1n } };
export const ONE: NumValue = { t: "rat", r: { num: 1n, den: 1n } };

export const ratValue = (num: bigint, den: bigint = 1n): NumValue => ({ t: "rat", r: rational(num, den) });
const piValue = (r: Rational): NumValue => (r.num === 0n ? { t: "rat", r } : { t: "pi", r });

export function isNum(v: Value): v is NumValue {
  return v.t === "rat" || v.t === "pi" || v.t === "real";
}

export function isInteger(v: Value): v is { t: "rat"; r: Rational } {
  return v.t === "rat" && v.r.den === 1n;
}

function realValue(d: Dec): NumValue {
  if (!d.isFinite()) throw new ValueError("the value is not finite", "check for a logarithm of zero, a square root of a negative number or an overflow");
  if (d.isZero()) return ZERO;
  return { t: "real", d };
}

/** The value as a high-precision decimal. */
export function toDec(v: NumValue): Dec {
  switch (v.t) {
    case "rat":
      return v.r.den === 1n ? dec(v.r.num) : dec(v.r.num).div(dec(v.r.den));
    case "pi":
      return PI.times(dec(v.r.num)).div(dec(v.r.den));
    case "real":
      return v.d;
  }
}

function isZero(v: NumValue): boolean {
  return v.t === "rat" ? v.r.num === 0n : v.t === "real" ? v.d.isZero() : false;
}

const ratAdd = (a: Rational, b: Rational): Rational => rational(a.num * b.den + b.num * a.den, a.den * b.den);
const ratMul = (a: Rational, b: Rational): Rational => rational(a.num * b.num, a.den * b.den);

export function add(a: NumValue, b: NumValue): NumValue {
  if (a.t === "rat" && b.t === "rat") return { t: "rat", r: ratAdd(a.r, b.r) };
  if (a.t === "pi" && b.t === "pi") return piValue(ratAdd(a.r, b.r));
  if (isZero(a)) return b;
  if (isZero(b)) return a;
  return realValue(toDec(a).plus(toDec(b)));
}

export function neg(a: NumValue): NumValue {
  switch (a.t) {
    case "rat":
      return { t: "rat", r: { num: -a.r.num, den: a.r.den } };
    case "pi":
      return { t: "pi", r: { num: -a.r.num, den: a.r.den } };
    case "real":
      return { t: "real", d: a.d.neg() };
  }
}

export function sub(a: NumValue, b: NumValue): NumValue {
  return add(a, neg(b));
}

export function mul(a: NumValue, b: NumValue): NumValue {
  if (a.t === "rat" && b.t === "rat") return { t: "rat", r: ratMul(a.r, b.r) };
  if (isZero(a) || isZero(b)) return ZERO;
  if (a.t === "rat" && b.t === "pi") return piValue(ratMul(a.r, b.r));
  if (a.t === "pi" && b.t === "rat") return piValue(ratMul(a.r, b.r));
  return realValue(toDec(a).times(toDec(b)));
}

const inverse = (r: Rational): Rational => rational(r.den, r.num);

export function div(a: NumValue, b: NumValue): NumValue {
  if (isZero(b)) throw new ValueError("division by zero");
  if (isZero(a)) return ZERO;
  if (b.t === "rat") {
    if (a.t === "rat") return { t: "rat", r: ratMul(a.r, inverse(b.r)) };
    if (a.t === "pi") return piValue(ratMul(a.r, inverse(b.r)));
  }
  if (a.t === "pi" && b.t === "pi") return { t: "rat", r: ratMul(a.r, inverse(b.r)) };
  return realValue(toDec(a).div(toDec(b)));
}

/** a - b * trunc(a / b), the remainder with the sign of a (as C and OpenQASM integers do). */
export function mod(a: NumValue, b: NumValue): NumValue {
  if (isZero(b)) throw new ValueError("division by zero (in '%')");
  if ((a.t === "rat" && b.t === "rat") || (a.t === "pi" && b.t === "pi")) {
    const q = (a.r.num * b.r.den) / (a.r.den * b.r.num);
    return sub(a, mul(b, ratValue(q)));
  }
  const da = toDec(a);
  const db = toDec(b);
  return realValue(da.minus(db.times(da.div(db).trunc())));
}

/** Exponents beyond this size are computed as reals (keeps exact integers from growing without bound). */
const MAX_EXACT_EXPONENT = 4096n;

export function pow(a: NumValue, b: NumValue): NumValue {
  if (isInteger(b)) {
    const k = b.r.num;
    if (k === 0n) return ONE;
    if (k === 1n) return a;
    if (isZero(a) && k < 0n) throw new ValueError("division by zero (zero to a negative power)");
    if (a.t === "rat" && (k < 0n ? -k : k) <= MAX_EXACT_EXPONENT && bitLength(a.r.num) + bitLength(a.r.den) <= 256) {
      const e = k < 0n ? -k : k;
      const r = rational(a.r.num ** e, a.r.den ** e);
      return { t: "rat", r: k < 0n ? inverse(r) : r };
    }
  }
  if (isZero(a)) return ZERO;
  const base = toDec(a);
  const ex = toDec(b);
  if (base.isNegative() && !isInteger(b)) throw new ValueError("the value is not finite (a negative number to a fractional power)");
  return realValue(base.pow(ex));
}

function bitLength(n: bigint): number {
  return (n < 0n ? -n : n).toString(2).length;
}

/** Exact comparison when both sides are exact, else by their high-precision values. Returns -1, 0 or 1. */
export function compare(a: NumValue, b: NumValue): number {
  if (a.t === "rat" && b.t === "rat") return cmpRat(a.r, b.r);
  if (a.t === "pi" && b.t === "pi") return cmpRat(a.r, b.r);
  return toDec(a).comparedTo(toDec(b));
}

function cmpRat(a: Rational, b: Rational): number {
  const l = a.num * b.den;
  const r = b.num * a.den;
  return l < r ? -1 : l > r ? 1 : 0;
}

/** trunc toward zero as a bigint. */
export function truncInt(v: NumValue): bigint {
  if (v.t === "rat") return v.r.num / v.r.den;
  return BigInt(toDec(v).trunc().toFixed(0));
}

export function floorInt(v: NumValue): bigint {
  if (v.t === "rat") {
    const q = v.r.num / v.r.den;
    return v.r.num < 0n && q * v.r.den !== v.r.num ? q - 1n : q;
  }
  return BigInt(toDec(v).floor().toFixed(0));
}

// ---------------------------------------------------------------------------------------------
// Functions. Exact where the answer is a known rational or rational multiple of pi.

/** sin(r pi) exactly when it is rational (0, ±1/2, ±1), else null. */
function sinPiExact(r: Rational): Rational | null {
  if ((r.num * 12n) % r.den !== 0n) return null;
  const k = ((((r.num * 12n) / r.den) % 24n) + 24n) % 24n; // r = k/12 (mod 2)
  const table: Readonly<Record<string, Rational>> = {
    "0": rational(0n),
    "2": rational(1n, 2n),
    "6": rational(1n),
    "10": rational(1n, 2n),
    "12": rational(0n),
    "14": rational(-1n, 2n),
    "18": rational(-1n),
    "22": rational(-1n, 2n),
  };
  return table[k.toString()] ?? null;
}

const HALF_PI: Rational = { num: 1n, den: 2n };

export function callFunction(name: string, args: readonly NumValue[]): NumValue {
  const one = (): NumValue => {
    if (args.length !== 1) throw new ValueError(`'${name}' takes 1 argument, got ${args.length}`);
    return args[0]!;
  };
  switch (name) {
    case "sin": {
      const x = one();
      if (isZero(x)) return ZERO;
      if (x.t === "pi") {
        const e = sinPiExact(x.r);
        if (e) return { t: "rat", r: e };
      }
      return realValue(toDec(x).sin());
    }
    case "cos": {
      const x = one();
      if (isZero(x)) return ONE;
      if (x.t === "pi") {
        const e = sinPiExact(ratAdd(x.r, HALF_PI));
        if (e) return { t: "rat", r: e };
      }
      return realValue(toDec(x).cos());
    }
    case "tan": {
      const x = one();
      if (isZero(x)) return ZERO;
      if (x.t === "pi") {
        const s = sinPiExact(x.r);
        const c = sinPiExact(ratAdd(x.r, HALF_PI));
        if (s && c) {
          if (c.num === 0n) throw new ValueError("the value is not finite (tan at an odd multiple of pi/2)");
          return { t: "rat", r: ratMul(s, inverse(c)) };
        }
      }
      return realValue(toDec(x).tan());
    }
    case "arcsin":
    case "arccos": {
      const x = one();
      if (x.t === "rat") {
        const special: Record<string, Rational> = { "0/1": rational(0n), "1/2": rational(1n, 6n), "1/1": rational(1n, 2n) };
        const a = x.r.num < 0n ? { num: -x.r.num, den: x.r.den } : x.r;
        const s = special[`${a.num}/${a.den}`];
        if (s) {
          const asin = x.r.num < 0n ? { num: -s.num, den: s.den } : s;
          return piValue(name === "arcsin" ? asin : ratAdd(HALF_PI, { num: -asin.num, den: asin.den }));
        }
      }
      const d = toDec(x);
      if (d.abs().gt(1)) throw new ValueError(`the value is not finite ('${name}' of a number outside [-1, 1])`);
      return realValue(name === "arcsin" ? d.asin() : d.acos());
    }
    case "arctan": {
      const x = one();
      if (x.t === "rat" && (x.r.num === 0n || (x.r.den === 1n && (x.r.num === 1n || x.r.num === -1n)))) {
        return piValue(rational(x.r.num, 4n));
      }
      return realValue(toDec(x).atan());
    }
    case "exp": {
      const x = one();
      if (isZero(x)) return ONE;
      return realValue(toDec(x).exp());
    }
    case "ln":
    case "log": {
      const x = one();
      if (x.t === "rat" && x.r.num === 1n && x.r.den === 1n) return ZERO;
      const d = toDec(x);
      if (!d.isPositive() || d.isZero()) throw new ValueError("the value is not finite (logarithm of a number that is not positive)");
      return realValue(d.ln());
    }
    case "sqrt": {
      const x = one();
      if (x.t === "rat") {
        if (x.r.num < 0n) throw new ValueError("the value is not finite (square root of a negative number)");
        const n = isqrt(x.r.num);
        const m = isqrt(x.r.den);
        if (n * n === x.r.num && m * m === x.r.den) return { t: "rat", r: rational(n, m) };
      }
      const d = toDec(x);
      if (d.isNegative() && !d.isZero()) throw new ValueError("the value is not finite (square root of a negative number)");
      return realValue(d.sqrt());
    }
    case "floor":
      return ratValue(floorInt(one()));
    case "ceiling":
      return ratValue(-floorInt(neg(one())));
    case "abs": {
      const x = one();
      return compare(x, ZERO) < 0 ? neg(x) : x;
    }
    case "mod": {
      if (args.length !== 2) throw new ValueError(`'mod' takes 2 arguments, got ${args.length}`);
      return mod(args[0]!, args[1]!);
    }
  }
  throw new ValueError(`unknown function '${name}'`);
}

export const FUNCTIONS: ReadonlySet<string> = new Set(["sin", "cos", "tan", "arcsin", "arccos", "arctan", "exp", "ln", "log", "sqrt", "floor", "ceiling", "abs", "mod"]);

function isqrt(n: bigint): bigint {
  if (n < 2n) return n;
  let x = BigInt(Math.floor(Math.sqrt(Number(n))));
  for (;;) {
    const y = (x + n / x) >> 1n;
    if (y >= x && x * x <= n && (x + 1n) * (x + 1n) > n) return x;
    if (y === x) return x;
    x = y;
  }
}

/** The built-in constants by name: pi/π, tau/τ, euler/ℇ. */
export function builtinConstant(name: string): NumValue | null {
  switch (name) {
    case "pi":
    case "π":
      return { t: "pi", r: { num: 1n, den: 1n } };
    case "tau":
    case "τ":
      return { t: "pi", r: { num: 2n, den: 1n } };
    case "euler":
    case "ℇ":
      return { t: "real", d: EULER };
  }
  return null;
}

const EULER: Dec = dec(1).exp();

// ---------------------------------------------------------------------------------------------
// Literals and conversion to angles.

/** The exact rational a numeric literal spells (decimal, hex, octal, binary; underscores allowed). */
export function parseNumberLiteral(text: string): Rational {
  const t = text.replace(/_/g, "");
  if (/^0[xX]/.test(t)) return rational(BigInt(t));
  if (/^0[oO]/.test(t)) return rational(BigInt("0o" + t.slice(2)));
  if (/^0[bB]/.test(t)) return rational(BigInt(t));
  const m = /^(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(t);
  if (!m) throw new ValueError(`malformed number '${text}'`);
  const intPart = m[1] ?? "";
  const frac = m[2] ?? "";
  let exp = BigInt(m[3] ?? "0") - BigInt(frac.length);
  if (exp > 100000n || exp < -100000n) throw new ValueError(`the exponent of '${text}' is out of range`);
  const digits = BigInt((intPart + frac).replace(/^0+(?=\d)/, "") || "0");
  if (exp >= 0n) return rational(digits * 10n ** exp);
  exp = -exp;
  return rational(digits, 10n ** exp);
}

/** A canonical decimal string of a rational whose denominator has no prime factor but 2 and 5, else null. */
function exactDecimal(r: Rational): string | null {
  let d = r.den;
  let twos = 0n;
  let fives = 0n;
  while (d % 2n === 0n) {
    d /= 2n;
    twos++;
  }
  while (d % 5n === 0n) {
    d /= 5n;
    fives++;
  }
  if (d !== 1n) return null;
  const k = twos > fives ? twos : fives;
  const scaled = (r.num * 10n ** k) / r.den;
  const neg = scaled < 0n;
  let s = (neg ? -scaled : scaled).toString();
  const kk = Number(k);
  if (kk > 0) {
    s = s.padStart(kk + 1, "0");
    s = s.slice(0, s.length - kk) + "." + s.slice(s.length - kk);
  }
  return (neg ? "-" : "") + s;
}

const angleCache = new Map<string, Angle>();

/**
 * The IR angle of a numeric value: exact pi-multiples keep their fraction, zero is the exact angle 0,
 * a rational with a finite decimal expansion is that exact decimal, anything else a 120-digit value.
 */
export function toAngle(v: NumValue): Angle {
  if (v.t === "real") return angleReal(v.d);
  if (v.t === "rat" && v.r.num === 0n) return ZERO_ANGLE;
  const key = `${v.t}${v.r.num}/${v.r.den}`;
  const hit = angleCache.get(key);
  if (hit) return hit;
  let a: Angle;
  if (v.t === "pi") a = anglePi(v.r);
  else {
    const s = exactDecimal(v.r);
    a = s !== null ? { pi: null, value: dec(s).toString() } : angleReal(dec(v.r.num).div(dec(v.r.den)));
  }
  if (angleCache.size > 100_000) angleCache.clear();
  angleCache.set(key, a);
  return a;
}

/** The numeric value of an IR angle (exact when the angle is a pi-multiple or an exact decimal). */
export function angleToValue(a: Angle): NumValue {
  if (a.pi) return piValue(a.pi);
  const neg = a.value.startsWith("-");
  const r = parseNumberLiteral(neg ? a.value.slice(1) : a.value);
  return { t: "rat", r: neg ? { num: -r.num, den: r.den } : r };
}
