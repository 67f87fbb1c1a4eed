// Exact 2x2 matrices over D[ω] with one common denominator √2^k: products, adjoint, equality, unitarity, gate application.
//
// An ExactU2 { a, b, c, d, k } is the matrix (1/√2^k) [[a, b], [c, d]] with a, b, c, d in Z[ω], always reduced:
// not all four numerators are divisible by √2 (the zero matrix is kept with k = 0). So k is the least
// denominator exponent of the matrix, and two matrices are equal iff their reduced forms are equal.
// For a unitary, k ≥ 0 and the columns have the form (u, t), (-t† ω^l, u† ω^l) with u†u + t†t = 2^k.
import {
  type ZOmega,
  ZO_ONE,
  ZO_ZERO,
  zoAdd,
  zoConj,
  zoDivSqrt2,
  zoEq,
  zoIsZero,
  zoMul,
  zoMulOmega,
  zoNeg,
  zoNormSq,
  zoSub,
  zoToComplex,
} from "../rings/zomega.js";
import { type DOmega, dom } from "../rings/domega.js";
import type { Gate1 } from "./word.js";

/** (1/√2^k) [[a, b], [c, d]], reduced (see the module comment). */
export interface ExactU2 {
  readonly a: ZOmega;
  readonly b: ZOmega;
  readonly c: ZOmega;
  readonly d: ZOmega;
  readonly k: number;
}

function divisibleBySqrt2(x: ZOmega): boolean {
  return ((x.a ^ x.c) & 1n) === 0n && ((x.b ^ x.d) & 1n) === 0n;
}

/** (1/√2^k) [[a, b], [c, d]] brought to reduced form. */
export function exactU2(a: ZOmega, b: ZOmega, c: ZOmega, d: ZOmega, k: number): ExactU2 {
  if (zoIsZero(a) && zoIsZero(b) && zoIsZero(c) && zoIsZero(d)) return { a, b, c, d, k: 0 };
  while (divisibleBySqrt2(a) && divisibleBySqrt2(b) && divisibleBySqrt2(c) && divisibleBySqrt2(d)) {
    a = zoDivSqrt2(a);
    b = zoDivSqrt2(b);
    c = zoDivSqrt2(c);
    d = zoDivSqrt2(d);
    k--;
  }
  return { a, b, c, d, k };
}

/**
 * The unitary (1/√2^k) [[u, -t† ω^l], [t, u† ω^l]] (reduced). It is unitary exactly when u†u + t†t = 2^k;
 * this constructor does not check that (use u2IsUnitary). Its determinant is ω^l.
 */
export function exactU2FromColumn(u: ZOmega, t: ZOmega, l: number, k: number): ExactU2 {
  return exactU2(u, zoNeg(zoMulOmega(zoConj(t), l)), t, zoMulOmega(zoConj(u), l), k);
}

export const U2_IDENTITY: ExactU2 = { a: ZO_ONE, b: ZO_ZERO, c: ZO_ZERO, d: ZO_ONE, k: 0 };

/** The matrix product x · y. */
export function u2Mul(x: ExactU2, y: ExactU2): ExactU2 {
  return exactU2(
    zoAdd(zoMul(x.a, y.a), zoMul(x.b, y.c)),
    zoAdd(zoMul(x.a, y.b), zoMul(x.b, y.d)),
    zoAdd(zoMul(x.c, y.a), zoMul(x.d, y.c)),
    zoAdd(zoMul(x.c, y.b), zoMul(x.d, y.d)),
    x.k + y.k,
  );
}

/** The conjugate transpose x†. */
export function u2Adjoint(x: ExactU2): ExactU2 {
  return { a: zoConj(x.a), b: zoConj(x.c), c: zoConj(x.b), d: zoConj(x.d), k: x.k };
}

/** ω^j · x (a global phase). */
export function u2MulOmega(x: ExactU2, j: number): ExactU2 {
  return { a: zoMulOmega(x.a, j), b: zoMulOmega(x.b, j), c: zoMulOmega(x.c, j), d: zoMulOmega(x.d, j), k: x.k };
}

/** x = y exactly (global phase included). */
export function u2Eq(x: ExactU2, y: ExactU2): boolean {
  return x.k === y.k && zoEq(x.a, y.a) && zoEq(x.b, y.b) && zoEq(x.c, y.c) && zoEq(x.d, y.d);
}

/** The j in 0..7 with x = ω^j · y, or null when x is not y times a power of ω. */
export function u2PhaseBetween(x: ExactU2, y: ExactU2): number | null {
  if (x.k !== y.k) return null;
  for (let j = 0; j < 8; j++) if (u2Eq(x, u2MulOmega(y, j))) return j;
  return null;
}

/** The least denominator exponent of the matrix (the k of its reduced form). */
export function u2Lde(x: ExactU2): number {
  return x.k;
}

/** x†x = I exactly. */
export function u2IsUnitary(x: ExactU2): boolean {
  if (x.k < 0) return false;
  const two = 1n << BigInt(x.k); // 2^k, the squared column norm of the numerators
  const c0 = zoAdd(zoNormSq0(x.a), zoNormSq0(x.c));
  const c1 = zoAdd(zoNormSq0(x.b), zoNormSq0(x.d));
  if (!zoEq(c0, { a: two, b: 0n, c: 0n, d: 0n }) || !zoEq(c1, { a: two, b: 0n, c: 0n, d: 0n })) return false;
  return zoIsZero(zoAdd(zoMul(zoConj(x.a), x.b), zoMul(zoConj(x.c), x.d)));
}

function zoNormSq0(x: ZOmega): ZOmega {
  const n = zoNormSq(x);
  return { a: n.a, b: n.b, c: 0n, d: -n.b };
}

/** The determinant, an element of D[ω] (ω^l for a Clifford+T unitary). */
export function u2Det(x: ExactU2): DOmega {
  return dom(zoSub(zoMul(x.a, x.d), zoMul(x.b, x.c)), 2 * x.k);
}

/** Entry (row, col) as an element of D[ω]. */
export function u2Entry(x: ExactU2, row: 0 | 1, col: 0 | 1): DOmega {
  const n = row === 0 ? (col === 0 ? x.a : x.b) : col === 0 ? x.c : x.d;
  return dom(n, x.k);
}

/** Left multiplication G · x by one gate's matrix (cheap row operations; exact, global phase included). */
export function u2ApplyGate(g: Gate1, x: ExactU2): ExactU2 {
  const { a, b, c, d, k } = x;
  switch (g) {
    case "t":
      return { a, b, c: zoMulOmega(c, 1), d: zoMulOmega(d, 1), k };
    case "tdg":
      return { a, b, c: zoMulOmega(c, 7), d: zoMulOmega(d, 7), k };
    case "s":
      return { a, b, c: zoMulOmega(c, 2), d: zoMulOmega(d, 2), k };
    case "sdg":
      return { a, b, c: zoMulOmega(c, 6), d: zoMulOmega(d, 6), k };
    case "z":
      return { a, b, c: zoNeg(c), d: zoNeg(d), k };
    case "x":
      return { a: c, b: d, c: a, d: b, k };
    case "y":
      // Y = [[0, -i], [i, 0]]
      return { a: zoMulOmega(c, 6), b: zoMulOmega(d, 6), c: zoMulOmega(a, 2), d: zoMulOmega(b, 2), k };
    case "h":
      return exactU2(zoAdd(a, c), zoAdd(b, d), zoSub(a, c), zoSub(b, d), k + 1);
  }
}

/** The exact matrix of one gate. */
export function u2Gate(g: Gate1): ExactU2 {
  return u2ApplyGate(g, U2_IDENTITY);
}

/** A canonical text key of the exact matrix (equal keys iff equal matrices), for hash maps. */
export function u2Key(x: ExactU2): string {
  const { a, b, c, d } = x;
  return `${x.k}|${a.a},${a.b},${a.c},${a.d}|${b.a},${b.b},${b.c},${b.d}|${c.a},${c.b},${c.c},${c.d}|${d.a},${d.b},${d.c},${d.d}`;
}

/** The matrix in doubles as [[re, im] of each entry] row-major: [[m00, m01], [m10, m11]], for tests and display. */
export function u2ToComplex(x: ExactU2): readonly (readonly (readonly [number, number])[])[] {
  const s = Math.pow(Math.SQRT2, -x.k);
  const f = (z: ZOmega): readonly [number, number] => {
    const [re, im] = zoToComplex(z);
    return [re * s, im * s];
  };
  return [
    [f(x.a), f(x.b)],
    [f(x.c), f(x.d)],
  ];
}
