import { describe, expect, it } from "vitest";
import { enumerateEllipsoid, reduceForm } from "../../src/numeric/ellipsoid.js";
import { seededRng } from "../../src/numeric/prng.js";

/** Inverse of a 4×4 matrix of doubles (Gauss–Jordan): only to size the brute-force box. */
function inverse4(m: number[][]): number[][] {
  const a = m.map((r, i) => [...r, ...[0, 1, 2, 3].map((j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < 4; c++) {
    let p = c;
    for (let r = c + 1; r < 4; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    [a[c], a[p]] = [a[p]!, a[c]!];
    const pv = a[c]![c]!;
    for (let j = 0; j < 8; j++) a[c]![j]! /= pv;
    for (let r = 0; r < 4; r++) {
      if (r === c) continue;
      const f = a[r]![c]!;
      for (let j = 0; j < 8; j++) a[r]![j]! -= f * a[c]![j]!;
    }
  }
  return a.map((r) => r.slice(4));
}

describe("lattice points in an ellipsoid", () => {
  it("matches a brute-force search over the ellipsoid's bounding box for random skewed 4-dimensional forms", () => {
    const rng = seededRng(8);
    const prec = 96;
    const scale = 16;
    let total = 0;
    for (let trial = 0; trial < 20; trial++) {
      // G = Aᵀ A (A a random integer matrix with one heavy row, so the form is skewed) plus a small
      // random definite part, everything scaled by 2^scale.
      const A: number[][] = [];
      for (let i = 0; i < 4; i++) A.push([0, 1, 2, 3].map(() => ((rng.nextU32() % 9) - 4) * (i === 0 ? 7 : 1)));
      const g: bigint[][] = [];
      for (let i = 0; i < 4; i++) {
        g.push([]);
        for (let j = 0; j < 4; j++) {
          let s = 0;
          for (let k = 0; k < 4; k++) s += A[k]![i]! * A[k]![j]!;
          g[i]!.push(BigInt(s) << BigInt(scale));
        }
        g[i]![i] = g[i]![i]! + (BigInt(1 + (rng.nextU32() % 4)) << BigInt(scale - 2));
      }
      const form = reduceForm(g, scale, prec);
      const cd = [0, 1, 2, 3].map(() => rng.nextFloat() * 6 - 3);
      const center = cd.map((c) => BigInt(Math.round(c * 2 ** 20)) << BigInt(prec - 20));
      const r2d = 5 + rng.nextFloat() * 60;
      const r2 = BigInt(Math.round(r2d * 2 ** 20)) << BigInt(prec - 20);
      const got = enumerateEllipsoid(form, center, r2, 40).map((v) => v.join(","));
      // Bounding box: |x_i - c_i| ≤ sqrt(r2 · (G⁻¹)_ii) with G the real form.
      const gi = inverse4(g.map((row) => row.map((x) => Number(x) / 2 ** scale)));
      const lo = cd.map((c, i) => Math.floor(c - Math.sqrt(r2d * gi[i]![i]!)) - 1);
      const hi = cd.map((c, i) => Math.ceil(c + Math.sqrt(r2d * gi[i]![i]!)) + 1);
      const want: string[] = [];
      const one = 1n << BigInt(prec);
      const x = [0n, 0n, 0n, 0n];
      for (let a = lo[0]!; a <= hi[0]!; a++)
        for (let b = lo[1]!; b <= hi[1]!; b++)
          for (let c = lo[2]!; c <= hi[2]!; c++)
            for (let d = lo[3]!; d <= hi[3]!; d++) {
              [a, b, c, d].forEach((t, i) => (x[i] = (BigInt(t) << BigInt(prec)) - center[i]!));
              let q = 0n;
              for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) q += x[i]! * g[i]![j]! * x[j]!;
              if (q <= r2 * one * (1n << BigInt(scale))) want.push([a, b, c, d].join(","));
            }
      // every point of the exact ellipsoid is found, and nothing else (the slack is 2^-40 relative)
      expect([...got].sort()).toEqual([...want].sort());
      total += want.length;
    }
    expect(total).toBeGreaterThan(50); // the test is not vacuous
  });
});
