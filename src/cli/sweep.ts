// `tledger sweep IN --from EPS --to EPS`: lower the program at a range of budgets (sharing the synthesis cache) and tabulate the cost curve.
import type { Command } from "commander";
import { parseQasmFile } from "../frontend/frontend.js";
import { lowerProgram } from "../lower.js";
import { createSynthCache } from "../passes/pipeline.js";
import { dec } from "../numeric/decimal.js";
import type { SweepPoint } from "../report/html/types.js";
import { collect, parseParams, runCommand, usageError, writeFileAtomic, type Io } from "./common.js";
import { readErrorOption, readJobs } from "./options.js";
import { checkWritable, progressReporter, readMethod } from "./lower.js";
import { toolVersion } from "./version.js";

export interface SweepOptions {
  readonly from?: string;
  readonly to?: string;
  readonly points?: string;
  readonly svg?: string;
  readonly json?: boolean;
  readonly jobs?: string;
  readonly cache?: string;
  readonly method?: string;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
  readonly progress?: boolean;
}

/** `n` budgets spaced evenly on a log scale from `from` to `to` (both included), 3 significant digits. */
export function sweepBudgets(from: string, to: string, n: number): string[] {
  const a = Math.log10(Number(from));
  const b = Math.log10(Number(to));
  const out: string[] = [];
  for (let i = 0; i < n; i++) {
    const x = n === 1 ? from : i === 0 ? from : i === n - 1 ? to : dec(Math.pow(10, a + ((b - a) * i) / (n - 1)).toPrecision(3)).toString();
    if (!out.includes(x)) out.push(x);
  }
  return out;
}

export async function sweepCommand(file: string, opts: SweepOptions, io: Io): Promise<SweepPoint[]> {
  if (opts.from === undefined || opts.to === undefined) throw usageError("sweep needs --from EPS and --to EPS", "for example --from 1e-2 --to 1e-8");
  const from = readErrorOption("--from", opts.from);
  const to = readErrorOption("--to", opts.to);
  const pointsText = opts.points ?? "5";
  if (!/^\d+$/.test(pointsText) || Number(pointsText) < 1 || Number(pointsText) > 100) throw usageError(`--points expects a whole number from 1 to 100, got '${pointsText}'`);
  const method = readMethod(opts.method);
  const jobs = readJobs(opts.jobs);
  if (opts.svg) checkWritable(opts.svg, "--svg");
  const source = parseQasmFile(file, { includeDirs: opts.include ?? [], params: parseParams(opts.param) });
  const cache = createSynthCache(opts.cache ?? null);
  const budgets = sweepBudgets(from, to, Number(pointsText));
  const progress = opts.progress === false ? { update: () => {}, stop: () => {} } : progressReporter("sweeping");
  const points: SweepPoint[] = [];
  let rotations = 0;
  try {
    for (let i = 0; i < budgets.length; i++) {
      const t0 = performance.now();
      const { report } = await lowerProgram(source, { policy: { kind: "budget", budget: budgets[i]! }, method, jobs, cache, version: toolVersion() });
      rotations = report.rotations.approximated;
      points.push({ budget: report.budget, tCount: report.tCount, tDepth: report.tDepth, errorBound: report.errorBound, seconds: Number(((performance.now() - t0) / 1000).toFixed(3)) });
      progress.update(i + 1, budgets.length);
    }
  } finally {
    progress.stop();
  }
  if (opts.svg) {
    const { sweepSvg } = await import("../report/html/svg-charts.js");
    writeFileAtomic(opts.svg, sweepSvg(points, { rotations, standalone: true, title: `T-count against error budget: ${file}` }));
  }
  if (opts.json) io.stdout(JSON.stringify({ file, rotations, points }, null, 2) + "\n");
  else {
    const rows = points.map((p) => [p.budget, String(p.tCount), String(p.tDepth), p.errorBound, p.seconds.toFixed(2)]);
    const head = ["budget", "T-count", "T-depth", "error bound", "seconds"];
    const w = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
    const line = (r: string[]) => r.map((v, i) => v.padStart(w[i]!)).join("  ");
    io.stdout([`${file}: ${rotations} rotations approximated per lowering`, line(head), ...rows.map(line)].join("\n") + "\n");
  }
  return points;
}

export function registerSweep(program: Command, setExit: (code: number) => void): void {
  program
    .command("sweep")
    .description("lower the program at budgets spaced on a log scale and tabulate T-count, T-depth and error bound")
    .argument("<file>", "the program")
    .option("--from <eps>", "the loosest budget")
    .option("--to <eps>", "the tightest budget")
    .option("--points <n>", "how many budgets", "5")
    .option("--svg <file>", "write a log-scale plot of T-count against budget, with the 3 log2(1/eps) yardstick")
    .option("--json", "print the points as JSON")
    .option("--method <name>", "synthesis method", "number-theoretic")
    .option("--jobs <n>", "worker threads for synthesis (default: the number of cores)")
    .option("--cache <dir>", "keep synthesized words in DIR and reuse them (re-verified when read)")
    .option("--no-progress", "never show a progress bar")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (file: string, opts: SweepOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      setExit(await runCommand(async (io) => void (await sweepCommand(file, opts, io)), { debug }));
    });
}
