import { describe, expect, it } from "vitest";
import { matrix, type Matrix } from "mathjs";
import { parseQasmText } from "../../src/frontend/frontend.js";
import { definedGates, gateDefinition, sameDefinitionText } from "../../src/emit/gate-definitions.js";
import { gateInfo } from "../../src/ir/gates.js";
import { circuitMatrix, distanceTo, M } from "../frontend/helpers.js";

const PARAM = 0.7310585786300049;

/** The unitary of one call of the definition, expanded by the front end as an ordinary user gate (no pragma). */
function definitionMatrix(name: string): { re: number[]; im: number[]; dim: number } {
  const info = gateInfo(name)!;
  const args = Array.from({ length: info.numQubits }, (_, i) => `q[${i}]`).join(", ");
  const params = info.numParams > 0 ? `(${Array(info.numParams).fill(PARAM).join(", ")})` : "";
  const src = `OPENQASM 3.0;\ninclude "stdgates.inc";\n${gateDefinition(name)}\nqubit[${info.numQubits}] q;\n${name}${params} ${args};\n`;
  return circuitMatrix(parseQasmText(src, `${name}.qasm`));
}

function tableMatrix(name: string): Matrix {
  const info = gateInfo(name)!;
  const m = info.matrix(Array(info.numParams).fill(PARAM));
  const rows: [number, number][][] = [];
  for (let r = 0; r < m.dim; r++) rows.push(Array.from({ length: m.dim }, (_, c) => [m.re[r * m.dim + c]!, m.im[r * m.dim + c]!]));
  return matrix(rows.map((row) => row.map(([re, im]) => ({ re, im }))) as never);
}

const SX = M.mul(M.H, M.S, M.H); // x^(1/2) with the principal branch: H S H (equals sx exactly)
const CX = M.ctrl(M.X, [true]);

/** Independent references (mathjs, from the OpenQASM 3 specification's matrices). */
const REFERENCE: Record<string, () => Matrix> = {
  sxdg: () => M.mul(M.H, M.mul(M.S, M.S, M.S), M.H),
  csx: () => M.ctrl(SX, [true]),
  c3x: () => M.ctrl(M.X, [true, true, true]),
  c4x: () => M.ctrl(M.X, [true, true, true, true]),
  c3sqrtx: () => M.ctrl(SX, [true, true, true]),
  c3sqrtxdg: () => M.ctrl(M.mul(M.H, M.mul(M.S, M.S, M.S), M.H), [true, true, true]),
  rxx: () => M.rot(M.kron(M.X, M.X), PARAM),
  ryy: () => M.rot(M.kron(M.Y, M.Y), PARAM),
  rzz: () => M.rot(M.kron(M.Z, M.Z), PARAM),
  rzx: () => M.rot(M.kron(M.Z, M.X), PARAM),
};

describe("the writer's gate definitions have exactly the canonical matrices (global phase included)", () => {
  for (const name of definedGates()) {
    it(`${name} matches the gate table`, () => {
      expect(distanceTo(definitionMatrix(name), tableMatrix(name))).toBeLessThan(1e-12);
    });
    const ref = REFERENCE[name];
    if (ref) {
      it(`${name} matches an independent mathjs reference`, () => {
        expect(distanceTo(definitionMatrix(name), ref())).toBeLessThan(1e-12);
      });
    }
  }

  it("rccx is a Toffoli up to a diagonal of relative phases (common practice, no source)", () => {
    const u = definitionMatrix("rccx");
    // On the basis states, |abc> -> phase * |a, b, c xor (a and b)>.
    for (let col = 0; col < 8; col++) {
      const a = (col >> 2) & 1;
      const b = (col >> 1) & 1;
      const row = col ^ (a & b);
      expect(Math.hypot(u.re[row * 8 + col]!, u.im[row * 8 + col]!)).toBeCloseTo(1, 12);
    }
    void CX;
  });

  it("names every canonical gate stdgates.inc lacks (besides the builtins and u1)", () => {
    const missing = ["sxdg", "csx", "c3x", "c4x", "c3sqrtx", "c3sqrtxdg", "rxx", "ryy", "rzz", "rzx", "rccx", "rc3x", "rc3xdg"];
    expect([...definedGates()].sort()).toEqual(missing.sort());
  });

  it("compares definition texts ignoring blanks only", () => {
    expect(sameDefinitionText("gate a q { x q; }", "gate  a q {\n  x q;\n}")).toBe(true);
    expect(sameDefinitionText("gate a q { x q; }", "gate a q { y q; }")).toBe(false);
  });
});
