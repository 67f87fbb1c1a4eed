// Unit quaternions as SU(2) modulo sign: products, inverses, the phase-blind distance, and conversions from gates and 2x2 matrices.
import type { Gate1, Word } from "../exact/word.js";

/**
 * A unit quaternion (a, b, c, d) standing for the SU(2) matrix a I - i (b X + c Y + d Z),
 * i.e. [[a - i d, -c - i b], [c - i b, a + i d]]. The Hamilton product matches the matrix
 * product, and q and -q stand for the same operator up to phase.
 */
export type Quat = readonly [number, number, number, number];

/** A 2x2 complex matrix, row-major: entries (u00, u01, u10, u11), real and imaginary parts apart. */
export interface Mat2 {
  readonly re: readonly [number, number, number, number];
  readonly im: readonly [number, number, number, number];
}

export const QUAT_ONE: Quat = [1, 0, 0, 0];

/** Hamilton product p q (as matrices: p times q, so q acts first). */
export function qmul(p: Quat, q: Quat): Quat {
  const [a1, b1, c1, d1] = p;
  const [a2, b2, c2, d2] = q;
  return [
    a1 * a2 - b1 * b2 - c1 * c2 - d1 * d2,
    a1 * b2 + b1 * a2 + c1 * d2 - d1 * c2,
    a1 * c2 - b1 * d2 + c1 * a2 + d1 * b2,
    a1 * d2 + b1 * c2 - c1 * b2 + d1 * a2,
  ];
}

/** The inverse of a unit quaternion (the adjoint matrix). */
export function qinv(q: Quat): Quat {
  return [q[0], -q[1], -q[2], -q[3]];
}

/** Rescale to unit length (guards against drift after long products). */
export function qnormalize(q: Quat): Quat {
  const n = Math.hypot(q[0], q[1], q[2], q[3]);
  return [q[0] / n, q[1] / n, q[2] / n, q[3] / n];
}

/**
 * d(U, V) = min over phases of the operator norm of U - e^{i phi} V = sqrt(2 - |tr(U^dag V)|).
 * For unit quaternions this is min(|p - q|, |p + q|), computed from the difference so that
 * it stays accurate when the distance is far below sqrt(machine epsilon).
 */
export function qdist(p: Quat, q: Quat): number {
  const m = Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2], p[3] - q[3]);
  const s = Math.hypot(p[0] + q[0], p[1] + q[1], p[2] + q[2], p[3] + q[3]);
  return Math.min(m, s);
}

const R2 = Math.SQRT1_2;
const C8 = Math.cos(Math.PI / 8);
const S8 = Math.sin(Math.PI / 8);

/**
 * Each gate as a unit quaternion, up to sign: H = i (X + Z)/sqrt2, T = e^{i pi/8} rz(pi/4),
 * S = e^{i pi/4} rz(pi/2), X = i (iX) and so on (rz(t) = cos(t/2) I - i sin(t/2) Z).
 */
export const GATE_QUAT: Readonly<Record<Gate1, Quat>> = {
  h: [0, R2, 0, R2],
  s: [R2, 0, 0, R2],
  sdg: [R2, 0, 0, -R2],
  t: [C8, 0, 0, S8],
  tdg: [C8, 0, 0, -S8],
  x: [0, 1, 0, 0],
  y: [0, 0, 1, 0],
  z: [0, 0, 0, 1],
};

/**
 * The operator of a word (circuit order: the last gate is the leftmost factor), multiplied
 * pairwise so that rounding grows with log(length) rather than length.
 */
export function wordQuat(w: Word): Quat {
  if (w.length === 0) return QUAT_ONE;
  const prod = (lo: number, hi: number): Quat => {
    if (hi - lo === 1) return GATE_QUAT[w[lo]!];
    const mid = (lo + hi) >> 1;
    return qmul(prod(mid, hi), prod(lo, mid));
  };
  return qnormalize(prod(0, w.length));
}

/** rz(theta) = diag(e^{-i theta/2}, e^{i theta/2}) as a quaternion. */
export function rzQuat(theta: number): Quat {
  return [Math.cos(theta / 2), 0, 0, Math.sin(theta / 2)];
}

/**
 * The SU(2) quaternion of a unitary 2x2 matrix, up to sign: divides out a square root of the
 * determinant (so any U(2) matrix is accepted) and renormalizes. Throws on a singular or
 * clearly non-unitary input.
 */
export function matToQuat(m: Mat2): Quat {
  const [ar, br, cr, dr] = m.re;
  const [ai, bi, ci, di] = m.im;
  // det = a d - b c
  const detRe = ar * dr - ai * di - (br * cr - bi * ci);
  const detIm = ar * di + ai * dr - (br * ci + bi * cr);
  const detAbs = Math.hypot(detRe, detIm);
  if (!(detAbs > 0.5 && detAbs < 2)) throw new RangeError("matToQuat: the matrix is not unitary");
  // sqrt(det) = sqrt(r) e^{i arg/2}; dividing by it makes the determinant 1.
  const half = Math.atan2(detIm, detRe) / 2;
  const r = Math.sqrt(detAbs);
  const pr = Math.cos(half) / r;
  const pi = -Math.sin(half) / r;
  const mulRe = (xr: number, xi: number) => xr * pr - xi * pi;
  const mulIm = (xr: number, xi: number) => xr * pi + xi * pr;
  const a = [mulRe(ar, ai), mulIm(ar, ai)] as const;
  const b = [mulRe(br, bi), mulIm(br, bi)] as const;
  const c = [mulRe(cr, ci), mulIm(cr, ci)] as const;
  const d = [mulRe(dr, di), mulIm(dr, di)] as const;
  // [[q0 - i q3, -q2 - i q1], [q2 - i q1, q0 + i q3]]
  const q: Quat = [(a[0] + d[0]) / 2, -(b[1] + c[1]) / 2, (c[0] - b[0]) / 2, (d[1] - a[1]) / 2];
  const n = Math.hypot(q[0], q[1], q[2], q[3]);
  if (!(n > 0.9 && n < 1.1)) throw new RangeError("matToQuat: the matrix is not unitary");
  return qnormalize(q);
}

/** The SU(2) matrix of a quaternion (the inverse of matToQuat up to sign). */
export function quatToMat(q: Quat): Mat2 {
  const [a, b, c, d] = q;
  return { re: [a, -c, c, a], im: [-d, -b, -b, d] };
}
