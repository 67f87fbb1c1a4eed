// Reading a JSON report back: checks the schema version, the shape and the obvious sums, and says exactly what is wrong.
import { DiagnosticError, type Diagnostic } from "../frontend/diagnostics.js";
import { dec } from "../numeric/decimal.js";
import { isDecimalText } from "./figures.js";
import { findJsonSyntaxError, type JsonSyntaxError } from "./json-syntax.js";
import { SCHEMA_VERSION, type LedgerAngle, type LedgerRow, type OptionValue, type QubitRow, type Report, type RotationCounts } from "./types.js";

/** Problems found so far; each is a message naming the JSON path it is about. */
type Problems = string[];

/** At most this many problems are reported (the rest would be noise after the first few). */
const MAX_PROBLEMS = 20;

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type JsonObject = { [k: string]: Json };

function describe(v: Json | undefined): string {
  if (v === undefined) return "nothing";
  if (v === null) return "null";
  if (Array.isArray(v)) return "an array";
  if (typeof v === "object") return "an object";
  if (typeof v === "string") return `the string ${JSON.stringify(v.length > 40 ? v.slice(0, 40) + "..." : v)}`;
  return `${typeof v} ${String(v)}`;
}

function isObject(v: Json | undefined): v is JsonObject {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Checks that `o` has exactly the keys `keys` (reports missing and unexpected ones). */
function object(p: Problems, v: Json | undefined, path: string, keys: readonly string[]): JsonObject | null {
  if (!isObject(v)) {
    p.push(`${path}: expected an object, found ${describe(v)}`);
    return null;
  }
  for (const k of keys) if (!Object.prototype.hasOwnProperty.call(v, k)) p.push(`${path}: missing key "${k}"`);
  for (const k of Object.keys(v)) if (!keys.includes(k)) p.push(`${path}: unexpected key "${k}"`);
  return v;
}

function at(path: string, key: string): string {
  return path === "" ? key : `${path}.${key}`;
}

function field(o: JsonObject, k: string): Json | undefined {
  return Object.prototype.hasOwnProperty.call(o, k) ? o[k] : undefined;
}

function count(p: Problems, v: Json | undefined, path: string): number {
  if (typeof v !== "number" || !Number.isSafeInteger(v) || v < 0) {
    p.push(`${path}: expected a non-negative integer, found ${describe(v)}`);
    return 0;
  }
  return v;
}

function text(p: Problems, v: Json | undefined, path: string, nonEmpty = false): string {
  if (typeof v !== "string" || (nonEmpty && v.length === 0)) {
    p.push(`${path}: expected ${nonEmpty ? "a non-empty" : "a"} string, found ${describe(v)}`);
    return "";
  }
  return v;
}

function flag(p: Problems, v: Json | undefined, path: string): boolean {
  if (typeof v !== "boolean") {
    p.push(`${path}: expected true or false, found ${describe(v)}`);
    return false;
  }
  return v;
}

function decimal(p: Problems, v: Json | undefined, path: string, nonNegative: boolean): string {
  if (typeof v !== "string" || !isDecimalText(v)) {
    p.push(`${path}: expected a decimal number written as a string (like "1e-10"), found ${describe(v)}`);
    return "0";
  }
  if (nonNegative && v.trim().startsWith("-") && !dec(v).isZero()) {
    p.push(`${path}: expected a non-negative number, found ${v}`);
    return "0";
  }
  return v;
}

const PI_FORM_RE = /^(?:0|-?(?:[1-9]\d*\*)?pi(?:\/[1-9]\d*)?)$/;

function angle(p: Problems, v: Json | undefined, path: string): LedgerAngle {
  const o = object(p, v, path, ["value", "pi"]);
  if (o === null) return { value: "0", pi: null };
  const value = decimal(p, field(o, "value"), at(path, "value"), false);
  const piV = field(o, "pi");
  let pi: string | null = null;
  if (piV !== null) {
    if (typeof piV !== "string" || !PI_FORM_RE.test(piV)) p.push(`${at(path, "pi")}: expected null or an exact form like "3*pi/8", found ${describe(piV)}`);
    else pi = piV;
  }
  return { value, pi };
}

const ROW_KEYS = ["location", "gate", "angle", "epsilon", "error", "tCount", "method", "instances", "conditional", "inLoop"] as const;

function ledgerRow(p: Problems, v: Json | undefined, path: string): LedgerRow | null {
  const o = object(p, v, path, ROW_KEYS);
  if (o === null) return null;
  const row: LedgerRow = {
    location: text(p, field(o, "location"), at(path, "location"), true),
    gate: text(p, field(o, "gate"), at(path, "gate"), true),
    angle: angle(p, field(o, "angle"), at(path, "angle")),
    epsilon: decimal(p, field(o, "epsilon"), at(path, "epsilon"), true),
    error: decimal(p, field(o, "error"), at(path, "error"), true),
    tCount: count(p, field(o, "tCount"), at(path, "tCount")),
    method: text(p, field(o, "method"), at(path, "method"), true),
    instances: count(p, field(o, "instances"), at(path, "instances")),
    conditional: flag(p, field(o, "conditional"), at(path, "conditional")),
    inLoop: flag(p, field(o, "inLoop"), at(path, "inLoop")),
  };
  if (typeof field(o, "instances") === "number" && row.instances === 0) p.push(`${at(path, "instances")}: a row has at least one instance`);
  if (row.inLoop && !row.conditional) p.push(`${path}: a row inside a while body (inLoop) is also conditional`);
  return row;
}

function array(p: Problems, v: Json | undefined, path: string): Json[] {
  if (!Array.isArray(v)) {
    p.push(`${path}: expected an array, found ${describe(v)}`);
    return [];
  }
  return v;
}

function qubitRow(p: Problems, v: Json | undefined, path: string, index: number): QubitRow | null {
  const o = object(p, v, path, ["qubit", "label", "tCount", "tDepth"]);
  if (o === null) return null;
  const q: QubitRow = {
    qubit: count(p, field(o, "qubit"), at(path, "qubit")),
    label: text(p, field(o, "label"), at(path, "label"), true),
    tCount: count(p, field(o, "tCount"), at(path, "tCount")),
    tDepth: count(p, field(o, "tDepth"), at(path, "tDepth")),
  };
  if (typeof field(o, "qubit") === "number" && q.qubit !== index) p.push(`${at(path, "qubit")}: expected ${index} (rows are in qubit order), found ${q.qubit}`);
  return q;
}

function record<T>(p: Problems, v: Json | undefined, path: string, item: (x: Json, path: string) => T): Record<string, T> {
  const out = Object.create(null) as Record<string, T>;
  if (!isObject(v)) {
    p.push(`${path}: expected an object, found ${describe(v)}`);
    return out;
  }
  for (const k of Object.keys(v)) out[k] = item(v[k], `${path}[${JSON.stringify(k)}]`);
  return out;
}

function optionValue(p: Problems, v: Json, path: string): OptionValue {
  if (v === null || typeof v === "string" || typeof v === "boolean" || typeof v === "number") return v;
  p.push(`${path}: expected a string, number, boolean or null, found ${describe(v)}`);
  return null;
}

const REPORT_KEYS = [
  "schemaVersion", "tool", "options", "budget", "errorBound", "boundPerIteration", "qubits", "gates", "depth", "tCount", "tDepth",
  "cxCount", "cliffordCount", "measurements", "resets", "conditionalOps", "remainingRotations", "rotations", "ledger", "perQubit", "gateCounts",
] as const;

function rotations(p: Problems, v: Json | undefined, path: string): RotationCounts {
  const o = object(p, v, path, ["total", "exact", "approximated", "distinct", "cached"]);
  if (o === null) return { total: 0, exact: 0, approximated: 0, distinct: 0, cached: 0 };
  const r: RotationCounts = {
    total: count(p, field(o, "total"), at(path, "total")),
    exact: count(p, field(o, "exact"), at(path, "exact")),
    approximated: count(p, field(o, "approximated"), at(path, "approximated")),
    distinct: count(p, field(o, "distinct"), at(path, "distinct")),
    cached: count(p, field(o, "cached"), at(path, "cached")),
  };
  if (r.total !== r.exact + r.approximated) p.push(`${path}.total: ${r.total} is not exact + approximated = ${r.exact + r.approximated}`);
  return r;
}

/** Cross-checks that hold for every report this program writes. */
function consistency(p: Problems, r: Report): void {
  if (r.perQubit.length !== r.qubits) p.push(`perQubit: ${r.perQubit.length} rows for ${r.qubits} qubits`);
  const tSum = r.perQubit.reduce((s, q) => s + q.tCount, 0);
  if (tSum !== r.tCount) p.push(`perQubit: T-counts add up to ${tSum}, but tCount is ${r.tCount}`);
  const tMax = r.perQubit.reduce((s, q) => Math.max(s, q.tDepth), 0);
  if (r.qubits > 0 && tMax !== r.tDepth) p.push(`perQubit: largest T-depth is ${tMax}, but tDepth is ${r.tDepth}`);
  if (r.tDepth > r.depth) p.push(`tDepth ${r.tDepth} exceeds depth ${r.depth}`);
  const gSum = Object.values(r.gateCounts).reduce((s, n) => s + n, 0);
  if (gSum !== r.gates) p.push(`gateCounts: counts add up to ${gSum}, but gates is ${r.gates}`);
}

function fail(file: string, messages: readonly string[], hint?: string, line = 0, col = 0): never {
  const shown = messages.slice(0, MAX_PROBLEMS);
  const diags: Diagnostic[] = shown.map((message) => ({ severity: "error", file, line, col, message, ...(hint ? { hint } : {}) }));
  if (messages.length > shown.length) {
    diags.push({ severity: "error", file, line, col, message: `... and ${messages.length - shown.length} more problems` });
  }
  throw new DiagnosticError(diags);
}

const NOT_A_REPORT_HINT = "give a JSON report written by `tledger lower`";

/**
 * Parses and validates a report written by `toJson`. Throws a DiagnosticError naming `file`
 * and, for each problem, the JSON path it concerns (e.g. `ledger[2].error: ...`); a JSON syntax
 * error carries its line and column. A report of another schema version is refused before its
 * shape is looked at.
 */
export function readReport(textIn: string, file: string): Report {
  let raw: Json;
  try {
    raw = JSON.parse(textIn) as Json;
  } catch (e) {
    // Our own scanner gives the position and wording (engines differ in both).
    let where: JsonSyntaxError | null = null;
    try {
      where = findJsonSyntaxError(textIn);
    } catch {
      where = null; // nesting deep enough to exhaust the stack: fall back to the engine's words
    }
    if (where !== null) fail(file, [`not valid JSON at line ${where.line}, column ${where.col}: ${where.message}`], NOT_A_REPORT_HINT, where.line, where.col);
    fail(file, [`not valid JSON: ${e instanceof Error ? e.message : String(e)}`], NOT_A_REPORT_HINT);
  }
  if (!isObject(raw)) fail(file, [`not a tledger report: expected a JSON object at the top, found ${describe(raw)}`], NOT_A_REPORT_HINT);
  const version = field(raw, "schemaVersion");
  if (version === undefined) fail(file, ["not a tledger report: no schemaVersion"], NOT_A_REPORT_HINT);
  if (version !== SCHEMA_VERSION) {
    fail(file, [`unsupported report schemaVersion ${JSON.stringify(version)}: this tledger reads version ${SCHEMA_VERSION}`], "write the report again with this version of tledger");
  }

  const p: Problems = [];
  const o = object(p, raw, "report", REPORT_KEYS) as JsonObject;
  const toolO = object(p, field(o, "tool"), "tool", ["name", "version"]);
  let version2 = "";
  if (toolO !== null) {
    if (field(toolO, "name") !== "tledger") p.push(`tool.name: expected "tledger", found ${describe(field(toolO, "name"))}`);
    version2 = text(p, field(toolO, "version"), "tool.version", true);
  }
  const report: Report = {
    schemaVersion: SCHEMA_VERSION,
    tool: { name: "tledger", version: version2 },
    options: record(p, field(o, "options"), "options", (x, path) => optionValue(p, x, path)),
    budget: decimal(p, field(o, "budget"), "budget", true),
    errorBound: decimal(p, field(o, "errorBound"), "errorBound", true),
    boundPerIteration: flag(p, field(o, "boundPerIteration"), "boundPerIteration"),
    qubits: count(p, field(o, "qubits"), "qubits"),
    gates: count(p, field(o, "gates"), "gates"),
    depth: count(p, field(o, "depth"), "depth"),
    tCount: count(p, field(o, "tCount"), "tCount"),
    tDepth: count(p, field(o, "tDepth"), "tDepth"),
    cxCount: count(p, field(o, "cxCount"), "cxCount"),
    cliffordCount: count(p, field(o, "cliffordCount"), "cliffordCount"),
    measurements: count(p, field(o, "measurements"), "measurements"),
    resets: count(p, field(o, "resets"), "resets"),
    conditionalOps: count(p, field(o, "conditionalOps"), "conditionalOps"),
    remainingRotations: count(p, field(o, "remainingRotations"), "remainingRotations"),
    rotations: rotations(p, field(o, "rotations"), "rotations"),
    ledger: array(p, field(o, "ledger"), "ledger")
      .map((v, i) => ledgerRow(p, v, `ledger[${i}]`))
      .filter((r): r is LedgerRow => r !== null),
    perQubit: array(p, field(o, "perQubit"), "perQubit")
      .map((v, i) => qubitRow(p, v, `perQubit[${i}]`, i))
      .filter((r): r is QubitRow => r !== null),
    gateCounts: record(p, field(o, "gateCounts"), "gateCounts", (x, path) => count(p, x, path)),
  };
  if (p.length === 0) consistency(p, report);
  if (p.length > 0) fail(file, p, "the report was edited or damaged; write it again with `tledger lower`");
  return report;
}
