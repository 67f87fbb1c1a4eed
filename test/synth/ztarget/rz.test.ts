// synthRz end to end: errors re-measured independently with mathjs, phases, exact angles, odd inputs, determinism, the T-count band.
import { describe, expect, it } from "vitest";
import { complex, matrix, type Complex, type Matrix } from "mathjs";
import { synthRz } from "../../../src/synth/index.js";
import { phasedDistance } from "./mathref.js";
import type { Angle } from "../../../src/ir/angle.js";
import { seededRng } from "../../../src/numeric/prng.js";

const dec = (v: string): Angle => ({ pi: null, value: v });

const c = (re: number, im = 0): Complex => complex(re, im);
/** rz(θ) = diag(e^{-iθ/2}, e^{iθ/2}) (OpenQASM 3). */
function rzRef(theta: number): Matrix {
  return matrix([[c(Math.cos(theta / 2), -Math.sin(theta / 2)), c(0)], [c(0), c(Math.cos(theta / 2), Math.sin(theta / 2))]]);
}

describe("synthRz", () => {
  it("errors re-checked independently with mathjs for eps from 1e-1 to 1e-12; the phase is the optimal one", () => {
    const rng = seededRng(31);
    for (const eps of [0.1, 1e-2, 1e-4, 1e-6, 1e-9, 1e-12]) {
      for (let i = 0; i < 4; i++) {
        const theta = Number((rng.nextFloat() * 8 - 4).toFixed(15));
        const r = synthRz(dec(theta.toString()), eps.toString());
        const err = Number(r.error);
        expect(err).toBeLessThanOrEqual(eps);
        const d = phasedDistance(r.word, Number(r.globalPhase), rzRef(theta));
        // the double-precision product of up to ~100 gates is good to about 1e-13
        expect(Math.abs(d - err)).toBeLessThan(1e-6 * eps + 2e-13);
        expect(r.method).toBe("number-theoretic");
        expect(r.tCount).toBe(r.word.filter((g) => g === "t" || g === "tdg").length);
        expect(r.cliffordCount).toBe(r.word.length - r.tCount);
      }
    }
  });

  it("exact multiples of π/4 give T^k words with error 0 and the phase e^{-ikπ/8}", () => {
    for (let k = -9; k <= 9; k++) {
      const g = BigInt(k) === 0n ? 1n : BigInt(Math.abs(k)) % 2n === 0n ? (BigInt(Math.abs(k)) % 4n === 0n ? 4n : 2n) : 1n;
      const angle: Angle = { pi: { num: BigInt(k) / g, den: 4n / g }, value: ((k * Math.PI) / 4).toString() };
      const r = synthRz(angle, "1e-10");
      expect(r.error).toBe("0");
      expect(r.method).toBe("exact");
      expect(r.tCount).toBe(Math.abs(k) % 2);
      expect(phasedDistance(r.word, Number(r.globalPhase), rzRef((k * Math.PI) / 4))).toBeLessThan(1e-12);
    }
    const zero = synthRz(dec("0"), "1e-20");
    expect(zero.word).toEqual([]);
    expect(zero.error).toBe("0");
  });

  it("handles tiny, negative, large and non-dyadic π-multiple angles", () => {
    const cases: [Angle, number][] = [
      [dec("1e-9"), 1e-3], // the identity is within 1e-3: T-count 0
      [dec("1e-9"), 1e-11],
      [dec("-2.75"), 1e-7],
      [dec("123456.789"), 1e-6],
      [dec("-9.87654321e20"), 1e-5],
      [{ pi: { num: 1n, den: 3n }, value: (Math.PI / 3).toString() }, 1e-8],
      [{ pi: { num: -7n, den: 5n }, value: ((-7 * Math.PI) / 5).toString() }, 1e-8],
      [{ pi: { num: 1000001n, den: 3n }, value: ((1000001 * Math.PI) / 3).toString() }, 1e-6],
    ];
    for (const [a, eps] of cases) {
      const r = synthRz(a, eps.toString());
      expect(Number(r.error)).toBeLessThanOrEqual(eps);
      // the reference target in doubles: reduce the π-multiples exactly first
      let theta = Number(a.value);
      if (a.pi) theta = (Number(((a.pi.num % (4n * a.pi.den)) + 4n * a.pi.den) % (4n * a.pi.den)) / Number(a.pi.den)) * Math.PI;
      if (Math.abs(theta) < 1e6) {
        const d = phasedDistance(r.word, Number(r.globalPhase), rzRef(theta));
        expect(d).toBeLessThan(eps * (1 + 1e-6) + 1e-12);
      }
    }
    expect(synthRz(dec("1e-9"), "1e-3").tCount).toBe(0);
    expect(synthRz(dec("1e-9"), "1e-11").tCount).toBeGreaterThan(20);
  });

  it("is deterministic: same input and seed give the same word and strings", () => {
    const a = synthRz(dec("0.123456789"), "1e-15", { seed: 5 });
    const b = synthRz(dec("0.123456789"), "1e-15", { seed: 5 });
    expect(b).toEqual(a);
  });

  it("T - 3 log2(1/eps) stays in a small band from 1e-3 to 1e-30 (Ross & Selinger 2014, from memory: 3 log2(1/eps) + O(log log(1/eps)))", () => {
    const rng = seededRng(99);
    for (const eps of [1e-3, 1e-6, 1e-10, 1e-15, 1e-20, 1e-30]) {
      let sum = 0;
      const n = 6;
      for (let i = 0; i < n; i++) {
        const theta = (rng.nextFloat() * 4 * Math.PI - 2 * Math.PI).toFixed(20);
        const r = synthRz(dec(theta), eps.toString());
        const excess = r.tCount - 3 * Math.log2(1 / eps);
        expect(excess).toBeGreaterThan(-15);
        expect(excess).toBeLessThan(10);
        sum += excess;
      }
      expect(Math.abs(sum / n)).toBeLessThan(4);
    }
  });

  it("rejects a non-positive or malformed eps", () => {
    expect(() => synthRz(dec("0.5"), "0")).toThrow(RangeError);
    expect(() => synthRz(dec("0.5"), "-1e-3")).toThrow(RangeError);
    expect(() => synthRz(dec("0.5"), "tiny")).toThrow(RangeError);
  });
});
