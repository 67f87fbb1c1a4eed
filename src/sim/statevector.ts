// State-vector simulation: apply gate matrices (with controls) to amplitude buffers, one column or a whole batch of columns at once.
//
// Convention (see ops.ts): circuit qubit q is bit (n - 1 - q) of the basis index (qubit 0 most significant).
// An amplitude buffer holds `batch` columns side by side: amplitude i of column c is at index i*batch + c.
// batch = 1 is a state vector; batch = 2^n with the identity as start is the unitary (unitary.ts), since
// applying a gate to every column of a matrix is multiplying it from the left.
import type { Circuit } from "../ir/circuit.js";
import type { CMatrix } from "../ir/gates.js";
import { DiagnosticError } from "../frontend/diagnostics.js";
import { circuitOps, type OpsOptions, type SimOp } from "./ops.js";

/** Largest circuit the state-vector simulator accepts (2^22 amplitudes: 64 MiB). */
export const MAX_STATE_QUBITS = 22;

/** Complex amplitudes as two parallel Float64Arrays. */
export interface Amplitudes {
  readonly re: Float64Array;
  readonly im: Float64Array;
}

/** The basis state |0...0> on n qubits. */
export function zeroState(numQubits: number): Amplitudes {
  const re = new Float64Array(2 ** numQubits);
  re[0] = 1;
  return { re, im: new Float64Array(2 ** numQubits) };
}

type Shape = "diagonal" | "antidiagonal" | "dense";

/**
 * The structure of a gate matrix, read from its exact zero entries. This only picks a faster loop that
 * skips multiplications by exact zeros (and by exact ones): the result is the same numbers the dense
 * product gives, so no float comparison decides anything about the answer.
 */
function shapeOf(m: CMatrix): Shape {
  const d = m.dim;
  let diagonal = true;
  for (let i = 0; i < d && diagonal; i++) {
    for (let j = 0; j < d; j++) {
      if (i !== j && (m.re[i * d + j] !== 0 || m.im[i * d + j] !== 0)) {
        diagonal = false;
        break;
      }
    }
  }
  if (diagonal) return "diagonal";
  if (d === 2 && m.re[0] === 0 && m.im[0] === 0 && m.re[3] === 0 && m.im[3] === 0) return "antidiagonal";
  return "dense";
}

const isZero = (m: CMatrix, k: number): boolean => m.re[k] === 0 && m.im[k] === 0;
const isOne = (m: CMatrix, k: number): boolean => m.re[k] === 1 && m.im[k] === 0;

/**
 * Rewrites an op whose matrix is exactly "identity unless target t is |v>" (no mixing of t's values,
 * the identity on the other value) as a smaller matrix under one more control, e.g. cx as x under a
 * control. Again only a choice of loop: the entries that drop out are exact 0s and 1s.
 */
export function peelControls(op: SimOp): SimOp {
  let cur = op;
  for (;;) {
    const m = cur.matrix;
    const k = cur.targets.length;
    const d = m.dim;
    let found: SimOp | null = null;
    for (let t = 0; t < k && !found; t++) {
      const bit = 1 << (k - 1 - t);
      for (const idle of [0, 1]) {
        let ok = true;
        for (let r = 0; r < d && ok; r++) {
          for (let c = 0; c < d; c++) {
            const br = (r & bit) !== 0 ? 1 : 0;
            const bc = (c & bit) !== 0 ? 1 : 0;
            const e = r * d + c;
            if (br !== bc) ok = isZero(m, e);
            else if (br === idle) ok = r === c ? isOne(m, e) : isZero(m, e);
            if (!ok) break;
          }
        }
        if (!ok) continue;
        // Keep the block where target t equals 1 - idle, dropping bit t from the indices.
        const dd = d >> 1;
        const re = new Float64Array(dd * dd);
        const im = new Float64Array(dd * dd);
        const expand = (x: number): number => {
          const low = x & (bit - 1);
          return ((x - low) << 1) | (idle === 0 ? bit : 0) | low;
        };
        for (let r = 0; r < dd; r++) {
          for (let c = 0; c < dd; c++) {
            re[r * dd + c] = m.re[expand(r) * d + expand(c)];
            im[r * dd + c] = m.im[expand(r) * d + expand(c)];
          }
        }
        found = {
          matrix: { dim: dd, re, im },
          targets: cur.targets.filter((_, i) => i !== t),
          controls: [...cur.controls, cur.targets[t]],
          ctrlOn: [...cur.ctrlOn, idle === 0],
        };
        break;
      }
    }
    if (!found) return cur;
    cur = found;
  }
}

/** Where one op acts: the row offsets of its 2^k matrix indices, and how to enumerate the untouched bits. */
interface Layout {
  /** offs[a]: the state-index offset of matrix index a (first target = most significant bit of a). */
  readonly offs: Int32Array;
  /** Bit positions of targets and controls, ascending. */
  readonly fixedPos: Int32Array;
  /** Control bits that must be 1. */
  readonly ctrlVal: number;
  /** Number of index blocks: 2^(n - targets - controls). */
  readonly numBases: number;
}

function layoutOf(op: SimOp, n: number): Layout {
  const k = op.targets.length;
  const size = 1 << k;
  const offs = new Int32Array(size);
  for (let a = 0; a < size; a++) {
    let off = 0;
    for (let t = 0; t < k; t++) if ((a >> (k - 1 - t)) & 1) off |= 1 << (n - 1 - op.targets[t]);
    offs[a] = off;
  }
  let ctrlVal = 0;
  const fixed: number[] = [];
  for (const q of op.targets) fixed.push(n - 1 - q);
  op.controls.forEach((q, i) => {
    fixed.push(n - 1 - q);
    if (op.ctrlOn[i]) ctrlVal |= 1 << (n - 1 - q);
  });
  fixed.sort((x, y) => x - y);
  for (let i = 0; i < fixed.length; i++) {
    if (!Number.isInteger(fixed[i]) || fixed[i] < 0 || fixed[i] >= n) throw new RangeError("applyOp: qubit out of range");
    if (i > 0 && fixed[i] === fixed[i - 1]) throw new RangeError("applyOp: a qubit appears twice");
  }
  return { offs, fixedPos: Int32Array.from(fixed), ctrlVal, numBases: 2 ** (n - fixed.length) };
}

/** The j-th index whose fixed bits are zero (a 0 inserted at each fixed position, ascending), with the control bits set. */
function deposit(j: number, fixedPos: Int32Array, ctrlVal: number): number {
  for (let f = 0; f < fixedPos.length; f++) {
    const p = fixedPos[f];
    const low = j & ((1 << p) - 1);
    j = ((j >> p) << (p + 1)) | low;
  }
  return j | ctrlVal;
}

function diagonalKernel(re: Float64Array, im: Float64Array, B: number, m: CMatrix, l: Layout): void {
  const size = m.dim;
  for (let a = 0; a < size; a++) {
    const dr = m.re[a * size + a];
    const di = m.im[a * size + a];
    if (dr === 1 && di === 0) continue;
    const off = l.offs[a];
    for (let j = 0; j < l.numBases; j++) {
      const row = (deposit(j, l.fixedPos, l.ctrlVal) + off) * B;
      const end = row + B;
      if (di === 0) {
        for (let c = row; c < end; c++) {
          re[c] *= dr;
          im[c] *= dr;
        }
      } else {
        for (let c = row; c < end; c++) {
          const xr = re[c];
          const xi = im[c];
          re[c] = dr * xr - di * xi;
          im[c] = dr * xi + di * xr;
        }
      }
    }
  }
}

function antidiagonalKernel(re: Float64Array, im: Float64Array, B: number, m: CMatrix, l: Layout): void {
  // [[0, m01], [m10, 0]]: swap the two rows with phases.
  const off1 = l.offs[1];
  const m01r = m.re[1], m01i = m.im[1], m10r = m.re[2], m10i = m.im[2];
  const plainSwap = m01r === 1 && m01i === 0 && m10r === 1 && m10i === 0;
  for (let j = 0; j < l.numBases; j++) {
    const b0 = deposit(j, l.fixedPos, l.ctrlVal);
    const r0 = b0 * B;
    const r1 = (b0 + off1) * B;
    if (plainSwap) {
      for (let c = 0; c < B; c++) {
        const ar = re[r0 + c], ai = im[r0 + c];
        re[r0 + c] = re[r1 + c];
        im[r0 + c] = im[r1 + c];
        re[r1 + c] = ar;
        im[r1 + c] = ai;
      }
    } else {
      for (let c = 0; c < B; c++) {
        const ar = re[r0 + c], ai = im[r0 + c];
        const br = re[r1 + c], bi = im[r1 + c];
        re[r0 + c] = m01r * br - m01i * bi;
        im[r0 + c] = m01r * bi + m01i * br;
        re[r1 + c] = m10r * ar - m10i * ai;
        im[r1 + c] = m10r * ai + m10i * ar;
      }
    }
  }
}

function dense1Kernel(re: Float64Array, im: Float64Array, B: number, m: CMatrix, l: Layout): void {
  const off1 = l.offs[1];
  const m00r = m.re[0], m00i = m.im[0], m01r = m.re[1], m01i = m.im[1];
  const m10r = m.re[2], m10i = m.im[2], m11r = m.re[3], m11i = m.im[3];
  for (let j = 0; j < l.numBases; j++) {
    const b0 = deposit(j, l.fixedPos, l.ctrlVal);
    const r0 = b0 * B;
    const r1 = (b0 + off1) * B;
    for (let c = 0; c < B; c++) {
      const ar = re[r0 + c], ai = im[r0 + c];
      const br = re[r1 + c], bi = im[r1 + c];
      re[r0 + c] = m00r * ar - m00i * ai + m01r * br - m01i * bi;
      im[r0 + c] = m00r * ai + m00i * ar + m01r * bi + m01i * br;
      re[r1 + c] = m10r * ar - m10i * ai + m11r * br - m11i * bi;
      im[r1 + c] = m10r * ai + m10i * ar + m11r * bi + m11i * br;
    }
  }
}

function dense2Kernel(re: Float64Array, im: Float64Array, B: number, m: CMatrix, l: Layout): void {
  // A general 4x4 matrix with all 16 entries held in locals: 4 loads and 4 stores per column.
  const [a00r, a01r, a02r, a03r, a10r, a11r, a12r, a13r, a20r, a21r, a22r, a23r, a30r, a31r, a32r, a33r] = m.re;
  const [a00i, a01i, a02i, a03i, a10i, a11i, a12i, a13i, a20i, a21i, a22i, a23i, a30i, a31i, a32i, a33i] = m.im;
  const o1 = l.offs[1], o2 = l.offs[2], o3 = l.offs[3];
  for (let j = 0; j < l.numBases; j++) {
    const b = deposit(j, l.fixedPos, l.ctrlVal);
    const r0 = b * B, r1 = (b + o1) * B, r2 = (b + o2) * B, r3 = (b + o3) * B;
    for (let c = 0; c < B; c++) {
      const x0r = re[r0 + c], x0i = im[r0 + c];
      const x1r = re[r1 + c], x1i = im[r1 + c];
      const x2r = re[r2 + c], x2i = im[r2 + c];
      const x3r = re[r3 + c], x3i = im[r3 + c];
      re[r0 + c] = a00r * x0r - a00i * x0i + a01r * x1r - a01i * x1i + a02r * x2r - a02i * x2i + a03r * x3r - a03i * x3i;
      im[r0 + c] = a00r * x0i + a00i * x0r + a01r * x1i + a01i * x1r + a02r * x2i + a02i * x2r + a03r * x3i + a03i * x3r;
      re[r1 + c] = a10r * x0r - a10i * x0i + a11r * x1r - a11i * x1i + a12r * x2r - a12i * x2i + a13r * x3r - a13i * x3i;
      im[r1 + c] = a10r * x0i + a10i * x0r + a11r * x1i + a11i * x1r + a12r * x2i + a12i * x2r + a13r * x3i + a13i * x3r;
      re[r2 + c] = a20r * x0r - a20i * x0i + a21r * x1r - a21i * x1i + a22r * x2r - a22i * x2i + a23r * x3r - a23i * x3i;
      im[r2 + c] = a20r * x0i + a20i * x0r + a21r * x1i + a21i * x1r + a22r * x2i + a22i * x2r + a23r * x3i + a23i * x3r;
      re[r3 + c] = a30r * x0r - a30i * x0i + a31r * x1r - a31i * x1i + a32r * x2r - a32i * x2i + a33r * x3r - a33i * x3i;
      im[r3 + c] = a30r * x0i + a30i * x0r + a31r * x1i + a31i * x1r + a32r * x2i + a32i * x2r + a33r * x3i + a33i * x3r;
    }
  }
}

/** Adds e * x[src..src+B) to y[dst..dst+B) (complex). */
function axpy(yr: Float64Array, yi: Float64Array, dst: number, er: number, ei: number, xr: Float64Array, xi: Float64Array, src: number, B: number): void {
  for (let c = 0; c < B; c++) {
    const a = xr[src + c];
    const b = xi[src + c];
    yr[dst + c] += er * a - ei * b;
    yi[dst + c] += er * b + ei * a;
  }
}

function denseKernel(re: Float64Array, im: Float64Array, B: number, m: CMatrix, l: Layout): void {
  // Copy the 2^k rows of one block, then row a = sum_b m[a][b] * row b (exact zeros skipped).
  const size = m.dim;
  const tr = new Float64Array(size * B);
  const ti = new Float64Array(size * B);
  const rows = new Int32Array(size);
  for (let j = 0; j < l.numBases; j++) {
    const base = deposit(j, l.fixedPos, l.ctrlVal);
    for (let a = 0; a < size; a++) {
      const r = (base + l.offs[a]) * B;
      rows[a] = r;
      for (let c = 0; c < B; c++) {
        tr[a * B + c] = re[r + c];
        ti[a * B + c] = im[r + c];
        re[r + c] = 0;
        im[r + c] = 0;
      }
    }
    for (let a = 0; a < size; a++) {
      for (let b = 0; b < size; b++) {
        const er = m.re[a * size + b];
        const ei = m.im[a * size + b];
        if (er === 0 && ei === 0) continue;
        axpy(re, im, rows[a], er, ei, tr, ti, b * B, B);
      }
    }
  }
}

/**
 * Applies one op to every column of `amp` (amplitude i of column c at index i*batch + c).
 * Controls restrict the update to indices whose control bits match; targets map the matrix's
 * row index (first target = most significant bit) onto the state's bits.
 */
export function applyOp(amp: Amplitudes, numQubits: number, batch: number, op0: SimOp): void {
  if (op0.matrix.dim !== 1 << op0.targets.length) {
    throw new RangeError(`applyOp: a ${op0.matrix.dim}x${op0.matrix.dim} matrix on ${op0.targets.length} qubit(s)`);
  }
  if (amp.re.length !== 2 ** numQubits * batch || amp.im.length !== amp.re.length) {
    throw new RangeError("applyOp: buffer size does not match the qubit count");
  }
  if (op0.controls.length !== op0.ctrlOn.length) throw new RangeError("applyOp: one ctrlOn entry per control");
  const op = peelControls(op0);
  const l = layoutOf(op, numQubits);
  const m = op.matrix;
  const shape = shapeOf(m);
  if (shape === "diagonal") diagonalKernel(amp.re, amp.im, batch, m, l);
  else if (shape === "antidiagonal") antidiagonalKernel(amp.re, amp.im, batch, m, l);
  else if (m.dim === 2) dense1Kernel(amp.re, amp.im, batch, m, l);
  else if (m.dim === 4) dense2Kernel(amp.re, amp.im, batch, m, l);
  else denseKernel(amp.re, amp.im, batch, m, l);
}

/** Applies a list of ops in order. */
export function applyOps(amp: Amplitudes, numQubits: number, batch: number, ops: readonly SimOp[]): void {
  for (const op of ops) applyOp(amp, numQubits, batch, op);
}

/** The diagnostic for a circuit too large for a simulator (no source position: it concerns the whole circuit). */
export function simulationSizeError(what: string, n: number, max: number): DiagnosticError {
  return new DiagnosticError([
    {
      severity: "error",
      file: "",
      line: 0,
      col: 0,
      message: `${what}: ${n} qubits is more than the ${max} this simulator handles`,
      hint: "check a smaller instance of the circuit",
    },
  ]);
}

/**
 * The state the circuit makes from `initial` (default |0...0>), for up to MAX_STATE_QUBITS qubits.
 * Throws a DiagnosticError for a circuit that is not unitary (measurement, reset, if, while) or too large.
 */
export function simulateState(c: Circuit, initial?: Amplitudes, opts: OpsOptions = {}): Amplitudes {
  if (c.numQubits > MAX_STATE_QUBITS) throw simulationSizeError("state-vector simulation", c.numQubits, MAX_STATE_QUBITS);
  const ops = circuitOps(c, opts);
  const amp = initial ? { re: Float64Array.from(initial.re), im: Float64Array.from(initial.im) } : zeroState(c.numQubits);
  if (amp.re.length !== 2 ** c.numQubits || amp.im.length !== amp.re.length) {
    throw new RangeError(`simulateState: initial state has ${amp.re.length} amplitudes, expected ${2 ** c.numQubits}`);
  }
  applyOps(amp, c.numQubits, 1, ops);
  return amp;
}
