import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { parseQasmFile } from "../../src/frontend/frontend.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { summarizeCircuit } from "../../src/cli/summary.js";
import type { Circuit } from "../../src/ir/circuit.js";
import { circuitMatrix, GOOD, parseFixture } from "./helpers.js";

/** The basis states with non-zero probability after the circuit's gates, from |0...0>. */
function outcomes(c: Circuit): Map<string, number> {
  const u = circuitMatrix(c);
  const out = new Map<string, number>();
  for (let r = 0; r < u.dim; r++) {
    const p = u.re[r * u.dim]! ** 2 + u.im[r * u.dim]! ** 2;
    if (p > 1e-9) out.set(r.toString(2).padStart(c.numQubits, "0"), p);
  }
  return out;
}

describe("good fixtures", () => {
  it("there are at least 8 demo circuits, all of at most 12 qubits", () => {
    expect(GOOD.length).toBeGreaterThanOrEqual(8);
    for (const f of GOOD) expect(parseFixture(f).numQubits, f).toBeLessThanOrEqual(12);
  });

  for (const f of GOOD) {
    it(`${f} parses and summarises`, () => {
      const c = parseFixture(f);
      const s = summarizeCircuit(c);
      expect(s.qubits).toBe(c.numQubits);
      expect(s.qubits).toBe(c.qubitRegs.reduce((n, r) => n + r.size, 0));
      expect(Object.values(s.gates).reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
      for (const a of s.rotations.distinctNonExactAngles) expect(Number.isFinite(Number(a))).toBe(true);
    });
  }

  it("spin-chain-trotter: 5 bonds x 3 steps, each bond 3 two-qubit terms of 2 CX and 1 rz, plus the field", () => {
    const s = summarizeCircuit(parseFixture("spin-chain-trotter.qasm"));
    expect(s.gates.cx).toBe(5 * 3 * 3 * 2);
    expect(s.gates.rz).toBe(5 * 3 * 3 + 6 * 3);
    expect(s.gates.x).toBe(3);
    // 2*J*dt = 0.1 (xx, yy), 2*Delta*J*dt = 0.05 (zz), 2*field*dt = 0.025: all exact decimals.
    expect(s.rotations.distinctNonExactAngles).toEqual(["0.025", "0.05", "0.1"]);
  });

  it("ripple-adder computes 5 + 3 = 8 (sum bits 000, carry 1) with 6 Toffolis", () => {
    const c = parseFixture("ripple-adder.qasm");
    expect(summarizeCircuit(c).gates.ccx).toBe(6);
    // qubits: cin, a[0..2], b[0..2], cout; a is restored to 101, b holds the sum 000, cout = 1.
    expect([...outcomes(c)]).toEqual([["01010001", expect.closeTo(1, 9)]]);
  });

  it("phase-estimation reads the phase 5/16 exactly: count = 1010 (count[0] first), eigenstate 1", () => {
    const c = parseFixture("phase-estimation.qasm");
    expect([...outcomes(c)]).toEqual([["10101", expect.closeTo(1, 9)]]);
  });

  it("vqe-ansatz needs its inputs, and takes them from the params file", () => {
    expect(() => parseQasmFile("fixtures/vqe-ansatz.qasm")).toThrow(DiagnosticError);
    const s = summarizeCircuit(parseFixture("vqe-ansatz.qasm"));
    expect(s.rotations.nonTrivial).toBe(16);
    // theta_2 = pi/8 and phi_1 = -3*pi/16 are exact pi-multiples; sin(0.3) is not.
    expect(s.rotations.distinctNonExactAngles.length).toBe(4);
  });

  it("qasm2 files read qelib1 gates as canonical ones", () => {
    const s = summarizeCircuit(parseFixture("qasm2-heisenberg.qasm"));
    expect(s.gates).toMatchObject({ U: 2, rxx: 3, rzz: 3, p: 1, cp: 1 });
  });
});

interface Expected {
  readonly file: string;
  readonly line: number;
  readonly col: number;
  readonly message: string;
  readonly hint?: string;
}

describe("bad fixtures", () => {
  const expected = JSON.parse(readFileSync("fixtures/bad/expected.json", "utf8")) as Record<string, Expected>;
  const files = readdirSync("fixtures/bad")
    .filter((f) => f.endsWith(".qasm"))
    .sort();

  it("there are at least 40, each with an expected diagnostic", () => {
    expect(files.length).toBeGreaterThanOrEqual(40);
    expect(Object.keys(expected).sort()).toEqual(files);
  });

  for (const f of files) {
    it(f, () => {
      let diag: DiagnosticError | null = null;
      try {
        parseQasmFile(`fixtures/bad/${f}`);
      } catch (e) {
        if (!(e instanceof DiagnosticError)) throw e;
        diag = e;
      }
      expect(diag, "no diagnostic").not.toBeNull();
      const d = diag!.diagnostics[0]!;
      const want = expected[f]!;
      expect({ file: d.file, line: d.line, col: d.col, message: d.message, hint: d.hint }).toEqual({
        file: `fixtures/bad/${want.file}`,
        line: want.line,
        col: want.col,
        message: want.message,
        hint: want.hint,
      });
    });
  }
});
