// Tests of the quaternion view of SU(2): gates, products, distance and matrix conversion against mathjs matrices.
import { describe, expect, it } from "vitest";
import type { Matrix } from "mathjs";
import { GATES1, type Gate1 } from "../../../src/synth/exact/word.js";
import { GATE_QUAT, matToQuat, qdist, qinv, qmul, quatToMat, rzQuat, wordQuat, type Quat } from "../../../src/synth/sk/quat.js";
import { seededHaarQuats } from "../../../src/synth/sk/seeded.js";
import { seededRng } from "../../../src/numeric/prng.js";
import { GATE_MATRIX, math, mathjsDist, mathjsQuatMatrix, mathjsU, mathjsWordMatrix, toMat2 } from "./reference.js";

describe("quaternions as SU(2) modulo sign", () => {
  it("each gate quaternion is the gate's matrix up to a global phase (mathjs reference)", () => {
    for (const g of GATES1) {
      const d = mathjsDist(mathjsQuatMatrix(GATE_QUAT[g]), GATE_MATRIX[g]);
      expect(d, g).toBeLessThan(1e-7);
    }
  });

  it("the Hamilton product is the matrix product (mathjs reference)", () => {
    const qs = seededHaarQuats(20, 11);
    for (let i = 0; i + 1 < qs.length; i += 2) {
      const p = qs[i]!;
      const q = qs[i + 1]!;
      const prod = math.multiply(mathjsQuatMatrix(p), mathjsQuatMatrix(q)) as Matrix;
      const diff = math.subtract(prod, mathjsQuatMatrix(qmul(p, q))) as Matrix;
      expect(math.norm(diff, "fro") as number).toBeLessThan(1e-13);
      const inv = math.subtract(math.ctranspose(mathjsQuatMatrix(p)), mathjsQuatMatrix(qinv(p))) as Matrix;
      expect(math.norm(inv, "fro") as number).toBeLessThan(1e-13);
    }
  });

  it("wordQuat composes in circuit order (first gate applied first)", () => {
    const rng = seededRng(5);
    for (let trial = 0; trial < 20; trial++) {
      const word: Gate1[] = Array.from({ length: 1 + (rng.nextU32() % 40) }, () => GATES1[rng.nextU32() % GATES1.length]!);
      expect(mathjsDist(mathjsQuatMatrix(wordQuat(word)), mathjsWordMatrix(word))).toBeLessThan(1e-7);
    }
    // An order-sensitive pair: the word "h t" applies H first, so its matrix is T H, not H T.
    expect(qdist(wordQuat(["h", "t"]), qmul(GATE_QUAT.t, GATE_QUAT.h))).toBeLessThan(1e-15);
    expect(qdist(wordQuat(["h", "t"]), qmul(GATE_QUAT.h, GATE_QUAT.t))).toBeGreaterThan(0.1);
  });

  it("qdist equals sqrt(2 - |tr(U^dag V)|) computed with mathjs, and ignores sign", () => {
    const qs = seededHaarQuats(30, 12);
    for (let i = 0; i + 1 < qs.length; i += 2) {
      const p = qs[i]!;
      const q = qs[i + 1]!;
      const ref = mathjsDist(mathjsQuatMatrix(p), mathjsQuatMatrix(q));
      expect(Math.abs(qdist(p, q) - ref)).toBeLessThan(1e-12);
      const negq: Quat = [-q[0], -q[1], -q[2], -q[3]];
      expect(qdist(p, negq)).toBe(qdist(p, q));
    }
  });

  it("qdist stays accurate for tiny distances: rz(0) vs rz(t) is 2 sin(|t|/4)", () => {
    // d(I, rz(t)) = sqrt(2 - 2 cos(t/2)) = 2 |sin(t/4)| (common practice, no source).
    for (const t of [1e-3, 1e-8, 1e-12, 3e-14]) {
      const d = qdist(rzQuat(0), rzQuat(t));
      expect(Math.abs(d - 2 * Math.sin(t / 4)) / (t / 2)).toBeLessThan(1e-6);
    }
  });

  it("matToQuat accepts any U(2) matrix: OpenQASM U(a, b, c) with a global phase (mathjs reference)", () => {
    const rng = seededRng(13);
    for (let trial = 0; trial < 20; trial++) {
      const [a, b, c, g] = [0, 0, 0, 0].map(() => (rng.nextFloat() * 2 - 1) * 2 * Math.PI) as [number, number, number, number];
      const u = mathjsU(a, b, c, g);
      const q = matToQuat(toMat2(u));
      expect(Math.hypot(...q)).toBeCloseTo(1, 14);
      expect(mathjsDist(mathjsQuatMatrix(q), u)).toBeLessThan(1e-7);
      // quatToMat is the inverse up to sign.
      expect(qdist(matToQuat(quatToMat(q)), q)).toBeLessThan(1e-15);
    }
  });

  it("matToQuat rejects a matrix that is not unitary", () => {
    expect(() => matToQuat({ re: [0, 0, 0, 0], im: [0, 0, 0, 0] })).toThrow(RangeError);
    expect(() => matToQuat({ re: [3, 0, 0, 3], im: [0, 0, 0, 0] })).toThrow(RangeError);
  });
});
