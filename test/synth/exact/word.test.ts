// Tests for gate words: exact matrices against mathjs, facts of the trade, inverse, and simplification that never changes the matrix.
import { describe, expect, it } from "vitest";
import { complex, multiply, matrix, type Complex, type Matrix } from "mathjs";
import {
  type Gate1,
  inverseWord,
  parseWord,
  simplifyWord,
  tCount,
  wordMatrix,
  wordToString,
} from "../../../src/synth/exact/word.js";
import { U2_IDENTITY, u2Adjoint, u2ApplyGate, u2Eq, u2Lde, u2Mul, u2MulOmega } from "../../../src/synth/exact/matrix.js";
import { normalForm } from "../../../src/synth/exact/normal-form.js";
import { cliffordLookup } from "../../../src/synth/exact/clifford.js";
import { dom, domAdd, domConj, domMul, domSub, lde } from "../../../src/synth/rings/domega.js";
import { zo } from "../../../src/synth/rings/zomega.js";
import { maxDiff, randomWord, refWordMatrix, rng } from "./helpers.js";

const W = (s: string) => parseWord(s);
const eqWords = (a: readonly Gate1[], b: readonly Gate1[]) => u2Eq(wordMatrix(a), wordMatrix(b));

describe("word matrices", () => {
  it("agree with mathjs complex matrix products for random words up to length 400 (mathjs as reference)", () => {
    const r = rng(21);
    for (let n = 0; n < 300; n++) {
      const w = randomWord(r, Math.floor(r() * 400));
      expect(maxDiff(wordMatrix(w), refWordMatrix(w))).toBeLessThan(1e-9);
    }
  });

  it("circuit order: the first gate is applied first (word [h, t] is the matrix T·H)", () => {
    expect(u2Eq(wordMatrix(["h", "t"]), u2ApplyGate("t", u2ApplyGate("h", U2_IDENTITY)))).toBe(true);
    expect(eqWords(["h", "t"], ["t", "h"])).toBe(false);
  });
});

describe("facts of the trade (common practice, no source)", () => {
  it("T⁸ = I exactly, and no smaller power of T is I", () => {
    expect(eqWords(Array<Gate1>(8).fill("t"), [])).toBe(true);
    for (let n = 1; n < 8; n++) expect(eqWords(Array<Gate1>(n).fill("t"), [])).toBe(false);
  });

  it("S = T², Z = S², HZH = X, S X S† = Y, HXH = Z, H² = I, exactly", () => {
    expect(eqWords(["t", "t"], ["s"])).toBe(true);
    expect(eqWords(["s", "s"], ["z"])).toBe(true);
    expect(eqWords(["h", "z", "h"], ["x"])).toBe(true);
    expect(eqWords(["h", "x", "h"], ["z"])).toBe(true);
    // S X S† as an operator: circuit order sdg, x, s
    expect(eqWords(["sdg", "x", "s"], ["y"])).toBe(true);
    expect(eqWords(["h", "h"], [])).toBe(true);
  });

  it("HTH is a π/4 rotation about X up to phase: HTH = e^{iπ/8} rx(π/4) (OpenQASM 3 rx definition, mathjs)", () => {
    const th = Math.PI / 4;
    // rx(θ) = [[cos θ/2, -i sin θ/2], [-i sin θ/2, cos θ/2]]
    const rx = matrix([
      [complex(Math.cos(th / 2), 0), complex(0, -Math.sin(th / 2))],
      [complex(0, -Math.sin(th / 2)), complex(Math.cos(th / 2), 0)],
    ]);
    const ph = complex(Math.cos(Math.PI / 8), Math.sin(Math.PI / 8));
    const ref = multiply(ph, rx) as Matrix;
    expect(maxDiff(wordMatrix(["h", "t", "h"]), ref)).toBeLessThan(1e-14);
    // exactly: HTH commutes with X and (HTH)⁴ = X
    const v = wordMatrix(["h", "t", "h"]);
    const x = wordMatrix(["x"]);
    expect(u2Eq(u2Mul(v, x), u2Mul(x, v))).toBe(true);
    expect(eqWords(["h", "t", "h", "h", "t", "h", "h", "t", "h", "h", "t", "h"], ["x"])).toBe(true);
  });

  it("HT has infinite order, even up to phase: 2cos θ of its rotation angle is not an algebraic integer (exact)", () => {
    // For U in U(2) with |det U| = 1, |tr U|² = 2 + 2cos θ where θ is the Bloch rotation angle. If (HT)ⁿ were a
    // scalar for some n ≥ 1, e^{iθ} would be a root of unity and 2cos θ = e^{iθ} + e^{-iθ} an algebraic integer.
    // The algebraic integers of Q(√2) are Z[√2], i.e. the elements of least denominator exponent ≤ 0.
    const u = wordMatrix(["t", "h"]); // operator H·T
    const tr = domAdd(dom(u.a, u.k), dom(u.d, u.k));
    const twoCos = domSub(domMul(domConj(tr), tr), dom(zo(2n)));
    expect(twoCos).toEqual(dom(zo(-2n, -1n, 0n, 1n), 2)); // (-2 - √2)/2 = -1 - 1/√2
    expect(lde(twoCos)).toBeGreaterThan(0);
    // consistent with it: (HT)ⁿ has T-count n in normal form and is never a Clifford for n = 1..60
    let p = U2_IDENTITY;
    for (let n = 1; n <= 60; n++) {
      p = u2Mul(u, p);
      expect(normalForm(p).syllables.length).toBe(n);
      expect(cliffordLookup(p)).toBeNull();
    }
  });
});

describe("inverse and text", () => {
  it("w followed by inverse(w) is the identity exactly; inverse's matrix is the adjoint", () => {
    const r = rng(22);
    for (let n = 0; n < 200; n++) {
      const w = randomWord(r, Math.floor(r() * 100));
      expect(eqWords([...w, ...inverseWord(w)], [])).toBe(true);
      expect(u2Eq(wordMatrix(inverseWord(w)), u2Adjoint(wordMatrix(w)))).toBe(true);
      expect(tCount(inverseWord(w))).toBe(tCount(w));
      expect(parseWord(wordToString(w))).toEqual(w);
    }
    expect(() => parseWord("h q")).toThrow();
    expect(wordToString([])).toBe("");
    expect(tCount(W("t h tdg s t"))).toBe(3);
  });
});

describe("simplifyWord", () => {
  it("known rewrites", () => {
    expect(simplifyWord(W("t t"))).toEqual(W("s"));
    expect(simplifyWord(W("s s"))).toEqual(W("z"));
    expect(simplifyWord(W("t tdg"))).toEqual([]);
    expect(simplifyWord(W("h h"))).toEqual([]);
    expect(simplifyWord(W("h z h"))).toEqual(W("x"));
    expect(simplifyWord(W("h s s h"))).toEqual(W("x"));
    expect(simplifyWord(W("h x h"))).toEqual(W("z"));
    expect(simplifyWord(W("t h h t"))).toEqual(W("s"));
    expect(simplifyWord(W("t t t t t t t t"))).toEqual([]);
    expect(simplifyWord(W("t s z sdg t"))).toEqual(W("sdg")); // T^(1+2+4+6+1) = T^14 = T^6
    expect(simplifyWord(W("x t x"))).toEqual(W("x t x"));
  });

  it("never changes the exact matrix, never grows length or T-count, and is idempotent (random words)", () => {
    const r = rng(23);
    const gateSets: (readonly Gate1[])[] = [
      ["h", "s", "sdg", "t", "tdg", "x", "y", "z"],
      ["h", "t", "tdg", "z"], // more cancellation opportunities
      ["h", "x", "z", "s"],
    ];
    const forbidden = new Set(["h h", "x x", "y y", "t tdg", "tdg t", "s sdg", "sdg s", "t t", "z z", "s s"]);
    const bad: string[] = [];
    for (let n = 0; n < 1500; n++) {
      const w = randomWord(r, Math.floor(r() * 120), gateSets[n % 3]!);
      const s = simplifyWord(w);
      const ok =
        u2Eq(wordMatrix(s), wordMatrix(w)) &&
        s.length <= w.length &&
        tCount(s) <= tCount(w) &&
        wordToString(simplifyWord(s)) === wordToString(s) &&
        // no adjacent cancelling or mergeable pair survives
        s.every((g, i) => i + 1 >= s.length || !forbidden.has(`${g} ${s[i + 1]}`));
      if (!ok) bad.push(wordToString(w));
    }
    expect(bad).toEqual([]);
  });

  it("a diagonal run costs at most one T gate", () => {
    const r = rng(24);
    for (let n = 0; n < 300; n++) {
      const w = randomWord(r, 1 + Math.floor(r() * 20), ["t", "tdg", "s", "sdg", "z"]);
      const s = simplifyWord(w);
      expect(tCount(s)).toBe(tCount(w) % 2);
      expect(u2Eq(wordMatrix(s), wordMatrix(w))).toBe(true);
    }
  });

  it("simplification of a product with its phase twin: u2MulOmega is not introduced", () => {
    // simplifyWord must keep the exact phase: x z x = -z must NOT become z
    const w = W("x z x");
    const s = simplifyWord(w);
    expect(u2Eq(wordMatrix(s), wordMatrix(w))).toBe(true);
    expect(u2Eq(wordMatrix(w), u2MulOmega(wordMatrix(W("z")), 4))).toBe(true);
    expect(u2Lde(wordMatrix(s))).toBe(0);
  });
});
