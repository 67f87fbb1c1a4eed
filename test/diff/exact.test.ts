import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { create, all } from "mathjs";
import { exactAdd, exactCompare, exactMul, exactRatio, exactSub, exactText, MAX_EXPONENT, parseExact, sameDecimal } from "../../src/diff/exact.js";

// mathjs as an independent reference: BigNumbers at 2000 digits hold every sum and product below exactly.
const math = create(all, { number: "BigNumber", precision: 2000 });
const big = (s: string) => math.bignumber(s);

/** A decimal text: sign, digits, optional point and exponent, in the spellings reports and users write. */
const decimalText = fc
  .tuple(fc.constantFrom("", "-", "+"), fc.bigInt({ min: 0n, max: 10n ** 30n }), fc.integer({ min: 0, max: 12 }), fc.integer({ min: -60, max: 60 }), fc.boolean())
  .map(([sign, digits, point, exp, withExp]) => {
    let s = digits.toString();
    if (point > 0) {
      s = s.padStart(point + 1, "0");
      s = `${s.slice(0, s.length - point)}.${s.slice(s.length - point)}`;
    }
    return sign + s + (withExp ? `e${exp}` : "");
  });

describe("exact decimals", () => {
  test("parsing the spellings of one number", () => {
    for (const s of ["0.25", ".25", "2.5e-1", "25e-2", "+0.250", "0.0025E+2", "250.0e-3"]) expect(exactText(parseExact(s))).toBe("2.5e-1");
    for (const s of ["0", "-0", "0.000", "0e5", ".0"]) expect(exactText(parseExact(s))).toBe("0");
    expect(exactText(parseExact("100"))).toBe("1e+2");
    expect(exactText(parseExact("-1.93e-11"))).toBe("-1.93e-11");
  });

  test("refuses what is not a decimal, and absurd exponents", () => {
    for (const s of ["", "abc", "1e", "0x10", "Infinity", "NaN", "1.2.3", " 1", "1 "]) expect(() => parseExact(s)).toThrow(RangeError);
    expect(() => parseExact(`1e${MAX_EXPONENT + 1}`)).toThrow(RangeError);
    expect(() => parseExact(`1e-${MAX_EXPONENT}`)).not.toThrow();
  });

  test("no rounding, even across 200 orders of magnitude", () => {
    const x = exactAdd(parseExact("1e+100"), parseExact("1e-100"));
    expect(exactText(x)).toBe(`1.${"0".repeat(199)}1e+100`);
    expect(exactText(exactSub(x, parseExact("1e+100")))).toBe("1e-100");
    expect(exactCompare(x, parseExact("1e+100"))).toBe(1);
    expect(sameDecimal("1.00000000001e-10", "1.000000000010e-10")).toBe(true);
    expect(sameDecimal("1.00000000001e-10", "1.00000000002e-10")).toBe(false);
  });

  test("sums, differences, products and order agree with mathjs BigNumbers", () => {
    fc.assert(
      fc.property(decimalText, decimalText, (s, t) => {
        const x = parseExact(s);
        const y = parseExact(t);
        const [bx, by] = [big(s), big(t)];
        expect(exactCompare(x, y)).toBe(bx.comparedTo(by));
        expect(sameDecimal(s, t)).toBe(bx.eq(by));
        for (const [got, want] of [
          [exactAdd(x, y), bx.plus(by)],
          [exactSub(x, y), bx.minus(by)],
          [exactMul(x, y), bx.times(by)],
        ] as const) {
          expect(big(exactText(got)).eq(want)).toBe(true);
        }
      }),
      { numRuns: 300, seed: 12 },
    );
  });

  test("the text is the report's canonical form (as canonicalDecimal writes it)", () => {
    // Canonical form per src/report/figures.ts: "0" or exponent notation without trailing zeros.
    expect(exactText(parseExact("0.00125"))).toBe("1.25e-3");
    expect(exactText(parseExact("12500"))).toBe("1.25e+4");
    expect(exactText(parseExact("3"))).toBe("3e+0");
  });

  test("ratio for display, null for a zero base", () => {
    expect(exactRatio(parseExact("1"), parseExact("4"))).toBe(0.25);
    expect(exactRatio(parseExact("-3e-11"), parseExact("6e-11"))).toBe(-0.5);
    expect(exactRatio(parseExact("1"), parseExact("0"))).toBeNull();
  });
});
