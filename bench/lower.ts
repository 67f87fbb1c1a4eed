// Whole-circuit lowering benchmark: a 100-qubit spin chain with 10^5 rotation instances, and a 64-qubit QFT at three budgets.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { qftProgram, spinChainProgram } from "./circuits.js";

interface Run {
  readonly seconds: number;
  readonly maxRssMb: number;
  readonly report: { tCount: number; tDepth: number; errorBound: string; rotations: { approximated: number; distinct: number; cached: number } };
}

const CHILD = join(dirname(fileURLToPath(import.meta.url)), "lower-child.js");

function lower(file: string, args: string[], dir: string): Run {
  const out = join(dir, "out.qasm");
  const json = join(dir, "report.json");
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ["--max-old-space-size=8192", CHILD, "--debug", "lower", file, "-o", out, "--json", json, "--no-progress", ...args], { encoding: "utf8", maxBuffer: 1 << 26 });
  const seconds = (performance.now() - t0) / 1000;
  if (r.status !== 0) throw new Error(`lower failed (${r.status}): ${r.stderr.slice(-2000)}`);
  const kb = Number(/BENCH-MAXRSS-KB (\d+)/.exec(r.stderr)?.[1] ?? "0");
  return { seconds, maxRssMb: kb / 1024, report: JSON.parse(readFileSync(json, "utf8")) };
}

export async function benchLower(): Promise<string> {
  const dir = mkdtempSync(join(tmpdir(), "tledger-bench-"));
  const lines: string[] = [];
  try {
    const chain = join(dir, "spin-chain-100.qasm");
    writeFileSync(chain, spinChainProgram(100, 503));
    const cache = join(dir, "cache");
    const j1 = lower(chain, ["--budget", "1e-6", "--jobs", "1"], dir);
    const j2 = lower(chain, ["--budget", "1e-6", "--jobs", "2", "--cache", cache], dir);
    const warm = lower(chain, ["--budget", "1e-6", "--jobs", "2", "--cache", cache], dir);
    const r = j2.report;
    lines.push(
      `Spin chain: 100 qubits, ${r.rotations.approximated} rotation instances, ${r.rotations.distinct} distinct angles, budget 1e-6 ` +
        `(T-count ${r.tCount}, T-depth ${r.tDepth}, error bound ${r.errorBound})`,
      "",
      "| run | seconds | peak RSS (MB) | rotations from cache |",
      "| --- | ---: | ---: | ---: |",
      `| --jobs 1 | ${j1.seconds.toFixed(1)} | ${j1.maxRssMb.toFixed(0)} | ${j1.report.rotations.cached} |`,
      `| --jobs 2 (cold disk cache) | ${j2.seconds.toFixed(1)} | ${j2.maxRssMb.toFixed(0)} | ${j2.report.rotations.cached} |`,
      `| --jobs 2, warm disk cache | ${warm.seconds.toFixed(1)} | ${warm.maxRssMb.toFixed(0)} | ${warm.report.rotations.cached} |`,
      "",
      `Speed-up of 2 jobs over 1: ${(j1.seconds / j2.seconds).toFixed(2)}x. Outputs identical across the three runs: ${j1.report.tCount === j2.report.tCount && j2.report.tCount === warm.report.tCount ? "yes (T-count)" : "NO"}.`,
      "",
    );
    const qft = join(dir, "qft-64.qasm");
    writeFileSync(qft, qftProgram(64));
    lines.push("QFT on 64 qubits (2016 controlled phases):", "", "| budget | approximated rotations | T-count | T-depth | error bound | seconds |", "| ---: | ---: | ---: | ---: | ---: | ---: |");
    for (const b of ["1e-3", "1e-6", "1e-9"]) {
      const q = lower(qft, ["--budget", b, "--jobs", "2"], dir);
      lines.push(`| ${b} | ${q.report.rotations.approximated} | ${q.report.tCount} | ${q.report.tDepth} | ${q.report.errorBound} | ${q.seconds.toFixed(1)} |`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return lines.join("\n");
}
