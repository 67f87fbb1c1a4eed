// End-to-end tests of `tledger report`: a lowered circuit's figures against lower's own report, and the cost estimate of a source.
import { beforeAll, describe, expect, it } from "vitest";
import { join } from "node:path";
import { EXIT_INPUT, EXIT_OK, runCommand } from "../../src/cli/common.js";
import { reportCommand, type CircuitReport, type ReportCliOptions } from "../../src/cli/report.js";
import { dec } from "../../src/numeric/decimal.js";
import type { Report } from "../../src/report/types.js";
import { capture, freshDir, metricFigures, reportFigures, runLower, type CapturedIo } from "./helpers.js";

async function runReport(file: string, opts: ReportCliOptions): Promise<{ code: number; io: CapturedIo; result: CircuitReport | null }> {
  const io = capture();
  let result: CircuitReport | null = null;
  const code = await runCommand(
    async (x) => {
      result = await reportCommand(file, opts, x);
    },
    { io },
  );
  return { code, io, result };
}

describe("report on a lowered circuit", () => {
  const source = "fixtures/phase-estimation.qasm";
  let lowered = "";
  let lowerReport: Report;

  beforeAll(async () => {
    const dir = freshDir("report");
    lowered = join(dir, "pe.clifford-t.qasm");
    const { code, io, report } = await runLower(source, { output: lowered, budget: "1e-3" });
    expect(code, io.err).toBe(EXIT_OK);
    lowerReport = report as unknown as Report;
  });

  it("gives the figures lower reported for the same circuit, and finds nothing to approximate", async () => {
    const { code, io, result } = await runReport(lowered, { json: true });
    expect(code, io.err).toBe(EXIT_OK);
    const r = result as unknown as CircuitReport;
    // What was printed is what was returned.
    expect(JSON.parse(io.out)).toEqual(JSON.parse(JSON.stringify(r)));
    expect(r.kind).toBe("circuit");
    expect(r.schemaVersion).toBe(1);
    const l = lowerReport;
    expect(metricFigures(r.metrics)).toEqual(reportFigures(l));
    expect(l.tCount).toBeGreaterThan(0);
    // A Clifford+T circuit needs no approximation: the estimate is its own T-count at every budget.
    expect(r.estimate.rotations).toBe(0);
    for (const b of r.estimate.budgets) expect(b.tCount).toBe(l.tCount);
  });

  it("prints the same figures as text", async () => {
    const { code, io } = await runReport(lowered, {});
    expect(code, io.err).toBe(EXIT_OK);
    expect(io.out).toMatch(new RegExp(`\\n +T-count +${lowerReport.tCount}\\n`));
    expect(io.out).toMatch(new RegExp(`\\n +T-depth +${lowerReport.tDepth}\\n`));
    expect(io.out).toMatch(new RegExp(`\\n +CX count +${lowerReport.cxCount}\\n`));
    expect(io.out).toMatch(/no rotation needs approximating/);
  });
});

describe("report on a source with rotations", () => {
  const source = "fixtures/qasm2-heisenberg.qasm";
  const budgets = ["1e-8", "1e-2", "1e-6", "1e-4"];

  it("lists each budget asked for, in order, with T-count estimates that fall as the budget loosens", async () => {
    const { code, io, result } = await runReport(source, { json: true, budget: budgets });
    expect(code, io.err).toBe(EXIT_OK);
    const e = (result as unknown as CircuitReport).estimate;
    expect(e.budgets.map((b) => dec(b.budget).toString())).toEqual(budgets.map((b) => dec(b).toString()));
    expect(e.rotations).toBeGreaterThan(0);
    const byBudget = [...e.budgets].sort((a, b) => dec(a.budget).comparedTo(dec(b.budget)));
    for (let i = 1; i < byBudget.length; i++) {
      expect(byBudget[i]!.tCount, `T at ${byBudget[i]!.budget} against ${byBudget[i - 1]!.budget}`).toBeLessThan(byBudget[i - 1]!.tCount);
      expect(byBudget[i]!.tEach).toBeLessThan(byBudget[i - 1]!.tEach);
    }
    // Equal shares: each rotation instance gets budget / rotations.
    for (const b of e.budgets) expect(Math.abs(Number(b.share) * e.rotations - Number(b.budget)) / Number(b.budget)).toBeLessThan(1e-3);
  });

  it("counts the rotations lower approximates, and estimates its T-count within a fifth", async () => {
    const { result } = await runReport(source, { json: true, budget: ["1e-4"] });
    const e = (result as unknown as CircuitReport).estimate;
    const dir = freshDir("report");
    const { code, io, report } = await runLower(source, { output: join(dir, "out.qasm"), budget: "1e-4" });
    expect(code, io.err).toBe(EXIT_OK);
    const l = report as unknown as Report;
    expect(e.rotations).toBe(l.rotations.approximated);
    expect(e.distinct).toBe(l.rotations.distinct);
    // The estimate is 3 log2(1/share) per rotation plus a measured offset (Ross & Selinger 2014, from memory, give
    // 3 log2(1/eps) + O(log log(1/eps)) as the typical T-count); a fifth either way leaves room for the offset.
    const est = e.budgets[0]!.tCount;
    expect(Math.abs(est - l.tCount) / l.tCount, `estimate ${est}, actual ${l.tCount}`).toBeLessThan(0.2);
  });

  it("writes the estimate table as text and as markdown", async () => {
    const text = await runReport(source, { budget: budgets });
    expect(text.code).toBe(EXIT_OK);
    for (const b of budgets) expect(text.io.out).toMatch(new RegExp(`\\n +${dec(b).toString()} +`));

    const md = await runReport(source, { budget: budgets, format: "markdown" });
    expect(md.code).toBe(EXIT_OK);
    const lines = md.io.out.split("\n");
    // A header row, a separator row and one row per budget.
    const head = lines.findIndex((l) => /^\| budget \|/.test(l));
    expect(head).toBeGreaterThanOrEqual(0);
    expect(lines[head + 1]).toMatch(/^\|( -+:? \|)+$/);
    const rows = lines.slice(head + 2).filter((l) => l.startsWith("|"));
    expect(rows.length).toBe(budgets.length);
    const cols = lines[head]!.split("|").length;
    for (const r of rows) expect(r.split("|").length).toBe(cols);
    // The figures table too.
    expect(md.io.out).toMatch(/^\| figure \| value \|$/m);
  });

  it("refuses a bad budget or format with exit 2", async () => {
    const a = await runReport(source, { budget: ["1e-3", "0"] });
    expect(a.code).toBe(EXIT_INPUT);
    expect(a.io.err).toContain("--budget");
    const b = await runReport(source, { format: "html" });
    expect(b.code).toBe(EXIT_INPUT);
    expect(b.io.err).toContain("--format");
  });
});
