// How a report's error budget was spent: each ledger row's error times copies as a share of the budget, the largest rows, the rest, and what is left.
import { dec, type Dec } from "../../numeric/decimal.js";
import { canonicalDecimal } from "../figures.js";
import { withinBudget } from "../format.js";
import type { LedgerRow, Report } from "../types.js";

/** One slice of the budget. */
export interface SpendItem {
  readonly kind: "row" | "other" | "unspent";
  /** The ledger index of a "row" item; -1 for the others. */
  readonly row: number;
  /** Ledger rows in the slice: 1 for a row, k for "other", 0 for "unspent". */
  readonly rows: number;
  /** What the slice is, in words (a row's location, gate, angle and copies). */
  readonly label: string;
  /** The error of the slice, exact (canonical decimal string): error * instances summed over its rows. */
  readonly amount: string;
  /** amount / budget as a float, for drawing only (0 when the budget is zero). */
  readonly fraction: number;
  /** amount / budget as display text ("38.6%", "<0.01%", "0%"); null when the budget is zero. */
  readonly percent: string | null;
}

export interface BudgetSpend {
  /** The budget as given. */
  readonly budget: string;
  /** The exact sum over the ledger of error * instances (canonical decimal). */
  readonly spent: string;
  /** The report's own verdict: its (rounded-up) error bound exceeds the budget. */
  readonly over: boolean;
  /** Largest rows first (ties in ledger order), then "other", then "unspent" when something is left. */
  readonly items: readonly SpendItem[];
  /** Ledger rows that spend nothing (exact lowerings); they get no slice. */
  readonly freeRows: number;
}

/** Display text of a ratio as a percentage: "0%", "<0.01%", or 3 significant digits. */
export function percentText(ratio: Dec): string {
  if (ratio.isZero()) return "0%";
  const pct = ratio.times(100);
  if (pct.lessThan(dec("0.01"))) return "<0.01%";
  return pct.toSignificantDigits(3, 6).toFixed() + "%";
}

/** The angle of a row as a label shows it: the pi form, else the decimal value to 6 significant digits. */
export function shortAngle(r: LedgerRow): string {
  if (r.angle.pi !== null) return r.angle.pi;
  const d = dec(r.angle.value);
  return d.isZero() ? "0" : d.toSignificantDigits(6, 6).toString();
}

/** A row in words: `file:line:col gate(angle) ×copies`, with `, in if` or `, in loop` when it applies. */
export function rowLabel(r: LedgerRow): string {
  const where = r.inLoop ? ", in loop" : r.conditional ? ", in if" : "";
  return `${r.location} ${r.gate}(${shortAngle(r)}) \u00d7${r.instances}${where}`;
}

/**
 * The budget split of a report: every ledger row with a nonzero error * instances, largest
 * first, at most `top` of them (all of them when only one more would remain), the rest folded
 * into "other", and the unspent remainder budget - spent when positive. Amounts are exact
 * decimals; floats appear only in `fraction`, for drawing.
 */
export function budgetSpend(report: Report, top = 8): BudgetSpend {
  if (!Number.isSafeInteger(top) || top < 1) throw new RangeError(`budgetSpend: top must be a positive integer, got ${top}`);
  const budget = dec(report.budget);
  const zeroBudget = budget.isZero();
  const share = (d: Dec): { fraction: number; percent: string | null } =>
    zeroBudget ? { fraction: 0, percent: null } : { fraction: d.div(budget).toNumber(), percent: percentText(d.div(budget)) };

  const costly: { index: number; amount: Dec }[] = [];
  let spent = dec(0);
  let freeRows = 0;
  report.ledger.forEach((r, index) => {
    const amount = dec(r.error).times(r.instances);
    spent = spent.plus(amount);
    if (amount.isZero()) freeRows += 1;
    else costly.push({ index, amount });
  });
  // Largest first; equal amounts keep ledger order (Array.prototype.sort is stable).
  costly.sort((a, b) => b.amount.comparedTo(a.amount));

  const shown = costly.length <= top + 1 ? costly : costly.slice(0, top);
  const rest = costly.slice(shown.length);
  const items: SpendItem[] = shown.map(({ index, amount }) => ({
    kind: "row",
    row: index,
    rows: 1,
    label: rowLabel(report.ledger[index]),
    amount: canonicalDecimal(amount),
    ...share(amount),
  }));
  if (rest.length > 0) {
    const amount = rest.reduce((s, x) => s.plus(x.amount), dec(0));
    items.push({ kind: "other", row: -1, rows: rest.length, label: `other rows (${rest.length})`, amount: canonicalDecimal(amount), ...share(amount) });
  }
  const left = budget.minus(spent);
  if (!zeroBudget && left.greaterThan(0)) {
    items.push({ kind: "unspent", row: -1, rows: 0, label: "unspent", amount: canonicalDecimal(left), ...share(left) });
  }
  return { budget: report.budget, spent: canonicalDecimal(spent), over: !withinBudget(report), items, freeRows };
}
