import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { parseQasmText } from "../../src/frontend/frontend.js";
import { formatAngle, writeQasm3 } from "../../src/emit/qasm3.js";
import { anglePi, angleDecimal, angleReal, rational, angleEq } from "../../src/ir/angle-ops.js";
import { dec } from "../../src/numeric/decimal.js";
import type { Angle } from "../../src/ir/angle.js";
import type { Circuit, CondExpr, Stmt } from "../../src/ir/circuit.js";
import { withoutLocations } from "../frontend/helpers.js";

const loc = { file: "x", line: 1, col: 1 };

/** Read an angle back as the front end would: `rz(<text>) q;`. */
function readAngle(text: string): Angle {
  const c = parseQasmText(`include "stdgates.inc";\nqubit q;\nrz(${text}) q;`, "a.qasm");
  const g = c.body[0]!;
  if (g.kind !== "gate") throw new Error("no gate");
  return g.params[0]!;
}

describe("angles", () => {
  it("writes exact pi-multiples as num*pi/den", () => {
    expect(formatAngle(anglePi(rational(3n, 8n)))).toBe("3*pi/8");
    expect(formatAngle(anglePi(rational(-1n, 4n)))).toBe("-pi/4");
    expect(formatAngle(anglePi(rational(2n, 1n)))).toBe("2*pi");
    expect(formatAngle(anglePi(rational(-1n, 1n)))).toBe("-pi");
    expect(formatAngle(anglePi(rational(0n, 1n)))).toBe("0");
  });

  it("reads back every exact pi-multiple exactly", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(10n ** 12n), max: 10n ** 12n }), fc.bigInt({ min: 1n, max: 10n ** 12n }), (n, d) => {
        const a = anglePi(rational(n, d));
        const b = readAngle(formatAngle(a));
        expect(b).toEqual(a);
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it("reads back decimal values to the same string, including exponent forms", () => {
    fc.assert(
      fc.property(fc.integer({ min: -999999, max: 999999 }), fc.integer({ min: -30, max: 30 }), (m, e) => {
        fc.pre(m !== 0);
        const a = angleDecimal(`${m}e${e}`);
        const b = readAngle(formatAngle(a));
        expect(b).toEqual(a);
      }),
      { numRuns: 200, seed: 11 },
    );
    const third = angleReal(dec(1).div(3));
    expect(readAngle(formatAngle(third))).toEqual(third);
    expect(angleEq(readAngle("0.1 + 0.2"), angleDecimal("0.3"))).toBe(true);
  });
});

function circuit(body: Stmt[], extra: Partial<Circuit> = {}): Circuit {
  return { numQubits: 3, qubitRegs: [{ name: "q", start: 0, size: 3 }], bits: [{ name: "c", size: 2, scalar: false }, { name: "f", size: 1, scalar: true }], body, ...extra };
}

describe("writer", () => {
  it("writes header, declarations, modifiers, measurements and blocks", () => {
    const body: Stmt[] = [
      { kind: "gate", name: "x", params: [], qubits: [0, 1, 2], ctrl: [true, false], loc },
      { kind: "gate", name: "h", params: [], qubits: [0, 1, 2], ctrl: [false, false], loc },
      { kind: "gate", name: "gphase", params: [anglePi(rational(1n, 2n))], qubits: [], ctrl: [], loc },
      { kind: "measure", qubit: 2, bit: { reg: "f", index: 0 }, loc },
      { kind: "measure", qubit: 1, bit: { reg: "c", index: 1 }, loc },
      { kind: "barrier", qubits: [0, 1, 2], loc },
      { kind: "if", cond: { k: "bit", bit: { reg: "f", index: 0 } }, then: [{ kind: "reset", qubit: 0, loc }], else: [{ kind: "pragma", text: "p q", loc }], loc },
    ];
    const text = writeQasm3(circuit(body));
    expect(text).toBe(
      [
        "OPENQASM 3.0;",
        'include "stdgates.inc";',
        "qubit[3] q;",
        "bit[2] c;",
        "bit f;",
        "ctrl @ negctrl @ x q[0], q[1], q[2];",
        "negctrl(2) @ h q[0], q[1], q[2];",
        "gphase(pi/2);",
        "f = measure q[2];",
        "c[1] = measure q[1];",
        "barrier q;",
        "if (f) {",
        "  reset q[0];",
        "} else {",
        "  pragma p q",
        "}",
        "",
      ].join("\n"),
    );
    expect(withoutLocations(parseQasmText(text, "w.qasm"))).toEqual(withoutLocations(circuit(body)));
  });

  it("parenthesises conditions so that they read back as the same tree", () => {
    const bit = (i: number): CondExpr => ({ k: "bit", bit: { reg: "c", index: i } });
    const conds: CondExpr[] = [
      { k: "binary", op: "==", l: { k: "reg", reg: "c" }, r: { k: "int", value: -3n } },
      { k: "unary", op: "!", e: { k: "binary", op: "&&", l: bit(0), r: bit(1) } },
      { k: "binary", op: "||", l: { k: "binary", op: "&&", l: bit(0), r: { k: "unary", op: "~", e: bit(1) } }, r: { k: "binary", op: "<", l: { k: "reg", reg: "c" }, r: { k: "int", value: 2n } } },
      { k: "binary", op: "**", l: { k: "unary", op: "-", e: { k: "reg", reg: "c" } }, r: { k: "int", value: 2n } },
      { k: "binary", op: "-", l: { k: "reg", reg: "c" }, r: { k: "binary", op: "-", l: bit(0), r: bit(1) } },
    ];
    for (const cond of conds) {
      const c = circuit([{ kind: "while", cond, body: [{ kind: "gate", name: "x", params: [], qubits: [0], ctrl: [], loc }], loc }]);
      expect(withoutLocations(parseQasmText(writeQasm3(c), "c.qasm"))).toEqual(withoutLocations(c));
    }
  });

  it("calls the comment hook before every statement, nested ones too", () => {
    const body: Stmt[] = [
      { kind: "gate", name: "t", params: [], qubits: [0], ctrl: [], loc },
      { kind: "box", duration: "10ns", body: [{ kind: "gate", name: "s", params: [], qubits: [1], ctrl: [], loc }], loc },
    ];
    const text = writeQasm3(circuit(body), { commentBefore: (s) => (s.kind === "gate" ? `T-cost of ${s.name}\nsecond line` : undefined) });
    expect(text).toContain("// T-cost of t\n// second line\nt q[0];\n");
    expect(text).toContain("box[10ns] {\n  // T-cost of s\n  // second line\n  s q[1];\n}");
  });

  it("declares one register with flatQubits, and an extra one for qubits outside the registers", () => {
    const body: Stmt[] = [{ kind: "gate", name: "cx", params: [], qubits: [0, 3], ctrl: [], loc }];
    const flat = writeQasm3({ numQubits: 4, qubitRegs: [{ name: "a", start: 0, size: 2 }, { name: "b", start: 2, size: 2 }], bits: [], body }, { flatQubits: true });
    expect(flat).toContain("qubit[4] q;\ncx q[0], q[3];");
    const extra = writeQasm3({ numQubits: 4, qubitRegs: [{ name: "a", start: 0, size: 2 }], bits: [], body });
    expect(extra).toContain("qubit[2] a;\nqubit[2] anc;\ncx a[0], anc[1];");
  });

  it("writes u1 as p (the same matrix) and refuses a gate it does not know", () => {
    const u1 = writeQasm3(circuit([{ kind: "gate", name: "u1", params: [angleDecimal("0.5")], qubits: [0], ctrl: [], loc }]));
    expect(u1).toContain("p(0.5) q[0];");
    expect(() => writeQasm3(circuit([{ kind: "gate", name: "frobnicate", params: [], qubits: [0], ctrl: [], loc }]))).toThrow(RangeError);
  });

  it("is deterministic and handles a large circuit", () => {
    const body: Stmt[] = [];
    const angles = [angleDecimal("0.1"), anglePi(rational(1n, 8n)), angleDecimal("-2.5e-7")];
    for (let i = 0; i < 100_000; i++) body.push({ kind: "gate", name: i % 2 ? "rz" : "cx", params: i % 2 ? [angles[i % 3]!] : [], qubits: i % 2 ? [i % 3] : [i % 3, (i + 1) % 3], ctrl: [], loc });
    const a = writeQasm3(circuit(body));
    const b = writeQasm3(circuit(body));
    expect(a).toBe(b);
    expect(a.split("\n").length).toBe(100_000 + 6);
  });
});
