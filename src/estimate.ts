// What lowering a circuit would cost, without synthesizing anything: the rotations left after decomposition and merging, and their T-count at a budget.
import type { Circuit } from "./ir/circuit.js";
import { dec } from "./numeric/decimal.js";
import { newLoweringContext } from "./passes/lowering-context.js";
import { prepareRotations } from "./passes/pipeline.js";
import { censusRotations, locKey } from "./passes/rotation-groups.js";
import { computeMetrics } from "./report/metrics.js";
import { reportAngle } from "./report/figures.js";
import type { EstimateTable } from "./report/html/types.js";

/**
 * Mean of T - 3 log2(1/eps) of the number-theoretic engine, measured by `npm run bench` (synth
 * section) between 1e-6 and 1e-15 and rounded up: the estimate leans to the expensive side.
 */
export const ENGINE_OFFSET = 0;

/** Estimated T gates of one z-rotation approximated within eps by the number-theoretic engine. */
export function estimateRotationT(eps: number): number {
  return Math.max(0, Math.round(3 * Math.log2(1 / eps) + ENGINE_OFFSET));
}

export interface BudgetEstimate {
  readonly budget: string;
  /** Error share of one approximated rotation under equal shares. */
  readonly share: string;
  readonly tEach: number;
  /** T gates of the exact parts plus the approximated rotations. */
  readonly tCount: number;
}

export interface LoweringEstimate {
  /** z-rotation instances left to approximate after decomposition, merging and exact angles. */
  readonly rotations: number;
  readonly distinct: number;
  /** T gates the exact parts cost (Toffolis, exact angles, T gates of the source). */
  readonly exactT: number;
  readonly budgets: readonly BudgetEstimate[];
  /** Per source rotation at the first budget (for the HTML report). */
  readonly table: EstimateTable | null;
}

/** Run the lowering passes that come before synthesis and estimate the cost at each budget. */
export function estimateLowering(source: Circuit, budgets: readonly string[]): LoweringEstimate {
  const c = prepareRotations(source, newLoweringContext());
  const census = censusRotations(c.body);
  const rotations = census.groups.reduce((n, g) => n + g.instances, 0);
  const exactT = computeMetrics(c).tCount;
  const rows = budgets.map((b): BudgetEstimate => {
    if (rotations === 0) return { budget: b, share: "0", tEach: 0, tCount: exactT };
    const share = dec(b).div(rotations);
    const tEach = estimateRotationT(share.toNumber());
    return { budget: b, share: share.toSignificantDigits(4, 1).toString(), tEach, tCount: exactT + tEach * rotations };
  });
  const first = rows[0];
  const table: EstimateTable | null =
    first === undefined
      ? null
      : {
          budget: first.budget,
          basis: `each of the ${rotations} rotation instances gets budget/${rotations}; T per rotation estimated as round(3 log2(1/share) + ${ENGINE_OFFSET}), the engine's measured mean offset`,
          rows: census.sites.map((s) => {
            const a = reportAngle(census.groups[s.group]!.angle);
            return { location: locKey(s.loc), gate: "rz", angle: a.pi ?? a.value, instances: s.instances, share: first.share, tEach: first.tEach };
          }),
        };
  return { rotations, distinct: census.groups.length, exactT, budgets: rows, table };
}
