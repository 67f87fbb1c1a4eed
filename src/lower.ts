// The main job as one library call: a circuit in; the Clifford+T circuit, the writer's ledger comments and the report out.
import type { Circuit, GateOp, Stmt } from "./ir/circuit.js";
import { isExactQuarterPi } from "./ir/angle-ops.js";
import { dec } from "./numeric/decimal.js";
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

/**
 * The gate named at each source location of the original program (the ledger names the source gate):
 * where several ops share a location (an inlined gate definition), the first with a continuous angle.
 */
function sourceGates(body: readonly Stmt[], into = new Map<string, { name: string; rotation: boolean }>()): Map<string, { name: string; rotation: boolean }> {
  for (const s of body) {
    if (s.kind === "gate") {
      const k = locKey(s.loc);
      const rotation = s.params.some((p) => !isExactQuarterPi(p));
      const prev = into.get(k);
      if (!prev || (rotation && !prev.rotation)) {
        const name = s.ctrl.length > 0 ? `${s.ctrl.map((c) => (c ? "ctrl" : "negctrl")).join(" @ ")} @ ${s.name}` : s.name;
        into.set(k, { name, rotation });
      }
    } else if (s.kind === "if") {
      sourceGates(s.then, into);
      sourceGates(s.else, into);
    } else if (s.kind === "while" || s.kind === "box") sourceGates(s.body, into);
  }
  return into;
}

/** Source rotation instances whose every angle is an exact multiple of pi/4 (lowered at zero error). */
function exactSourceRotations(body: readonly Stmt[]): number {
  let n = 0;
  for (const s of body) {
    if (s.kind === "gate") {
      if (s.name !== "gphase" && s.params.length > 0 && s.params.every(isExactQuarterPi)) n++;
    } else if (s.kind === "if") n += exactSourceRotations(s.then) + exactSourceRotations(s.else);
    else if (s.kind === "while" || s.kind === "box") n += exactSourceRotations(s.body);
  }
  return n;
}

/**
 * Lower `source` within the budget and build the report. Counting: `rotations.exact` is the source
 * rotations whose angles are all exact multiples of pi/4, plus merged z-rotations that became such a
 * multiple; `rotations.approximated` counts the z-rotation instances synthesized after decomposition
 * and merging (a controlled rotation contributes two, a general U up to three).
 */
export async function lowerProgram(source: Circuit, opts: LowerProgramOptions): Promise<LowerProgramResult> {
  const out = await lowerCircuit(source, opts);
  const gates = sourceGates(source.body);
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
      exact: exactSourceRotations(source.body) + out.exactRotations,
      approximated,
      distinct: out.census.groups.length,
      cached: out.cached.filter(Boolean).length,
    },
  });
  return { circuit: out.circuit, comments: out.comments, report };
}
