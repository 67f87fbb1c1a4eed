// Pass: merge z-rotations on each qubit before synthesis: adjacent rz add, diagonal gates fold in, the control of a CX lets them through, zero vanishes.
import type { Angle } from "../ir/angle.js";
import type { Circuit, GateOp, SourceLoc, Stmt } from "../ir/circuit.js";
import { angleAdd, anglePi, rational } from "../ir/angle-ops.js";

/** Diagonal Clifford+T gates as multiples of pi/4 of a z-rotation (equal up to global phase). */
const DIAGONAL_QUARTERS: ReadonlyMap<string, bigint> = new Map([
  ["t", 1n],
  ["s", 2n],
  ["z", 4n],
  ["sdg", -2n],
  ["tdg", -1n],
]);

interface Pending {
  angle: Angle;
  readonly loc: SourceLoc;
  /** True once a continuous (not exact pi/4-multiple) rotation has joined. */
  continuous: boolean;
}

/**
 * True when rz(a) is the identity up to global phase: an exact even multiple of pi, or a decimal
 * value that is exactly zero (two rotations that cancel digit for digit).
 */
export function isZeroAngle(a: Angle): boolean {
  if (a.pi) return a.pi.den === 1n && a.pi.num % 2n === 0n;
  return /^-?0(\.0*)?(e[+-]?\d+)?$/i.test(a.value);
}

/**
 * Merge rotations about z. Requires the decomposed basis (h s sdg x y z cx t tdg rz, no ctrl lists).
 * Diagonal Clifford+T gates fold into a pending continuous rotation (they would otherwise cost
 * their own T gates next to a synthesized one); global phase is dropped, which is sound because
 * no gate is controlled any more at this stage and classical control cannot expose a phase.
 * A pending rotation is emitted where it must stop: before a non-commuting gate on its qubit,
 * before any block or non-gate statement touching it, or at the end of the enclosing body.
 */
export function mergeRotations(circuit: Circuit): Circuit {
  return { ...circuit, body: mergeBody(circuit.body) };
}

function mergeBody(body: readonly Stmt[]): Stmt[] {
  const out: Stmt[] = [];
  const pending = new Map<number, Pending>();

  const flush = (q: number): void => {
    const p = pending.get(q);
    if (!p) return;
    pending.delete(q);
    if (!isZeroAngle(p.angle)) out.push(rzOp(q, p.angle, p.loc));
  };
  const flushAll = (): void => {
    for (const q of [...pending.keys()].sort((a, b) => a - b)) flush(q);
  };

  for (const s of body) {
    if (s.kind !== "gate") {
      if (s.kind === "if" || s.kind === "while" || s.kind === "box") {
        flushAll();
        if (s.kind === "if") out.push({ ...s, then: mergeBody(s.then), else: mergeBody(s.else) });
        else out.push({ ...s, body: mergeBody(s.body) });
      } else {
        if (s.kind === "measure" || s.kind === "reset") flush(s.qubit);
        else if (s.kind === "barrier" || s.kind === "delay") {
          if (s.qubits.length === 0) flushAll();
          else for (const q of s.qubits) flush(q);
        }
        out.push(s);
      }
      continue;
    }
    if (s.ctrl.length > 0) {
      for (const q of s.qubits) flush(q);
      out.push(s);
      continue;
    }
    const q0 = s.qubits[0];
    if (s.name === "rz" && q0 !== undefined) {
      const p = pending.get(q0);
      const a = s.params[0]!;
      const continuous = !isQuarterPi(a);
      if (p) {
        p.angle = angleAdd(p.angle, a);
        p.continuous ||= continuous;
      } else pending.set(q0, { angle: a, loc: s.loc, continuous });
      continue;
    }
    const quarters = DIAGONAL_QUARTERS.get(s.name);
    if (quarters !== undefined && q0 !== undefined) {
      const p = pending.get(q0);
      if (p && p.continuous) {
        p.angle = angleAdd(p.angle, anglePi(rational(quarters, 4n)));
        continue;
      }
      out.push(s);
      continue;
    }
    if (s.name === "cx") {
      // rz on the control commutes with CX; the target's must be emitted first.
      flush(s.qubits[1]!);
      out.push(s);
      continue;
    }
    for (const q of s.qubits) flush(q);
    out.push(s);
  }
  flushAll();
  return out;
}

function isQuarterPi(a: Angle): boolean {
  return a.pi !== null && 4n % a.pi.den === 0n;
}

export function rzOp(q: number, angle: Angle, loc: SourceLoc): GateOp {
  return { kind: "gate", name: "rz", params: [angle], qubits: [q], ctrl: [], loc };
}
