import { describe, expect, it } from "vitest";
import { CHUNK_BYTES, writeQasm3, writeQasm3Chunks, type WriteOptions } from "../../src/emit/qasm3.js";
import type { Angle } from "../../src/ir/angle.js";
import type { Circuit, CondExpr, GateOp, Stmt } from "../../src/ir/circuit.js";
import { angleDecimal, anglePi, rational } from "../../src/ir/angle-ops.js";
import { wordOps } from "../../src/passes/word-ops.js";
import type { Gate1 } from "../../src/synth/exact/word.js";
import { GOOD, parseFixture } from "../frontend/helpers.js";
import { rng } from "../helpers/circuit-builder.js";

const loc = { file: "x.qasm", line: 1, col: 1 };

function chunksOf(c: Circuit, opts: WriteOptions, chunkBytes?: number): string[] {
  const out: string[] = [];
  writeQasm3Chunks(c, opts, (ch) => out.push(ch), chunkBytes);
  return out;
}

/**
 * The chunk contract: none empty, each ends at a line end, at most `limit` bytes as UTF-8 unless it is
 * one line alone; and a chunk is only cut when the next line might not fit (the writer reserves 3
 * bytes per UTF-16 unit, so: this chunk's bytes + 3 x the next chunk's first line > limit).
 */
function checkChunks(chunks: readonly string[], limit: number): void {
  expect(chunks.length).toBeGreaterThan(0);
  for (let i = 0; i < chunks.length; i++) {
    const ch = chunks[i]!;
    expect(ch.length).toBeGreaterThan(0);
    expect(ch.endsWith("\n")).toBe(true);
    const bytes = Buffer.byteLength(ch, "utf8");
    if (bytes > limit) expect(ch.indexOf("\n")).toBe(ch.length - 1);
    if (i + 1 < chunks.length) {
      const next = chunks[i + 1]!;
      const firstLine = next.slice(0, next.indexOf("\n") + 1);
      expect(bytes + 3 * firstLine.length).toBeGreaterThan(limit);
    }
  }
}

describe("writeQasm3Chunks on the fixtures", () => {
  for (const f of GOOD) {
    it(f, () => {
      const ir = parseFixture(f);
      // A comment before every third statement (nested ones included), and a header.
      let n = 0;
      const opts: WriteOptions = { header: `from ${f}\nsecond line`, commentBefore: () => (n++ % 3 === 0 ? `note ${n}` : undefined) };
      const whole = writeQasm3(ir, opts);
      for (const size of [CHUNK_BYTES, 1, 7, 64, 1000]) {
        n = 0;
        const chunks = chunksOf(ir, opts, size);
        expect(chunks.join("")).toBe(whole);
        checkChunks(chunks, size);
      }
      // Without options, too.
      expect(chunksOf(ir, {}, 50).join("")).toBe(writeQasm3(ir));
    });
  }
});

// ---- An independent reference writer for a subset of the IR, from the OpenQASM 3 specification's syntax
// (gate calls `name(params) q[i], ...;`, `ctrl @`, `c[i] = measure q[j];`, `reset`, `barrier`,
// `if (...) { } else { }`, `while`, `box`, `//` comments), used to check the chunked writer's lines.

const PLAIN: readonly Gate1[] = ["h", "s", "sdg", "t", "tdg", "x", "y", "z"];
/** Angles with the text OpenQASM 3 reads back as the same value. */
const ANGLES: readonly (readonly [Angle, string])[] = [
  [anglePi(rational(1n, 4n)), "pi/4"],
  [anglePi(rational(-3n, 8n)), "-3*pi/8"],
  [angleDecimal("0.125"), "0.125"],
];
const COMMENTS = ["plain note", "two\nlines", "ünïcødé ζ", "\uFEFFstarts with a BOM", "emoji 😀 pair", "  indented text"];

interface Case {
  readonly circuit: Circuit;
  readonly comments: ReadonlyMap<Stmt, string>;
  readonly expected: string;
}

/** A seeded random circuit with its expected text; `regs` gives the qubit register names (3 + 2 qubits). */
function randomCase(seed: number, len: number, regs: readonly [string, string]): Case {
  const r = rng(seed);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;
  const n = 5;
  const qname = (q: number): string => (q < 3 ? `${regs[0]}[${q}]` : `${regs[1]}[${q - 3}]`);
  // Interned plain ops: the same object used again and again, as in lowered circuits.
  const interned = new Map<string, GateOp>();
  const plain = (name: string, q: number): GateOp => {
    const key = `${name}/${q}`;
    let op = interned.get(key);
    if (!op) interned.set(key, (op = Object.freeze({ kind: "gate" as const, name, params: [], qubits: [q], ctrl: [], loc })));
    return op;
  };
  const comments = new Map<Stmt, string>();
  const lines: string[] = [];
  // Comments are keyed by statement identity, so only fresh (not interned) statements get one.
  const emit = (s: Stmt, text: string, ind: string, fresh = true): Stmt => {
    if (fresh && r() < 0.15) {
      const c = pick(COMMENTS);
      comments.set(s, c);
      for (const l of c.split("\n")) lines.push(`${ind}// ${l}`);
    }
    lines.push(text);
    return s;
  };
  const cond = (): [CondExpr, string] =>
    r() < 0.5 ? [{ k: "bit", bit: { reg: "c", index: 1 } }, "c[1]"] : [{ k: "binary", op: "==", l: { k: "reg", reg: "c" }, r: { k: "int", value: 2n } }, "c == 2"];
  const body = (count: number, ind: string, depth: number): Stmt[] => {
    const out: Stmt[] = [];
    for (let i = 0; i < count; i++) {
      const x = r();
      const q = Math.floor(r() * n);
      const t = (q + 1 + Math.floor(r() * (n - 1))) % n;
      if (x < 0.6) {
        const name = pick(PLAIN);
        // Some plain ops are fresh objects, not interned.
        const fresh = r() < 0.2;
        const op = fresh ? { kind: "gate" as const, name, params: [], qubits: [q], ctrl: [], loc } : plain(name, q);
        out.push(emit(op, `${ind}${name} ${qname(q)};`, ind, fresh));
      } else if (x < 0.68) {
        const [a, text] = pick(ANGLES);
        out.push(emit({ kind: "gate", name: "rz", params: [a], qubits: [q], ctrl: [], loc }, `${ind}rz(${text}) ${qname(q)};`, ind));
      } else if (x < 0.74) {
        out.push(emit({ kind: "gate", name: "cx", params: [], qubits: [q, t], ctrl: [], loc }, `${ind}cx ${qname(q)}, ${qname(t)};`, ind));
      } else if (x < 0.78) {
        out.push(emit({ kind: "gate", name: "x", params: [], qubits: [q, t], ctrl: [true], loc }, `${ind}ctrl @ x ${qname(q)}, ${qname(t)};`, ind));
      } else if (x < 0.83) {
        const b = Math.floor(r() * 3);
        out.push(emit({ kind: "measure", qubit: q, bit: { reg: "c", index: b }, loc }, `${ind}c[${b}] = measure ${qname(q)};`, ind));
      } else if (x < 0.86) {
        out.push(emit({ kind: "reset", qubit: q, loc }, `${ind}reset ${qname(q)};`, ind));
      } else if (x < 0.88) {
        out.push(emit({ kind: "barrier", qubits: [q, t], loc }, `${ind}barrier ${qname(q)}, ${qname(t)};`, ind));
      } else if (depth < 2 && x < 0.93) {
        const [ce, ct] = cond();
        const placeholder: Stmt[] = [];
        const withElse = r() < 0.5;
        const s: Stmt = { kind: "if", cond: ce, then: placeholder, else: [], loc };
        emit(s, `${ind}if (${ct}) {`, ind);
        const thenBody = body(1 + Math.floor(r() * 6), ind + "  ", depth + 1);
        let elseBody: Stmt[] = [];
        if (withElse) {
          lines.push(`${ind}} else {`);
          elseBody = body(1 + Math.floor(r() * 4), ind + "  ", depth + 1);
        }
        lines.push(`${ind}}`);
        const full: Stmt = { kind: "if", cond: ce, then: thenBody, else: elseBody, loc };
        if (comments.has(s)) {
          comments.set(full, comments.get(s)!);
          comments.delete(s);
        }
        out.push(full);
      } else if (depth < 2 && x < 0.96) {
        const [ce, ct] = cond();
        const s: Stmt = { kind: "while", cond: ce, body: [], loc };
        emit(s, `${ind}while (${ct}) {`, ind);
        const inner = body(1 + Math.floor(r() * 5), ind + "  ", depth + 1);
        lines.push(`${ind}}`);
        const full: Stmt = { kind: "while", cond: ce, body: inner, loc };
        if (comments.has(s)) {
          comments.set(full, comments.get(s)!);
          comments.delete(s);
        }
        out.push(full);
      } else if (depth < 2) {
        const s: Stmt = { kind: "box", duration: null, body: [], loc };
        emit(s, `${ind}box {`, ind);
        const inner = body(1 + Math.floor(r() * 5), ind + "  ", depth + 1);
        lines.push(`${ind}}`);
        const full: Stmt = { kind: "box", duration: null, body: inner, loc };
        if (comments.has(s)) {
          comments.set(full, comments.get(s)!);
          comments.delete(s);
        }
        out.push(full);
      } else {
        out.push(emit({ kind: "pragma", text: "keep this ü", loc }, `${ind}pragma keep this ü`, ind));
      }
    }
    return out;
  };
  const stmts = body(len, "", 0);
  const prelude = ["OPENQASM 3.0;", "// made by a test", 'include "stdgates.inc";', `qubit[3] ${regs[0]};`, `qubit[2] ${regs[1]};`, "bit[3] c;", "bit f;"];
  const circuit: Circuit = {
    numQubits: n,
    qubitRegs: [
      { name: regs[0], start: 0, size: 3 },
      { name: regs[1], start: 3, size: 2 },
    ],
    bits: [
      { name: "c", size: 3, scalar: false },
      { name: "f", size: 1, scalar: true },
    ],
    body: stmts,
  };
  return { circuit, comments, expected: [...prelude, ...lines].join("\n") + "\n" };
}

describe("writeQasm3Chunks on random circuits with comments, blocks and measurements", () => {
  for (const regs of [["q", "r"], ["q", "ζ"]] as const) {
    it(`matches an independent reference at every chunk size (registers ${regs.join(", ")})`, () => {
      for (let seed = 1; seed <= 12; seed++) {
        const { circuit, comments, expected } = randomCase(seed, 200, regs);
        const opts: WriteOptions = { header: "made by a test", commentBefore: (s) => comments.get(s) };
        expect(writeQasm3(circuit, opts)).toBe(expected);
        for (const size of [1, 5, 16, 40, 333, 4096]) {
          const chunks = chunksOf(circuit, opts, size);
          expect(chunks.join("")).toBe(expected);
          checkChunks(chunks, size);
        }
      }
    });
  }

  it("writes a line longer than a chunk as a chunk of its own, exactly", () => {
    const long = "ü".repeat(300) + "x".repeat(500);
    const body: Stmt[] = [
      { kind: "gate", name: "h", params: [], qubits: [0], ctrl: [], loc },
      { kind: "gate", name: "t", params: [], qubits: [1], ctrl: [], loc },
      { kind: "gate", name: "s", params: [], qubits: [0], ctrl: [], loc },
    ];
    const c: Circuit = { numQubits: 2, qubitRegs: [{ name: "q", start: 0, size: 2 }], bits: [], body };
    const opts: WriteOptions = { commentBefore: (s) => (s === body[1] ? long : undefined) };
    const chunks = chunksOf(c, opts, 256);
    expect(chunks).toContain(`// ${long}\n`);
    expect(chunks.join("")).toBe(`OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[2] q;\nh q[0];\n// ${long}\nt q[1];\ns q[0];\n`);
    checkChunks(chunks, 256);
  });

  it("rejects a chunk size that is not a positive integer", () => {
    const c: Circuit = { numQubits: 1, qubitRegs: [{ name: "q", start: 0, size: 1 }], bits: [], body: [] };
    for (const bad of [0, -5, 1.5, Number.NaN]) expect(() => chunksOf(c, {}, bad)).toThrow(RangeError);
  });
});

describe("writeQasm3Chunks on a large interned circuit", () => {
  it("streams 300k interned ops over 100 qubits in bounded chunks with the right lines", () => {
    const r = rng(2024);
    const word: Gate1[] = Array.from({ length: 150 }, () => PLAIN[Math.floor(r() * PLAIN.length)]!);
    const body: Stmt[] = [];
    const lines = ["OPENQASM 3.0;", 'include "stdgates.inc";', "qubit[100] q;"];
    const comments = new Map<Stmt, string>();
    for (let k = 0; k < 2000; k++) {
      const q = (k * 37) % 100;
      const ops = wordOps(word, q, { file: "in.qasm", line: 1 + (k % 9), col: 1 }, true);
      comments.set(ops[0]!, `rotation ${k}`);
      lines.push(`// rotation ${k}`);
      for (const op of ops) {
        body.push(op);
        lines.push(`${op.name} q[${q}];`);
      }
    }
    const c: Circuit = { numQubits: 100, qubitRegs: [{ name: "q", start: 0, size: 100 }], bits: [], body };
    const chunks = chunksOf(c, { commentBefore: (s) => comments.get(s) });
    const expected = lines.join("\n") + "\n";
    expect(chunks.length).toBeGreaterThan(Math.floor(expected.length / CHUNK_BYTES));
    checkChunks(chunks, CHUNK_BYTES);
    expect(chunks.join("")).toBe(expected);
  });
});
