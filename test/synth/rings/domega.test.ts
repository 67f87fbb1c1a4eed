// Tests for D[ω] = Z[ω][1/√2]: the reduced form is unique, arithmetic agrees with complex numbers, conjugations are homomorphisms.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { complex, multiply, add, type Complex } from "mathjs";
import {
  type DOmega,
  DO_INV_SQRT2,
  DO_ONE,
  DO_ZERO,
  dom,
  domAdd,
  domBullet,
  domConj,
  domEq,
  domFromZSqrt2,
  domIsZero,
  domMul,
  domMulOmega,
  domNeg,
  domNumeratorAt,
  domSub,
  domToComplex,
  domToString,
  lde,
} from "../../../src/synth/rings/domega.js";
import { zo, zoDivisibleBySqrt2, zoIsZero, zoMulSqrt2, OMEGA, SQRT2_ZO } from "../../../src/synth/rings/zomega.js";
import { zs } from "../../../src/synth/rings/zsqrt2.js";

const RUNS = { seed: 99017, numRuns: 300 };
const smallInt = fc.bigInt({ min: -40n, max: 40n });
const zoArb = fc.tuple(smallInt, smallInt, smallInt, smallInt).map(([a, b, c, d]) => zo(a, b, c, d));
const domArb = fc.tuple(zoArb, fc.integer({ min: -3, max: 8 })).map(([n, k]) => dom(n, k));

/** x as a mathjs complex number computed independently: num evaluated at ω = e^{iπ/4}, divided by √2^k (mathjs as reference). */
function refComplex(x: DOmega): Complex {
  const w = complex(Math.SQRT1_2, Math.SQRT1_2);
  let acc = complex(0, 0);
  let p = complex(1, 0);
  for (const coef of [x.num.a, x.num.b, x.num.c, x.num.d]) {
    acc = add(acc, multiply(p, Number(coef))) as Complex;
    p = multiply(p, w) as Complex;
  }
  return multiply(acc, Math.pow(2, -x.k / 2)) as Complex;
}
function close(x: DOmega, c: Complex): void {
  const [re, im] = domToComplex(x);
  expect(Math.abs(re - c.re)).toBeLessThan(1e-7);
  expect(Math.abs(im - c.im)).toBeLessThan(1e-7);
}

describe("D[ω] reduced form", () => {
  it("the numerator of a nonzero element is never divisible by √2, and rescaling gives the same form", () => {
    fc.assert(
      fc.property(zoArb, fc.integer({ min: -5, max: 10 }), fc.integer({ min: 0, max: 6 }), (n, k, m) => {
        const x = dom(n, k);
        if (zoIsZero(n)) {
          expect(x).toEqual(DO_ZERO);
          return;
        }
        expect(zoDivisibleBySqrt2(x.num)).toBe(false);
        let scaled = n;
        for (let i = 0; i < m; i++) scaled = zoMulSqrt2(scaled);
        expect(domEq(dom(scaled, k + m), x)).toBe(true);
        expect(dom(domNumeratorAt(x, x.k + m), x.k + m)).toEqual(x);
      }),
      RUNS,
    );
  });

  it("least denominator exponents of simple elements", () => {
    expect(lde(DO_ONE)).toBe(0);
    expect(lde(DO_INV_SQRT2)).toBe(1);
    expect(lde(dom(zo(2n), 0))).toBe(-2);
    expect(lde(dom(zo(1n, 1n), 3))).toBe(3); // 1 + ω is not divisible by √2
    expect(lde(dom(SQRT2_ZO, 1))).toBe(0); // √2/√2 = 1
    expect(domEq(dom(SQRT2_ZO, 1), DO_ONE)).toBe(true);
    expect(lde(DO_ZERO)).toBe(0);
    expect(() => domNumeratorAt(DO_INV_SQRT2, 0)).toThrow();
  });
});

describe("D[ω] arithmetic", () => {
  it("add, sub, mul, neg, ω-multiplication and conjugation agree with mathjs complex numbers (mathjs as reference)", () => {
    fc.assert(
      fc.property(domArb, domArb, fc.integer({ min: 0, max: 7 }), (x, y, j) => {
        const cx = refComplex(x);
        const cy = refComplex(y);
        close(domAdd(x, y), add(cx, cy) as Complex);
        close(domSub(x, y), add(cx, multiply(cy, -1)) as Complex);
        close(domMul(x, y), multiply(cx, cy) as Complex);
        close(domNeg(x), multiply(cx, -1) as Complex);
        close(domConj(x), complex(cx.re, -cx.im));
        let wj = complex(1, 0);
        for (let i = 0; i < j; i++) wj = multiply(wj, complex(Math.SQRT1_2, Math.SQRT1_2)) as Complex;
        close(domMulOmega(x, j), multiply(cx, wj) as Complex);
      }),
      RUNS,
    );
  });

  it("ring laws hold exactly", () => {
    fc.assert(
      fc.property(domArb, domArb, domArb, (x, y, z) => {
        expect(domEq(domMul(x, domAdd(y, z)), domAdd(domMul(x, y), domMul(x, z)))).toBe(true);
        expect(domEq(domAdd(domAdd(x, y), z), domAdd(x, domAdd(y, z)))).toBe(true);
        expect(domIsZero(domSub(x, x))).toBe(true);
      }),
      RUNS,
    );
  });

  it("the • conjugation is a ring homomorphism with (1/√2)• = -1/√2", () => {
    fc.assert(
      fc.property(domArb, domArb, (x, y) => {
        expect(domEq(domBullet(domMul(x, y)), domMul(domBullet(x), domBullet(y)))).toBe(true);
        expect(domEq(domBullet(domAdd(x, y)), domAdd(domBullet(x), domBullet(y)))).toBe(true);
        expect(domEq(domBullet(domBullet(x)), x)).toBe(true);
      }),
      RUNS,
    );
    expect(domEq(domBullet(DO_INV_SQRT2), domNeg(DO_INV_SQRT2))).toBe(true);
    expect(domEq(domBullet(dom(OMEGA)), domNeg(dom(OMEGA)))).toBe(true);
  });

  it("embedding of Z[√2] and printing", () => {
    expect(domEq(domFromZSqrt2(zs(0n, 1n)), dom(SQRT2_ZO))).toBe(true);
    expect(domToString(dom(zo(1n, 1n), 3))).toBe("(1+ω)/√2^3");
  });
});
