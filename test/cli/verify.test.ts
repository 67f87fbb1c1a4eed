// End-to-end tests of `tledger verify`: a lowered fixture checks out, a tampered one does not, and circuits the simulator cannot take are refused.
import { beforeAll, describe, expect, it } from "vitest";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { EXIT_INPUT, EXIT_OK, runCommand } from "../../src/cli/common.js";
import { EXIT_BOUND_VIOLATED, verifyCommand, type VerifyOptions } from "../../src/cli/verify.js";
import { MAX_STATE_QUBITS } from "../../src/sim/index.js";
import type { Report } from "../../src/report/types.js";
import { capture, fixtureParams, freshDir, runLower, type CapturedIo } from "./helpers.js";

async function runVerify(original: string, lowered: string, opts: VerifyOptions = {}): Promise<{ code: number; io: CapturedIo }> {
  const io = capture();
  let verdict = -1;
  const run = await runCommand(
    (x) => {
      verdict = verifyCommand(original, lowered, opts, x);
    },
    { io },
  );
  return { code: run !== EXIT_OK ? run : verdict, io };
}

/**
 * The lowered text with one `t` removed from the middle of the first synthesized block that has at least three:
 * the block then implements a different rotation (a T gate fewer changes the exact unitary of the word).
 */
function withoutOneT(text: string): string {
  const lines = text.split("\n");
  for (let i = 0; i < lines.length; i++) {
    if (!/^\s*\/\/ \S+:\d+:\d+ .*achieved/.test(lines[i]!)) continue;
    const ts: number[] = [];
    for (let j = i + 1; j < lines.length && !lines[j]!.startsWith("//") && /^[a-z]+ \w+\[\d+\];$/.test(lines[j]!); j++) if (lines[j]!.startsWith("t ")) ts.push(j);
    if (ts.length >= 3) {
      const k = ts[Math.floor(ts.length / 2)]!;
      return [...lines.slice(0, k), ...lines.slice(k + 1)].join("\n");
    }
  }
  throw new Error("no synthesized block with three T gates to tamper with");
}

describe("verify a lowered fixture", () => {
  const source = "fixtures/hubbard-dimer.qasm";
  let dir = "";
  let lowered = "";
  let json = "";
  let report: Report;

  beforeAll(async () => {
    dir = freshDir("verify");
    lowered = join(dir, "hubbard.clifford-t.qasm");
    json = join(dir, "hubbard.json");
    const r = await runLower(source, { output: lowered, json, budget: "1e-3" });
    expect(r.code, r.io.err).toBe(EXIT_OK);
    report = r.report as unknown as Report;
  });

  it("holds: exit 0, the bound taken from the lowered file's header", async () => {
    const { code, io } = await runVerify(source, lowered);
    expect(code, io.err).toBe(EXIT_OK);
    expect(io.out).toMatch(/verdict: +the bound holds/);
    expect(io.out).toContain(`bound:    ${report.errorBound} (from the header of ${lowered}`);
  });

  it("--json gives the distance, exact, within the bound", async () => {
    const { code, io } = await runVerify(source, lowered, { json: true });
    expect(code, io.err).toBe(EXIT_OK);
    const j = JSON.parse(io.out) as { qubits: number; distance: number; exact: boolean; bound: string; holds: boolean; finalMeasurementsIgnored: number };
    expect(j.qubits).toBe(4);
    expect(j.exact).toBe(true);
    expect(j.bound).toBe(report.errorBound);
    expect(j.distance).toBeLessThanOrEqual(Number(report.errorBound) + 1e-12);
    // A nonzero distance: the circuit was approximated, and the simulation sees it.
    expect(j.distance).toBeGreaterThan(0);
    expect(j.holds).toBe(true);
    // hubbard-dimer ends by measuring its 4 qubits, and so does its lowered form.
    expect(j.finalMeasurementsIgnored).toBe(8);
  });

  it("--report takes the bound from the JSON report", async () => {
    const { code, io } = await runVerify(source, lowered, { report: json });
    expect(code, io.err).toBe(EXIT_OK);
    expect(io.out).toContain(`(from ${json};`);
  });

  it("is violated (exit 3) when one T gate is deleted from a synthesized block, with the header's bound or the report's", async () => {
    const tampered = join(dir, "tampered.qasm");
    writeFileSync(tampered, withoutOneT(readFileSync(lowered, "utf8")));
    const a = await runVerify(source, tampered);
    expect(a.code, a.io.err).toBe(EXIT_BOUND_VIOLATED);
    expect(a.io.out).toMatch(/VIOLATED/);
    const b = await runVerify(source, tampered, { report: json, json: true });
    expect(b.code, b.io.err).toBe(EXIT_BOUND_VIOLATED);
    const j = JSON.parse(b.io.out) as { distance: number; holds: boolean };
    expect(j.holds).toBe(false);
    expect(j.distance).toBeGreaterThan(Number(report.errorBound));
  });

  it("refuses (exit 2) a lowered file without a header when no --report is given", async () => {
    const bare = join(dir, "bare.qasm");
    writeFileSync(bare, readFileSync(lowered, "utf8").replace(/^\/\/.*error bound.*$/m, "// (header removed)"));
    const { code, io } = await runVerify(source, bare);
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toMatch(/no error bound/);
    expect(io.err).toContain("--report");
  });
});

describe("verify refuses what it cannot simulate", () => {
  it(`a ${MAX_STATE_QUBITS + 1}-qubit circuit: exit 2 with a message about the qubit limit`, async () => {
    const dir = freshDir("verify");
    const src = join(dir, "wide.qasm");
    const n = MAX_STATE_QUBITS + 1;
    writeFileSync(src, ["OPENQASM 3.0;", 'include "stdgates.inc";', `qubit[${n}] q;`, "h q;", `cx q[0], q[${n - 1}];`, "t q[3];", ""].join("\n"));
    const out = join(dir, "wide.clifford-t.qasm");
    const lowered = await runLower(src, { output: out });
    expect(lowered.code, lowered.io.err).toBe(EXIT_OK);
    const { code, io } = await runVerify(src, out);
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toContain(`${n} qubits`);
    expect(io.err).toContain(String(MAX_STATE_QUBITS));
    expect(io.err).not.toMatch(/internal error/);
  });

  // The size diagnostic carries an empty file name (src/sim/statevector.ts simulationSizeError), so formatDiagnostic
  // prints it as ": error: distance check: ...", a line that starts with a bare colon.
  it("the qubit-limit message names where it comes from (no line starting with a bare colon)", async () => {
    const dir = freshDir("verify");
    const src = join(dir, "wide.qasm");
    const n = MAX_STATE_QUBITS + 1;
    writeFileSync(src, ["OPENQASM 3.0;", 'include "stdgates.inc";', `qubit[${n}] q;`, "h q;", ""].join("\n"));
    const out = join(dir, "wide.clifford-t.qasm");
    expect((await runLower(src, { output: out })).code).toBe(EXIT_OK);
    const { code, io } = await runVerify(src, out);
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).not.toMatch(/^:/m);
  });

  it("a mid-circuit measurement: exit 2 naming the measurement", async () => {
    const dir = freshDir("verify");
    const source = "fixtures/teleport-reset.qasm";
    const out = join(dir, "teleport.clifford-t.qasm");
    const lowered = await runLower(source, { output: out, budget: "1e-3" });
    expect(lowered.code, lowered.io.err).toBe(EXIT_OK);
    const { code, io } = await runVerify(source, out);
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toMatch(/not a unitary circuit: measurement/);
  });
});

describe("verify with bound inputs", () => {
  // The lowered circuit has its inputs bound already; --param is for the source (bug: src/cli/verify.ts applies the
  // same --param values to both files, and the lowered one has no `input` to bind).
  it("checks vqe-ansatz with --param against its lowered circuit", async () => {
    const dir = freshDir("verify");
    const source = "fixtures/vqe-ansatz.qasm";
    const param = fixtureParams(source);
    const out = join(dir, "vqe.clifford-t.qasm");
    const lowered = await runLower(source, { output: out, budget: "1e-3", param });
    expect(lowered.code, lowered.io.err).toBe(EXIT_OK);
    const { code, io } = await runVerify(source, out, { param });
    expect(code, io.err).toBe(EXIT_OK);
  });
});
