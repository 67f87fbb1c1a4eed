// Tests of the balanced group commutator: V W V^dag W^dag reproduces Delta, with V and W rotations by the same angle.
import { describe, expect, it } from "vitest";
import type { Matrix } from "mathjs";
import { balancedCommutator, groupCommutator } from "../../../src/synth/sk/commutator.js";
import { qdist, QUAT_ONE, type Quat } from "../../../src/synth/sk/quat.js";
import { seededHaarQuats } from "../../../src/synth/sk/seeded.js";
import { math, mathjsDist, mathjsQuatMatrix } from "./reference.js";

/** Random rotations at a spread of distances from the identity, from 1e-12 up to the largest (d = sqrt2). */
function targets(): Quat[] {
  const out: Quat[] = [];
  const axes = seededHaarQuats(60, 31);
  axes.forEach((a, i) => {
    const half = i < 50 ? 0.5 * Math.PI * 10 ** (-(i % 10) - (i >= 25 ? 2 : 0)) * (1 + (i % 7) / 10) : ((i - 50) / 10) * (Math.PI / 2);
    const n = Math.hypot(a[1], a[2], a[3]);
    out.push([Math.cos(half), (Math.sin(half) * a[1]) / n, (Math.sin(half) * a[2]) / n, (Math.sin(half) * a[3]) / n]);
  });
  out.push([0, 1, 0, 0], [0, 0, 0, 1], [-Math.SQRT1_2, 0, Math.SQRT1_2, 0]);
  return out;
}

const rotationAngle = (q: Quat): number => 2 * Math.atan2(Math.hypot(q[1], q[2], q[3]), Math.abs(q[0]));

describe("balanced group commutator", () => {
  it("V W V^dag W^dag equals Delta up to sign (quaternion product)", () => {
    for (const delta of targets()) {
      const { v, w } = balancedCommutator(delta);
      const d = qdist(groupCommutator(v, w), delta);
      // Relative to the size of Delta: the decomposition must not swamp a tiny Delta.
      expect(d, JSON.stringify(delta)).toBeLessThan(1e-15 + 1e-12 * qdist(delta, QUAT_ONE));
    }
  });

  it("V W V^dag W^dag equals Delta up to phase (independent check with mathjs matrices)", () => {
    for (const delta of targets().slice(0, 40)) {
      const { v, w } = balancedCommutator(delta);
      const [mv, mw] = [mathjsQuatMatrix(v), mathjsQuatMatrix(w)];
      const comm = math.multiply(math.multiply(math.multiply(mv, mw), math.ctranspose(mv)), math.ctranspose(mw)) as Matrix;
      expect(mathjsDist(comm, mathjsQuatMatrix(delta))).toBeLessThan(1e-7);
    }
  });

  it("is balanced, with the angle relation of Dawson & Nielsen 2005", () => {
    for (const delta of targets()) {
      const { v, w } = balancedCommutator(delta);
      const phi = rotationAngle(v);
      expect(Math.abs(rotationAngle(w) - phi)).toBeLessThan(1e-12);
      // Dawson & Nielsen 2005 (from memory): sin(theta/2) = 2 sin^2(phi/2) sqrt(1 - sin^4(phi/2)).
      const theta = rotationAngle(delta);
      const s2 = Math.sin(phi / 2) ** 2;
      expect(Math.abs(Math.sin(theta / 2) - 2 * s2 * Math.sqrt(1 - s2 * s2))).toBeLessThan(1e-12);
      // So for small Delta, d(V, I) is about sqrt(d(Delta, I) / 2): the square-root shrinkage SK relies on.
      const dd = qdist(delta, QUAT_ONE);
      if (dd > 0 && dd < 1e-3) expect(qdist(v, QUAT_ONE) / Math.sqrt(dd / 2)).toBeCloseTo(1, 3);
    }
  });

  it("gives identities for the identity", () => {
    const { v, w } = balancedCommutator(QUAT_ONE);
    expect(qdist(v, QUAT_ONE)).toBe(0);
    expect(qdist(w, QUAT_ONE)).toBe(0);
  });
});
