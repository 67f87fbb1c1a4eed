// Tests of the random-state lower bound: never above the exact distance (seeded property test), determinism, stable evaluation.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { phaseAlignedDistance, randomStateLowerBound } from "../../src/sim/random-states.js";
import { distanceToIdentity } from "../../src/sim/distance.js";
import { circuitAdjointTimes } from "../../src/sim/unitary.js";
import { seededRng } from "../../src/sim/rng.js";
import { circuit, gate, randomCircuit } from "./helpers.js";

describe("random-state lower bound", () => {
  test("never exceeds the exact distance (fast-check, seeded)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 4 }), fc.integer({ min: 1, max: 5 }), (seed, n, states) => {
        const a = randomCircuit(seed, n, 25);
        // B: A with a few gates changed (small and large differences both occur).
        const extra = randomCircuit(seed + 7, n, 1 + (seed % 3));
        const b = circuit(n, [...a.body.slice(0, 10), ...extra.body, ...a.body.slice(10)]);
        const exact = distanceToIdentity(circuitAdjointTimes(a, b));
        const r = randomStateLowerBound(a, b, { seed, states });
        expect(r.perState).toHaveLength(states);
        expect(r.lowerBound).toBeLessThanOrEqual(exact + 1e-12);
        expect(r.lowerBound).toBe(Math.max(...r.perState));
      }),
      { seed: 20240607, numRuns: 40 },
    );
  });

  test("comes close to the exact distance when one qubit carries the error (random states mix evenly)", () => {
    const a = randomCircuit(3, 6, 80);
    const b = circuit(6, [...a.body, gate("rz", [2], [0.02])]);
    const exact = distanceToIdentity(circuitAdjointTimes(a, b));
    const r = randomStateLowerBound(a, b, { states: 6 });
    expect(exact).toBeCloseTo(2 * Math.sin(0.02 / 4), 12);
    expect(r.lowerBound).toBeLessThanOrEqual(exact + 1e-12);
    expect(r.lowerBound).toBeGreaterThan(0.5 * exact);
  });

  test("zero for circuits equal up to global phase", () => {
    const a = randomCircuit(5, 5, 60);
    const b = circuit(5, [gate("gphase", [], [1.234]), ...a.body]);
    expect(randomStateLowerBound(a, b).lowerBound).toBeLessThan(1e-13);
  });

  test("deterministic: the same seed repeats bit for bit, another seed differs", () => {
    const a = randomCircuit(8, 4, 40);
    const b = randomCircuit(9, 4, 40);
    const r1 = randomStateLowerBound(a, b, { seed: 17, states: 3 });
    const r2 = randomStateLowerBound(a, b, { seed: 17, states: 3 });
    const r3 = randomStateLowerBound(a, b, { seed: 18, states: 3 });
    expect(r1.perState).toEqual(r2.perState);
    expect(r3.perState).not.toEqual(r1.perState);
  });

  test("phaseAlignedDistance equals sqrt(2 - 2|<x|y>|) for unit vectors at moderate distance (definition, common practice)", () => {
    const rng = seededRng(4);
    for (let k = 0; k < 20; k++) {
      const n = 16;
      const mk = () => {
        const re = new Float64Array(n);
        const im = new Float64Array(n);
        let s = 0;
        for (let i = 0; i < n; i++) {
          [re[i], im[i]] = rng.gaussianPair();
          s += re[i] ** 2 + im[i] ** 2;
        }
        return { re: re.map((v) => v / Math.sqrt(s)), im: im.map((v) => v / Math.sqrt(s)) };
      };
      const x = mk();
      const y = mk();
      let ir = 0;
      let ii = 0;
      for (let i = 0; i < n; i++) {
        ir += x.re[i] * y.re[i] + x.im[i] * y.im[i];
        ii += x.re[i] * y.im[i] - x.im[i] * y.re[i];
      }
      expect(phaseAlignedDistance(x, y)).toBeCloseTo(Math.sqrt(2 - 2 * Math.hypot(ir, ii)), 12);
    }
  });

  test("phaseAlignedDistance keeps relative accuracy where sqrt(2 - 2|<x|y>|) cancels", () => {
    // y = e^{i a} (cos e |0> + sin e |1>) vs x = |0>: the distance is sqrt(2 - 2 cos e) = 2 sin(e/2).
    for (const e of [1e-6, 1e-9, 1e-12]) {
      const x = { re: Float64Array.of(1, 0), im: Float64Array.of(0, 0) };
      const a = 0.9;
      const y = {
        re: Float64Array.of(Math.cos(a) * Math.cos(e), Math.cos(a) * Math.sin(e)),
        im: Float64Array.of(Math.sin(a) * Math.cos(e), Math.sin(a) * Math.sin(e)),
      };
      expect(Math.abs(phaseAlignedDistance(x, y) - 2 * Math.sin(e / 2)) / e).toBeLessThan(1e-6);
    }
  });
});
