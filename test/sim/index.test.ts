// Tests of the simulator's public face: circuitDistance picks exact or lower-bound methods, refuses what it cannot do, and handles 10 qubits.
import { describe, expect, test } from "vitest";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { circuitDistance, circuitUnitary, distanceUpToPhase } from "../../src/sim/index.js";
import { circuit, gate, randomCircuit } from "./helpers.js";

describe("circuitDistance", () => {
  test("exact up to 10 qubits: one extra rz(e) anywhere gives 2 sin(e/4)", () => {
    // d(A, A') where A' has rz(e) inserted: A^dag A' is conjugate to rz(e) (x) I, eigenphase arc e (synthesis.md s.1).
    const a = randomCircuit(12, 4, 50);
    for (const e of [0.5, 1e-4, 1e-9]) {
      const b = circuit(4, [...a.body.slice(0, 20), gate("rz", [1], [e]), ...a.body.slice(20)]);
      const r = circuitDistance(a, b);
      expect(r.exact).toBe(true);
      expect(r.qubits).toBe(4);
      expect(Math.abs(r.distance - 2 * Math.sin(e / 4)) / (2 * Math.sin(e / 4))).toBeLessThan(1e-5);
      expect(r.halfDiamond).toBeCloseTo(Math.sin(e / 2), 12);
      expect(r.method).toMatch(/exact/);
    }
  });

  test("agrees with distanceUpToPhase on the circuits' unitaries", () => {
    const a = randomCircuit(30, 3, 40);
    const b = randomCircuit(31, 3, 40);
    expect(circuitDistance(a, b).distance).toBeCloseTo(distanceUpToPhase(circuitUnitary(a), circuitUnitary(b)), 12);
  });

  test("above 10 qubits: a labelled lower bound from seeded random states", () => {
    const a = randomCircuit(40, 12, 60);
    const b = circuit(12, [...a.body, gate("rx", [5], [0.1])]);
    const r = circuitDistance(a, b, { seed: 3, states: 2 });
    expect(r.exact).toBe(false);
    expect(r.states).toBe(2);
    expect(r.halfDiamond).toBeNull();
    expect(r.method).toMatch(/lower bound/);
    expect(r.distance).toBeGreaterThan(0);
    expect(r.distance).toBeLessThanOrEqual(2 * Math.sin(0.1 / 4) + 1e-12);
  });

  test("refuses different qubit counts, more than 22 qubits and non-unitary circuits", () => {
    expect(() => circuitDistance(circuit(2, []), circuit(3, []))).toThrow(DiagnosticError);
    expect(() => circuitDistance(circuit(23, []), circuit(23, []))).toThrow(/23 qubits/);
    const m = circuit(2, [{ kind: "measure", qubit: 0, bit: null, loc: { file: "x.qasm", line: 4, col: 1 } }]);
    expect(() => circuitDistance(m, circuit(2, []))).toThrow(/measurement/);
  });

  test("a 10-qubit unitary distance completes and is accurate", () => {
    const a = randomCircuit(77, 10, 120);
    const e = 3e-8;
    const b = circuit(10, [...a.body.slice(0, 60), gate("ry", [7], [e]), ...a.body.slice(60)]);
    const r = circuitDistance(a, b);
    expect(r.exact).toBe(true);
    expect(Math.abs(r.distance - 2 * Math.sin(e / 4)) / (2 * Math.sin(e / 4))).toBeLessThan(1e-5);
  });
});
