// Shared test helpers for the exact layer: a seeded generator, random words, and reference matrices in mathjs.
import { seededRng } from "../../../src/numeric/prng.js";
import { complex, multiply, matrix, identity, type Complex, type Matrix } from "mathjs";
import type { Gate1, Word } from "../../../src/synth/exact/word.js";
import type { ExactU2 } from "../../../src/synth/exact/matrix.js";
import { u2ToComplex } from "../../../src/synth/exact/matrix.js";

/** Seeded floats in [0, 1) from the project's one generator (numeric/prng.ts). */
export function rng(seed: number): () => number {
  const g = seededRng(seed);
  return () => g.nextFloat();
}

export const ALL_GATES: readonly Gate1[] = ["h", "s", "sdg", "t", "tdg", "x", "y", "z"];

export function randomWord(r: () => number, length: number, gates: readonly Gate1[] = ALL_GATES): Gate1[] {
  const w: Gate1[] = [];
  for (let i = 0; i < length; i++) w.push(gates[Math.floor(r() * gates.length)]!);
  return w;
}

/**
 * Gate matrices as written in the OpenQASM 3 specification's stdgates.inc (h, s, sdg, t, tdg, x, y, z),
 * built in mathjs complex numbers, independently of the exact code.
 */
const c = (re: number, im = 0): Complex => complex(re, im);
const r2 = Math.SQRT1_2;
export const REF_GATES: Readonly<Record<Gate1, Matrix>> = {
  h: matrix([[c(r2), c(r2)], [c(r2), c(-r2)]]),
  s: matrix([[c(1), c(0)], [c(0), c(0, 1)]]),
  sdg: matrix([[c(1), c(0)], [c(0), c(0, -1)]]),
  t: matrix([[c(1), c(0)], [c(0), c(Math.cos(Math.PI / 4), Math.sin(Math.PI / 4))]]),
  tdg: matrix([[c(1), c(0)], [c(0), c(Math.cos(Math.PI / 4), -Math.sin(Math.PI / 4))]]),
  x: matrix([[c(0), c(1)], [c(1), c(0)]]),
  y: matrix([[c(0), c(0, -1)], [c(0, 1), c(0)]]),
  z: matrix([[c(1), c(0)], [c(0), c(-1)]]),
};

/** The word's matrix as a mathjs product: last gate leftmost (circuit order). */
export function refWordMatrix(w: Word): Matrix {
  let m = identity(2) as Matrix;
  for (const g of w) m = multiply(REF_GATES[g], m) as Matrix;
  return m;
}

/** Largest entrywise |difference| between an exact matrix times e^{iπ·phasePi} and a mathjs matrix. */
export function maxDiff(u: ExactU2, ref: Matrix, phasePi = 0): number {
  const e = u2ToComplex(u);
  const ph = c(Math.cos(Math.PI * phasePi), Math.sin(Math.PI * phasePi));
  let worst = 0;
  for (let i = 0; i < 2; i++)
    for (let j = 0; j < 2; j++) {
      const [re, im] = e[i]![j]!;
      const z = multiply(ph, c(re, im)) as Complex;
      const rv = ref.get([i, j]) as Complex | number;
      const rc = typeof rv === "number" ? c(rv) : rv;
      worst = Math.max(worst, Math.hypot(z.re - rc.re, z.im - rc.im));
    }
  return worst;
}
