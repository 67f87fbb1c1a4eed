// Test helpers: mathjs as an independent matrix reference, gates embedded in small registers, and a seeded generator.
import { seededRng } from "../../src/numeric/prng.js";
import { create, all, type Complex, type Matrix } from "mathjs";
import { controlledMatrix, complexMatrixMul, gateInfo, identityMatrix, zeroMatrix, type CMatrix } from "../../src/ir/gates.js";
import type { Stmt } from "../../src/ir/circuit.js";

export const math = create(all, {});

/** A mathjs matrix (complex entries) as a CMatrix. */
export function fromMath(m: Matrix): CMatrix {
  const size = m.size();
  const dim = size[0]!;
  if (size.length !== 2 || size[1] !== dim) throw new Error("fromMath: not square");
  const out = zeroMatrix(dim);
  for (let i = 0; i < dim; i++)
    for (let j = 0; j < dim; j++) {
      const v = m.get([i, j]) as number | Complex;
      const c = typeof v === "number" ? math.complex(v, 0) : v;
      out.re[i * dim + j] = c.re;
      out.im[i * dim + j] = c.im;
    }
  return out;
}

/** A CMatrix as a mathjs complex matrix. */
export function toMath(a: CMatrix): Matrix {
  const rows: Complex[][] = [];
  for (let i = 0; i < a.dim; i++) {
    const row: Complex[] = [];
    for (let j = 0; j < a.dim; j++) row.push(math.complex(a.re[i * a.dim + j]!, a.im[i * a.dim + j]!));
    rows.push(row);
  }
  return math.matrix(rows);
}

/** max |a_ij - b_ij|. */
export function maxDiff(a: CMatrix, b: CMatrix): number {
  if (a.dim !== b.dim) return Infinity;
  let m = 0;
  for (let i = 0; i < a.re.length; i++) m = Math.max(m, Math.hypot(a.re[i]! - b.re[i]!, a.im[i]! - b.im[i]!));
  return m;
}

/** min over phases of max |a_ij - e^{i phi} b_ij| (phase taken from b's largest entry; exact enough for unitaries). */
export function diffUpToPhase(a: CMatrix, b: CMatrix): number {
  if (a.dim !== b.dim) return Infinity;
  let k = 0;
  let best = -1;
  for (let i = 0; i < b.re.length; i++) {
    const m = Math.hypot(b.re[i]!, b.im[i]!);
    if (m > best) {
      best = m;
      k = i;
    }
  }
  // phase = a_k / b_k normalised
  const br = b.re[k]!;
  const bi = b.im[k]!;
  const ar = a.re[k]!;
  const ai = a.im[k]!;
  let pr = ar * br + ai * bi;
  let pi = ai * br - ar * bi;
  const n = Math.hypot(pr, pi);
  if (n === 0) return Infinity;
  pr /= n;
  pi /= n;
  let m = 0;
  for (let i = 0; i < a.re.length; i++) {
    const r = pr * b.re[i]! - pi * b.im[i]!;
    const im = pr * b.im[i]! + pi * b.re[i]!;
    m = Math.max(m, Math.hypot(a.re[i]! - r, a.im[i]! - im));
  }
  return m;
}

/**
 * The 2^n matrix of gate matrix `m` acting on register qubits `qubits` (the first listed is the gate's most
 * significant bit); register qubit 0 is the most significant bit of the register's index.
 */
export function embed(m: CMatrix, qubits: readonly number[], n: number): CMatrix {
  const k = qubits.length;
  if (m.dim !== 1 << k) throw new Error(`embed: matrix of dim ${m.dim} on ${k} qubits`);
  const dim = 1 << n;
  const out = zeroMatrix(dim);
  const bit = (q: number): number => 1 << (n - 1 - q);
  let mask = 0;
  for (const q of qubits) mask |= bit(q);
  const sub = (i: number): number => {
    let s = 0;
    for (const q of qubits) s = (s << 1) | ((i & bit(q)) !== 0 ? 1 : 0);
    return s;
  };
  const spread = (s: number): number => {
    let v = 0;
    qubits.forEach((q, j) => {
      if ((s >> (k - 1 - j)) & 1) v |= bit(q);
    });
    return v;
  };
  for (let col = 0; col < dim; col++) {
    const sc = sub(col);
    const rest = col & ~mask;
    for (let sr = 0; sr < m.dim; sr++) {
      const re = m.re[sr * m.dim + sc]!;
      const im = m.im[sr * m.dim + sc]!;
      if (re === 0 && im === 0) continue;
      const row = rest | spread(sr);
      out.re[row * dim + col] = re;
      out.im[row * dim + col] = im;
    }
  }
  return out;
}

/** The unitary of a straight-line list of gate ops on n qubits (non-gate statements are not allowed). */
export function unitaryOf(body: readonly Stmt[], n: number): CMatrix {
  const u = identityMatrix(1 << n);
  for (const s of body) {
    if (s.kind !== "gate") throw new Error(`unitaryOf: unexpected ${s.kind}`);
    const info = gateInfo(s.name);
    if (!info) throw new Error(`unitaryOf: unknown gate ${s.name}`);
    const g = controlledMatrix(info.matrix(s.params.map((p) => Number(p.value))), s.ctrl);
    if (s.qubits.length === 0) {
      const scaled = complexMatrixMul(scalarTimesIdentity(g, 1 << n), u);
      u.re.set(scaled.re);
      u.im.set(scaled.im);
    } else applyInPlace(u, g, s.qubits, n);
  }
  return u;
}

/** u := (g on `qubits`) * u, column by column (the same convention as embed, without building the big matrix). */
export function applyInPlace(u: CMatrix, g: CMatrix, qubits: readonly number[], n: number): void {
  const k = qubits.length;
  const dim = 1 << n;
  const bits = qubits.map((q) => 1 << (n - 1 - q));
  let mask = 0;
  for (const b of bits) mask |= b;
  const offs: number[] = [];
  for (let s = 0; s < 1 << k; s++) {
    let v = 0;
    for (let j = 0; j < k; j++) if ((s >> (k - 1 - j)) & 1) v |= bits[j]!;
    offs.push(v);
  }
  const gd = g.dim;
  const vr = new Float64Array(gd);
  const vi = new Float64Array(gd);
  for (let base = 0; base < dim; base++) {
    if (base & mask) continue;
    for (let col = 0; col < dim; col++) {
      for (let s = 0; s < gd; s++) {
        vr[s] = u.re[(base | offs[s]!) * dim + col]!;
        vi[s] = u.im[(base | offs[s]!) * dim + col]!;
      }
      for (let r = 0; r < gd; r++) {
        let ar = 0;
        let ai = 0;
        for (let s = 0; s < gd; s++) {
          const gr = g.re[r * gd + s]!;
          const gi = g.im[r * gd + s]!;
          if (gr === 0 && gi === 0) continue;
          ar += gr * vr[s]! - gi * vi[s]!;
          ai += gr * vi[s]! + gi * vr[s]!;
        }
        u.re[(base | offs[r]!) * dim + col] = ar;
        u.im[(base | offs[r]!) * dim + col] = ai;
      }
    }
  }
}

function scalarTimesIdentity(g: CMatrix, dim: number): CMatrix {
  const out = zeroMatrix(dim);
  for (let i = 0; i < dim; i++) {
    out.re[i * dim + i] = g.re[0]!;
    out.im[i * dim + i] = g.im[0]!;
  }
  return out;
}

/** Seeded floats in [0, 1) from the project's one generator (numeric/prng.ts). */
export function seeded(seed: number): () => number {
  const g = seededRng(seed);
  return () => g.nextFloat();
}
