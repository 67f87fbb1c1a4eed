// Pairing the ledger rows of two reports: which row of the new report is which row of the old one, and what changed in it.
//
// The pairing rule. A row is keyed by its source location (`file:line:col`), except that when each
// ledger names exactly one file and the two files differ (the same program saved under another
// name), locations are compared by `line:col` alone. Rows are then paired in five stages; each stage
// only looks at rows left unpaired by the stages before it, walks the old rows in ledger order and
// takes the first unpaired new row (in ledger order) that qualifies:
//   1. same location, every field equal (an unchanged row);
//   2. same location, same gate and same angle (the row's cost or share changed);
//   3. another location, same gate and same angle (the statement moved, e.g. lines inserted above it);
//   4. same location, same gate (the angle changed);
//   5. same location, anything (the gate changed).
// Rows still unpaired exist on one side only. Angles are equal when both exact pi forms are equal,
// or, failing that, when the decimal values are equal exactly; decimals (shares, errors) compare exactly.
import type { LedgerRow } from "../report/types.js";
import { exactSub, exactText, parseExact, sameDecimal } from "./exact.js";

/** The fields of a ledger row a pair can differ in. */
export type RowField = "location" | "gate" | "angle" | "epsilon" | "error" | "tCount" | "method" | "instances" | "conditional" | "inLoop";

/** Two rows taken to be the same rotation of the program. */
export interface RowPair {
  readonly a: LedgerRow;
  readonly b: LedgerRow;
  /** b.tCount - a.tCount (T gates per instance). */
  readonly tCountChange: number;
  /** b.error - a.error, exact, canonical decimal text. */
  readonly errorChange: string;
  /** The fields that differ, in the order of `RowField`; "location" only when the row moved. */
  readonly fields: readonly RowField[];
}

export interface LedgerDiff {
  /** Locations were compared by line and column only (each side has one, different, file name). */
  readonly ignoredFileNames: boolean;
  /** Pairs whose T-count, error or instance count changed (what the rotation costs), in the new ledger's order. */
  readonly changed: readonly RowPair[];
  /** Pairs with the same cost but some other difference (moved, share, method, angle, gate, flags), in the new ledger's order. */
  readonly otherwiseChanged: readonly RowPair[];
  /** Rows of the old report with no partner, in its ledger order. */
  readonly onlyA: readonly LedgerRow[];
  /** Rows of the new report with no partner, in its ledger order. */
  readonly onlyB: readonly LedgerRow[];
  /** Pairs identical in every field. */
  readonly unchanged: number;
}

const LOCATION_RE = /^(.*):(\d+):(\d+)$/;

/** The file part of a `file:line:col` location (the whole text when it has no line and column). */
function fileOf(location: string): string {
  const m = LOCATION_RE.exec(location);
  return m === null ? location : m[1];
}

/** `line:col` of a location (the whole text when it has no line and column). */
function lineColOf(location: string): string {
  const m = LOCATION_RE.exec(location);
  return m === null ? location : `${m[2]}:${m[3]}`;
}

function sameAngle(a: LedgerRow, b: LedgerRow): boolean {
  if (a.angle.pi !== null && b.angle.pi !== null) return a.angle.pi === b.angle.pi;
  return sameDecimal(a.angle.value, b.angle.value);
}

/** The fields in which two rows differ (location compared through `where`). */
function differences(a: LedgerRow, b: LedgerRow, where: (r: LedgerRow) => string): RowField[] {
  const out: RowField[] = [];
  if (where(a) !== where(b)) out.push("location");
  if (a.gate !== b.gate) out.push("gate");
  if (!sameAngle(a, b) || a.angle.pi !== b.angle.pi) out.push("angle");
  if (!sameDecimal(a.epsilon, b.epsilon)) out.push("epsilon");
  if (!sameDecimal(a.error, b.error)) out.push("error");
  if (a.tCount !== b.tCount) out.push("tCount");
  if (a.method !== b.method) out.push("method");
  if (a.instances !== b.instances) out.push("instances");
  if (a.conditional !== b.conditional) out.push("conditional");
  if (a.inLoop !== b.inLoop) out.push("inLoop");
  return out;
}

/** True when the pair's cost differs: T gates or error per instance, or the number of instances. */
function costChanged(fields: readonly RowField[]): boolean {
  return fields.includes("tCount") || fields.includes("error") || fields.includes("instances");
}

/** True when every ledger row names a single file and the two files differ. */
function singleDifferentFiles(a: readonly LedgerRow[], b: readonly LedgerRow[]): boolean {
  const fa = new Set(a.map((r) => fileOf(r.location)));
  const fb = new Set(b.map((r) => fileOf(r.location)));
  if (fa.size !== 1 || fb.size !== 1) return false;
  return [...fa][0] !== [...fb][0];
}

/** Gate and exact angle value: rows that can be "the same rotation" share this key (pi forms agree with their values). */
function gateAngleKey(r: LedgerRow): string {
  return `${r.gate}\u0000${exactText(parseExact(r.angle.value))}`;
}

/** Row indices grouped by a key, each group in ledger order. */
function buckets(rows: readonly LedgerRow[], key: (r: LedgerRow) => string): Map<string, number[]> {
  const out = new Map<string, number[]>();
  rows.forEach((r, j) => {
    const k = key(r);
    const list = out.get(k);
    if (list) list.push(j);
    else out.set(k, [j]);
  });
  return out;
}

/** Pairs the ledger rows of two reports (rule in the module comment) and sorts the pairs into changed and unchanged. */
export function pairLedgers(a: readonly LedgerRow[], b: readonly LedgerRow[]): LedgerDiff {
  const ignoredFileNames = singleDifferentFiles(a, b);
  const where = ignoredFileNames ? (r: LedgerRow) => lineColOf(r.location) : (r: LedgerRow) => r.location;
  const partnerOfA = new Array<number>(a.length).fill(-1);
  const takenB = new Array<boolean>(b.length).fill(false);

  // Candidate partners, in ledger order: by location, and by gate and angle value (for moved rows).
  const byLocation = buckets(b, where);
  const byGateAngle = buckets(b, gateAngleKey);
  const stage = (sameLocation: boolean, fits: (x: LedgerRow, y: LedgerRow) => boolean): void => {
    for (let i = 0; i < a.length; i++) {
      if (partnerOfA[i] >= 0) continue;
      const wa = where(a[i]);
      const candidates = (sameLocation ? byLocation.get(wa) : byGateAngle.get(gateAngleKey(a[i]))) ?? [];
      for (const j of candidates) {
        if (takenB[j] || (where(b[j]) === wa) !== sameLocation || !fits(a[i], b[j])) continue;
        partnerOfA[i] = j;
        takenB[j] = true;
        break;
      }
    }
  };
  stage(true, (x, y) => differences(x, y, where).length === 0);
  stage(true, (x, y) => x.gate === y.gate && sameAngle(x, y));
  stage(false, (x, y) => x.gate === y.gate && sameAngle(x, y));
  stage(true, (x, y) => x.gate === y.gate);
  stage(true, () => true);

  const pairs: { pair: RowPair; order: number }[] = [];
  let unchanged = 0;
  for (let i = 0; i < a.length; i++) {
    const j = partnerOfA[i];
    if (j < 0) continue;
    const fields = differences(a[i], b[j], where);
    if (fields.length === 0) {
      unchanged += 1;
      continue;
    }
    const errorChange = exactSub(parseExact(b[j].error), parseExact(a[i].error));
    pairs.push({ pair: { a: a[i], b: b[j], tCountChange: b[j].tCount - a[i].tCount, errorChange: exactText(errorChange), fields }, order: j });
  }
  pairs.sort((x, y) => x.order - y.order);
  const changed = pairs.filter((p) => costChanged(p.pair.fields)).map((p) => p.pair);
  const otherwiseChanged = pairs.filter((p) => !costChanged(p.pair.fields)).map((p) => p.pair);
  return {
    ignoredFileNames,
    changed,
    otherwiseChanged,
    onlyA: a.filter((_, i) => partnerOfA[i] < 0),
    onlyB: b.filter((_, j) => !takenB[j]),
    unchanged,
  };
}
