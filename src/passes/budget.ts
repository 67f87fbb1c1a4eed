// The error budget: equal shares per approximated rotation instance, unspent share carried forward in a fixed order.
import { dec, type Dec } from "../numeric/decimal.js";

/** Distinct rotations in first-appearance order, with how many executed instances each stands for. */
export interface BudgetGroup {
  readonly instances: number;
}

export type BudgetPolicy =
  | { readonly kind: "budget"; readonly budget: string }
  | { readonly kind: "per-rotation"; readonly eps: string };

/** Groups are synthesized in batches of this many, in order; fixed so output never depends on --jobs. */
export const BUDGET_BATCH = 32;

/** Significant digits of an allocated eps (rounded down, so shares never exceed the pool). */
const EPS_DIGITS = 4;

function Dmin(x: Dec, cap: string | null): Dec {
  return cap !== null && x.gt(dec(cap)) ? dec(cap) : x;
}

/** Round a positive decimal down to EPS_DIGITS significant digits, as a canonical string. */
export function roundEpsDown(x: Dec): string {
  return x.toSignificantDigits(EPS_DIGITS, 1 /* ROUND_DOWN */).toString();
}

/**
 * Allocate eps to each group and synthesize, batch by batch.
 * Budget policy: at the start of each batch the remaining pool (budget minus the errors already
 * achieved, each counted once per instance) is shared equally over all instances not yet
 * synthesized; every group of the batch is synthesized at that per-instance share. A synthesized
 * rotation usually lands below its share, so later batches receive the unspent part. Since
 * sum(instances * achieved) <= sum(instances * share) <= pool at every step, the total stays
 * within the budget. A share above `maxEps` (the engine's largest) is capped there. `synth(indices, eps)` must return, for each group index, its achieved error.
 */
export async function allocate(
  groups: readonly BudgetGroup[],
  policy: BudgetPolicy,
  synth: (batch: readonly { index: number; eps: string }[]) => Promise<readonly string[]>,
  maxEps: string | null = null,
): Promise<{ eps: string[]; errors: string[]; spent: Dec }> {
  const eps: string[] = new Array(groups.length);
  const errors: string[] = new Array(groups.length);
  let spent = dec(0);
  let remaining = groups.reduce((n, g) => n + g.instances, 0);
  for (let start = 0; start < groups.length; start += BUDGET_BATCH) {
    const end = Math.min(groups.length, start + BUDGET_BATCH);
    const share =
      policy.kind === "per-rotation"
        ? policy.eps
        : roundEpsDown(Dmin(dec(policy.budget).minus(spent).div(dec(remaining)), maxEps));
    const batch: { index: number; eps: string }[] = [];
    for (let i = start; i < end; i++) {
      eps[i] = share;
      batch.push({ index: i, eps: share });
    }
    const achieved = await synth(batch);
    for (let j = 0; j < batch.length; j++) {
      const i = batch[j]!.index;
      errors[i] = achieved[j]!;
      const n = groups[i]!.instances;
      spent = spent.plus(dec(achieved[j]!).times(n));
      remaining -= n;
    }
  }
  return { eps, errors, spent };
}
