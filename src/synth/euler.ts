// The Euler route for an arbitrary single-qubit gate U(a, b, c): three z-rotations around two Hadamards, the error budget shared between them.
//
// OpenQASM 3: U(a,b,c) = [[cos(a/2), -e^{ic} sin(a/2)], [e^{ib} sin(a/2), e^{i(b+c)} cos(a/2)]]
//           = e^{i(b+c)/2} rz(b) ry(a) rz(c),   and ry(a) = S H rz(a) H S† = rz(π/2) H rz(a) H rz(-π/2),
// so U(a,b,c) = e^{i(b+c)/2} rz(b + π/2) H rz(a) H rz(c - π/2)   (matrix order; the circuit applies
// rz(c - π/2) first). Special cases that save rotations, all exact identities:
//   a ≡ 0 (mod 4π):  U = e^{i(b+c)/2} rz(b + c)                      (one rotation);
//   a ≡ 2π (mod 4π): U = -e^{i(b+c)/2} rz(b + c);
//   a ≡ ±π (mod 4π): ry(±π) = e^{∓iπ/2} Y and rz(b) Y = Y rz(-b), so U = e^{i(b+c)/2 ∓ iπ/2} Y rz(c - b).
// Budget split (documented for the ledger): the total ε is shared by the rotations that are not exact
// π/4 multiples (exact ones cost no error). They are synthesized in circuit order; each gets the budget
// still unspent divided by the number of rotations still to do, so equal shares ε/m when every rotation
// spends its whole share (the Lagrange optimum of Σ 3 log2(1/ε_i) under Σ ε_i = ε) and any unspent part
// passes on to the later ones. The composition bound d(U1U2, V1V2) ≤ d(U1, V1) + d(U2, V2) then keeps
// the total within ε; the returned error is re-measured from the exact matrix of the whole word.
import type { Angle } from "../ir/angle.js";
import { angleAdd, angleNeg, anglePi, angleScale, rational } from "../ir/angle-ops.js";
import type { SynthResult } from "./index.js";
import { type Gate1, type Word, simplifyWord, tCount, wordMatrix } from "./exact/word.js";
import { decimalToRational, fxCosSin, fxFromDecimal, fxMul, fxPi, fxToDecimalUp, fxToFixedString, parseDecimal } from "../numeric/fixed.js";
import { divFloor } from "../numeric/bigint.js";
import { angleToFixed, exactQuarterTurns, readEps } from "./ztarget/precision.js";
import { ERROR_DIGITS, PHASE_DIGITS, type RzOptions } from "./ztarget/rz.js";
import { type FxMat2, distance2Up, exactToFx, fxSqrtUp } from "./ztarget/distance.js";

/** A z-rotation synthesizer (the number-theoretic one, or another method behind the same signature). */
export type RzSynth = (theta: Angle, eps: string, opts?: RzOptions) => SynthResult;

/** U(a, b, c) in fixed point, exactly as OpenQASM 3 defines it. */
export function uFx(a: bigint, b: bigint, c: bigint, prec: number): FxMat2 {
  const ha = fxCosSin(a >> 1n, prec);
  const eb = fxCosSin(b, prec);
  const ec = fxCosSin(c, prec);
  const ebc = fxCosSin(b + c, prec);
  return [
    { re: ha.cos, im: 0n },
    { re: -fxMul(ec.cos, ha.sin, prec), im: -fxMul(ec.sin, ha.sin, prec) },
    { re: fxMul(eb.cos, ha.sin, prec), im: fxMul(eb.sin, ha.sin, prec) },
    { re: fxMul(ebc.cos, ha.cos, prec), im: fxMul(ebc.sin, ha.cos, prec) },
  ];
}

const HALF_PI = rational(1n, 2n);

/** a/π in -1..2 when a is known to be an integer multiple of π (taken mod 4π), else null. */
function piTurns(a: Angle): number | null {
  const k = exactQuarterTurns(a);
  if (k === null || k % 4 !== 0) return null;
  return k / 4; // a = (k/4)π with k in -7..8: one of -1, 0, 1, 2
}

/**
 * U(a, b, c) within eps by the Euler route, each z-rotation synthesized by `rz` (the number-theoretic
 * method by default, via src/synth/index.ts).
 */
export function synthEuler(params: readonly [Angle, Angle, Angle], epsText: string, rz: RzSynth, opts: RzOptions = {}): SynthResult {
  const [a, b, c] = params;
  const eps = readEps(epsText);
  const prec = eps.prec;
  const half = (x: Angle): Angle => angleScale(x, rational(1n, 2n));
  // Rotations in circuit order, with the gates between them, and the extra phase of the decomposition.
  type Piece = { readonly kind: "rz"; readonly angle: Angle } | { readonly kind: "gates"; readonly word: Word };
  let pieces: Piece[];
  let phase: Angle = half(angleAdd(b, c)); // e^{i(b+c)/2}
  const turns = piTurns(a);
  if (turns === 0 || turns === 2) {
    pieces = [{ kind: "rz", angle: angleAdd(b, c) }];
    if (turns === 2) phase = angleAdd(phase, anglePi(rational(1n)));
  } else if (turns === 1 || turns === -1) {
    // ry(π) = [[0, -1], [1, 0]] = -iY = e^{-iπ/2} Y; ry(-π) = e^{iπ/2} Y.
    pieces = [
      { kind: "rz", angle: angleAdd(c, angleNeg(b)) },
      { kind: "gates", word: ["y"] },
    ];
    phase = angleAdd(phase, anglePi(rational(turns === 1 ? -1n : 1n, 2n)));
  } else {
    pieces = [
      { kind: "rz", angle: angleAdd(c, anglePi(rational(-1n, 2n))) },
      { kind: "gates", word: ["h"] },
      { kind: "rz", angle: a },
      { kind: "gates", word: ["h"] },
      { kind: "rz", angle: angleAdd(b, anglePi(HALF_PI)) },
    ];
  }
  // Budget: exact rotations first (error 0), then shares of what is left, in circuit order.
  const inexact = pieces.filter((p) => p.kind === "rz" && exactQuarterTurns(p.angle) === null).length;
  let remainingNum = eps.num; // remaining budget as an exact rational remainingNum / remainingDen
  let remainingDen = eps.den;
  let left = inexact;
  const word: Gate1[] = [];
  let phaseFx = angleToFixed(phase, prec);
  let allExact = true;
  let certified = true;
  let skipped = 0;
  for (const p of pieces) {
    if (p.kind === "gates") {
      word.push(...p.word);
      continue;
    }
    const exact = exactQuarterTurns(p.angle) !== null;
    let share = "1"; // unused for exact rotations
    if (!exact) {
      share = shareString(remainingNum, remainingDen * BigInt(left));
      left--;
    }
    const r = rz(p.angle, share, opts);
    word.push(...r.word);
    phaseFx += fxFromDecimal(r.globalPhase, prec);
    if (r.method !== "exact") allExact = false;
    if (!r.certifiedOptimal) certified = false;
    skipped += r.skipped;
    if (!exact) {
      // remaining -= achieved error (an exact decimal upper bound)
      const spent = decimalToRational(parseDecimal(r.error));
      remainingNum = remainingNum * spent.den - spent.num * remainingDen;
      remainingDen = remainingDen * spent.den;
      if (remainingNum < 0n) throw new Error("internal: a rotation overspent its share of the budget");
    }
  }
  const w = simplifyWord(word);
  // Re-measure the whole word against U(a, b, c).
  const target = uFx(angleToFixed(a, prec), angleToFixed(b, prec), angleToFixed(c, prec), prec);
  const d2 = distance2Up(exactToFx(wordMatrix(w), prec), target, prec);
  if (d2 > eps.eps2Down) throw new Error("internal: the Euler word misses its error bound");
  if (allExact && d2 >= 1n << BigInt(prec >> 1)) throw new Error("internal: an exact Euler word is not exact");
  const error = allExact ? "0" : fxToDecimalUp(fxSqrtUp(d2, prec), prec, ERROR_DIGITS);
  // phase into (-π, π]
  const twoPi = 2n * fxPi(prec);
  phaseFx = phaseFx - twoPi * divFloor(phaseFx + twoPi / 2n, twoPi);
  const tc = tCount(w);
  return {
    word: w,
    tCount: tc,
    cliffordCount: w.length - tc,
    error,
    globalPhase: fxToFixedString(phaseFx, prec, PHASE_DIGITS),
    method: allExact ? "exact" : "euler",
    certifiedOptimal: certified,
    skipped,
  };
}

/** num/den (> 0) as a decimal string rounded down to about 40 significant digits (a share never exceeds the budget). */
function shareString(num: bigint, den: bigint): string {
  if (num <= 0n) throw new Error("internal: no error budget left");
  const e = Math.max(0, den.toString().length - num.toString().length + 40);
  const q = (num * 10n ** BigInt(e)) / den; // floor
  return `${q}e-${e}`;
}
