// Tests for exact rotations by multiples of π/4: matrices against the OpenQASM 3 definitions (mathjs), exactly where the phase allows.
import { describe, expect, it } from "vitest";
import { complex, matrix, type Complex, type Matrix } from "mathjs";
import { exactRotationWord, exactUWord, type ExactRotationGate } from "../../../src/synth/exact/exact-angles.js";
import { type ExactU2, u2Eq, u2Gate, u2Mul, u2MulOmega, exactU2 } from "../../../src/synth/exact/matrix.js";
import { tCount, wordMatrix } from "../../../src/synth/exact/word.js";
import { ZO_ONE, ZO_ZERO, zoMulOmega } from "../../../src/synth/rings/zomega.js";
import type { Rational } from "../../../src/ir/angle.js";
import { maxDiff } from "./helpers.js";

const e = (x: number): Complex => complex(Math.cos(x), Math.sin(x));
const c0 = complex(0, 0);
const c1 = complex(1, 0);

/** Gate matrices as defined in the OpenQASM 3 specification (stdgates.inc and the built-in U), in mathjs. */
function refGate(gate: ExactRotationGate, t: number): Matrix {
  const cs = Math.cos(t / 2);
  const sn = Math.sin(t / 2);
  switch (gate) {
    case "rz":
      return matrix([[e(-t / 2), c0], [c0, e(t / 2)]]);
    case "rx":
      return matrix([[complex(cs, 0), complex(0, -sn)], [complex(0, -sn), complex(cs, 0)]]);
    case "ry":
      return matrix([[complex(cs, 0), complex(-sn, 0)], [complex(sn, 0), complex(cs, 0)]]);
    case "p":
      return matrix([[c1, c0], [c0, e(t)]]);
  }
}
function refU(th: number, ph: number, la: number): Matrix {
  const cs = Math.cos(th / 2);
  const sn = Math.sin(th / 2);
  const m = (z: Complex, r: number) => complex(z.re * r, z.im * r);
  return matrix([[complex(cs, 0), m(e(la), -sn)], [m(e(ph), sn), m(e(ph + la), cs)]]);
}

const rat = (num: number, den = 1): Rational => ({ num: BigInt(num), den: BigInt(den) });
const ratValue = (r: Rational) => Number(r.num) / Number(r.den);
const GATES: readonly ExactRotationGate[] = ["rz", "rx", "ry", "p"];

/** e^{ikπ/8}·gate(kπ/4), which lies in D[ω]: diag(1, ω^k) conjugated as each gate's definition says. */
function exactShifted(gate: ExactRotationGate, k: number): ExactU2 {
  const d = exactU2(ZO_ONE, ZO_ZERO, ZO_ZERO, zoMulOmega(ZO_ONE, k), 0);
  const h = u2Gate("h");
  switch (gate) {
    case "rz":
    case "p":
      return d;
    case "rx":
      return u2Mul(h, u2Mul(d, h));
    case "ry":
      return u2Mul(u2Gate("s"), u2Mul(h, u2Mul(d, u2Mul(h, u2Gate("sdg")))));
  }
}

describe("exactRotationWord", () => {
  it("matches the OpenQASM 3 matrices times the recorded phase for k = -16..16 (mathjs as reference)", () => {
    for (const gate of GATES)
      for (let k = -16; k <= 16; k++) {
        const r = exactRotationWord(gate, rat(k, 4))!;
        expect(r).not.toBeNull();
        const ph = ratValue(r.phaseRadiansPiMultiple);
        expect(maxDiff(wordMatrix(r.word), refGate(gate, (k * Math.PI) / 4), ph)).toBeLessThan(1e-12);
        // phase reduced into [0, 2), in lowest terms
        expect(ph).toBeGreaterThanOrEqual(0);
        expect(ph).toBeLessThan(2);
        expect(r.phaseRadiansPiMultiple.den > 0n).toBe(true);
      }
  });

  it("is exact: e^{ikπ/8}·gate(kπ/4) = ω^j · word exactly, with j from the recorded phase, k = 0..15", () => {
    for (const gate of GATES)
      for (let k = 0; k < 16; k++) {
        const r = exactRotationWord(gate, rat(k, 4))!;
        // gate = e^{iπφ} W and gate = e^{-ikπ/8} E  =>  E = e^{iπ(φ + k/8)} W; φ + k/8 must be a multiple of 1/4
        const shift = gate === "p" ? 0 : k / 8;
        const quarters = (ratValue(r.phaseRadiansPiMultiple) + shift) * 4;
        expect(Math.abs(quarters - Math.round(quarters))).toBeLessThan(1e-9);
        const j = ((Math.round(quarters) % 8) + 8) % 8;
        expect(u2Eq(exactShifted(gate, k), u2MulOmega(wordMatrix(r.word), j))).toBe(true);
      }
  });

  it("costs k mod 2 T gates (multiples of π/2 are Clifford; common practice, no source)", () => {
    for (const gate of GATES)
      for (let k = 0; k < 16; k++) expect(tCount(exactRotationWord(gate, rat(k, 4))!.word)).toBe(k % 2);
    expect(exactRotationWord("rz", rat(0))!.word).toEqual([]);
    expect(exactRotationWord("p", rat(1, 4))!.word).toEqual(["t"]);
    expect(exactRotationWord("p", rat(1, 4))!.phaseRadiansPiMultiple).toEqual(rat(0));
    // rz(π/4) = e^{-iπ/8} T: phase -1/8 ≡ 15/8
    expect(exactRotationWord("rz", rat(1, 4))!.phaseRadiansPiMultiple).toEqual(rat(15, 8));
  });

  it("returns null unless the angle is a multiple of π/4", () => {
    for (const gate of GATES) {
      expect(exactRotationWord(gate, rat(1, 8))).toBeNull();
      expect(exactRotationWord(gate, rat(1, 3))).toBeNull();
      expect(exactRotationWord(gate, rat(7, 1000))).toBeNull();
    }
    expect(exactRotationWord("rz", rat(5, 2))).not.toBeNull();
    expect(exactRotationWord("rz", rat(-3, 4))).not.toBeNull();
  });
});

describe("exactUWord", () => {
  it("matches the OpenQASM 3 U(θ, φ, λ) times the recorded phase for all θ, φ, λ in {0, π/4, ..., 7π/4} (mathjs as reference)", () => {
    for (let a = 0; a < 8; a++)
      for (let b = 0; b < 8; b++)
        for (let c = 0; c < 8; c++) {
          const r = exactUWord(rat(a, 4), rat(b, 4), rat(c, 4))!;
          const ref = refU((a * Math.PI) / 4, (b * Math.PI) / 4, (c * Math.PI) / 4);
          expect(maxDiff(wordMatrix(r.word), ref, ratValue(r.phaseRadiansPiMultiple))).toBeLessThan(1e-12);
        }
  });

  it("U(π/2, 0, π) = H exactly, and null for a non-quarter angle", () => {
    const r = exactUWord(rat(1, 2), rat(0), rat(1))!;
    expect(r.word).toEqual(["h"]);
    expect(r.phaseRadiansPiMultiple).toEqual(rat(0));
    expect(exactUWord(rat(1, 2), rat(1, 8), rat(1))).toBeNull();
  });
});
