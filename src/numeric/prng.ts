// A seeded pseudo-random generator (xoshiro128** seeded by splitmix32): the only source of randomness in synthesis.

/** A deterministic stream of pseudo-random numbers; the same seed always gives the same stream. */
export interface Rng {
  /** A uniform 32-bit unsigned integer. */
  nextU32(): number;
  /** A uniform double in [0, 1). */
  nextFloat(): number;
  /** A uniform bigint in [0, n) for n ≥ 1 (rejection sampling on whole 32-bit words). */
  nextBelow(n: bigint): bigint;
}

function splitmix32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

/** A generator seeded by a 32-bit integer (other numbers are reduced modulo 2^32 after truncation). */
export function seededRng(seed: number): Rng {
  const sm = splitmix32(Math.trunc(seed) >>> 0);
  let a = sm();
  let b = sm();
  let c = sm();
  let d = sm();
  if ((a | b | c | d) === 0) a = 1; // the all-zero state is a fixed point
  const nextU32 = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    c = (c ^ a) >>> 0;
    d = (d ^ b) >>> 0;
    b = (b ^ c) >>> 0;
    a = (a ^ d) >>> 0;
    c = (c ^ t) >>> 0;
    d = rotl(d, 11);
    return result;
  };
  return {
    nextU32,
    nextFloat: () => nextU32() / 4294967296,
    nextBelow(n: bigint): bigint {
      if (n < 1n) throw new RangeError("nextBelow: bound must be at least 1");
      const words = Math.ceil(n.toString(2).length / 32);
      const span = 1n << BigInt(32 * words);
      const limit = span - (span % n); // accept only below a multiple of n: uniform
      for (;;) {
        let x = 0n;
        for (let i = 0; i < words; i++) x = (x << 32n) | BigInt(nextU32());
        if (x < limit) return x % n;
      }
    },
  };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
