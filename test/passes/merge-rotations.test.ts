import { describe, expect, it } from "vitest";
import { mergeRotations } from "../../src/passes/merge-rotations.js";
import { circuitDistance } from "../../src/sim/index.js";
import { circuit, dAngle, g, piAngle, randomBasisCircuit } from "../helpers/circuit-builder.js";

const countRz = (c: { body: readonly { kind: string; name?: string }[] }) => c.body.filter((s) => s.kind === "gate" && s.name === "rz").length;

describe("merge-rotations", () => {
  it("adds adjacent rotations on one qubit and drops the ones that cancel", () => {
    const c = circuit(1, [g("rz", [0], [dAngle("0.3")]), g("rz", [0], [dAngle("0.2")]), g("h", [0]), g("rz", [0], [dAngle("0.7")]), g("rz", [0], [dAngle("-0.7")])]);
    const m = mergeRotations(c);
    expect(m.body.map((s) => (s.kind === "gate" ? `${s.name}(${s.params.map((p) => p.value).join()})` : s.kind))).toEqual(["rz(0.5)", "h()"]);
  });

  it("moves rotations through diagonal gates and CX controls, not through CX targets", () => {
    const c = circuit(2, [g("rz", [0], [dAngle("0.1")]), g("cx", [0, 1]), g("t", [0]), g("rz", [0], [dAngle("0.2")]), g("rz", [1], [dAngle("0.4")]), g("cx", [0, 1]), g("rz", [1], [dAngle("0.5")])]);
    const m = mergeRotations(c);
    // qubit 0: 0.1 + pi/4 (the T folds in) + 0.2 becomes one rotation; qubit 1's two are split by a CX target.
    expect(countRz(m)).toBe(3);
    expect(circuitDistance(c, m).distance).toBeLessThan(1e-12);
  });

  it("keeps exact pi-multiples exact when nothing continuous joins them", () => {
    const c = circuit(1, [g("rz", [0], [piAngle(1, 8)]), g("rz", [0], [piAngle(1, 8)])]);
    const m = mergeRotations(c);
    const op = m.body[0]!;
    expect(op.kind === "gate" && op.params[0]!.pi).toEqual({ num: 1n, den: 4n });
  });

  it("never changes the unitary up to phase and never adds rotations (seeded random circuits)", () => {
    for (let seed = 1; seed <= 40; seed++) {
      const c = randomBasisCircuit(seed, 3, 60);
      const m = mergeRotations(c);
      expect(countRz(m)).toBeLessThanOrEqual(countRz(c));
      expect(circuitDistance(c, m).distance).toBeLessThan(1e-9);
    }
  });
});
