// The main job as one library call: a circuit in; the Clifford+T circuit, the writer's ledger comments and the report out.
import type { Angle } from "./ir/angle.js";
import type { Circuit, GateOp, Stmt } from "./ir/circuit.js";
import { isExactQuarterPi } from "./ir/angle-ops.js";
import { dec } from "./numeric/decimal.js";
import { decomposeOp } from "./passes/decompose.js";
import { isZeroAngle } from "./passes/merge-rotations.js";
import { lowerCircuit, type LowerOptions } from "./passes/pipeline.js";
import { locKey } from "./passes/rotation-groups.js";
import { computeMetrics } from "./report/metrics.js";
import { buildReport, type LedgerEntry } from "./report/ledger.js";
import type { OptionValue, Report } from "./report/types.js";

export interface LowerProgramOptions extends LowerOptions {
  /** tledger's version, written into the report. */
  readonly version: string;
  /** The options that shape the output, recorded in the report. */
  readonly reportOptions?: Readonly<Record<string, OptionValue>>;
}

export interface LowerProgramResult {
  readonly circuit: Circuit;
  readonly comments: ReadonlyMap<GateOp, readonly string[]>;
  readonly report: Report;
}

/** A key for the decomposition of an op up to its qubit labels: name, control pattern, exact parameters. */
function shapeKey(op: GateOp): string {
  const ctrl = op.ctrl.map((c) => (c ? "1" : "0")).join("");
  const params = op.params.map((a) => (a.pi ? `p${a.pi.num}/${a.pi.den}` : `d${a.value}`)).join(",");
  return `${op.name}|${ctrl}|${op.qubits.length}|${params}`;
}

/** True when rz(a) (or an Euler angle a of U) must be approximated: not an exact multiple of pi/4, and not a decimal zero. */
function needsApproximation(a: Angle): boolean {
  return !isExactQuarterPi(a) && !(a.pi === null && isZeroAngle(a));
}

/**
 * Whether decomposing `op` leaves a z-rotation to approximate: an rz (or a U, whose Euler split gives
 * rz by each of its angles) by an angle that is not an exact multiple of pi/4. Asks `decomposeOp`
 * itself, on the op moved to qubits 0..n-1 (the decomposition depends only on the op's shape), and
 * caches the answer per shape. Ops with neither parameters nor controls decompose to Clifford+T gates.
 */
function approximates(op: GateOp, cache: Map<string, boolean>): boolean {
  if (op.params.length === 0 && op.ctrl.length === 0) return false;
  const key = shapeKey(op);
  const known = cache.get(key);
  if (known !== undefined) return known;
  const probe: GateOp = { ...op, qubits: op.qubits.map((_, i) => i) };
  const answer = decomposeOp(probe).some((o) => (o.name === "rz" || o.name === "U") && o.params.some(needsApproximation));
  cache.set(key, answer);
  return answer;
}

interface SourceGate {
  readonly name: string;
  /** 2: its decomposition has a rotation to approximate; 1: it has a continuous angle; 0: neither. */
  readonly rank: number;
}

/**
 * The gate named at each ledger location of the original program (the ledger names the source gate).
 * Where several ops share a location (an inlined gate definition), the first whose decomposition
 * leaves a rotation to approximate (so `crz(pi/4)`, approximated as rz(pi/8) halves, is named rather
 * than an `h` inlined before it); failing that the first with a continuous angle, else the first op.
 * Only locations in `wanted` are looked at.
 */
function sourceGates(body: readonly Stmt[], wanted: ReadonlySet<string>, cache: Map<string, boolean>, into = new Map<string, SourceGate>()): Map<string, SourceGate> {
  for (const s of body) {
    if (s.kind === "gate") {
      const k = locKey(s.loc);
      if (!wanted.has(k)) continue;
      const prev = into.get(k);
      if (prev && prev.rank === 2) continue;
      const rank = approximates(s, cache) ? 2 : s.params.some((p) => !isExactQuarterPi(p)) ? 1 : 0;
      if (!prev || rank > prev.rank) {
        const name = s.ctrl.length > 0 ? `${s.ctrl.map((c) => (c ? "ctrl" : "negctrl")).join(" @ ")} @ ${s.name}` : s.name;
        into.set(k, { name, rank });
      }
    } else if (s.kind === "if") {
      sourceGates(s.then, wanted, cache, into);
      sourceGates(s.else, wanted, cache, into);
    } else if (s.kind === "while" || s.kind === "box") sourceGates(s.body, wanted, cache, into);
  }
  return into;
}

/** Source rotation instances (ops with angle parameters, gphase aside) whose decomposition leaves nothing to approximate. */
function exactSourceRotations(body: readonly Stmt[], cache: Map<string, boolean>): number {
  let n = 0;
  for (const s of body) {
    if (s.kind === "gate") {
      if (s.name !== "gphase" && s.params.length > 0 && !approximates(s, cache)) n++;
    } else if (s.kind === "if") n += exactSourceRotations(s.then, cache) + exactSourceRotations(s.else, cache);
    else if (s.kind === "while" || s.kind === "box") n += exactSourceRotations(s.body, cache);
  }
  return n;
}

/**
 * Lower `source` within the budget and build the report. Counting: `rotations.exact` is the source
 * rotations (ops with angle parameters, gphase aside) whose decomposition leaves no rotation to
 * approximate (so `cp(pi/4)`, whose halves are pi/8, is not one), plus merged z-rotations that became
 * an exact multiple of pi/4; `rotations.approximated` counts the z-rotation instances synthesized after decomposition
 * and merging (a controlled rotation contributes two, a general U up to three).
 */
export async function lowerProgram(source: Circuit, opts: LowerProgramOptions): Promise<LowerProgramResult> {
  const out = await lowerCircuit(source, opts);
  const decided = new Map<string, boolean>();
  const wanted = new Set([...out.census.sites.map((site) => locKey(site.loc)), ...out.snaps.map((snap) => locKey(snap.loc))]);
  const gates = sourceGates(source.body, wanted, decided);
  const entries: LedgerEntry[] = [];
  let implied = dec(0);
  for (const site of out.census.sites) {
    const g = site.group;
    const r = out.results[g]!;
    const entry: LedgerEntry = {
      loc: site.loc,
      gate: gates.get(locKey(site.loc))?.name ?? "rz",
      angle: out.census.groups[g]!.angle,
      epsilon: out.eps[g]!,
      error: r.error,
      tCount: r.tCount,
      method: r.method,
      conditional: site.conditional,
      inLoop: site.inLoop,
    };
    for (let i = 0; i < site.instances; i++) entries.push(entry);
    implied = implied.plus(dec(out.eps[g]!).times(site.instances));
  }
  for (const s of out.snaps) {
    entries.push({
      loc: s.loc,
      gate: gates.get(locKey(s.loc))?.name ?? "rz",
      angle: { pi: null, value: s.from },
      epsilon: s.error,
      error: s.error,
      tCount: 0,
      method: "snap",
      conditional: false,
      inLoop: false,
    });
    implied = implied.plus(dec(s.error));
  }
  const approximated = out.census.groups.reduce((n, g) => n + g.instances, 0);
  const budget = opts.policy.kind === "budget" ? opts.policy.budget : implied.toString();
  const report = buildReport({
    version: opts.version,
    budget,
    options: opts.reportOptions ?? {},
    metrics: computeMetrics(out.circuit),
    entries,
    rotations: {
      exact: exactSourceRotations(source.body, decided) + out.exactRotations,
      approximated,
      distinct: out.census.groups.length,
      cached: out.cached.filter(Boolean).length,
    },
  });
  return { circuit: out.circuit, comments: out.comments, report };
}
