// Shared pieces of the end-to-end command tests: a captured Io, fresh folders, the fixtures and their parameters, and IR walks.
import { existsSync, mkdtempSync, readdirSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join } from "node:path";
import { runCommand, type Io } from "../../src/cli/common.js";
import { lowerCommand, type LowerCliOptions } from "../../src/cli/lower.js";
import type { Circuit, GateOp, Stmt } from "../../src/ir/circuit.js";
import type { Report } from "../../src/report/types.js";
import type { Metrics } from "../../src/report/metrics.js";

/** An Io that keeps what a command writes. */
export interface CapturedIo extends Io {
  out: string;
  err: string;
}

export function capture(): CapturedIo {
  const io: CapturedIo = {
    out: "",
    err: "",
    color: false,
    stdout: (t: string) => {
      io.out += t;
    },
    stderr: (t: string) => {
      io.err += t;
    },
  };
  return io;
}

/** A new empty folder under the system's temporary folder. */
export function freshDir(tag = "cli"): string {
  return mkdtempSync(join(tmpdir(), `tledger-${tag}-`));
}

/** Every demo circuit `fixtures/*.qasm`, sorted by name. */
export function fixtureFiles(): string[] {
  return readdirSync("fixtures")
    .filter((f) => f.endsWith(".qasm"))
    .sort()
    .map((f) => `fixtures/${f}`);
}

/** The `--param` values a fixture needs (only vqe-ansatz has inputs; fixtures/params/NAME.txt lists them). */
export function fixtureParams(file: string): string[] {
  const p = `fixtures/params/${basename(file, ".qasm")}.txt`;
  if (!existsSync(p)) return [];
  return readFileSync(p, "utf8")
    .split("\n")
    .map((l) => l.trim())
    .filter((l) => l.length > 0);
}

/** Run `lower` in-process as the CLI does; the exit code, what it printed and the report (null when it failed). */
export async function runLower(file: string, opts: LowerCliOptions): Promise<{ code: number; io: CapturedIo; report: Report | null }> {
  const io = capture();
  let report: Report | null = null;
  const code = await runCommand(
    async (x) => {
      report = await lowerCommand(file, { progress: false, jobs: "1", ...opts }, x);
    },
    { io },
  );
  return { code, io, report };
}

/** Every statement of a body, blocks entered (depth first, in program order). */
export function allStatements(body: readonly Stmt[], out: Stmt[] = []): Stmt[] {
  for (const s of body) {
    out.push(s);
    if (s.kind === "if") {
      allStatements(s.then, out);
      allStatements(s.else, out);
    } else if (s.kind === "while" || s.kind === "box") allStatements(s.body, out);
  }
  return out;
}

/** Every gate operation of a circuit, blocks entered. */
export function allGates(c: Circuit): GateOp[] {
  return allStatements(c.body).filter((s): s is GateOp => s.kind === "gate");
}

/** Statements of `c` that are not in `kinds` (blocks entered). */
export function statementsOtherThan(c: Circuit, kinds: readonly Stmt["kind"][]): Stmt[] {
  return allStatements(c.body).filter((s) => !kinds.includes(s.kind));
}

/** The figures of a report that describe its circuit, in the shape of `computeMetrics`. */
export function reportFigures(r: Report): Record<string, unknown> {
  return {
    qubits: r.qubits,
    gates: r.gates,
    depth: r.depth,
    tCount: r.tCount,
    tDepth: r.tDepth,
    cxCount: r.cxCount,
    cliffordCount: r.cliffordCount,
    measurements: r.measurements,
    resets: r.resets,
    conditionalOps: r.conditionalOps,
    rotations: r.remainingRotations,
    gateCounts: { ...r.gateCounts },
    perQubit: r.perQubit.map((q) => ({ qubit: q.qubit, label: q.label, tCount: q.tCount, tDepth: q.tDepth })),
  };
}

export function metricFigures(m: Metrics): Record<string, unknown> {
  return {
    qubits: m.qubits,
    gates: m.gates,
    depth: m.depth,
    tCount: m.tCount,
    tDepth: m.tDepth,
    cxCount: m.cxCount,
    cliffordCount: m.cliffordCount,
    measurements: m.measurements,
    resets: m.resets,
    conditionalOps: m.conditionalOps,
    rotations: m.rotations,
    gateCounts: { ...m.gateCounts },
    perQubit: m.perQubit.map((q) => ({ qubit: q.qubit, label: q.label, tCount: q.tCount, tDepth: q.tDepth })),
  };
}
