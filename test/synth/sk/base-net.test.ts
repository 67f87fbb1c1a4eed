// Tests of the base net: the right number of distinct operators per T-count, exactly the right set, and quaternions matching words.
import { describe, expect, it } from "vitest";
import { tCount } from "../../../src/synth/exact/word.js";
import { buildBaseNet, CLIFFORD_WORDS, netQuat, netWord } from "../../../src/synth/sk/base-net.js";
import { qdist, wordQuat } from "../../../src/synth/sk/quat.js";
import { blochKey, blochSetsByTCount, wordBloch } from "./reference.js";

/** Giles & Selinger 2013 (from memory): 192 (3 * 2^n - 2) operators with phase, 24 (3 * 2^n - 2) up to phase. */
const giles = (n: number): number => 24 * (3 * 2 ** n - 2);

describe("base net", () => {
  it("the 24 Clifford words are 24 distinct operators up to phase (exact Bloch matrices)", () => {
    expect(CLIFFORD_WORDS.length).toBe(24);
    const keys = new Set(CLIFFORD_WORDS.map((w) => blochKey(wordBloch(w))));
    expect(keys.size).toBe(24);
    for (const w of CLIFFORD_WORDS) expect(tCount(w)).toBe(0);
  });

  it("an independent breadth-first search reproduces 24 (3 * 2^n - 2) operators of T-count <= n", () => {
    const sets = blochSetsByTCount(4);
    sets.forEach((s, n) => expect(s.size, `n = ${n}`).toBe(n === 0 ? 24 : giles(n)));
  });

  it("the net for L = 0..4 holds exactly the operators of T-count <= L, each once (exact Bloch matrices)", () => {
    const sets = blochSetsByTCount(4);
    for (let L = 0; L <= 4; L++) {
      const net = buildBaseNet(L);
      expect(net.size).toBe(L === 0 ? 24 : giles(L));
      const keys = new Set<string>();
      for (let i = 0; i < net.size; i++) {
        const w = netWord(net, i);
        expect(tCount(w)).toBeLessThanOrEqual(L);
        keys.add(blochKey(wordBloch(w)));
      }
      expect(keys.size, `distinct operators at L = ${L}`).toBe(net.size);
      for (const k of keys) expect(sets[L]!.has(k)).toBe(true);
    }
  });

  it("every point's quaternion is its word's operator, with a canonical sign", () => {
    const net = buildBaseNet(7);
    expect(net.size).toBe(giles(7));
    for (let i = 0; i < net.size; i += 7) {
      const q = netQuat(net, i);
      expect(qdist(q, wordQuat(netWord(net, i)))).toBeLessThan(1e-13);
      const first = q.find((x) => x !== 0)!;
      expect(first).toBeGreaterThan(0);
    }
  });

  it("rejects a T-count the encoding cannot hold", () => {
    expect(() => buildBaseNet(16)).toThrow(RangeError);
    expect(() => buildBaseNet(-1)).toThrow(RangeError);
  });
});
