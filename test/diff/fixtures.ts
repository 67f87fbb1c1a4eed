// Test helper for the diff tests: figures of flat circuits counted by hand, and reports built the way the lowering command builds them.
import type { Angle } from "../../src/ir/angle.js";
import type { Circuit, GateOp, SourceLoc } from "../../src/ir/circuit.js";
import { buildReport, type LedgerEntry } from "../../src/report/ledger.js";
import { computeMetrics } from "../../src/report/metrics.js";
import type { LedgerRow, Report } from "../../src/report/types.js";

/** Figures of a flat circuit over h s sdg t tdg x y z cx rz, counted here without the metrics module. */
export interface NaiveFigures {
  readonly gates: number;
  readonly tCount: number;
  readonly tDepth: number;
  readonly depth: number;
  readonly cxCount: number;
  readonly cliffordCount: number;
  readonly rotations: number;
  readonly histogram: Map<string, number>;
  readonly tPerQubit: number[];
  readonly tDepthPerQubit: number[];
}

const FIXED_CLIFFORD = new Set(["h", "s", "sdg", "x", "y", "z", "cx"]);

/**
 * The usual as-soon-as-possible layering (common practice, no source): a gate starts after the
 * last gate on any of its qubits; T-depth counts T gates along the longest dependency chain.
 * An rz is Clifford when its angle is an exact multiple of pi/2, a continuous rotation when its
 * angle is not known as a multiple of pi at all.
 */
export function naiveFigures(c: Circuit): NaiveFigures {
  const clock = new Array<number>(c.numQubits).fill(0);
  const level = new Array<number>(c.numQubits).fill(0);
  const tPerQubit = new Array<number>(c.numQubits).fill(0);
  const histogram = new Map<string, number>();
  let tCount = 0;
  let cxCount = 0;
  let cliffordCount = 0;
  let rotations = 0;
  for (const s of c.body) {
    if (s.kind !== "gate") throw new Error("naiveFigures: flat gate lists only");
    const op = s as GateOp;
    histogram.set(op.name, (histogram.get(op.name) ?? 0) + 1);
    const isT = op.name === "t" || op.name === "tdg";
    if (isT) {
      tCount += 1;
      tPerQubit[op.qubits[0]] += 1;
    }
    if (op.name === "cx") cxCount += 1;
    if (FIXED_CLIFFORD.has(op.name)) cliffordCount += 1;
    if (op.name === "rz") {
      const pi = op.params[0].pi;
      if (pi === null) rotations += 1;
      else if (pi.den === 1n || pi.den === 2n) cliffordCount += 1;
    }
    const start = Math.max(...op.qubits.map((q) => clock[q]));
    const lv = Math.max(...op.qubits.map((q) => level[q])) + (isT ? 1 : 0);
    for (const q of op.qubits) {
      clock[q] = start + 1;
      level[q] = lv;
    }
  }
  return {
    gates: c.body.length,
    tCount,
    tDepth: Math.max(0, ...level),
    depth: Math.max(0, ...clock),
    cxCount,
    cliffordCount,
    rotations,
    histogram,
    tPerQubit,
    tDepthPerQubit: level,
  };
}

export const at = (line: number, col: number, file = "chain.qasm"): SourceLoc => ({ file, line, col });

/** A ledger entry with the usual defaults (not conditional; method "exact" for a zero error, else "grid"). */
export function entry(loc: SourceLoc, gate: string, angle: Angle, tCount: number, error: string, epsilon = "5e-11"): LedgerEntry {
  const exact = error === "0";
  return { loc, gate, angle, tCount, error, epsilon: exact ? "0" : epsilon, method: exact ? "exact" : "grid", conditional: false, inLoop: false };
}

/** A report of `circuit` with the given ledger entries (as `tledger lower` assembles one). */
export function reportOf(circuit: Circuit, entries: readonly LedgerEntry[], budget = "1e-10"): Report {
  const approximated = entries.filter((e) => e.method !== "exact").length;
  return buildReport({
    version: "0.1.0",
    budget,
    options: { budget },
    metrics: computeMetrics(circuit),
    entries,
    rotations: { exact: entries.length - approximated, approximated, distinct: approximated, cached: 0 },
  });
}

/** A ledger row written out by hand. */
export function row(location: string, gate: string, angle: { value: string; pi: string | null }, tCount: number, error: string, extra: Partial<LedgerRow> = {}): LedgerRow {
  return { location, gate, angle, epsilon: "5e-11", error, tCount, method: "grid", instances: 1, conditional: false, inLoop: false, ...extra };
}
