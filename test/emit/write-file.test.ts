import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { writeFileAtomic, writeFileAtomicChunks } from "../../src/cli/common.js";
import { writeQasm3, writeQasm3Chunks } from "../../src/emit/qasm3.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { parseFixture } from "../frontend/helpers.js";

let dir = "";
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), "tledger-emit-"));
});
afterEach(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe("writeFileAtomicChunks", () => {
  it("writes every chunk, in order, as UTF-8", () => {
    const target = join(dir, "out.qasm");
    const ir = parseFixture("lab-feature-tour.qasm");
    let n = 0;
    const opts = { header: "ünïcødé header 😀", commentBefore: () => (n++ % 2 === 0 ? `ζ note ${n}` : undefined) };
    writeFileAtomicChunks(target, (sink) => writeQasm3Chunks(ir, opts, sink, 100));
    n = 0;
    expect(readFileSync(target, "utf8")).toBe(writeQasm3(ir, opts));
    expect(readdirSync(dir)).toEqual(["out.qasm"]);
  });

  it("replaces an existing file", () => {
    const target = join(dir, "out.txt");
    writeFileSync(target, "old content that is longer than the new one\n");
    writeFileAtomicChunks(target, (sink) => {
      sink("new\n");
      sink("text\n");
    });
    expect(readFileSync(target, "utf8")).toBe("new\ntext\n");
    expect(readdirSync(dir)).toEqual(["out.txt"]);
  });

  it("leaves no file when the writer throws midway", () => {
    const target = join(dir, "out.txt");
    const boom = new Error("writer failed");
    expect(() =>
      writeFileAtomicChunks(target, (sink) => {
        sink("first chunk\n");
        sink("second chunk\n");
        throw boom;
      }),
    ).toThrow(boom);
    expect(readdirSync(dir)).toEqual([]);
  });

  it("leaves an existing target untouched when the writer throws midway", () => {
    const target = join(dir, "out.qasm");
    writeFileSync(target, "OPENQASM 3.0;\n// the old file\n");
    const ir = parseFixture("ising-quench.qasm");
    let calls = 0;
    expect(() =>
      writeFileAtomicChunks(target, (sink) =>
        writeQasm3Chunks(
          ir,
          {},
          (chunk) => {
            if (++calls === 3) throw new RangeError("disk full, say");
            sink(chunk);
          },
          64,
        ),
      ),
    ).toThrow(RangeError);
    expect(calls).toBe(3);
    expect(readFileSync(target, "utf8")).toBe("OPENQASM 3.0;\n// the old file\n");
    expect(readdirSync(dir)).toEqual(["out.qasm"]);
  });

  it("reports a missing folder as an input error, like writeFileAtomic", () => {
    const target = join(dir, "no-such-folder", "out.qasm");
    expect(() => writeFileAtomicChunks(target, (sink) => sink("x\n"))).toThrow(DiagnosticError);
    expect(() => writeFileAtomic(target, "x\n")).toThrow(DiagnosticError);
    expect(readdirSync(dir)).toEqual([]);
  });
});

describe("writeFileAtomic", () => {
  it("writes the whole text and leaves no temporary file", () => {
    const target = join(dir, "a.txt");
    const text = "αβγ\n".repeat(50_000);
    writeFileAtomic(target, text);
    expect(readFileSync(target, "utf8")).toBe(text);
    expect(readdirSync(dir)).toEqual(["a.txt"]);
  });
});
