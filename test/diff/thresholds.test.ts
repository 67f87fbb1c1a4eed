import { describe, expect, test } from "vitest";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { diffSides, METRIC_NAMES, type DiffResult } from "../../src/diff/compare.js";
import { checkThresholds, parseThresholds } from "../../src/diff/thresholds.js";
import { diffJson, diffMarkdown, diffText } from "../../src/diff/format.js";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import type { Report } from "../../src/report/types.js";
import { circuit, g } from "../helpers/circuit-builder.js";
import { reportOf } from "./fixtures.js";

function diagnostics(f: () => unknown): DiagnosticError {
  try {
    f();
  } catch (e) {
    if (e instanceof DiagnosticError) return e;
    throw e;
  }
  throw new Error("expected a DiagnosticError");
}

describe("parsing --max-increase", () => {
  test("absolute, percentage and decimal limits, lists and repeated flags", () => {
    expect(parseThresholds("tDepth=0")).toEqual([{ metric: "tDepth", kind: "absolute", value: "0", text: "tDepth=0" }]);
    expect(parseThresholds("cxCount=10,tCount=2%")).toEqual([
      { metric: "cxCount", kind: "absolute", value: "1e+1", text: "cxCount=10" },
      { metric: "tCount", kind: "percent", value: "2e+0", text: "tCount=2%" },
    ]);
    expect(parseThresholds([" errorBound = 1.5e-12 ", "depth=0.5%,tCount=+3"])).toEqual([
      { metric: "errorBound", kind: "absolute", value: "1.5e-12", text: "errorBound = 1.5e-12" },
      { metric: "depth", kind: "percent", value: "5e-1", text: "depth=0.5%" },
      { metric: "tCount", kind: "absolute", value: "3e+0", text: "tCount=+3" },
    ]);
    // The same metric twice: both limits kept.
    expect(parseThresholds("tCount=5,tCount=1%").map((l) => l.kind)).toEqual(["absolute", "percent"]);
    // Every metric of the diff is accepted.
    expect(parseThresholds(METRIC_NAMES.map((m) => `${m}=1`).join(",")).map((l) => l.metric)).toEqual(METRIC_NAMES);
    expect(parseThresholds([])).toEqual([]);
  });

  test.each([
    ["", "empty entry"],
    ["tCount=1,,tDepth=0", "empty entry"],
    ["tCount=1,", "empty entry"],
    ["tCount", 'has no "="'],
    ["=5", "names no metric"],
    ["tCount=", "gives no limit"],
    ["tCount=abc", "is not a number or a percentage"],
    ["tCount=-1", "is not a non-negative limit"],
    ["tCount=5%%", "is not a number or a percentage"],
    ["tCount=%", "is not a number or a percentage"],
    ["tCount=1e", "is not a number or a percentage"],
    ["tCount=0x10", "is not a number or a percentage"],
    ["tCount=Infinity", "is not a number or a percentage"],
    ["tCount=++1", "is not a number or a percentage"],
    ["tCount=1 0", "is not a number or a percentage"],
    ["tCount=1e99999", "exponent out of range"],
    ["fooCount=1", 'unknown metric "fooCount"'],
    ["tcount=1", "did you mean tCount?"],
    ["t-depth=1", "did you mean tDepth?"],
  ])("%j is refused (%s)", (spec, words) => {
    const e = diagnostics(() => parseThresholds(spec));
    expect(e.diagnostics.length).toBeGreaterThan(0);
    const d = e.diagnostics[0];
    expect([d.severity, d.file, d.line, d.col]).toEqual(["error", "<options>", 0, 0]);
    expect(d.message).toContain(words);
    for (const m of METRIC_NAMES) expect(d.hint).toContain(m);
  });

  test("every problem of a list is reported at once", () => {
    const e = diagnostics(() => parseThresholds("tCount=x,bogus=1,tDepth=0"));
    expect(e.diagnostics.map((d) => d.message)).toEqual([expect.stringContaining('"x"'), expect.stringContaining('"bogus"')]);
  });
});

/** A circuit with `t` T gates and `cx` CNOTs on two qubits (T-depth t, all on qubit 0). */
function tcx(t: number, cx: number): Circuit {
  const body: Stmt[] = [];
  for (let i = 0; i < t; i++) body.push(g("t", [0]));
  for (let i = 0; i < cx; i++) body.push(g("cx", [0, 1]));
  return circuit(2, body);
}

function diffOf(a: Circuit, b: Circuit): DiffResult {
  return diffSides({ label: "a", circuit: a }, { label: "b", circuit: b });
}

describe("checking limits", () => {
  test("absolute limits: an increase equal to the limit holds, one more fails", () => {
    const d = diffOf(tcx(10, 4), tcx(13, 14));
    expect(checkThresholds(d, parseThresholds("tCount=3,cxCount=10"))).toEqual([]);
    const v = checkThresholds(d, parseThresholds("tCount=2,cxCount=10,tDepth=0"));
    expect(v.map((x) => [x.limit.metric, x.reason, x.before, x.after, x.increase, x.allowed])).toEqual([
      ["tCount", "exceeded", 10, 13, 3, "2e+0"],
      ["tDepth", "exceeded", 10, 13, 3, "0"],
    ]);
    // A decrease never fails a limit, even a zero one.
    expect(checkThresholds(diffOf(tcx(13, 14), tcx(10, 4)), parseThresholds("tCount=0,cxCount=0,tDepth=0"))).toEqual([]);
  });

  test("percentage limits are a share of the old value, decided exactly", () => {
    // 100 -> 102: +2 is exactly 2% of 100 (holds); 100 -> 103 is 3% (fails a 2% limit).
    expect(checkThresholds(diffOf(tcx(100, 0), tcx(102, 0)), parseThresholds("tCount=2%"))).toEqual([]);
    const v = checkThresholds(diffOf(tcx(100, 0), tcx(103, 0)), parseThresholds("tCount=2%"));
    expect(v.map((x) => [x.reason, x.increase, x.allowed])).toEqual([["exceeded", 3, "2e+0"]]);
    // 3 -> 4 is +33.33...%: 33.33% of 3 = 0.9999 < 1 fails, 33.34% of 3 = 1.0002 holds.
    expect(checkThresholds(diffOf(tcx(3, 0), tcx(4, 0)), parseThresholds("tCount=33.33%")).length).toBe(1);
    expect(checkThresholds(diffOf(tcx(3, 0), tcx(4, 0)), parseThresholds("tCount=33.34%"))).toEqual([]);
    // From 0 no percentage allows growth; staying at 0 is fine.
    expect(checkThresholds(diffOf(tcx(0, 1), tcx(1, 1)), parseThresholds("tCount=1000%")).length).toBe(1);
    expect(checkThresholds(diffOf(tcx(0, 1), tcx(0, 1)), parseThresholds("tCount=0%"))).toEqual([]);
  });

  function reportWithBound(bound: string): Report {
    // The error bound is the ledger's sum: one row whose error is the bound we want.
    return reportOf(tcx(1, 0), [{ loc: { file: "c.qasm", line: 1, col: 1 }, gate: "rz", angle: { pi: null, value: "0.3" }, epsilon: bound, error: bound, tCount: 1, method: "grid", conditional: false, inLoop: false }]);
  }

  test("error bounds are compared as exact decimals, where doubles would decide wrongly", () => {
    const a = reportWithBound("1e-10");
    const b = reportWithBound("1.00000000001e-10"); // +1e-21 exactly
    const d = diffSides({ label: "a", report: a }, { label: "b", report: b });
    expect(checkThresholds(d, parseThresholds("errorBound=1e-21"))).toEqual([]);
    // In doubles the increase comes out near 9.99997e-22 and would pass this limit.
    expect(1.00000000001e-10 - 1e-10 <= 9.99999e-22).toBe(true);
    const v = checkThresholds(d, parseThresholds("errorBound=9.99999e-22"));
    expect(v.map((x) => [x.before, x.after, x.increase])).toEqual([["1e-10", "1.00000000001e-10", "1e-21"]]);
    // A percentage of a decimal: 1e-21 is exactly 1e-9 % of 1e-10.
    expect(checkThresholds(d, parseThresholds("errorBound=0.000000001%"))).toEqual([]);
    expect(checkThresholds(d, parseThresholds("errorBound=0.00000000099%")).length).toBe(1);
    // And the other way: 0.7 -> 0.8 is +0.1 exactly, which doubles make 0.10000000000000009.
    expect(0.8 - 0.7 <= 0.1).toBe(false);
    const d2 = diffSides({ label: "a", report: reportWithBound("0.7") }, { label: "b", report: reportWithBound("0.8") });
    expect(checkThresholds(d2, parseThresholds("errorBound=0.1"))).toEqual([]);
  });

  test("a limit on a figure a side lacks is unavailable, and counts as failing", () => {
    const d = diffSides({ label: "a", circuit: tcx(1, 0) }, { label: "b", report: reportWithBound("1e-10") });
    const v = checkThresholds(d, parseThresholds("errorBound=1,tCount=5"));
    expect(v.map((x) => [x.limit.metric, x.reason, x.before, x.after, x.increase, x.allowed])).toEqual([["errorBound", "unavailable", null, "1e-10", null, null]]);
  });

  test("violations appear in every format", () => {
    const d = diffOf(tcx(10, 4), tcx(13, 4));
    const limits = parseThresholds("tCount=2,cxCount=0");
    const violations = checkThresholds(d, limits);
    const text = diffText(d, { color: false, checks: { limits, violations } });
    expect(text).toContain("limits: 1 of 2 failed");
    expect(text).toContain("FAIL tCount=2: T-count went from 10 to 13 (+3)");
    expect(diffMarkdown(d, { limits, violations })).toContain("**FAILED**: limits: 1 of 2 failed");
    const json = JSON.parse(diffJson(d, { limits, violations }));
    expect(json.violations[0]).toEqual({ limit: { metric: "tCount", kind: "absolute", value: "2e+0", text: "tCount=2" }, reason: "exceeded", before: 10, after: 13, increase: 3, allowed: "2e+0" });
    expect(diffText(d, { color: false, checks: { limits, violations: [] } })).toContain("limits: all 2 held");
  });
});
