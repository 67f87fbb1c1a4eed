// Tests of the budget split: exact amounts, largest-first order with stable ties, folding into "other", the unspent rest.
import { all, create } from "mathjs";
import { describe, expect, it } from "vitest";
import { dec } from "../../../src/numeric/decimal.js";
import { budgetSpend, percentText, rowLabel } from "../../../src/report/html/budget-spend.js";
import type { LedgerRow, Report } from "../../../src/report/types.js";
import { fixtureReport, ledgerRows } from "./fixture.js";

// mathjs as an independent reference for the decimal sums.
const math = create(all, { number: "BigNumber", precision: 64 });
const big = (s: string | number) => math.bignumber(s);

function withRows(rows: LedgerRow[], budget: string): Report {
  return { ...fixtureReport(), budget, errorBound: "0", ledger: rows };
}

function rows(n: number, error: (i: number) => string): LedgerRow[] {
  const r = ledgerRows()[0];
  return Array.from({ length: n }, (_, i) => ({ ...r, location: `f.qasm:${i + 1}:1`, error: error(i), instances: 1 + (i % 3) }));
}

describe("budgetSpend", () => {
  it("folds all but the largest `top` rows into one 'other' slice whose amount is their exact sum", () => {
    const ls = rows(12, (i) => `${i + 1}.5e-7`);
    const s = budgetSpend(withRows(ls, "1e-4"), 8);
    const amounts = ls.map((r) => big(r.error).times(r.instances));
    const order = ls.map((_, i) => i).sort((a, b) => amounts[b].comparedTo(amounts[a]) || a - b);
    expect(s.items.map((it) => it.kind)).toEqual([...Array(8).fill("row"), "other", "unspent"]);
    expect(s.items.slice(0, 8).map((it) => it.row)).toEqual(order.slice(0, 8));
    const rest = order.slice(8).reduce((acc, i) => acc.plus(amounts[i]), big(0));
    expect(big(s.items[8].amount).equals(rest)).toBe(true);
    expect(s.items[8].rows).toBe(4);
    const total = amounts.reduce((a, b) => a.plus(b));
    expect(big(s.spent).equals(total)).toBe(true);
    expect(big(s.items[9].amount).equals(big("1e-4").minus(total))).toBe(true);
    // all slices together are the budget
    const sum = s.items.reduce((acc, it) => acc.plus(big(it.amount)), big(0));
    expect(sum.equals(big("1e-4"))).toBe(true);
  });

  it("shows every row rather than an 'other' slice of one", () => {
    const s = budgetSpend(withRows(rows(9, () => "1e-6"), "1e-3"), 8);
    expect(s.items.filter((it) => it.kind === "row")).toHaveLength(9);
    expect(s.items.some((it) => it.kind === "other")).toBe(false);
  });

  it("keeps ledger order among equal amounts", () => {
    const ls = rows(6, () => "2e-6").map((r) => ({ ...r, instances: 1 }));
    expect(budgetSpend(withRows(ls, "1e-3")).items.filter((it) => it.kind === "row").map((it) => it.row)).toEqual([0, 1, 2, 3, 4, 5]);
  });

  it("decides 'over' as the report does and leaves no unspent slice then", () => {
    const r: Report = { ...fixtureReport(), budget: "1.2e-4" };
    const s = budgetSpend(r);
    expect(s.over).toBe(true);
    expect(s.items.some((it) => it.kind === "unspent")).toBe(false);
    expect(budgetSpend(fixtureReport()).over).toBe(false);
  });

  it("counts rows that spend nothing and gives them no slice", () => {
    const s = budgetSpend(fixtureReport());
    expect(s.freeRows).toBe(1);
    expect(s.items.some((it) => it.row === 3)).toBe(false);
  });

  it("has no percentages for a zero budget", () => {
    const s = budgetSpend(withRows(rows(2, () => "1e-6"), "0"));
    expect(s.items.every((it) => it.percent === null && it.fraction === 0)).toBe(true);
    expect(s.items.some((it) => it.kind === "unspent")).toBe(false);
  });

  it("rejects a bad `top`", () => {
    expect(() => budgetSpend(fixtureReport(), 0)).toThrow(RangeError);
    expect(() => budgetSpend(fixtureReport(), 1.5)).toThrow(RangeError);
  });
});

describe("percentText and rowLabel", () => {
  it("writes shares with three significant digits, and says when they are tiny", () => {
    expect(percentText(dec(0))).toBe("0%");
    expect(percentText(dec("1e-7"))).toBe("<0.01%");
    expect(percentText(dec("0.0001"))).toBe("0.01%");
    expect(percentText(dec("0.615"))).toBe("61.5%");
    expect(percentText(dec(1).div(3))).toBe("33.3%");
    expect(percentText(dec("1.5"))).toBe("150%");
  });

  it("names a row by place, gate, angle, copies and where it sits", () => {
    const [a, b, c] = ledgerRows();
    expect(rowLabel(a)).toBe("spin-chain.qasm:14:3 rz(0.42) \u00d74");
    expect(rowLabel(b)).toBe("spin-chain.qasm:15:3 rx(pi/3) \u00d72");
    expect(rowLabel(c)).toBe("spin-chain.qasm:21:5 ry(-1.25) \u00d71, in if");
    expect(rowLabel({ ...a, angle: { value: "0.12345678901", pi: null }, inLoop: true, conditional: true })).toBe("spin-chain.qasm:14:3 rz(0.123457) \u00d74, in loop");
  });
});
