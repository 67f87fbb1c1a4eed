// The ledger: one entry per lowered rotation instance, grouped into rows, summed exactly into the error bound, and assembled into the report.
import type { Angle } from "../ir/angle.js";
import type { SourceLoc } from "../ir/circuit.js";
import { angleValue } from "../ir/angle-ops.js";
import { dec, type Dec } from "../numeric/decimal.js";
import { canonicalDecimal, locationText, lowerFigure, reportAngle, toDec, upperFigure } from "./figures.js";
import { byCodeUnits, type Metrics } from "./metrics.js";
import { SCHEMA_VERSION, type LedgerRow, type OptionValue, type Report } from "./types.js";

/** What the lowering pass records for one rotation instance it lowered. */
export interface LedgerEntry {
  readonly loc: SourceLoc;
  /** The rotation gate lowered (rz, rx, ry, ...). */
  readonly gate: string;
  readonly angle: Angle;
  /** Error share allocated to this instance (decimal string or high-precision decimal, >= 0). */
  readonly epsilon: string | Dec;
  /** Error achieved by this instance (>= 0). */
  readonly error: string | Dec;
  /** T gates in the word emitted for this instance. */
  readonly tCount: number;
  readonly method: string;
  /** Inside an if/else branch or a while body. */
  readonly conditional: boolean;
  /** Inside a while body. */
  readonly inLoop: boolean;
}

/** Everything `buildReport` needs besides the ledger entries. */
export interface ReportInput {
  /** tledger's version (the CLI reads it from package.json). */
  readonly version: string;
  /** The error budget as given (decimal string or high-precision decimal, >= 0). */
  readonly budget: string | Dec;
  readonly options: Readonly<Record<string, OptionValue>>;
  /** Metrics of the lowered circuit. */
  readonly metrics: Metrics;
  readonly entries: readonly LedgerEntry[];
  readonly rotations: { readonly exact: number; readonly approximated: number; readonly distinct: number; readonly cached: number };
}

function checkCount(v: number, what: string): number {
  if (!Number.isSafeInteger(v) || v < 0) throw new RangeError(`${what}: expected a non-negative integer, got ${v}`);
  return v;
}

function nonNegative(v: string | Dec, what: string): Dec {
  const d = toDec(v, what);
  if (d.isNegative() && !d.isZero()) throw new RangeError(`${what}: negative value ${d.toString()}`);
  return d;
}

/** Working form of a row while entries are grouped. */
interface Group {
  readonly loc: SourceLoc;
  readonly gate: string;
  readonly angle: Angle;
  readonly angleValue: Dec;
  readonly epsilon: Dec;
  readonly error: Dec;
  readonly tCount: number;
  readonly method: string;
  readonly conditional: boolean;
  readonly inLoop: boolean;
  instances: number;
}

/** Grouping key: entries agreeing on every printed field (at full precision) share a row. */
function groupKey(e: LedgerEntry, angle: string, eps: Dec, err: Dec): string {
  const pi = e.angle.pi === null ? "-" : `${e.angle.pi.num}/${e.angle.pi.den}`;
  return [locationText(e.loc), e.gate, pi, angle, canonicalDecimal(eps), canonicalDecimal(err), e.tCount, e.method, e.conditional, e.inLoop].join("\u0000");
}

function compareNumbers(a: number, b: number): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Row order: file, line, column, gate, angle value, method, epsilon, error, T-count, flags. */
function compareGroups(a: Group, b: Group): number {
  return (
    byCodeUnits(a.loc.file, b.loc.file) ||
    compareNumbers(a.loc.line, b.loc.line) ||
    compareNumbers(a.loc.col, b.loc.col) ||
    byCodeUnits(a.gate, b.gate) ||
    a.angleValue.comparedTo(b.angleValue) ||
    byCodeUnits(a.method, b.method) ||
    a.epsilon.comparedTo(b.epsilon) ||
    a.error.comparedTo(b.error) ||
    compareNumbers(a.tCount, b.tCount) ||
    compareNumbers(Number(a.conditional), Number(b.conditional)) ||
    compareNumbers(Number(a.inLoop), Number(b.inLoop)) ||
    // Same value, different exact form (e.g. pi/4 against its 120-digit decimal): exact first.
    compareNumbers(a.angle.pi === null ? 1 : 0, b.angle.pi === null ? 1 : 0) ||
    byCodeUnits(reportAngle(a.angle).pi ?? "", reportAngle(b.angle).pi ?? "")
  );
}

/**
 * Groups ledger entries into rows (one row per distinct location, gate, angle, share, error,
 * T-count, method and flags, with an instance count) in a fixed order, and sums the errors of
 * all instances exactly (then rounds the sum up): the order of `entries` does not change the result.
 */
export function ledgerRows(entries: readonly LedgerEntry[]): { readonly rows: readonly LedgerRow[]; readonly errorBound: string; readonly boundPerIteration: boolean } {
  const groups = new Map<string, Group>();
  // The lowering pass hands one entry object per instance; a loop of 10^5 iterations repeats the
  // same object, so its decimal work is done once.
  let last: LedgerEntry | null = null;
  let lastGroup: Group | null = null;
  for (const e of entries) {
    if (e === last && lastGroup) {
      lastGroup.instances += 1;
      continue;
    }
    const where = locationText(e.loc);
    const epsilon = nonNegative(e.epsilon, `ledger entry at ${where}: epsilon`);
    const error = nonNegative(e.error, `ledger entry at ${where}: error`);
    checkCount(e.tCount, `ledger entry at ${where}: tCount`);
    const av = angleValue(e.angle);
    const key = groupKey(e, canonicalDecimal(av), epsilon, error);
    let g = groups.get(key);
    if (g) g.instances += 1;
    else {
      g = {
        loc: e.loc,
        gate: e.gate,
        angle: e.angle,
        angleValue: av,
        epsilon,
        error,
        tCount: e.tCount,
        method: e.method,
        conditional: e.conditional,
        inLoop: e.inLoop,
        instances: 1,
      };
      groups.set(key, g);
    }
    last = e;
    lastGroup = g;
  }
  const sorted = [...groups.values()].sort(compareGroups);
  let sum = dec(0);
  let boundPerIteration = false;
  const rows = sorted.map((g): LedgerRow => {
    sum = sum.plus(g.error.times(g.instances));
    if (g.inLoop && !g.error.isZero()) boundPerIteration = true;
    return {
      location: locationText(g.loc),
      gate: g.gate,
      angle: reportAngle(g.angle),
      epsilon: lowerFigure(g.epsilon),
      error: upperFigure(g.error),
      tCount: g.tCount,
      method: g.method,
      instances: g.instances,
      conditional: g.conditional,
      inLoop: g.inLoop,
    };
  });
  return { rows, errorBound: upperFigure(sum), boundPerIteration };
}

/** The report of one lowering run (see `Report` for the meaning of each field). */
export function buildReport(input: ReportInput): Report {
  const m = input.metrics;
  const r = input.rotations;
  const exact = checkCount(r.exact, "rotations.exact");
  const approximated = checkCount(r.approximated, "rotations.approximated");
  const { rows, errorBound, boundPerIteration } = ledgerRows(input.entries);
  const options = Object.create(null) as Record<string, OptionValue>;
  for (const k of Object.keys(input.options).sort(byCodeUnits)) {
    const v = input.options[k];
    if (typeof v === "number" && !Number.isFinite(v)) throw new RangeError(`option ${k}: not a finite number`);
    options[k] = v;
  }
  return {
    schemaVersion: SCHEMA_VERSION,
    tool: { name: "tledger", version: input.version },
    options,
    budget: canonicalDecimal(nonNegative(input.budget, "budget")),
    errorBound,
    boundPerIteration,
    qubits: m.qubits,
    gates: m.gates,
    depth: m.depth,
    tCount: m.tCount,
    tDepth: m.tDepth,
    cxCount: m.cxCount,
    cliffordCount: m.cliffordCount,
    measurements: m.measurements,
    resets: m.resets,
    conditionalOps: m.conditionalOps,
    remainingRotations: m.rotations,
    rotations: {
      total: exact + approximated,
      exact,
      approximated,
      distinct: checkCount(r.distinct, "rotations.distinct"),
      cached: checkCount(r.cached, "rotations.cached"),
    },
    ledger: rows,
    perQubit: m.perQubit.map((q) => ({ qubit: q.qubit, label: q.label, tCount: q.tCount, tDepth: q.tDepth })),
    gateCounts: m.gateCounts,
  };
}
