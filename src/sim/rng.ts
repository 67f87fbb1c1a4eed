// The simulator's random numbers: uniform doubles and normal pairs drawn from the project's one seeded generator (numeric/prng.ts).
import { seededRng as baseRng } from "../numeric/prng.js";

/** A deterministic stream of uniform doubles in [0, 1) and standard normal pairs. */
export interface Rng {
  /** Uniform in [0, 1), 53 random bits. */
  uniform(): number;
  /** Two independent standard normal samples (used as the real and imaginary part of one amplitude). */
  gaussianPair(): readonly [number, number];
}

/** The generator for a 32-bit seed (other numbers are reduced mod 2^32). */
export function seededRng(seed: number): Rng {
  const base = baseRng(seed);
  const next = (): number => base.nextU32();
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
