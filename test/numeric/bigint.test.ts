import { describe, expect, it } from "vitest";
import { bitLength, divCeil, divFloor, divRound, gcd, isqrt, isqrtCeil, mod, modInverse, modPow, removeFactor } from "../../src/numeric/bigint.js";
import { seededRng } from "../../src/numeric/prng.js";

describe("bigint primitives", () => {
  it("bitLength matches the binary expansion", () => {
    for (const n of [0n, 1n, 2n, 3n, 255n, 256n, -256n, (1n << 200n) - 1n, 1n << 200n]) {
      const expect_ = n === 0n ? 0 : (n < 0n ? -n : n).toString(2).length;
      expect(bitLength(n)).toBe(expect_);
    }
  });

  it("isqrt is the floor square root (small exhaustive, large random)", () => {
    for (let n = 0n; n < 2000n; n++) {
      const r = isqrt(n);
      expect(r * r <= n && (r + 1n) * (r + 1n) > n).toBe(true);
      const c = isqrtCeil(n);
      expect(c * c >= n && (c === 0n || (c - 1n) * (c - 1n) < n)).toBe(true);
    }
    const rng = seededRng(7);
    for (let i = 0; i < 300; i++) {
      const n = rng.nextBelow(1n << BigInt(1 + (i % 400)));
      const r = isqrt(n);
      expect(r * r <= n && (r + 1n) * (r + 1n) > n).toBe(true);
    }
    // exact squares at the double-precision boundary
    for (const r of [(1n << 26n) + 1n, (1n << 27n) - 1n, 94906267n, 10n ** 20n + 7n]) {
      expect(isqrt(r * r)).toBe(r);
      expect(isqrt(r * r - 1n)).toBe(r - 1n);
    }
  });

  it("floor, ceil and round division agree with their definitions on all sign combinations", () => {
    for (let p = -25n; p <= 25n; p++) {
      for (const q of [-7n, -4n, -1n, 1n, 3n, 4n, 9n]) {
        const f = divFloor(p, q);
        expect(f * q <= p === q > 0n || f * q === p).toBe(true);
        // floor: f ≤ p/q < f + 1  <=>  (p - f q)/q in [0, 1)
        const num = p - f * q;
        expect(q > 0n ? num >= 0n && num < q : num <= 0n && num > q).toBe(true);
        expect(divCeil(p, q)).toBe(-divFloor(-p, q));
        const r = divRound(p, q);
        // |p/q - r| ≤ 1/2  <=>  |2p - 2rq| ≤ |q|
        const dev = 2n * p - 2n * r * q;
        const aq = q < 0n ? -q : q;
        expect((dev < 0n ? -dev : dev) <= aq).toBe(true);
      }
    }
  });

  it("gcd, mod, modPow and modInverse against naive definitions", () => {
    const rng = seededRng(11);
    for (let i = 0; i < 200; i++) {
      const a = rng.nextBelow(10n ** 12n) - 5n * 10n ** 11n;
      const b = rng.nextBelow(10n ** 9n) + 1n;
      const g = gcd(a, b);
      expect(a % g).toBe(0n);
      expect(b % g).toBe(0n);
      expect(gcd(a / g, b / g)).toBe(1n);
      const m = mod(a, b);
      expect(m >= 0n && m < b && (a - m) % b === 0n).toBe(true);
    }
    for (let i = 0; i < 100; i++) {
      const m = rng.nextBelow(1000n) + 2n;
      const base = rng.nextBelow(5000n) - 2500n;
      const e = rng.nextBelow(40n);
      let naive = 1n;
      for (let j = 0n; j < e; j++) naive = mod(naive * base, m);
      expect(modPow(base, e, m)).toBe(naive);
      const inv = modInverse(base, m);
      if (gcd(base, m) === 1n) expect(mod(inv! * base, m)).toBe(1n);
      else expect(inv).toBeNull();
    }
    expect(removeFactor(2n ** 5n * 3n * 7n, 2n)).toEqual({ e: 5, rest: 21n });
  });
});
