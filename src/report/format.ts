// Writing a report: a terminal summary with aligned tables, a Markdown version for reviews, and canonical JSON bytes.
import { Chalk, type ChalkInstance } from "chalk";
import { dec } from "../numeric/decimal.js";
import { byCodeUnits } from "./metrics.js";
import type { LedgerRow, OptionValue, QubitRow, Report } from "./types.js";

// ---------------------------------------------------------------------------------------------
// JSON

/** A copy of a string-keyed record with keys in ascending code unit order. */
function sortedRecord<T>(r: Readonly<Record<string, T>>): Record<string, T> {
  const out = Object.create(null) as Record<string, T>;
  for (const k of Object.keys(r).sort(byCodeUnits)) out[k] = r[k];
  return out;
}

/** A ledger row as JSON, keys in the order of `LedgerRow` (the diff's JSON uses it too). */
export function jsonRow(r: LedgerRow): object {
  return {
    location: r.location,
    gate: r.gate,
    angle: { value: r.angle.value, pi: r.angle.pi },
    epsilon: r.epsilon,
    error: r.error,
    tCount: r.tCount,
    method: r.method,
    instances: r.instances,
    conditional: r.conditional,
    inLoop: r.inLoop,
  };
}

function jsonQubit(q: QubitRow): object {
  return { qubit: q.qubit, label: q.label, tCount: q.tCount, tDepth: q.tDepth };
}

/**
 * The report as JSON: keys in the fixed order of the `Report` declaration (records sorted by
 * key), 2-space indent, a trailing newline. Equal reports give identical bytes whatever the
 * key order of the objects passed in.
 */
export function toJson(report: Report): string {
  const o = {
    schemaVersion: report.schemaVersion,
    tool: { name: report.tool.name, version: report.tool.version },
    options: sortedRecord(report.options),
    budget: report.budget,
    errorBound: report.errorBound,
    boundPerIteration: report.boundPerIteration,
    qubits: report.qubits,
    gates: report.gates,
    depth: report.depth,
    tCount: report.tCount,
    tDepth: report.tDepth,
    cxCount: report.cxCount,
    cliffordCount: report.cliffordCount,
    measurements: report.measurements,
    resets: report.resets,
    conditionalOps: report.conditionalOps,
    remainingRotations: report.remainingRotations,
    rotations: {
      total: report.rotations.total,
      exact: report.rotations.exact,
      approximated: report.rotations.approximated,
      distinct: report.rotations.distinct,
      cached: report.rotations.cached,
    },
    ledger: report.ledger.map(jsonRow),
    perQubit: report.perQubit.map(jsonQubit),
    gateCounts: sortedRecord(report.gateCounts),
  };
  return JSON.stringify(o, null, 2) + "\n";
}

// ---------------------------------------------------------------------------------------------
// Shared wording

/** The share of the budget spent, as a percentage for display ("98.8%", "<0.01%", "0%"); null for a zero budget. */
export function budgetSpent(report: Report): string | null {
  const budget = dec(report.budget);
  if (budget.isZero()) return null;
  const bound = dec(report.errorBound);
  if (bound.isZero()) return "0%";
  const pct = bound.div(budget).times(100);
  if (pct.lessThan(dec("0.01"))) return "<0.01%";
  return pct.toSignificantDigits(3, 6).toFixed() + "%";
}

/** True when the error bound does not exceed the budget (decided exactly on the decimal strings). */
export function withinBudget(report: Report): boolean {
  return dec(report.errorBound).lessThanOrEqualTo(dec(report.budget));
}

function optionText(v: OptionValue): string {
  return v === null ? "null" : typeof v === "string" ? v : String(v);
}

function optionsLine(report: Report): string {
  const keys = Object.keys(report.options).sort(byCodeUnits);
  return keys.length === 0 ? "(none)" : keys.map((k) => `${k}=${optionText(report.options[k])}`).join(" ");
}

function rotationsLine(report: Report): string {
  const r = report.rotations;
  return `${r.total} = ${r.exact} exact + ${r.approximated} approximated (${r.distinct} distinct, ${r.cached} from cache)`;
}

function angleText(r: LedgerRow): string {
  return r.angle.pi ?? r.angle.value;
}

function flagsText(r: LedgerRow): string {
  return r.inLoop ? "loop" : r.conditional ? "if" : "";
}

const LOOP_NOTE = "some approximated rotations sit in while bodies: the bound holds per loop iteration";

/** The summary as label/value pairs, in display order. */
function summaryPairs(report: Report): [string, string][] {
  const spent = budgetSpent(report);
  return [
    ["error budget", report.budget],
    ["error bound", report.errorBound + (spent === null ? "" : `  (${spent} of budget)`)],
    ["qubits", String(report.qubits)],
    ["gates", String(report.gates)],
    ["depth", String(report.depth)],
    ["T-count", String(report.tCount)],
    ["T-depth", String(report.tDepth)],
    ["CX count", String(report.cxCount)],
    ["Clifford gates", String(report.cliffordCount)],
    ["measurements", String(report.measurements)],
    ["resets", String(report.resets)],
    ["conditional ops", String(report.conditionalOps)],
    ["rotations met", rotationsLine(report)],
    ["rotations left", String(report.remainingRotations)],
    ["options", optionsLine(report)],
  ];
}

interface Column {
  readonly head: string;
  readonly right: boolean;
}

const LEDGER_COLUMNS: readonly Column[] = [
  { head: "where", right: false },
  { head: "gate", right: false },
  { head: "angle", right: false },
  { head: "share", right: true },
  { head: "error", right: true },
  { head: "T", right: true },
  { head: "method", right: false },
  { head: "copies", right: true },
  { head: "in", right: false },
];

function ledgerCells(r: LedgerRow): string[] {
  return [r.location, r.gate, angleText(r), r.epsilon, r.error, String(r.tCount), r.method, String(r.instances), flagsText(r)];
}

const QUBIT_COLUMNS: readonly Column[] = [
  { head: "qubit", right: false },
  { head: "T-count", right: true },
  { head: "T-depth", right: true },
];

function qubitCells(q: QubitRow): string[] {
  return [q.label, String(q.tCount), String(q.tDepth)];
}

const GATE_COLUMNS: readonly Column[] = [
  { head: "gate", right: false },
  { head: "count", right: true },
];

function gateRows(report: Report): string[][] {
  return Object.keys(report.gateCounts)
    .sort(byCodeUnits)
    .map((k) => [k, String(report.gateCounts[k])]);
}

// ---------------------------------------------------------------------------------------------
// Terminal text

export interface TextOptions {
  /** Colour with ANSI escapes (the CLI decides from the TTY and NO_COLOR). */
  readonly color: boolean;
  /** Show at most this many rows of the ledger and per-qubit tables (default: all). */
  readonly maxRows?: number;
}

/** Pads plain text to `width`; colour is applied after padding so escapes never skew alignment. */
function pad(s: string, width: number, right: boolean): string {
  const fill = " ".repeat(Math.max(0, width - s.length));
  return right ? fill + s : s + fill;
}

function textTable(columns: readonly Column[], rows: readonly string[][], ink: ChalkInstance, limit: number): string[] {
  const shown = rows.slice(0, limit);
  const widths = columns.map((c) => c.head.length);
  for (const r of shown) for (let i = 0; i < widths.length; i++) if (r[i].length > widths[i]) widths[i] = r[i].length;
  const line = (cells: readonly string[]): string =>
    ("  " + cells.map((s, i) => pad(s, widths[i], columns[i].right)).join("  ")).trimEnd();
  const out = [ink.dim(line(columns.map((c) => c.head)))];
  for (const r of shown) out.push(line(r));
  if (rows.length > shown.length) out.push(ink.dim(`  ... ${rows.length - shown.length} more rows (the JSON report has them all)`));
  return out;
}

/** A readable terminal report: summary, ledger, gate counts, per-qubit T figures. Ends with a newline. */
export function formatText(report: Report, opts: TextOptions): string {
  const ink = new Chalk({ level: opts.color ? 1 : 0 });
  const limit = opts.maxRows ?? Number.POSITIVE_INFINITY;
  const out: string[] = [];
  out.push(ink.bold(`tledger ${report.tool.version}: lowering report`));
  out.push("");
  const pairs = summaryPairs(report);
  const labelWidth = Math.max(...pairs.map(([k]) => k.length));
  const okay = withinBudget(report);
  for (const [k, v] of pairs) {
    const value = k === "error bound" ? (okay ? ink.green(v) : ink.red(v + "  OVER BUDGET")) : v;
    out.push(`  ${pad(k, labelWidth, false)}  ${value}`);
  }
  if (report.boundPerIteration) out.push(ink.yellow(`  note: ${LOOP_NOTE}`));

  out.push("");
  out.push(ink.bold(`Ledger (${report.ledger.length} ${report.ledger.length === 1 ? "row" : "rows"})`));
  if (report.ledger.length === 0) out.push("  no rotation needed approximating");
  else out.push(...textTable(LEDGER_COLUMNS, report.ledger.map(ledgerCells), ink, limit));

  out.push("");
  out.push(ink.bold("Gate counts"));
  const gates = gateRows(report);
  if (gates.length === 0) out.push("  no gates");
  else out.push(...textTable(GATE_COLUMNS, gates, ink, Number.POSITIVE_INFINITY));

  out.push("");
  out.push(ink.bold("T per qubit"));
  if (report.perQubit.length === 0) out.push("  no qubits");
  else out.push(...textTable(QUBIT_COLUMNS, report.perQubit.map(qubitCells), ink, limit));
  return out.join("\n") + "\n";
}

// ---------------------------------------------------------------------------------------------
// Markdown

/** A table cell: pipes escaped, line breaks flattened, surrounding spaces trimmed. */
function mdCell(s: string): string {
  return s.replace(/\\/g, "\\\\").replace(/\|/g, "\\|").replace(/[\r\n]+/g, " ").trim();
}

function mdTable(columns: readonly Column[], rows: readonly string[][]): string[] {
  const out = [`| ${columns.map((c) => mdCell(c.head)).join(" | ")} |`];
  out.push(`|${columns.map((c) => (c.right ? " ---: " : " --- ")).join("|")}|`);
  for (const r of rows) out.push(`| ${r.map(mdCell).join(" | ")} |`);
  return out;
}

/** The report as GitHub-flavoured Markdown tables, for pasting into a review. Ends with a newline. */
export function formatMarkdown(report: Report): string {
  const out: string[] = [];
  out.push(`### tledger ${mdCell(report.tool.version)}: lowering report`);
  out.push("");
  const pairs = summaryPairs(report).map(([k, v]) => [k, k === "error bound" && !withinBudget(report) ? v + "  OVER BUDGET" : v]);
  out.push(...mdTable([{ head: "figure", right: false }, { head: "value", right: false }], pairs));
  if (report.boundPerIteration) {
    out.push("");
    out.push(`> Note: ${LOOP_NOTE}.`);
  }
  out.push("");
  out.push(`#### Ledger (${report.ledger.length} ${report.ledger.length === 1 ? "row" : "rows"})`);
  out.push("");
  if (report.ledger.length === 0) out.push("No rotation needed approximating.");
  else out.push(...mdTable(LEDGER_COLUMNS, report.ledger.map(ledgerCells)));
  out.push("");
  out.push("#### Gate counts");
  out.push("");
  const gates = gateRows(report);
  if (gates.length === 0) out.push("No gates.");
  else out.push(...mdTable(GATE_COLUMNS, gates));
  out.push("");
  out.push("#### T per qubit");
  out.push("");
  if (report.perQubit.length === 0) out.push("No qubits.");
  else out.push(...mdTable(QUBIT_COLUMNS, report.perQubit.map(qubitCells)));
  return out.join("\n") + "\n";
}
