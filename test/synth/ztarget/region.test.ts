// The lattice enumeration of the grid problem against brute force, and its ellipse against the cap.
import { describe, expect, it } from "vitest";
import { levelCandidates, prepareRegion } from "../../../src/synth/ztarget/region.js";
import { angleToFixed, readEps } from "../../../src/synth/ztarget/precision.js";
import { zoNormSq } from "../../../src/synth/rings/zomega.js";

/** Brute force over a box: every u ∈ Z[ω] at level k with |u|², |u•|² ≤ 2^k and d(u/√2^k)² ≤ eps², in doubles. */
function bruteForce(theta: number, eps: number, k: number): { inside: Set<string>; borderline: Set<string> } {
  const inside = new Set<string>();
  const borderline = new Set<string>();
  const R = Math.ceil(Math.sqrt(2 ** k) * 1.5) + 1; // |a|, |c| ≤ 2^{k/2}, |b|, |d| ≤ √2 · 2^{k/2}
  const s = Math.SQRT1_2;
  const sc = 2 ** (-k / 2);
  const twoK = 2n ** BigInt(k);
  for (let a = -R; a <= R; a++)
    for (let b = -R; b <= R; b++)
      for (let c = -R; c <= R; c++)
        for (let d = -R; d <= R; d++) {
          const n = zoNormSq({ a: BigInt(a), b: BigInt(b), c: BigInt(c), d: BigInt(d) });
          const x = twoK - n.a; // ξ = x - n.b √2 must be doubly positive: x ≥ |n.b| √2
          if (x < 0n) continue;
          const nb = n.b < 0n ? -n.b : n.b;
          if (2n * nb * nb > x * x) continue;
          const re = (a + (b - d) * s) * sc;
          const im = (c + (b + d) * s) * sc;
          const d2 = 2 - 2 * (re * Math.cos(theta / 2) - im * Math.sin(theta / 2));
          const key = `${a},${b},${c},${d}`;
          if (Math.abs(d2 - eps * eps) < 1e-9) borderline.add(key);
          else if (d2 < eps * eps) inside.add(key);
        }
  return { inside, borderline };
}

describe("grid problem by lattice enumeration", () => {
  it("finds every candidate of a box search and nothing outside the region (small k, several angles and eps)", () => {
    let total = 0;
    for (const [theta, eps] of [
      [0.3, 0.3],
      [-1.9, 0.2],
      [2.6, 0.15],
      [0.05, 0.1],
      [-3.1, 0.25],
    ] as const) {
      const e = readEps(eps.toString());
      const region = prepareRegion(angleToFixed({ pi: null, value: theta.toString() }, e.prec), e.epsUp, e.eps2Down, e.prec);
      for (let k = 0; k <= 7; k++) {
        const got = new Set(levelCandidates(region, k, () => true).map((c) => `${c.u.a},${c.u.b},${c.u.c},${c.u.d}`));
        const { inside, borderline } = bruteForce(theta, eps, k);
        for (const key of inside) expect(got.has(key), `missed ${key} at k=${k}`).toBe(true);
        for (const key of got) expect(inside.has(key) || borderline.has(key), `extra ${key} at k=${k}`).toBe(true);
        total += inside.size;
      }
    }
    expect(total).toBeGreaterThan(200);
  });

  it("counts candidates per level as the covolume predicts: area(cap) · π · 4^k / 4 (our derivation; statistical, 5 sigma)", () => {
    for (const [epsText, ks] of [
      ["1e-10", [54, 55]],
      ["1e-30", [152, 153]],
    ] as const) {
      const eps = Number(epsText);
      const e = readEps(epsText);
      for (const theta of ["0.7", "-2.2"]) {
        const region = prepareRegion(angleToFixed({ pi: null, value: theta }, e.prec), e.epsUp, e.eps2Down, e.prec);
        for (const k of ks) {
          const n = levelCandidates(region, k, () => true).length;
          // cap area: the segment of height h = eps²/2 of the unit disk, (4/3) h sqrt(2h) to leading order
          const h = (eps * eps) / 2;
          const expected = (4 / 3) * h * Math.sqrt(2 * h) * Math.PI * 4 ** k / 4;
          expect(Math.abs(n - expected)).toBeLessThan(5 * Math.sqrt(expected) + 1);
        }
      }
    }
  });

  it("the enclosing ellipse contains the cap: chord and arc points sampled densely lie inside it", () => {
    for (const eps of [0.5, 0.3, 0.1, 1e-3, 1e-8]) {
      const h = (eps * eps) / 2;
      const s0 = Math.sqrt(2 * h - h * h);
      const A = ((2 * h) / 3) * (1 + 2 ** -10);
      const B = ((2 * s0) / Math.sqrt(3)) * (1 + 2 ** -10);
      // x measured from 1 (offsets keep doubles accurate for tiny h); the centre sits at offset -2h/3
      const q = (xOff: number, y: number) => ((xOff + (2 * h) / 3) / A) ** 2 + (y / B) ** 2;
      if (h >= 1 / 8) continue; // the region falls back to the unit disk there
      for (let i = 0; i <= 2000; i++) {
        const y = -s0 + (2 * s0 * i) / 2000;
        expect(q(-h, y)).toBeLessThanOrEqual(1 + 1e-9); // chord
        expect(q(-(y * y) / (1 + Math.sqrt(1 - y * y)), y)).toBeLessThanOrEqual(1 + 1e-9); // arc: sqrt(1 - y²) - 1
      }
    }
  });
});
