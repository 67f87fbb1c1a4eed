// Exact synthesis: any unitary over D[ω] to its Matsumoto–Amano normal form (T | ε)(HT | SHT)* C, which has the least T-count.
//
// Method (Giles & Selinger's reading of the normal form through the Bloch sphere, derived and checked here):
// the Bloch (SO(3)) matrix R(U), R_ij = ½ tr(σ_i U σ_j U†), has entries in Z[1/√2]; write R = M / √2^e with
// M over Z[√2] and e least. Then e is the T-count, and for e > 0 exactly one row of M is ≡ 0 (mod √2)
// (Giles & Selinger 2013, from memory; the tests check both claims against brute force). That row names
// the leftmost syllable of U: row z -> T, row x -> HT, row y -> SHT (T rotates about z; H swaps x and z;
// S moves x to y). Multiplying U on the left by that syllable's inverse lowers e by exactly one and only
// needs additions and exact halvings in Z[√2], so synthesis is linear in e (times the cost of the numbers).
// When e = 0, R is a signed permutation: it names the Clifford C up to phase.
//
// The phase ω^p of the remainder V = (syllables)⁻¹ U = ω^p C is found without carrying V in big integers:
// V's numerators are carried modulo an odd number Q (as exact small integers) and p is the unique j with
// V ≡ ω^j C (mod Q). Unique because ω^j - ω^j', √2 and every nonzero Clifford numerator have absolute norm
// a power of 2, hence are invertible modulo an odd Q. Exists because R(V) = R(C) makes V = z·C with z in
// D[ω] and |z| = 1, and such z are exactly the ω^j (x x† = 2^k in Z[ω] forces x = ω^j √2^k up to sign).
import { type ZOmega, zoAdd, zoConj, zoMul, zoMulOmega, zoNormSq, zoSub } from "../rings/zomega.js";
import { type ExactU2, u2IsUnitary } from "./matrix.js";
import { CLIFFORDS } from "./clifford.js";
import { type Gate1, type Word, simplifyWord, wordMatrix } from "./word.js";

/** A normal-form syllable, as an operator (leftmost = applied last). */
export type Syllable = "T" | "HT" | "SHT";

/** u = ω^phase · S1 · S2 ··· Sm · CLIFFORDS[clifford].matrix, with syllables = [S1, ..., Sm] (matrix-product order). */
export interface NormalForm {
  readonly syllables: readonly Syllable[];
  readonly clifford: number;
  readonly phase: number;
}

/** The result of exact synthesis: u = ω^phase · wordMatrix(word), with phase in 0..7. */
export interface ExactSynthesis {
  readonly word: Word;
  readonly phase: number;
}

// ---- Bloch matrix ----------------------------------------------------------------------------------

/** A real element of Z[ω] (c = 0, d = -b) as a + b√2 written into m[i], m[i+1]; throws if not real. */
function putReal(m: bigint[], i: number, x: ZOmega): void {
  if (x.c !== 0n || x.d !== -x.b) throw new RangeError("exact synthesis: the matrix is not unitary");
  m[i] = x.a;
  m[i + 1] = x.b;
}

/** z + z† (= 2 Re z, real). */
function twoRe(z: ZOmega): ZOmega {
  return zoAdd(z, zoConj(z));
}

/** i (z - z†) (= -2 Im z, real). */
function minusTwoIm(z: ZOmega): ZOmega {
  return zoMulOmega(zoSub(z, zoConj(z)), 2);
}

function realOf(n: { a: bigint; b: bigint }): ZOmega {
  return { a: n.a, b: n.b, c: 0n, d: -n.b };
}

/**
 * The Bloch matrix of u as numerators over Z[√2] and the least exponent e with R = M / √2^e.
 * M is 18 bigints, row-major over rows x, y, z; each entry a + b√2 stored as a, b.
 */
export function blochNumerators(u: ExactU2): { m: bigint[]; e: number } {
  const { a, b, c, d } = u;
  // P_j = N σ_j N† for N = [[a, b], [c, d]] is Hermitian; column j of R is
  // (2 Re P01, -2 Im P01, P00 - P11) / 2^(k+1). Six products and four norms suffice.
  const ba = zoMul(b, zoConj(a));
  const dc = zoMul(d, zoConj(c));
  const bc = zoMul(b, zoConj(c));
  const ad = zoMul(a, zoConj(d));
  const ac = zoMul(a, zoConj(c));
  const bd = zoMul(b, zoConj(d));
  const na = zoNormSq(a);
  const nb = zoNormSq(b);
  const nc = zoNormSq(c);
  const nd = zoNormSq(d);
  const px01 = zoAdd(bc, ad); // σx
  const py01 = zoMulOmega(zoSub(bc, ad), 2); // σy: N σy = i [[b, -a], [d, -c]]
  const pz01 = zoSub(ac, bd); // σz
  const px0011 = zoSub(twoRe(ba), twoRe(dc));
  const py0011 = zoSub(minusTwoIm(ba), minusTwoIm(dc));
  const pz0011 = realOf({ a: na.a - nb.a - nc.a + nd.a, b: na.b - nb.b - nc.b + nd.b });
  const m: bigint[] = new Array<bigint>(18);
  const cols: [ZOmega, ZOmega][] = [
    [px01, px0011],
    [py01, py0011],
    [pz01, pz0011],
  ];
  for (let j = 0; j < 3; j++) {
    const [p01, p0011] = cols[j]!;
    putReal(m, 2 * j, twoRe(p01));
    putReal(m, 6 + 2 * j, minusTwoIm(p01));
    putReal(m, 12 + 2 * j, p0011);
  }
  let e = 2 * u.k + 2;
  // reduce: while every entry is divisible by √2 (every a even), divide: (a + b√2)/√2 = b + (a/2)√2
  for (;;) {
    let acc = 0n;
    for (let i = 0; i < 18; i += 2) acc |= m[i]!;
    if ((acc & 1n) !== 0n || e === 0) break;
    for (let i = 0; i < 18; i += 2) {
      const na2 = m[i + 1]!;
      m[i + 1] = m[i]! >> 1n;
      m[i] = na2;
    }
    e--;
  }
  return { m, e };
}

const KIND_T = 0;
const KIND_HT = 1;
const KIND_SHT = 2;

/*
 * The peeling loop tracks only the first two columns of M (columns transform independently under left
 * multiplication). That is enough: M's columns and rows are vectors whose squares sum to 2^e, so modulo √2
 * each row and each column holds an even number of odd entries. If both tracked columns were even, every
 * row would hold at most one odd entry, hence none, and M would not be reduced. So some tracked column has
 * exactly two odd entries, and the zero row is the third. The same argument shows the two columns alone
 * have least exponent e. At e = 0 the third column is the cross product of the first two.
 *
 * Layout of the 12 numerators: row r at offset 4r (rows x, y, z), then column 0 (a, b), column 1 (a, b).
 */

/** The first two columns of the Bloch numerators of u and their least exponent e (= the T-count). */
function blochTwoColumns(u: ExactU2): { m: bigint[]; e: number } {
  const { a, b, c, d } = u;
  const ba = zoMul(b, zoConj(a));
  const dc = zoMul(d, zoConj(c));
  const bc = zoMul(b, zoConj(c));
  const ad = zoMul(a, zoConj(d));
  const cols: [ZOmega, ZOmega][] = [
    [zoAdd(bc, ad), zoSub(twoRe(ba), twoRe(dc))],
    [zoMulOmega(zoSub(bc, ad), 2), zoSub(minusTwoIm(ba), minusTwoIm(dc))],
  ];
  const t: bigint[] = new Array<bigint>(18).fill(0n);
  for (let j = 0; j < 2; j++) {
    const [p01, p0011] = cols[j]!;
    putReal(t, 2 * j, twoRe(p01));
    putReal(t, 6 + 2 * j, minusTwoIm(p01));
    putReal(t, 12 + 2 * j, p0011);
  }
  const m: bigint[] = [t[0]!, t[1]!, t[2]!, t[3]!, t[6]!, t[7]!, t[8]!, t[9]!, t[12]!, t[13]!, t[14]!, t[15]!];
  let e = 2 * u.k + 2;
  for (;;) {
    let acc = 0n;
    for (let i = 0; i < 12; i += 2) acc |= m[i]!;
    if ((acc & 1n) !== 0n || e === 0) break;
    for (let i = 0; i < 12; i += 2) {
      const na = m[i + 1]!;
      m[i + 1] = m[i]! >> 1n;
      m[i] = na;
    }
    e--;
  }
  return { m, e };
}

/** The syllable named by the zero row (see above), from the parities of the a-parts of the two columns. */
function syllableKind(px0: boolean, py0: boolean, pz0: boolean, px1: boolean, py1: boolean, pz1: boolean): number {
  // p* are "odd" flags; a column with odd entries has exactly two, the even one marks the zero row
  let x = px0;
  let y = py0;
  let z = pz0;
  if (!x && !y && !z) {
    x = px1;
    y = py1;
    z = pz1;
  }
  if (x && y && !z) return KIND_T;
  if (!x && y && z) return KIND_HT;
  if (x && !y && z) return KIND_SHT;
  throw new Error("internal: the Bloch parity pattern names no syllable");
}

/**
 * One peeling step on the two tracked columns, in BigInt, from m into o:
 *   T:   x' = (x + y)/2, y' = (y - x)/2,  z' = z/√2   (R(T)ᵀ R)
 *   HT:  x' = (z - y)/2, y' = -(y + z)/2, z' = x/√2   (R(HT)ᵀ R)
 *   SHT: x' = (z + x)/2, y' = (x - z)/2,  z' = y/√2   (R(SHT)ᵀ R)
 * Returns false if a division is not exact (which the normal-form theorem rules out).
 */
function peelBig(m: bigint[], o: bigint[], kind: number): boolean {
  let odd = 0n;
  for (let j = 0; j < 4; j++) {
    const x = m[j]!;
    const y = m[4 + j]!;
    const z = m[8 + j]!;
    let p: bigint;
    let q: bigint;
    if (kind === KIND_T) {
      p = x + y;
      q = y - x;
    } else if (kind === KIND_HT) {
      p = z - y;
      q = -(y + z);
    } else {
      p = z + x;
      q = x - z;
    }
    odd |= p | q;
    o[j] = p >> 1n;
    o[4 + j] = q >> 1n;
  }
  const w = kind === KIND_T ? 8 : kind === KIND_HT ? 0 : 4;
  for (let j = 0; j < 4; j += 2) {
    const a = m[w + j]!;
    odd |= a;
    o[8 + j] = m[w + j + 1]!;
    o[9 + j] = a >> 1n;
  }
  return (odd & 1n) === 0n;
}

/** The same step on exact integers held in doubles (all magnitudes below 2^52, checked). */
function peelNum(m: number[], o: number[], kind: number): boolean {
  for (let j = 0; j < 4; j++) {
    const x = m[j]!;
    const y = m[4 + j]!;
    const z = m[8 + j]!;
    let p: number;
    let q: number;
    if (kind === KIND_T) {
      p = x + y;
      q = y - x;
    } else if (kind === KIND_HT) {
      p = z - y;
      q = -(y + z);
    } else {
      p = z + x;
      q = x - z;
    }
    if (p % 2 !== 0 || q % 2 !== 0 || Math.abs(p) > NUM_LIMIT || Math.abs(q) > NUM_LIMIT) return false;
    o[j] = p / 2;
    o[4 + j] = q / 2;
  }
  const w = kind === KIND_T ? 8 : kind === KIND_HT ? 0 : 4;
  for (let j = 0; j < 4; j += 2) {
    const a = m[w + j]!;
    if (a % 2 !== 0) return false;
    o[8 + j] = m[w + j + 1]!;
    o[9 + j] = a / 2;
  }
  return true;
}

/** Integers up to this magnitude, and sums of two of them, are exact in doubles. */
const NUM_LIMIT = 2 ** 52;
const NUM_LIMIT_BIG = 2n ** 50n;
/**
 * Below this exponent every numerator fits comfortably in a double: |a|, |b| ≤ 2^(e/2), because M and its
 * • image are √2^e times orthogonal matrices (U• is unitary too). The switch also checks the bound.
 */
const NUM_SWITCH_E = 96;

// ---- arithmetic of Z[ω] numerators modulo an odd Q (exact small integers in doubles, all < 2^53) ----------

/** An odd modulus (a prime below 2^25, so products of two residues stay below 2^50). */
const Q = 33554393;
const QB = BigInt(Q);

function modQ(x: bigint): number {
  const r = Number(x % QB);
  return r < 0 ? r + Q : r;
}

/** Row 2 (entries c, d: slots 8..15) of a mod-Q matrix times ω^7 (= T†): (a, b, c, d) -> (b, c, d, -a). */
function rowTdg(v: number[]): void {
  for (let o = 8; o < 16; o += 4) {
    const a = v[o]!;
    v[o] = v[o + 1]!;
    v[o + 1] = v[o + 2]!;
    v[o + 2] = v[o + 3]!;
    v[o + 3] = a === 0 ? 0 : Q - a;
  }
}

/** Row 2 times ω^6 (= S†): (a, b, c, d) -> (c, d, -a, -b). */
function rowSdg(v: number[]): void {
  for (let o = 8; o < 16; o += 4) {
    const a = v[o]!;
    const b = v[o + 1]!;
    v[o] = v[o + 2]!;
    v[o + 1] = v[o + 3]!;
    v[o + 2] = a === 0 ? 0 : Q - a;
    v[o + 3] = b === 0 ? 0 : Q - b;
  }
}

/** Rows (r1, r2) -> (r1 + r2, r1 - r2), i.e. √2·H (the caller counts the √2). */
function rowsH(v: number[]): void {
  for (let i = 0; i < 8; i++) {
    const x = v[i]!;
    const y = v[8 + i]!;
    const s = x + y;
    const t = x - y;
    v[i] = s >= Q ? s - Q : s;
    v[8 + i] = t < 0 ? t + Q : t;
  }
}

/** x · y for 4-coefficient residues (ω⁴ = -1). */
function mulQ(x: readonly number[], xo: number, y: readonly number[]): number[] {
  const out = [0, 0, 0, 0];
  for (let i = 0; i < 4; i++)
    for (let j = 0; j < 4; j++) {
      const p = (x[xo + i]! * y[j]!) % Q;
      const k = i + j;
      if (k < 4) out[k] = (out[k]! + p) % Q;
      else out[k - 4] = (out[k - 4]! + Q - p) % Q;
    }
  return out;
}

/** √2^n modulo Q as 4 coefficients: 2^(n/2) for even n, 2^((n-1)/2)(ω - ω³) for odd n. */
function sqrt2PowQ(n: number): number[] {
  let s = 1;
  for (let i = 0; i < n >> 1; i++) s = (s * 2) % Q;
  return n % 2 === 0 ? [s, 0, 0, 0] : [0, s, 0, s === 0 ? 0 : Q - s];
}

/** Per Clifford: its Bloch key and its numerators modulo Q. */
interface CliffordInfo {
  readonly index: number;
  readonly k: number;
  readonly numQ: readonly number[];
}

const CLIFFORD_BY_BLOCH: ReadonlyMap<string, CliffordInfo> = (() => {
  const map = new Map<string, CliffordInfo>();
  for (const c of CLIFFORDS) {
    const { m, e } = blochNumerators(c.matrix);
    const key = blochKey(m);
    if (e !== 0 || key === null || map.has(key)) throw new Error("internal: Clifford Bloch matrices are not distinct signed permutations");
    const { a, b, c: cc, d, k } = c.matrix;
    const numQ: number[] = [];
    for (const z of [a, b, cc, d]) numQ.push(modQ(z.a), modQ(z.b), modQ(z.c), modQ(z.d));
    map.set(key, { index: c.index, k, numQ });
  }
  return map;
})();

/** The key of an integer (e = 0) Bloch matrix, or null if some entry has a √2 part. */
function blochKey(m: readonly bigint[]): string | null {
  let s = "";
  for (let i = 0; i < 18; i += 2) {
    if (m[i + 1] !== 0n) return null;
    s += `${m[i]},`;
  }
  return s;
}

// ---- synthesis -------------------------------------------------------------------------------------

/** The Matsumoto–Amano normal form of an exact unitary (throws RangeError if u is not unitary). */
export function normalForm(u: ExactU2): NormalForm {
  if (!u2IsUnitary(u)) throw new RangeError("exact synthesis: the matrix is not unitary");
  const bloch = blochTwoColumns(u);
  let e = bloch.e;
  // V = (peeled syllables)⁻¹ u, numerators modulo Q over the denominator √2^kv (not reduced).
  const v: number[] = [];
  for (const z of [u.a, u.b, u.c, u.d]) v.push(modQ(z.a), modQ(z.b), modQ(z.c), modQ(z.d));
  let kv = u.k;
  const syllables: Syllable[] = new Array<Syllable>(e);
  let n = 0;
  const step = (kind: number): void => {
    if (kind === KIND_T) {
      if (n > 0) throw new Error("internal: T syllable after the first position");
      syllables[n++] = "T";
    } else {
      if (kind === KIND_SHT) rowSdg(v);
      rowsH(v);
      kv++;
      syllables[n++] = kind === KIND_HT ? "HT" : "SHT";
    }
    rowTdg(v);
    e--;
  };
  // big-integer phase
  let mb = bloch.m;
  let ob: bigint[] = new Array<bigint>(12);
  while (e > NUM_SWITCH_E) {
    const kind = syllableKind((mb[0]! & 1n) !== 0n, (mb[4]! & 1n) !== 0n, (mb[8]! & 1n) !== 0n, (mb[2]! & 1n) !== 0n, (mb[6]! & 1n) !== 0n, (mb[10]! & 1n) !== 0n);
    if (!peelBig(mb, ob, kind)) throw new Error("internal: a normal-form peel is not exact");
    const t = mb;
    mb = ob;
    ob = t;
    step(kind);
  }
  // small-integer phase
  for (const x of mb) if (x > NUM_LIMIT_BIG || x < -NUM_LIMIT_BIG) throw new Error("internal: Bloch numerators exceed their bound");
  let m: number[] = mb.map(Number);
  let o: number[] = new Array<number>(12);
  while (e > 0) {
    const kind = syllableKind(m[0]! % 2 !== 0, m[4]! % 2 !== 0, m[8]! % 2 !== 0, m[2]! % 2 !== 0, m[6]! % 2 !== 0, m[10]! % 2 !== 0);
    if (!peelNum(m, o, kind)) throw new Error("internal: a normal-form peel is not exact");
    const t = m;
    m = o;
    o = t;
    step(kind);
  }
  // the remaining Bloch matrix is a signed permutation; its third column is the cross product of the first two
  for (let i = 1; i < 12; i += 2) if (m[i] !== 0) throw new Error("internal: the remainder of exact synthesis is not a Clifford");
  const c0 = [m[0]!, m[4]!, m[8]!];
  const c1 = [m[2]!, m[6]!, m[10]!];
  const c2 = [c0[1]! * c1[2]! - c0[2]! * c1[1]!, c0[2]! * c1[0]! - c0[0]! * c1[2]!, c0[0]! * c1[1]! - c0[1]! * c1[0]!];
  const key = `${c0[0]},${c1[0]},${c2[0]},${c0[1]},${c1[1]},${c2[1]},${c0[2]},${c1[2]},${c2[2]},`;
  const info = CLIFFORD_BY_BLOCH.get(key);
  if (info === undefined) throw new Error("internal: the remainder of exact synthesis is not a Clifford");
  // find the unique j with V ≡ ω^j · C (mod Q), comparing numerators over √2^kv
  const s = sqrt2PowQ(kv - info.k);
  const target: number[] = [];
  for (let i = 0; i < 16; i += 4) target.push(...mulQ(info.numQ, i, s));
  let phase = -1;
  for (let j = 0; j < 8; j++) {
    let ok = true;
    for (let i = 0; i < 16 && ok; i += 4) {
      const r = rotQ(target, i, j);
      for (let c = 0; c < 4; c++) if (r[c] !== v[i + c]) ok = false;
    }
    if (ok) {
      if (phase >= 0) throw new Error("internal: the phase of the Clifford remainder is not unique");
      phase = j;
    }
  }
  if (phase < 0) throw new Error("internal: the remainder of exact synthesis is not a Clifford with phase");
  return { syllables, clifford: info.index, phase };
}

/** ω^j · x for 4 residues at x[o..o+3]. */
function rotQ(x: readonly number[], o: number, j: number): number[] {
  let r = [x[o]!, x[o + 1]!, x[o + 2]!, x[o + 3]!];
  for (let i = 0; i < j; i++) r = [r[3] === 0 ? 0 : Q - r[3]!, r[0]!, r[1]!, r[2]!];
  return r;
}

const SYLLABLE_WORD: Readonly<Record<Syllable, readonly Gate1[]>> = { T: ["t"], HT: ["t", "h"], SHT: ["t", "h", "s"] };

/** The circuit-order word of a normal form (Clifford first, then the syllables from last to first), and its phase. */
export function normalFormWord(nf: NormalForm): ExactSynthesis {
  const cl = CLIFFORDS[nf.clifford]!;
  const out: Gate1[] = [...cl.word];
  for (let i = nf.syllables.length - 1; i >= 0; i--) for (const g of SYLLABLE_WORD[nf.syllables[i]!]) out.push(g);
  return { word: out, phase: (nf.phase + cl.wordPhase) % 8 };
}

/**
 * Exact synthesis: a word of least T-count with u = ω^phase · wordMatrix(word) exactly (phase in 0..7).
 * Throws RangeError when u is not unitary. Cost is linear in the least denominator exponent.
 */
export function exactSynthesize(u: ExactU2): ExactSynthesis {
  const r = normalFormWord(normalForm(u));
  return { word: simplifyWord(r.word), phase: r.phase };
}

/** The normal-form word of any word: same matrix up to the returned phase ω^phase, least T-count. */
export function normalizeWord(word: Word): ExactSynthesis {
  return exactSynthesize(wordMatrix(word));
}
