// Exact integral LLL reduction of a positive definite quadratic form given by its integer Gram matrix (Cohen 1993, Alg. 2.6.7).
import { divRound } from "./bigint.js";

/**
 * The result of reducing the form x ↦ xᵀ G x on Zⁿ.
 * - `basis[i]`: the i-th reduced basis vector in the original coordinates (a row of a unimodular matrix).
 * - `gram`: the reduced Gram matrix, gram[i][j] = basis[i]ᵀ G basis[j] (exact).
 * - `d`: d[0] = 1 and d[i] = det(gram restricted to the first i vectors), so the squared Gram–Schmidt
 *   lengths are d[i+1]/d[i] for vector i.
 * - `lambda[i][j]` (j < i): d[j+1] · μ_ij, where μ_ij are the Gram–Schmidt coefficients.
 * All entries are exact integers: nothing here is rounded.
 */
export interface LllResult {
  readonly basis: bigint[][];
  readonly gram: bigint[][];
  readonly d: bigint[];
  readonly lambda: bigint[][];
  /** Number of swaps performed (a cost measure). */
  readonly swaps: number;
}

/**
 * LLL-reduces the integer Gram matrix `g` (symmetric, positive definite) with Lovász constant
 * deltaNum/deltaDen in (1/4, 1) (default 99/100). Exact integer arithmetic throughout.
 */
export function lllGram(g: readonly (readonly bigint[])[], deltaNum = 99n, deltaDen = 100n): LllResult {
  const n = g.length;
  // 1-based working arrays, as in the book.
  const G: bigint[][] = [];
  const H: bigint[][] = [];
  const lam: bigint[][] = [];
  for (let i = 0; i <= n; i++) {
    G.push(new Array<bigint>(n + 1).fill(0n));
    H.push(new Array<bigint>(n + 1).fill(0n));
    lam.push(new Array<bigint>(n + 1).fill(0n));
  }
  for (let i = 1; i <= n; i++) {
    H[i]![i] = 1n;
    for (let j = 1; j <= n; j++) G[i]![j] = g[i - 1]![j - 1]!;
  }
  const d = new Array<bigint>(n + 1).fill(0n);
  d[0] = 1n;
  if (n === 0) return { basis: [], gram: [], d: [1n], lambda: [], swaps: 0 };
  d[1] = G[1]![1]!;
  if (d[1] <= 0n) throw new RangeError("lllGram: form is not positive definite");
  let k = 2;
  let kmax = 1;
  let swaps = 0;

  const red = (k: number, l: number): void => {
    const lkl = lam[k]![l]!;
    const dl = d[l]!;
    if (2n * (lkl < 0n ? -lkl : lkl) <= dl) return;
    const q = divRound(lkl, dl);
    const Hk = H[k]!;
    const Hl = H[l]!;
    for (let j = 1; j <= n; j++) Hk[j] = Hk[j]! - q * Hl[j]!;
    const Gk = G[k]!;
    const Gl = G[l]!;
    const gkkNew = Gk[k]! - 2n * q * Gk[l]! + q * q * Gl[l]!;
    for (let j = 1; j <= n; j++) {
      if (j === k) continue;
      Gk[j] = Gk[j]! - q * Gl[j]!;
      G[j]![k] = Gk[j]!;
    }
    Gk[k] = gkkNew;
    lam[k]![l] = lkl - q * dl;
    for (let i = 1; i < l; i++) lam[k]![i] = lam[k]![i]! - q * lam[l]![i]!;
  };

  const swap = (k: number): void => {
    swaps++;
    [H[k], H[k - 1]] = [H[k - 1]!, H[k]!];
    [G[k], G[k - 1]] = [G[k - 1]!, G[k]!];
    for (let i = 1; i <= n; i++) {
      const row = G[i]!;
      [row[k], row[k - 1]] = [row[k - 1]!, row[k]!];
    }
    for (let j = 1; j <= k - 2; j++) {
      const t = lam[k]![j]!;
      lam[k]![j] = lam[k - 1]![j]!;
      lam[k - 1]![j] = t;
    }
    const lmb = lam[k]![k - 1]!;
    const B = (d[k - 2]! * d[k]! + lmb * lmb) / d[k - 1]!;
    for (let i = k + 1; i <= kmax; i++) {
      const t = lam[i]![k]!;
      lam[i]![k] = (d[k]! * lam[i]![k - 1]! - lmb * t) / d[k - 1]!;
      lam[i]![k - 1] = (B * t + lmb * lam[i]![k]!) / d[k]!;
    }
    d[k - 1] = B;
  };

  while (k <= n) {
    if (k > kmax) {
      kmax = k;
      for (let j = 1; j <= k; j++) {
        let u = G[k]![j]!;
        for (let i = 1; i < j; i++) u = (d[i]! * u - lam[k]![i]! * lam[j]![i]!) / d[i - 1]!;
        if (j < k) lam[k]![j] = u;
        else {
          if (u <= 0n) throw new RangeError("lllGram: form is not positive definite");
          d[k] = u;
        }
      }
    }
    red(k, k - 1);
    const lk = lam[k]![k - 1]!;
    if (deltaDen * d[k]! * d[k - 2]! < deltaNum * d[k - 1]! * d[k - 1]! - deltaDen * lk * lk) {
      swap(k);
      k = Math.max(2, k - 1);
    } else {
      for (let l = k - 2; l >= 1; l--) red(k, l);
      k++;
    }
  }
  const basis: bigint[][] = [];
  const gram: bigint[][] = [];
  const lambda: bigint[][] = [];
  for (let i = 1; i <= n; i++) {
    basis.push(H[i]!.slice(1));
    gram.push(G[i]!.slice(1));
    lambda.push(lam[i]!.slice(1));
  }
  return { basis, gram, d: d.slice(), lambda, swaps };
}

/** The inverse of a square integer matrix of determinant ±1 (exact, by fraction-free elimination). */
export function inverseUnimodular(m: readonly (readonly bigint[])[]): bigint[][] {
  const n = m.length;
  // Gauss–Jordan over the rationals with a common denominator kept implicitly: use Bareiss on [m | I].
  const a: bigint[][] = m.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1n : 0n))]);
  let prev = 1n;
  for (let c = 0; c < n; c++) {
    let piv = c;
    while (piv < n && a[piv]![c] === 0n) piv++;
    if (piv === n) throw new RangeError("inverseUnimodular: singular matrix");
    if (piv !== c) [a[piv], a[c]] = [a[c]!, a[piv]!];
    const pc = a[c]![c]!;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r]![c]!;
      for (let j = 0; j < 2 * n; j++) {
        if (j === c) continue;
        a[r]![j] = (pc * a[r]![j]! - f * a[c]![j]!) / prev;
      }
      a[r]![c] = 0n;
    }
    prev = pc;
  }
  // Now a[i][i] = det for every i, and the right block is det · m⁻¹.
  const det = a[0]![0]!;
  if (det !== 1n && det !== -1n) throw new RangeError("inverseUnimodular: determinant is not ±1");
  return a.map((row) => row.slice(n).map((x) => x / det));
}
