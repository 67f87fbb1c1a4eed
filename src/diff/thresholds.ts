// Limits on how much a figure may grow (`--max-increase tCount=2%,tDepth=0`): parsing them, and checking a diff against them exactly.
import { DiagnosticError, type Diagnostic } from "../frontend/diagnostics.js";
import { isDecimalText } from "../report/figures.js";
import { isMetricName, METRIC_NAMES, metricChange, type DiffResult, type MetricName } from "./compare.js";
import { exactCompare, exactInt, exactMul, exactSub, exactText, parseExact, type Exact } from "./exact.js";

/**
 * One limit. `absolute`: the figure may grow by at most `value` (in its own unit);
 * `percent`: by at most `value` percent of its old value (so a figure that was 0 may not grow at all).
 */
export interface Limit {
  readonly metric: MetricName;
  readonly kind: "absolute" | "percent";
  /** The limit as an exact canonical decimal string ("10", "2.5", "1e-12"), without the percent sign. */
  readonly value: string;
  /** The limit as the user wrote it, trimmed (`tCount=2%`). */
  readonly text: string;
}

/**
 * A limit that did not hold. `exceeded`: the figure grew by more than the limit allows;
 * `unavailable`: a side lacks the figure (say, an error bound for a bare circuit), so the limit
 * could not be checked, and that counts as failing it.
 */
export interface Violation {
  readonly limit: Limit;
  readonly reason: "exceeded" | "unavailable";
  /** Old and new value (numbers for counts, canonical decimal strings for errorBound and budget), null when missing. */
  readonly before: number | string | null;
  readonly after: number | string | null;
  /** after - before (null when a value is missing). */
  readonly increase: number | string | null;
  /** The largest increase the limit allows, as an exact decimal string (null when a value is missing). */
  readonly allowed: string | null;
}

const OPTIONS_FILE = "<options>";

/** A limit: a non-negative decimal number (no sign, no spaces), optionally followed by `%`. */
const LIMIT_RE = /^(\+?)([0-9.eE+-]+)(%?)$/;

const HINT = `write METRIC=LIMIT[,METRIC=LIMIT...], LIMIT a non-negative number, absolute (tDepth=0, cxCount=10) or a percentage of the old value (tCount=2%); metrics: ${METRIC_NAMES.join(", ")}`;

function problem(message: string): Diagnostic {
  return { severity: "error", file: OPTIONS_FILE, line: 0, col: 0, message, hint: HINT };
}

function suggestion(name: string): string {
  const lower = name.toLowerCase().replace(/[-_\s]/g, "");
  const close = METRIC_NAMES.find((m) => m.toLowerCase() === lower);
  return close === undefined ? "" : ` (did you mean ${close}?)`;
}

function parseOne(item: string, problems: Diagnostic[]): Limit | null {
  const text = item.trim();
  if (text === "") {
    problems.push(problem("--max-increase: empty entry (two commas in a row, or a comma at an end)"));
    return null;
  }
  const eq = text.indexOf("=");
  if (eq < 0) {
    problems.push(problem(`--max-increase: "${text}" has no "=": expected METRIC=LIMIT`));
    return null;
  }
  const name = text.slice(0, eq).trim();
  const limitText = text.slice(eq + 1).trim();
  let ok = true;
  if (name === "") {
    problems.push(problem(`--max-increase: "${text}" names no metric`));
    ok = false;
  } else if (!isMetricName(name)) {
    problems.push(problem(`--max-increase: unknown metric "${name}"${suggestion(name)}`));
    ok = false;
  }
  const m = LIMIT_RE.exec(limitText);
  if (limitText === "") {
    problems.push(problem(`--max-increase: "${text}" gives no limit`));
    ok = false;
  } else if (m === null || !isDecimalText(m[2]) || m[2].startsWith("+") || m[2].startsWith("-")) {
    const negative = limitText.startsWith("-");
    problems.push(problem(`--max-increase: "${limitText}" is not ${negative ? "a non-negative limit" : "a number or a percentage"} (in "${text}")`));
    ok = false;
  }
  if (!ok || m === null) return null;
  let value: Exact;
  try {
    value = parseExact(m[2]);
  } catch (e) {
    problems.push(problem(`--max-increase: "${limitText}": ${e instanceof Error ? e.message : String(e)}`));
    return null;
  }
  return { metric: name as MetricName, kind: m[3] === "%" ? "percent" : "absolute", value: exactText(value), text };
}

/**
 * Parses one or more `--max-increase` values (each a comma-separated list of METRIC=LIMIT).
 * Every problem is collected; any problem throws one DiagnosticError (file "<options>", line 0,
 * col 0) with a hint giving the syntax and listing the valid metrics. The same metric may appear
 * more than once (say, an absolute and a percentage limit): each is checked.
 */
export function parseThresholds(specs: string | readonly string[]): Limit[] {
  const list = typeof specs === "string" ? [specs] : specs;
  const problems: Diagnostic[] = [];
  const out: Limit[] = [];
  for (const spec of list) {
    for (const item of spec.split(",")) {
      const limit = parseOne(item, problems);
      if (limit !== null) out.push(limit);
    }
  }
  if (problems.length > 0) throw new DiagnosticError(problems);
  return out;
}

function toExact(v: number | string): Exact {
  return typeof v === "number" ? exactInt(v) : parseExact(v);
}

/**
 * The limits that do not hold for `diff` (in the order of `limits`). Decided exactly: an absolute
 * limit L fails when after - before > L; a percentage P fails when after - before > P/100 * before.
 */
export function checkThresholds(diff: DiffResult, limits: readonly Limit[]): Violation[] {
  const out: Violation[] = [];
  for (const limit of limits) {
    const m = metricChange(diff, limit.metric);
    if (m.a === null || m.b === null || m.change === null) {
      out.push({ limit, reason: "unavailable", before: m.a, after: m.b, increase: null, allowed: null });
      continue;
    }
    const before = toExact(m.a);
    const increase = exactSub(toExact(m.b), before);
    const value = parseExact(limit.value);
    const allowed = limit.kind === "absolute" ? value : exactMul(exactMul(value, before), parseExact("0.01"));
    if (exactCompare(increase, allowed) > 0) {
      out.push({ limit, reason: "exceeded", before: m.a, after: m.b, increase: m.change, allowed: exactText(allowed) });
    }
  }
  return out;
}
