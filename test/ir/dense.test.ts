// Tests of the test helpers themselves: the in-place gate application agrees with embedding and multiplying.
import { describe, expect, it } from "vitest";
import { complexMatrixMul, controlledMatrix, gateInfo, identityMatrix } from "../../src/ir/gates.js";
import { angleDecimal } from "../../src/ir/angle-ops.js";
import type { GateOp } from "../../src/ir/circuit.js";
import { embed, fromMath, math, maxDiff, seeded, unitaryOf } from "./dense.js";

describe("dense helpers", () => {
  it("embed puts the first listed qubit on the most significant bit", () => {
    // cx with control on register qubit 1 and target on qubit 0, in a 2-qubit register: |q0 q1>
    const cx = embed(gateInfo("cx")!.matrix([]), [1, 0], 2);
    const want = math.matrix([[1, 0, 0, 0], [0, 0, 0, 1], [0, 0, 1, 0], [0, 1, 0, 0]]);
    expect(maxDiff(cx, fromMath(want))).toBe(0);
  });

  it("unitaryOf (in place) equals the product of embedded matrices", () => {
    const rnd = seeded(3);
    const names = ["h", "cx", "rz", "ccx", "cu", "swap", "U", "t"];
    const ops: GateOp[] = [];
    for (let i = 0; i < 30; i++) {
      const name = names[Math.floor(rnd() * names.length)]!;
      const info = gateInfo(name)!;
      const qs = [0, 1, 2, 3].sort(() => rnd() - 0.5).slice(0, info.numQubits + 1);
      const ctrl = rnd() < 0.5 ? [] : [rnd() < 0.5];
      const qubits = qs.slice(0, ctrl.length + info.numQubits);
      const params = Array.from({ length: info.numParams }, () => angleDecimal((rnd() * 6 - 3).toFixed(6)));
      ops.push({ kind: "gate", name, params, qubits, ctrl, loc: { file: "f", line: 1, col: 1 } });
    }
    let slow = identityMatrix(16);
    for (const o of ops) {
      const m = gateInfo(o.name)!.matrix(o.params.map((p) => Number(p.value)));
      slow = complexMatrixMul(embed(controlledMatrix(m, o.ctrl), o.qubits, 4), slow);
    }
    expect(maxDiff(unitaryOf(ops, 4), slow)).toBeLessThan(1e-12);
  });
});
