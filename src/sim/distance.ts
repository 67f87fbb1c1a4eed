// The distance up to global phase d(U, V) = min_phi ||U - e^{i phi} V|| (operator norm), from the eigenphases of U^dag V.
//
// With W = U^dag V unitary, ||U - e^{i phi} V|| = ||I - e^{i phi} W|| = max_j |1 - e^{i(phi + theta_j)}|
// = max_j 2 |sin((phi + theta_j)/2)| over the eigenphases theta_j of W. The best phi centres the
// smallest arc of the circle holding every theta_j, so d = 2 sin(arc/4) (design note, synthesis.md s.1).
// Half the diamond distance between the two unitary channels is sin(arc/2) while arc < pi, else 1.
//
// How the eigenphases are found (n > 2). W is normal, so any Hermitian function of W shares its
// eigenvectors and its eigenvalues are the same function of the eigenphases; Hermitian eigenvalue
// problems have a backward stable, cheap (4/3 n^3 complex flops) solution, unlike the general complex
// QR algorithm (~10x the work), which matters at n = 1024.
//  1. Remove the mean phase: W' = e^{-i phi0} W with phi0 = arg tr W. If every eigenphase of W lies on an
//     arc shorter than pi, phi0 lies on that arc, so the eigenphases psi_j of W' satisfy |psi_j| <= arc.
//  2. Fast path: a Cholesky factorisation of Re W' - cos(pi/3) I (Re W' = (W' + W'^dag)/2, eigenvalues
//     cos psi_j) succeeds iff every |psi_j| < pi/3 (to working precision). Then psi_j = asin of the
//     eigenvalues of Im W' = (W' - W'^dag)/2i, and the arc is asin(max) - asin(min). The eigenvalue error
//     is about 2^-52 ||Im W'|| ~ 2^-52 * arc: the arc comes out with small *relative* error, with no
//     sqrt(2 - |tr|)-style cancellation. This is the case that matters (circuits that nearly agree).
//  3. General case: the Cayley transform. With the phase pole moved to -1 (W'' = e^{-i phi1} W), the pencil
//     Im W'' x = lambda (I + Re W'') x is Hermitian-definite when no eigenphase sits at pi, and its
//     eigenvalues are sin psi / (1 + cos psi) = tan(psi/2), psi in (-pi, pi). We reduce it with the Cholesky
//     factor L of I + Re W'' to the Hermitian L^-1 (Im W'') L^-dag. The pole is placed in the middle of the
//     largest gap of the candidate set {asin s, pi - asin s} built from the eigenvalues s of Im W' (every
//     true phase is a candidate, so a gap of the candidates is a gap of the phases, at least pi/n wide).
import type { CMatrix } from "../ir/gates.js";
import { cholesky, congruenceByInverseFactor, hermitianEigenvalues, hermitianExtremes } from "./hermitian.js";

const TWO_PI = 2 * Math.PI;

/** d = 2 sin(arc/4) for the smallest arc holding every eigenphase of U^dag V. */
export function distanceFromArc(arc: number): number {
  return 2 * Math.sin(arc / 4);
}

/** Half the diamond distance between the channels of U and V: sin(arc/2) for arc < pi, else 1. */
export function halfDiamondFromArc(arc: number): number {
  return arc >= Math.PI ? 1 : Math.sin(arc / 2);
}

/** U^dag V. */
export function adjointTimes(u: CMatrix, v: CMatrix): CMatrix {
  if (u.dim !== v.dim) throw new RangeError(`adjointTimes: dimension ${u.dim} vs ${v.dim}`);
  const n = u.dim;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  // W[i][j] = sum_k conj(U[k][i]) V[k][j]: row k of V is streamed into row i of W.
  for (let k = 0; k < n; k++) {
    const rk = k * n;
    for (let i = 0; i < n; i++) {
      const ar = u.re[rk + i];
      const ai = -u.im[rk + i];
      if (ar === 0 && ai === 0) continue;
      const ri = i * n;
      for (let j = 0; j < n; j++) {
        const br = v.re[rk + j];
        const bi = v.im[rk + j];
        re[ri + j] += ar * br - ai * bi;
        im[ri + j] += ar * bi + ai * br;
      }
    }
  }
  return { dim: n, re, im };
}

/**
 * The eigenphase arc of a 2x2 unitary W. Writes W = e^{i alpha} M with M in SU(2) (alpha = arg(det W)/2,
 * the branch chosen so Re M00 >= 0); M = [[a, -b*], [b, a*]] has eigenvalues e^{+-i gamma} with
 * cos gamma = |Re a| and sin gamma = sqrt((Im a)^2 + |b|^2), both read without cancellation; arc = 2 gamma.
 */
export function arc2x2(w: CMatrix): number {
  if (w.dim !== 2) throw new RangeError("arc2x2: not a 2x2 matrix");
  const [w00r, w01r, w10r, w11r] = [w.re[0], w.re[1], w.re[2], w.re[3]];
  const [w00i, w01i, w10i, w11i] = [w.im[0], w.im[1], w.im[2], w.im[3]];
  const detr = w00r * w11r - w00i * w11i - (w01r * w10r - w01i * w10i);
  const deti = w00r * w11i + w00i * w11r - (w01r * w10i + w01i * w10r);
  const alpha = Math.atan2(deti, detr) / 2;
  const c = Math.cos(alpha);
  const s = -Math.sin(alpha);
  // M = e^{-i alpha} W
  const m = (r: number, i: number): [number, number] => [r * c - i * s, r * s + i * c];
  const [m00r, m00i] = m(w00r, w00i);
  const [m01r, m01i] = m(w01r, w01i);
  const [m10r, m10i] = m(w10r, w10i);
  const [m11r, m11i] = m(w11r, w11i);
  // Average the two copies of a and b that SU(2) structure provides.
  const aRe = 0.5 * (m00r + m11r);
  const aIm = 0.5 * (m00i - m11i);
  const bRe = 0.5 * (m10r - m01r);
  const bIm = 0.5 * (m10i + m01i);
  const sinG = Math.hypot(aIm, bRe, bIm);
  const gamma = Math.atan2(sinG, Math.abs(aRe));
  return 2 * gamma;
}

/** d(U, V) for 2x2 unitaries (the closed form sqrt(2 - |tr U^dag V|), computed without its cancellation). */
export function distance2x2(u: CMatrix, v: CMatrix): number {
  if (u.dim !== 2 || v.dim !== 2) throw new RangeError("distance2x2: not 2x2 matrices");
  return distanceFromArc(arc2x2(adjointTimes(u, v)));
}

/** e^{-i phi} W. */
function rotate(w: CMatrix, phi: number): CMatrix {
  const c = Math.cos(phi);
  const s = -Math.sin(phi);
  const n = w.dim;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let k = 0; k < n * n; k++) {
    re[k] = w.re[k] * c - w.im[k] * s;
    im[k] = w.re[k] * s + w.im[k] * c;
  }
  return { dim: n, re, im };
}

/** (W + W^dag)/2 + shift I and (W - W^dag)/2i, the Hermitian "real" and "imaginary" parts of W. */
function hermitianParts(w: CMatrix, shift: number): { readonly re: CMatrix; readonly im: CMatrix } {
  const n = w.dim;
  const kr = new Float64Array(n * n);
  const ki = new Float64Array(n * n);
  const hr = new Float64Array(n * n);
  const hi = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const ar = w.re[i * n + j];
      const ai = w.im[i * n + j];
      const br = w.re[j * n + i];
      const bi = w.im[j * n + i];
      // K[i][j] = (W[i][j] + conj(W[j][i]))/2
      const kre = 0.5 * (ar + br);
      const kim = 0.5 * (ai - bi);
      // H[i][j] = (W[i][j] - conj(W[j][i]))/(2i) = ((ai + bi) - i (ar - br))/2
      const hre = 0.5 * (ai + bi);
      const him = -0.5 * (ar - br);
      kr[i * n + j] = kre;
      ki[i * n + j] = kim;
      kr[j * n + i] = kre;
      ki[j * n + i] = -kim;
      hr[i * n + j] = hre;
      hi[i * n + j] = him;
      hr[j * n + i] = hre;
      hi[j * n + i] = -him;
    }
    kr[i * n + i] += shift;
    ki[i * n + i] = 0;
    hi[i * n + i] = 0;
  }
  return { re: { dim: n, re: kr, im: ki }, im: { dim: n, re: hr, im: hi } };
}

const clamp1 = (x: number): number => Math.max(-1, Math.min(1, x));

/** The arc from sorted phases in (-pi, pi]: 2 pi minus the largest gap between neighbours (wrapping round). */
function arcOfSortedPhases(psi: Float64Array): number {
  const n = psi.length;
  if (n <= 1) return 0;
  let gap = psi[0] + TWO_PI - psi[n - 1];
  for (let j = 1; j < n; j++) gap = Math.max(gap, psi[j] - psi[j - 1]);
  return Math.max(0, TWO_PI - gap);
}

/** How the arc of a matrix was found (for tests and reports). */
export type ArcMethod = "trivial" | "2x2" | "hermitian-part" | "cayley";

/**
 * The length of the smallest arc of the unit circle holding every eigenphase of the unitary W,
 * in [0, 2 pi). Accurate to a few ulps of n (absolute), relative on tiny arcs (see the file comment).
 */
export function phaseArc(w: CMatrix): { readonly arc: number; readonly method: ArcMethod } {
  const n = w.dim;
  if (n <= 1) return { arc: 0, method: "trivial" };
  if (n === 2) return { arc: arc2x2(w), method: "2x2" };
  let tr = 0;
  let ti = 0;
  for (let i = 0; i < n; i++) {
    tr += w.re[i * n + i];
    ti += w.im[i * n + i];
  }
  const phi0 = tr === 0 && ti === 0 ? 0 : Math.atan2(ti, tr);
  const w0 = rotate(w, phi0);
  const parts = hermitianParts(w0, -0.5);
  if (cholesky(parts.re) !== null) {
    // Every |psi_j| < pi/3: the eigenphases are asin of the eigenvalues of Im W'.
    const { min, max } = hermitianExtremes(parts.im);
    return { arc: Math.max(0, Math.asin(clamp1(max)) - Math.asin(clamp1(min))), method: "hermitian-part" };
  }
  // Candidates for the phases relative to phi0, then the pole in the middle of their largest gap.
  const s = hermitianEigenvalues(parts.im);
  const cand = new Float64Array(2 * n);
  for (let j = 0; j < n; j++) {
    const a = Math.asin(clamp1(s[j]));
    cand[2 * j] = a;
    cand[2 * j + 1] = a >= 0 ? Math.PI - a : -Math.PI - a;
  }
  cand.sort();
  let bestGap = cand[0] + TWO_PI - cand[2 * n - 1];
  let pole = cand[2 * n - 1] + bestGap / 2;
  for (let j = 1; j < 2 * n; j++) {
    const g = cand[j] - cand[j - 1];
    if (g > bestGap) {
      bestGap = g;
      pole = cand[j - 1] + g / 2;
    }
  }
  // Put the pole at -1: W'' = e^{-i (phi0 + pole - pi)} W.
  const w1 = rotate(w, phi0 + pole - Math.PI);
  const p1 = hermitianParts(w1, 1);
  const l = cholesky(p1.re);
  if (l === null) {
    throw new Error(`phaseArc: I + Re W is not positive definite after placing the pole in a gap of width ${bestGap}; is W unitary?`);
  }
  const c = congruenceByInverseFactor(p1.im, l);
  const lam = hermitianEigenvalues(c);
  const psi = new Float64Array(n);
  for (let j = 0; j < n; j++) psi[j] = 2 * Math.atan(lam[j]);
  return { arc: arcOfSortedPhases(psi), method: "cayley" };
}

/** d(I, W) = min_phi ||I - e^{i phi} W|| for a unitary W. */
export function distanceToIdentity(w: CMatrix): number {
  return distanceFromArc(phaseArc(w).arc);
}

/** The distance up to global phase d(U, V) = min_phi ||U - e^{i phi} V|| (operator norm) of two unitaries. */
export function distanceUpToPhase(u: CMatrix, v: CMatrix): number {
  if (u.dim !== v.dim) throw new RangeError(`distanceUpToPhase: dimension ${u.dim} vs ${v.dim}`);
  return distanceToIdentity(adjointTimes(u, v));
}
