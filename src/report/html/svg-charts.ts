// Charts as SVG strings built at write time (no DOM, no network): T-count against budget, T-count per qubit, and how the budget was spent.
import { max, min, range } from "d3-array";
import { format } from "d3-format";
import { scaleBand, scaleLinear, scaleLog, type ScaleLinear, type ScaleLogarithmic } from "d3-scale";
import { line } from "d3-shape";
import { dec } from "../../numeric/decimal.js";
import { isDecimalText, shortFigure } from "../figures.js";
import type { QubitRow, Report } from "../types.js";
import { budgetSpend } from "./budget-spend.js";
import { attrs, esc, num, shortenEnd, shortenStart } from "./markup.js";
import type { SweepPoint } from "./types.js";

const SVG_NS = "http://www.w3.org/2000/svg";
const FONT = "system-ui, -apple-system, sans-serif";
const INK = "#1d2733";
const MUTED = "#5b6673";
const GRID = "#e4e8ed";
const MEASURED = "#0b6e99";
const YARDSTICK = "#c2571a";
const BAR = "#2f7d5b";
const SLICES = ["#0b6e99", "#c2571a", "#2f7d5b", "#8a4f9e", "#a87a12", "#b03a48", "#4a6fa5", "#5d7f1f"];
const OTHER = "#7d8793";
const UNSPENT = "#e3e7ec";
const OVER = "#b3261e";

const fmtInt = format(",d");
const fmtExp = format("~e");
const fmtSeconds = format(".3~r");

/** Size and form of a chart. */
export interface ChartFrame {
  /** Width in CSS pixels (default 720). */
  readonly width?: number;
  /** Height in CSS pixels (each chart has its own default). */
  readonly height?: number;
  /** A standalone SVG document (XML declaration, trailing newline) instead of an element to inline in HTML. */
  readonly standalone?: boolean;
}

interface Margin {
  readonly top: number;
  readonly right: number;
  readonly bottom: number;
  readonly left: number;
}

function size(v: number | undefined, fallback: number, what: string): number {
  const s = v ?? fallback;
  if (!Number.isFinite(s) || s < 120 || s > 10000) throw new RangeError(`chart ${what} must be between 120 and 10000, got ${s}`);
  return s;
}

/** The outer `<svg>` with its accessible title and description. `kind` goes to `data-chart`. */
function svgDoc(kind: string, w: number, h: number, title: string, desc: string, body: string, standalone: boolean): string {
  const open =
    `<svg` +
    attrs([
      ["xmlns", SVG_NS],
      ["width", w],
      ["height", h],
      ["viewBox", `0 0 ${num(w)} ${num(h)}`],
      ["role", "img"],
      ["data-chart", kind],
      ["font-family", FONT],
      ["font-size", "12"],
      ["fill", INK],
    ]) +
    `>`;
  const svg = `${open}<title>${esc(title)}</title><desc>${esc(desc)}</desc>${body}</svg>`;
  return standalone ? `<?xml version="1.0" encoding="UTF-8"?>\n${svg}\n` : svg;
}

function text(x: number, y: number, s: string, extra: readonly (readonly [string, string | number | undefined])[] = []): string {
  return `<text${attrs([["x", x], ["y", y], ...extra])}>${esc(s)}</text>`;
}

function hline(x1: number, x2: number, y: number, stroke: string): string {
  return `<line${attrs([["x1", x1], ["x2", x2], ["y1", y], ["y2", y], ["stroke", stroke]])}/>`;
}

function vline(x: number, y1: number, y2: number, stroke: string): string {
  return `<line${attrs([["x1", x], ["x2", x], ["y1", y1], ["y2", y2], ["stroke", stroke]])}/>`;
}

/** A chart that has nothing to draw: the frame and one sentence. */
function emptyChart(kind: string, w: number, h: number, title: string, message: string, standalone: boolean): string {
  return svgDoc(kind, w, h, title, message, text(w / 2, h / 2, message, [["text-anchor", "middle"], ["fill", MUTED]]), standalone);
}

/** The vertical axis of a linear integer scale: gridlines, ticks and labels at integer values, and a title. */
function yAxis(y: ScaleLinear<number, number>, m: Margin, w: number, title: string): string {
  const ticks = y.ticks(6).filter((v) => Number.isInteger(v));
  let g = `<g data-axis="y">`;
  for (const v of ticks) {
    const py = y(v);
    g += hline(m.left, w - m.right, py, GRID);
    g += `<g${attrs([["data-tick", "y"], ["data-value", String(v)], ["transform", `translate(${num(m.left)},${num(py)})`]])}>`;
    g += `<line x2="-5" stroke="${MUTED}"/>` + text(-8, 4, fmtInt(v), [["text-anchor", "end"], ["fill", MUTED]]) + `</g>`;
  }
  const [y0, y1] = y.range();
  g += vline(m.left, y0, y1, MUTED);
  const mid = (y0 + y1) / 2;
  g += text(0, 0, title, [["text-anchor", "middle"], ["transform", `translate(${num(16)},${num(mid)}) rotate(-90)`]]);
  return g + `</g>`;
}

// ---------------------------------------------------------------------------------------------
// T-count against budget

/** Options of the sweep chart. */
export interface SweepSvgOptions extends ChartFrame {
  /**
   * R, the number of approximated rotation instances. When positive the chart adds the yardstick
   * `R * 3 log2(R / budget)`: each instance gets the share budget / R and costs about
   * 3 log2(1 / share) T gates (Ross & Selinger 2014, from memory).
   */
  readonly rotations?: number;
  readonly title?: string;
}

/** The yardstick T-count `R * 3 log2(R / budget)` (0 where that is negative), a float for drawing. */
export function yardstickT(rotations: number, budget: number): number {
  if (rotations <= 0) return 0;
  return Math.max(0, 3 * rotations * Math.log2(rotations / budget));
}

function checkPoint(p: SweepPoint, i: number): number {
  if (!isDecimalText(p.budget)) throw new RangeError(`sweep point ${i}: budget "${p.budget}" is not a decimal number`);
  const b = Number(p.budget);
  if (!(b > 0) || !Number.isFinite(b)) throw new RangeError(`sweep point ${i}: budget ${p.budget} must be positive and within float range to be drawn`);
  for (const [k, v] of [["tCount", p.tCount], ["tDepth", p.tDepth]] as const) {
    if (!Number.isSafeInteger(v) || v < 0) throw new RangeError(`sweep point ${i}: ${k} must be a non-negative integer, got ${v}`);
  }
  if (!isDecimalText(p.errorBound)) throw new RangeError(`sweep point ${i}: errorBound "${p.errorBound}" is not a decimal number`);
  if (!Number.isFinite(p.seconds) || p.seconds < 0) throw new RangeError(`sweep point ${i}: seconds must be a non-negative number, got ${p.seconds}`);
  return b;
}

/** Log-scale ticks: every tick for small marks, and at most 8 labelled ones (powers of ten when there are two or more). */
function logTicks(x: ScaleLogarithmic<number, number>): { minor: number[]; labelled: number[] } {
  const all = x.ticks();
  const isPow = (v: number): boolean => Math.abs(Math.log10(v) - Math.round(Math.log10(v))) < 1e-9;
  let lab = all.filter(isPow);
  if (lab.length < 2) lab = all;
  const stride = Math.ceil(lab.length / 8);
  return { minor: all, labelled: lab.filter((_, i) => i % stride === 0) };
}

function pointTitle(p: SweepPoint): string {
  return `budget ${p.budget}: T-count ${fmtInt(p.tCount)}, T-depth ${fmtInt(p.tDepth)}, error bound ${p.errorBound}, ${fmtSeconds(p.seconds)} s`;
}

/**
 * T-count against error budget as SVG. The budget axis is logarithmic and runs from the loosest
 * budget on the left to the tightest on the right (so the T-count climbs to the right); the
 * T-count axis is linear from 0, on which the yardstick is a straight line. Points are joined in
 * budget order; each carries `data-budget` and `data-t` and a tooltip with all its figures.
 */
export function sweepSvg(points: readonly SweepPoint[], opts: SweepSvgOptions = {}): string {
  const w = size(opts.width, 720, "width");
  const h = size(opts.height, 400, "height");
  const standalone = opts.standalone ?? false;
  const title = opts.title ?? "T-count against error budget";
  const rotations = opts.rotations ?? 0;
  if (!Number.isSafeInteger(rotations) || rotations < 0) throw new RangeError(`sweepSvg: rotations must be a non-negative integer, got ${rotations}`);
  const budgets = points.map(checkPoint);
  if (points.length === 0) return emptyChart("sweep", w, h, title, "No sweep points to draw.", standalone);

  const m: Margin = { top: 44, right: 28, bottom: 56, left: 72 };
  let hi = max(budgets) as number;
  let lo = min(budgets) as number;
  if (hi === lo) {
    hi *= Math.sqrt(10);
    lo /= Math.sqrt(10);
  }
  const x = scaleLog().domain([hi, lo]).range([m.left, w - m.right]);
  const order = range(points.length).sort((a, b) => budgets[b] - budgets[a]);
  const yard: [number, number][] = rotations > 0 ? range(65).map((i) => {
    const b = hi * Math.pow(lo / hi, i / 64);
    return [b, yardstickT(rotations, b)];
  }) : [];
  const top = Math.max(1, max(points, (p) => p.tCount) as number, max(yard, (s) => s[1]) ?? 0);
  const y = scaleLinear().domain([0, top]).nice().range([h - m.bottom, m.top]);
  const path = line<[number, number]>().x((d) => d[0]).y((d) => d[1]).digits(2);

  let body = "";
  // budget axis
  const { minor, labelled } = logTicks(x);
  const baseY = h - m.bottom;
  body += `<g data-axis="x">`;
  for (const v of labelled) body += vline(x(v), m.top, baseY, GRID);
  if (minor.length <= 200) for (const v of minor) body += vline(x(v), baseY, baseY + 3, MUTED);
  for (const v of labelled) {
    const label = fmtExp(v);
    body += `<g${attrs([["data-tick", "x"], ["data-value", label], ["transform", `translate(${num(x(v))},${num(baseY)})`]])}>`;
    body += `<line y2="6" stroke="${MUTED}"/>` + text(0, 20, label, [["text-anchor", "middle"], ["fill", MUTED]]) + `</g>`;
  }
  body += hline(m.left, w - m.right, baseY, MUTED);
  body += text((m.left + w - m.right) / 2, h - 12, "error budget (log scale; tighter budgets to the right \u2192)", [["text-anchor", "middle"]]);
  body += `</g>`;
  body += yAxis(y, m, w, "T-count");

  // series
  if (yard.length > 0) {
    const d = path(yard.map(([b, t]) => [x(b), y(t)]));
    if (d !== null) body += `<path${attrs([["data-series", "yardstick"], ["d", d], ["fill", "none"], ["stroke", YARDSTICK], ["stroke-width", 2], ["stroke-dasharray", "6 4"]])}/>`;
  }
  const d = path(order.map((i) => [x(budgets[i]), y(points[i].tCount)]));
  if (d !== null) body += `<path${attrs([["data-series", "measured"], ["d", d], ["fill", "none"], ["stroke", MEASURED], ["stroke-width", 2]])}/>`;
  body += `<g data-series="points">`;
  for (const i of order) {
    const p = points[i];
    body += `<circle${attrs([["data-budget", p.budget], ["data-t", String(p.tCount)], ["cx", x(budgets[i])], ["cy", y(p.tCount)], ["r", 3.5], ["fill", MEASURED]])}>`;
    body += `<title>${esc(pointTitle(p))}</title></circle>`;
  }
  body += `</g>`;

  // legend
  let lg = `<g data-legend="" transform="translate(${num(m.left)},18)">`;
  lg += `<line x2="24" stroke="${MEASURED}" stroke-width="2"/><circle cx="12" r="3.5" fill="${MEASURED}"/>` + text(30, 4, "measured T-count");
  if (rotations > 0) {
    lg += `<g transform="translate(170,0)"><line x2="24" stroke="${YARDSTICK}" stroke-width="2" stroke-dasharray="6 4"/>`;
    lg += text(30, 4, `yardstick R \u00b7 3 log2(R / budget), R = ${fmtInt(rotations)} approximated rotations`) + `</g>`;
  }
  body += lg + `</g>`;

  const desc =
    `T-count of the lowered circuit at ${points.length} error budgets from ${points[order[0]].budget} to ${points[order[order.length - 1]].budget}` +
    (rotations > 0 ? `, with the yardstick R * 3 log2(R / budget) for R = ${rotations}.` : ".");
  return svgDoc("sweep", w, h, title, desc, body, standalone);
}

// ---------------------------------------------------------------------------------------------
// T-count per qubit

/**
 * A bar per qubit, in qubit order, of its T-count. Every bar carries `data-qubit`, `data-label`
 * and `data-t`, and a tooltip with the label, T-count and T-depth; labels under the axis are
 * thinned when there are too many to read.
 */
export function qubitTSvg(rows: readonly QubitRow[], opts: ChartFrame & { readonly title?: string } = {}): string {
  const w = size(opts.width, 720, "width");
  const h = size(opts.height, 300, "height");
  const standalone = opts.standalone ?? false;
  const title = opts.title ?? "T-count per qubit";
  if (rows.length === 0) return emptyChart("qubits", w, h, title, "The circuit has no qubits.", standalone);
  for (const r of rows) {
    if (!Number.isSafeInteger(r.tCount) || r.tCount < 0) throw new RangeError(`qubitTSvg: qubit ${r.qubit} has T-count ${r.tCount}`);
  }
  const labels = rows.map((r) => shortenEnd(r.label, 12));
  const rotate = labels.some((s) => Array.from(s).length > 5);
  const m: Margin = { top: 20, right: 20, bottom: rotate ? 78 : 52, left: 72 };
  const keys = rows.map((_, i) => String(i));
  const x = scaleBand<string>()
    .domain(keys)
    .range([m.left, w - m.right])
    .paddingInner(rows.length <= 64 ? 0.2 : 0.05)
    .paddingOuter(0.1);
  const y = scaleLinear()
    .domain([0, Math.max(1, max(rows, (r) => r.tCount) as number)])
    .nice()
    .range([h - m.bottom, m.top]);
  const baseY = h - m.bottom;
  let body = yAxis(y, m, w, "T gates");
  const bw = x.bandwidth();

  body += `<g data-series="bars">`;
  rows.forEach((r, i) => {
    const bx = x(keys[i]) as number;
    const top = y(r.tCount);
    body += `<rect${attrs([["data-qubit", String(r.qubit)], ["data-label", r.label], ["data-t", String(r.tCount)], ["x", bx], ["y", top], ["width", bw], ["height", baseY - top], ["fill", BAR]])}>`;
    body += `<title>${esc(`${r.label}: T-count ${r.tCount}, T-depth ${r.tDepth}`)}</title></rect>`;
    if (rows.length <= 32) body += text(bx + bw / 2, top - 4, fmtInt(r.tCount), [["text-anchor", "middle"], ["font-size", "11"], ["fill", MUTED]]);
  });
  body += `</g>`;

  const perLabel = rotate ? 22 : 44;
  const stride = Math.ceil(rows.length / Math.max(1, Math.floor((w - m.left - m.right) / perLabel)));
  body += `<g data-axis="x">`;
  body += hline(m.left, w - m.right, baseY, MUTED);
  for (let i = 0; i < rows.length; i += stride) {
    const cx = (x(keys[i]) as number) + bw / 2;
    body += `<g${attrs([["data-tick", "x"], ["data-value", rows[i].label], ["transform", `translate(${num(cx)},${num(baseY)})`]])}>`;
    body += `<line y2="5" stroke="${MUTED}"/>`;
    body += rotate
      ? text(0, 0, labels[i], [["text-anchor", "end"], ["fill", MUTED], ["transform", "translate(0,14) rotate(-40)"]])
      : text(0, 18, labels[i], [["text-anchor", "middle"], ["fill", MUTED]]);
    body += `</g>`;
  }
  body += text((m.left + w - m.right) / 2, h - 8, stride > 1 ? `qubit (one label in ${stride})` : "qubit", [["text-anchor", "middle"]]);
  body += `</g>`;
  const total = rows.reduce((s, r) => s + r.tCount, 0);
  return svgDoc("qubits", w, h, title, `T gates on each of ${rows.length} qubits, ${total} in all.`, body, standalone);
}

// ---------------------------------------------------------------------------------------------
// Budget spending

/**
 * How the error budget was spent: one stacked bar (the budget, or the spending when it exceeds
 * the budget, with the budget marked), then one line per slice with its own bar, amount and
 * share. Slices are the largest ledger rows by error * copies, "other rows", and "unspent"
 * (see `budgetSpend`). Each slice element carries `data-item`, `data-row` and `data-amount`.
 */
export function budgetSvg(report: Report, opts: ChartFrame & { readonly title?: string; readonly top?: number } = {}): string {
  const w = size(opts.width, 720, "width");
  const standalone = opts.standalone ?? false;
  const title = opts.title ?? "How the error budget was spent";
  const s = budgetSpend(report, opts.top ?? 8);
  const budget = dec(s.budget);
  const spent = dec(s.spent);
  const total = spent.greaterThan(budget) ? spent : budget;
  if (total.isZero()) {
    return emptyChart("budget", w, size(opts.height, 140, "height"), title, "The budget is zero and nothing was spent.", standalone);
  }
  const rowH = 22;
  const listTop = 84;
  const note = s.freeRows > 0;
  const h = size(opts.height, Math.max(120, listTop + rowH * s.items.length + (note ? rowH : 0) + 8), "height");
  const left = 12;
  const right = w - 12;
  const frac = (amount: string): number => dec(amount).div(total).toNumber();
  const colour = (i: number): string => {
    const it = s.items[i];
    return it.kind === "unspent" ? UNSPENT : it.kind === "other" ? OTHER : SLICES[i % SLICES.length];
  };
  const sliceTitle = (i: number): string => {
    const it = s.items[i];
    return `${it.label}: ${it.amount}` + (it.percent === null ? "" : ` (${it.percent} of the budget)`);
  };

  let body = "";
  const spentPct = budget.isZero() ? "" : ` (${dec(s.spent).div(budget).times(100).toSignificantDigits(3, 6).toFixed()}%)`;
  const headline = `budget ${s.budget}, spent ${shortFigure(spent, 3)}${spentPct}` + (s.over ? ": over budget" : "");
  body += text(left, 16, headline, [["font-weight", "600"], ["fill", s.over ? OVER : INK]]);

  // the stacked bar
  const barY = 28;
  const barH = 26;
  body += `<g data-series="stack">`;
  let at = left;
  s.items.forEach((it, i) => {
    const wd = frac(it.amount) * (right - left);
    body += `<rect${attrs([["data-item", it.kind], ["data-row", String(it.row)], ["data-amount", it.amount], ["x", at], ["y", barY], ["width", wd], ["height", barH], ["fill", colour(i)]])}>`;
    body += `<title>${esc(sliceTitle(i))}</title></rect>`;
    at += wd;
  });
  body += `<rect${attrs([["x", left], ["y", barY], ["width", right - left], ["height", barH], ["fill", "none"], ["stroke", MUTED]])}/>`;
  if (s.over && !budget.isZero()) {
    const bx = left + budget.div(total).toNumber() * (right - left);
    body += `<line${attrs([["data-marker", "budget"], ["x1", bx], ["x2", bx], ["y1", barY - 6], ["y2", barY + barH + 6], ["stroke", OVER], ["stroke-width", 2]])}/>`;
    body += text(bx, barY + barH + 18, "budget", [["text-anchor", "middle"], ["fill", OVER]]);
  }
  body += `</g>`;

  // one line per slice
  const labelX = left + 18;
  const miniL = 372;
  const miniR = Math.max(miniL + 40, w - 150);
  body += `<g data-series="slices">`;
  s.items.forEach((it, i) => {
    const ry = listTop + i * rowH;
    const amountText = shortFigure(dec(it.amount), 3) + (it.percent === null ? "" : ` \u00b7 ${it.percent}`);
    body += `<g${attrs([["data-item", it.kind], ["data-row", String(it.row)], ["data-amount", it.amount], ["transform", `translate(0,${num(ry)})`]])}>`;
    body += `<title>${esc(sliceTitle(i))}</title>`;
    body += `<rect${attrs([["x", left], ["y", -10], ["width", 11], ["height", 11], ["fill", colour(i)], ["stroke", it.kind === "unspent" ? MUTED : undefined]])}/>`;
    body += text(labelX, 0, shortenStart(it.label, 50));
    body += `<rect${attrs([["x", miniL], ["y", -10], ["width", frac(it.amount) * (miniR - miniL)], ["height", 11], ["fill", colour(i)]])}/>`;
    body += text(miniR + 8, 0, amountText, [["fill", MUTED]]);
    body += `</g>`;
  });
  body += `</g>`;
  if (note) {
    const ny = listTop + s.items.length * rowH;
    body += text(left, ny, `${s.freeRows} ledger ${s.freeRows === 1 ? "row was" : "rows were"} lowered exactly and spent nothing.`, [["fill", MUTED]]);
  }
  const desc = `Error spent per ledger row (error times copies) against the budget ${s.budget}; total spent ${s.spent}.`;
  return svgDoc("budget", w, h, title, desc, body, standalone);
}
