import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { allocate, BUDGET_BATCH, roundEpsDown } from "../../src/passes/budget.js";
import { dec } from "../../src/numeric/decimal.js";

describe("budget allocation", () => {
  it("rounds shares down", () => {
    expect(roundEpsDown(dec("0.000123456"))).toBe("0.0001234");
    expect(dec(roundEpsDown(dec(1).div(3))).lte(dec(1).div(3))).toBe(true);
  });

  it("starts with equal shares and carries unspent error forward, never exceeding the budget", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 1, maxLength: 3 * BUDGET_BATCH + 5 }),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        async (instances, fraction) => {
          const groups = instances.map((n) => ({ instances: n }));
          const total = instances.reduce((a, b) => a + b, 0);
          const budget = "1e-6";
          const seen: string[] = [];
          const { eps, errors, spent } = await allocate(groups, { kind: "budget", budget }, async (batch) => {
            // Each synthesized rotation spends `fraction` of its share.
            return batch.map((b) => {
              seen.push(b.eps);
              return dec(b.eps).times(fraction).toString();
            });
          });
          expect(spent.lte(dec(budget))).toBe(true);
          const recomputed = errors.reduce((s, e, i) => s.plus(dec(e).times(instances[i]!)), dec(0));
          expect(recomputed.eq(spent)).toBe(true);
          // the first batch gets the plain equal share
          expect(eps[0]).toBe(roundEpsDown(dec(budget).div(total)));
          // later shares never shrink: unspent error only adds
          for (let i = 1; i < eps.length; i++) expect(dec(eps[i]!).gte(dec(eps[i - 1]!))).toBe(true);
          expect(seen.length).toBe(groups.length);
        },
      ),
      { seed: 7, numRuns: 60 },
    );
  });

  it("uses the given eps for every rotation under --per-rotation", async () => {
    const { eps } = await allocate([{ instances: 3 }, { instances: 1 }], { kind: "per-rotation", eps: "1e-5" }, async (b) => b.map(() => "1e-6"));
    expect(eps).toEqual(["1e-5", "1e-5"]);
  });

  it("caps shares at the engine's largest eps", async () => {
    const { eps } = await allocate([{ instances: 1 }], { kind: "budget", budget: "0.9" }, async (b) => b.map(() => "0"), "0.1");
    expect(eps).toEqual(["0.1"]);
  });
});
