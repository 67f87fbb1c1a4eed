// `tledger report IN`: the metrics of any circuit without lowering it, and for one with rotations, what each budget would cost.
import type { Command } from "commander";
import { Chalk } from "chalk";
import { parseQasmFile } from "../frontend/frontend.js";
import { computeMetrics, type Metrics } from "../report/metrics.js";
import { estimateLowering, type LoweringEstimate } from "../estimate.js";
import { collect, parseParams, runCommand, usageError, writeFileAtomic, type Io } from "./common.js";
import { readErrorOption } from "./options.js";
import { checkWritable } from "./lower.js";
import { toolVersion } from "./version.js";

export interface ReportCliOptions {
  readonly budget?: readonly string[];
  readonly json?: boolean;
  readonly format?: string;
  readonly html?: string;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
}

const DEFAULT_BUDGETS = ["1e-2", "1e-3", "1e-4", "1e-6", "1e-8", "1e-10"];

/** The record `report --json` prints (its own kind: a circuit's figures, not a lowering's ledger). */
export interface CircuitReport {
  readonly schemaVersion: 1;
  readonly kind: "circuit";
  readonly tool: { readonly name: "tledger"; readonly version: string };
  readonly file: string;
  readonly metrics: Metrics;
  readonly estimate: Omit<LoweringEstimate, "table">;
}

function metricLines(m: Metrics): [string, string][] {
  return [
    ["qubits", String(m.qubits)],
    ["gates", String(m.gates)],
    ["T-count", String(m.tCount)],
    ["T-depth", String(m.tDepth)],
    ["depth", String(m.depth)],
    ["CX count", String(m.cxCount)],
    ["Clifford gates", String(m.cliffordCount)],
    ["open rotations", String(m.rotations)],
    ["measurements", String(m.measurements)],
    ["conditional ops", String(m.conditionalOps)],
  ];
}

export function circuitReportText(r: CircuitReport, format: string, color: boolean): string {
  const c = new Chalk({ level: color ? 1 : 0 });
  const md = format === "markdown";
  const out: string[] = [];
  const m = metricLines(r.metrics);
  if (md) {
    out.push(`### ${r.file}`, "", "| figure | value |", "| --- | ---: |", ...m.map(([k, v]) => `| ${k} | ${v} |`));
  } else {
    out.push(c.bold(`circuit ${r.file}`));
    const w = Math.max(...m.map(([k]) => k.length));
    for (const [k, v] of m) out.push(`  ${k.padEnd(w)}  ${v}`);
  }
  const e = r.estimate;
  if (e.rotations === 0) {
    out.push(md ? "\nNo rotation needs approximating: lowering is exact." : "\n  no rotation needs approximating: lowering costs no error");
  } else {
    const head = `${e.rotations} z-rotation instances (${e.distinct} distinct angles) to approximate after decomposition and merging; exact parts cost ${e.exactT} T`;
    const rows = e.budgets.map((b) => [b.budget, b.share, String(b.tEach), String(b.tCount)]);
    if (md) out.push("", head, "", "| budget | share per rotation | T each (est.) | T-count (est.) |", "| ---: | ---: | ---: | ---: |", ...rows.map((r) => `| ${r.join(" | ")} |`));
    else {
      out.push("", c.bold("estimated cost of lowering"), `  ${head}`);
      const cols = ["budget", "share", "T each", "T-count"];
      const widths = cols.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
      out.push("  " + cols.map((h, i) => h.padStart(widths[i]!)).join("  "));
      for (const r of rows) out.push("  " + r.map((v, i) => v.padStart(widths[i]!)).join("  "));
      out.push("  (estimates: equal shares, T = 3 log2(1/share) + the engine's measured offset; `tledger lower` gives the exact figures)");
    }
  }
  return out.join("\n") + "\n";
}

export async function reportCommand(file: string, opts: ReportCliOptions, io: Io): Promise<CircuitReport> {
  const budgets = (opts.budget ?? DEFAULT_BUDGETS).map((b) => readErrorOption("--budget", b));
  const format = opts.format ?? "text";
  if (format !== "text" && format !== "markdown") throw usageError(`--format expects text or markdown, got '${format}'`);
  if (opts.html) checkWritable(opts.html, "--html");
  const circuit = parseQasmFile(file, { includeDirs: opts.include ?? [], params: parseParams(opts.param) });
  const metrics = computeMetrics(circuit);
  const { table, ...estimate } = estimateLowering(circuit, budgets);
  const r: CircuitReport = { schemaVersion: 1, kind: "circuit", tool: { name: "tledger", version: toolVersion() }, file, metrics, estimate };
  if (opts.html) {
    const { renderHtml } = await import("../report/html/page.js");
    writeFileAtomic(opts.html, renderHtml({ title: `tledger: ${file}`, source: file, metrics, ...(table ? { estimates: table } : {}), version: toolVersion() }));
  }
  if (opts.json) io.stdout(JSON.stringify(r, null, 2) + "\n");
  else io.stdout(circuitReportText(r, format, io.color && Boolean(process.stdout.isTTY)));
  return r;
}

export function registerReport(program: Command, setExit: (code: number) => void): void {
  program
    .command("report")
    .description("the metrics of any circuit without lowering it; for rotations, what each budget would cost")
    .argument("<file>", "the program (OpenQASM 3 or 2.0; a lowered circuit gives its exact figures)")
    .option("--budget <eps>", `a budget to estimate (repeatable; default ${DEFAULT_BUDGETS.join(", ")})`, collect)
    .option("--json", "print the figures as JSON")
    .option("--format <kind>", "text or markdown", "text")
    .option("--html <file>", "write a self-contained HTML report to FILE")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (file: string, opts: ReportCliOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      setExit(await runCommand(async (io) => void (await reportCommand(file, opts, io)), { debug }));
    });
}
