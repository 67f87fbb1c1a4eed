// Tests for the Clifford table: 24 up to phase, 192 with phase, shortest words, Pauli conjugation, lookup and products.
import { describe, expect, it } from "vitest";
import { CLIFFORDS, CLIFFORD_COUNT_WITH_PHASE, cliffordLookup, cliffordProduct } from "../../../src/synth/exact/clifford.js";
import { type ExactU2, u2Adjoint, u2Eq, u2Key, u2Lde, u2Mul, u2MulOmega, u2PhaseBetween } from "../../../src/synth/exact/matrix.js";
import { type Gate1, type Word, wordMatrix } from "../../../src/synth/exact/word.js";

/** All words over `gates` of length exactly n. */
function allWords(gates: readonly Gate1[], n: number): Word[] {
  let out: Gate1[][] = [[]];
  for (let i = 0; i < n; i++) out = out.flatMap((w) => gates.map((g) => [...w, g]));
  return out;
}

function samePhaseFree(x: ExactU2, y: ExactU2): boolean {
  return u2PhaseBetween(x, y) !== null;
}

describe("the Clifford table", () => {
  it("has 24 elements, pairwise distinct up to phase; with the 8 phases, 192 distinct matrices", () => {
    // 24 single-qubit Cliffords up to phase (common practice, no source)
    expect(CLIFFORDS.length).toBe(24);
    const keys = new Set<string>();
    for (const c of CLIFFORDS) for (let j = 0; j < 8; j++) keys.add(u2Key(u2MulOmega(c.matrix, j)));
    expect(keys.size).toBe(CLIFFORD_COUNT_WITH_PHASE);
    expect(CLIFFORDS[0]!.hsWord).toEqual([]);
  });

  it("every entry's matrix is that of its H/S word, and of its short word up to the recorded phase", () => {
    for (const c of CLIFFORDS) {
      expect(u2Eq(c.matrix, wordMatrix(c.hsWord))).toBe(true);
      expect(u2Eq(c.matrix, u2MulOmega(wordMatrix(c.word), c.wordPhase))).toBe(true);
      expect(c.hsWord.every((g) => g === "h" || g === "s")).toBe(true);
      expect(c.word.every((g) => g !== "t" && g !== "tdg")).toBe(true);
      expect(u2Lde(c.matrix)).toBeLessThanOrEqual(1);
    }
  });

  it("words are shortest: no shorter word over the same gates gives the same Clifford up to phase (brute force)", () => {
    for (const c of CLIFFORDS) {
      for (let n = 0; n < c.hsWord.length; n++)
        for (const w of allWords(["h", "s"], n)) expect(samePhaseFree(wordMatrix(w), c.matrix)).toBe(false);
      for (let n = 0; n < c.word.length; n++)
        for (const w of allWords(["h", "s", "sdg", "x", "y", "z"], n)) expect(samePhaseFree(wordMatrix(w), c.matrix)).toBe(false);
    }
  });

  it("each Clifford maps the Paulis to Paulis up to phase under conjugation (common practice, no source)", () => {
    const paulis = (["x", "y", "z"] as const).map((p) => wordMatrix([p]));
    for (const c of CLIFFORDS)
      for (const p of paulis) {
        const q = u2Mul(u2Mul(c.matrix, p), u2Adjoint(c.matrix));
        expect(paulis.some((r) => samePhaseFree(q, r))).toBe(true);
      }
    // T does not: T X T† is (X + Y)/√2
    const t = wordMatrix(["t"]);
    const q = u2Mul(u2Mul(t, paulis[0]!), u2Adjoint(t));
    expect(paulis.some((r) => samePhaseFree(q, r))).toBe(false);
  });

  it("lookup recovers index and phase of every Clifford with phase, and rejects non-Cliffords", () => {
    for (const c of CLIFFORDS)
      for (let j = 0; j < 8; j++) expect(cliffordLookup(u2MulOmega(c.matrix, j))).toEqual({ index: c.index, phase: j });
    expect(cliffordLookup(wordMatrix(["t"]))).toBeNull();
    expect(cliffordLookup(wordMatrix(["h", "t", "h"]))).toBeNull();
    expect(cliffordLookup(wordMatrix(["t", "h", "t", "h", "t"]))).toBeNull();
  });

  it("the product table agrees with exact matrix products", () => {
    for (const x of CLIFFORDS)
      for (const y of CLIFFORDS) {
        const { index, phase } = cliffordProduct(x.index, y.index);
        expect(u2Eq(u2Mul(x.matrix, y.matrix), u2MulOmega(CLIFFORDS[index]!.matrix, phase))).toBe(true);
      }
  });

  it("ω·I is a Clifford: (SH)³ = ω I (common practice, no source)", () => {
    const sh3 = wordMatrix(["h", "s", "h", "s", "h", "s"]);
    expect(cliffordLookup(sh3)).toEqual({ index: 0, phase: 1 });
  });
});
