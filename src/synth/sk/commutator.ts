// The balanced group commutator: write a rotation Delta as V W V^dag W^dag with V, W rotations by one and the same small angle.
import { qinv, qmul, qnormalize, type Quat } from "./quat.js";

export interface CommutatorPair {
  readonly v: Quat;
  readonly w: Quat;
}

/**
 * Balanced group commutator (Dawson & Nielsen 2005), derived here with quaternions.
 *
 * Take V0 = rx(phi) = (c, s, 0, 0) and W0 = ry(phi) = (c, 0, s, 0) with c = cos(phi/2),
 * s = sin(phi/2). Multiplying out, V0 W0 V0^-1 W0^-1 = (1 - 2 s^4, 2 c s^2 (s, -s, c)): a rotation by
 * theta with cos(theta/2) = 1 - 2 s^4, i.e. s^2 = sin(theta/4), about the unit axis
 * m = (s, -s, c) / sqrt(1 + s^2). Given Delta = (cos(theta/2), sin(theta/2) n) (sign chosen with a
 * non-negative scalar part, which is free modulo sign), choose phi by s^2 = sin(theta/4), and a
 * rotation R taking m to n; then V = R V0 R^-1 and W = R W0 R^-1 have the commutator
 * R (V0 W0 V0^-1 W0^-1) R^-1 = Delta, and both are rotations by phi, with
 * d(V, I) = d(W, I) = 2 sin(phi/4), about sqrt(d(Delta, I) / 2) for small Delta.
 */
export function balancedCommutator(delta: Quat): CommutatorPair {
  const sg = delta[0] < 0 ? -1 : 1;
  const a = sg * delta[0];
  const nx = sg * delta[1];
  const ny = sg * delta[2];
  const nz = sg * delta[3];
  const vn = Math.hypot(nx, ny, nz);
  if (vn === 0) return { v: [1, 0, 0, 0], w: [1, 0, 0, 0] };
  const halfTheta = Math.atan2(vn, a); // theta / 2, in [0, pi/2]
  const s2 = Math.sin(halfTheta / 2); // sin(theta / 4) = sin^2(phi / 2)
  const s = Math.sqrt(s2);
  const c = Math.sqrt(1 - s2);
  const v0: Quat = [c, s, 0, 0];
  const w0: Quat = [c, 0, s, 0];
  // Axis of the commutator of v0 and w0, and of Delta.
  const mn = Math.sqrt(1 + s2);
  const m = [s / mn, -s / mn, c / mn] as const;
  const n = [nx / vn, ny / vn, nz / vn] as const;
  const r = rotationTaking(m, n);
  const rInv = qinv(r);
  return { v: qnormalize(qmul(qmul(r, v0), rInv)), w: qnormalize(qmul(qmul(r, w0), rInv)) };
}

/** A unit quaternion whose rotation takes unit vector m to unit vector n. */
function rotationTaking(m: readonly [number, number, number], n: readonly [number, number, number]): Quat {
  const dot = m[0] * n[0] + m[1] * n[1] + m[2] * n[2];
  const cx = m[1] * n[2] - m[2] * n[1];
  const cy = m[2] * n[0] - m[0] * n[2];
  const cz = m[0] * n[1] - m[1] * n[0];
  if (1 + dot > 1e-9) return qnormalize([1 + dot, cx, cy, cz]);
  // Antiparallel: a half-turn about any axis perpendicular to m.
  const p: [number, number, number] =
    Math.abs(m[0]) < 0.6 ? [0, m[2], -m[1]] : [m[1], -m[0], 0];
  const pn = Math.hypot(p[0], p[1], p[2]);
  return [0, p[0] / pn, p[1] / pn, p[2] / pn];
}

/** The group commutator V W V^-1 W^-1. */
export function groupCommutator(v: Quat, w: Quat): Quat {
  return qmul(qmul(qmul(v, w), qinv(v)), qinv(w));
}
