import { describe, expect, it } from "vitest";
import { factorize, isProbablePrime, iroot, jacobi, perfectPowerRoot, pollardBrent, primesBelow, sqrtMod, trialDivide } from "../../src/numeric/primes.js";
import { seededRng } from "../../src/numeric/prng.js";
import { modPow } from "../../src/numeric/bigint.js";

describe("primes and factoring", () => {
  it("the sieve counts the primes below 10^4 and 10^5 (1229 and 9592: common practice, no source)", () => {
    expect(primesBelow(10_000).length).toBe(1229);
    expect(primesBelow(100_000).length).toBe(9592);
  });

  it("Miller–Rabin agrees with the sieve below 5·10^4 and with trial division on random 40-bit numbers", () => {
    const sieve = new Set(primesBelow(50_000));
    for (let n = 0; n < 50_000; n++) expect(isProbablePrime(BigInt(n))).toBe(sieve.has(n));
    const rng = seededRng(3);
    const small = primesBelow(1 << 20);
    for (let i = 0; i < 200; i++) {
      const n = rng.nextBelow(1n << 40n) | 1n;
      const nn = Number(n); // exact: below 2^53
      let prime = n > 1n;
      for (const p of small) {
        if (p * p > nn) break;
        if (nn % p === 0) {
          prime = false;
          break;
        }
      }
      expect(isProbablePrime(n)).toBe(prime);
    }
  });

  it("rejects Carmichael numbers and strong pseudoprimes, accepts known large primes", () => {
    // Carmichael numbers and strong pseudoprimes: common practice, no source (2047 = 23·89 is the least
    // base-2 strong pseudoprime; 3215031751 = 151·751·28351 is strong to bases 2, 3, 5, 7).
    for (const c of [561n, 1105n, 1729n, 2465n, 2821n, 6601n, 8911n, 2047n, 3215031751n, 151n * 751n * 28351n]) {
      expect(isProbablePrime(c)).toBe(false);
    }
    // Mersenne primes 2^61 - 1, 2^89 - 1, 2^127 - 1 (common practice, no source); 2^67 - 1 is composite
    // (Cole 1903: 193707721 · 761838257287).
    expect(isProbablePrime((1n << 61n) - 1n)).toBe(true);
    expect(isProbablePrime((1n << 89n) - 1n)).toBe(true);
    expect(isProbablePrime((1n << 127n) - 1n)).toBe(true);
    expect(isProbablePrime((1n << 67n) - 1n)).toBe(false);
    expect(193707721n * 761838257287n).toBe((1n << 67n) - 1n);
    // The Fermat number F7 = 2^128 + 1 is composite (common practice, no source).
    expect(isProbablePrime((1n << 128n) + 1n)).toBe(false);
  });

  it("trial division removes exactly the small primes", () => {
    const n = 2n ** 10n * 3n ** 4n * 4093n * ((1n << 61n) - 1n);
    const { found, rest } = trialDivide(n);
    expect(found).toEqual([
      { p: 2n, e: 10 },
      { p: 3n, e: 4 },
      { p: 4093n, e: 1 },
    ]);
    expect(rest).toBe((1n << 61n) - 1n);
  });

  it("Pollard–Brent splits 2^67 - 1 and seeded semiprimes; factorize reassembles n from primes", () => {
    const rng = seededRng(5);
    const f = pollardBrent((1n << 67n) - 1n, rng, 1 << 20);
    expect(f === 193707721n || f === 761838257287n).toBe(true);
    const ps = primesBelow(1 << 20)
      .filter((p) => p > 70_000)
      .map(BigInt);
    for (let i = 0; i < 40; i++) {
      const p = ps[rng.nextU32() % ps.length]!;
      const q = ps[rng.nextU32() % ps.length]!;
      const r = ps[rng.nextU32() % ps.length]!;
      const n = p * q * r * 12n;
      const fac = factorize(n, rng, 1 << 16);
      expect(fac.hard).toEqual([]);
      let prod = 1n;
      for (const { p: pp, e } of fac.primes) {
        expect(isProbablePrime(pp)).toBe(true);
        prod *= pp ** BigInt(e);
      }
      expect(prod).toBe(n);
    }
  });

  it("factorize reports a hard composite when the work limit is too small, and handles prime powers", () => {
    const rng = seededRng(9);
    const p = (1n << 61n) - 1n;
    const q = (1n << 89n) - 1n;
    const fac = factorize(p * q, rng, 200);
    expect(fac.hard).toEqual([p * q]);
    expect(perfectPowerRoot(p ** 3n)).toEqual({ root: p, k: 3 });
    expect(iroot(10n ** 30n + 5n, 3)).toBe(10n ** 10n);
    const fp = factorize(p ** 3n * 7n, rng, 200);
    expect(fp.primes).toEqual([
      { p: 7n, e: 1 },
      { p, e: 3 },
    ]);
  });

  it("Jacobi symbols match Euler's criterion for primes, and Tonelli–Shanks finds square roots", () => {
    const rng = seededRng(13);
    const primes = primesBelow(50_000).slice(1).map(BigInt);
    for (let i = 0; i < 300; i++) {
      const p = primes[rng.nextU32() % primes.length]!;
      const a = rng.nextBelow(p);
      const e = modPow(a, (p - 1n) / 2n, p);
      const euler = e === 0n ? 0 : e === 1n ? 1 : -1;
      expect(jacobi(a, p)).toBe(euler);
      const r = sqrtMod(a, p);
      if (euler >= 0) expect((r! * r!) % p).toBe(a);
      else expect(r).toBeNull();
    }
    // p ≡ 1 mod 8 with a large 2-power in p - 1: 2^61 - 1 is 7 mod 8; use a prime of the form k·2^20 + 1.
    const p = 7340033n; // 7·2^20 + 1, prime (common practice, no source)
    expect(isProbablePrime(p)).toBe(true);
    for (let i = 0; i < 50; i++) {
      const x = rng.nextBelow(p);
      const r = sqrtMod((x * x) % p, p)!;
      expect(r === x || r === p - x).toBe(true);
    }
    // Jacobi symbol for composite moduli: multiplicative in the modulus.
    for (let i = 0; i < 100; i++) {
      const p1 = primes[rng.nextU32() % primes.length]!;
      const p2 = primes[rng.nextU32() % primes.length]!;
      const a = rng.nextBelow(10n ** 9n);
      expect(jacobi(a, p1 * p2)).toBe(jacobi(a, p1) * jacobi(a, p2));
    }
  });
});
