// The self-contained HTML report: headline figures, sortable ledger, charts and sweep in one page that fetches nothing.
import { createHash } from "node:crypto";
import { format } from "d3-format";
import { dec } from "../../numeric/decimal.js";
import { canonicalDecimal } from "../figures.js";
import { budgetSpent, withinBudget } from "../format.js";
import { byCodeUnits, type Metrics } from "../metrics.js";
import type { LedgerRow, OptionValue, QubitRow, Report } from "../types.js";
import { attrs, esc } from "./markup.js";
import { PAGE_SCRIPT } from "./page-script.js";
import { PAGE_STYLE } from "./page-style.js";
import { budgetSvg, qubitTSvg, sweepSvg } from "./svg-charts.js";
import type { EstimateTable, SweepPoint } from "./types.js";

/** What one page shows; every part is optional but the title and source. */
export interface HtmlInput {
  readonly title: string;
  /** The source program the page describes, as the user named it (shown, never opened). */
  readonly source: string;
  /** A lowering report: figures, ledger, budget spending, T per qubit. */
  readonly report?: Report;
  /** Figures of a circuit that was not lowered (the `report` command); ignored when `report` is given. */
  readonly metrics?: Metrics;
  /** Lowerings of the same program at several budgets. */
  readonly sweep?: readonly SweepPoint[];
  /** Cost estimates for the rotations of a circuit that was not lowered. */
  readonly estimates?: EstimateTable;
  /** The tool version for the footer; defaults to the report's. */
  readonly version?: string;
  /** R for the sweep's yardstick (approximated rotation instances); defaults to the report's count. */
  readonly rotations?: number;
}

const fmtSeconds = format(".3~r");

type ColumnType = "dec" | "num" | "text";

interface Column {
  readonly key: string;
  readonly head: string;
  readonly type: ColumnType;
  /** Right-aligned (numbers). */
  readonly right?: boolean;
  readonly mono?: boolean;
  /** A longer explanation, shown as the header's tooltip. */
  readonly hint?: string;
}

/** A cell: the text shown and the value the sort script compares (`data-v`). */
interface Cell {
  readonly text: string;
  readonly v: string;
}

const cell = (text: string, v: string = text): Cell => ({ text, v });
const intCell = (n: number): Cell => cell(String(n));

/** A table whose headers sort it (see page-script.ts). `sorted` names the column the rows already follow, in direction `dir`. */
function sortableTable(
  name: string,
  caption: string,
  cols: readonly Column[],
  rows: readonly (readonly Cell[])[],
  sorted?: string,
  dir: "ascending" | "descending" = "ascending",
): string {
  let out = `<div class="scroll"><table data-sortable=""${attrs([["data-table", name], ["data-sorted", sorted === undefined ? undefined : `${sorted} ${dir}`]])}>`;
  out += `<caption class="muted">${esc(caption)}</caption><thead><tr>`;
  for (const c of cols) {
    out += `<th${attrs([
      ["scope", "col"],
      ["class", c.right ? "n" : undefined],
      ["data-key", c.key],
      ["data-type", c.type],
      ["aria-sort", c.key === sorted ? dir : "none"],
      ["title", c.hint],
    ])}><button type="button">${esc(c.head)}</button></th>`;
  }
  out += `</tr></thead><tbody>`;
  rows.forEach((r, i) => {
    out += `<tr data-i="${i}">`;
    r.forEach((x, k) => {
      const cls = [cols[k].right ? "n" : "", cols[k].mono ? "mono" : ""].filter((s) => s !== "").join(" ");
      out += `<td${attrs([["class", cls === "" ? undefined : cls], ["data-v", x.v]])}>${esc(x.text)}</td>`;
    });
    out += `</tr>`;
  });
  return out + `</tbody></table></div>`;
}

interface Figure {
  readonly key: string;
  readonly label: string;
  readonly value: string;
  readonly detail?: string;
  /** Extra class: "key" for the headline three, "over"/"within" for the error bound. */
  readonly cls?: string;
}

function figures(list: readonly Figure[]): string {
  let out = `<dl class="figures">`;
  for (const f of list) {
    out += `<div${attrs([["class", f.cls === undefined ? "figure" : `figure ${f.cls}`], ["data-figure", f.key]])}>`;
    out += `<dt>${esc(f.label)}</dt><dd><span class="v">${esc(f.value)}</span>`;
    if (f.detail !== undefined) out += `<small>${esc(f.detail)}</small>`;
    out += `</dd></div>`;
  }
  return out + `</dl>`;
}

/** A page section: its anchor, its heading and its inner markup. */
interface Section {
  readonly id: string;
  readonly heading: string;
  readonly inner: string;
}

const section = (id: string, heading: string, inner: string): Section => ({ id, heading, inner });

function sectionHtml(s: Section): string {
  return `<section${attrs([["id", s.id], ["aria-labelledby", `${s.id}-h`]])}><h2${attrs([["id", `${s.id}-h`]])}>${esc(s.heading)}</h2>${s.inner}</section>`;
}

function reportFigures(r: Report): Figure[] {
  const spent = budgetSpent(r);
  const ok = withinBudget(r);
  const rot = r.rotations;
  return [
    { key: "tCount", label: "T-count", value: String(r.tCount), cls: "key" },
    { key: "tDepth", label: "T-depth", value: String(r.tDepth), cls: "key" },
    {
      key: "errorBound",
      label: "error bound",
      value: r.errorBound,
      detail: (spent === null ? "budget is zero" : `${spent} of the budget`) + (ok ? "" : ": over budget"),
      cls: ok ? "key within" : "key over",
    },
    { key: "budget", label: "error budget", value: r.budget },
    { key: "qubits", label: "qubits", value: String(r.qubits) },
    { key: "gates", label: "gates", value: String(r.gates) },
    { key: "depth", label: "depth", value: String(r.depth) },
    { key: "cxCount", label: "CX count", value: String(r.cxCount) },
    { key: "cliffordCount", label: "Clifford gates", value: String(r.cliffordCount) },
    { key: "measurements", label: "measurements", value: String(r.measurements) },
    { key: "resets", label: "resets", value: String(r.resets) },
    { key: "conditionalOps", label: "conditional ops", value: String(r.conditionalOps) },
    {
      key: "approximated",
      label: "rotations approximated",
      value: String(rot.approximated),
      detail: `of ${rot.total}; ${rot.exact} exact; ${rot.distinct} distinct, ${rot.cached} from cache`,
    },
    { key: "remainingRotations", label: "rotations left", value: String(r.remainingRotations) },
  ];
}

function metricFigures(m: Metrics): Figure[] {
  return [
    { key: "tCount", label: "T-count", value: String(m.tCount), cls: "key" },
    { key: "tDepth", label: "T-depth", value: String(m.tDepth), cls: "key" },
    { key: "rotations", label: "rotations to lower", value: String(m.rotations), cls: "key" },
    { key: "qubits", label: "qubits", value: String(m.qubits) },
    { key: "gates", label: "gates", value: String(m.gates) },
    { key: "depth", label: "depth", value: String(m.depth) },
    { key: "cxCount", label: "CX count", value: String(m.cxCount) },
    { key: "cliffordCount", label: "Clifford gates", value: String(m.cliffordCount) },
    { key: "measurements", label: "measurements", value: String(m.measurements) },
    { key: "resets", label: "resets", value: String(m.resets) },
    { key: "conditionalOps", label: "conditional ops", value: String(m.conditionalOps) },
  ];
}

const LEDGER_COLUMNS: readonly Column[] = [
  { key: "where", head: "where", type: "num", mono: true, hint: "file:line:column of the source statement" },
  { key: "gate", head: "gate", type: "text" },
  { key: "angle", head: "angle", type: "dec", mono: true },
  { key: "share", head: "share", type: "dec", right: true, mono: true, hint: "error allotted to one copy" },
  { key: "error", head: "error", type: "dec", right: true, mono: true, hint: "error reached by one copy (operator norm, up to phase)" },
  { key: "t", head: "T each", type: "num", right: true, hint: "T gates in one copy" },
  { key: "copies", head: "copies", type: "num", right: true, hint: "times the rotation appears in the lowered program" },
  { key: "spent", head: "error \u00d7 copies", type: "dec", right: true, mono: true, hint: "what the row adds to the error bound" },
  { key: "method", head: "method", type: "text" },
  { key: "in", head: "in", type: "text", hint: "inside an if/else branch or a while loop" },
];

function ledgerCells(r: LedgerRow, i: number): Cell[] {
  const spent = canonicalDecimal(dec(r.error).times(r.instances));
  return [
    cell(r.location, String(i)),
    cell(r.gate),
    cell(r.angle.pi ?? r.angle.value, r.angle.value),
    cell(r.epsilon),
    cell(r.error),
    intCell(r.tCount),
    intCell(r.instances),
    cell(spent),
    cell(r.method),
    cell(r.inLoop ? "loop" : r.conditional ? "if" : ""),
  ];
}

const QUBIT_COLUMNS: readonly Column[] = [
  { key: "qubit", head: "qubit", type: "num", mono: true },
  { key: "t", head: "T-count", type: "num", right: true },
  { key: "tDepth", head: "T-depth", type: "num", right: true },
];

function qubitSection(rows: readonly QubitRow[]): Section {
  const table = sortableTable(
    "qubits",
    "T figures per qubit",
    QUBIT_COLUMNS,
    rows.map((q) => [cell(q.label, String(q.qubit)), intCell(q.tCount), intCell(q.tDepth)]),
    "qubit",
  );
  return section("qubits", "T gates per qubit", `<figure>${qubitTSvg(rows)}</figure><details><summary>Table</summary>${table}</details>`);
}

function gateSection(counts: Readonly<Record<string, number>>): Section {
  const keys = Object.keys(counts).sort(byCodeUnits);
  if (keys.length === 0) return section("gates", "Gate counts", `<p class="muted">The circuit has no gates.</p>`);
  const table = sortableTable(
    "gates",
    "Gates of the circuit by name",
    [
      { key: "gate", head: "gate", type: "text", mono: true },
      { key: "count", head: "count", type: "num", right: true },
    ],
    keys.map((k) => [cell(k), intCell(counts[k])]),
    "gate",
  );
  return section("gates", "Gate counts", table);
}

function optionText(v: OptionValue): string {
  return v === null ? "null" : String(v);
}

function optionsLine(options: Readonly<Record<string, OptionValue>>): string {
  const keys = Object.keys(options).sort(byCodeUnits);
  if (keys.length === 0) return `<p class="muted">Options: none recorded.</p>`;
  return `<p class="muted">Options: ${keys.map((k) => `<code>${esc(`${k}=${optionText(options[k])}`)}</code>`).join(" ")}</p>`;
}

function reportSections(r: Report): Section[] {
  const out: Section[] = [];
  let notes = "";
  if (!withinBudget(r)) notes += `<p class="note over" data-note="over">The error bound ${esc(r.errorBound)} exceeds the budget ${esc(r.budget)}.</p>`;
  if (r.boundPerIteration) {
    notes += `<p class="note" data-note="loop">Some approximated rotations sit inside while loops: the bound counts each loop body once, so it holds per iteration, not for the whole run.</p>`;
  }
  out.push(section("figures", "Headline figures", figures(reportFigures(r)) + notes + optionsLine(r.options)));
  const n = r.ledger.length;
  const ledger =
    n === 0
      ? `<p class="muted">No rotation needed approximating: the ledger is empty.</p>`
      : sortableTable(
          "ledger",
          `${n} ${n === 1 ? "row" : "rows"}: each groups identical lowerings of one source rotation. Click a heading to sort.`,
          LEDGER_COLUMNS,
          r.ledger.map(ledgerCells),
          "where",
        );
  out.push(section("ledger", `Ledger (${n} ${n === 1 ? "row" : "rows"})`, ledger));
  out.push(section("spend", "Budget spending", `<figure>${budgetSvg(r)}<figcaption>Each slice is a ledger row's error times its copies; together they make the error bound.</figcaption></figure>`));
  out.push(qubitSection(r.perQubit));
  out.push(gateSection(r.gateCounts));
  return out;
}

function metricSections(m: Metrics): Section[] {
  return [
    section("figures", "Circuit figures", figures(metricFigures(m))),
    qubitSection(m.perQubit.map((q) => ({ qubit: q.qubit, label: q.label, tCount: q.tCount, tDepth: q.tDepth }))),
    gateSection(m.gateCounts),
  ];
}

function estimateSection(e: EstimateTable): Section {
  const total = e.rows.reduce((s, r) => s + r.tEach * r.instances, 0);
  const copies = e.rows.reduce((s, r) => s + r.instances, 0);
  const table = sortableTable(
    "estimates",
    e.basis,
    [
      { key: "where", head: "where", type: "num", mono: true },
      { key: "gate", head: "gate", type: "text" },
      { key: "angle", head: "angle", type: "text", mono: true },
      { key: "copies", head: "copies", type: "num", right: true },
      { key: "share", head: "share", type: "dec", right: true, mono: true },
      { key: "t", head: "T each (est.)", type: "num", right: true },
      { key: "total", head: "T total (est.)", type: "num", right: true },
    ],
    e.rows.map((r, i) => [
      cell(r.location, String(i)),
      cell(r.gate),
      cell(r.angle),
      intCell(r.instances),
      cell(r.share),
      intCell(r.tEach),
      intCell(r.tEach * r.instances),
    ]),
    "where",
  );
  const head = figures([
    { key: "estimateBudget", label: "assumed budget", value: e.budget },
    { key: "estimateCopies", label: "rotations to approximate", value: String(copies) },
    { key: "estimateT", label: "estimated T gates for them", value: String(total) },
  ]);
  return section("estimates", "Rotation cost estimate", head + (e.rows.length === 0 ? `<p class="muted">Nothing to estimate: no rotation needs approximating.</p>` : table));
}

function sweepSection(points: readonly SweepPoint[], rotations: number): Section {
  const order = points.map((_, i) => i).sort((a, b) => Number(points[b].budget) - Number(points[a].budget));
  const table = sortableTable(
    "sweep",
    "One lowering per budget",
    [
      { key: "budget", head: "budget", type: "dec", right: true, mono: true },
      { key: "t", head: "T-count", type: "num", right: true },
      { key: "tDepth", head: "T-depth", type: "num", right: true },
      { key: "bound", head: "error bound", type: "dec", right: true, mono: true },
      { key: "seconds", head: "seconds", type: "num", right: true },
    ],
    order.map((i) => {
      const p = points[i];
      return [cell(p.budget), intCell(p.tCount), intCell(p.tDepth), cell(p.errorBound), cell(fmtSeconds(p.seconds), String(p.seconds))];
    }),
    "budget",
    "descending",
  );
  const caption =
    rotations > 0
      ? `The dashed line is the yardstick R \u00b7 3 log2(R / budget) for R = ${rotations} approximated rotations, each given budget / R.`
      : "No approximated rotations: no yardstick line.";
  return section("sweep", "T-count against error budget", `<figure>${sweepSvg(points, { rotations })}<figcaption>${esc(caption)}</figcaption></figure>${table}`);
}

function sha256(text: string): string {
  return `'sha256-${createHash("sha256").update(text, "utf8").digest("base64")}'`;
}

/**
 * The page as one HTML document: inline CSS, one inline script (table sorting) and inline SVG
 * charts; the content security policy admits only those two blocks by hash and fetches nothing.
 * All text from the input is escaped. No dates or clocks: equal input gives identical bytes.
 */
export function renderHtml(input: HtmlInput): string {
  const r = input.report;
  const version = input.version ?? r?.tool.version ?? "";
  const kind = r !== undefined ? "lowering report" : input.metrics !== undefined ? "circuit figures" : input.sweep !== undefined ? "budget sweep" : "report";
  const parts: Section[] = [];
  if (r !== undefined) parts.push(...reportSections(r));
  else if (input.metrics !== undefined) parts.push(...metricSections(input.metrics));
  if (input.estimates !== undefined) parts.push(estimateSection(input.estimates));
  if (input.sweep !== undefined) parts.push(sweepSection(input.sweep, input.rotations ?? r?.rotations.approximated ?? 0));
  const nav = parts.map((p) => `<a${attrs([["href", `#${p.id}`]])}>${esc(p.heading)}</a>`).join(" \u00b7 ");
  const main = parts.length === 0 ? `<p class="muted">Nothing to show.</p>` : parts.map(sectionHtml).join("\n");
  const csp = `default-src 'none'; style-src ${sha256(PAGE_STYLE)}; script-src ${sha256(PAGE_SCRIPT)}; img-src data:; base-uri 'none'; form-action 'none'`;
  const tool = version === "" ? "tledger" : `tledger ${version}`;
  return (
    `<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n` +
    `<meta http-equiv="Content-Security-Policy"${attrs([["content", csp]])}>\n` +
    `<meta name="viewport" content="width=device-width, initial-scale=1">\n` +
    `<meta${attrs([["name", "generator"], ["content", tool]])}>\n` +
    `<link rel="icon" href="data:,">\n` +
    `<title>${esc(input.title)}</title>\n<style>${PAGE_STYLE}</style>\n</head>\n<body>\n` +
    `<header><h1>${esc(input.title)}</h1><p class="source">${esc(kind)} for <code data-source="">${esc(input.source)}</code> \u00b7 ${esc(tool)}</p>` +
    (nav === "" ? "" : `<nav class="muted">${nav}</nav>`) +
    `</header>\n<main>\n${main}\n</main>\n` +
    `<footer>Written by ${esc(tool)}. The error bound is a mathematical bound on the distance, up to global phase and in the operator norm, ` +
    `between the lowered circuit and the source program; it is not a prediction of hardware noise.</footer>\n` +
    `<script>${PAGE_SCRIPT}</script>\n</body>\n</html>\n`
  );
}
