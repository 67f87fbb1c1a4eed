// `tledger lower IN -o OUT`: the main job — every rotation to Clifford+T within one error budget, the circuit written, the ledger reported.
import { accessSync, constants, existsSync, statSync } from "node:fs";
import { dirname, resolve } from "node:path";
import type { Command } from "commander";
import cliProgress from "cli-progress";
import { parseQasmFile } from "../frontend/frontend.js";
import { writeQasm3, writeQasm3Chunks } from "../emit/qasm3.js";
import { lowerProgram } from "../lower.js";
import { DEFAULT_BUDGET, createSynthCache } from "../passes/pipeline.js";
import type { BudgetPolicy } from "../passes/budget.js";
import type { SynthMethod } from "../synth/verify.js";
import { formatMarkdown, formatText, toJson } from "../report/format.js";
import type { Report } from "../report/types.js";
import type { Stmt } from "../ir/circuit.js";
import { collect, parseParams, runCommand, usageError, writeFileAtomic, writeFileAtomicChunks, type Io } from "./common.js";
import { readErrorOption, readJobs, readPerRotation } from "./options.js";
import { toolVersion } from "./version.js";

export interface LowerCliOptions {
  readonly output?: string;
  readonly budget?: string;
  readonly perRotation?: string;
  readonly json?: string;
  readonly format?: string;
  readonly snap?: boolean;
  readonly method?: string;
  readonly jobs?: string;
  readonly cache?: string;
  readonly html?: string;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
  readonly progress?: boolean;
}

const METHODS: readonly SynthMethod[] = ["number-theoretic", "solovay-kitaev"];

/** Fail before any work when an output cannot be written (so a long run never ends without its files). */
export function checkWritable(path: string, flag: string): void {
  const dir = dirname(resolve(path));
  if (!existsSync(dir)) throw usageError(`cannot write ${flag} '${path}': the folder '${dir}' does not exist`);
  if (existsSync(path) && statSync(path).isDirectory()) throw usageError(`cannot write ${flag} '${path}': it is a folder`);
  try {
    accessSync(dir, constants.W_OK);
  } catch {
    throw usageError(`cannot write ${flag} '${path}': permission denied`);
  }
}

export function readPolicy(opts: { budget?: string; perRotation?: string }): BudgetPolicy {
  if (opts.budget !== undefined && opts.perRotation !== undefined)
    throw usageError("--budget and --per-rotation cannot be used together", "--budget shares one error over the whole program; --per-rotation gives every rotation the same eps");
  if (opts.perRotation !== undefined) return { kind: "per-rotation", eps: readPerRotation(opts.perRotation) };
  return { kind: "budget", budget: readErrorOption("--budget", opts.budget ?? DEFAULT_BUDGET) };
}

export function readMethod(text: string | undefined): SynthMethod {
  const m = (text ?? "number-theoretic") as SynthMethod;
  if (!METHODS.includes(m)) throw usageError(`--method expects one of ${METHODS.join(", ")}, got '${text}'`);
  return m;
}

/** A progress bar on stderr for work longer than about a second, only when stderr is a terminal. */
export function progressReporter(label: string): { update: (done: number, total: number) => void; stop: () => void } {
  if (!process.stderr.isTTY) return { update: () => {}, stop: () => {} };
  const started = Date.now();
  let bar: cliProgress.SingleBar | null = null;
  return {
    update: (done, total) => {
      if (!bar && Date.now() - started < 1000) return;
      if (!bar) {
        bar = new cliProgress.SingleBar(
          { stream: process.stderr, format: `${label} [{bar}] {value}/{total} | {eta_formatted} left`, hideCursor: true, clearOnComplete: true },
          cliProgress.Presets.shades_classic,
        );
        bar.start(total, done);
      } else bar.update(done);
    },
    stop: () => bar?.stop(),
  };
}

/** Text or markdown of a report, by --format. */
export function reportText(report: Report, format: string | undefined, color: boolean): string {
  if (format === undefined || format === "text") return formatText(report, { color });
  if (format === "markdown") return formatMarkdown(report);
  throw usageError(`--format expects text or markdown, got '${format}'`, "for JSON use --json FILE");
}

export async function lowerCommand(file: string, opts: LowerCliOptions, io: Io): Promise<Report> {
  const policy = readPolicy(opts);
  const method = readMethod(opts.method);
  const jobs = readJobs(opts.jobs);
  if (opts.format !== undefined && opts.format !== "text" && opts.format !== "markdown") reportText({} as Report, opts.format, false);
  if (opts.output && opts.output !== "-") checkWritable(opts.output, "-o");
  if (opts.json) checkWritable(opts.json, "--json");
  if (opts.html) checkWritable(opts.html, "--html");

  const source = parseQasmFile(file, { includeDirs: opts.include ?? [], params: parseParams(opts.param) });
  const progress = opts.progress === false ? { update: () => {}, stop: () => {} } : progressReporter("synthesizing");
  let result;
  try {
    result = await lowerProgram(source, {
      policy,
      snap: opts.snap ?? false,
      method,
      jobs,
      cache: createSynthCache(opts.cache ?? null),
      onProgress: progress.update,
      version: toolVersion(),
      reportOptions: {
        budget: policy.kind === "budget" ? policy.budget : null,
        perRotation: policy.kind === "per-rotation" ? policy.eps : null,
        snap: opts.snap ?? false,
        method,
      },
    });
  } finally {
    progress.stop();
  }
  const { circuit, comments, report } = result;
  const header = [`lowered to Clifford+T by tledger ${report.tool.version} from ${file}`, `error budget ${report.budget}, error bound ${report.errorBound}, T-count ${report.tCount}`].join("\n");
  const writeOpts = { header, commentBefore: (s: Stmt) => (s.kind === "gate" ? comments.get(s)?.join("\n") : undefined) };
  // Colour on the report only when it goes to a terminal (NO_COLOR is honoured by io.color).
  const toFile = opts.output !== undefined && opts.output !== "-";
  const color = io.color && Boolean(toFile ? process.stdout.isTTY : process.stderr.isTTY);
  const summary = reportText(report, opts.format, color);
  // Each output is written atomically; the circuit (possibly hundreds of megabytes) streams in chunks.
  if (toFile) writeFileAtomicChunks(opts.output!, (sink) => writeQasm3Chunks(circuit, writeOpts, sink));
  if (opts.json) writeFileAtomic(opts.json, toJson(report));
  if (opts.html) {
    const { renderHtml } = await import("../report/html/page.js");
    writeFileAtomic(opts.html, renderHtml({ report, title: `tledger: ${file}`, source: file }));
  }
  if (!toFile) {
    io.stdout(writeQasm3(circuit, writeOpts));
    io.stderr(summary);
  } else io.stdout(summary);
  return report;
}

export function registerLower(program: Command, setExit: (code: number) => void): void {
  program
    .command("lower")
    .description("lower every rotation to Clifford+T within one error budget; write the circuit and report the ledger")
    .argument("<file>", "the program (OpenQASM 3 or 2.0)")
    .option("-o, --output <file>", "write the Clifford+T circuit to FILE (else to standard output, with the report on standard error)")
    .option("--budget <eps>", `total error budget for the whole program, distance up to global phase (default ${DEFAULT_BUDGET})`)
    .option("--per-rotation <eps>", "give every approximated rotation this eps instead of sharing a budget")
    .option("--json <file>", "write the report as JSON to FILE")
    .option("--html <file>", "write a self-contained HTML report to FILE")
    .option("--format <kind>", "report on the terminal as text or markdown", "text")
    .option("--snap", "treat literal angles equal to k*pi/4 in double precision as exact (the snap error is booked)")
    .option("--method <name>", `synthesis method: ${METHODS.join(" or ")}`, "number-theoretic")
    .option("--jobs <n>", "worker threads for synthesis (default: the number of cores)")
    .option("--cache <dir>", "keep synthesized words in DIR and reuse them (every entry is re-verified when read)")
    .option("--no-progress", "never show a progress bar")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (file: string, opts: LowerCliOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      setExit(await runCommand(async (io) => void (await lowerCommand(file, opts, io)), { debug }));
    });
}
