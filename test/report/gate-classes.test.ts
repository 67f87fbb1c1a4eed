import { describe, expect, it } from "vitest";
import { abs, complex, multiply, kron, ctranspose, matrix, identity, subtract, type Complex, type Matrix } from "mathjs";
import { gateKey, isCliffordGate, isCxGate, isOpenRotation, isTGate } from "../../src/report/gate-classes.js";
import type { Angle } from "../../src/ir/angle.js";
import { gate, lit, pi } from "./circuits.js";

// Gate matrices written from the OpenQASM 3 specification (stdgates.inc and the U definition),
// evaluated in floating point by mathjs as an independent reference. Qubit order: the first
// qubit of the gate is the most significant (control first).

type M = Matrix;
const c = (re: number, im = 0): Complex => complex(re, im);
const eix = (t: number): Complex => complex(Math.cos(t), Math.sin(t));
const m2 = (a: Complex, b: Complex, d: Complex, e: Complex): M => matrix([[a, b], [d, e]]);

function U(th: number, ph: number, la: number): M {
  return m2(c(Math.cos(th / 2)), multiply(c(-1), multiply(eix(la), Math.sin(th / 2))) as Complex, multiply(eix(ph), Math.sin(th / 2)) as Complex, multiply(eix(ph + la), Math.cos(th / 2)) as Complex);
}
const rz = (t: number): M => m2(eix(-t / 2), c(0), c(0), eix(t / 2));
const rx = (t: number): M => m2(c(Math.cos(t / 2)), c(0, -Math.sin(t / 2)), c(0, -Math.sin(t / 2)), c(Math.cos(t / 2)));
const ry = (t: number): M => m2(c(Math.cos(t / 2)), c(-Math.sin(t / 2)), c(Math.sin(t / 2)), c(Math.cos(t / 2)));
const p = (t: number): M => m2(c(1), c(0), c(0), eix(t));

/** The 4x4 controlled version of a 2x2 matrix (control = first qubit). */
function controlled(g: M): M {
  const a = g.toArray() as Complex[][];
  const z = c(0);
  return matrix([
    [c(1), z, z, z],
    [z, c(1), z, z],
    [z, z, a[0][0], a[0][1]],
    [z, z, a[1][0], a[1][1]],
  ]);
}

const X = m2(c(0), c(1), c(1), c(0));
const Y = m2(c(0), c(0, -1), c(0, 1), c(0));
const Z = m2(c(1), c(0), c(0), c(-1));
const I2 = identity(2) as M;

function paulis(n: 1 | 2): M[] {
  const one = [I2, X, Y, Z];
  if (n === 1) return one;
  const out: M[] = [];
  for (const a of one) for (const b of one) out.push(kron(a, b) as M);
  return out;
}

function close(a: M, b: M, sign: number): boolean {
  const x = a.toArray() as Complex[][];
  const y = b.toArray() as Complex[][];
  for (let i = 0; i < x.length; i++) {
    for (let j = 0; j < x.length; j++) {
      const d = subtract(x[i][j], multiply(y[i][j], sign)) as Complex;
      if ((abs(d) as unknown as number) > 1e-9) return false;
    }
  }
  return true;
}

/** Clifford test (common practice, no source): V P V^dag is +-(a Pauli) for the generators P. */
function isCliffordMatrix(v: M, n: 1 | 2): boolean {
  const all = paulis(n);
  const gens = n === 1 ? [X, Z] : [kron(X, I2), kron(Z, I2), kron(I2, X), kron(I2, Z)].map((g) => g as M);
  const vd = ctranspose(v) as M;
  return gens.every((g) => {
    const img = multiply(multiply(v, g), vd) as M;
    return all.some((q) => close(img, q, 1) || close(img, q, -1));
  });
}

const num = (a: Angle): number => Number(a.value);
const eighths = Array.from({ length: 33 }, (_, k) => pi(k - 16, 8));

describe("isCliffordGate against matrices", () => {
  it("agrees on one-parameter rotations at multiples of pi/8", () => {
    const defs: [string, (t: number) => M][] = [["rz", rz], ["rx", rx], ["ry", ry], ["p", p], ["phase", p], ["u1", p]];
    for (const [name, f] of defs) {
      for (const a of eighths) {
        expect([name, a.value, isCliffordGate(gate(name, [0], [a]))]).toEqual([name, a.value, isCliffordMatrix(f(num(a)), 1)]);
      }
    }
  });

  it("agrees on U, u3 and u2 over a grid of exact angles", () => {
    // U(theta + 2 pi, ...) = -U(theta, ...), so theta over [0, 2 pi) covers every case; phi and
    // lambda in steps of pi/8 separate the rules for even and odd multiples of pi.
    const th = [...Array.from({ length: 8 }, (_, k) => pi(k, 4)), pi(1, 8), pi(3, 8), pi(9, 4)];
    const ang = Array.from({ length: 16 }, (_, k) => pi(k, 8));
    let cliffords = 0;
    for (const a of th) {
      for (const b of ang) {
        for (const l of ang) {
          const expected = isCliffordMatrix(U(num(a), num(b), num(l)), 1);
          if (expected) cliffords++;
          expect([a.value, b.value, l.value, isCliffordGate(gate("U", [0], [a, b, l]))]).toEqual([a.value, b.value, l.value, expected]);
        }
      }
      expect(isCliffordGate(gate("u3", [0], [a, pi(1, 8), pi(1, 8)]))).toBe(isCliffordMatrix(U(num(a), Math.PI / 8, Math.PI / 8), 1));
    }
    expect(cliffords).toBeGreaterThan(0);
    for (const b of ang) for (const l of ang) expect(isCliffordGate(gate("u2", [0], [b, l]))).toBe(isCliffordMatrix(U(Math.PI / 2, num(b), num(l)), 1));
  });

  it("agrees on controlled rotations, written as crz/cp or as ctrl @", () => {
    const defs: [string, (t: number) => M][] = [["rz", rz], ["rx", rx], ["ry", ry], ["p", p]];
    for (const [name, f] of defs) {
      for (const a of eighths) {
        const expected = isCliffordMatrix(controlled(f(num(a))), 2);
        const named = name === "p" ? "cp" : "c" + name;
        expect([named, a.value, isCliffordGate(gate(named, [0, 1], [a]))]).toEqual([named, a.value, expected]);
        expect([name, a.value, isCliffordGate(gate(name, [0, 1], [a], [true]))]).toEqual([name, a.value, expected]);
        expect(isCliffordGate(gate(name, [0, 1], [a], [false]))).toBe(expected);
      }
    }
    // ctrl @ gphase(a) is p(a) on the control qubit.
    for (const a of eighths) expect(isCliffordGate(gate("gphase", [0], [a], [true]))).toBe(isCliffordMatrix(p(num(a)), 1));
  });

  it("agrees on the fixed gates", () => {
    const s = p(Math.PI / 2);
    const h = matrix([[c(Math.SQRT1_2), c(Math.SQRT1_2)], [c(Math.SQRT1_2), c(-Math.SQRT1_2)]]);
    const t = p(Math.PI / 4);
    const fixed: [string, M, 1 | 2][] = [
      ["h", h, 1],
      ["s", s, 1],
      ["sdg", ctranspose(s) as M, 1],
      ["x", X, 1],
      ["y", Y, 1],
      ["z", Z, 1],
      ["t", t, 1],
      ["tdg", ctranspose(t) as M, 1],
      ["sx", multiply(c(0.5), matrix([[c(1, 1), c(1, -1)], [c(1, -1), c(1, 1)]])) as M, 1],
      ["cx", controlled(X), 2],
      ["cy", controlled(Y), 2],
      ["cz", controlled(Z), 2],
      ["ch", controlled(h), 2],
      ["swap", matrix([[c(1), c(0), c(0), c(0)], [c(0), c(0), c(1), c(0)], [c(0), c(1), c(0), c(0)], [c(0), c(0), c(0), c(1)]]), 2],
    ];
    for (const [name, m, n] of fixed) {
      const qs = n === 1 ? [0] : [0, 1];
      expect([name, isCliffordGate(gate(name, qs))]).toEqual([name, isCliffordMatrix(m, n)]);
    }
    // ctrl @ s is controlled-S, not Clifford; ctrl @ x/y/z are.
    expect(isCliffordGate(gate("s", [0, 1], [], [true]))).toBe(isCliffordMatrix(controlled(s), 2));
    for (const [name, m] of [["x", X], ["y", Y], ["z", Z]] as const) expect(isCliffordGate(gate(name, [0, 1], [], [true]))).toBe(isCliffordMatrix(controlled(m), 2));
  });

  it("never calls an angle Clifford unless it is known exactly", () => {
    // 1.5707963267948966 is pi/2 to double precision, but written as a decimal it is not pi/2.
    expect(isCliffordGate(gate("rz", [0], [lit("1.5707963267948966")]))).toBe(false);
    expect(isCliffordGate(gate("rz", [0], [pi(1, 2)]))).toBe(true);
  });
});

describe("T, CX and rotation classes", () => {
  it("recognises T gates only uncontrolled", () => {
    expect(isTGate(gate("t", [0]))).toBe(true);
    expect(isTGate(gate("tdg", [0]))).toBe(true);
    expect(isTGate(gate("t", [0, 1], [], [true]))).toBe(false);
    expect(isTGate(gate("rz", [0], [pi(1, 4)]))).toBe(false);
  });

  it("recognises CNOTs", () => {
    expect(isCxGate(gate("cx", [0, 1]))).toBe(true);
    expect(isCxGate(gate("CX", [0, 1]))).toBe(true);
    expect(isCxGate(gate("x", [0, 1], [], [true]))).toBe(true);
    expect(isCxGate(gate("x", [0, 1], [], [false]))).toBe(false);
    expect(isCxGate(gate("cz", [0, 1]))).toBe(false);
    expect(isCxGate(gate("cx", [0, 1, 2], [], [true]))).toBe(false);
  });

  it("calls a gate an open rotation when some angle is not a known multiple of pi/4", () => {
    expect(isOpenRotation(gate("rz", [0], [pi(3, 4)]))).toBe(false);
    expect(isOpenRotation(gate("rz", [0], [pi(1, 8)]))).toBe(true);
    expect(isOpenRotation(gate("rz", [0], [lit("0.7853981633974483")]))).toBe(true);
    expect(isOpenRotation(gate("U", [0], [pi(1, 2), pi(1, 4), lit("0.1")]))).toBe(true);
    expect(isOpenRotation(gate("gphase", [], [lit("0.1")]))).toBe(false);
    expect(isOpenRotation(gate("gphase", [0], [lit("0.1")], [true]))).toBe(true);
    expect(isOpenRotation(gate("h", [0]))).toBe(false);
  });

  it("writes control modifiers in the key as OpenQASM 3 does", () => {
    expect(gateKey(gate("h", [0]))).toBe("h");
    expect(gateKey(gate("x", [0, 1, 2], [], [true, true]))).toBe("ctrl(2) @ x");
    expect(gateKey(gate("x", [0, 1, 2, 3], [], [false, true, true]))).toBe("negctrl @ ctrl(2) @ x");
  });
});
