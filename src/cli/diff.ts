// `tledger diff A B`: what changed between two compiled outputs (OpenQASM files or lowering reports), with CI thresholds and an equivalence check.
import { readFileSync } from "node:fs";
import type { Command } from "commander";
import { parseQasmFile, type FrontendOptions } from "../frontend/frontend.js";
import { withoutFinalMeasurements } from "../sim/final-measurements.js";
import { readReport } from "../report/read.js";
import type { Report } from "../report/types.js";
import type { Circuit } from "../ir/circuit.js";
import { checkThresholds, diffJson, diffMarkdown, diffSides, diffText, equivalence, parseThresholds, type DiffChecks, type DiffSide } from "../diff/index.js";
import { collect, parseParams, runCommand, usageError, type Io } from "./common.js";
import { EXIT_BOUND_VIOLATED } from "./verify.js";

export interface DiffCliOptions {
  readonly reportA?: string;
  readonly reportB?: string;
  readonly equiv?: boolean;
  readonly maxIncrease?: readonly string[];
  readonly format?: string;
  readonly seed?: string;
  readonly states?: string;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
}

/** Exit code when a threshold is crossed or the equivalence check fails. */
export const EXIT_DIFF_FAILED = EXIT_BOUND_VIOLATED;

function readText(file: string): string {
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw usageError(`cannot read '${file}': ${code === "ENOENT" ? "no such file" : code === "EISDIR" ? "it is a folder" : String(code).toLowerCase()}`);
  }
  return bytes.toString("utf8");
}

function loadReport(file: string): Report {
  return readReport(readText(file), file);
}

/** A side from a file: a JSON report when the text starts with `{`, else an OpenQASM program. */
export function loadSide(file: string, report: string | undefined, fopts: FrontendOptions): DiffSide {
  const text = readText(file);
  if (/^\s*\{/.test(text)) {
    if (report) throw usageError(`'${file}' is already a report; --report-a/--report-b go with OpenQASM files`);
    return { label: file, report: readReport(text, file) };
  }
  const circuit: Circuit = parseQasmFile(file, fopts);
  return report ? { label: file, circuit, report: loadReport(report) } : { label: file, circuit };
}

function readCount(flag: string, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  if (!/^\d+$/.test(text) || Number(text) < 1) throw usageError(`${flag} expects a positive whole number, got '${text}'`);
  return Number(text);
}

/** Returns the exit code: 0, or EXIT_DIFF_FAILED when a threshold is crossed or --equiv fails. */
export function diffCommand(a: string, b: string, opts: DiffCliOptions, io: Io): number {
  const format = opts.format ?? "text";
  if (!["text", "json", "markdown"].includes(format)) throw usageError(`--format expects text, json or markdown, got '${format}'`);
  const limits = opts.maxIncrease && opts.maxIncrease.length > 0 ? parseThresholds(opts.maxIncrease) : undefined;
  // --param binds the inputs of whichever side declares them (a lowered side has none left).
  const fopts = { includeDirs: opts.include ?? [], params: parseParams(opts.param), allowUnusedParams: true };
  const sa = loadSide(a, opts.reportA, fopts);
  const sb = loadSide(b, opts.reportB, fopts);
  const d = diffSides(sa, sb);
  const checks: { -readonly [K in keyof DiffChecks]: DiffChecks[K] } = {};
  let failed = false;
  if (limits) {
    checks.limits = limits;
    checks.violations = checkThresholds(d, limits);
    failed ||= checks.violations.length > 0;
  }
  if (opts.equiv) {
    if (!sa.circuit || !sb.circuit) throw usageError("--equiv needs two OpenQASM circuits, not reports", "pass the circuits, with --report-a/--report-b for their bounds");
    // Final measurements only read out the prepared state: the unitary parts are compared.
    const eq = equivalence(withoutFinalMeasurements(sa.circuit).circuit, withoutFinalMeasurements(sb.circuit).circuit, { a: sa.report?.errorBound ?? null, b: sb.report?.errorBound ?? null }, { seed: readCount("--seed", opts.seed), states: readCount("--states", opts.states) });
    checks.equivalence = eq;
    failed ||= !eq.within;
  }
  if (format === "json") io.stdout(diffJson(d, checks));
  else if (format === "markdown") io.stdout(diffMarkdown(d, checks));
  else io.stdout(diffText(d, { color: io.color && Boolean(process.stdout.isTTY), checks }));
  return failed ? EXIT_DIFF_FAILED : 0;
}

export function registerDiff(program: Command, setExit: (code: number) => void): void {
  program
    .command("diff")
    .description("compare two compiled outputs (OpenQASM files or JSON reports of tledger lower): metrics, gates, qubits, ledger")
    .argument("<a>", "the before side: an OpenQASM file or a JSON report")
    .argument("<b>", "the after side")
    .option("--report-a <file>", "the JSON report that goes with A (for its error bound and ledger)")
    .option("--report-b <file>", "the JSON report that goes with B")
    .option("--equiv", "simulate both and check their distance against the sum of their declared bounds")
    .option("--max-increase <limits>", "fail (exit 3) when a metric grows more than allowed: METRIC=LIMIT[,METRIC=LIMIT...], LIMIT a number or N%", collect)
    .option("--format <kind>", "text, json or markdown", "text")
    .option("--seed <n>", "seed of the random states used above 10 qubits")
    .option("--states <n>", "random states used above 10 qubits")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (a: string, b: string, opts: DiffCliOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      let code = 0;
      const run = await runCommand((io) => void (code = diffCommand(a, b, opts, io)), { debug });
      setExit(run !== 0 ? run : code);
    });
}
