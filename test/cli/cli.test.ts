import { describe, expect, it, vi } from "vitest";
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { spawnSync } from "node:child_process";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { parseCommand } from "../../src/cli/parse.js";
import { emitCommand } from "../../src/cli/emit.js";
import { formatDiagnostic, parseParams, runCommand, writeFileAtomic, EXIT_INPUT, EXIT_INTERNAL, EXIT_OK, type Io } from "../../src/cli/common.js";
import { buildProgram } from "../../src/cli/program.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { parseQasmFile, parseQasmText } from "../../src/frontend/frontend.js";
import { withoutLocations } from "../frontend/helpers.js";

function capture(color = false): Io & { out: string; err: string } {
  const io = {
    out: "",
    err: "",
    color,
    stdout: (t: string) => {
      io.out += t;
    },
    stderr: (t: string) => {
      io.err += t;
    },
  };
  return io;
}

describe("tledger parse", () => {
  it("prints a summary of registers, gates and angles", async () => {
    const io = capture();
    expect(await runCommand((x) => parseCommand("fixtures/ripple-adder.qasm", {}, x), { io })).toBe(EXIT_OK);
    expect(io.out).toContain("qubits: 8 (cin[1], a[3], b[3], cout[1])\n");
    expect(io.out).toContain("classical bits: 4 (sum[3], carry[1])\n");
    expect(io.out).toMatch(/\n {2}ccx +6\n/);
    expect(io.out).toContain("rotations with non-trivial angles: 0\n");
    expect(io.err).toBe("");
  });

  it("prints the same as JSON, with parameters bound", async () => {
    const io = capture();
    const params = readFileSync("fixtures/params/vqe-ansatz.txt", "utf8").trim().split("\n");
    expect(await runCommand((x) => parseCommand("fixtures/vqe-ansatz.qasm", { json: true, param: params }, x), { io })).toBe(EXIT_OK);
    const j = JSON.parse(io.out) as { file: string; qubits: number; gates: Record<string, number>; rotations: { nonTrivial: number; distinctNonExactAngles: string[] } };
    expect(j.file).toBe("fixtures/vqe-ansatz.qasm");
    expect(j.qubits).toBe(4);
    expect(j.gates).toEqual({ cx: 4, ry: 8, rz: 8 });
    expect(j.rotations.nonTrivial).toBe(16);
    expect(j.rotations.distinctNonExactAngles).toContain("0.35");
  });

  it("searches -I folders for includes", async () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-cli-"));
    writeFileSync(join(dir, "main.qasm"), 'include "stdgates.inc";\ninclude "halvorsen-gates.inc";\nqubit[2] q;\nhop(0.1) q[0], q[1];\n');
    const io = capture();
    expect(await runCommand((x) => parseCommand(join(dir, "main.qasm"), { include: ["fixtures/lib"] }, x), { io })).toBe(EXIT_OK);
    expect(io.out).toMatch(/\n {2}cx +4\n/);
  });
});

describe("tledger emit", () => {
  it("writes the expanded program to stdout, which reads back to the same IR", async () => {
    const io = capture();
    expect(await runCommand((x) => emitCommand("fixtures/hubbard-dimer.qasm", {}, x), { io })).toBe(EXIT_OK);
    expect(io.out.startsWith('OPENQASM 3.0;\ninclude "stdgates.inc";\n')).toBe(true);
    expect(withoutLocations(parseQasmText(io.out, "o.qasm"))).toEqual(withoutLocations(parseQasmFile("fixtures/hubbard-dimer.qasm")));
  });

  it("writes -o OUT completely, leaving no temporary file, and leaves OUT untouched on an input error", async () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-cli-"));
    const out = join(dir, "out.qasm");
    expect(await runCommand((x) => emitCommand("fixtures/ising-quench.qasm", { output: out }, x), { io: capture() })).toBe(EXIT_OK);
    const first = readFileSync(out, "utf8");
    expect(first).toContain("qubit[8] q;");
    expect(readdirSync(dir)).toEqual(["out.qasm"]);
    const io = capture();
    expect(await runCommand((x) => emitCommand("fixtures/bad/06-wrong-arity.qasm", { output: out }, x), { io })).toBe(EXIT_INPUT);
    expect(readFileSync(out, "utf8")).toBe(first);
    expect(readdirSync(dir)).toEqual(["out.qasm"]);
  });

  it("reports an output folder that does not exist as an input error", async () => {
    const io = capture();
    const code = await runCommand((x) => emitCommand("fixtures/ising-quench.qasm", { output: "/nonexistent-tledger-dir/out.qasm" }, x), { io });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toContain("cannot write '/nonexistent-tledger-dir/out.qasm': no such folder");
  });

  it("writeFileAtomic replaces a file whole", () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-cli-"));
    const f = join(dir, "x.txt");
    writeFileSync(f, "old");
    writeFileAtomic(f, "new content");
    expect(readFileSync(f, "utf8")).toBe("new content");
    expect(readdirSync(dir)).toEqual(["x.txt"]);
  });
});

describe("errors and exit codes", () => {
  it("formats an input error with its location, the source line, a caret and the hint, and exits 2", async () => {
    const io = capture();
    const code = await runCommand((x) => parseCommand("fixtures/bad/04-gate-without-include.qasm", {}, x), { io });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toBe(
      [
        "fixtures/bad/04-gate-without-include.qasm:3:1: error: unknown gate 'h'",
        "  h q[0];",
        "  ^",
        `hint: add 'include "stdgates.inc";' at the top`,
        "",
      ].join("\n"),
    );
  });

  it("puts the caret under the column, keeping tabs", () => {
    const d = { severity: "error" as const, file: "f.qasm", line: 2, col: 6, message: "m" };
    expect(formatDiagnostic(d, "\tab\tcd", false)).toBe("f.qasm:2:6: error: m\n  \tab\tcd\n  \t  \t ^\n");
    expect(formatDiagnostic({ ...d, line: 0, col: 0 }, null, false)).toBe("f.qasm: error: m\n");
  });

  it("colours only when asked to", () => {
    const d = { severity: "error" as const, file: "f.qasm", line: 1, col: 1, message: "m", hint: "h" };
    expect(formatDiagnostic(d, "x", true)).toMatch(/\u001b\[/);
    expect(formatDiagnostic(d, "x", false)).not.toMatch(/\u001b\[/);
  });

  it("reports an internal fault in one line and exits 1; the stack only with --debug", async () => {
    const boom = () => {
      throw new TypeError("something broke");
    };
    const io = capture();
    expect(await runCommand(boom, { io })).toBe(EXIT_INTERNAL);
    expect(io.err).toBe("tledger: internal error: something broke (run with --debug for details)\n");
    const io2 = capture();
    expect(await runCommand(boom, { io: io2, debug: true })).toBe(EXIT_INTERNAL);
    expect(io2.err).toMatch(/^tledger: internal error: something broke\nTypeError: something broke\n\s+at /);
  });

  it("shows no source line for a binary file", async () => {
    const io = capture();
    expect(await runCommand((x) => parseCommand("fixtures/bad/16-binary-file.qasm", {}, x), { io })).toBe(EXIT_INPUT);
    expect(io.err.split("\n")[0]).toMatch(/^fixtures\/bad\/16-binary-file\.qasm: error: not a text file/);
    expect(io.err).not.toContain("^");
  });

  it("rejects malformed --param values", () => {
    expect(parseParams(["a=1", "b = pi/2 "])).toEqual({ a: "1", b: " pi/2 " });
    expect(() => parseParams(["a"])).toThrow(DiagnosticError);
    expect(() => parseParams(["1a=2"])).toThrow(DiagnosticError);
    expect(() => parseParams(["a=1", "a=2"])).toThrow(DiagnosticError);
  });
});

describe("the commander program", () => {
  it("wires parse and emit and sets the exit code", async () => {
    const codes: number[] = [];
    const write = vi.spyOn(process.stdout, "write").mockImplementation(() => true);
    const ewrite = vi.spyOn(process.stderr, "write").mockImplementation(() => true);
    try {
      await buildProgram((c) => codes.push(c)).parseAsync(["node", "tledger", "parse", "fixtures/qasm2-qft.qasm", "--json"]);
      await buildProgram((c) => codes.push(c)).parseAsync(["node", "tledger", "--debug", "emit", "fixtures/bad/03-unknown-gate.qasm"]);
      const out = write.mock.calls.map((c) => String(c[0])).join("");
      expect(JSON.parse(out).qubits).toBe(4);
      expect(ewrite.mock.calls.map((c) => String(c[0])).join("")).toContain("unknown gate 'hadamard'");
    } finally {
      write.mockRestore();
      ewrite.mockRestore();
    }
    expect(codes).toEqual([EXIT_OK, EXIT_INPUT]);
  });

  it.skipIf(!existsSync("dist/src/cli/main.js"))("runs as a process: exit 2 on an input error, 0 on help (needs npm run build)", () => {
    const bad = spawnSync(process.execPath, ["dist/src/cli/main.js", "parse", "fixtures/bad/08-index-out-of-range.qasm"], { encoding: "utf8", env: { ...process.env, NO_COLOR: "1" } });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain("fixtures/bad/08-index-out-of-range.qasm:4:5: error: index 3 is out of range for 'q' (3 qubits)");
    const help = spawnSync(process.execPath, ["dist/src/cli/main.js", "--help"], { encoding: "utf8" });
    expect(help.status).toBe(0);
    expect(help.stdout).toContain("emit");
    const usage = spawnSync(process.execPath, ["dist/src/cli/main.js", "parse"], { encoding: "utf8" });
    expect(usage.status).toBe(2);
  });
});
