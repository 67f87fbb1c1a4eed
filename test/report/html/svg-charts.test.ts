// Tests of the SVG charts: well-formed XML, monotone axes, drawn values that map back to the data, escaping, determinism.
import { all, create } from "mathjs";
import { describe, expect, it } from "vitest";
import { budgetSvg, qubitTSvg, sweepSvg, yardstickT } from "../../../src/report/html/svg-charts.js";
import type { QubitRow, Report } from "../../../src/report/types.js";
import type { SweepPoint } from "../../../src/report/html/types.js";
import { fixtureReport, fixtureSweep, HOSTILE, hostileReport } from "./fixture.js";
import { elements, xmlProblems } from "./xml-check.js";

// mathjs as an independent reference for the decimal and logarithm arithmetic (its own instance, 64 digits).
const math = create(all, { number: "BigNumber", precision: 64 });
const big = (s: string | number) => math.bignumber(s);

function translate(t: string): [number, number] {
  const m = /^translate\(([-\d.]+),([-\d.]+)\)$/.exec(t);
  if (m === null) throw new Error(`not a translate: ${t}`);
  return [Number(m[1]), Number(m[2])];
}

function ticks(svg: string, axis: "x" | "y"): { value: string; x: number; y: number }[] {
  return elements(svg, "g", "data-tick")
    .filter((a) => a["data-tick"] === axis)
    .map((a) => {
      const [x, y] = translate(a.transform);
      return { value: a["data-value"], x, y };
    });
}

/** The vertices of an SVG path made of M and L commands only. */
function vertices(d: string): [number, number][] {
  expect(d).toMatch(/^M[-\d.,L]+$/);
  return d.slice(1).split("L").map((p) => p.split(",").map(Number) as [number, number]);
}

/** The linear map pixel -> value read off the first and last y ticks. */
function yInverse(svg: string): (py: number) => number {
  const t = ticks(svg, "y");
  const a = t[0];
  const b = t[t.length - 1];
  return (py) => Number(a.value) + ((py - a.y) * (Number(b.value) - Number(a.value))) / (b.y - a.y);
}

/** The log map pixel -> log10(budget) read off the first and last labelled x ticks. */
function xInverse(svg: string): (px: number) => number {
  const t = ticks(svg, "x");
  const a = t[0];
  const b = t[t.length - 1];
  const la = Math.log10(Number(a.value));
  const lb = Math.log10(Number(b.value));
  return (px) => la + ((px - a.x) * (lb - la)) / (b.x - a.x);
}

describe("xml checker (test helper)", () => {
  it("accepts a small document and rejects broken ones", () => {
    expect(xmlProblems(`<svg a="1"><g/><text>x &amp; y</text></svg>`)).toEqual([]);
    expect(xmlProblems(`<svg><g></svg>`)).not.toEqual([]);
    expect(xmlProblems(`<svg a="<"></svg>`)).not.toEqual([]);
    expect(xmlProblems(`<svg>a & b</svg>`)).not.toEqual([]);
    expect(xmlProblems(`<svg>a < b</svg>`)).not.toEqual([]);
    expect(xmlProblems(`<svg/><svg/>`)).not.toEqual([]);
    expect(xmlProblems(`<svg a="1" a="2"/>`)).not.toEqual([]);
    expect(xmlProblems(`<svg>\u0001</svg>`)).not.toEqual([]);
  });
});

describe("sweepSvg", () => {
  const pts = fixtureSweep();
  const svg = sweepSvg(pts, { rotations: 7 });

  it("is well-formed XML, inline and standalone", () => {
    expect(xmlProblems(svg)).toEqual([]);
    const doc = sweepSvg(pts, { rotations: 7, standalone: true });
    expect(xmlProblems(doc)).toEqual([]);
    expect(doc.startsWith(`<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg"`)).toBe(true);
    expect(doc.endsWith("</svg>\n")).toBe(true);
  });

  it("runs its budget axis from loose (left) to tight (right), ticks strictly monotone", () => {
    const xt = ticks(svg, "x");
    expect(xt.length).toBeGreaterThanOrEqual(2);
    expect(xt.length).toBeLessThanOrEqual(8);
    for (let i = 1; i < xt.length; i++) {
      expect(xt[i].x).toBeGreaterThan(xt[i - 1].x);
      expect(Number(xt[i].value)).toBeLessThan(Number(xt[i - 1].value));
    }
    const yt = ticks(svg, "y");
    expect(Number(yt[0].value)).toBe(0);
    for (let i = 1; i < yt.length; i++) {
      expect(Number(yt[i].value)).toBeGreaterThan(Number(yt[i - 1].value));
      expect(yt[i].y).toBeLessThan(yt[i - 1].y);
    }
    // the T-count axis covers every point
    expect(Number(yt[yt.length - 1].value)).toBeGreaterThanOrEqual(Math.max(...pts.map((p) => p.tCount)));
  });

  it("places every point where its budget and T-count say", () => {
    const circles = elements(svg, "circle", "data-budget");
    expect(circles.map((c) => c["data-budget"]).sort()).toEqual(pts.map((p) => p.budget).sort());
    const toT = yInverse(svg);
    const toLog = xInverse(svg);
    for (const c of circles) {
      const p = pts.find((q) => q.budget === c["data-budget"]) as SweepPoint;
      expect(c["data-t"]).toBe(String(p.tCount));
      expect(Math.abs(toT(Number(c.cy)) - p.tCount)).toBeLessThan(0.05);
      expect(Math.abs(toLog(Number(c.cx)) - Math.log10(Number(p.budget)))).toBeLessThan(1e-3);
    }
    // circles follow the budget from loose to tight
    const xs = circles.map((c) => Number(c.cx));
    expect([...xs].sort((a, b) => a - b)).toEqual(xs);
  });

  it("draws the yardstick R * 3 log2(R / budget) where the formula puts it", () => {
    // Ross & Selinger 2014 (from memory): about 3 log2(1/eps) T gates per z-rotation; with the
    // budget shared equally among R rotations (design note, section 9) the total is R * 3 log2(R / budget).
    const path = elements(svg, "path", "data-series").find((a) => a["data-series"] === "yardstick");
    expect(path).toBeDefined();
    const toT = yInverse(svg);
    const toLog = xInverse(svg);
    const vs = vertices((path as Record<string, string>).d);
    expect(vs.length).toBeGreaterThan(10);
    for (const [px, py] of vs) {
      const budget = big(10).pow(big(toLog(px)));
      const expected = Math.max(0, big(21).times(big(7).div(budget).log(2)).toNumber());
      expect(Math.abs(toT(py) - expected)).toBeLessThan(0.2);
    }
    expect(yardstickT(7, 1e-4)).toBeCloseTo(21 * Math.log2(7e4), 9);
    expect(yardstickT(7, 100)).toBe(0);
    expect(yardstickT(0, 1e-4)).toBe(0);
    expect(sweepSvg(pts)).not.toContain(`data-series="yardstick"`);
  });

  it("gives the same bytes for the same points in any order", () => {
    expect(sweepSvg(pts, { rotations: 7 })).toBe(svg);
    expect(sweepSvg([...pts].reverse(), { rotations: 7 })).toBe(svg);
  });

  it("copes with one point, a narrow range and forty decades", () => {
    const one = sweepSvg([pts[2]], { rotations: 7 });
    expect(xmlProblems(one)).toEqual([]);
    expect(elements(one, "circle", "data-budget")).toHaveLength(1);
    const narrow = sweepSvg([
      { budget: "2e-6", tCount: 300, tDepth: 100, errorBound: "1.9e-6", seconds: 1 },
      { budget: "1e-6", tCount: 310, tDepth: 104, errorBound: "9e-7", seconds: 1 },
    ]);
    const wide = sweepSvg([
      { budget: "1e-1", tCount: 10, tDepth: 5, errorBound: "5e-2", seconds: 1 },
      { budget: "1e-40", tCount: 4000, tDepth: 2000, errorBound: "9e-41", seconds: 1 },
    ], { rotations: 3 });
    for (const s of [narrow, wide]) {
      expect(xmlProblems(s)).toEqual([]);
      const xt = ticks(s, "x");
      expect(xt.length).toBeGreaterThanOrEqual(2);
      expect(xt.length).toBeLessThanOrEqual(8);
      for (let i = 1; i < xt.length; i++) {
        expect(xt[i].x).toBeGreaterThan(xt[i - 1].x);
        expect(Number(xt[i].value)).toBeLessThan(Number(xt[i - 1].value));
      }
    }
  });

  it("says so when there is nothing to draw, and refuses points it cannot draw", () => {
    const empty = sweepSvg([]);
    expect(xmlProblems(empty)).toEqual([]);
    expect(empty).toContain("No sweep points");
    const ok = pts[0];
    for (const bad of [
      { ...ok, budget: "0" },
      { ...ok, budget: "-1e-3" },
      { ...ok, budget: "1e-999" },
      { ...ok, budget: "abc" },
      { ...ok, tCount: -1 },
      { ...ok, tCount: 1.5 },
      { ...ok, errorBound: "NaN" },
      { ...ok, seconds: Number.NaN },
    ]) {
      expect(() => sweepSvg([bad])).toThrow(RangeError);
    }
    expect(() => sweepSvg(pts, { rotations: -1 })).toThrow(RangeError);
  });
});

describe("qubitTSvg", () => {
  const rows = fixtureReport().perQubit;

  it("draws one bar per qubit carrying its label and T-count, heights in proportion", () => {
    const svg = qubitTSvg(rows);
    expect(xmlProblems(svg)).toEqual([]);
    const bars = elements(svg, "rect", "data-qubit");
    expect(bars.map((b) => [b["data-qubit"], b["data-label"], b["data-t"]])).toEqual(rows.map((r) => [String(r.qubit), r.label, String(r.tCount)]));
    const perT = bars.map((b, i) => Number(b.height) / rows[i].tCount);
    for (const k of perT) expect(Math.abs(k - perT[0])).toBeLessThan(0.01);
    for (const r of rows) expect(svg).toContain(`<title>${r.label}: T-count ${r.tCount}, T-depth ${r.tDepth}</title>`);
    // bar tops map back to the T-counts through the axis ticks
    const toT = yInverse(svg);
    bars.forEach((b, i) => expect(Math.abs(toT(Number(b.y)) - rows[i].tCount)).toBeLessThan(0.05));
  });

  it("keeps every bar of a wide register but thins its labels", () => {
    const many: QubitRow[] = Array.from({ length: 200 }, (_, q) => ({ qubit: q, label: `chain[${q}]`, tCount: (q * 37) % 23, tDepth: q % 5 }));
    const svg = qubitTSvg(many);
    expect(xmlProblems(svg)).toEqual([]);
    const bars = elements(svg, "rect", "data-qubit");
    expect(bars.map((b) => Number(b["data-t"]))).toEqual(many.map((r) => r.tCount));
    const labels = ticks(svg, "x");
    expect(labels.length).toBeLessThan(many.length);
    expect(labels.length).toBeGreaterThan(5);
    for (let i = 1; i < labels.length; i++) expect(labels[i].x).toBeGreaterThan(labels[i - 1].x);
    // zero-T qubits have zero-height bars
    bars.forEach((b, i) => { if (many[i].tCount === 0) expect(Number(b.height)).toBe(0); });
  });

  it("handles no qubits", () => {
    const svg = qubitTSvg([]);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain("no qubits");
  });
});

describe("budgetSvg", () => {
  const report = fixtureReport();

  it("splits the stacked bar by exact error times copies, largest first, then the unspent rest", () => {
    const svg = budgetSvg(report);
    expect(xmlProblems(svg)).toEqual([]);
    const slices = elements(svg, "rect", "data-item");
    const amounts = report.ledger.map((r) => big(r.error).times(r.instances));
    const costly = report.ledger.map((_, i) => i).filter((i) => !amounts[i].isZero());
    costly.sort((a, b) => amounts[b].comparedTo(amounts[a]) || a - b);
    expect(slices.map((s) => s["data-row"])).toEqual([...costly.map(String), "-1"]);
    slices.slice(0, -1).forEach((s, k) => expect(big(s["data-amount"]).equals(amounts[costly[k]])).toBe(true));
    const spent = amounts.reduce((a, b) => a.plus(b));
    const unspent = slices[slices.length - 1];
    expect(unspent["data-item"]).toBe("unspent");
    expect(big(unspent["data-amount"]).equals(big(report.budget).minus(spent))).toBe(true);
    // widths are in proportion to the amounts and fill the bar
    const total = slices.reduce((s, x) => s + Number(x.width), 0);
    expect(Math.abs(total - 696)).toBeLessThan(0.05);
    for (const s of slices) expect(Math.abs(Number(s.width) / 696 - big(s["data-amount"]).div(big(report.budget)).toNumber())).toBeLessThan(1e-4);
    expect(svg).toContain("61.5%");
    expect(svg).toContain("1 ledger row was lowered exactly");
  });

  it("marks the budget when the spending exceeds it", () => {
    const over: Report = { ...report, budget: "1e-4" };
    const svg = budgetSvg(over);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain(`data-marker="budget"`);
    expect(svg).not.toContain(`data-item="unspent"`);
    expect(svg).toContain("over budget");
    const marker = elements(svg, "line", "data-marker")[0];
    // the budget sits at 1e-4 / 1.23e-4 of the bar
    expect(Math.abs((Number(marker.x1) - 12) / 696 - 1e-4 / 1.23e-4)).toBeLessThan(1e-4);
  });

  it("has a sentence instead of a bar when the budget is zero and nothing was spent", () => {
    const zero: Report = { ...report, budget: "0", errorBound: "0", ledger: [report.ledger[3]] };
    const svg = budgetSvg(zero);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain("The budget is zero and nothing was spent.");
  });
});

describe("escaping", () => {
  it("keeps hostile labels as text in every chart", () => {
    const r = hostileReport();
    for (const svg of [budgetSvg(r), qubitTSvg(r.perQubit), sweepSvg(fixtureSweep(), { title: HOSTILE })]) {
      expect(xmlProblems(svg)).toEqual([]);
      expect(svg).not.toMatch(/<script/i);
      expect(svg).toContain("&lt;script&gt;");
    }
    const bars = elements(qubitTSvg(r.perQubit), "rect", "data-qubit");
    // the control character and the lone surrogate become U+FFFD; everything else survives
    const expected = HOSTILE.replace("\u0001", "\uFFFD").replace("\uD800", "\uFFFD");
    expect(bars.map((b) => b["data-label"])).toEqual(r.perQubit.map((q) => `${expected}[${q.qubit}]`));
  });
});
