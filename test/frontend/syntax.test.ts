import { describe, expect, it } from "vitest";
import { parseQasmText } from "../../src/frontend/frontend.js";
import { DiagnosticError, type Diagnostic } from "../../src/frontend/diagnostics.js";
import { readStatements } from "../../src/frontend/syntax.js";
import type { Stmt } from "../../src/ir/circuit.js";

function diag(text: string): Diagnostic {
  try {
    parseQasmText(text, "s.qasm");
  } catch (e) {
    if (e instanceof DiagnosticError) return e.diagnostics[0]!;
    throw e;
  }
  throw new Error("no diagnostic");
}

const STD = 'include "stdgates.inc";\n';

describe("syntax errors", () => {
  it("say where and what was expected", () => {
    const cases: [string, number, number, string][] = [
      [`${STD}qubit q;\nrz(0.1 q;`, 3, 8, "unexpected 'q'; expected ')', ',' or an operator"],
      [`${STD}qubit q;\nh q`, 3, 4, "unexpected end of file; expected ';'"],
      [`${STD}qubit q;\nif (true { h q; }`, 3, 10, "unexpected '{'; expected ')'"],
      [`${STD}gate g a {\n  h a;\n`, 4, 1, "unexpected end of file; expected a statement or '}'"],
      [`${STD}qubit q;\nh q;;`, 3, 5, "unexpected ';'; expected a statement"],
      [`${STD}qubit q;\nh q ~;`, 3, 5, "unexpected '~'; expected ';'"],
      [`${STD}qubit q;\nh q €;`, 3, 5, "unexpected character '€'; expected ';'"],
      [`OPENQASM 3.0;\ninclude "stdgates.inc;\n`, 2, 9, "unterminated string"],
      [`${STD}qubit q; /* never closed\nh q;`, 2, 10, "unterminated comment"],
      [`${STD}let = q;`, 2, 5, "unexpected '='; expected an identifier"],
    ];
    for (const [text, line, col, message] of cases) {
      const d = diag(text);
      expect([d.line, d.col, d.message], JSON.stringify(text)).toEqual([line, col, message]);
    }
  });

  it("count columns in characters: tabs and non-ASCII letters are one column each", () => {
    expect(diag(`${STD}qubit q;\n\t\trz(0.1 q;`)).toMatchObject({ line: 3, col: 10 });
    expect(diag(`${STD}qubit q; /* ππ */ rz(0.1 q;`)).toMatchObject({ line: 2, col: 26 });
    expect(diag(`${STD}qubit q; /* 😀 */ rz(0.1 q;`)).toMatchObject({ line: 2, col: 25 });
    expect(diag(`${STD}qubit θ; rz(0.1 θ;`)).toMatchObject({ line: 2, col: 17 });
  });

  it("reads unicode names and constants", () => {
    const c = parseQasmText(`${STD}qubit θ; rz(π/4) θ; rx(τ/8) θ; ry(ℇ - ℇ) θ;`, "u.qasm");
    expect(c.qubitRegs[0]!.name).toBe("θ");
    expect(c.body.map((s) => (s.kind === "gate" ? s.params[0]!.pi : null))).toEqual([
      { num: 1n, den: 4n },
      { num: 1n, den: 4n },
      { num: 0n, den: 1n },
    ]);
  });
});

describe("statements longer than the parser's first window", () => {
  it("parse a long gate definition and a long if/else whole", () => {
    const body = Array.from({ length: 600 }, (_, i) => `rz(${i}.5) a;`).join(" ");
    const c = parseQasmText(`${STD}qubit q;\ngate long a { ${body} }\nlong q;\n`, "l.qasm");
    expect(c.body.length).toBe(600);
    const thenPart = Array.from({ length: 700 }, () => "h q;").join("\n");
    const c2 = parseQasmText(`${STD}qubit q;\nbit b;\nb = measure q;\nif (b) {\n${thenPart}\n} else {\n  x q;\n}\n`, "l2.qasm");
    const iff = c2.body[1] as Extract<Stmt, { kind: "if" }>;
    expect(iff.then.length).toBe(700);
    expect(iff.else.length).toBe(1);
  });

  it("report an error beyond the first window at its true place", () => {
    const filler = Array.from({ length: 900 }, () => "h a;").join(" ");
    const d = diag(`${STD}gate g a { ${filler} h a a; }`);
    expect(d).toMatchObject({ line: 2, col: 12 + 900 * 5 + 4, message: "unexpected 'a'; expected ';'" });
  });
});

describe("pragmas, annotations and the '@' of modifiers", () => {
  it("reads an '@' first on its line as an annotation, elsewhere as a modifier", () => {
    const c = parseQasmText(`${STD}qubit[2] q;\n  @lab.check strict\nctrl @x q[0], q[1];\n#pragma lab layout 2\npragma\n`, "a.qasm");
    expect(c.body.map((s) => s.kind)).toEqual(["annotation", "gate", "pragma", "pragma"]);
    expect(c.body[0]).toMatchObject({ text: "lab.check strict" });
    expect(c.body[1]).toMatchObject({ name: "cx" });
    expect(c.body[2]).toMatchObject({ text: "lab layout 2" });
    expect(c.body[3]).toMatchObject({ text: "" });
  });

  it("hands statements out one at a time, in order", () => {
    const it = readStatements({ file: "r.qasm", text: "h q;\nqubit[2] r;\n// c\nx r[1];" });
    expect(it.next().value).toMatchObject({ k: "call", name: "h", pos: { line: 1, col: 1 } });
    expect(it.next().value).toMatchObject({ k: "qubit", name: "r", pos: { line: 2, col: 1 } });
    expect(it.next().value).toMatchObject({ k: "call", name: "x", pos: { line: 4, col: 1 } });
    expect(it.next().done).toBe(true);
  });
});

describe("deeply nested input", () => {
  it("is a diagnostic, not a crash", () => {
    const deep = "(".repeat(20000) + "1" + ")".repeat(20000);
    const d = diag(`${STD}qubit q;\nrz(${deep}) q;`);
    expect(d).toMatchObject({ line: 3, col: 1 });
    expect(d.message).toMatch(/nested too deeply/);
    const gates = Array.from({ length: 3000 }, (_, i) => (i === 0 ? "gate g0 a { x a; }" : `gate g${i} a { g${i - 1} a; }`)).join("\n");
    const d2 = diag(`${STD}qubit q;\n${gates}\ng2999 q;`);
    expect(d2.message).toMatch(/nested too deeply|too large/);
  });
});
