import { describe, expect, it } from "vitest";
import { inverseUnimodular, lllGram } from "../../src/numeric/lll.js";
import { seededRng } from "../../src/numeric/prng.js";

type Mat = bigint[][];

function matMul(a: readonly (readonly bigint[])[], b: readonly (readonly bigint[])[]): Mat {
  return a.map((row) => b[0]!.map((_, j) => row.reduce((s, x, k) => s + x * b[k]![j]!, 0n)));
}
function transpose(a: readonly (readonly bigint[])[]): Mat {
  return a[0]!.map((_, j) => a.map((row) => row[j]!));
}
/** A random n×n integer basis whose Gram matrix is skewed like the synthesis forms. */
function randomGram(rng: ReturnType<typeof seededRng>, n: number, bits: number): Mat {
  const b: Mat = [];
  for (let i = 0; i < n; i++) {
    const row: bigint[] = [];
    for (let j = 0; j < n; j++) row.push(rng.nextBelow(1n << BigInt(bits)) - (1n << BigInt(bits - 1)));
    row[i] = row[i]! + (1n << BigInt(bits + i * 7)); // diagonal dominance keeps it non-singular, skews it
    b.push(row);
  }
  return matMul(b, transpose(b));
}

/** Exact rational Gram–Schmidt data of a Gram matrix: squared lengths and mu, as [num, den] pairs. */
function gramSchmidt(g: Mat): { B: [bigint, bigint][]; mu: [bigint, bigint][][] } {
  // Work with fractions over a common denominator per entry, slowly but exactly.
  type Q = [bigint, bigint];
  const norm = ([a, b]: Q): Q => {
    if (b < 0n) [a, b] = [-a, -b];
    let x = a < 0n ? -a : a;
    let y = b;
    while (y) [x, y] = [y, x % y];
    return x === 0n ? [0n, 1n] : [a / x, b / x];
  };
  const sub = (p: Q, q: Q): Q => norm([p[0] * q[1] - q[0] * p[1], p[1] * q[1]]);
  const mul = (p: Q, q: Q): Q => norm([p[0] * q[0], p[1] * q[1]]);
  const div = (p: Q, q: Q): Q => norm([p[0] * q[1], p[1] * q[0]]);
  const n = g.length;
  const B: Q[] = [];
  const mu: Q[][] = [];
  // r[i][j] = <b_i, b*_j>
  const r: Q[][] = [];
  for (let i = 0; i < n; i++) {
    r.push([]);
    mu.push([]);
    for (let j = 0; j <= i; j++) {
      let v: Q = [g[i]![j]!, 1n];
      for (let k = 0; k < j; k++) v = sub(v, mul(mu[j]![k]!, r[i]![k]!));
      r[i]!.push(v);
      if (j < i) mu[i]!.push(div(v, B[j]!));
      else B.push(v);
    }
  }
  return { B, mu };
}

describe("integral LLL on Gram matrices", () => {
  it("returns a unimodular basis whose exact Gram matrix is size-reduced and satisfies Lovász (delta 0.99)", () => {
    const rng = seededRng(21);
    for (let trial = 0; trial < 30; trial++) {
      const n = 2 + (trial % 4);
      const g = randomGram(rng, n, 12 + (trial % 5) * 10);
      const r = lllGram(g);
      const inv = inverseUnimodular(r.basis);
      const id = matMul(r.basis, inv);
      id.forEach((row, i) => row.forEach((x, j) => expect(x).toBe(i === j ? 1n : 0n)));
      expect(matMul(matMul(r.basis, g), transpose(r.basis))).toEqual(r.gram);
      const { B, mu } = gramSchmidt(r.gram);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < i; j++) {
          const [a, b] = mu[i]![j]!;
          expect(2n * (a < 0n ? -a : a) <= b).toBe(true); // |mu| ≤ 1/2
        }
        if (i > 0) {
          // B_i ≥ (0.99 - mu²) B_{i-1}
          const [bi, bid] = B[i]!;
          const [bp, bpd] = B[i - 1]!;
          const [m, md] = mu[i]![i - 1]!;
          // bi/bid ≥ (99/100 - m²/md²) bp/bpd
          expect(100n * bi * bpd * md * md >= (99n * md * md - 100n * m * m) * bp * bid).toBe(true);
        }
        // d[i+1]/d[i] is B_i
        const [bi, bid] = B[i]!;
        expect(r.d[i + 1]! * bid).toBe(bi * r.d[i]!);
      }
    }
  });

  it("finds a shortest vector of a 2-dimensional form (checked against a brute-force search)", () => {
    const rng = seededRng(4);
    for (let trial = 0; trial < 20; trial++) {
      const g = randomGram(rng, 2, 8);
      const r = lllGram(g);
      const q = (x: bigint, y: bigint) => x * x * g[0]![0]! + 2n * x * y * g[0]![1]! + y * y * g[1]![1]!;
      let best = -1n;
      for (let x = -300n; x <= 300n; x++)
        for (let y = -300n; y <= 300n; y++) {
          if (x === 0n && y === 0n) continue;
          const v = q(x, y);
          if (best < 0n || v < best) best = v;
        }
      // In dimension 2 an LLL-reduced first vector with delta near 1 is within 4/3 of the minimum.
      expect(3n * r.gram[0]![0]! <= 4n * best).toBe(true);
    }
  });
});
