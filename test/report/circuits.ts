// Small builders for hand-made circuits in the report tests (test helper, not a test file).
import type { Angle } from "../../src/ir/angle.js";
import type { BarrierOp, Circuit, GateOp, IfBlock, MeasureOp, QubitReg, ResetOp, SourceLoc, Stmt, WhileBlock, BoxBlock } from "../../src/ir/circuit.js";
import { anglePi, angleDecimal, rational } from "../../src/ir/angle-ops.js";

export const LOC: SourceLoc = { file: "t.qasm", line: 1, col: 1 };

export function gate(name: string, qubits: readonly number[], params: readonly Angle[] = [], ctrl: readonly boolean[] = []): GateOp {
  return { kind: "gate", name, qubits, params, ctrl, loc: LOC };
}

/** (num/den) * pi, exact. */
export function pi(num: number, den = 1): Angle {
  return anglePi(rational(BigInt(num), BigInt(den)));
}

/** A decimal literal angle (not known as a pi multiple). */
export function lit(text: string): Angle {
  return angleDecimal(text);
}

export function measure(q: number): MeasureOp {
  return { kind: "measure", qubit: q, bit: null, loc: LOC };
}

export function reset(q: number): ResetOp {
  return { kind: "reset", qubit: q, loc: LOC };
}

export function barrier(qubits: readonly number[]): BarrierOp {
  return { kind: "barrier", qubits, loc: LOC };
}

export function ifBlock(then: readonly Stmt[], els: readonly Stmt[] = []): IfBlock {
  return { kind: "if", cond: { k: "bit", bit: { reg: "c", index: 0 } }, then, else: els, loc: LOC };
}

export function whileBlock(body: readonly Stmt[]): WhileBlock {
  return { kind: "while", cond: { k: "bit", bit: { reg: "c", index: 0 } }, body, loc: LOC };
}

export function boxBlock(body: readonly Stmt[]): BoxBlock {
  return { kind: "box", duration: null, body, loc: LOC };
}

export function circuit(numQubits: number, body: readonly Stmt[], qubitRegs: readonly QubitReg[] = [{ name: "q", start: 0, size: numQubits }]): Circuit {
  return { numQubits, qubitRegs, bits: [{ name: "c", size: 1, scalar: false }], body };
}
