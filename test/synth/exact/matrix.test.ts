// Tests for exact 2x2 matrices over D[ω]: gate matrices against the OpenQASM 3 definitions, products, adjoint, unitarity, reduced form.
import { describe, expect, it } from "vitest";
import {
  U2_IDENTITY,
  exactU2,
  exactU2FromColumn,
  u2Adjoint,
  u2ApplyGate,
  u2Det,
  u2Entry,
  u2Eq,
  u2Gate,
  u2IsUnitary,
  u2Key,
  u2Lde,
  u2Mul,
  u2MulOmega,
  u2PhaseBetween,
} from "../../../src/synth/exact/matrix.js";
import { wordMatrix } from "../../../src/synth/exact/word.js";
import { dom, domEq, domMulOmega, DO_ONE } from "../../../src/synth/rings/domega.js";
import { zo, ZO_ONE, ZO_ZERO, zoDivisibleBySqrt2 } from "../../../src/synth/rings/zomega.js";
import { ALL_GATES, REF_GATES, maxDiff, randomWord, rng } from "./helpers.js";

describe("gate matrices", () => {
  it("each gate's exact matrix equals its OpenQASM 3 stdgates definition (numerically, mathjs)", () => {
    for (const g of ALL_GATES) expect(maxDiff(u2Gate(g), REF_GATES[g])).toBeLessThan(1e-15);
  });

  it("u2ApplyGate(g, m) is the product gate · m", () => {
    const r = rng(11);
    for (let n = 0; n < 200; n++) {
      const m = wordMatrix(randomWord(r, 30));
      for (const g of ALL_GATES) expect(u2Eq(u2ApplyGate(g, m), u2Mul(u2Gate(g), m))).toBe(true);
    }
  });

  it("least denominator exponents: Paulis and S, T have 0, H has 1", () => {
    for (const g of ["s", "sdg", "t", "tdg", "x", "y", "z"] as const) expect(u2Lde(u2Gate(g))).toBe(0);
    expect(u2Lde(u2Gate("h"))).toBe(1);
    expect(u2Lde(wordMatrix(["h", "h"]))).toBe(0);
  });
});

describe("products, adjoint and unitarity", () => {
  it("products are associative; u · u† = I exactly for random words", () => {
    const r = rng(12);
    for (let n = 0; n < 200; n++) {
      const a = wordMatrix(randomWord(r, 40));
      const b = wordMatrix(randomWord(r, 40));
      const c = wordMatrix(randomWord(r, 40));
      expect(u2Eq(u2Mul(u2Mul(a, b), c), u2Mul(a, u2Mul(b, c)))).toBe(true);
      expect(u2Eq(u2Mul(a, u2Adjoint(a)), U2_IDENTITY)).toBe(true);
      expect(u2Eq(u2Adjoint(u2Mul(a, b)), u2Mul(u2Adjoint(b), u2Adjoint(a)))).toBe(true);
      expect(u2IsUnitary(a)).toBe(true);
    }
  });

  it("u2IsUnitary rejects non-unitary matrices", () => {
    expect(u2IsUnitary(exactU2(zo(2n), ZO_ZERO, ZO_ZERO, zo(2n), 0))).toBe(false); // 2I
    expect(u2IsUnitary(exactU2(ZO_ONE, ZO_ONE, ZO_ZERO, ZO_ONE, 0))).toBe(false); // shear
    expect(u2IsUnitary(exactU2(ZO_ONE, ZO_ONE, ZO_ONE, ZO_ONE, 1))).toBe(false); // orthogonality fails
    expect(u2IsUnitary(exactU2(ZO_ONE, ZO_ZERO, ZO_ZERO, ZO_ONE, 0))).toBe(true);
  });

  it("the determinant of a Clifford+T word is a power of ω", () => {
    const r = rng(13);
    for (let n = 0; n < 200; n++) {
      const u = wordMatrix(randomWord(r, 60));
      const det = u2Det(u);
      let ok = false;
      for (let j = 0; j < 8; j++) if (domEq(det, domMulOmega(DO_ONE, j))) ok = true;
      expect(ok).toBe(true);
    }
  });

  it("exactU2FromColumn rebuilds a unitary from its first column and determinant (Kliuchnikov, Maslov & Mosca 2013 form)", () => {
    const r = rng(14);
    for (let n = 0; n < 200; n++) {
      const u = wordMatrix(randomWord(r, 60));
      const det = u2Det(u);
      let l = -1;
      for (let j = 0; j < 8; j++) if (domEq(det, domMulOmega(DO_ONE, j))) l = j;
      expect(l).toBeGreaterThanOrEqual(0);
      const v = exactU2FromColumn(u.a, u.c, l, u.k);
      expect(u2Eq(v, u)).toBe(true);
      expect(u2IsUnitary(v)).toBe(true);
    }
  });

  it("the reduced form is unique: scaling all numerators by √2 does not change the matrix", () => {
    const u = wordMatrix(["h", "t", "h", "s", "h"]);
    const s = (x: typeof u.a) => zo(x.b - x.d, x.a + x.c, x.b + x.d, x.c - x.a); // x·√2
    const v = exactU2(s(u.a), s(u.b), s(u.c), s(u.d), u.k + 1);
    expect(u2Eq(u, v)).toBe(true);
    expect(u2Key(u)).toBe(u2Key(v));
    const nums = [u.a, u.b, u.c, u.d];
    expect(nums.every(zoDivisibleBySqrt2)).toBe(false);
  });

  it("global phases: u2PhaseBetween finds j with x = ω^j y, or null", () => {
    const u = wordMatrix(["h", "t", "s", "h", "t"]);
    for (let j = 0; j < 8; j++) expect(u2PhaseBetween(u2MulOmega(u, j), u)).toBe(j);
    expect(u2PhaseBetween(u, wordMatrix(["h", "t"]))).toBeNull();
    expect(domEq(u2Entry(U2_IDENTITY, 0, 0), dom(ZO_ONE))).toBe(true);
    expect(domEq(u2Entry(u2Gate("h"), 1, 1), dom(zo(-1n), 1))).toBe(true);
  });
});
