import { describe, expect, it } from "vitest";
import { seededRng } from "../../src/numeric/prng.js";

describe("seeded generator", () => {
  it("is deterministic per seed and differs between seeds", () => {
    const a = seededRng(42);
    const b = seededRng(42);
    const c = seededRng(43);
    const sa = Array.from({ length: 20 }, () => a.nextU32());
    const sb = Array.from({ length: 20 }, () => b.nextU32());
    const sc = Array.from({ length: 20 }, () => c.nextU32());
    expect(sa).toEqual(sb);
    expect(sa).not.toEqual(sc);
  });

  it("nextBelow stays in range and is roughly uniform (chi-square over 10 cells, loose bound)", () => {
    const r = seededRng(1);
    const counts = new Array<number>(10).fill(0);
    const N = 20_000;
    for (let i = 0; i < N; i++) {
      const x = r.nextBelow(10n);
      expect(x >= 0n && x < 10n).toBe(true);
      counts[Number(x)]!++;
    }
    const chi = counts.reduce((s, c) => s + (c - N / 10) ** 2 / (N / 10), 0);
    expect(chi).toBeLessThan(40); // 9 degrees of freedom: 40 is far in the tail (common practice, no source)
    for (let i = 0; i < 200; i++) {
      const big = (1n << 100n) + 12345n;
      const x = r.nextBelow(big);
      expect(x >= 0n && x < big).toBe(true);
    }
    const f = r.nextFloat();
    expect(f >= 0 && f < 1).toBe(true);
  });
});
