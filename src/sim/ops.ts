// The circuit as a flat list of matrix applications for the simulators, or a diagnostic naming the statement that is not unitary.
//
// Qubit numbering used by every simulator here: circuit qubit q is bit (n - 1 - q) of the basis-state
// index, so qubit 0 is the most significant bit. This matches the gate table's rule "the first listed
// qubit is the most significant bit of the row index": a circuit holding one gate on qubits 0..k-1 in
// that order has exactly the gate's matrix as its unitary.
import type { Circuit, GateOp, SourceLoc, Stmt } from "../ir/circuit.js";
import { angleToNumber } from "../ir/angle-ops.js";
import { adjointMatrix, gateInfo, type CMatrix } from "../ir/gates.js";
import { DiagnosticError, type Diagnostic } from "../frontend/diagnostics.js";

/** One matrix application: `matrix` (2^k x 2^k) on `targets` (first = most significant), under controls. */
export interface SimOp {
  readonly matrix: CMatrix;
  readonly targets: readonly number[];
  readonly controls: readonly number[];
  /** One entry per control: true for a control on |1>, false for one on |0>. */
  readonly ctrlOn: readonly boolean[];
}

export interface OpsOptions {
  /** Multiply runs of uncontrolled one-qubit gates on the same qubit into one matrix, and gather global phases (default true). */
  readonly fuse?: boolean;
}

function diag(stmt: { readonly loc: SourceLoc }, message: string, hint?: string): Diagnostic {
  return { severity: "error", file: stmt.loc.file, line: stmt.loc.line, col: stmt.loc.col, message, ...(hint !== undefined ? { hint } : {}) };
}

const NON_UNITARY_HINT = "a unitary simulation needs a circuit of gates only: remove measurements, resets and classical control flow, or check the unitary part alone";

/** The first statement (in program order) that keeps the circuit from being one unitary, as a diagnostic; null if none. */
export function nonUnitaryStatement(c: Circuit): Diagnostic | null {
  const walk = (body: readonly Stmt[]): Diagnostic | null => {
    for (const s of body) {
      switch (s.kind) {
        case "measure":
          return diag(s, `not a unitary circuit: measurement of qubit ${s.qubit}`, NON_UNITARY_HINT);
        case "reset":
          return diag(s, `not a unitary circuit: reset of qubit ${s.qubit}`, NON_UNITARY_HINT);
        case "if":
          return diag(s, "not a unitary circuit: an `if` statement on classical bits", NON_UNITARY_HINT);
        case "while":
          return diag(s, "not a unitary circuit: a `while` loop", NON_UNITARY_HINT);
        case "box": {
          const d = walk(s.body);
          if (d) return d;
          break;
        }
        default:
          break;
      }
    }
    return null;
  };
  return walk(c.body);
}

/** The simulation op of one gate statement, checked against the gate table and the circuit's qubit count. */
export function gateOpToSimOp(g: GateOp, numQubits: number): SimOp {
  const info = gateInfo(g.name);
  if (!info) throw new DiagnosticError([diag(g, `cannot simulate unknown gate '${g.name}'`)]);
  if (g.params.length !== info.numParams) {
    throw new DiagnosticError([diag(g, `gate '${g.name}' takes ${info.numParams} parameter(s), got ${g.params.length}`)]);
  }
  const nc = g.ctrl.length;
  if (g.qubits.length !== nc + info.numQubits) {
    throw new DiagnosticError([diag(g, `gate '${g.name}' with ${nc} control(s) needs ${nc + info.numQubits} qubit(s), got ${g.qubits.length}`)]);
  }
  const seen = new Set<number>();
  for (const q of g.qubits) {
    if (!Number.isInteger(q) || q < 0 || q >= numQubits) {
      throw new DiagnosticError([diag(g, `gate '${g.name}' uses qubit ${q}, outside 0..${numQubits - 1}`)]);
    }
    if (seen.has(q)) throw new DiagnosticError([diag(g, `gate '${g.name}' uses qubit ${q} twice`)]);
    seen.add(q);
  }
  const matrix = info.matrix(g.params.map(angleToNumber));
  return { matrix, targets: g.qubits.slice(nc), controls: g.qubits.slice(0, nc), ctrlOn: g.ctrl.slice() };
}

/** b * a for 2x2 matrices (a applied first). */
function mul2(b: CMatrix, a: CMatrix): CMatrix {
  const re = new Float64Array(4);
  const im = new Float64Array(4);
  for (let i = 0; i < 2; i++) {
    for (let j = 0; j < 2; j++) {
      let sr = 0;
      let si = 0;
      for (let k = 0; k < 2; k++) {
        const xr = b.re[i * 2 + k];
        const xi = b.im[i * 2 + k];
        const yr = a.re[k * 2 + j];
        const yi = a.im[k * 2 + j];
        sr += xr * yr - xi * yi;
        si += xr * yi + xi * yr;
      }
      re[i * 2 + j] = sr;
      im[i * 2 + j] = si;
    }
  }
  return { dim: 2, re, im };
}

/**
 * The circuit's gates in application order as simulation ops. Barriers, delays, pragmas and annotations are
 * skipped; box bodies are entered. Throws a DiagnosticError at the first measurement, reset, `if` or `while`
 * (not a unitary) and at any gate the gate table does not know or that is malformed.
 */
export function circuitOps(c: Circuit, opts: OpsOptions = {}): SimOp[] {
  const bad = nonUnitaryStatement(c);
  if (bad) throw new DiagnosticError([bad]);
  const fuse = opts.fuse ?? true;
  const out: SimOp[] = [];
  const pending: (CMatrix | null)[] = new Array<CMatrix | null>(c.numQubits).fill(null);
  let phase = 0;
  let anyPhase = false;
  const flush = (q: number): void => {
    const m = pending[q];
    if (m) {
      out.push({ matrix: m, targets: [q], controls: [], ctrlOn: [] });
      pending[q] = null;
    }
  };
  const walk = (body: readonly Stmt[]): void => {
    for (const s of body) {
      if (s.kind === "box") walk(s.body);
      if (s.kind !== "gate") continue;
      const op = gateOpToSimOp(s, c.numQubits);
      if (!fuse) {
        out.push(op);
        continue;
      }
      if (op.controls.length === 0 && op.targets.length === 0) {
        // An uncontrolled gphase: a scalar, commutes with everything.
        phase += Math.atan2(op.matrix.im[0], op.matrix.re[0]);
        anyPhase = true;
        continue;
      }
      if (op.controls.length === 0 && op.targets.length === 1) {
        const q = op.targets[0];
        const prev = pending[q];
        pending[q] = prev ? mul2(op.matrix, prev) : op.matrix;
        continue;
      }
      for (const q of op.controls) flush(q);
      for (const q of op.targets) flush(q);
      out.push(op);
    }
  };
  walk(c.body);
  for (let q = 0; q < c.numQubits; q++) flush(q);
  if (anyPhase) {
    out.push({ matrix: { dim: 1, re: Float64Array.of(Math.cos(phase)), im: Float64Array.of(Math.sin(phase)) }, targets: [], controls: [], ctrlOn: [] });
  }
  return out;
}

/** The ops of the inverse circuit: reversed order, each matrix replaced by its conjugate transpose. */
export function inverseOps(ops: readonly SimOp[]): SimOp[] {
  const out: SimOp[] = [];
  for (let i = ops.length - 1; i >= 0; i--) {
    const op = ops[i];
    out.push({ matrix: adjointMatrix(op.matrix), targets: op.targets, controls: op.controls, ctrlOn: op.ctrlOn });
  }
  return out;
}
