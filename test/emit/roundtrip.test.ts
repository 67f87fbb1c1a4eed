import { describe, expect, it } from "vitest";
import { parseQasmText } from "../../src/frontend/frontend.js";
import { writeQasm3 } from "../../src/emit/qasm3.js";
import { GOOD, parseFixture, withoutLocations } from "../frontend/helpers.js";
import type { Circuit, GateOp } from "../../src/ir/circuit.js";
import { definedGates } from "../../src/emit/gate-definitions.js";
import { gateInfo } from "../../src/ir/gates.js";
import { anglePi, angleDecimal } from "../../src/ir/angle-ops.js";

describe("parse -> IR -> write -> parse gives the same IR (all but source locations)", () => {
  for (const f of GOOD) {
    it(f, () => {
      const ir = parseFixture(f);
      const text = writeQasm3(ir);
      const again = parseQasmText(text, `${f}.emitted.qasm`);
      expect(withoutLocations(again)).toEqual(withoutLocations(ir));
      // And the writer is a fixed point from there on: byte-identical output.
      expect(writeQasm3(again)).toBe(text);
    });
  }

  it("round-trips the qelib1-only gates through the writer's own definitions", () => {
    const src = [
      "OPENQASM 2.0;",
      'include "qelib1.inc";',
      "qreg q[5];",
      "rxx(0.3) q[0], q[1];",
      "rzz(pi/3) q[1], q[2];",
      "rccx q[0], q[1], q[2];",
      "rc3x q[0], q[1], q[2], q[3];",
      "c3x q[0], q[1], q[2], q[3];",
      "c3sqrtx q[0], q[1], q[2], q[3];",
      "c4x q[0], q[1], q[2], q[3], q[4];",
      "csx q[0], q[1];",
    ].join("\n");
    const ir = parseQasmText(src, "q2.qasm");
    const text = writeQasm3(ir);
    expect(text).toContain("pragma tledger canonical rccx");
    expect(withoutLocations(parseQasmText(text, "rt.qasm"))).toEqual(withoutLocations(ir));
  });

  it("round-trips every gate the writer defines itself, controlled or not", () => {
    const loc = { file: "x", line: 1, col: 1 };
    const body: GateOp[] = [];
    for (const name of definedGates()) {
      const info = gateInfo(name)!;
      const params = Array.from({ length: info.numParams }, (_, i) => (i % 2 === 0 ? angleDecimal("0.125") : anglePi({ num: -3n, den: 7n })));
      const qubits = Array.from({ length: info.numQubits }, (_, i) => i);
      body.push({ kind: "gate", name, params, qubits, ctrl: [], loc });
      body.push({ kind: "gate", name, params, qubits: [...qubits.map((q) => q + 1), 0], ctrl: [false], loc });
    }
    const ir: Circuit = { numQubits: 6, qubitRegs: [{ name: "q", start: 0, size: 6 }], bits: [], body };
    const again = parseQasmText(writeQasm3(ir), "defs.qasm");
    expect(withoutLocations(again)).toEqual(withoutLocations(ir));
  });
});
