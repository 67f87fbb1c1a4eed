// Tests for exact synthesis: the published operator count by T-count, T-optimality against brute force, uniqueness, round trips.
import { describe, expect, it } from "vitest";
import { type ExactU2, U2_IDENTITY, exactU2, u2ApplyGate, u2Eq, u2Key, u2MulOmega } from "../../../src/synth/exact/matrix.js";
import { type Gate1, type Word, tCount, wordMatrix, inverseWord } from "../../../src/synth/exact/word.js";
import { exactSynthesize, normalForm, normalFormWord, normalizeWord } from "../../../src/synth/exact/normal-form.js";
import { CLIFFORDS } from "../../../src/synth/exact/clifford.js";
import { zo, ZO_ONE, ZO_ZERO } from "../../../src/synth/rings/zomega.js";
import { randomWord, rng } from "./helpers.js";

/**
 * Breadth-first search over exact matrices, by T-count (a 0-1 search: H and S cost 0, T costs 1).
 * Returns, for n = 0..maxN, the operators of T-count exactly n, and the cumulative counts.
 */
function enumerateByTCount(maxN: number): { levels: ExactU2[][]; cumulative: number[] } {
  const seen = new Set<string>([u2Key(U2_IDENTITY)]);
  let frontier: ExactU2[] = [U2_IDENTITY];
  const levels: ExactU2[][] = [];
  const cumulative: number[] = [];
  for (let n = 0; n <= maxN; n++) {
    const level = frontier;
    for (let i = 0; i < level.length; i++)
      for (const g of ["h", "s"] as const) {
        const m = u2ApplyGate(g, level[i]!);
        const key = u2Key(m);
        if (!seen.has(key)) {
          seen.add(key);
          level.push(m);
        }
      }
    levels.push(level);
    cumulative.push(seen.size);
    if (n === maxN) break;
    const next: ExactU2[] = [];
    for (const m of level) {
      const t = u2ApplyGate("t", m);
      const key = u2Key(t);
      if (!seen.has(key)) {
        seen.add(key);
        next.push(t);
      }
    }
    frontier = next;
  }
  return { levels, cumulative };
}

const HEAVY = process.env.TLEDGER_HEAVY_TESTS === "1";
const MAX_COUNT_N = HEAVY ? 8 : 7;
const ENUM = enumerateByTCount(MAX_COUNT_N);

describe("operators by T-count", () => {
  it(`exactly 192·(3·2ⁿ − 2) distinct operators have T-count ≤ n, n = 0..${MAX_COUNT_N} (Giles & Selinger 2013, from memory)`, () => {
    for (let n = 0; n <= MAX_COUNT_N; n++) expect(ENUM.cumulative[n]).toBe(192 * (3 * 2 ** n - 2));
  });

  it("the normal form's T-count equals the breadth-first T-count for every operator up to T-count 6", () => {
    const bad: string[] = [];
    for (let n = 0; n <= 6; n++)
      for (const u of ENUM.levels[n]!) if (normalForm(u).syllables.length !== n) bad.push(u2Key(u));
    expect(bad).toEqual([]);
  });

  it("the synthesized word reproduces every operator up to T-count 5 exactly, with T-count n", () => {
    const bad: string[] = [];
    for (let n = 0; n <= 5; n++)
      for (const u of ENUM.levels[n]!) {
        const r = exactSynthesize(u);
        if (tCount(r.word) !== n || !u2Eq(u, u2MulOmega(wordMatrix(r.word), r.phase))) bad.push(u2Key(u));
      }
    expect(bad).toEqual([]);
  });

  it("normal forms are distinct for distinct operators and have the shape (T | ε)(HT | SHT)* C", () => {
    const seen = new Set<string>();
    const bad: string[] = [];
    let total = 0;
    for (let n = 0; n <= 5; n++)
      for (const u of ENUM.levels[n]!) {
        const nf = normalForm(u);
        const text = nf.syllables.join(" ");
        if (!/^(T ?)?((HT|SHT) ?)*$/.test(text)) bad.push(text);
        seen.add(`${text}|${nf.clifford}|${nf.phase}`);
        total++;
      }
    expect(bad).toEqual([]);
    expect(seen.size).toBe(total);
  });
});

/** Insert identities into a word at random places (so the operator is unchanged, the word is not). */
function padWithIdentities(w: readonly Gate1[], r: () => number): Gate1[] {
  // each is the identity exactly (phase included): Y·(S X S†) = I and Z·(H X H) = I
  const ids: Gate1[][] = [["h", "h"], ["t", "tdg"], ["s", "s", "s", "s"], ["sdg", "x", "s", "y"], ["t", "t", "t", "t", "t", "t", "t", "t"], ["h", "x", "h", "z"]];
  const out: Gate1[] = [];
  for (const g of w) {
    if (r() < 0.2) out.push(...ids[Math.floor(r() * ids.length)]!);
    out.push(g);
  }
  return out;
}

describe("exact synthesis of random words", () => {
  it("round trips 3000 seeded random words up to length 400: same exact matrix (phase included), T-count never larger", () => {
    const r = rng(31);
    const bad: string[] = [];
    for (let n = 0; n < 3000; n++) {
      const w = randomWord(r, Math.floor(r() * 401));
      const u = wordMatrix(w);
      const s = exactSynthesize(u);
      const ok = u2Eq(u, u2MulOmega(wordMatrix(s.word), s.phase)) && tCount(s.word) <= tCount(w) && Number.isInteger(s.phase) && s.phase >= 0 && s.phase < 8;
      if (!ok) bad.push(w.join(" "));
    }
    expect(bad).toEqual([]);
  });

  it("the normal form is unique: padding a word with identities does not change it", () => {
    const r = rng(32);
    for (let n = 0; n < 500; n++) {
      const w = randomWord(r, Math.floor(r() * 150));
      const p = padWithIdentities(w, r);
      expect(u2Eq(wordMatrix(w), wordMatrix(p))).toBe(true);
      expect(normalForm(wordMatrix(p))).toEqual(normalForm(wordMatrix(w)));
      expect(normalizeWord(p)).toEqual(normalizeWord(w));
    }
  });

  it("a word that is already a normal form keeps its T-count; a word and its inverse have equal T-count", () => {
    const r = rng(33);
    for (let n = 0; n < 300; n++) {
      // build an operator-order normal form T? (HT|SHT)^m C and write it as a circuit
      const m = Math.floor(r() * 40);
      const circuit: Gate1[] = [...CLIFFORDS[Math.floor(r() * 24)]!.word];
      for (let i = 0; i < m; i++) circuit.push(...(r() < 0.5 ? (["t", "h"] as const) : (["t", "h", "s"] as const)));
      const lead = r() < 0.5;
      if (lead) circuit.push("t");
      const u = wordMatrix(circuit);
      expect(normalForm(u).syllables.length).toBe(m + (lead ? 1 : 0));
      expect(tCount(exactSynthesize(u).word)).toBe(m + (lead ? 1 : 0));
      expect(tCount(normalizeWord(inverseWord(circuit)).word)).toBe(m + (lead ? 1 : 0));
    }
  });

  it("large denominator exponents (k up to 300, past the switch from big integers to doubles) round trip exactly", () => {
    const r = rng(36);
    for (const k of [40, 47, 48, 49, 50, 51, 60, 120, 300]) {
      // a random operator with least denominator exponent k: random syllables until k is reached
      let u = CLIFFORDS[Math.floor(r() * 24)]!.matrix;
      let t = 0;
      while (u.k < k) {
        u = u2ApplyGate("h", u2ApplyGate("t", u));
        if (r() < 0.5) u = u2ApplyGate("s", u);
        t++;
      }
      u = u2MulOmega(u, Math.floor(r() * 8));
      const s = exactSynthesize(u);
      expect(u2Eq(u, u2MulOmega(wordMatrix(s.word), s.phase))).toBe(true);
      expect(tCount(s.word)).toBe(t); // built as a normal form, so already T-optimal
    }
  });

  it("normalFormWord gives the unsimplified normal form with the same matrix", () => {
    const r = rng(34);
    for (let n = 0; n < 200; n++) {
      const u = wordMatrix(randomWord(r, 80));
      const raw = normalFormWord(normalForm(u));
      expect(u2Eq(u, u2MulOmega(wordMatrix(raw.word), raw.phase))).toBe(true);
    }
  });

  it("rejects non-unitary input", () => {
    expect(() => exactSynthesize(exactU2(zo(2n), ZO_ZERO, ZO_ZERO, ZO_ONE, 0))).toThrow(RangeError);
    expect(() => exactSynthesize(exactU2(ZO_ONE, ZO_ONE, ZO_ONE, ZO_ONE, 1))).toThrow(RangeError);
  });

  it("T-count tracks the least denominator exponent: about 2k (Kliuchnikov, Maslov & Mosca 2013, from memory)", () => {
    const r = rng(35);
    for (let n = 0; n < 300; n++) {
      const u = wordMatrix(randomWord(r, Math.floor(r() * 300)));
      const t = normalForm(u).syllables.length;
      if (u.k === 0) expect(t).toBeLessThanOrEqual(1);
      else {
        expect(t).toBeGreaterThanOrEqual(2 * u.k - 3);
        expect(t).toBeLessThanOrEqual(2 * u.k + 1);
      }
    }
  });
});

export type { Word };
