// The norm equation t†t = ξ: exact solutions, proven unsolvable cases, and the work limit.
import { describe, expect, it } from "vitest";
import { solveNormEquation } from "../../../src/synth/ztarget/norm-equation.js";
import { type ZOmega, zoNormSq } from "../../../src/synth/rings/zomega.js";
import { type ZSqrt2, zsIsDoublyPositive, zsMul, zsNorm } from "../../../src/synth/rings/zsqrt2.js";
import { seededRng } from "../../../src/numeric/prng.js";
import { isProbablePrime } from "../../../src/numeric/primes.js";

const key = (x: ZSqrt2) => `${x.a},${x.b}`;

describe("norm equation t†t = ξ", () => {
  it("every ξ = 2^k - u†u from seeded u (thousands): solutions satisfy t†t = ξ exactly; hard cases are rare at this size", () => {
    const rng = seededRng(77);
    let solved = 0;
    let unsolvable = 0;
    let hard = 0;
    for (let i = 0; i < 3000; i++) {
      const k = 4 + (i % 40);
      const lim = 1n << BigInt(Math.floor(k / 2));
      const rnd = () => rng.nextBelow(2n * lim + 1n) - lim;
      const u: ZOmega = { a: rnd(), b: rnd() / 2n, c: rnd(), d: rnd() / 2n };
      const n = zoNormSq(u);
      const xi: ZSqrt2 = { a: (1n << BigInt(k)) - n.a, b: -n.b };
      if (!zsIsDoublyPositive(xi)) continue;
      const r = solveNormEquation(xi, rng, 1 << 16);
      if (r.kind === "hard") hard++;
      else if (r.kind === "solved") {
        const m = zoNormSq(r.t);
        expect(key(m)).toBe(key(xi));
        solved++;
      } else unsolvable++;
    }
    expect(solved).toBeGreaterThan(300);
    expect(unsolvable).toBeGreaterThan(300);
    expect(hard).toBeLessThan((solved + unsolvable) / 30); // N(ξ) < 2^90 here: rho splits nearly everything
  });

  it("agrees with an exhaustive search on every doubly positive ξ with rational part ≤ 40", () => {
    // t = a + bω + cω² + dω³ has t†t = (a²+b²+c²+d²) + (ab+bc+cd-da)√2, so |coefficients| ≤ √40.
    const reachable = new Set<string>();
    for (let a = -6; a <= 6; a++)
      for (let b = -6; b <= 6; b++)
        for (let c = -6; c <= 6; c++)
          for (let d = -6; d <= 6; d++) {
            const n = zoNormSq({ a: BigInt(a), b: BigInt(b), c: BigInt(c), d: BigInt(d) });
            if (n.a <= 40n) reachable.add(key(n));
          }
    const rng = seededRng(1);
    let cases = 0;
    for (let a = 0n; a <= 40n; a++)
      for (let b = -a; b <= a; b++) {
        const xi = { a, b };
        if (!zsIsDoublyPositive(xi)) continue;
        const r = solveNormEquation(xi, rng, 1 << 12);
        expect(r.kind === "solved", `ξ = ${a} + ${b}√2`).toBe(reachable.has(key(xi)));
        if (r.kind === "solved") expect(key(zoNormSq(r.t))).toBe(key(xi));
        cases++;
      }
    expect(cases).toBeGreaterThan(500);
  });

  it("a prime of Z[√2] above p ≡ 7 (mod 8) to an odd power makes ξ unsolvable; to an even power it does not", () => {
    const rng = seededRng(3);
    // η = 3 + √2 has norm 7; η' = 5 + √2 has norm 23 (both ≡ 7 mod 8, both doubly positive)
    const eta7: ZSqrt2 = { a: 3n, b: 1n };
    const eta23: ZSqrt2 = { a: 5n, b: 1n };
    expect(zsNorm(eta7)).toBe(7n);
    expect(zsNorm(eta23)).toBe(23n);
    for (let i = 0; i < 200; i++) {
      // a random solvable part s†s
      const s: ZOmega = { a: rng.nextBelow(2000n) - 1000n, b: rng.nextBelow(2000n) - 1000n, c: rng.nextBelow(2000n), d: rng.nextBelow(2000n) };
      const base = zoNormSq(s);
      const odd = zsMul(base, i % 2 === 0 ? eta7 : zsMul(eta23, zsMul(eta7, eta7)));
      expect(solveNormEquation(odd, rng, 1 << 14).kind).toBe("unsolvable");
      const even = zsMul(base, zsMul(eta23, eta23));
      const r = solveNormEquation(even, rng, 1 << 14);
      expect(r.kind).toBe("solved");
      if (r.kind === "solved") expect(key(zoNormSq(r.t))).toBe(key(even));
    }
  });

  it("large ξ: exact solutions when factoring succeeds, 'hard' (never a wrong answer) when the work limit is hit", () => {
    const rng = seededRng(9);
    // Primes p ≡ 1 (mod 8) near 2^40 and their primes of Z[√2], found by search.
    const bigPrimes1mod8: bigint[] = [];
    for (let p = (1n << 40n) + 1n; bigPrimes1mod8.length < 2; p += 8n) if (isProbablePrime(p)) bigPrimes1mod8.push(p);
    // ξ = s†s with s built from large random coefficients is solvable by construction
    for (let i = 0; i < 50; i++) {
      const s: ZOmega = { a: rng.nextBelow(1n << 40n), b: rng.nextBelow(1n << 40n), c: rng.nextBelow(1n << 40n), d: rng.nextBelow(1n << 40n) };
      const xi = zoNormSq(s);
      const r = solveNormEquation(xi, rng, 1 << 15);
      expect(r.kind).not.toBe("unsolvable");
      if (r.kind === "solved") expect(key(zoNormSq(r.t))).toBe(key(xi));
    }
    // N(ξ) = p·q with two 40-bit primes and a tiny work limit: rho cannot split it
    const xi: ZSqrt2 = { a: bigPrimes1mod8[0]! * bigPrimes1mod8[1]!, b: 0n }; // a rational integer: N = (pq)²
    const r = solveNormEquation(xi, rng, 64);
    expect(["hard", "solved"]).toContain(r.kind);
    if (r.kind === "solved") expect(key(zoNormSq(r.t))).toBe(key(xi));
  });
});
