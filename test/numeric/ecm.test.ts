import { describe, expect, it } from "vitest";
import { ecmFactor } from "../../src/numeric/ecm.js";
import { isProbablePrime } from "../../src/numeric/primes.js";
import { seededRng } from "../../src/numeric/prng.js";

describe("elliptic-curve factoring", () => {
  it("splits products of a 30-bit prime and a 90-bit prime (out of cheap rho reach) and returns only true factors", () => {
    const rng = seededRng(12);
    const randPrime = (bits: number): bigint => {
      for (;;) {
        const p = rng.nextBelow(1n << BigInt(bits)) | (1n << BigInt(bits - 1)) | 1n;
        if (isProbablePrime(p)) return p;
      }
    };
    let found = 0;
    for (let i = 0; i < 6; i++) {
      const p = randPrime(30);
      const q = randPrime(90);
      const f = ecmFactor(p * q, rng, 30, 500);
      if (f !== null) {
        expect(f === p || f === q).toBe(true);
        found++;
      }
    }
    expect(found).toBeGreaterThanOrEqual(5);
    // a prime has no factor to find
    expect(ecmFactor((1n << 89n) - 1n, rng, 2, 200)).toBeNull();
  });
});
