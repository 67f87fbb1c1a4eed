// Tests for Z[ω]: defining identities, conjugations as homomorphisms, norms, √2 and δ divisibility, Euclidean division, gcd.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { complex, multiply, add, type Complex } from "mathjs";
import {
  type ZOmega,
  DELTA_ZO,
  OMEGA,
  SQRT2_ZO,
  ZO_I,
  ZO_ONE,
  ZO_ZERO,
  zo,
  zoAdd,
  zoBullet,
  zoConj,
  zoDivExact,
  zoDivMod,
  zoDivSqrt2,
  zoDivides,
  zoDivisibleByDelta,
  zoDivisibleBySqrt2,
  zoEq,
  zoFromGaussian,
  zoFromSqrt2ReIm,
  zoFromZSqrt2,
  zoGcd,
  zoIsReal,
  zoIsUnit,
  zoIsZero,
  zoMul,
  zoMulOmega,
  zoMulSqrt2,
  zoNeg,
  zoNorm,
  zoNormSq,
  zoPow,
  zoScale,
  zoSqrt2Im,
  zoSqrt2Re,
  zoSqrt2Valuation,
  zoSub,
  zoToComplex,
  zoToString,
  zoToZSqrt2,
} from "../../../src/synth/rings/zomega.js";
import { LAMBDA, zs, zsMul, zsNorm } from "../../../src/synth/rings/zsqrt2.js";

const RUNS = { seed: 7201, numRuns: 300 };
const smallInt = fc.bigInt({ min: -50n, max: 50n });
const bigInt = fc.bigInt({ min: -(10n ** 20n), max: 10n ** 20n });
const zoArb = (g = smallInt) => fc.tuple(g, g, g, g).map(([a, b, c, d]) => zo(a, b, c, d));
const nonzero = zoArb().filter((y) => !zoIsZero(y));

/** ω as a mathjs complex number, e^{iπ/4} (mathjs as the independent reference). */
const W = complex(Math.SQRT1_2, Math.SQRT1_2);
function refComplex(x: ZOmega): Complex {
  // a + bω + cω² + dω³ evaluated in mathjs complex arithmetic
  let acc = complex(0, 0);
  let p = complex(1, 0);
  for (const coef of [x.a, x.b, x.c, x.d]) {
    acc = add(acc, multiply(p, Number(coef))) as Complex;
    p = multiply(p, W) as Complex;
  }
  return acc;
}
function closeTo(x: readonly [number, number], c: Complex, tol = 1e-9): void {
  expect(Math.abs(x[0] - c.re)).toBeLessThan(tol);
  expect(Math.abs(x[1] - c.im)).toBeLessThan(tol);
}

describe("Z[ω] defining identities (common practice, no source)", () => {
  it("ω⁴ = -1 and ω⁸ = 1", () => {
    expect(zoPow(OMEGA, 4)).toEqual(zoNeg(ZO_ONE));
    expect(zoPow(OMEGA, 8)).toEqual(ZO_ONE);
    for (let k = 1; k < 8; k++) expect(zoEq(zoPow(OMEGA, k), ZO_ONE)).toBe(false);
  });

  it("√2 = ω - ω³ squares to 2, and i = ω² squares to -1", () => {
    expect(zoMul(SQRT2_ZO, SQRT2_ZO)).toEqual(zo(2n));
    expect(zoMul(ZO_I, ZO_I)).toEqual(zo(-1n));
  });

  it("(1+ω)†(1+ω) = √2(1+√2) = 2 + √2", () => {
    const n = zoMul(zoConj(DELTA_ZO), DELTA_ZO);
    expect(zoToZSqrt2(n)).toEqual(zsMul(zs(0n, 1n), LAMBDA));
    expect(zoNormSq(DELTA_ZO)).toEqual(zs(2n, 1n));
  });

  it("ring laws hold", () => {
    fc.assert(
      fc.property(zoArb(bigInt), zoArb(bigInt), zoArb(bigInt), (x, y, z) => {
        expect(zoMul(x, y)).toEqual(zoMul(y, x));
        expect(zoMul(zoMul(x, y), z)).toEqual(zoMul(x, zoMul(y, z)));
        expect(zoMul(x, zoAdd(y, z))).toEqual(zoAdd(zoMul(x, y), zoMul(x, z)));
        expect(zoSub(zoAdd(x, y), y)).toEqual(x);
        expect(zoScale(x, 3n)).toEqual(zoAdd(x, zoAdd(x, x)));
      }),
      RUNS,
    );
  });

  it("multiplication matches mathjs complex arithmetic (mathjs as reference)", () => {
    fc.assert(
      fc.property(zoArb(), zoArb(), (x, y) => {
        closeTo(zoToComplex(x), refComplex(x));
        closeTo(zoToComplex(zoMul(x, y)), multiply(refComplex(x), refComplex(y)) as Complex, 1e-7);
      }),
      RUNS,
    );
  });

  it("zoMulOmega(x, k) = ω^k · x for all k, including negative", () => {
    fc.assert(
      fc.property(zoArb(), fc.integer({ min: -20, max: 20 }), (x, k) => {
        const m = ((k % 8) + 8) % 8;
        expect(zoMulOmega(x, k)).toEqual(zoMul(zoPow(OMEGA, m), x));
      }),
      RUNS,
    );
  });
});

describe("Z[ω] conjugations and norms", () => {
  it("complex conjugation and • are ring homomorphisms and involutions; they commute", () => {
    fc.assert(
      fc.property(zoArb(bigInt), zoArb(bigInt), (x, y) => {
        for (const f of [zoConj, zoBullet]) {
          expect(f(zoMul(x, y))).toEqual(zoMul(f(x), f(y)));
          expect(f(zoAdd(x, y))).toEqual(zoAdd(f(x), f(y)));
          expect(f(f(x))).toEqual(x);
        }
        expect(zoConj(zoBullet(x))).toEqual(zoBullet(zoConj(x)));
      }),
      RUNS,
    );
  });

  it("conjugation matches mathjs's complex conjugate; • sends √2 to -√2 and ω to -ω", () => {
    fc.assert(
      fc.property(zoArb(), (x) => {
        const c = refComplex(x);
        closeTo(zoToComplex(zoConj(x)), complex(c.re, -c.im));
      }),
      RUNS,
    );
    expect(zoBullet(SQRT2_ZO)).toEqual(zoNeg(SQRT2_ZO));
    expect(zoBullet(OMEGA)).toEqual(zoNeg(OMEGA));
  });

  it("zoNormSq(x) = x†x (real), zoNorm = N(x†x) is multiplicative and equals |x|²|x•|²", () => {
    fc.assert(
      fc.property(zoArb(bigInt), zoArb(bigInt), (x, y) => {
        const p = zoMul(zoConj(x), x);
        expect(zoIsReal(p)).toBe(true);
        expect(zoToZSqrt2(p)).toEqual(zoNormSq(x));
        expect(zoNorm(x)).toBe(zsNorm(zoNormSq(x)));
        expect(zoNorm(zoMul(x, y))).toBe(zoNorm(x) * zoNorm(y));
        expect(zoNorm(x) >= 0n).toBe(true);
      }),
      RUNS,
    );
  });

  it("embedding of Z[√2] and Gaussian integers, and the √2·Re / √2·Im coordinates", () => {
    fc.assert(
      fc.property(zoArb(), smallInt, smallInt, (x, a, b) => {
        const r = zoFromZSqrt2(zs(a, b));
        expect(zoIsReal(r)).toBe(true);
        expect(zoToZSqrt2(r)).toEqual(zs(a, b));
        closeTo(zoToComplex(r), complex(Number(a) + Number(b) * Math.SQRT2, 0));
        closeTo(zoToComplex(zoFromGaussian(a, b)), complex(Number(a), Number(b)));
        // √2 Re(x) and √2 Im(x) as Z[√2] elements, and back
        const c = refComplex(x);
        const re = zoSqrt2Re(x);
        const im = zoSqrt2Im(x);
        expect(Math.abs(Number(re.a) + Number(re.b) * Math.SQRT2 - Math.SQRT2 * c.re)).toBeLessThan(1e-9);
        expect(Math.abs(Number(im.a) + Number(im.b) * Math.SQRT2 - Math.SQRT2 * c.im)).toBeLessThan(1e-9);
        expect(zoFromSqrt2ReIm(re, im)).toEqual(x);
      }),
      RUNS,
    );
    // (1 + 0i)/√2 is not in Z[ω]: √2·Re = 1, √2·Im = 0 have different parities
    expect(zoFromSqrt2ReIm(zs(1n), zs(0n))).toBeNull();
    expect(zoToZSqrt2(OMEGA)).toBeNull();
  });

  it("units: ω^k and λ are units, 1 + ω and 2 are not", () => {
    for (let k = 0; k < 8; k++) expect(zoIsUnit(zoPow(OMEGA, k))).toBe(true);
    expect(zoIsUnit(zoFromZSqrt2(LAMBDA))).toBe(true);
    expect(zoIsUnit(DELTA_ZO)).toBe(false);
    expect(zoIsUnit(zo(2n))).toBe(false);
  });
});

describe("Z[ω] divisibility, division and gcd", () => {
  it("√2 divisibility: zoDivSqrt2 inverts zoMulSqrt2 and agrees with general exact division", () => {
    fc.assert(
      fc.property(zoArb(bigInt), (x) => {
        expect(zoMulSqrt2(x)).toEqual(zoMul(x, SQRT2_ZO));
        expect(zoDivSqrt2(zoMulSqrt2(x))).toEqual(x);
        expect(zoDivisibleBySqrt2(x)).toBe(zoDivExact(x, SQRT2_ZO) !== null);
        if (zoDivisibleBySqrt2(x)) expect(zoMul(zoDivSqrt2(x), SQRT2_ZO)).toEqual(x);
      }),
      RUNS,
    );
    expect(() => zoDivSqrt2(ZO_ONE)).toThrow();
  });

  it("√2-valuation counts factors of √2", () => {
    fc.assert(
      fc.property(nonzero, fc.integer({ min: 0, max: 10 }), (x, m) => {
        let y = x;
        for (let i = 0; i < m; i++) y = zoMulSqrt2(y);
        expect(zoSqrt2Valuation(y)).toBe(zoSqrt2Valuation(x) + m);
      }),
      RUNS,
    );
  });

  it("δ = 1 + ω divisibility agrees with exact division, and δ² = ω·√2·(unit)", () => {
    fc.assert(
      fc.property(zoArb(), (x) => {
        expect(zoDivisibleByDelta(x)).toBe(zoDivExact(x, DELTA_ZO) !== null);
      }),
      RUNS,
    );
    // √2 is δ² up to a unit: both divide each other
    const d2 = zoMul(DELTA_ZO, DELTA_ZO);
    expect(zoDivides(d2, SQRT2_ZO)).toBe(true);
    expect(zoDivides(SQRT2_ZO, d2)).toBe(true);
  });

  it("x = q·y + r with N(r) < N(y)", () => {
    fc.assert(
      fc.property(zoArb(bigInt), nonzero, (x, y) => {
        const { q, r } = zoDivMod(x, y);
        expect(zoAdd(zoMul(q, y), r)).toEqual(x);
        expect(zoNorm(r) < zoNorm(y)).toBe(true);
      }),
      RUNS,
    );
  });

  it("exact division inverts multiplication", () => {
    fc.assert(
      fc.property(zoArb(bigInt), nonzero, (x, y) => {
        expect(zoDivExact(zoMul(x, y), y)).toEqual(x);
        const q = zoDivExact(x, y);
        if (q !== null) expect(zoMul(q, y)).toEqual(x);
      }),
      RUNS,
    );
    expect(zoDivExact(ZO_ONE, DELTA_ZO)).toBeNull();
    expect(zoDivides(ZO_ZERO, ZO_ZERO)).toBe(true);
    expect(zoDivides(ZO_ZERO, ZO_ONE)).toBe(false);
  });

  it("gcd divides both arguments and is divisible by any planted common factor", () => {
    fc.assert(
      fc.property(zoArb(), zoArb(), nonzero, (x0, y0, d) => {
        const x = zoMul(x0, d);
        const y = zoMul(y0, d);
        const g = zoGcd(x, y);
        if (zoIsZero(x) && zoIsZero(y)) {
          expect(zoIsZero(g)).toBe(true);
          return;
        }
        expect(zoDivides(g, x)).toBe(true);
        expect(zoDivides(g, y)).toBe(true);
        expect(zoDivides(d, g)).toBe(true);
      }),
      RUNS,
    );
  });

  it("a rational prime p ≡ 1 (mod 8) splits into four primes of absolute norm p", () => {
    // Number theory of Z[ω] (common practice, no source): 17 = η η• in Z[√2] with η = 5 + 2√2, and
    // h = 4 has h² ≡ -1 (mod 17). gcd(17, h + i) takes two of the four primes (norm 17²),
    // gcd(η, h + i) exactly one (norm 17).
    const hPlusI = zo(4n, 0n, 1n, 0n);
    const g2 = zoGcd(zo(17n), hPlusI);
    expect(zoNorm(g2)).toBe(17n * 17n);
    expect(zoDivides(g2, zo(17n))).toBe(true);
    const eta = zoFromZSqrt2(zs(5n, 2n));
    const g1 = zoGcd(eta, hPlusI);
    expect(zoNorm(g1)).toBe(17n);
    expect(zoDivides(g1, eta)).toBe(true);
    expect(zoDivides(g1, hPlusI)).toBe(true);
  });

  it("zoToString", () => {
    expect(zoToString(zo(1n, 2n, 0n, -1n))).toBe("1+2ω-ω³");
    expect(zoToString(ZO_ZERO)).toBe("0");
    expect(zoToString(zo(0n, -1n))).toBe("-ω");
  });
});
