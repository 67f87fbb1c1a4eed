import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { create, all } from "mathjs";
import { parseQasmText } from "../../src/frontend/frontend.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { parseNumberLiteral, toAngle, angleToValue, ratValue } from "../../src/frontend/values.js";
import type { Angle } from "../../src/ir/angle.js";
import { ANGLE_DIGITS } from "../../src/ir/angle.js";
import { ZERO_ANGLE } from "../../src/ir/angle-ops.js";

/** The angle of `rz(<expr>) q;` after `prelude`. */
function angleOf(expr: string, prelude = ""): Angle {
  const c = parseQasmText(`include "stdgates.inc";\nqubit q;\n${prelude}\nrz(${expr}) q;`, "v.qasm");
  const g = c.body[c.body.length - 1]!;
  if (g.kind !== "gate") throw new Error("no gate");
  return g.params[0]!;
}

function errorOf(expr: string): string {
  try {
    angleOf(expr);
  } catch (e) {
    if (e instanceof DiagnosticError) return e.diagnostics[0]!.message;
    throw e;
  }
  throw new Error("no error");
}

const pi = (num: bigint, den: bigint) => ({ num, den });

// An independent high-precision engine (mathjs BigNumber at 150 digits) as the reference.
const ref = create(all, { number: "BigNumber", precision: 150 });
const refValue = (expr: string): string => ref.format(ref.evaluate(expr), { notation: "fixed", precision: 100 }) as string;

describe("exact angles", () => {
  const cases: [string, { num: bigint; den: bigint }][] = [
    ["3*pi/8", pi(3n, 8n)],
    ["tau/16", pi(1n, 8n)],
    ["pi/2**3", pi(1n, 8n)],
    ["-pi/4", pi(-1n, 4n)],
    ["pi*0.25", pi(1n, 4n)],
    ["π/3 + τ/3", pi(1n, 1n)],
    ["(pi - pi/4) * 2", pi(3n, 2n)],
    ["pi / 1e1", pi(1n, 10n)],
    ["arccos(0)", pi(1n, 2n)],
    ["arctan(-1)", pi(-1n, 4n)],
    ["arcsin(0.5)", pi(1n, 6n)],
    ["2*pi % (3*pi/4)", pi(1n, 2n)],
  ];
  for (const [expr, want] of cases) {
    it(`${expr} is exactly ${want.num}/${want.den} pi`, () => {
      expect(angleOf(expr).pi).toEqual(want);
    });
  }

  it("keeps an exact pi-multiple's value to ANGLE_DIGITS digits (checked against mathjs)", () => {
    const a = angleOf("3*pi/8");
    const want = ref.bignumber(ref.format(ref.evaluate("3*pi/8"), { precision: ANGLE_DIGITS }));
    expect(ref.bignumber(a.value).minus(want).abs().lt(ref.bignumber(`1e-${ANGLE_DIGITS - 2}`))).toBe(true);
  });

  it("reads zero as the exact angle 0, however it is spelled", () => {
    for (const e of ["0", "0.0", "pi - pi", "sin(0)", "0 * euler", "1 - 1.0"]) expect(angleOf(e)).toEqual(ZERO_ANGLE);
  });

  it("treats pi/pi and other pi quotients as exact rationals", () => {
    expect(angleOf("pi/pi")).toEqual({ pi: null, value: "1" });
    expect(angleOf("(pi/4)/(pi/2)")).toEqual({ pi: null, value: "0.5" });
  });
});

describe("decimals mean exactly what they spell", () => {
  it("0.1 + 0.2 is exactly 0.3, and literals in every form are exact", () => {
    expect(angleOf("0.1 + 0.2")).toEqual({ pi: null, value: "0.3" });
    expect(angleOf("1e-3")).toEqual({ pi: null, value: "0.001" });
    expect(angleOf("1_000.5")).toEqual({ pi: null, value: "1000.5" });
    expect(angleOf("0x1F")).toEqual({ pi: null, value: "31" });
    expect(angleOf("0o17 + 0b101")).toEqual({ pi: null, value: "20" });
    expect(angleOf(".5e1")).toEqual({ pi: null, value: "5" });
    expect(angleOf("1.")).toEqual({ pi: null, value: "1" });
    expect(angleOf("-2.5e-7")).toEqual({ pi: null, value: "-2.5e-7" });
  });

  it("parses decimal literals to exact fractions (property: the digits over a power of ten)", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: 0n, max: 10n ** 30n }), fc.integer({ min: 0, max: 25 }), (digits, shift) => {
        const s = digits.toString();
        const text = shift === 0 ? s : s.length > shift ? `${s.slice(0, -shift)}.${s.slice(-shift)}` : `0.${s.padStart(shift, "0")}`;
        const r = parseNumberLiteral(text);
        expect(r.num * 10n ** BigInt(shift)).toBe(digits * r.den);
      }),
      { numRuns: 300, seed: 3 },
    );
  });

  it("gives a rational that is not a finite decimal 120 significant digits", () => {
    const a = angleOf("1/3");
    expect(a.pi).toBeNull();
    expect(a.value).toBe("0." + "3".repeat(ANGLE_DIGITS));
    expect(angleToValue(toAngle(ratValue(1n, 8n)))).toEqual(ratValue(1n, 8n));
  });
});

describe("functions and constants against references", () => {
  const cases = ["sin(0.3)", "cos(1.2)", "tan(0.7)", "arcsin(0.25)", "arccos(-0.6)", "arctan(3)", "exp(1.5)", "ln(2)", "sqrt(2)", "euler", "ℇ ** 2", "2 ** 0.5", "pi ** 2", "sin(pi/7)"];
  for (const expr of cases) {
    it(`${expr} agrees with mathjs at 100 digits and with Math`, () => {
      const a = angleOf(expr);
      expect(a.pi).toBeNull();
      const mathjsExpr = expr.replace("ℇ", "e").replace("euler", "e").replace("arcsin", "asin").replace("arccos", "acos").replace("arctan", "atan").replace("ln(", "log(").replace(/\*\*/g, "^");
      const want = refValue(mathjsExpr);
      expect(ref.bignumber(a.value).minus(ref.bignumber(want)).abs().lt(ref.bignumber("1e-100"))).toBe(true);
      const jsExpr = mathjsExpr.replace(/\^/g, "**").replace(/\b(sin|cos|tan|asin|acos|atan|exp|log|sqrt)\(/g, "Math.$1(").replace(/\be\b/g, "Math.E").replace(/\bpi\b/g, "Math.PI");
      expect(Number(a.value)).toBeCloseTo(Function(`return ${jsExpr}`)() as number, 12);
    });
  }

  it("knows the exact values of sin and cos at multiples of pi/6 and pi/2", () => {
    expect(angleOf("sin(pi/6)")).toEqual({ pi: null, value: "0.5" });
    expect(angleOf("cos(2*pi/3)")).toEqual({ pi: null, value: "-0.5" });
    expect(angleOf("sin(-pi/2)")).toEqual({ pi: null, value: "-1" });
    expect(angleOf("tan(pi/4)")).toEqual({ pi: null, value: "1" });
    expect(angleOf("sqrt(0.25)")).toEqual({ pi: null, value: "0.5" });
    expect(angleOf("floor(-2.5) + ceiling(2.1) + abs(-1)")).toEqual({ pi: null, value: "1" });
  });

  it("follows OpenQASM precedence: ** binds tighter than unary minus, and is right-associative", () => {
    expect(angleOf("-2**2")).toEqual({ pi: null, value: "-4" });
    expect(angleOf("2**3**2")).toEqual({ pi: null, value: "512" });
    expect(angleOf("2**-1")).toEqual({ pi: null, value: "0.5" });
    expect(angleOf("1 - 2 - 3")).toEqual({ pi: null, value: "-4" });
    expect(angleOf("12 / 4 / 3")).toEqual({ pi: null, value: "1" });
  });

  it("casts and typed constants", () => {
    expect(angleOf("int(2.7) + float(0.5)")).toEqual({ pi: null, value: "2.5" });
    expect(angleOf("n * pi / 4", "const uint n = 3;")).toEqual({ pi: pi(3n, 4n), value: angleOf("3*pi/4").value });
    expect(angleOf("int(b) + int(!b)", "const bool b = true;")).toEqual({ pi: null, value: "1" });
  });

  it("reports division by zero and values that are not finite", () => {
    expect(errorOf("1/0")).toBe("division by zero");
    expect(errorOf("pi/(1 - 1)")).toBe("division by zero");
    expect(errorOf("1 % 0")).toBe("division by zero (in '%')");
    expect(errorOf("0 ** -1")).toBe("division by zero (zero to a negative power)");
    expect(errorOf("ln(0)")).toMatch(/^the value is not finite/);
    expect(errorOf("sqrt(-1)")).toMatch(/^the value is not finite/);
    expect(errorOf("arcsin(2)")).toMatch(/^the value is not finite/);
    expect(errorOf("tan(pi/2)")).toMatch(/^the value is not finite/);
    expect(errorOf("exp(1e20)")).toMatch(/^the value is not finite/);
    expect(errorOf("true")).toBe("a gate parameter must be a number, found a boolean");
    expect(errorOf("100ns")).toBe("a gate parameter must be a number, found a duration");
  });
});
