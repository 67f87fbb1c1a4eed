import { describe, expect, it } from "vitest";
import { canonicalDecimal, isDecimalText, locationText, lowerFigure, piForm, reportAngle, shortFigure, toDec, upperFigure } from "../../src/report/figures.js";
import { dec } from "../../src/numeric/decimal.js";
import { rational } from "../../src/ir/angle-ops.js";
import { lit, pi } from "./circuits.js";

describe("figures", () => {
  it("writes decimals canonically", () => {
    expect(canonicalDecimal(dec("0.000"))).toBe("0");
    expect(canonicalDecimal(dec("0.00125"))).toBe("1.25e-3");
    expect(canonicalDecimal(dec("1e-10"))).toBe("1e-10");
    expect(canonicalDecimal(dec("1.50"))).toBe("1.5e+0");
    expect(Number(canonicalDecimal(dec("123.5")))).toBe(123.5);
  });

  it("rounds errors up and shares down at 12 significant digits", () => {
    // 1.00000000000001e-10 has 15 significant digits; up to 12: 1.00000000001e-10.
    expect(upperFigure(dec("1.00000000000001e-10"))).toBe("1.00000000001e-10");
    expect(lowerFigure(dec("1.00000000000001e-10"))).toBe("1e-10");
    // 1/3 * 1e-10: down 3.33333333333e-11, up 3.33333333334e-11.
    const third = dec(1).div(3).times(dec("1e-10"));
    expect(lowerFigure(third)).toBe("3.33333333333e-11");
    expect(upperFigure(third)).toBe("3.33333333334e-11");
    // Exact short values are unchanged either way.
    expect(upperFigure(dec("2.5e-11"))).toBe("2.5e-11");
    expect(lowerFigure(dec("0"))).toBe("0");
    expect(shortFigure(dec("98.7654"), 3)).toBe("9.88e+1");
  });

  it("writes exact angles as OpenQASM expressions", () => {
    expect(piForm(rational(0n))).toBe("0");
    expect(piForm(rational(1n))).toBe("pi");
    expect(piForm(rational(-1n, 4n))).toBe("-pi/4");
    expect(piForm(rational(3n, 8n))).toBe("3*pi/8");
    expect(piForm(rational(2n))).toBe("2*pi");
    expect(piForm(rational(-7n, 3n))).toBe("-7*pi/3");
  });

  it("shows angles with their exact form when known", () => {
    expect(reportAngle(pi(1, 4))).toEqual({ value: "0.78539816339744830962", pi: "pi/4" });
    expect(reportAngle(lit("0.3"))).toEqual({ value: "0.3", pi: null });
    expect(reportAngle(pi(0))).toEqual({ value: "0", pi: "0" });
  });

  it("accepts only plain decimal text", () => {
    for (const s of ["1", "-2.5", "1e-10", "0.5E+3", ".5", "3."]) expect([s, isDecimalText(s)]).toEqual([s, true]);
    for (const s of ["", "abc", "0x10", "Infinity", "NaN", "1e", " 1", "1,5", "--1"]) expect([s, isDecimalText(s)]).toEqual([s, false]);
    expect(() => toDec("0x10", "budget")).toThrow(/budget: "0x10" is not a decimal number/);
  });

  it("writes locations as file:line:col", () => {
    expect(locationText({ file: "a.qasm", line: 3, col: 14 })).toBe("a.qasm:3:14");
  });
});
