// Tests of the Hermitian helpers: eigenvalues against closed forms and mathjs, Cholesky reconstruction, the definite-pencil reduction.
import { describe, expect, test } from "vitest";
import { all, create, type Complex, type Matrix } from "mathjs";
import type { CMatrix } from "../../src/ir/gates.js";
import { cholesky, congruenceByInverseFactor, hermitianEigenvalues, hermitianExtremes, tridiagonalEigenvalues, tridiagonalize } from "../../src/sim/hermitian.js";
import { seededRng } from "../../src/sim/rng.js";

const math = create(all);

function randomHermitian(seed: number, n: number, scale = 1): CMatrix {
  const rng = seededRng(seed);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    re[i * n + i] = scale * (rng.uniform() * 2 - 1);
    for (let j = 0; j < i; j++) {
      const [a, b] = rng.gaussianPair();
      re[i * n + j] = scale * a;
      im[i * n + j] = scale * b;
      re[j * n + i] = scale * a;
      im[j * n + i] = -scale * b;
    }
  }
  return { dim: n, re, im };
}

function toMath(a: CMatrix): Matrix {
  const rows: Complex[][] = [];
  for (let i = 0; i < a.dim; i++) rows.push(Array.from({ length: a.dim }, (_, j) => math.complex(a.re[i * a.dim + j], a.im[i * a.dim + j])));
  return math.matrix(rows);
}

function mathjsEigenvalues(m: Matrix): number[] {
  const vals = (math.eigs(m).values as Matrix).toArray() as (number | Complex)[];
  return vals.map((v) => (typeof v === "number" ? v : v.re)).sort((x, y) => x - y);
}

describe("tridiagonal bisection", () => {
  test("the [-1, 2, -1] matrix has eigenvalues 2 - 2 cos(k pi/(n+1)) (discrete Laplacian; common practice, no source)", () => {
    for (const n of [1, 2, 5, 40]) {
      const t = { d: new Float64Array(n).fill(2), e2: new Float64Array(n - 1).fill(1) };
      const got = tridiagonalEigenvalues(t);
      for (let k = 1; k <= n; k++) expect(got[k - 1]).toBeCloseTo(2 - 2 * Math.cos((k * Math.PI) / (n + 1)), 14);
    }
  });

  test("a split matrix (zero off-diagonal) returns its diagonal sorted; ranges select by index", () => {
    const t = { d: Float64Array.of(3, -1, 2, 0.5), e2: Float64Array.of(0, 0, 0) };
    expect(Array.from(tridiagonalEigenvalues(t))).toEqual([-1, 0.5, 2, 3].map((x) => expect.closeTo(x, 15)));
    expect(tridiagonalEigenvalues(t, 1, 3)[1]).toBeCloseTo(2, 15);
  });
});

describe("Hermitian eigenvalues", () => {
  test("match mathjs eigs on random complex Hermitian matrices", () => {
    for (const n of [1, 2, 3, 7, 12]) {
      const a = randomHermitian(n * 13, n);
      const got = Array.from(hermitianEigenvalues(a));
      const want = mathjsEigenvalues(toMath(a));
      got.forEach((x, k) => expect(x).toBeCloseTo(want[k], 11));
      const ex = hermitianExtremes(a);
      expect(ex.min).toBeCloseTo(want[0], 11);
      expect(ex.max).toBeCloseTo(want[n - 1], 11);
    }
  });

  test("tridiagonalisation keeps the trace and the Frobenius norm (similarity invariants)", () => {
    const a = randomHermitian(99, 20);
    const t = tridiagonalize(a);
    let tr = 0;
    let fro = 0;
    for (let i = 0; i < 20; i++) tr += a.re[i * 20 + i];
    for (let k = 0; k < 400; k++) fro += a.re[k] ** 2 + a.im[k] ** 2;
    const ttr = t.d.reduce((s, x) => s + x, 0);
    const tfro = t.d.reduce((s, x) => s + x * x, 0) + 2 * t.e2.reduce((s, x) => s + x, 0);
    expect(ttr).toBeCloseTo(tr, 12);
    expect(tfro).toBeCloseTo(fro, 10);
  });

  test("absolute accuracy scales with the matrix norm (tiny matrices keep relative accuracy)", () => {
    const big = randomHermitian(5, 10);
    const small = { dim: 10, re: big.re.map((x) => x * 1e-11), im: big.im.map((x) => x * 1e-11) };
    const eb = hermitianEigenvalues(big);
    const es = hermitianEigenvalues(small);
    eb.forEach((x, k) => expect(Math.abs(es[k] * 1e11 - x)).toBeLessThan(1e-12));
  });
});

describe("Cholesky and the definite pencil", () => {
  test("L L^dag reproduces a positive definite matrix; indefinite ones are refused", () => {
    const n = 9;
    const h = randomHermitian(3, n);
    // P = H^2 + I is positive definite.
    const p = math.add(math.multiply(toMath(h), toMath(h)), math.identity(n)) as Matrix;
    const arr = p.toArray() as (number | Complex)[][];
    const pm: CMatrix = {
      dim: n,
      re: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? z : z.re))),
      im: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? 0 : z.im))),
    };
    const l = cholesky(pm)!;
    expect(l).not.toBeNull();
    const llh = math.multiply(toMath(l), math.ctranspose(toMath(l))) as Matrix;
    const diff = math.subtract(llh, p) as Matrix;
    const worst = Math.max(...(diff.toArray() as (number | Complex)[][]).flat().map((z) => math.abs(z) as number));
    expect(worst).toBeLessThan(1e-12);
    expect(cholesky(h)).toBeNull(); // random Hermitian: indefinite
    expect(cholesky(pm, 1e9)).toBeNull(); // pivot threshold
  });

  test("L^-1 H L^-dag has the eigenvalues of P^-1 H (mathjs eigs of the product)", () => {
    const n = 6;
    const h = randomHermitian(8, n);
    const g = randomHermitian(9, n);
    const p = math.add(math.multiply(toMath(g), toMath(g)), math.multiply(2, math.identity(n))) as Matrix;
    const arr = p.toArray() as (number | Complex)[][];
    const pm: CMatrix = {
      dim: n,
      re: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? z : z.re))),
      im: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? 0 : z.im))),
    };
    const c = congruenceByInverseFactor(h, cholesky(pm)!);
    const got = hermitianEigenvalues(c);
    const want = mathjsEigenvalues(math.multiply(math.inv(p), toMath(h)) as Matrix);
    got.forEach((x, k) => expect(x).toBeCloseTo(want[k], 10));
  });
});
