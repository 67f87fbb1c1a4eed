// Writing a diff: a terminal summary, Markdown for a pull-request comment, and canonical JSON bytes; limits and the equivalence verdict included when given.
import { Chalk, type ChalkInstance } from "chalk";
import { dec } from "../numeric/decimal.js";
import type { LedgerRow } from "../report/types.js";
import { jsonRow } from "../report/format.js";
import { METRIC_NAMES, type DiffResult, type GateChange, type MetricChange, type MetricName, type QubitChange, type SideInfo } from "./compare.js";
import type { Equivalence } from "./equiv.js";
import type { LedgerDiff, RowPair } from "./ledger-pairs.js";
import type { Limit, Violation } from "./thresholds.js";

/** What was checked besides the figures: the limits asked for, those that failed, and the equivalence verdict. */
export interface DiffChecks {
  /** The limits asked for (`parseThresholds`); with `violations`, lets the output say how many held. */
  readonly limits?: readonly Limit[];
  /** `checkThresholds(diff, limits)`. */
  readonly violations?: readonly Violation[];
  readonly equivalence?: Equivalence;
}

export interface DiffTextOptions {
  /** Colour with ANSI escapes (the CLI decides from the TTY and NO_COLOR). */
  readonly color: boolean;
  /** Show at most this many rows in each table (default: all). */
  readonly maxRows?: number;
  readonly checks?: DiffChecks;
}

/** Version of the JSON layout written by `diffJson`. */
export const DIFF_SCHEMA_VERSION = 1;

// ---------------------------------------------------------------------------------------------
// Shared wording

const METRIC_LABELS: Readonly<Record<MetricName, string>> = {
  tCount: "T-count",
  tDepth: "T-depth",
  cxCount: "CX count",
  cliffordCount: "Clifford gates",
  gates: "gates",
  depth: "depth",
  qubits: "qubits",
  measurements: "measurements",
  resets: "resets",
  conditionalOps: "conditional ops",
  remainingRotations: "rotations left",
  rotations: "rotations met",
  exactRotations: "exact rotations",
  approximatedRotations: "approximated rotations",
  errorBound: "error bound",
  budget: "error budget",
};

export function metricLabel(m: MetricName): string {
  return METRIC_LABELS[m];
}

const SOURCE_WORDS: Readonly<Record<SideInfo["source"], string>> = {
  circuit: "circuit",
  report: "report",
  "circuit+report": "circuit with report",
};

function signed(n: number): string {
  return n > 0 ? `+${n}` : String(n);
}

function signedDecimal(s: string): string {
  return s.startsWith("-") || s === "0" ? s : `+${s}`;
}

/** A relative change as a percentage with 3 significant digits ("+0.833%", "-25%"). */
export function percentText(relative: number): string {
  const pct = relative * 100;
  const mag = Math.abs(pct) >= 1000 ? String(Math.round(pct)) : String(Number(pct.toPrecision(3)));
  return (pct > 0 ? "+" : "") + mag + "%";
}

function valueText(v: number | string | null): string {
  return v === null ? "-" : String(v);
}

/** The change column: "+1 (+0.833%)", "=", "n/a" when a side lacks the figure. */
function changeText(m: MetricChange): string {
  if (m.change === null) return m.a === null && m.b === null ? "" : "n/a";
  const zero = m.kind === "count" ? m.change === 0 : m.change === "0";
  if (zero) return "=";
  const abs = m.kind === "count" ? signed(m.change) : signedDecimal(m.change);
  return m.relative === null ? abs : `${abs} (${percentText(m.relative)})`;
}

/** +1 when the figure grew, -1 when it shrank, 0 otherwise (or unknown). */
function direction(m: MetricChange): number {
  if (m.change === null) return 0;
  if (m.kind === "count") return Math.sign(m.change);
  return m.change === "0" ? 0 : m.change.startsWith("-") ? -1 : 1;
}

function shownMetrics(d: DiffResult): MetricChange[] {
  return d.metrics.filter((m) => m.a !== null || m.b !== null);
}

function metricCells(m: MetricChange): string[] {
  return [metricLabel(m.metric), valueText(m.a), valueText(m.b), changeText(m)];
}

function gateCells(g: GateChange): string[] {
  return [g.gate, String(g.a), String(g.b), signed(g.change)];
}

function changedGates(d: DiffResult): string[][] {
  return d.gates.filter((g) => g.change !== 0).map(gateCells);
}

function changedQubits(d: DiffResult): QubitChange[] {
  return d.qubits.filter((q) => q.tCountA !== q.tCountB || q.tDepthA !== q.tDepthB);
}

function fromTo(a: number | null, b: number | null, change: number): string {
  const x = valueText(a);
  const y = valueText(b);
  return a === b ? x : `${x} -> ${y} (${signed(change)})`;
}

function qubitCells(q: QubitChange): string[] {
  return [q.label, fromTo(q.tCountA, q.tCountB, q.tCountChange), fromTo(q.tDepthA, q.tDepthB, q.tDepthChange)];
}

function angleText(r: LedgerRow): string {
  return r.angle.pi ?? r.angle.value;
}

function pairCells(p: RowPair): string[] {
  const where = p.a.location === p.b.location ? p.b.location : `${p.a.location} -> ${p.b.location}`;
  const gate = p.a.gate === p.b.gate ? p.b.gate : `${p.a.gate} -> ${p.b.gate}`;
  const angle = angleText(p.a) === angleText(p.b) ? angleText(p.b) : `${angleText(p.a)} -> ${angleText(p.b)}`;
  const t = p.tCountChange === 0 ? String(p.b.tCount) : `${p.a.tCount} -> ${p.b.tCount} (${signed(p.tCountChange)})`;
  const err = p.errorChange === "0" ? p.b.error : `${p.a.error} -> ${p.b.error} (${signedDecimal(p.errorChange)})`;
  const copies = p.a.instances === p.b.instances ? String(p.b.instances) : `${p.a.instances} -> ${p.b.instances}`;
  return [where, gate, angle, t, err, copies, p.fields.join(" ")];
}

function rowCells(r: LedgerRow): string[] {
  return [r.location, r.gate, angleText(r), String(r.tCount), r.error, String(r.instances), r.method];
}

interface Column {
  readonly head: string;
  readonly right: boolean;
}

const METRIC_COLUMNS: readonly Column[] = [
  { head: "figure", right: false },
  { head: "before", right: true },
  { head: "after", right: true },
  { head: "change", right: false },
];
const GATE_COLUMNS: readonly Column[] = [
  { head: "gate", right: false },
  { head: "before", right: true },
  { head: "after", right: true },
  { head: "change", right: true },
];
const QUBIT_COLUMNS: readonly Column[] = [
  { head: "qubit", right: false },
  { head: "T-count", right: false },
  { head: "T-depth", right: false },
];
const PAIR_COLUMNS: readonly Column[] = [
  { head: "where", right: false },
  { head: "gate", right: false },
  { head: "angle", right: false },
  { head: "T", right: false },
  { head: "error", right: false },
  { head: "copies", right: false },
  { head: "changed", right: false },
];
const ROW_COLUMNS: readonly Column[] = [
  { head: "where", right: false },
  { head: "gate", right: false },
  { head: "angle", right: false },
  { head: "T", right: true },
  { head: "error", right: true },
  { head: "copies", right: true },
  { head: "method", right: false },
];

function ledgerSummary(l: LedgerDiff): string {
  const parts = [
    `${l.changed.length} changed in cost`,
    `${l.otherwiseChanged.length} changed otherwise`,
    `${l.onlyA.length} only before`,
    `${l.onlyB.length} only after`,
    `${l.unchanged} unchanged`,
  ];
  return parts.join(", ");
}

const CIRCUITS_DIFFER = "no figure changed, but the circuits differ (angles, operands or order)";

/** True when no metric, gate count or per-qubit figure changed (the ledger aside). */
function figuresUnchanged(d: DiffResult): boolean {
  return (
    d.metrics.every((m) => m.change === null ? m.a === m.b : m.kind === "count" ? m.change === 0 : m.change === "0") &&
    d.gates.every((g) => g.change === 0) &&
    d.qubits.every((q) => q.tCountA === q.tCountB && q.tDepthA === q.tDepthB)
  );
}

const LEDGER_FILE_NOTE = "the two ledgers name different files; rows were paired by line and column";

function metricName(v: Violation): string {
  return metricLabel(v.limit.metric);
}

/** A decimal for reading: plain digits for moderate exponents ("0.5", "50"), else the canonical exponent form. */
function readable(x: string): string {
  return dec(x).toString();
}

/** One sentence per failed limit. */
export function violationText(v: Violation): string {
  if (v.reason === "unavailable") {
    const side = v.before === null && v.after === null ? "neither side has" : v.before === null ? "the old side has no" : "the new side has no";
    return `${v.limit.text}: cannot be checked, ${side} ${metricName(v)} (a bare circuit has no ledger figures)`;
  }
  const inc = typeof v.increase === "number" ? signed(v.increase) : signedDecimal(String(v.increase));
  const written = v.limit.text.slice(v.limit.text.indexOf("=") + 1).trim();
  const allowed = v.limit.kind === "percent" ? `${readable(String(v.allowed))} (${written} of ${v.before})` : readable(String(v.allowed));
  return `${v.limit.text}: ${metricName(v)} went from ${v.before} to ${v.after} (${inc}), more than the ${allowed} allowed`;
}

function limitsHeadline(checks: DiffChecks): string | null {
  const failed = checks.violations?.length ?? 0;
  const total = checks.limits?.length;
  if (checks.violations === undefined) return null;
  if (failed === 0) return total === undefined ? "limits: all held" : `limits: all ${total} held`;
  return total === undefined ? `limits: ${failed} failed` : `limits: ${failed} of ${total} failed`;
}

/** The distance as 4 significant digits in exponent form ("3.142e-11", "0"). */
function distanceText(x: number): string {
  return x === 0 ? "0" : x.toExponential(3);
}

/** The equivalence verdict in one sentence. */
export function equivalenceText(e: Equivalence): string {
  const what = e.exact ? `distance ${distanceText(e.distance)}` : `distance at least ${distanceText(e.distance)}`;
  const bounds = `declared bounds ${e.boundSum} (tolerance ${distanceText(e.tolerance)})`;
  if (!e.within) return `${what} exceeds the ${bounds}: the two circuits do not implement the same program within their ledgers [${e.method}]`;
  if (e.exact) return `${what} is within the ${bounds}: equivalent within the ledgers [${e.method}]`;
  return `${what} is within the ${bounds}: no tested state told them apart (a lower bound, not a proof) [${e.method}]`;
}

// ---------------------------------------------------------------------------------------------
// Terminal text

/** Pads plain text to `width`; colour is applied after padding so escapes never skew alignment. */
function pad(s: string, width: number, right: boolean): string {
  const fill = " ".repeat(Math.max(0, width - s.length));
  return right ? fill + s : s + fill;
}

/** An aligned table; `paint(row, col, padded)` colours a padded cell. */
function textTable(
  columns: readonly Column[],
  rows: readonly string[][],
  ink: ChalkInstance,
  limit: number,
  paint: (row: number, col: number, s: string) => string = (_r, _c, s) => s,
): string[] {
  const shown = rows.slice(0, limit);
  const widths = columns.map((c) => c.head.length);
  for (const r of shown) for (let i = 0; i < widths.length; i++) if (r[i].length > widths[i]) widths[i] = r[i].length;
  const last = columns.length - 1;
  // A left-aligned last column is not padded, so no coloured trailing blanks survive the trim.
  const cell = (s: string, i: number): string => (i === last && !columns[i].right ? s : pad(s, widths[i], columns[i].right));
  const line = (cells: readonly string[], ri: number): string =>
    ("  " + cells.map((s, i) => (ri < 0 ? cell(s, i) : paint(ri, i, cell(s, i)))).join("  ")).trimEnd();
  const out = [ink.dim(line(columns.map((c) => c.head), -1))];
  shown.forEach((r, ri) => out.push(line(r, ri)));
  if (rows.length > shown.length) out.push(ink.dim(`  ... ${rows.length - shown.length} more rows`));
  return out;
}

function sideText(s: SideInfo): string {
  return `${s.label} (${SOURCE_WORDS[s.source]})`;
}

/** Paints by direction: growth red, shrinkage green (the error budget is a choice, not a cost: left plain). */
function byDirection(ink: ChalkInstance, dir: number, s: string): string {
  return dir > 0 ? ink.red(s) : dir < 0 ? ink.green(s) : s;
}

function textChecks(checks: DiffChecks | undefined, ink: ChalkInstance, out: string[]): void {
  if (checks === undefined) return;
  const head = limitsHeadline(checks);
  if (head !== null) {
    out.push("");
    const failed = (checks.violations?.length ?? 0) > 0;
    out.push(failed ? ink.bold.red(head) : ink.bold.green(head));
    for (const v of checks.violations ?? []) out.push(ink.red(`  FAIL ${violationText(v)}`));
  }
  if (checks.equivalence !== undefined) {
    out.push("");
    const e = checks.equivalence;
    out.push(ink.bold("equivalence"));
    out.push("  " + (e.within ? ink.green(equivalenceText(e)) : ink.red(equivalenceText(e))));
  }
}

/** A readable terminal comparison of two compiled outputs. Ends with a newline. */
export function diffText(d: DiffResult, opts: DiffTextOptions): string {
  const ink = new Chalk({ level: opts.color ? 1 : 0 });
  const limit = opts.maxRows ?? Number.POSITIVE_INFINITY;
  const out: string[] = [];
  out.push(ink.bold(`tledger diff: ${sideText(d.a)} -> ${sideText(d.b)}`));
  for (const w of d.warnings) out.push(ink.yellow(`  warning: ${w}`));
  if (d.identical) {
    out.push("");
    out.push("  no change");
    textChecks(opts.checks, ink, out);
    return out.join("\n") + "\n";
  }

  out.push("");
  if (d.sameCircuits === false && figuresUnchanged(d)) out.push(`  ${CIRCUITS_DIFFER}`);
  const metrics = shownMetrics(d);
  out.push(
    ...textTable(METRIC_COLUMNS, metrics.map(metricCells), ink, Number.POSITIVE_INFINITY, (r, c, s) =>
      c === 3 && metrics[r].metric !== "budget" ? byDirection(ink, direction(metrics[r]), s) : s,
    ),
  );

  const gates = d.gates.filter((g) => g.change !== 0);
  out.push("");
  out.push(ink.bold(`gate counts: ${gates.length} of ${d.gates.length} changed`));
  if (gates.length > 0) out.push(...textTable(GATE_COLUMNS, gates.map(gateCells), ink, limit, (r, c, s) => (c === 3 ? byDirection(ink, gates[r].change, s) : s)));

  const qubits = changedQubits(d);
  out.push("");
  out.push(ink.bold(`T per qubit: ${qubits.length} of ${d.qubits.length} changed`));
  if (qubits.length > 0) out.push(...textTable(QUBIT_COLUMNS, qubits.map(qubitCells), ink, limit));

  if (d.ledger !== null) {
    const l = d.ledger;
    out.push("");
    out.push(ink.bold(`ledger rows: ${ledgerSummary(l)}`));
    if (l.ignoredFileNames) out.push(ink.dim(`  note: ${LEDGER_FILE_NOTE}`));
    const section = (title: string, cols: readonly Column[], rows: string[][]): void => {
      if (rows.length === 0) return;
      out.push(`  ${title}`);
      out.push(...textTable(cols, rows, ink, limit).map((s) => "  " + s));
    };
    section("changed in cost", PAIR_COLUMNS, l.changed.map(pairCells));
    section("changed otherwise", PAIR_COLUMNS, l.otherwiseChanged.map(pairCells));
    section("only before", ROW_COLUMNS, l.onlyA.map(rowCells));
    section("only after", ROW_COLUMNS, l.onlyB.map(rowCells));
  }
  textChecks(opts.checks, ink, out);
  return out.join("\n") + "\n";
}

// ---------------------------------------------------------------------------------------------
// Markdown

/** A table cell: pipes and backslashes escaped, line breaks flattened, surrounding spaces trimmed. */
function mdCell(s: string): string {
  return s.replace(/\\/g, "\\\\").replace(/\|/g, "\\|").replace(/[\r\n]+/g, " ").trim();
}

/** Inline code that survives backticks inside the text. */
function mdCode(s: string): string {
  const flat = s.replace(/[\r\n]+/g, " ");
  const longest = Math.max(0, ...(flat.match(/`+/g) ?? []).map((m) => m.length));
  const fence = "`".repeat(longest + 1);
  const padded = flat.startsWith("`") || flat.endsWith("`") ? ` ${flat} ` : flat;
  return `${fence}${padded}${fence}`;
}

function mdTable(columns: readonly Column[], rows: readonly string[][]): string[] {
  const out = [`| ${columns.map((c) => mdCell(c.head)).join(" | ")} |`];
  out.push(`|${columns.map((c) => (c.right ? " ---: " : " --- ")).join("|")}|`);
  for (const r of rows) out.push(`| ${r.map(mdCell).join(" | ")} |`);
  return out;
}

function mdChecks(checks: DiffChecks | undefined, out: string[]): void {
  if (checks === undefined) return;
  const head = limitsHeadline(checks);
  if (head !== null) {
    out.push("");
    const failed = (checks.violations?.length ?? 0) > 0;
    out.push(`**${failed ? "FAILED" : "PASSED"}**: ${head}`);
    if (failed) {
      out.push("");
      for (const v of checks.violations ?? []) out.push(`- ${mdCell(violationText(v))}`);
    }
  }
  if (checks.equivalence !== undefined) {
    const e = checks.equivalence;
    out.push("");
    out.push(`**Equivalence ${e.within ? "held" : "FAILED"}**: ${mdCell(equivalenceText(e))}`);
  }
}

/** The comparison as GitHub-flavoured Markdown, for a pull-request comment. Ends with a newline. */
export function diffMarkdown(d: DiffResult, checks?: DiffChecks): string {
  const out: string[] = [];
  out.push(`### tledger diff: ${mdCode(d.a.label)} (${SOURCE_WORDS[d.a.source]}) → ${mdCode(d.b.label)} (${SOURCE_WORDS[d.b.source]})`);
  for (const w of d.warnings) {
    out.push("");
    out.push(`> Warning: ${mdCell(w)}`);
  }
  out.push("");
  if (d.identical) {
    out.push("No change.");
    mdChecks(checks, out);
    return out.join("\n") + "\n";
  }
  if (d.sameCircuits === false && figuresUnchanged(d)) out.push(`${CIRCUITS_DIFFER[0].toUpperCase()}${CIRCUITS_DIFFER.slice(1)}.`, "");
  out.push(...mdTable(METRIC_COLUMNS, shownMetrics(d).map(metricCells)));

  const gates = changedGates(d);
  out.push("");
  out.push(`#### Gate counts (${gates.length} of ${d.gates.length} changed)`);
  if (gates.length > 0) {
    out.push("");
    out.push(...mdTable(GATE_COLUMNS, gates));
  }
  const qubits = changedQubits(d);
  out.push("");
  out.push(`#### T per qubit (${qubits.length} of ${d.qubits.length} changed)`);
  if (qubits.length > 0) {
    out.push("");
    out.push(...mdTable(QUBIT_COLUMNS, qubits.map(qubitCells)));
  }
  if (d.ledger !== null) {
    const l = d.ledger;
    out.push("");
    out.push(`#### Ledger rows (${ledgerSummary(l)})`);
    if (l.ignoredFileNames) {
      out.push("");
      out.push(`> Note: ${LEDGER_FILE_NOTE}.`);
    }
    const section = (title: string, cols: readonly Column[], rows: string[][]): void => {
      if (rows.length === 0) return;
      out.push("");
      out.push(`${title}:`);
      out.push("");
      out.push(...mdTable(cols, rows));
    };
    section("Changed in cost", PAIR_COLUMNS, l.changed.map(pairCells));
    section("Changed otherwise", PAIR_COLUMNS, l.otherwiseChanged.map(pairCells));
    section("Only before", ROW_COLUMNS, l.onlyA.map(rowCells));
    section("Only after", ROW_COLUMNS, l.onlyB.map(rowCells));
  }
  mdChecks(checks, out);
  return out.join("\n") + "\n";
}

// ---------------------------------------------------------------------------------------------
// JSON

function jsonPair(p: RowPair): object {
  return { a: jsonRow(p.a), b: jsonRow(p.b), tCountChange: p.tCountChange, errorChange: p.errorChange, fields: [...p.fields] };
}

function jsonLimit(l: Limit): object {
  return { metric: l.metric, kind: l.kind, value: l.value, text: l.text };
}

/**
 * The comparison as JSON: keys in a fixed order (metrics in METRIC_NAMES order, lists in the order
 * of the result), 2-space indent, a trailing newline. `limits`, `violations` and `equivalence` are
 * null when not given. Equal inputs give identical bytes.
 */
export function diffJson(d: DiffResult, checks?: DiffChecks): string {
  const metrics: Record<string, object> = {};
  for (const k of METRIC_NAMES) {
    const m = d.metrics.find((x) => x.metric === k);
    if (m !== undefined) metrics[k] = { a: m.a, b: m.b, change: m.change, relative: m.relative };
  }
  const l = d.ledger;
  const e = checks?.equivalence;
  const o = {
    tool: "tledger",
    kind: "diff",
    schemaVersion: DIFF_SCHEMA_VERSION,
    a: { label: d.a.label, source: d.a.source },
    b: { label: d.b.label, source: d.b.source },
    identical: d.identical,
    sameCircuits: d.sameCircuits,
    warnings: [...d.warnings],
    metrics,
    gates: d.gates.map((g) => ({ gate: g.gate, a: g.a, b: g.b, change: g.change })),
    qubits: d.qubits.map((q) => ({
      qubit: q.qubit,
      label: q.label,
      tCountA: q.tCountA,
      tCountB: q.tCountB,
      tCountChange: q.tCountChange,
      tDepthA: q.tDepthA,
      tDepthB: q.tDepthB,
      tDepthChange: q.tDepthChange,
    })),
    ledger:
      l === null
        ? null
        : {
            ignoredFileNames: l.ignoredFileNames,
            unchanged: l.unchanged,
            changed: l.changed.map(jsonPair),
            otherwiseChanged: l.otherwiseChanged.map(jsonPair),
            onlyA: l.onlyA.map(jsonRow),
            onlyB: l.onlyB.map(jsonRow),
          },
    limits: checks?.limits === undefined ? null : checks.limits.map(jsonLimit),
    violations:
      checks?.violations === undefined
        ? null
        : checks.violations.map((v) => ({ limit: jsonLimit(v.limit), reason: v.reason, before: v.before, after: v.after, increase: v.increase, allowed: v.allowed })),
    equivalence:
      e === undefined
        ? null
        : { distance: e.distance, exact: e.exact, method: e.method, states: e.states, qubits: e.qubits, boundSum: e.boundSum, tolerance: e.tolerance, within: e.within },
  };
  return JSON.stringify(o, null, 2) + "\n";
}
