// Dense Hermitian linear algebra in doubles: Cholesky, triangular congruence, Householder tridiagonalisation and Sturm bisection.
//
// Matrices are the IR's CMatrix: square, row-major, split into `re` and `im` (dim*dim entries).
// Everything here is backward stable: computed eigenvalues are exact for a Hermitian
// matrix within about n * 2^-52 * ||A|| of the input, so the absolute error of each
// eigenvalue scales with the norm of the matrix handed in (which is what lets
// distance.ts reach relative accuracy on tiny spectral arcs).
import { adjointMatrix, type CMatrix } from "../ir/gates.js";

/** A real symmetric tridiagonal matrix: diagonal `d` (n entries), squared off-diagonal `e2` (n-1 entries). */
export interface Tridiagonal {
  readonly d: Float64Array;
  readonly e2: Float64Array;
}
const EPS = 2 ** -52;
const SAFE_MIN = 2 ** -1000;

/**
 * Cholesky factor of a Hermitian matrix A = L L^dag, L lower triangular with real positive diagonal.
 * Reads only the lower triangle of A. Returns null when a pivot is not positive (A not positive definite
 * to working precision) or when some pivot falls below `minPivot` (squared-diagonal threshold, default 0).
 */
export function cholesky(a: CMatrix, minPivot = 0): CMatrix | null {
  const n = a.dim;
  const lr = new Float64Array(n * n);
  const li = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    const rj = j * n;
    let s = a.re[rj + j];
    for (let k = 0; k < j; k++) s -= lr[rj + k] * lr[rj + k] + li[rj + k] * li[rj + k];
    if (!(s > minPivot)) return null;
    const ljj = Math.sqrt(s);
    lr[rj + j] = ljj;
    const inv = 1 / ljj;
    for (let i = j + 1; i < n; i++) {
      const ri = i * n;
      // L[i][j] = (A[i][j] - sum_k L[i][k] conj(L[j][k])) / L[j][j]
      let sr = a.re[ri + j];
      let si = a.im[ri + j];
      for (let k = 0; k < j; k++) {
        const ar = lr[ri + k];
        const ai = li[ri + k];
        const br = lr[rj + k];
        const bi = li[rj + k];
        sr -= ar * br + ai * bi;
        si -= ai * br - ar * bi;
      }
      lr[ri + j] = sr * inv;
      li[ri + j] = si * inv;
    }
  }
  return { dim: n, re: lr, im: li };
}

/** Solves L Y = B for lower-triangular L (real diagonal), all columns of B at once; returns Y. */
function forwardSolve(l: CMatrix, b: CMatrix): CMatrix {
  const n = l.dim;
  const yr = Float64Array.from(b.re);
  const yi = Float64Array.from(b.im);
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    for (let k = 0; k < i; k++) {
      const cr = l.re[ri + k];
      const ci = l.im[ri + k];
      if (cr === 0 && ci === 0) continue;
      const rk = k * n;
      for (let c = 0; c < n; c++) {
        const xr = yr[rk + c];
        const xi = yi[rk + c];
        yr[ri + c] -= cr * xr - ci * xi;
        yi[ri + c] -= cr * xi + ci * xr;
      }
    }
    const inv = 1 / l.re[ri + i];
    for (let c = 0; c < n; c++) {
      yr[ri + c] *= inv;
      yi[ri + c] *= inv;
    }
  }
  return { dim: n, re: yr, im: yi };
}

/**
 * L^-1 H L^-dag for Hermitian H and the Cholesky factor L of a positive definite P: a Hermitian
 * matrix whose eigenvalues are those of the pencil H x = lambda P x. Made exactly Hermitian at the end.
 */
export function congruenceByInverseFactor(h: CMatrix, l: CMatrix): CMatrix {
  const x = forwardSolve(l, h); // L^-1 H
  const y = forwardSolve(l, adjointMatrix(x)); // L^-1 (L^-1 H)^dag = L^-1 H L^-dag since H = H^dag
  return hermitianPart(y);
}

/** (A + A^dag) / 2. */
export function hermitianPart(a: CMatrix): CMatrix {
  const n = a.dim;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const r = 0.5 * (a.re[i * n + j] + a.re[j * n + i]);
      const m = 0.5 * (a.im[i * n + j] - a.im[j * n + i]);
      re[i * n + j] = r;
      im[i * n + j] = m;
      re[j * n + i] = r;
      im[j * n + i] = -m;
    }
  }
  return { dim: n, re, im };
}

/**
 * Householder reduction of a Hermitian matrix (lower triangle read) to a real symmetric tridiagonal
 * matrix with the same eigenvalues. Each step applies the Hermitian reflector I - 2uu^dag from both sides
 * as the rank-2 update A - u w^dag - w u^dag, w = 2(Au - (u^dag A u) u), on the lower triangle only.
 * The complex subdiagonal entries are replaced by their moduli (a diagonal unitary similarity).
 */
export function tridiagonalize(a: CMatrix): Tridiagonal {
  const n = a.dim;
  const ar = Float64Array.from(a.re);
  const ai = Float64Array.from(a.im);
  const d = new Float64Array(n);
  const e2 = new Float64Array(Math.max(0, n - 1));
  const ur = new Float64Array(n);
  const ui = new Float64Array(n);
  const pr = new Float64Array(n);
  const pi = new Float64Array(n);
  for (let k = 0; k < n - 1; k++) {
    d[k] = ar[k * n + k];
    const m0 = k + 1;
    // x = A[m0..n-1][k]; scale to avoid under/overflow in the norm.
    let scale = 0;
    for (let i = m0; i < n; i++) scale = Math.max(scale, Math.abs(ar[i * n + k]), Math.abs(ai[i * n + k]));
    if (scale === 0) {
      e2[k] = 0;
      continue;
    }
    let ss = 0;
    for (let i = m0; i < n; i++) {
      const xr = ar[i * n + k] / scale;
      const xi = ai[i * n + k] / scale;
      ss += xr * xr + xi * xi;
    }
    const sigma = Math.sqrt(ss) * scale;
    e2[k] = sigma * sigma;
    if (m0 === n - 1) break; // a single entry: nothing to reflect, the modulus is all we keep
    // beta = -e^{i arg x0} sigma; v = x - beta e1; u = v / ||v||.
    const x0r = ar[m0 * n + k];
    const x0i = ai[m0 * n + k];
    const x0abs = Math.hypot(x0r, x0i);
    const phr = x0abs === 0 ? 1 : x0r / x0abs;
    const phi = x0abs === 0 ? 0 : x0i / x0abs;
    // v0 = x0 + e^{i arg x0} sigma = e^{i arg x0} (|x0| + sigma): no cancellation.
    ur[m0] = phr * (x0abs + sigma);
    ui[m0] = phi * (x0abs + sigma);
    for (let i = m0 + 1; i < n; i++) {
      ur[i] = ar[i * n + k];
      ui[i] = ai[i * n + k];
    }
    // ||v||^2 = 2 sigma (sigma + |x0|)
    const vnorm = Math.sqrt(2 * sigma * (sigma + x0abs));
    const inv = 1 / vnorm;
    for (let i = m0; i < n; i++) {
      ur[i] *= inv;
      ui[i] *= inv;
    }
    // p = A u on the trailing block, from the lower triangle.
    for (let i = m0; i < n; i++) {
      pr[i] = 0;
      pi[i] = 0;
    }
    for (let i = m0; i < n; i++) {
      const ri = i * n;
      let sr = ar[ri + i] * ur[i];
      let si = ar[ri + i] * ui[i];
      const uir = ur[i];
      const uii = ui[i];
      for (let j = m0; j < i; j++) {
        const xr = ar[ri + j];
        const xi = ai[ri + j];
        // row i: A[i][j] u[j]
        sr += xr * ur[j] - xi * ui[j];
        si += xr * ui[j] + xi * ur[j];
        // row j: conj(A[i][j]) u[i]
        pr[j] += xr * uir + xi * uii;
        pi[j] += xr * uii - xi * uir;
      }
      pr[i] += sr;
      pi[i] += si;
    }
    // gamma = u^dag p (real for Hermitian A); w = 2 (p - gamma u)
    let gamma = 0;
    for (let i = m0; i < n; i++) gamma += ur[i] * pr[i] + ui[i] * pi[i];
    for (let i = m0; i < n; i++) {
      pr[i] = 2 * (pr[i] - gamma * ur[i]);
      pi[i] = 2 * (pi[i] - gamma * ui[i]);
    }
    // A[i][j] -= u[i] conj(w[j]) + w[i] conj(u[j]) for m0 <= j <= i
    for (let i = m0; i < n; i++) {
      const ri = i * n;
      const uir = ur[i];
      const uii = ui[i];
      const wir = pr[i];
      const wii = pi[i];
      for (let j = m0; j <= i; j++) {
        const wjr = pr[j];
        const wji = pi[j];
        const ujr = ur[j];
        const uji = ui[j];
        ar[ri + j] -= uir * wjr + uii * wji + wir * ujr + wii * uji;
        ai[ri + j] -= uii * wjr - uir * wji + wii * ujr - wir * uji;
      }
    }
  }
  if (n > 0) d[n - 1] = ar[(n - 1) * n + (n - 1)];
  return { d, e2 };
}

/** Gershgorin interval [lo, hi] holding every eigenvalue of the tridiagonal matrix. */
function gershgorin(t: Tridiagonal): [number, number] {
  const n = t.d.length;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const r = (i > 0 ? Math.sqrt(t.e2[i - 1]) : 0) + (i < n - 1 ? Math.sqrt(t.e2[i]) : 0);
    lo = Math.min(lo, t.d[i] - r);
    hi = Math.max(hi, t.d[i] + r);
  }
  return [lo, hi];
}

/** Number of eigenvalues strictly below x (Sturm sequence via the LDL^T pivots of T - xI). */
function countBelow(t: Tridiagonal, x: number, pivmin: number): number {
  const n = t.d.length;
  let count = 0;
  let q = t.d[0] - x;
  if (Math.abs(q) < pivmin) q = -pivmin;
  if (q < 0) count++;
  for (let i = 1; i < n; i++) {
    q = t.d[i] - x - t.e2[i - 1] / q;
    if (Math.abs(q) < pivmin) q = -pivmin;
    if (q < 0) count++;
  }
  return count;
}

/**
 * Eigenvalues of a real symmetric tridiagonal matrix with index in [from, to) of the ascending order,
 * by bisection on Sturm counts, to an absolute accuracy of a few ulps of the matrix norm.
 */
export function tridiagonalEigenvalues(t: Tridiagonal, from = 0, to = t.d.length): Float64Array {
  const n = t.d.length;
  const out = new Float64Array(Math.max(0, to - from));
  if (n === 0 || to <= from) return out;
  let [glo, ghi] = gershgorin(t);
  const norm = Math.max(Math.abs(glo), Math.abs(ghi));
  if (norm === 0) return out; // the zero matrix
  let maxE2 = 0;
  for (let i = 0; i < n - 1; i++) maxE2 = Math.max(maxE2, t.e2[i]);
  const pivmin = SAFE_MIN * Math.max(1, maxE2);
  const pad = 2 * EPS * norm + 2 * pivmin;
  glo -= pad;
  ghi += pad;
  const atol = EPS * norm;
  for (let k = from; k < to; k++) {
    let lo = glo;
    let hi = ghi;
    // Reuse the previous eigenvalue as a lower bracket (ascending order).
    if (k > from) {
      lo = Math.max(lo, out[k - from - 1] - 2 * atol);
      if (countBelow(t, lo, pivmin) > k) lo = glo; // keep the invariant count(lo) <= k < count(hi)
    }
    for (;;) {
      const mid = 0.5 * (lo + hi);
      if (mid <= lo || mid >= hi || hi - lo <= Math.max(atol, 2 * EPS * Math.max(Math.abs(lo), Math.abs(hi)))) break;
      if (countBelow(t, mid, pivmin) > k) hi = mid;
      else lo = mid;
    }
    out[k - from] = 0.5 * (lo + hi);
  }
  return out;
}

/** All eigenvalues of a Hermitian matrix, ascending. */
export function hermitianEigenvalues(a: CMatrix): Float64Array {
  return tridiagonalEigenvalues(tridiagonalize(a));
}

/** The least and greatest eigenvalues of a Hermitian matrix. */
export function hermitianExtremes(a: CMatrix): { readonly min: number; readonly max: number } {
  const t = tridiagonalize(a);
  const n = a.dim;
  const lo = tridiagonalEigenvalues(t, 0, 1);
  const hi = tridiagonalEigenvalues(t, n - 1, n);
  return { min: lo[0], max: hi[0] };
}
