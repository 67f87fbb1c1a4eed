// The Euler route: synthU(a, b, c) within eps of OpenQASM 3's U(a, b, c), checked with mathjs.
import { describe, expect, it } from "vitest";
import { complex, matrix, subtract, multiply, type Complex, type Matrix } from "mathjs";
import { synthU } from "../../src/synth/index.js";
import type { Angle } from "../../src/ir/angle.js";
import { seededRng } from "../../src/numeric/prng.js";
import { opNorm, wordMatrixRef } from "./ztarget/mathref.js";

const c = (re: number, im = 0): Complex => complex(re, im);
const cis = (x: number): Complex => c(Math.cos(x), Math.sin(x));
/** U(a,b,c) = [[cos(a/2), -e^{ic} sin(a/2)], [e^{ib} sin(a/2), e^{i(b+c)} cos(a/2)]] (OpenQASM 3 specification). */
function uRef(a: number, b: number, cc: number): Matrix {
  const ca = Math.cos(a / 2);
  const sa = Math.sin(a / 2);
  return matrix([
    [c(ca), multiply(-sa, cis(cc)) as Complex],
    [multiply(sa, cis(b)) as Complex, multiply(ca, cis(b + cc)) as Complex],
  ]);
}
function check(params: [Angle, Angle, Angle], abc: [number, number, number], eps: number): void {
  const r = synthU(params, eps.toString());
  expect(Number(r.error)).toBeLessThanOrEqual(eps);
  const W = multiply(cis(Number(r.globalPhase)), wordMatrixRef(r.word)) as Matrix;
  const d = opNorm(subtract(W, uRef(...abc)) as Matrix);
  // the returned phase need not be the optimal one, but it is within the bound plus rounding
  expect(d).toBeLessThanOrEqual(2 * eps + 1e-12);
  expect(Number(r.error)).toBeLessThanOrEqual(d + 1e-12);
}
const dec = (x: number): Angle => ({ pi: null, value: x.toString() });
const piq = (num: bigint, den: bigint): Angle => ({ pi: { num, den }, value: ((Number(num) * Math.PI) / Number(den)).toString() });

describe("synthU by the Euler route", () => {
  it("lands within eps of U(a, b, c) for seeded generic angles (mathjs check)", () => {
    const rng = seededRng(17);
    for (const eps of [1e-2, 1e-5, 1e-9]) {
      for (let i = 0; i < 3; i++) {
        const abc = [0, 1, 2].map(() => Number((rng.nextFloat() * 6 - 3).toFixed(14))) as [number, number, number];
        const r = synthU([dec(abc[0]), dec(abc[1]), dec(abc[2])], eps.toString());
        expect(r.method).toBe("euler");
        check([dec(abc[0]), dec(abc[1]), dec(abc[2])], abc, eps);
      }
    }
  });

  it("short-circuits exact parts: all-exact U is exact with error 0; a = 0 and a = π need one rotation", () => {
    const h = synthU([piq(1n, 2n), piq(0n, 1n), piq(1n, 1n)], "1e-10"); // U(π/2, 0, π) = H
    expect(h.error).toBe("0");
    expect(h.method).toBe("exact");
    expect(h.tCount).toBe(0);
    check([piq(1n, 2n), piq(0n, 1n), piq(1n, 1n)], [Math.PI / 2, 0, Math.PI], 1e-10);
    const t = synthU([piq(0n, 1n), piq(0n, 1n), piq(1n, 4n)], "1e-10"); // U(0, 0, π/4) = T
    expect(t.error).toBe("0");
    expect(t.tCount).toBe(1);
    // a = 0: U = e^{i(b+c)/2} rz(b + c): one rotation of about 3 log2(1/eps) T gates
    const one = synthU([piq(0n, 1n), dec(0.3), dec(0.4)], "1e-8");
    const three = synthU([dec(0.2), dec(0.3), dec(0.4)], "1e-8");
    expect(one.tCount).toBeLessThan(three.tCount / 2);
    check([piq(0n, 1n), dec(0.3), dec(0.4)], [0, 0.3, 0.4], 1e-8);
    check([piq(1n, 1n), dec(0.3), dec(-1.4)], [Math.PI, 0.3, -1.4], 1e-8);
    check([piq(-1n, 1n), dec(2.1), dec(0.4)], [-Math.PI, 2.1, 0.4], 1e-8);
    check([piq(2n, 1n), dec(0.3), dec(0.4)], [2 * Math.PI, 0.3, 0.4], 1e-8);
    // one exact rotation among three: the other two share the budget
    check([piq(1n, 4n), dec(0.3), dec(0.4)], [Math.PI / 4, 0.3, 0.4], 1e-6);
  });
});
