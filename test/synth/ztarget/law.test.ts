// The T-count law the search relies on, checked against brute force.
import { describe, expect, it } from "vitest";
import { type ZOmega, zoDivisibleByDelta, zoDivisibleBySqrt2, zoMulOmega, zoNormSq } from "../../../src/synth/rings/zomega.js";
import { type ExactU2, exactU2FromColumn, u2ApplyGate, u2Key, u2Mul, u2MulOmega, U2_IDENTITY } from "../../../src/synth/exact/matrix.js";
import { exactSynthesize } from "../../../src/synth/exact/normal-form.js";
import { tCount } from "../../../src/synth/exact/word.js";

/** Key of an operator up to a global power of ω. */
function phaseFreeKey(x: ExactU2): string {
  let best = u2Key(x);
  for (let j = 1; j < 8; j++) {
    const k = u2Key(u2MulOmega(x, j));
    if (k < best) best = k;
  }
  return best;
}

/** Breadth-first search over exact matrices: T-count of every operator (up to phase) with T-count ≤ maxT. */
function bfsTCounts(maxT: number): { table: Map<string, number>; layerTotals: number[] } {
  // Cliffords up to phase: closure of {h, s}.
  const cliff: ExactU2[] = [];
  const seen = new Set<string>();
  const queue: ExactU2[] = [U2_IDENTITY];
  seen.add(phaseFreeKey(U2_IDENTITY));
  while (queue.length > 0) {
    const m = queue.shift()!;
    cliff.push(m);
    for (const g of ["h", "s"] as const) {
      const n = u2ApplyGate(g, m);
      const key = phaseFreeKey(n);
      if (!seen.has(key)) {
        seen.add(key);
        queue.push(n);
      }
    }
  }
  const table = new Map<string, number>();
  for (const c of cliff) table.set(phaseFreeKey(c), 0);
  const layerTotals = [table.size];
  let layer = cliff;
  for (let n = 1; n <= maxT; n++) {
    const next: ExactU2[] = [];
    for (const m of layer) {
      const mt = u2ApplyGate("t", m);
      for (const c of cliff) {
        const x = u2Mul(c, mt);
        const key = phaseFreeKey(x);
        if (!table.has(key)) {
          table.set(key, n);
          next.push(x);
        }
      }
    }
    layer = next;
    layerTotals.push(table.size);
  }
  return { table, layerTotals };
}

/** All x ∈ Z[ω] with |x|² ≤ 2^k and |x•|² ≤ 2^k, grouped by x†x. */
function elementsByNorm(k: number): { all: ZOmega[]; byNorm: Map<string, ZOmega[]> } {
  const bound = 2n ** BigInt(k);
  const r = Math.ceil(Math.sqrt(2 ** k) * 1.5) + 1;
  const all: ZOmega[] = [];
  const byNorm = new Map<string, ZOmega[]>();
  for (let a = -r; a <= r; a++)
    for (let b = -r; b <= r; b++)
      for (let c = -r; c <= r; c++)
        for (let d = -r; d <= r; d++) {
          const x: ZOmega = { a: BigInt(a), b: BigInt(b), c: BigInt(c), d: BigInt(d) };
          const n = zoNormSq(x);
          // |x|² = n.a + n.b√2 ≤ 2^k and |x•|² = n.a - n.b√2 ≤ 2^k  <=>  n.a + |n.b|√2 ≤ 2^k
          const s = bound - n.a;
          if (s < 0n) continue;
          const nb = n.b < 0n ? -n.b : n.b;
          if (2n * nb * nb > s * s) continue;
          all.push(x);
          const key = `${n.a},${n.b}`;
          if (!byNorm.has(key)) byNorm.set(key, []);
          byNorm.get(key)!.push(x);
        }
  return { all, byNorm };
}

/** The law of src/synth/ztarget/search.ts. */
function lawTCount(k: number, odd: boolean, u: ZOmega): number {
  if (k === 0) return odd ? 1 : 0;
  if (!odd) return 2 * k - 2;
  return zoDivisibleByDelta(u) ? 2 * k - 3 : 2 * k - 1;
}

describe("the T-count law of the search (checked, not assumed)", () => {
  it("breadth-first search reproduces 192(3·2^n - 2) operators with phase, i.e. 24(3·2^n - 2) up to phase (Giles & Selinger 2013, from memory)", () => {
    const { layerTotals } = bfsTCounts(5);
    layerTotals.forEach((total, n) => expect(total).toBe(24 * (3 * 2 ** n - 2)));
  });

  it("every unitary at level k ≤ 4 (√2 ∤ u): the best of the 8 conjugates t -> ω^j t has the law's T-count; no conjugate has fewer", () => {
    const maxT = 6;
    const { table } = bfsTCounts(maxT);
    let checkedBfs = 0;
    let checked = 0;
    for (let k = 0; k <= 4; k++) {
      const { all, byNorm } = elementsByNorm(k);
      const twoK = 2n ** BigInt(k);
      for (const u of all) {
        if (k >= 1 && zoDivisibleBySqrt2(u)) continue;
        const n = zoNormSq(u);
        const ts = byNorm.get(`${twoK - n.a},${-n.b}`) ?? [];
        for (const t of ts.slice(0, 3)) {
          for (const odd of [false, true]) {
            const law = lawTCount(k, odd, u);
            let best = Infinity;
            for (let j = 0; j < 8; j++) {
              const U = exactU2FromColumn(u, zoMulOmega(t, j), odd ? 1 : 0, k);
              const tc = tCount(exactSynthesize(U).word);
              best = Math.min(best, tc);
              // independent of the normal form: breadth-first T-counts where they reach
              const bfs = table.get(phaseFreeKey(U));
              if (bfs !== undefined) {
                expect(tc).toBe(bfs);
                checkedBfs++;
              } else expect(tc).toBeGreaterThan(maxT);
            }
            expect(best).toBe(law);
            checked++;
          }
        }
      }
    }
    expect(checked).toBeGreaterThan(1000);
    expect(checkedBfs).toBeGreaterThan(5000);
  });
});
