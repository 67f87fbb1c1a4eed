import { describe, expect, it } from "vitest";
import { mkdtempSync, mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { complex, matrix, multiply, transpose, conj, type Matrix } from "mathjs";
import { parseQasmFile, parseQasmText, type FrontendOptions } from "../../src/frontend/frontend.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import { formatAngle } from "../../src/emit/qasm3.js";
import { circuitMatrix, distanceTo, M } from "./helpers.js";

const std = (src: string, opts?: FrontendOptions): Circuit => parseQasmText(`OPENQASM 3.0;\ninclude "stdgates.inc";\n${src}`, "t.qasm", opts);

/** Gate operations as compact strings: "ctrl@negctrl@name(params) q0,q1". */
function ops(body: readonly Stmt[]): string[] {
  return body.map((s) => {
    if (s.kind !== "gate") return s.kind;
    const pre = s.ctrl.map((c) => (c ? "ctrl@" : "negctrl@")).join("");
    const ps = s.params.length > 0 ? `(${s.params.map(formatAngle).join(",")})` : "";
    return `${pre}${s.name}${ps} ${s.qubits.join(",")}`;
  });
}

function diag(f: () => unknown): { line: number; col: number; message: string; hint?: string } {
  try {
    f();
  } catch (e) {
    if (e instanceof DiagnosticError) return e.diagnostics[0]!;
    throw e;
  }
  throw new Error("expected a diagnostic");
}

describe("operands", () => {
  it("broadcasts a one-qubit gate over a register, in order", () => {
    expect(ops(std("qubit[3] q; h q;").body)).toEqual(["h 0", "h 1", "h 2"]);
  });
  it("broadcasts registers of equal size element by element, and a single qubit against a register", () => {
    expect(ops(std("qubit[2] a; qubit[2] b; cx a, b;").body)).toEqual(["cx 0,2", "cx 1,3"]);
    expect(ops(std("qubit[3] q; qubit[2] r; cx q[1], r;").body)).toEqual(["cx 1,3", "cx 1,4"]);
  });
  it("reads slices with the end included, steps, negative indices and index sets", () => {
    const c = std("qubit[6] q; x q[1:3]; x q[0:2:4]; x q[-1]; x q[{3, 1}]; x q[4:]; x q[:1]; x q[5:-2:1];");
    expect(ops(c.body)).toEqual(["x 1", "x 2", "x 3", "x 0", "x 2", "x 4", "x 5", "x 3", "x 1", "x 4", "x 5", "x 0", "x 1", "x 5", "x 3", "x 1"]);
  });
  it("aliases parts of registers and their concatenation with let", () => {
    const c = std("qubit[2] q; qubit[3] r; let a = q[0:1] ++ r[2]; x a; h a[2]; let b = r[1]; z b;");
    expect(ops(c.body)).toEqual(["x 0", "x 1", "x 4", "h 4", "z 3"]);
  });
  it("counts qubits in declaration order across registers", () => {
    const c = std("qubit a; qubit[2] b; qreg c[3]; x c[2];");
    expect(c.numQubits).toBe(6);
    expect(c.qubitRegs).toEqual([
      { name: "a", start: 0, size: 1 },
      { name: "b", start: 1, size: 2 },
      { name: "c", start: 3, size: 3 },
    ]);
    expect(ops(c.body)).toEqual(["x 5"]);
  });
  it("rejects a qubit used twice, naming it", () => {
    const d = diag(() => std("qubit[2] q; qubit r; cx q, q[1];"));
    expect(d.message).toBe("qubit q[1] is used twice in one gate call");
  });
  it("rejects indexing a single qubit", () => {
    expect(diag(() => std("qubit a; x a[0];")).message).toBe("'a' is a single qubit and cannot be indexed");
  });
});

describe("modifiers and gate definitions match the OpenQASM 3 matrices", () => {
  // Reference matrices are built from the specification's definitions with mathjs (test/frontend/helpers.ts).
  const cases: [string, string, Matrix][] = [
    ["inv @ pow(2) @ ctrl @ rx", "qubit[2] q; inv @ pow(2) @ ctrl @ rx(0.25) q[0], q[1];", M.ctrl(M.rot(M.X, -0.5), [true])],
    ["ctrl @ negctrl @ h", "qubit[3] q; ctrl @ negctrl @ h q[0], q[1], q[2];", M.ctrl(M.H, [true, false])],
    ["negctrl @ gphase", "qubit q; negctrl @ gphase(0.7) q;", matrix([[complex({ r: 1, phi: 0.7 }), 0], [0, 1]])],
    ["ctrl @ gphase on one of two qubits", "qubit[2] q; ctrl @ gphase(0.3) q[0];", M.kron(M.p(0.3), M.I)],
    ["ctrl @ negctrl @ gphase", "qubit[2] q; ctrl @ negctrl @ gphase(0.9) q[0], q[1];", M.ctrl(matrix([[complex({ r: 1, phi: 0.9 }), 0], [0, 1]]), [true])],
    ["pow(1/2) @ x is sx", "qubit q; pow(1/2) @ x q;", multiply(0.5, matrix([[complex(1, 1), complex(1, -1)], [complex(1, -1), complex(1, 1)]])) as Matrix],
    ["pow(-1) @ t", "qubit q; pow(-1) @ t q;", M.p(-Math.PI / 4)],
    ["ctrl(2) @ x", "qubit[3] q; ctrl(2) @ x q[0], q[1], q[2];", M.ctrl(M.X, [true, true])],
    ["ctrl(2) @ negctrl @ z", "qubit[4] q; ctrl(2) @ negctrl @ z q[0], q[1], q[2], q[3];", M.ctrl(M.Z, [true, true, false])],
    ["pow(3) @ h", "qubit q; pow(3) @ h q;", M.H],
    ["pow(0.5) @ ctrl @ rz", "qubit[2] q; pow(0.5) @ ctrl @ rz(0.8) q[0], q[1];", M.ctrl(M.rot(M.Z, 0.4), [true])],
    ["pow(1/2) @ cx is a controlled sx", "qubit[2] q; pow(1/2) @ cx q[0], q[1];", M.ctrl(multiply(0.5, matrix([[complex(1, 1), complex(1, -1)], [complex(1, -1), complex(1, 1)]])) as Matrix, [true])],
    [
      "inv @ a user gate",
      "qubit[2] q; gate g a, b { h a; cx a, b; t b; } inv @ g q[0], q[1];",
      conj(transpose(M.mul(M.kron(M.I, M.T), M.ctrl(M.X, [true]), M.kron(M.H, M.I)))) as Matrix,
    ],
    [
      "ctrl @ a user gate with a global phase in its body",
      "qubit[2] q; gate g(t) a { gphase(t); rz(t) a; } ctrl @ g(0.4) q[0], q[1];",
      M.ctrl(M.phase(0.4, M.rot(M.Z, 0.4)), [true]),
    ],
    [
      "ctrl @ u3 keeps stdgates' phase",
      "qubit[2] q; ctrl @ u3(0.1, 0.2, 0.3) q[0], q[1];",
      // stdgates.inc: u3(t,f,l) = gphase(-(f+l)/2) U(t,f,l); U from the specification.
      M.ctrl(
        M.phase(
          -0.25,
          matrix([
            [Math.cos(0.05), multiply(-Math.sin(0.05), complex({ r: 1, phi: 0.3 }))],
            [multiply(Math.sin(0.05), complex({ r: 1, phi: 0.2 })), multiply(Math.cos(0.05), complex({ r: 1, phi: 0.5 }))],
          ] as never),
        ),
        [true],
      ),
    ],
    ["a subroutine inlined", "qubit[2] q; def prep(angle a, qubit x, qubit y) { ry(a) x; cx x, y; } prep(0.5, q[1], q[0]);", M.mul(matrix([[1, 0, 0, 0], [0, 0, 0, 1], [0, 0, 1, 0], [0, 1, 0, 0]]), M.kron(M.I, M.rot(M.Y, 0.5)))],
  ];
  for (const [name, src, ref] of cases) {
    it(name, () => {
      expect(distanceTo(circuitMatrix(std(src)), ref)).toBeLessThan(1e-12);
    });
  }

  it("keeps qelib1's relative phase of rzz under ctrl @", () => {
    // qelib1.inc: rzz(t) a,b = cx a,b; u1(t) b; cx a,b  (from memory of the library), built here with mathjs.
    const cx = M.ctrl(M.X, [true]);
    const rzzQelib = M.mul(cx, M.kron(M.I, M.p(0.6)), cx);
    const c = parseQasmText('OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[3];\nctrl @ rzz(0.6) q[0], q[1], q[2];', "t.qasm");
    expect(distanceTo(circuitMatrix(c), M.ctrl(rzzQelib, [true]))).toBeLessThan(1e-12);
    // Uncontrolled, the phase is dropped: the op is the canonical rzz alone.
    const u = parseQasmText('OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nrzz(0.6) q[0], q[1];', "t.qasm");
    expect(ops(u.body)).toEqual(["rzz(0.6) 0,1"]);
  });

  it("canonicalises controls into the gate's controlled name", () => {
    const c = std("qubit[6] q; ctrl @ x q[0], q[1]; ctrl @ cx q[0], q[1], q[2]; ctrl @ p(0.5) q[0], q[1]; negctrl @ cx q[0], q[1], q[2]; ctrl @ negctrl @ x q[0], q[1], q[2]; ctrl(5) @ x q[0], q[1], q[2], q[3], q[4], q[5];");
    // ctrl(5) @ x: the four controls nearest the target go into c4x (the largest multi-controlled x).
    expect(ops(c.body)).toEqual(["cx 0,1", "ccx 0,1,2", "cp(0.5) 0,1", "negctrl@cx 0,1,2", "ctrl@negctrl@x 0,1,2", "ctrl@c4x 0,1,2,3,4,5"]);
  });

  it("resolves a fractional power of a rotation exactly", () => {
    expect(ops(std("qubit q; pow(1/3) @ rz(pi/2) q; pow(-2) @ rx(3*pi/8) q;").body)).toEqual(["rz(pi/6) 0", "rx(-3*pi/4) 0"]);
  });

  it("repeats a user gate for an integer power, inverted for a negative one", () => {
    expect(ops(std("qubit[2] q; gate g a, b { h a; s b; } pow(2) @ g q[0], q[1]; pow(-1) @ g q[0], q[1];").body)).toEqual([
      "h 0",
      "s 1",
      "h 0",
      "s 1",
      "sdg 1",
      "h 0",
    ]);
  });

  it("expands a gate body once per distinct parameters (no stale cache)", () => {
    expect(ops(std("qubit q; gate r(t) a { rz(2*t) a; } r(0.1) q; r(0.2) q; r(0.1) q;").body)).toEqual(["rz(0.2) 0", "rz(0.4) 0", "rz(0.2) 0"]);
  });

  it("only lets a gate body call gates defined before it", () => {
    const d = diag(() => std("qubit q; gate a x { b x; } gate b x { h x; }"));
    expect(d.message).toBe("unknown gate 'b'");
  });
});

describe("loops, conditions and classical values", () => {
  it("unrolls ranges (end included, negative steps), sets and registers", () => {
    const c = std("qubit[4] q; for uint i in [3:-2:0] { x q[i]; } for int k in {2, 0} { h q[k]; } for qubit w in q[1:2] { z w; }");
    expect(ops(c.body)).toEqual(["x 3", "x 1", "h 2", "h 0", "z 1", "z 2"]);
  });
  it("honours break and continue in unrolled loops", () => {
    const c = std("qubit[5] q; for uint i in [0:4] { if (i == 1) { continue; } if (i == 3) { break; } x q[i]; }");
    expect(ops(c.body)).toEqual(["x 0", "x 2"]);
  });
  it("gives each iteration its own scope", () => {
    const c = std("qubit[2] q; for uint i in [0:1] { const angle a = pi * (i + 1) / 4; rz(a) q[i]; }");
    expect(ops(c.body)).toEqual(["rz(pi/4) 0", "rz(pi/2) 1"]);
  });
  it("tracks mutable classical variables at compile time", () => {
    const c = std("qubit q; angle a = 0; for uint i in [1:3] { a += pi / 8; rz(a) q; } int n = 7; n = n % 4; rx(n * 0.5) q;");
    expect(ops(c.body)).toEqual(["rz(pi/8) 0", "rz(pi/4) 0", "rz(3*pi/8) 0", "rx(1.5) 0"]);
  });
  it("folds conditions known at compile time and keeps run-time ones as blocks", () => {
    const c = std("qubit[2] q; bit[2] c; const int n = 3; if (n > 2) { x q[0]; } else { y q[0]; } c = measure q; if (c[0] == 1 && c != 2) { h q[1]; } while (!c[1]) { x q[1]; c[1] = measure q[1]; }");
    const kinds = c.body.map((s) => s.kind);
    expect(kinds).toEqual(["gate", "measure", "measure", "if", "while"]);
    const iff = c.body[3] as Extract<Stmt, { kind: "if" }>;
    expect(iff.cond).toEqual({
      k: "binary",
      op: "&&",
      l: { k: "binary", op: "==", l: { k: "bit", bit: { reg: "c", index: 0 } }, r: { k: "int", value: 1n } },
      r: { k: "binary", op: "!=", l: { k: "reg", reg: "c" }, r: { k: "int", value: 2n } },
    });
    const wh = c.body[4] as Extract<Stmt, { kind: "while" }>;
    expect(wh.cond).toEqual({ k: "unary", op: "!", e: { k: "bit", bit: { reg: "c", index: 1 } } });
    expect(ops(wh.body)).toEqual(["x 1", "measure"]);
  });
  it("loops over a bit register for conditions", () => {
    const c = std("qubit[2] q; bit[2] c; c = measure q; for bit b in c { if (b) { x q[0]; } }");
    const ifs = c.body.filter((s): s is Extract<Stmt, { kind: "if" }> => s.kind === "if");
    expect(ifs.map((s) => s.cond)).toEqual([
      { k: "bit", bit: { reg: "c", index: 0 } },
      { k: "bit", bit: { reg: "c", index: 1 } },
    ]);
  });
  it("binds inputs from parameters and names an unbound one", () => {
    const src = "input float theta; input int n; qubit q; for uint i in [1:n] { rz(theta) q; }";
    expect(ops(std(src, { params: { theta: "pi/3", n: "2" } }).body)).toEqual(["rz(pi/3) 0", "rz(pi/3) 0"]);
    expect(diag(() => std(src, { params: { n: "1" } })).message).toBe("input 'theta' has no value");
    expect(diag(() => std(src, { params: { theta: "1", n: "1", phi: "2" } })).message).toBe("'phi' is not an input of the program");
    expect(diag(() => std(src, { params: { theta: "1", n: "0.5" } })).message).toMatch(/expected an integer/);
    expect(diag(() => std(src, { params: { theta: "1 +", n: "1" } })).message).toMatch(/^unexpected '\+'/);
  });
  it("stops at the operation limit with a diagnostic", () => {
    const d = diag(() => std("qubit q; for uint i in [0:1000] { h q; }", { maxOps: 500 }));
    expect(d.message).toMatch(/too large/);
  });
});

describe("statements that pass through", () => {
  it("keeps measure, reset, barrier, delay, box, pragmas and annotations in order", () => {
    const c = std("qubit[2] q; bit c;\npragma lab.note hello\n@lab.tag x\nh q[0];\nbarrier;\nbarrier q[1], q[0], q[1];\ndelay[50ns] q[0];\nbox[1us] { reset q[1]; }\nmeasure q[0] -> c;\nmeasure q[1];");
    expect(c.body.map((s) => s.kind)).toEqual(["pragma", "annotation", "gate", "barrier", "barrier", "delay", "box", "measure", "measure"]);
    expect(c.body[0]).toMatchObject({ text: "lab.note hello" });
    expect(c.body[1]).toMatchObject({ text: "lab.tag x" });
    expect(c.body[3]).toMatchObject({ qubits: [0, 1] });
    expect(c.body[4]).toMatchObject({ qubits: [1, 0] });
    expect(c.body[5]).toMatchObject({ duration: "50ns", qubits: [0] });
    expect(c.body[6]).toMatchObject({ duration: "1us", body: [{ kind: "reset", qubit: 1 }] });
    expect(c.body[7]).toMatchObject({ qubit: 0, bit: { reg: "c", index: 0 } });
    expect(c.body[8]).toMatchObject({ qubit: 1, bit: null });
  });
  it("reads OpenQASM 2.0 builtins U and CX", () => {
    const c = parseQasmText("OPENQASM 2.0;\nqreg q[2];\nU(pi, 0, pi) q[0];\nCX q[0], q[1];", "t.qasm");
    expect(ops(c.body)).toEqual(["U(pi,0,pi) 0", "cx 0,1"]);
  });
});

describe("locations and includes", () => {
  it("gives every operation its statement's file, line and column, and inlined ones the call site", () => {
    const c = std("qubit[2] q;\ngate g a { h a; x a; }\n  g q[1];\ndef f(qubit a) { z a; }\nf(q[0]);");
    expect(c.body.map((s) => (s as { loc: unknown }).loc)).toEqual([
      { file: "t.qasm", line: 5, col: 3 },
      { file: "t.qasm", line: 5, col: 3 },
      { file: "t.qasm", line: 7, col: 1 },
    ]);
  });
  it("finds includes next to the including file first, then in -I folders in order", () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-inc-"));
    mkdirSync(join(dir, "a"));
    mkdirSync(join(dir, "b"));
    writeFileSync(join(dir, "a", "g.inc"), "gate g q { x q; }\n");
    writeFileSync(join(dir, "b", "g.inc"), "gate g q { y q; }\n");
    writeFileSync(join(dir, "main.qasm"), 'include "stdgates.inc";\ninclude "g.inc";\nqubit q;\ng q;\n');
    expect(ops(parseQasmFile(join(dir, "main.qasm"), { includeDirs: [join(dir, "b"), join(dir, "a")] }).body)).toEqual(["y 0"]);
    writeFileSync(join(dir, "g.inc"), "gate g q { z q; }\n");
    expect(ops(parseQasmFile(join(dir, "main.qasm"), { includeDirs: [join(dir, "b")] }).body)).toEqual(["z 0"]);
  });
  it("locates diagnostics inside an included file there", () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-inc-"));
    writeFileSync(join(dir, "bad.inc"), "// helper\ngate g q { nosuch q; }\n");
    writeFileSync(join(dir, "main.qasm"), 'include "stdgates.inc";\ninclude "bad.inc";\n');
    try {
      parseQasmFile(join(dir, "main.qasm"));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(DiagnosticError);
      const d = (e as DiagnosticError).diagnostics[0]!;
      expect([d.file, d.line, d.col, d.message]).toEqual([join(dir, "bad.inc"), 2, 12, "unknown gate 'nosuch'"]);
    }
  });
});

void complex;
