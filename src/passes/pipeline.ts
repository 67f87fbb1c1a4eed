// The lowering pipeline: the passes in the order they run, and the driver that books the budget and synthesizes.
import type { Circuit, GateOp } from "../ir/circuit.js";
import { dec } from "../numeric/decimal.js";
import { DiagnosticError } from "../frontend/diagnostics.js";
import { SynthCache, type SynthKey } from "../synth/cache.js";
import { createPool } from "../synth/pool.js";
import type { SynthResult } from "../synth/index.js";
import { MAX_EPS, minEps, verifyRzResult, type SynthMethod } from "../synth/verify.js";
import { decompose } from "./decompose.js";
import { eulerSplit } from "./euler-split.js";
import { cancelPairs } from "./cancel-pairs.js";
import { mergeRotations } from "./merge-rotations.js";
import { exactAngles } from "./exact-angles.js";
import { allocate, type BudgetPolicy } from "./budget.js";
import { censusRotations, type RotationCensus } from "./rotation-groups.js";
import { lowerRotations } from "./lower-rotations.js";
import { peephole } from "./peephole.js";
import { newLoweringContext, type LoweringContext, type SnapRecord } from "./lowering-context.js";

/** The budget used when neither --budget nor --per-rotation is given (documented in README.md). */
export const DEFAULT_BUDGET = "1e-3";

export interface LowerOptions {
  readonly policy: BudgetPolicy;
  readonly snap?: boolean;
  readonly method?: SynthMethod;
  readonly jobs?: number;
  /** A cache shared across runs in one process (sweep), or null for a fresh in-memory one. */
  readonly cache?: SynthCache<SynthResult> | null;
  readonly cacheDir?: string | null;
  readonly onProgress?: (done: number, total: number) => void;
}

export interface LowerOutcome {
  readonly circuit: Circuit;
  /** Comments the writer prints before an op (the ledger line of a synthesized block). */
  readonly comments: ReadonlyMap<GateOp, readonly string[]>;
  readonly census: RotationCensus;
  readonly eps: readonly string[];
  readonly results: readonly SynthResult[];
  /** Per group: served from the cache (memory or disk) rather than synthesized in this run. */
  readonly cached: readonly boolean[];
  readonly snaps: readonly SnapRecord[];
  readonly exactRotations: number;
  readonly cacheRejected: number;
}

/** Build the cache the driver uses: entries loaded from disk are re-verified against their key. */
export function createSynthCache(dir: string | null): SynthCache<SynthResult> {
  return new SynthCache<SynthResult>(dir, (key: SynthKey, value: SynthResult) => verifyRzResult(key.angle, key.eps, value));
}

/** The passes before synthesis: what is left afterwards is Clifford+T plus the rz ops to approximate. */
export function prepareRotations(circuit: Circuit, ctx: LoweringContext): Circuit {
  let c = decompose(circuit, {});
  c = eulerSplit(c);
  c = cancelPairs(c);
  c = mergeRotations(c);
  return exactAngles(c, ctx);
}

/**
 * Lower every rotation of `circuit` to Clifford+T. The passes, in order:
 * decompose -> euler-split -> cancel-pairs -> merge-rotations -> exact-angles -> (budget + synthesis) -> lower-rotations -> peephole.
 */
export async function lowerCircuit(circuit: Circuit, opts: LowerOptions): Promise<LowerOutcome> {
  const ctx = newLoweringContext({ snap: opts.snap ?? false });
  const method: SynthMethod = opts.method ?? "number-theoretic";
  const c = prepareRotations(circuit, ctx);

  const census = censusRotations(c.body);
  const snapSpent = ctx.snaps.reduce((s, r) => s.plus(dec(r.error)), dec(0));
  let policy = opts.policy;
  if (policy.kind === "budget") {
    const rest = dec(policy.budget).minus(snapSpent);
    if (rest.lte(0) && census.groups.length > 0)
      throw inputError(`the snapped angles alone spend ${snapSpent.toString()}, the whole budget ${policy.budget}`, "raise --budget or drop --snap");
    policy = { kind: "budget", budget: rest.toString() };
  }
  const cache = opts.cache ?? createSynthCache(opts.cacheDir ?? null);
  const rejectedBefore = cache.rejected;
  const pool = createPool(Math.max(1, opts.jobs ?? 1));
  const results: SynthResult[] = new Array(census.groups.length);
  const cached: boolean[] = new Array(census.groups.length).fill(false);
  let done = 0;
  try {
    const alloc = await allocate(census.groups, policy, async (batch) => {
      const misses: { index: number; key: SynthKey }[] = [];
      for (const { index, eps } of batch) {
        checkEps(eps, method);
        const key: SynthKey = { method, angle: census.groups[index]!.angle.value, eps };
        const hit = cache.get(key);
        if (hit) {
          results[index] = hit.value;
          cached[index] = true;
        } else misses.push({ index, key });
      }
      const fresh = await pool.run(misses.map((m) => ({ angle: census.groups[m.index]!.angle, eps: m.key.eps, method })));
      misses.forEach((m, j) => {
        results[m.index] = fresh[j]!;
        cache.set(m.key, fresh[j]!);
      });
      done += batch.length;
      opts.onProgress?.(done, census.groups.length);
      return batch.map((b) => results[b.index]!.error);
    }, MAX_EPS);
    const expand = lowerRotations(
      census,
      results.map((r) => r.word),
      (g, op) => {
        const r = results[g]!;
        const a = census.groups[g]!.angle;
        const v = a.value.length > 22 ? a.value.slice(0, 22) + "…" : a.value;
        return `${op.loc.file}:${op.loc.line}:${op.loc.col} rz(${v}): eps ${alloc.eps[g]}, achieved ${r.error}, ${r.tCount} T (${r.method})`;
      },
    );
    const cleaned = peephole(c, new Map(), expand);
    return {
      circuit: cleaned.circuit,
      comments: cleaned.comments,
      census,
      eps: alloc.eps,
      results,
      cached,
      snaps: ctx.snaps,
      exactRotations: ctx.exactRotations,
      cacheRejected: cache.rejected - rejectedBefore,
    };
  } finally {
    await pool.close();
  }
}

function checkEps(eps: string, method: SynthMethod): void {
  const e = dec(eps);
  const min = minEps(method);
  if (e.lt(dec(min)))
    throw inputError(
      `the error share per rotation would be ${eps}, below ${min}, the smallest the ${method} engine supports`,
      "raise --budget, or use --per-rotation with a supported value",
    );
  if (e.gt(dec(MAX_EPS)))
    throw inputError(`a per-rotation error of ${eps} is above ${MAX_EPS}, the largest the engine supports`, `use at most ${MAX_EPS}`);
}

function inputError(message: string, hint: string): DiagnosticError {
  return new DiagnosticError([{ severity: "error", file: "<options>", line: 0, col: 0, message, hint }]);
}
