// End-to-end tests of `tledger sweep`: the cost curve over a range of budgets, its SVG plot and JSON, each point as lower gives it.
import { beforeAll, describe, expect, it } from "vitest";
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { EXIT_INPUT, EXIT_OK, runCommand } from "../../src/cli/common.js";
import { sweepCommand, type SweepOptions } from "../../src/cli/sweep.js";
import { dec } from "../../src/numeric/decimal.js";
import type { SweepPoint } from "../../src/report/html/types.js";
import type { Report } from "../../src/report/types.js";
import { capture, freshDir, runLower, type CapturedIo } from "./helpers.js";

async function runSweep(file: string, opts: SweepOptions): Promise<{ code: number; io: CapturedIo; points: SweepPoint[] | null }> {
  const io = capture();
  let points: SweepPoint[] | null = null;
  const code = await runCommand(
    async (x) => {
      points = await sweepCommand(file, { progress: false, jobs: "1", ...opts }, x);
    },
    { io },
  );
  return { code, io, points };
}

describe("sweep a small fixture from 1e-2 to 1e-6 in 3 points", () => {
  const file = "fixtures/qasm2-heisenberg.qasm";
  let dir = "";
  let svg = "";
  let run: Awaited<ReturnType<typeof runSweep>>;

  beforeAll(async () => {
    dir = freshDir("sweep");
    svg = join(dir, "curve.svg");
    run = await runSweep(file, { from: "1e-2", to: "1e-6", points: "3", svg, json: true });
  });

  it("lowers at 1e-2, 1e-4 and 1e-6; T-count never falls as the budget tightens; each bound within its budget", () => {
    expect(run.code, run.io.err).toBe(EXIT_OK);
    const points = run.points!;
    // Evenly spaced on a log scale, both ends included: 1e-2, 1e-4, 1e-6.
    expect(points.map((p) => dec(p.budget).toString())).toEqual(["0.01", "0.0001", "0.000001"]);
    for (let i = 1; i < points.length; i++) {
      expect(points[i]!.tCount, `T-count at ${points[i]!.budget} against ${points[i - 1]!.budget}`).toBeGreaterThanOrEqual(points[i - 1]!.tCount);
    }
    // 9 rotations and 100 times less error per step: the T-count must actually grow (about 9 * 3 log2(100) per step).
    expect(points[2]!.tCount).toBeGreaterThan(points[0]!.tCount);
    for (const p of points) expect(dec(p.errorBound).lte(dec(p.budget)), `bound ${p.errorBound} > budget ${p.budget}`).toBe(true);
  });

  it("prints the points as JSON", () => {
    const j = JSON.parse(run.io.out) as { file: string; rotations: number; points: SweepPoint[] };
    expect(j.file).toBe(file);
    expect(j.points).toEqual(run.points);
    expect(j.rotations).toBeGreaterThan(0);
  });

  it("gives at each point what lower gives at that budget", async () => {
    const p = run.points![1]!;
    const { code, io, report } = await runLower(file, { output: join(freshDir("sweep"), "out.qasm"), budget: p.budget });
    expect(code, io.err).toBe(EXIT_OK);
    const r = report as unknown as Report;
    expect({ tCount: p.tCount, tDepth: p.tDepth, errorBound: p.errorBound }).toEqual({ tCount: r.tCount, tDepth: r.tDepth, errorBound: r.errorBound });
  });

  it("writes a standalone SVG", () => {
    expect(existsSync(svg)).toBe(true);
    const text = readFileSync(svg, "utf8");
    expect(text).toContain("<svg");
    // A standalone SVG file declares the SVG namespace (W3C SVG 1.1, section 5.1; from memory).
    expect(text).toMatch(/xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    expect(text.trimEnd().endsWith("</svg>")).toBe(true);
    // One opening svg element and no HTML page around it.
    expect(text).not.toMatch(/<html|<body|<script/i);
  });

  it("prints a table when --json is not given", async () => {
    const { code, io } = await runSweep(file, { from: "1e-2", to: "1e-3", points: "2" });
    expect(code, io.err).toBe(EXIT_OK);
    const lines = io.out.trimEnd().split("\n");
    expect(lines[1]).toMatch(/budget +T-count +T-depth +error bound +seconds/);
    expect(lines.length).toBe(4);
  });
});

describe("sweep refuses bad input", () => {
  const file = "fixtures/qasm2-heisenberg.qasm";

  it("without --from or --to, with a bad budget or a bad point count: exit 2, no SVG written", async () => {
    const dir = freshDir("sweep");
    const svg = join(dir, "curve.svg");
    for (const opts of [{ to: "1e-3" }, { from: "1e-2" }, { from: "0", to: "1e-3" }, { from: "1e-2", to: "1e-3", points: "0" }, { from: "1e-2", to: "1e-3", points: "x" }]) {
      const { code, io } = await runSweep(file, { ...opts, svg });
      expect(code, JSON.stringify(opts)).toBe(EXIT_INPUT);
      expect(io.err).toMatch(/--from|--to|--points/);
      expect(existsSync(svg)).toBe(false);
    }
  });
});
