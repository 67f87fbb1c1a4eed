import { describe, expect, it } from "vitest";
import { create, all } from "mathjs";
import {
  decimalToRational,
  fxCosSin,
  fxDiv,
  fxFromDecimal,
  fxMul,
  fxPi,
  fxSqrt,
  fxToDecimalUp,
  fxToFixedString,
  fxToNumber,
  parseDecimal,
} from "../../src/numeric/fixed.js";

// mathjs BigNumber at 130 digits: an independent reference for pi, cos and sin.
const M = create(all, { number: "BigNumber", precision: 130 });
const big = (s: string) => M.bignumber(s);

/** |fixed - ref| as a decimal, ref a mathjs BigNumber. */
function diff(x: bigint, prec: number, ref: ReturnType<typeof big>): number {
  const v = M.divide(big(x.toString()), M.pow(big("2"), big(String(prec)))) as unknown as ReturnType<typeof big>;
  return Number(M.abs(M.subtract(v, ref) as unknown as ReturnType<typeof big>).toString());
}

describe("fixed-point reals", () => {
  it("parses decimal strings exactly", () => {
    expect(parseDecimal("-1.25e-7")).toEqual({ m: -125n, e: -9 });
    expect(parseDecimal("0.1")).toEqual({ m: 1n, e: -1 });
    expect(parseDecimal("3")).toEqual({ m: 3n, e: 0 });
    expect(parseDecimal("+.5E3")).toEqual({ m: 5n, e: 2 });
    expect(decimalToRational(parseDecimal("2.5e2"))).toEqual({ num: 250n, den: 1n });
    expect(() => parseDecimal("pi")).toThrow();
    expect(() => parseDecimal(".")).toThrow();
  });

  it("pi to 400 bits matches mathjs's pi (an independent reference)", () => {
    const prec = 400;
    expect(diff(fxPi(prec), prec, M.pi as unknown as ReturnType<typeof big>)).toBeLessThan(2 ** -395);
  });

  it("cos and sin match mathjs at 400 bits for small, large and negative arguments", () => {
    const prec = 400;
    for (const s of ["0", "0.1", "-0.7853981", "1", "3.14159", "-2.5", "100.25", "-12345.678", "1e-30", "1e25"]) {
      const x = fxFromDecimal(s, prec);
      const { cos, sin } = fxCosSin(x, prec);
      expect(diff(cos, prec, M.cos(big(s)) as unknown as ReturnType<typeof big>)).toBeLessThan(2 ** -390);
      expect(diff(sin, prec, M.sin(big(s)) as unknown as ReturnType<typeof big>)).toBeLessThan(2 ** -390);
    }
  });

  it("mul, div and sqrt are accurate to a few units in the last place", () => {
    const prec = 200;
    const a = fxFromDecimal("1.7320508", prec);
    const b = fxFromDecimal("-0.00123", prec);
    expect(diff(fxMul(a, b, prec), prec, M.multiply(big("1.7320508"), big("-0.00123")) as never)).toBeLessThan(2 ** -195);
    // the inputs carry 2^-200 rounding, which the quotient magnifies by about 1/|b|^2 ~ 2^20
    expect(diff(fxDiv(a, b, prec), prec, M.divide(big("1.7320508"), big("-0.00123")) as never)).toBeLessThan(2 ** -175);
    expect(diff(fxSqrt(a, prec), prec, M.sqrt(big("1.7320508")) as never)).toBeLessThan(2 ** -195);
    expect(fxToNumber(a, prec)).toBeCloseTo(1.7320508, 12);
  });

  it("decimal output rounds up (an upper bound) with the requested significant digits", () => {
    const prec = 300;
    expect(fxToDecimalUp(fxFromDecimal("1.5", prec), prec, 6)).toBe("1.5");
    // 1/3 rounded up to 6 digits
    expect(fxToDecimalUp(fxDiv(1n << BigInt(prec), 3n << BigInt(prec), prec), prec, 6)).toBe("3.33334e-1");
    expect(fxToDecimalUp(fxFromDecimal("9.9999999e-40", prec), prec, 4)).toBe("1e-39");
    expect(fxToDecimalUp(fxFromDecimal("123456.7", prec), prec, 3)).toBe("1.24e5");
    expect(fxToDecimalUp(0n, prec, 3)).toBe("0");
    for (const s of ["2.718281828e-17", "6.02e23", "0.000314159"]) {
      const out = fxToDecimalUp(fxFromDecimal(s, prec), prec, 5);
      const r = Number(out);
      expect(r).toBeGreaterThanOrEqual(Number(s));
      expect(r / Number(s)).toBeLessThan(1 + 1e-4);
    }
    expect(fxToFixedString(fxFromDecimal("-0.785398", prec), prec, 4)).toBe("-0.7854");
    expect(fxToFixedString(fxFromDecimal("2", prec), prec, 4)).toBe("2");
  });
});
