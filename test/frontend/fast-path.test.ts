import { seededRng } from "../../src/numeric/prng.js";
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { fastStatement } from "../../src/frontend/fast-path.js";
import { parseStatementAt, readStatements, skipLayout, type Cursor, type SourceText } from "../../src/frontend/syntax.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import type { Stmt } from "../../src/frontend/ast.js";
import { GOOD } from "./helpers.js";

const START: Cursor = { i: 0, line: 1, col: 1 };

/** The generated parser's reading of the statement at the start of `text`, or null on a syntax error. */
function slow(text: string): { stmt: Stmt; next: Cursor } | null {
  try {
    return parseStatementAt({ file: "s.qasm", text }, skipLayout(text, START));
  } catch (e) {
    if (e instanceof DiagnosticError) return null;
    throw e;
  }
}

/** Whenever the fast path accepts, it must agree with the generated parser exactly. */
function agree(text: string): boolean {
  const at = skipLayout(text, START);
  const fast = fastStatement(text, at);
  if (!fast) return false;
  const ref = slow(text);
  expect(ref, `generated parser rejects ${JSON.stringify(text)}`).not.toBeNull();
  expect(fast.stmt, JSON.stringify(text)).toEqual(ref!.stmt);
  expect(fast.next, JSON.stringify(text)).toEqual(ref!.next);
  return true;
}

/** Seeded floats in [0, 1) from the project's one generator (numeric/prng.ts). */
function rng(seed: number): () => number {
  const g = seededRng(seed);
  return () => g.nextFloat();
}

describe("fast path agrees with the generated parser", () => {
  it("accepts the common forms", () => {
    const common = [
      "h q;",
      "rz(0.5) q[3];",
      "cx a[0], b[1];",
      "ry(-pi/7) q[11];",
      "rz(3*pi/16) q[0];",
      "rx(--0.25) q[0];",
      "U(pi, 0, pi) q[0];",
      "ctrl @ x q[0], q[1];",
      "inv @ pow(2) @ negctrl(2) @ rz(1e-3) a, b, c;",
      "gphase(pi/4);",
      "ctrl @ gphase(0.5) q[0];",
      "measure q[0] -> c[0];",
      "measure q;",
      "c[1] = measure q[2];",
      "c = measure q;",
      "reset q[4];",
      "barrier q, r;",
      "barrier;",
      "  h\tq[ 2 ]\n ;",
      "rz( 1.5e+2 - (0.5 / 2) * .25 ) q;",
    ];
    for (const s of common) expect(agree(s), s).toBe(true);
  });

  it("declines what it does not cover (and the generated parser decides)", () => {
    const declined = [
      "rz(2 im) q;",
      "h q[1_0];",
      "rz(1e) q;",
      "ctrl\n@ x a, b;",
      "h pragma_q q;",
      "rz(2**3) q;",
      "rz(sin(0.1)) q;",
      "h q[i];",
      "h q[1:2];",
      "h $0;",
      "rz(0x1F) q;",
      "rz(5ns) q;",
      "h q /* c */;",
      "h q,;",
      "h() q;",
      "rz(π) q;",
      "x = 1;",
      "c == measure q;",
      "h[10ns] q;",
      "measure q - > c;",
      "gate g a { h a; }",
      "rz(1 % 2) q;",
      "rz(+1) q;",
      "rz(a[0]) q;",
    ];
    for (const s of declined) expect(fastStatement(s, START), s).toBeNull();
  });

  it("agrees on thousands of generated statements", () => {
    const next = rng(20250101);
    const pick = <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)]!;
    const ws = [" ", "", "  ", "\t", "\n", " \n  ", "\r\n"];
    const names = ["h", "rz", "cx", "U", "inv", "pow", "ctrl", "measure", "reset", "barrier", "gphase", "pragma", "qubit", "x1", "_g", "true", "in", "CX"];
    const atoms = ["0", "1", "0.5", ".5", "1.", "1e-3", "2.5E+4", "1_0", "0x1F", "2ns", "3 im", "pi", "tau", "θ", "euler", "a", "in", "true"];
    const ops = ["+", "-", "*", "/", "**", "%", "^", "==", "+=", "->"];
    const expr = (depth: number): string => {
      const r = next();
      if (depth > 2 || r < 0.4) return pick(atoms);
      if (r < 0.55) return `-${pick(ws)}${expr(depth + 1)}`;
      if (r < 0.7) return `(${pick(ws)}${expr(depth + 1)}${pick(ws)})`;
      return `${expr(depth + 1)}${pick(ws)}${pick(ops)}${pick(ws)}${expr(depth + 1)}`;
    };
    const operand = (): string => {
      const r = next();
      const n = pick(["q", "r", "c", "gate", "q2"]);
      if (r < 0.4) return n;
      if (r < 0.8) return `${n}${pick(ws)}[${pick(ws)}${pick(["0", "3", "12", "1_0", "i", "1:2", "-1"])}${pick(ws)}]`;
      return pick(["$0", "q[{0,1}]", "q[0][1]"]);
    };
    const modifier = (): string => pick(["inv", "pow(2)", "pow(-1/2)", "ctrl", "ctrl(2)", "negctrl", "negctrl(1)"]) + pick([...ws, "\n  "]) + "@" + pick([" ", "", "\n"]);
    let accepted = 0;
    const total = 3000;
    for (let n = 0; n < total; n++) {
      const r = next();
      let s: string;
      if (r < 0.15) s = `measure${pick([" ", "  "])}${operand()}${next() < 0.5 ? `${pick(ws)}->${pick(ws)}${operand()}` : ""}${pick(ws)};`;
      else if (r < 0.25) s = `${operand()}${pick(ws)}=${pick(ws)}measure ${operand()};`;
      else if (r < 0.3) s = `${pick(["reset", "barrier"])} ${operand()}${next() < 0.3 ? `, ${operand()}` : ""};`;
      else {
        const mods = Array.from({ length: Math.floor(next() * 3) }, modifier).join(" ");
        const params = next() < 0.6 ? `(${Array.from({ length: 1 + Math.floor(next() * 2) }, () => expr(0)).join(`,${pick(ws)}`)})` : "";
        const operands = Array.from({ length: Math.floor(next() * 3) + (next() < 0.1 ? 0 : 1) }, operand).join(`${pick(ws)},${pick(ws)}`);
        s = `${mods}${mods ? " " : ""}${pick(names)}${pick(ws)}${params}${pick(ws)}${operands}${pick(ws)}${pick([";", ";", ";", "", ",;"])}`;
      }
      if (agree(pick(ws) + s)) accepted++;
    }
    // The generator is biased towards accepted forms; a fast path that declines everything would pass the rest.
    expect(accepted).toBeGreaterThan(total / 10);
  });

  it("reads every fixture to the same statements with and without the fast path", () => {
    for (const f of GOOD) {
      const src: SourceText = { file: f, text: readFileSync(`fixtures/${f}`, "utf8") };
      const withFast = [...readStatements(src)];
      const slowOnly: Stmt[] = [];
      for (let cur = skipLayout(src.text, START); cur.i < src.text.length; cur = skipLayout(src.text, cur)) {
        const r = parseStatementAt(src, cur);
        slowOnly.push(r.stmt);
        cur = r.next;
      }
      expect(withFast, f).toEqual(slowOnly);
    }
  });
});
