// Test references for the SK engine: gate words as mathjs complex matrices, and exact Bloch-sphere matrices over Z[sqrt2].
import { create, all, type Complex, type Matrix } from "mathjs";
import type { Gate1, Word } from "../../../src/synth/exact/word.js";
import type { Mat2, Quat } from "../../../src/synth/sk/quat.js";

export const math = create(all);

const c = (re: number, im = 0): Complex => math.complex(re, im);
const r2 = 1 / Math.sqrt(2);

/** The gate matrices of the OpenQASM 3 standard library (stdgates.inc, from memory), built with mathjs. */
export const GATE_MATRIX: Readonly<Record<Gate1, Matrix>> = {
  h: math.matrix([[c(r2), c(r2)], [c(r2), c(-r2)]]),
  s: math.matrix([[c(1), c(0)], [c(0), c(0, 1)]]),
  sdg: math.matrix([[c(1), c(0)], [c(0), c(0, -1)]]),
  t: math.matrix([[c(1), c(0)], [c(0), math.exp(c(0, Math.PI / 4))]]),
  tdg: math.matrix([[c(1), c(0)], [c(0), math.exp(c(0, -Math.PI / 4))]]),
  x: math.matrix([[c(0), c(1)], [c(1), c(0)]]),
  y: math.matrix([[c(0), c(0, -1)], [c(0, 1), c(0)]]),
  z: math.matrix([[c(1), c(0)], [c(0), c(-1)]]),
};

/** The matrix of a circuit-order word with mathjs: the last gate is the leftmost factor. */
export function mathjsWordMatrix(word: Word): Matrix {
  let m = math.identity(2) as Matrix;
  for (const g of word) m = math.multiply(GATE_MATRIX[g], m) as Matrix;
  return m;
}

/** OpenQASM 3's U(a, b, c) times a global phase e^{i g}, with mathjs. */
export function mathjsU(a: number, b: number, cc: number, g = 0): Matrix {
  const ph = math.exp(c(0, g));
  const e = (x: number): Complex => math.exp(c(0, x)) as Complex;
  const m = math.matrix([
    [c(Math.cos(a / 2)), math.multiply(math.unaryMinus(e(cc)), Math.sin(a / 2)) as Complex],
    [math.multiply(e(b), Math.sin(a / 2)) as Complex, math.multiply(e(b + cc), Math.cos(a / 2)) as Complex],
  ]);
  return math.multiply(ph, m) as Matrix;
}

/** d(U, V) = sqrt(2 - |tr(U^dag V)|), with mathjs. */
export function mathjsDist(u: Matrix, v: Matrix): number {
  const tr = math.trace(math.multiply(math.ctranspose(u), v) as Matrix) as unknown as Complex;
  return Math.sqrt(Math.max(0, 2 - (math.abs(tr) as unknown as number)));
}

/** A mathjs 2x2 matrix as the engine's Mat2. */
export function toMat2(m: Matrix): Mat2 {
  const e = (i: number, j: number): Complex => {
    const x = m.get([i, j]) as Complex | number;
    return typeof x === "number" ? c(x) : x;
  };
  const es = [e(0, 0), e(0, 1), e(1, 0), e(1, 1)];
  return { re: [es[0]!.re, es[1]!.re, es[2]!.re, es[3]!.re], im: [es[0]!.im, es[1]!.im, es[2]!.im, es[3]!.im] };
}

/** The matrix a I - i (b X + c Y + d Z) of a quaternion, assembled with mathjs from the Pauli matrices. */
export function mathjsQuatMatrix(q: Quat): Matrix {
  const mi = c(0, -1);
  let m = math.multiply(q[0], math.identity(2)) as Matrix;
  m = math.add(m, math.multiply(math.multiply(mi, q[1]), GATE_MATRIX.x)) as Matrix;
  m = math.add(m, math.multiply(math.multiply(mi, q[2]), GATE_MATRIX.y)) as Matrix;
  m = math.add(m, math.multiply(math.multiply(mi, q[3]), GATE_MATRIX.z)) as Matrix;
  return m;
}

// ---- exact Bloch matrices: R = M / sqrt2^e with M a 3x3 matrix over Z[sqrt2], e least ----

/** a + b sqrt2. */
type Zr2 = readonly [bigint, bigint];
/** Numerators (row-major, 9 entries) and the exponent e of R = M / sqrt2^e. */
export interface ExactBloch {
  readonly m: readonly Zr2[];
  readonly e: number;
}

const zmul = (x: Zr2, y: Zr2): Zr2 => [x[0] * y[0] + 2n * x[1] * y[1], x[0] * y[1] + x[1] * y[0]];
const zadd = (x: Zr2, y: Zr2): Zr2 => [x[0] + y[0], x[1] + y[1]];

function bloch(rows: number[][], e: number): ExactBloch {
  return { m: rows.flat().map((v) => [BigInt(v), 0n] as Zr2), e };
}

/**
 * Bloch matrices R_ij = tr(sigma_i U sigma_j U^dag)/2 of the gates (common practice, no source):
 * H swaps x and z and negates y; S turns x to y; T turns x to (x + y)/sqrt2; Paulis flip two axes.
 */
const GATE_BLOCH: Readonly<Record<Gate1, ExactBloch>> = {
  h: bloch([[0, 0, 1], [0, -1, 0], [1, 0, 0]], 0),
  s: bloch([[0, -1, 0], [1, 0, 0], [0, 0, 1]], 0),
  sdg: bloch([[0, 1, 0], [-1, 0, 0], [0, 0, 1]], 0),
  x: bloch([[1, 0, 0], [0, -1, 0], [0, 0, -1]], 0),
  y: bloch([[-1, 0, 0], [0, 1, 0], [0, 0, -1]], 0),
  z: bloch([[-1, 0, 0], [0, -1, 0], [0, 0, 1]], 0),
  // sqrt2 * R_T = [[1, -1, 0], [1, 1, 0], [0, 0, sqrt2]]
  t: { m: [[1n, 0n], [-1n, 0n], [0n, 0n], [1n, 0n], [1n, 0n], [0n, 0n], [0n, 0n], [0n, 0n], [0n, 1n]], e: 1 },
  tdg: { m: [[1n, 0n], [1n, 0n], [0n, 0n], [-1n, 0n], [1n, 0n], [0n, 0n], [0n, 0n], [0n, 0n], [0n, 1n]], e: 1 },
};

/** p q, reduced to the least exponent (divide every numerator by sqrt2 while all are divisible). */
export function blochMul(p: ExactBloch, q: ExactBloch): ExactBloch {
  let m: Zr2[] = [];
  for (let i = 0; i < 3; i++)
    for (let j = 0; j < 3; j++) {
      let s: Zr2 = [0n, 0n];
      for (let k = 0; k < 3; k++) s = zadd(s, zmul(p.m[3 * i + k]!, q.m[3 * k + j]!));
      m.push(s);
    }
  let e = p.e + q.e;
  while (e > 0 && m.every((x) => x[0] % 2n === 0n)) {
    m = m.map((x) => [x[1], x[0] / 2n] as Zr2); // (a + b sqrt2) / sqrt2 = b + (a/2) sqrt2
    e--;
  }
  return { m, e };
}

export const BLOCH_ONE: ExactBloch = bloch([[1, 0, 0], [0, 1, 0], [0, 0, 1]], 0);

/** The exact Bloch matrix of a circuit-order word: it determines the operator up to phase. */
export function wordBloch(word: Word): ExactBloch {
  let r = BLOCH_ONE;
  for (const g of word) r = blochMul(GATE_BLOCH[g], r);
  return r;
}

/** A canonical string for an exact Bloch matrix (equal strings iff equal operators up to phase). */
export function blochKey(r: ExactBloch): string {
  return `${r.e}:${r.m.map((x) => `${x[0]},${x[1]}`).join(";")}`;
}

/** Operators of T-count <= n, up to phase, by breadth-first search over exact Bloch matrices. */
export function blochSetsByTCount(n: number): Set<string>[] {
  // The Clifford group modulo phase: closure of {h, s} from the identity.
  const cliff = new Map<string, ExactBloch>([[blochKey(BLOCH_ONE), BLOCH_ONE]]);
  let frontier = [BLOCH_ONE];
  while (frontier.length > 0) {
    const next: ExactBloch[] = [];
    for (const r of frontier)
      for (const g of ["h", "s"] as const) {
        const r2_ = blochMul(GATE_BLOCH[g], r);
        const k = blochKey(r2_);
        if (!cliff.has(k)) {
          cliff.set(k, r2_);
          next.push(r2_);
        }
      }
    frontier = next;
  }
  // A word with j T gates is C_j T C_{j-1} ... T C_0, so level j = level 0 together with Cliff * T * level (j-1).
  const cliffT = [...cliff.values()].map((cl) => blochMul(cl, GATE_BLOCH.t));
  const levels: Map<string, ExactBloch>[] = [cliff];
  for (let j = 1; j <= n; j++) {
    const cur = new Map(cliff);
    for (const u of levels[j - 1]!.values())
      for (const ct of cliffT) {
        const r = blochMul(ct, u);
        cur.set(blochKey(r), r);
      }
    levels.push(cur);
  }
  return levels.map((l) => new Set(l.keys()));
}
