// The circuit IR: numbered qubits, gate operations with exact parameters and source locations, blocks for kept control flow.
import type { Angle } from "./angle.js";

/** Where a statement came from: 1-based line and column in `file` (as given to the front end). */
export interface SourceLoc {
  readonly file: string;
  readonly line: number;
  readonly col: number;
}

/**
 * One gate application. `name` is a canonical gate of the gate table (src/ir/gates.ts).
 * `qubits` lists control qubits first, then the gate's own qubits; `ctrl` has one entry per
 * leading control qubit: true for `ctrl @`, false for `negctrl @`. `ctrl` is empty for an
 * uncontrolled gate. `inv @` and `pow(k) @` are resolved by the front end (they never reach the IR).
 */
export interface GateOp {
  readonly kind: "gate";
  readonly name: string;
  readonly params: readonly Angle[];
  readonly qubits: readonly number[];
  readonly ctrl: readonly boolean[];
  readonly loc: SourceLoc;
}

/** A classical bit: register name and index within it. */
export interface BitRef {
  readonly reg: string;
  readonly index: number;
}

export interface MeasureOp {
  readonly kind: "measure";
  readonly qubit: number;
  readonly bit: BitRef | null;
  readonly loc: SourceLoc;
}

export interface ResetOp {
  readonly kind: "reset";
  readonly qubit: number;
  readonly loc: SourceLoc;
}

export interface BarrierOp {
  readonly kind: "barrier";
  readonly qubits: readonly number[];
  readonly loc: SourceLoc;
}

export interface DelayOp {
  readonly kind: "delay";
  /** The duration as written, e.g. "100ns". */
  readonly duration: string;
  readonly qubits: readonly number[];
  readonly loc: SourceLoc;
}

/** Pragmas and annotations pass through as text (without the leading `pragma`/`#pragma` or `@`). */
export interface PragmaOp {
  readonly kind: "pragma" | "annotation";
  readonly text: string;
  readonly loc: SourceLoc;
}

/** A classical condition, kept symbolically over classical registers. */
export type CondExpr =
  | { readonly k: "bit"; readonly bit: BitRef }
  | { readonly k: "reg"; readonly reg: string }
  | { readonly k: "int"; readonly value: bigint }
  | { readonly k: "bool"; readonly value: boolean }
  | { readonly k: "unary"; readonly op: "!" | "~" | "-"; readonly e: CondExpr }
  | { readonly k: "binary"; readonly op: string; readonly l: CondExpr; readonly r: CondExpr };

export interface IfBlock {
  readonly kind: "if";
  readonly cond: CondExpr;
  readonly then: readonly Stmt[];
  readonly else: readonly Stmt[];
  readonly loc: SourceLoc;
}

export interface WhileBlock {
  readonly kind: "while";
  readonly cond: CondExpr;
  readonly body: readonly Stmt[];
  readonly loc: SourceLoc;
}

export interface BoxBlock {
  readonly kind: "box";
  /** Duration designator as written, or null. */
  readonly duration: string | null;
  readonly body: readonly Stmt[];
  readonly loc: SourceLoc;
}

export type Stmt = GateOp | MeasureOp | ResetOp | BarrierOp | DelayOp | PragmaOp | IfBlock | WhileBlock | BoxBlock;

/** A classical register (a scalar `bit c;` has size 1 and scalar = true). */
export interface ClassicalReg {
  readonly name: string;
  readonly size: number;
  readonly scalar: boolean;
}

/** A named range of the flat qubit numbering, for reports (the source's register names). */
export interface QubitReg {
  readonly name: string;
  readonly start: number;
  readonly size: number;
}

export interface Circuit {
  /** Number of qubits; qubits are numbered 0 .. numQubits - 1. */
  readonly numQubits: number;
  readonly qubitRegs: readonly QubitReg[];
  readonly bits: readonly ClassicalReg[];
  readonly body: readonly Stmt[];
}
