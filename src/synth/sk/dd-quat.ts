// Double-double (about 32 significant digits) quaternion products, so that the error reported for a long word is not rounding noise.
import type { Gate1, Word } from "../exact/word.js";
import type { Quat } from "./quat.js";

// A double-double number is hi + lo with |lo| <= ulp(hi)/2. Error-free transformations after
// Dekker (1971) and Knuth (common practice, no source).

const SPLITTER = 134217729; // 2^27 + 1

/** hi + lo = a + b exactly. */
function twoSum(a: number, b: number, out: Float64Array, i: number): void {
  const s = a + b;
  const bb = s - a;
  out[i] = s;
  out[i + 1] = a - (s - bb) + (b - bb);
}

/** hi + lo = a * b exactly (Dekker's product with Veltkamp splitting). */
function twoProd(a: number, b: number, out: Float64Array, i: number): void {
  const p = a * b;
  let t = SPLITTER * a;
  const ah = t - (t - a);
  const al = a - ah;
  t = SPLITTER * b;
  const bh = t - (t - b);
  const bl = b - bh;
  out[i] = p;
  out[i + 1] = ah * bh - p + ah * bl + al * bh + al * bl;
}

const tmp = new Float64Array(4);

/** (ah, al) * (bh, bl) as a double-double in out[i], out[i+1]. */
function ddMul(ah: number, al: number, bh: number, bl: number, out: Float64Array, i: number): void {
  twoProd(ah, bh, tmp, 0);
  const e = tmp[1]! + (ah * bl + al * bh);
  const s = tmp[0]! + e;
  out[i] = s;
  out[i + 1] = e - (s - tmp[0]!);
}

/** (ah, al) + (bh, bl) as a double-double in out[i], out[i+1] (the accurate two-sum variant). */
function ddAdd(ah: number, al: number, bh: number, bl: number, out: Float64Array, i: number): void {
  twoSum(ah, bh, tmp, 0);
  twoSum(al, bl, tmp, 2);
  let s1 = tmp[0]!;
  let s2 = tmp[1]! + tmp[2]!;
  let h = s1 + s2;
  s2 = s2 - (h - s1);
  s1 = h;
  s2 += tmp[3]!;
  h = s1 + s2;
  out[i] = h;
  out[i + 1] = s2 - (h - s1);
}

/** A double-double quaternion: [a_hi, a_lo, b_hi, b_lo, c_hi, c_lo, d_hi, d_lo]. */
export type DDQuat = Float64Array;

/** sqrt of a double-double by one Newton step from the double square root. */
function ddSqrt(h: number, l: number): [number, number] {
  const y = Math.sqrt(h);
  const r = new Float64Array(2);
  twoProd(y, y, r, 0);
  const res = new Float64Array(2);
  ddAdd(h, l, -r[0]!, -r[1]!, res, 0);
  const corr = res[0]! / (2 * y);
  const s = y + corr;
  return [s, corr - (s - y)];
}

const [R2H, R2L] = ddSqrt(0.5, 0); // 1/sqrt2
const half = new Float64Array(2);
ddAdd(1, 0, R2H, R2L, half, 0);
const [C8H, C8L] = ddSqrt(half[0]! / 2, half[1]! / 2); // cos(pi/8) = sqrt((1 + 1/sqrt2) / 2)
ddAdd(1, 0, -R2H, -R2L, half, 0);
const [S8H, S8L] = ddSqrt(half[0]! / 2, half[1]! / 2); // sin(pi/8) = sqrt((1 - 1/sqrt2) / 2)

const dd = (xs: readonly number[]): DDQuat => Float64Array.from(xs);

/** The gates as double-double quaternions (same conventions as GATE_QUAT in quat.ts). */
const GATE_DD: Readonly<Record<Gate1, DDQuat>> = {
  h: dd([0, 0, R2H, R2L, 0, 0, R2H, R2L]),
  s: dd([R2H, R2L, 0, 0, 0, 0, R2H, R2L]),
  sdg: dd([R2H, R2L, 0, 0, 0, 0, -R2H, -R2L]),
  t: dd([C8H, C8L, 0, 0, 0, 0, S8H, S8L]),
  tdg: dd([C8H, C8L, 0, 0, 0, 0, -S8H, -S8L]),
  x: dd([0, 0, 1, 0, 0, 0, 0, 0]),
  y: dd([0, 0, 0, 0, 1, 0, 0, 0]),
  z: dd([0, 0, 0, 0, 0, 0, 1, 0]),
};

// Accumulator for one component of a product: (acH, acL) += sign * (ph, pl) * (qh, ql).
let acH = 0;
let acL = 0;

function acc(ph: number, pl: number, qh: number, ql: number, neg: boolean): void {
  // Product (Dekker), then the accurate double-double sum into the accumulator.
  const p = ph * qh;
  let t = SPLITTER * ph;
  const ahi = t - (t - ph);
  const alo = ph - ahi;
  t = SPLITTER * qh;
  const bhi = t - (t - qh);
  const blo = qh - bhi;
  let e = ahi * bhi - p + ahi * blo + alo * bhi + alo * blo;
  e += ph * ql + pl * qh;
  let xh = p + e;
  let xl = e - (xh - p);
  if (neg) {
    xh = -xh;
    xl = -xl;
  }
  let s1 = acH + xh;
  let bb = s1 - acH;
  let s2 = acH - (s1 - bb) + (xh - bb);
  const t1 = acL + xl;
  bb = t1 - acL;
  const t2 = acL - (t1 - bb) + (xl - bb);
  s2 += t1;
  let h = s1 + s2;
  s2 -= h - s1;
  s1 = h;
  s2 += t2;
  h = s1 + s2;
  acH = h;
  acL = s2 - (h - s1);
}

/** The Hamilton product p q in double-double (component formulas as in qmul, quat.ts). */
export function ddQmul(p: DDQuat, q: DDQuat): DDQuat {
  const out = new Float64Array(8);
  const [a1h, a1l, b1h, b1l, c1h, c1l, d1h, d1l] = p as unknown as [number, number, number, number, number, number, number, number];
  const [a2h, a2l, b2h, b2l, c2h, c2l, d2h, d2l] = q as unknown as [number, number, number, number, number, number, number, number];
  // a1 a2 - b1 b2 - c1 c2 - d1 d2
  acH = 0;
  acL = 0;
  acc(a1h, a1l, a2h, a2l, false);
  acc(b1h, b1l, b2h, b2l, true);
  acc(c1h, c1l, c2h, c2l, true);
  acc(d1h, d1l, d2h, d2l, true);
  out[0] = acH;
  out[1] = acL;
  // a1 b2 + b1 a2 + c1 d2 - d1 c2
  acH = 0;
  acL = 0;
  acc(a1h, a1l, b2h, b2l, false);
  acc(b1h, b1l, a2h, a2l, false);
  acc(c1h, c1l, d2h, d2l, false);
  acc(d1h, d1l, c2h, c2l, true);
  out[2] = acH;
  out[3] = acL;
  // a1 c2 - b1 d2 + c1 a2 + d1 b2
  acH = 0;
  acL = 0;
  acc(a1h, a1l, c2h, c2l, false);
  acc(b1h, b1l, d2h, d2l, true);
  acc(c1h, c1l, a2h, a2l, false);
  acc(d1h, d1l, b2h, b2l, false);
  out[4] = acH;
  out[5] = acL;
  // a1 d2 + b1 c2 - c1 b2 + d1 a2
  acH = 0;
  acL = 0;
  acc(a1h, a1l, d2h, d2l, false);
  acc(b1h, b1l, c2h, c2l, false);
  acc(c1h, c1l, b2h, b2l, true);
  acc(d1h, d1l, a2h, a2l, false);
  out[6] = acH;
  out[7] = acL;
  return out;
}

/** The operator of a circuit-order word in double-double, multiplied pairwise. */
export function ddWordQuat(w: Word): DDQuat {
  if (w.length === 0) return dd([1, 0, 0, 0, 0, 0, 0, 0]);
  const prod = (lo: number, hi: number): DDQuat => {
    if (hi - lo === 1) return GATE_DD[w[lo]!];
    const mid = (lo + hi) >> 1;
    return ddQmul(prod(mid, hi), prod(lo, mid));
  };
  return prod(0, w.length);
}

/** (ah, al) / (bh, bl) as a double-double: a quotient and one correction step. */
function ddDiv(ah: number, al: number, bh: number, bl: number): [number, number] {
  const r = new Float64Array(2);
  const q1 = ah / bh;
  ddMul(q1, 0, bh, bl, r, 0);
  ddAdd(ah, al, -r[0]!, -r[1]!, r, 0);
  const q2 = r[0]! / bh;
  const s = q1 + q2;
  return [s, q2 - (s - q1)];
}

/** x / |x| for a double-double quaternion, as a double-double quaternion. */
function ddUnit(x: DDQuat): DDQuat {
  const r = new Float64Array(2);
  let nh = 0;
  let nl = 0;
  for (let k = 0; k < 4; k++) {
    ddMul(x[2 * k]!, x[2 * k + 1]!, x[2 * k]!, x[2 * k + 1]!, r, 0);
    ddAdd(nh, nl, r[0]!, r[1]!, r, 0);
    nh = r[0]!;
    nl = r[1]!;
  }
  const [sh, sl] = ddSqrt(nh, nl);
  const out = new Float64Array(8);
  for (let k = 0; k < 4; k++) {
    const [h, l] = ddDiv(x[2 * k]!, x[2 * k + 1]!, sh, sl);
    out[2 * k] = h;
    out[2 * k + 1] = l;
  }
  return out;
}

/**
 * d(word, target) = sqrt(2 - |tr(W^dag U)|) = min(|p - q|, |p + q|) for the unit quaternions p
 * of the word and q of the target (the target's double coordinates taken as exact, then scaled to
 * unit length). Both are normalized in double-double, so neither the word's length nor rounding
 * drift of its norm matters, and the differences are formed in double-double before squaring:
 * the result is accurate to about 1e-28 absolute for words of a few million gates.
 */
export function ddWordDist(w: Word, target: Quat): number {
  const p = ddUnit(ddWordQuat(w));
  const q = ddUnit(Float64Array.from([target[0], 0, target[1], 0, target[2], 0, target[3], 0]));
  const r = new Float64Array(2);
  let m2 = 0;
  let s2 = 0;
  for (let k = 0; k < 4; k++) {
    ddAdd(p[2 * k]!, p[2 * k + 1]!, -q[2 * k]!, -q[2 * k + 1]!, r, 0);
    const dm = r[0]! + r[1]!;
    ddAdd(p[2 * k]!, p[2 * k + 1]!, q[2 * k]!, q[2 * k + 1]!, r, 0);
    const dp = r[0]! + r[1]!;
    m2 += dm * dm;
    s2 += dp * dp;
  }
  return Math.sqrt(Math.min(m2, s2));
}
