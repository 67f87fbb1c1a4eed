// Tests of the Solovay–Kitaev engine: errors shrink with depth, results meet eps (checked with mathjs), polylog length growth.
import { describe, expect, it } from "vitest";
import type { Matrix } from "mathjs";
import { seededRng } from "../../../src/numeric/prng.js";
import { simplifyWord } from "../../../src/synth/exact/word.js";
import { skModel, skPredictDepth, skRz, skSynthesize } from "../../../src/synth/sk/solovay-kitaev.js";
import { math, mathjsDist, mathjsU, mathjsWordMatrix, toMat2 } from "./reference.js";

/** Seeded random targets: OpenQASM U(a, b, c) with a random global phase, built with mathjs. */
function randomTargets(count: number, seed: number): Matrix[] {
  const rng = seededRng(seed);
  const ang = (): number => (rng.nextFloat() * 2 - 1) * Math.PI;
  return Array.from({ length: count }, () => mathjsU(Math.acos(1 - 2 * rng.nextFloat()), ang(), ang(), ang()));
}

/** rz(t) = diag(e^{-it/2}, e^{it/2}) (OpenQASM 3 stdgates.inc, from memory), with mathjs. */
function mathjsRz(t: number): Matrix {
  return math.matrix([
    [math.exp(math.complex(0, -t / 2)), math.complex(0, 0)],
    [math.complex(0, 0), math.exp(math.complex(0, t / 2))],
  ]);
}

/** Rounding allowance on d^2 for a mathjs product of up to ~10^4 gates (about 1e-16 per gate). */
const MATHJS_D2_SLACK = 2e-12;

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)]!;

describe("Solovay–Kitaev", () => {
  it("the error shrinks with the recursion depth", () => {
    const targets = randomTargets(6, 41);
    const errs: number[][] = [];
    for (let n = 0; n <= 4; n++) errs.push(targets.map((u) => skSynthesize(toMat2(u), 1e-30, { depth: n }).error));
    for (let n = 1; n <= 4; n++) expect(median(errs[n]!), `median at depth ${n}`).toBeLessThan(median(errs[n - 1]!));
    targets.forEach((_, i) => {
      expect(errs[2]![i]!).toBeLessThan(errs[0]![i]!);
      expect(errs[4]![i]!).toBeLessThan(errs[2]![i]!);
      expect(errs[4]![i]!).toBeLessThan(1e-4);
    });
  });

  for (const eps of [1e-2, 1e-3, 1e-4]) {
    it(`meets eps = ${eps} on seeded random targets (word matrix recomputed with mathjs)`, () => {
      for (const u of randomTargets(4, 42 + Math.round(-Math.log10(eps)))) {
        const r = skSynthesize(toMat2(u), eps);
        expect(r.error).toBeLessThanOrEqual(eps);
        // mathjs multiplies thousands of rounded gate matrices in sequence, so its product drifts from
        // unitary by about 1e-16 per gate; that shifts d^2 = 2 - |tr| by the same amount. Compare d^2.
        const d = mathjsDist(mathjsWordMatrix(r.word), u);
        expect(d * d).toBeLessThanOrEqual(eps * eps + MATHJS_D2_SLACK);
        expect(Math.abs(d * d - r.error * r.error)).toBeLessThan(MATHJS_D2_SLACK);
      }
    });
  }

  it("skRz meets eps for z-rotations (mathjs reference for rz)", () => {
    const rng = seededRng(43);
    for (let i = 0; i < 4; i++) {
      const theta = (rng.nextFloat() * 2 - 1) * Math.PI;
      const r = skRz(theta, 1e-3);
      expect(r.error).toBeLessThanOrEqual(1e-3);
      expect(mathjsDist(mathjsWordMatrix(r.word), mathjsRz(theta)) ** 2).toBeLessThanOrEqual(1e-6 + MATHJS_D2_SLACK);
    }
  });

  it("is deterministic and blind to global phase", () => {
    const [u] = randomTargets(1, 44);
    const a = skSynthesize(toMat2(u!), 1e-4);
    const b = skSynthesize(toMat2(u!), 1e-4);
    expect(b.word).toEqual(a.word);
    const phased = math.multiply(math.exp(math.complex(0, 1.234)), u!) as Matrix;
    expect(skSynthesize(toMat2(phased), 1e-4).word).toEqual(a.word);
  });

  it("returns simplified words and honours a fixed depth", () => {
    const [u] = randomTargets(1, 45);
    for (let n = 0; n <= 3; n++) {
      const r = skSynthesize(toMat2(u!), 1e-30, { depth: n });
      expect(r.depth).toBe(n);
      expect(simplifyWord(r.word)).toEqual(r.word);
    }
  });

  it("chooses a depth no deeper than the model's prediction plus two", () => {
    for (const eps of [1e-2, 1e-3, 1e-4, 1e-6]) {
      const p = skPredictDepth(eps);
      expect(Number.isFinite(p)).toBe(true);
      for (const u of randomTargets(2, 46)) {
        const r = skSynthesize(toMat2(u), eps);
        expect(r.depth).toBeLessThanOrEqual(p + 2);
        if (r.depth > 0) {
          // The first level that meets eps is returned, so the level above it did not.
          const above = skSynthesize(toMat2(u), eps, { depth: r.depth - 1 });
          expect(above.error).toBeGreaterThan(eps);
        }
      }
    }
    const m = skModel();
    expect(m.eps0).toBeGreaterThan(0);
    expect(m.eps0).toBeLessThan(0.1);
  });

  it("word length grows like log^c(1/eps) with c well above 1 (Dawson & Nielsen 2005, from memory: c -> 3.97)", () => {
    // Least-squares slope of log(length) against log(log(1/error)) over depths 1..5.
    const targets = randomTargets(3, 47);
    const xs: number[] = [];
    const ys: number[] = [];
    for (let n = 1; n <= 5; n++) {
      for (const u of targets) {
        const r = skSynthesize(toMat2(u), 1e-30, { depth: n });
        xs.push(Math.log(Math.log(1 / r.error)));
        ys.push(Math.log(r.word.length));
      }
    }
    const mx = xs.reduce((a, b) => a + b) / xs.length;
    const my = ys.reduce((a, b) => a + b) / ys.length;
    let sxy = 0;
    let sxx = 0;
    xs.forEach((x, i) => {
      sxy += (x - mx) * (ys[i]! - my);
      sxx += (x - mx) ** 2;
    });
    const c = sxy / sxx;
    expect(c).toBeGreaterThan(2);
    expect(c).toBeLessThan(8);
  });

  it("rejects a non-positive eps or a bad depth", () => {
    expect(() => skRz(0.3, 0)).toThrow(RangeError);
    expect(() => skRz(0.3, 1e-3, { depth: -1 })).toThrow(RangeError);
    expect(() => skSynthesize({ re: [1, 0, 0, 1], im: [0, 0, 0, Number.NaN] }, 1e-3)).toThrow(RangeError);
  });
});
