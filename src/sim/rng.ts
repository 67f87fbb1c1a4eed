// A small seeded pseudo-random generator (xoshiro128** seeded by splitmix32): the only randomness the simulator uses.

/** A deterministic stream of uniform doubles in [0, 1) and standard normal pairs. */
export interface Rng {
  /** Uniform in [0, 1), 53 random bits. */
  uniform(): number;
  /** Two independent standard normal samples (used as the real and imaginary part of one amplitude). */
  gaussianPair(): readonly [number, number];
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

/** The generator for a 32-bit seed (other numbers are reduced mod 2^32). */
export function seededRng(seed: number): Rng {
  const sm = splitmix32(seed);
  let a = sm();
  let b = sm();
  let c = sm();
  let d = sm();
  if ((a | b | c | d) === 0) a = 1;
  const next = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  };
  const uniform = (): number => ((next() >>> 5) * 67108864 + (next() >>> 6)) / 9007199254740992;
  return {
    uniform,
    gaussianPair(): readonly [number, number] {
      // Box-Muller; 1 - u lies in (0, 1] so the logarithm is finite.
      const r = Math.sqrt(-2 * Math.log(1 - uniform()));
      const t = 2 * Math.PI * uniform();
      return [r * Math.cos(t), r * Math.sin(t)];
    },
  };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
