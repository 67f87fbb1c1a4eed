// Tests of the double-double word distance against a 140-digit reference built from the exact layer's word matrix.
import { describe, expect, it } from "vitest";
import { dec, type Dec } from "../../../src/numeric/decimal.js";
import { seededRng } from "../../../src/numeric/prng.js";
import type { ZOmega } from "../../../src/synth/rings/zomega.js";
import { GATES1, wordMatrix, type Gate1, type Word } from "../../../src/synth/exact/word.js";
import { ddQmul, ddWordDist, ddWordQuat } from "../../../src/synth/sk/dd-quat.js";
import { qdist, rzQuat, wordQuat, type Quat } from "../../../src/synth/sk/quat.js";
import { skRz } from "../../../src/synth/sk/solovay-kitaev.js";

/** The exact value of a double as a decimal (dec(x) would go through the shortest round-trip string). */
function exactDec(x: number): Dec {
  let e = 0;
  while (!Number.isInteger(x)) {
    x *= 2; // exact for doubles
    e++;
  }
  return dec(BigInt(x)).div(dec(2).pow(e));
}

/**
 * d = sqrt(2 - |tr(W^dag V)|) at 140 significant digits, W the exact matrix of the word
 * (entries (a + b w + c w^2 + d w^3) / sqrt2^k, w = e^{i pi/4}) and V the SU(2) matrix
 * [[a - i d, -c - i b], [c - i b, a + i d]] of the target quaternion scaled to unit length.
 */
function referenceDist(word: Word, q: Quat): Dec {
  const w = wordMatrix(word);
  const r2 = dec(2).sqrt();
  const scale = r2.pow(w.k);
  const entry = (z: ZOmega): [Dec, Dec] => [
    dec(z.a).plus(dec(z.b - z.d).div(r2)).div(scale),
    dec(z.c).plus(dec(z.b + z.d).div(r2)).div(scale),
  ];
  const n = q.reduce((s, x) => s.plus(exactDec(x).times(exactDec(x))), dec(0)).sqrt();
  const [a, b, c, d] = q.map((x) => exactDec(x).div(n)) as [Dec, Dec, Dec, Dec];
  const v: [Dec, Dec][] = [
    [a, d.neg()],
    [c.neg(), b.neg()],
    [c, b.neg()],
    [a, d],
  ];
  const ws = [entry(w.a), entry(w.b), entry(w.c), entry(w.d)];
  // tr(W^dag V) = sum of conj(W_ij) V_ij
  let re = dec(0);
  let im = dec(0);
  ws.forEach(([wr, wi], i) => {
    const [vr, vi] = v[i]!;
    re = re.plus(wr.times(vr).plus(wi.times(vi)));
    im = im.plus(wr.times(vi).minus(wi.times(vr)));
  });
  const abs = re.times(re).plus(im.times(im)).sqrt();
  return dec(2).minus(abs).sqrt();
}

function randomWord(seed: number, len: number): Gate1[] {
  const rng = seededRng(seed);
  return Array.from({ length: len }, () => GATES1[rng.nextU32() % GATES1.length]!);
}

describe("double-double word distance", () => {
  it("gate constants: T^8 = -1 and H^2 = -1 to double-double precision", () => {
    const t8 = ddWordQuat(Array<Gate1>(8).fill("t"));
    expect(t8[0]! + 1 + t8[1]!).toBeLessThan(1e-30);
    for (let i = 2; i < 8; i++) expect(Math.abs(t8[i]!)).toBeLessThan(1e-30);
    const h2 = ddQmul(ddWordQuat(["h"]), ddWordQuat(["h"]));
    expect(Math.abs(h2[0]! + 1) + Math.abs(h2[1]!)).toBeLessThan(1e-30);
  });

  it("agrees with the double product on short words", () => {
    for (let s = 0; s < 20; s++) {
      const w = randomWord(100 + s, 50);
      const p = ddWordQuat(w);
      expect(qdist([p[0]!, p[2]!, p[4]!, p[6]!], wordQuat(w))).toBeLessThan(1e-14);
    }
  });

  it("matches the 140-digit reference on SK words (depths 3 and 4) for rz targets", () => {
    for (const [theta, depth] of [
      [0.7, 3],
      [-2.1, 4],
    ] as const) {
      const q = rzQuat(theta);
      const r = skRz(theta, 1e-30, { depth });
      const ref = referenceDist(r.word, q);
      const got = ddWordDist(r.word, q);
      expect(Math.abs(got - ref.toNumber())).toBeLessThan(1e-15 * ref.toNumber() + 1e-25); // a few ulps of d
      expect(got).toBe(r.error);
    }
  });

  it("resolves distances near 1e-16: a word against its own rounded quaternion", () => {
    for (let s = 0; s < 4; s++) {
      const w = randomWord(200 + s, 3000);
      const q = wordQuat(w);
      const ref = referenceDist(w, q).toNumber();
      expect(ref).toBeLessThan(1e-13);
      expect(Math.abs(ddWordDist(w, q) - ref)).toBeLessThan(1e-25);
    }
  });
});
