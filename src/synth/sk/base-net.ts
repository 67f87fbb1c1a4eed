// The base net: every single-qubit Clifford+T operator up to a T-count, generated as Matsumoto–Amano normal forms, as quaternions.
import type { Gate1, Word } from "../exact/word.js";
import { GATE_QUAT, QUAT_ONE, qmul, qnormalize, wordQuat, type Quat } from "./quat.js";

/** Largest T-count the compact point encoding holds. */
export const MAX_NET_TCOUNT = 15;

/**
 * The 24 single-qubit Cliffords up to phase, each with a shortest word over {h, s, sdg, x, y, z}.
 * Found by breadth-first search over their exact Bloch-sphere matrices (signed 3x3 permutation
 * matrices with integer entries), so no floating-point comparison decides which are equal.
 */
export const CLIFFORD_WORDS: readonly Word[] = cliffordWords();

function cliffordWords(): Word[] {
  // Bloch matrices of the generators, row-major 3x3, acting on (x, y, z) as R v.
  const gens: readonly (readonly [Gate1, readonly number[]])[] = [
    ["h", [0, 0, 1, 0, -1, 0, 1, 0, 0]],
    ["s", [0, -1, 0, 1, 0, 0, 0, 0, 1]],
    ["sdg", [0, 1, 0, -1, 0, 0, 0, 0, 1]],
    ["x", [1, 0, 0, 0, -1, 0, 0, 0, -1]],
    ["y", [-1, 0, 0, 0, 1, 0, 0, 0, -1]],
    ["z", [-1, 0, 0, 0, -1, 0, 0, 0, 1]],
  ];
  const mul = (p: readonly number[], q: readonly number[]): number[] => {
    const r: number[] = new Array<number>(9).fill(0);
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        let s = 0;
        for (let k = 0; k < 3; k++) s += p[3 * i + k]! * q[3 * k + j]!;
        r[3 * i + j] = s;
      }
    return r;
  };
  const start = [1, 0, 0, 0, 1, 0, 0, 0, 1];
  const seen = new Map<string, Word>([[start.join(","), []]]);
  let frontier: { m: number[]; w: Word }[] = [{ m: start, w: [] }];
  while (frontier.length > 0) {
    const next: { m: number[]; w: Word }[] = [];
    for (const { m, w } of frontier)
      for (const [g, gm] of gens) {
        const m2 = mul(gm, m); // appending g in circuit order multiplies on the left
        const key = m2.join(",");
        if (!seen.has(key)) {
          const w2 = [...w, g];
          seen.set(key, w2);
          next.push({ m: m2, w: w2 });
        }
      }
    frontier = next;
  }
  return [...seen.values()];
}

/**
 * A net of Clifford+T operators modulo phase. Point i has quaternion
 * `quats[4i .. 4i+3]`, its sign chosen so that the first nonzero coordinate is positive, and a
 * compact normal-form code `codes[i]` that `netWord` expands.
 */
export interface BaseNet {
  readonly maxTCount: number;
  readonly size: number;
  readonly quats: Float64Array;
  readonly codes: Uint32Array;
}

// Code layout: bits 0-4 Clifford index, bit 5 leading T, bits 6-9 syllable count j,
// bits 10.. syllable kinds (bit 10+i set: syllable i, counted from the left, is SHT, else HT).
const enc = (cliff: number, lead: number, j: number, kinds: number): number =>
  (cliff | (lead << 5) | (j << 6) | (kinds << 10)) >>> 0;

/**
 * All normal forms (T | empty)(HT | SHT)^j C, read as operator products (the leftmost factor acts
 * last), with T-count lead + j <= maxTCount. By Matsumoto–Amano these are pairwise distinct
 * operators (up to phase), and they are all the operators of T-count <= maxTCount.
 */
export function buildBaseNet(maxTCount: number): BaseNet {
  if (!Number.isInteger(maxTCount) || maxTCount < 0 || maxTCount > MAX_NET_TCOUNT)
    throw new RangeError(`buildBaseNet: T-count must be an integer in 0..${MAX_NET_TCOUNT}`);
  const cliffQ = CLIFFORD_WORDS.map((w) => wordQuat(w));
  const size = 24 * (maxTCount === 0 ? 1 : 3 * 2 ** maxTCount - 2);
  const quats = new Float64Array(4 * size);
  const codes = new Uint32Array(size);
  const qT = GATE_QUAT.t;
  const qHT = qmul(GATE_QUAT.h, qT);
  const qSHT = qmul(GATE_QUAT.s, qHT);
  let n = 0;
  const emit = (prefix: Quat, lead: number, j: number, kinds: number): void => {
    for (let c = 0; c < 24; c++) {
      const q = qmul(prefix, cliffQ[c]!);
      const sgn = q[0] < 0 || (q[0] === 0 && (q[1] < 0 || (q[1] === 0 && (q[2] < 0 || (q[2] === 0 && q[3] < 0))))) ? -1 : 1;
      quats[4 * n] = sgn * q[0];
      quats[4 * n + 1] = sgn * q[1];
      quats[4 * n + 2] = sgn * q[2];
      quats[4 * n + 3] = sgn * q[3];
      codes[n] = enc(c, lead, j, kinds);
      n++;
    }
  };
  // Depth-first over prefixes T^lead S_1 ... S_j; every prefix is a normal form once a Clifford follows.
  const walk = (prefix: Quat, lead: number, j: number, kinds: number): void => {
    emit(prefix, lead, j, kinds);
    if (lead + j === maxTCount) return;
    walk(qnormalize(qmul(prefix, qHT)), lead, j + 1, kinds);
    walk(qnormalize(qmul(prefix, qSHT)), lead, j + 1, kinds | (1 << j));
  };
  walk(QUAT_ONE, 0, 0, 0);
  if (maxTCount > 0) walk(qT, 1, 0, 0);
  if (n !== size) throw new Error(`buildBaseNet: generated ${n} points, expected ${size}`);
  return { maxTCount, size, quats, codes };
}

/** The word (circuit order) of net point i: the Clifford first, then the syllables right to left, then the leading T. */
export function netWord(net: BaseNet, i: number): Gate1[] {
  const code = net.codes[i]!;
  const cliff = code & 31;
  const lead = (code >>> 5) & 1;
  const j = (code >>> 6) & 15;
  const kinds = code >>> 10;
  const out: Gate1[] = [...CLIFFORD_WORDS[cliff]!];
  for (let k = j - 1; k >= 0; k--) {
    out.push("t", "h");
    if ((kinds >>> k) & 1) out.push("s");
  }
  if (lead) out.push("t");
  return out;
}

/** The quaternion of net point i. */
export function netQuat(net: BaseNet, i: number): Quat {
  const q = net.quats;
  return [q[4 * i]!, q[4 * i + 1]!, q[4 * i + 2]!, q[4 * i + 3]!];
}
