// Circuit metrics: gate counts, T-count, and depth and T-depth from one as-soon-as-possible schedule.
import type { Circuit, GateOp, QubitReg, Stmt } from "../ir/circuit.js";
import { gateKey, isCliffordGate, isCxGate, isOpenRotation, isTGate } from "./gate-classes.js";

/** T figures of one qubit. */
export interface QubitFigures {
  readonly qubit: number;
  /** Register label, `reg[i]` from the circuit's qubit registers, or `$i` when no register covers it. */
  readonly label: string;
  /** T gates acting on this qubit. */
  readonly tCount: number;
  /** The qubit's T-level at the end of the schedule (see `Metrics.tDepth`). */
  readonly tDepth: number;
}

/**
 * Figures of a circuit. Definitions (all exact, integer):
 *
 * - Counting: every gate, measurement and reset is counted once per appearance in the text of
 *   the circuit; a gate inside an if/else branch or a while body counts once, whatever runs.
 * - `tCount`: uncontrolled `t` and `tdg` gates (one per target qubit; `ctrl @ t` is not a T gate).
 * - `cxCount`: CNOTs (`cx`, `CX`, `ctrl @ x`); `cliffordCount`: gates known exactly to be
 *   Clifford (see `isCliffordGate`), including the CNOTs. Every gate is also in `gateCounts`.
 * - `rotations`: gates with an angle not known exactly to be a multiple of pi/4 (see `isOpenRotation`).
 * - `depth`: each qubit keeps a clock. A gate (of any arity), a measurement or a reset starts at
 *   the largest clock of its qubits and sets all of them to start + 1. A barrier sets the clocks
 *   of its qubits (all qubits when it names none) to their maximum without adding a layer; a
 *   delay does the same; pragmas and annotations do nothing. `depth` is the largest clock.
 * - `tDepth`: each qubit keeps a T-level. A T gate sets its qubit to 1 + its level; any other
 *   gate, measurement, reset, barrier or delay sets all its qubits to their largest level. `tDepth`
 *   is the largest level: the most T gates on any dependency chain. It never exceeds `depth`.
 * - Blocks (if, while, box) act as barriers on every qubit they touch: on entry the clocks and
 *   levels of those qubits are synchronised to their maximum; the body (each branch of an `if`,
 *   each from the entry state) is scheduled once; on exit those qubits take the largest clock and
 *   level reached by any branch. A while body is scheduled once: depth per iteration, not total.
 * - `conditionalOps`: gates, measurements and resets inside an if/else branch or a while body
 *   (at any nesting); a `box` alone is not conditional.
 */
export interface Metrics {
  readonly qubits: number;
  /** All gate operations (not measurements, resets, barriers, delays, pragmas). */
  readonly gates: number;
  readonly measurements: number;
  readonly resets: number;
  readonly tCount: number;
  readonly tDepth: number;
  readonly depth: number;
  readonly cxCount: number;
  readonly cliffordCount: number;
  readonly rotations: number;
  readonly conditionalOps: number;
  /** Gate counts by `gateKey`, keys in ascending UTF-16 code unit order. */
  readonly gateCounts: Readonly<Record<string, number>>;
  /** One entry per qubit, in qubit order. */
  readonly perQubit: readonly QubitFigures[];
}

/** Mutable state of one metrics walk; the per-qubit clocks live in typed arrays. */
interface Walk {
  readonly n: number;
  readonly clock: Int32Array;
  readonly tLevel: Int32Array;
  readonly tPerQubit: Int32Array;
  /** Scratch marks for collecting the qubits of a block: mark[q] === stamp means "seen". */
  readonly mark: Int32Array;
  stamp: number;
  /** Gate counts by key; a boxed counter so each gate costs one map lookup. */
  readonly counts: Map<string, { n: number }>;
  gates: number;
  measurements: number;
  resets: number;
  tCount: number;
  cxCount: number;
  cliffordCount: number;
  rotations: number;
  conditionalOps: number;
}

function checkQubit(w: Walk, q: number): void {
  if (!Number.isInteger(q) || q < 0 || q >= w.n) {
    throw new RangeError(`metrics: qubit index ${q} outside 0..${w.n - 1}`);
  }
}

/** Sets the clocks and T-levels of `qs` to their maxima (a barrier). */
function sync(w: Walk, qs: readonly number[]): void {
  let c = 0;
  let t = 0;
  for (const q of qs) {
    checkQubit(w, q);
    if (w.clock[q] > c) c = w.clock[q];
    if (w.tLevel[q] > t) t = w.tLevel[q];
  }
  for (const q of qs) {
    w.clock[q] = c;
    w.tLevel[q] = t;
  }
}

/** Schedules one operation occupying a layer on `qs`; `isT` advances the T-level. */
function layer(w: Walk, qs: readonly number[], isT: boolean): void {
  if (qs.length === 1) {
    const q = qs[0];
    checkQubit(w, q);
    w.clock[q] += 1;
    if (isT) {
      w.tLevel[q] += 1;
      w.tPerQubit[q] += 1;
    }
    return;
  }
  let c = 0;
  let t = 0;
  for (const q of qs) {
    checkQubit(w, q);
    if (w.clock[q] > c) c = w.clock[q];
    if (w.tLevel[q] > t) t = w.tLevel[q];
  }
  c += 1;
  if (isT) t += 1;
  for (const q of qs) {
    w.clock[q] = c;
    w.tLevel[q] = t;
    if (isT) w.tPerQubit[q] += 1;
  }
}

/** Classes of a gate with no controls and no parameters: a function of its name alone, cached. */
interface PlainClass {
  readonly t: boolean;
  readonly cx: boolean;
  readonly clifford: boolean;
}
const plainClasses = new Map<string, PlainClass>();

function plainClass(op: GateOp): PlainClass {
  let c = plainClasses.get(op.name);
  if (!c) {
    c = { t: isTGate(op), cx: isCxGate(op), clifford: isCliffordGate(op) };
    plainClasses.set(op.name, c);
  }
  return c;
}

function countGate(w: Walk, op: GateOp, conditional: boolean): void {
  const key = gateKey(op);
  const box = w.counts.get(key);
  if (box) box.n += 1;
  else w.counts.set(key, { n: 1 });
  w.gates += 1;
  if (conditional) w.conditionalOps += 1;
  // Lowered circuits are tens of millions of plain one-qubit gates: classify those by name once.
  const plain = op.ctrl.length === 0 && op.params.length === 0 ? plainClass(op) : null;
  const t = plain ? plain.t : isTGate(op);
  if (t) w.tCount += op.qubits.length;
  else if (plain) {
    if (plain.cx) w.cxCount += 1;
    if (plain.clifford) w.cliffordCount += 1;
  } else {
    if (isCxGate(op)) w.cxCount += 1;
    if (isCliffordGate(op)) w.cliffordCount += 1;
    else if (op.params.length > 0 && isOpenRotation(op)) w.rotations += 1;
  }
  // A T gate on several qubits (an unexpanded broadcast) is one T gate per qubit, one layer.
  if (op.qubits.length > 0) layer(w, op.qubits, t);
}

/** All qubits in `qs`; an empty list stands for every qubit (OpenQASM's bare `barrier;`). */
function allIfEmpty(w: Walk, qs: readonly number[]): readonly number[] {
  if (qs.length > 0) return qs;
  const all: number[] = new Array<number>(w.n);
  for (let q = 0; q < w.n; q++) all[q] = q;
  return all;
}

/** Collects, without repetition and in first-seen order, the qubits the statements touch. */
function collectQubits(w: Walk, body: readonly Stmt[], out: number[]): void {
  const add = (q: number): void => {
    checkQubit(w, q);
    if (w.mark[q] !== w.stamp) {
      w.mark[q] = w.stamp;
      out.push(q);
    }
  };
  for (const s of body) {
    switch (s.kind) {
      case "gate":
        for (const q of s.qubits) add(q);
        break;
      case "measure":
      case "reset":
        add(s.qubit);
        break;
      case "barrier":
      case "delay":
        for (const q of allIfEmpty(w, s.qubits)) add(q);
        break;
      case "if":
        collectQubits(w, s.then, out);
        collectQubits(w, s.else, out);
        break;
      case "while":
      case "box":
        collectQubits(w, s.body, out);
        break;
      case "pragma":
      case "annotation":
        break;
    }
  }
}

function blockQubits(w: Walk, bodies: readonly (readonly Stmt[])[]): number[] {
  w.stamp += 1;
  const out: number[] = [];
  for (const b of bodies) collectQubits(w, b, out);
  return out;
}

/** Schedules a block whose alternative bodies start from one synchronised state (see `Metrics`). */
function block(w: Walk, bodies: readonly (readonly Stmt[])[], conditional: boolean): void {
  const qs = blockQubits(w, bodies);
  sync(w, qs);
  if (bodies.length === 1) {
    walk(w, bodies[0], conditional);
    sync(w, qs);
    return;
  }
  // After the entry sync every qubit of the block shares one clock and one T-level.
  const startClock = qs.length > 0 ? w.clock[qs[0]] : 0;
  const startT = qs.length > 0 ? w.tLevel[qs[0]] : 0;
  let endClock = startClock;
  let endT = startT;
  for (const b of bodies) {
    for (const q of qs) {
      w.clock[q] = startClock;
      w.tLevel[q] = startT;
    }
    walk(w, b, conditional);
    for (const q of qs) {
      if (w.clock[q] > endClock) endClock = w.clock[q];
      if (w.tLevel[q] > endT) endT = w.tLevel[q];
    }
  }
  for (const q of qs) {
    w.clock[q] = endClock;
    w.tLevel[q] = endT;
  }
}

function walk(w: Walk, body: readonly Stmt[], conditional: boolean): void {
  for (const s of body) {
    switch (s.kind) {
      case "gate":
        countGate(w, s, conditional);
        break;
      case "measure":
        w.measurements += 1;
        if (conditional) w.conditionalOps += 1;
        layer(w, [s.qubit], false);
        break;
      case "reset":
        w.resets += 1;
        if (conditional) w.conditionalOps += 1;
        layer(w, [s.qubit], false);
        break;
      case "barrier":
      case "delay":
        sync(w, allIfEmpty(w, s.qubits));
        break;
      case "if":
        block(w, s.else.length > 0 ? [s.then, s.else] : [s.then], true);
        break;
      case "while":
        block(w, [s.body], true);
        break;
      case "box":
        block(w, [s.body], conditional);
        break;
      case "pragma":
      case "annotation":
        break;
    }
  }
}

/** `reg[i]` for the first register (in declaration order) holding qubit q, else `$q`. */
function qubitLabels(n: number, regs: readonly QubitReg[]): string[] {
  const labels = new Array<string>(n);
  for (let i = regs.length - 1; i >= 0; i--) {
    const r = regs[i];
    for (let k = 0; k < r.size; k++) {
      const q = r.start + k;
      if (q >= 0 && q < n) labels[q] = `${r.name}[${k}]`;
    }
  }
  for (let q = 0; q < n; q++) if (labels[q] === undefined) labels[q] = `$${q}`;
  return labels;
}

/** Ascending UTF-16 code unit order (locale-independent, hence deterministic). */
export function byCodeUnits(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The metrics of a circuit (definitions in `Metrics`). Linear in the number of operations. */
export function computeMetrics(c: Circuit): Metrics {
  const n = c.numQubits;
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`metrics: bad qubit count ${n}`);
  const w: Walk = {
    n,
    clock: new Int32Array(n),
    tLevel: new Int32Array(n),
    tPerQubit: new Int32Array(n),
    mark: new Int32Array(n),
    stamp: 0,
    counts: new Map(),
    gates: 0,
    measurements: 0,
    resets: 0,
    tCount: 0,
    cxCount: 0,
    cliffordCount: 0,
    rotations: 0,
    conditionalOps: 0,
  };
  walk(w, c.body, false);

  let depth = 0;
  let tDepth = 0;
  const labels = qubitLabels(n, c.qubitRegs);
  const perQubit: QubitFigures[] = new Array<QubitFigures>(n);
  for (let q = 0; q < n; q++) {
    if (w.clock[q] > depth) depth = w.clock[q];
    if (w.tLevel[q] > tDepth) tDepth = w.tLevel[q];
    perQubit[q] = { qubit: q, label: labels[q], tCount: w.tPerQubit[q], tDepth: w.tLevel[q] };
  }
  // A prototype-free record: a gate named `__proto__` is an ordinary key.
  const gateCounts = Object.create(null) as Record<string, number>;
  for (const k of [...w.counts.keys()].sort(byCodeUnits)) gateCounts[k] = w.counts.get(k)!.n;

  return {
    qubits: n,
    gates: w.gates,
    measurements: w.measurements,
    resets: w.resets,
    tCount: w.tCount,
    tDepth,
    depth,
    cxCount: w.cxCount,
    cliffordCount: w.cliffordCount,
    rotations: w.rotations,
    conditionalOps: w.conditionalOps,
    gateCounts,
    perQubit,
  };
}
