// mathjs references for synthesis tests: gate matrices from the OpenQASM 3 definitions, operator norms, phased distances.
import { complex, multiply, matrix, identity, subtract, ctranspose, type Complex, type Matrix } from "mathjs";
import type { Word } from "../../../src/synth/exact/word.js";

const c = (re: number, im = 0): Complex => complex(re, im);
const r2 = Math.SQRT1_2;
/** Gate matrices from the OpenQASM 3 stdgates.inc definitions, in mathjs complex numbers. */
const GATES: Record<string, Matrix> = {
  h: matrix([[c(r2), c(r2)], [c(r2), c(-r2)]]),
  s: matrix([[c(1), c(0)], [c(0), c(0, 1)]]),
  sdg: matrix([[c(1), c(0)], [c(0), c(0, -1)]]),
  t: matrix([[c(1), c(0)], [c(0), c(r2, r2)]]),
  tdg: matrix([[c(1), c(0)], [c(0), c(r2, -r2)]]),
  x: matrix([[c(0), c(1)], [c(1), c(0)]]),
  y: matrix([[c(0), c(0, -1)], [c(0, 1), c(0)]]),
  z: matrix([[c(1), c(0)], [c(0), c(-1)]]),
};
export function wordMatrixRef(w: Word): Matrix {
  let m = identity(2) as Matrix;
  for (const g of w) m = multiply(GATES[g]!, m) as Matrix;
  return m;
}
/** Operator norm of a 2×2 complex matrix: sqrt of the largest eigenvalue of D†D. */
export function opNorm(d: Matrix): number {
  const g = multiply(ctranspose(d), d) as Matrix;
  const get = (i: number, j: number): Complex => {
    const v = g.get([i, j]) as Complex | number;
    return typeof v === "number" ? c(v) : v;
  };
  const a = get(0, 0).re;
  const b = get(1, 1).re;
  const off = get(0, 1);
  const disc = Math.sqrt(((a - b) / 2) ** 2 + off.re ** 2 + off.im ** 2);
  return Math.sqrt(Math.max(0, (a + b) / 2 + disc));
}
/** ||W e^{iφ} - target|| with mathjs. */
export function phasedDistance(w: Word, phase: number, target: Matrix): number {
  const W = multiply(c(Math.cos(phase), Math.sin(phase)), wordMatrixRef(w)) as Matrix;
  return opNorm(subtract(W, target) as Matrix);
}
