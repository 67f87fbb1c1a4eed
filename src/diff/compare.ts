// Comparing two compiled outputs (circuits, reports or both): every figure before and after, the gate histogram, per-qubit T and the ledger rows.
import type { Circuit } from "../ir/circuit.js";
import { byCodeUnits, computeMetrics, type Metrics } from "../report/metrics.js";
import type { LedgerRow, Report } from "../report/types.js";
import { exactRatio, exactSub, exactText, parseExact, sameDecimal } from "./exact.js";
import { pairLedgers, type LedgerDiff } from "./ledger-pairs.js";

/**
 * One side of a comparison, as the caller loaded it. An OpenQASM file gives `circuit` (figures
 * computed from it); a report JSON gives `report` (its figures used). With both (a lowered file and
 * its report), the circuit's own figures are used and the report adds the error bound, the budget,
 * the rotation counts and the ledger; disagreements between the two are listed in `warnings`.
 */
export interface DiffSide {
  readonly label: string;
  readonly circuit?: Circuit;
  readonly report?: Report;
}

/** Integer figures, in display order. */
export const COUNT_METRICS = [
  "tCount",
  "tDepth",
  "cxCount",
  "cliffordCount",
  "gates",
  "depth",
  "qubits",
  "measurements",
  "resets",
  "conditionalOps",
  "remainingRotations",
  "rotations",
  "exactRotations",
  "approximatedRotations",
] as const;

/** Decimal figures (exact decimal strings). */
export const DECIMAL_METRICS = ["errorBound", "budget"] as const;

export type CountMetric = (typeof COUNT_METRICS)[number];
export type DecimalMetric = (typeof DECIMAL_METRICS)[number];
export type MetricName = CountMetric | DecimalMetric;

/**
 * Every figure a diff compares, in display order. Meanings (as in `Report` and `Metrics`):
 * - tCount, tDepth, cxCount, cliffordCount, gates, depth, qubits, measurements, resets, conditionalOps:
 *   the circuit figures (of the circuit when there is one, else of the report);
 * - remainingRotations: gates still carrying an angle not known to be a multiple of pi/4 (`Metrics.rotations`
 *   for a circuit, `Report.remainingRotations` for a report);
 * - rotations, exactRotations, approximatedRotations: the rotations the lowering met (`Report.rotations`
 *   total, exact, approximated): reports only, null for a bare circuit;
 * - errorBound, budget: the report's decimal strings; null for a bare circuit.
 */
export const METRIC_NAMES: readonly MetricName[] = [...COUNT_METRICS, ...DECIMAL_METRICS];

export function isMetricName(s: string): s is MetricName {
  return (METRIC_NAMES as readonly string[]).includes(s);
}

export function isDecimalMetric(m: MetricName): m is DecimalMetric {
  return (DECIMAL_METRICS as readonly string[]).includes(m);
}

/** An integer figure on both sides (null when a side does not have it). */
export interface CountChange {
  readonly kind: "count";
  readonly metric: CountMetric;
  readonly a: number | null;
  readonly b: number | null;
  /** b - a, or null when a side lacks the figure. */
  readonly change: number | null;
  /** (b - a) / a as a decimal fraction (0.25 for +25%); null when a side lacks the figure or a is 0. For display only. */
  readonly relative: number | null;
}

/** A decimal figure on both sides: canonical decimal strings, the change computed exactly. */
export interface DecimalChange {
  readonly kind: "decimal";
  readonly metric: DecimalMetric;
  readonly a: string | null;
  readonly b: string | null;
  readonly change: string | null;
  readonly relative: number | null;
}

export type MetricChange = CountChange | DecimalChange;

/** One gate name of the histogram; a side without the gate counts 0. */
export interface GateChange {
  readonly gate: string;
  readonly a: number;
  readonly b: number;
  readonly change: number;
}

/** T figures of one qubit index on both sides; null where a side has no such qubit (the change then counts it as 0). */
export interface QubitChange {
  readonly qubit: number;
  /** The new side's label for the qubit (the old side's when the new side lacks it). */
  readonly label: string;
  readonly tCountA: number | null;
  readonly tCountB: number | null;
  readonly tCountChange: number;
  readonly tDepthA: number | null;
  readonly tDepthB: number | null;
  readonly tDepthChange: number;
}

export type SideSource = "circuit" | "report" | "circuit+report";

export interface SideInfo {
  readonly label: string;
  readonly source: SideSource;
}

export interface DiffResult {
  readonly a: SideInfo;
  readonly b: SideInfo;
  /** True when no figure, gate count, per-qubit figure or ledger row differs, and the circuits (if both given) agree. */
  readonly identical: boolean;
  /** Every metric of METRIC_NAMES, in that order. */
  readonly metrics: readonly MetricChange[];
  /** Every gate name of either side, largest absolute change first, then by name (code unit order). */
  readonly gates: readonly GateChange[];
  /**
   * Every qubit index of either side, largest absolute T-count change first, then largest absolute
   * T-depth change, then by qubit index.
   */
  readonly qubits: readonly QubitChange[];
  /**
   * When both sides carry a circuit: true when their statements agree, source locations aside (so an
   * angle changed in place, which no figure shows, still makes the diff non-identical). Otherwise null.
   */
  readonly sameCircuits: boolean | null;
  /** The paired ledger rows when both sides carry a report; otherwise null. */
  readonly ledger: LedgerDiff | null;
  /** Things the caller should know (a report disagreeing with its circuit), in a fixed order. */
  readonly warnings: readonly string[];
}

/** The figures of one side, normalised. */
interface SideFigures {
  readonly info: SideInfo;
  readonly counts: Readonly<Record<CountMetric, number | null>>;
  readonly decimals: Readonly<Record<DecimalMetric, string | null>>;
  readonly gateCounts: Readonly<Record<string, number>>;
  readonly perQubit: readonly { readonly qubit: number; readonly label: string; readonly tCount: number; readonly tDepth: number }[];
  readonly ledger: readonly LedgerRow[] | null;
}

function sideSource(s: DiffSide): SideSource {
  if (s.circuit !== undefined && s.report !== undefined) return "circuit+report";
  if (s.circuit !== undefined) return "circuit";
  if (s.report !== undefined) return "report";
  throw new RangeError(`diff side "${s.label}": neither a circuit nor a report was given`);
}

/** Circuit figures a report repeats, checked against the circuit when a side has both. */
const CROSS_CHECKED = ["qubits", "gates", "depth", "tCount", "tDepth", "cxCount", "cliffordCount", "measurements", "resets", "conditionalOps"] as const;

function crossCheck(label: string, m: Metrics, r: Report, warnings: string[]): void {
  const off: string[] = [];
  for (const k of CROSS_CHECKED) if (m[k] !== r[k]) off.push(`${k} ${r[k]} (circuit: ${m[k]})`);
  if (m.rotations !== r.remainingRotations) off.push(`remainingRotations ${r.remainingRotations} (circuit: ${m.rotations})`);
  const names = [...new Set([...Object.keys(m.gateCounts), ...Object.keys(r.gateCounts)])].sort(byCodeUnits);
  const gatesOff = names.filter((g) => (m.gateCounts[g] ?? 0) !== (r.gateCounts[g] ?? 0));
  if (gatesOff.length > 0) off.push(`gate counts of ${gatesOff.join(", ")}`);
  if (off.length > 0) {
    warnings.push(`${label}: the report does not describe this circuit (it says ${off.join("; ")}); circuit figures are used, the ledger and error bound come from the report`);
  }
}

/** The rotation counts a report adds (null for a bare circuit). */
function rotationCounts(r: Report | undefined): Pick<Record<CountMetric, number | null>, "rotations" | "exactRotations" | "approximatedRotations"> {
  return { rotations: r?.rotations.total ?? null, exactRotations: r?.rotations.exact ?? null, approximatedRotations: r?.rotations.approximated ?? null };
}

/** The circuit figures, from a circuit's metrics or from a report (same definitions). */
function circuitCounts(f: Metrics | Report): Omit<Record<CountMetric, number>, "rotations" | "exactRotations" | "approximatedRotations"> {
  return {
    tCount: f.tCount,
    tDepth: f.tDepth,
    cxCount: f.cxCount,
    cliffordCount: f.cliffordCount,
    gates: f.gates,
    depth: f.depth,
    qubits: f.qubits,
    measurements: f.measurements,
    resets: f.resets,
    conditionalOps: f.conditionalOps,
    remainingRotations: "remainingRotations" in f ? f.remainingRotations : f.rotations,
  };
}

function figures(s: DiffSide, warnings: string[]): SideFigures {
  const info: SideInfo = { label: s.label, source: sideSource(s) };
  const r = s.report;
  const m = s.circuit !== undefined ? computeMetrics(s.circuit) : null;
  if (m !== null && r !== undefined) crossCheck(s.label, m, r, warnings);
  // sideSource has checked that one of the two is present.
  const f: Metrics | Report = m ?? (r as Report);
  return {
    info,
    counts: { ...circuitCounts(f), ...rotationCounts(r) },
    decimals: {
      errorBound: r === undefined ? null : exactText(parseExact(r.errorBound)),
      budget: r === undefined ? null : exactText(parseExact(r.budget)),
    },
    gateCounts: f.gateCounts,
    perQubit: f.perQubit,
    ledger: r === undefined ? null : r.ledger,
  };
}

function countChange(metric: CountMetric, a: number | null, b: number | null): CountChange {
  if (a === null || b === null) return { kind: "count", metric, a, b, change: null, relative: null };
  return { kind: "count", metric, a, b, change: b - a, relative: a === 0 ? null : (b - a) / a };
}

function decimalChange(metric: DecimalMetric, a: string | null, b: string | null): DecimalChange {
  if (a === null || b === null) return { kind: "decimal", metric, a, b, change: null, relative: null };
  const x = parseExact(a);
  const d = exactSub(parseExact(b), x);
  return { kind: "decimal", metric, a, b, change: exactText(d), relative: exactRatio(d, x) };
}

function own(r: Readonly<Record<string, number>>, k: string): number {
  return Object.prototype.hasOwnProperty.call(r, k) ? r[k] : 0;
}

function gateChanges(a: Readonly<Record<string, number>>, b: Readonly<Record<string, number>>): GateChange[] {
  const names = [...new Set([...Object.keys(a), ...Object.keys(b)])];
  const out = names.map((gate): GateChange => {
    const x = own(a, gate);
    const y = own(b, gate);
    return { gate, a: x, b: y, change: y - x };
  });
  return out.sort((p, q) => Math.abs(q.change) - Math.abs(p.change) || byCodeUnits(p.gate, q.gate));
}

function qubitChanges(a: SideFigures["perQubit"], b: SideFigures["perQubit"]): QubitChange[] {
  const n = Math.max(a.length, b.length);
  const out: QubitChange[] = [];
  for (let q = 0; q < n; q++) {
    const x = a[q];
    const y = b[q];
    out.push({
      qubit: q,
      label: y?.label ?? x?.label ?? `$${q}`,
      tCountA: x?.tCount ?? null,
      tCountB: y?.tCount ?? null,
      tCountChange: (y?.tCount ?? 0) - (x?.tCount ?? 0),
      tDepthA: x?.tDepth ?? null,
      tDepthB: y?.tDepth ?? null,
      tDepthChange: (y?.tDepth ?? 0) - (x?.tDepth ?? 0),
    });
  }
  return out.sort(
    (p, q) => Math.abs(q.tCountChange) - Math.abs(p.tCountChange) || Math.abs(q.tDepthChange) - Math.abs(p.tDepthChange) || p.qubit - q.qubit,
  );
}

function sameMetric(m: MetricChange): boolean {
  if (m.a === null || m.b === null) return m.a === m.b;
  return m.kind === "count" ? m.a === m.b : sameDecimal(m.a, m.b as string);
}

/** Deep equality of IR values (records, arrays, strings, numbers, bigints, booleans, null), ignoring every `loc` field. */
function sameStructure(x: unknown, y: unknown): boolean {
  if (x === y) return true;
  if (typeof x !== "object" || typeof y !== "object" || x === null || y === null) return false;
  if (Array.isArray(x) !== Array.isArray(y)) return false;
  if (Array.isArray(x) && Array.isArray(y)) return x.length === y.length && x.every((v, i) => sameStructure(v, y[i]));
  const rx = x as Record<string, unknown>;
  const ry = y as Record<string, unknown>;
  const kx = Object.keys(rx).filter((k) => k !== "loc" && rx[k] !== undefined);
  const ky = Object.keys(ry).filter((k) => k !== "loc" && ry[k] !== undefined);
  if (kx.length !== ky.length) return false;
  return kx.every((k) => Object.prototype.hasOwnProperty.call(ry, k) && sameStructure(rx[k], ry[k]));
}

/**
 * Compares side `a` (before) with side `b` (after). Pure: the same two sides give an equal result.
 * Throws a RangeError when a side has neither a circuit nor a report.
 */
export function diffSides(a: DiffSide, b: DiffSide): DiffResult {
  const warnings: string[] = [];
  const fa = figures(a, warnings);
  const fb = figures(b, warnings);
  const metrics: MetricChange[] = METRIC_NAMES.map((k) =>
    isDecimalMetric(k) ? decimalChange(k, fa.decimals[k], fb.decimals[k]) : countChange(k, fa.counts[k], fb.counts[k]),
  );
  const gates = gateChanges(fa.gateCounts, fb.gateCounts);
  const qubits = qubitChanges(fa.perQubit, fb.perQubit);
  const ledger = fa.ledger !== null && fb.ledger !== null ? pairLedgers(fa.ledger, fb.ledger) : null;
  const sameCircuits = a.circuit !== undefined && b.circuit !== undefined ? sameStructure(a.circuit.numQubits, b.circuit.numQubits) && sameStructure(a.circuit.body, b.circuit.body) : null;
  const identical =
    sameCircuits !== false &&
    metrics.every(sameMetric) &&
    gates.every((g) => g.change === 0) &&
    qubits.every((q) => q.tCountA === q.tCountB && q.tDepthA === q.tDepthB) &&
    (ledger === null || (ledger.changed.length === 0 && ledger.otherwiseChanged.length === 0 && ledger.onlyA.length === 0 && ledger.onlyB.length === 0));
  return { a: fa.info, b: fb.info, identical, metrics, gates, qubits, sameCircuits, ledger, warnings };
}

/** The change of one metric of a diff. */
export function metricChange(d: DiffResult, metric: MetricName): MetricChange {
  const m = d.metrics.find((x) => x.metric === metric);
  if (m === undefined) throw new RangeError(`diff has no metric ${metric}`);
  return m;
}
