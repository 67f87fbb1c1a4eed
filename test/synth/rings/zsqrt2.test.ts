// Tests for Z[√2]: ring laws, exact sign against a high-precision reference, Euclidean division, gcd, units.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { create, all, type BigNumber } from "mathjs";
import {
  type ZSqrt2,
  LAMBDA,
  LAMBDA_INV,
  ZS_ONE,
  bigIsqrt,
  bigDivRound,
  bigDivFloor,
  zs,
  zsAdd,
  zsCeil,
  zsCompare,
  zsConj,
  zsDivExact,
  zsDivMod,
  zsDivSqrt2,
  zsDivides,
  zsDivisibleBySqrt2,
  zsEq,
  zsFloor,
  zsGcd,
  zsIsDoublyPositive,
  zsIsUnit,
  zsIsZero,
  zsLambdaPow,
  zsMul,
  zsMulSqrt2,
  zsNeg,
  zsNorm,
  zsPow,
  zsSign,
  zsSqrt2Valuation,
  zsSquare,
  zsSub,
  zsToNumber,
  zsToString,
} from "../../../src/synth/rings/zsqrt2.js";

// mathjs BigNumber at 200 digits serves as the independent reference for real values (mathjs).
// Its BigNumber methods (isPositive, floor, ceil) are used directly: mathjs's top-level functions compare with a tolerance.
const big = create(all, { number: "BigNumber", precision: 200 });
const SQRT2_BIG = big.sqrt(big.bignumber(2));
function refValue(x: ZSqrt2): BigNumber {
  return big.add(big.bignumber(x.a.toString()), big.multiply(big.bignumber(x.b.toString()), SQRT2_BIG)) as BigNumber;
}

const RUNS = { seed: 20240611, numRuns: 400 };
const smallInt = fc.bigInt({ min: -1000n, max: 1000n });
const bigInt = fc.bigInt({ min: -(10n ** 30n), max: 10n ** 30n });
const zsArb = (g = smallInt) => fc.tuple(g, g).map(([a, b]) => zs(a, b));

/** Pell pairs: (a, b) with a² - 2b² = ±1 (powers of λ), so a - b√2 is tiny. */
function pellPairs(n: number): ZSqrt2[] {
  const out: ZSqrt2[] = [];
  let x = LAMBDA;
  for (let i = 0; i < n; i++) {
    out.push(x);
    x = zsMul(x, LAMBDA);
  }
  return out;
}

describe("Z[√2] ring laws", () => {
  it("addition and multiplication are commutative, associative and distributive", () => {
    fc.assert(
      fc.property(zsArb(bigInt), zsArb(bigInt), zsArb(bigInt), (x, y, z) => {
        expect(zsMul(x, y)).toEqual(zsMul(y, x));
        expect(zsMul(zsMul(x, y), z)).toEqual(zsMul(x, zsMul(y, z)));
        expect(zsMul(x, zsAdd(y, z))).toEqual(zsAdd(zsMul(x, y), zsMul(x, z)));
        expect(zsSub(zsAdd(x, y), y)).toEqual(x);
        expect(zsAdd(x, zsNeg(x))).toEqual(zs(0n, 0n));
        expect(zsSquare(x)).toEqual(zsMul(x, x));
      }),
      RUNS,
    );
  });

  it("√2 · √2 = 2 and (1 + √2)(-1 + √2) = 1", () => {
    expect(zsMul(zs(0n, 1n), zs(0n, 1n))).toEqual(zs(2n, 0n));
    expect(zsMul(LAMBDA, LAMBDA_INV)).toEqual(ZS_ONE);
  });

  it("the • conjugation is a ring homomorphism and an involution; the norm is multiplicative", () => {
    fc.assert(
      fc.property(zsArb(bigInt), zsArb(bigInt), (x, y) => {
        expect(zsConj(zsMul(x, y))).toEqual(zsMul(zsConj(x), zsConj(y)));
        expect(zsConj(zsAdd(x, y))).toEqual(zsAdd(zsConj(x), zsConj(y)));
        expect(zsConj(zsConj(x))).toEqual(x);
        expect(zsNorm(zsMul(x, y))).toBe(zsNorm(x) * zsNorm(y));
        expect(zsMul(x, zsConj(x))).toEqual(zs(zsNorm(x), 0n));
      }),
      RUNS,
    );
  });

  it("zsPow agrees with repeated multiplication", () => {
    const x = zs(3n, -2n);
    let p = ZS_ONE;
    for (let n = 0; n < 20; n++) {
      expect(zsPow(x, n)).toEqual(p);
      p = zsMul(p, x);
    }
  });

  it("λⁿ · λ⁻ⁿ = 1 and λⁿ is a unit with norm (-1)ⁿ", () => {
    for (let n = -30; n <= 30; n++) {
      expect(zsMul(zsLambdaPow(n), zsLambdaPow(-n))).toEqual(ZS_ONE);
      expect(zsIsUnit(zsLambdaPow(n))).toBe(true);
      expect(zsNorm(zsLambdaPow(n))).toBe(n % 2 === 0 ? 1n : -1n);
    }
    expect(zsIsUnit(zs(2n, 1n))).toBe(false); // norm 2
    expect(zsIsUnit(zs(3n, 2n))).toBe(true); // λ²
  });
});

describe("Z[√2] exact order", () => {
  it("zsSign agrees with a 200-digit mathjs evaluation on random elements (mathjs as reference)", () => {
    fc.assert(
      fc.property(zsArb(bigInt), (x) => {
        const ref = refValue(x);
        const s = ref.isZero() ? 0 : ref.isPositive() ? 1 : -1;
        expect(zsSign(x)).toBe(s);
      }),
      RUNS,
    );
  });

  it("zsSign is exact on near-cancelling Pell values a - b√2 = ±λ⁻ⁿ (mathjs as reference)", () => {
    for (const p of pellPairs(60)) {
      const x = zs(p.a, -p.b); // |x| = λ^-n, tiny
      const ref = refValue(x);
      expect(zsSign(x)).toBe(ref.isPositive() ? 1 : -1);
      expect(zsSign(zsNeg(x))).toBe(ref.isPositive() ? -1 : 1);
      // the neighbours differ by one in a: sign must follow the integer part
      expect(zsSign(zs(x.a + 1n, x.b))).toBe(1);
      expect(zsSign(zs(x.a - 1n, x.b))).toBe(-1);
    }
    expect(zsSign(zs(0n, 0n))).toBe(0);
  });

  it("zsCompare is antisymmetric and consistent with subtraction", () => {
    fc.assert(
      fc.property(zsArb(), zsArb(), (x, y) => {
        expect(zsCompare(x, y)).toBe(-zsCompare(y, x) as number);
        expect(zsCompare(x, y)).toBe(zsSign(zsSub(x, y)));
        expect(zsCompare(x, x)).toBe(0);
      }),
      RUNS,
    );
  });

  it("doubly positive: x ≥ 0 and x• ≥ 0", () => {
    expect(zsIsDoublyPositive(zs(2n, 1n))).toBe(true); // 2 ± √2 > 0
    expect(zsIsDoublyPositive(zs(1n, 1n))).toBe(false); // 1 - √2 < 0
    expect(zsIsDoublyPositive(zs(0n, 0n))).toBe(true);
    expect(zsIsDoublyPositive(zs(3n, 2n))).toBe(true); // λ² and λ⁻² both positive
    fc.assert(
      fc.property(zsArb(), (x) => {
        // x x† ... any square of a real is ≥ 0, and (x²)• = (x•)² ≥ 0
        expect(zsIsDoublyPositive(zsSquare(x))).toBe(true);
      }),
      RUNS,
    );
  });

  it("floor and ceil agree with mathjs at 200 digits, including Pell near-integers (mathjs as reference)", () => {
    const cases: ZSqrt2[] = [...pellPairs(40).map((p) => zs(p.a, -p.b)), ...pellPairs(40)];
    fc.assert(
      fc.property(zsArb(bigInt), (x) => {
        expect(zsFloor(x).toString()).toBe(refValue(x).floor().toFixed(0));
        expect(zsCeil(x).toString()).toBe(refValue(x).ceil().toFixed(0));
      }),
      RUNS,
    );
    for (const x of cases) {
      expect(zsFloor(x).toString()).toBe(refValue(x).floor().toFixed(0));
      expect(zsCeil(x).toString()).toBe(refValue(x).ceil().toFixed(0));
    }
    expect(zsFloor(zs(5n, 0n))).toBe(5n);
    expect(zsCeil(zs(5n, 0n))).toBe(5n);
  });

  it("zsToNumber is accurate even under cancellation (mathjs as reference)", () => {
    for (const p of pellPairs(30)) {
      const x = zs(p.a, -p.b);
      const ref = Number(refValue(x).toString());
      expect(Math.abs(zsToNumber(x) - ref) / Math.abs(ref)).toBeLessThan(1e-12);
    }
  });
});

describe("integer helpers", () => {
  it("bigIsqrt is the floor square root", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: 0n, max: 10n ** 40n }), (n) => {
        const r = bigIsqrt(n);
        expect(r * r <= n).toBe(true);
        expect((r + 1n) * (r + 1n) > n).toBe(true);
      }),
      RUNS,
    );
  });

  it("bigDivRound and bigDivFloor match their definitions", () => {
    fc.assert(
      fc.property(bigInt, bigInt.filter((q) => q !== 0n), (p, q) => {
        const f = bigDivFloor(p, q);
        // f ≤ p/q < f + 1
        const qs = q > 0n ? 1n : -1n;
        expect((p - f * q) * qs >= 0n).toBe(true);
        expect((p - (f + 1n) * q) * qs < 0n).toBe(true);
        const r = bigDivRound(p, q);
        // |p/q - r| ≤ 1/2  <=>  |2p - 2rq| ≤ |q|
        const diff = 2n * p - 2n * r * q;
        expect((diff < 0n ? -diff : diff) <= (q < 0n ? -q : q)).toBe(true);
      }),
      RUNS,
    );
  });
});

describe("Z[√2] Euclidean division and gcd", () => {
  const nonzero = zsArb(bigInt).filter((y) => !zsIsZero(y));

  it("x = q·y + r with |N(r)| < |N(y)|", () => {
    fc.assert(
      fc.property(zsArb(bigInt), nonzero, (x, y) => {
        const { q, r } = zsDivMod(x, y);
        expect(zsAdd(zsMul(q, y), r)).toEqual(x);
        const nr = zsNorm(r);
        const ny = zsNorm(y);
        expect((nr < 0n ? -nr : nr) < (ny < 0n ? -ny : ny)).toBe(true);
      }),
      RUNS,
    );
  });

  it("exact division inverts multiplication and detects non-divisibility", () => {
    fc.assert(
      fc.property(zsArb(bigInt), nonzero, (x, y) => {
        expect(zsDivExact(zsMul(x, y), y)).toEqual(x);
        expect(zsDivides(y, zsMul(x, y))).toBe(true);
        const q = zsDivExact(x, y);
        if (q !== null) expect(zsMul(q, y)).toEqual(x);
        else expect(zsDivides(y, x)).toBe(false);
      }),
      RUNS,
    );
    expect(zsDivExact(zs(1n, 0n), zs(0n, 1n))).toBeNull(); // √2 does not divide 1
  });

  it("gcd divides both arguments and is divisible by any planted common factor", () => {
    fc.assert(
      fc.property(zsArb(), zsArb(), zsArb().filter((d) => !zsIsZero(d)), (x0, y0, d) => {
        const x = zsMul(x0, d);
        const y = zsMul(y0, d);
        const g = zsGcd(x, y);
        if (zsIsZero(x) && zsIsZero(y)) {
          expect(zsIsZero(g)).toBe(true);
          return;
        }
        expect(zsDivides(g, x)).toBe(true);
        expect(zsDivides(g, y)).toBe(true);
        expect(zsDivides(d, g)).toBe(true);
      }),
      RUNS,
    );
  });

  it("√2 divisibility and valuation", () => {
    fc.assert(
      fc.property(zsArb(bigInt).filter((x) => !zsIsZero(x)), fc.integer({ min: 0, max: 12 }), (x, m) => {
        let y = x;
        for (let i = 0; i < m; i++) y = zsMulSqrt2(y);
        expect(zsSqrt2Valuation(y)).toBe(zsSqrt2Valuation(x) + m);
        expect(zsDivisibleBySqrt2(x)).toBe(zsDivExact(x, zs(0n, 1n)) !== null);
        if (m > 0) expect(zsMulSqrt2(zsDivSqrt2(y))).toEqual(y);
      }),
      RUNS,
    );
  });

  it("zsEq and zsToString", () => {
    expect(zsEq(zs(1n, 2n), zs(1n, 2n))).toBe(true);
    expect(zsEq(zs(1n, 2n), zs(2n, 1n))).toBe(false);
    expect(zsToString(zs(3n, 2n))).toBe("3+2√2");
    expect(zsToString(zs(0n, -1n))).toBe("-√2");
    expect(zsToString(zs(-1n, 1n))).toBe("-1+√2");
  });
});
