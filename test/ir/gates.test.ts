// Tests of the canonical gate table: unitarity, matrices against the OpenQASM 3 definitions (via mathjs), inverses, powers, controlled names.
import { describe, expect, it } from "vitest";
import type { Complex, Matrix } from "mathjs";
import {
  GATES,
  adjointMatrix,
  complexMatrixMul,
  controlledMatrix,
  controlledName,
  gateInfo,
  identityMatrix,
  inverseGate,
  kronMatrix,
  powerGate,
  type CMatrix,
} from "../../src/ir/gates.js";
import { angleDecimal, anglePi, rational } from "../../src/ir/angle-ops.js";
import type { Angle } from "../../src/ir/angle.js";
import { diffUpToPhase, fromMath, math, maxDiff, seeded } from "./dense.js";

const TOL = 1e-12;
const rnd = seeded(20240601);
const randomAngle = (): number => (rnd() * 2 - 1) * 2 * Math.PI;
const asAngle = (x: number): Angle => angleDecimal(x.toPrecision(17));
const num = (a: Angle): number => Number(a.value);
const mat = (name: string, params: readonly Angle[]): CMatrix => gateInfo(name)!.matrix(params.map(num));

// ---- independent references, written from the OpenQASM 3 specification (stdgates.inc, from memory) with mathjs ----
const c = (re: number, im = 0): Complex => math.complex(re, im);
const eix = (t: number): Complex => math.exp(c(0, t)) as Complex;
const M = (rows: (number | Complex)[][]): Matrix => math.matrix(rows.map((r) => r.map((v) => (typeof v === "number" ? c(v) : v))));
const mul = (...ms: Matrix[]): Matrix => ms.reduce((a, b) => math.multiply(a, b) as Matrix);
const scale = (s: Complex, m: Matrix): Matrix => math.multiply(s, m) as Matrix;
const I2 = M([[1, 0], [0, 1]]);
const PX = M([[0, 1], [1, 0]]);
const PY = M([[0, c(0, -1)], [c(0, 1), 0]]);
const PZ = M([[1, 0], [0, -1]]);
/** OpenQASM 3 builtin U(a,b,c) = [[cos(a/2), -e^{ic} sin(a/2)], [e^{ib} sin(a/2), e^{i(b+c)} cos(a/2)]] (spec, "Built-in gates"). */
const refU = (a: number, b: number, cc: number): Matrix =>
  M([
    [Math.cos(a / 2), math.multiply(-Math.sin(a / 2), eix(cc)) as Complex],
    [math.multiply(Math.sin(a / 2), eix(b)) as Complex, math.multiply(Math.cos(a / 2), eix(b + cc)) as Complex],
  ]);
/** exp(-i t/2 P) via mathjs's matrix exponential (the spec defines rx, ry, rz and the Pauli-pair rotations this way). */
const expRot = (p: Matrix, t: number): Matrix => math.expm(scale(c(0, -t / 2), p)) as Matrix;
/** ctrl @ G: identity on the control's |0> block, G on its |1> block (spec, "Quantum gate modifiers"). */
const refCtrl = (g: Matrix, n = 1): Matrix => {
  let m = g;
  for (let k = 0; k < n; k++) {
    const d = m.size()[0]!;
    const out = math.identity(2 * d) as Matrix;
    const z = math.zeros(2 * d, 2 * d) as Matrix;
    const res = math.add(z, out) as Matrix;
    for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) res.set([d + i, d + j], m.get([i, j]));
    m = res;
  }
  return m;
};
const refP = (l: number): Matrix => refU(0, 0, l); // p(l) = ctrl @ gphase(l) = U(0,0,l) (spec)
const H = refU(Math.PI / 2, 0, Math.PI);
/** The principal square root of X (spec: sx = pow(1/2) @ x): X = H Z H, eigenvalue -1 -> i. */
const SX = mul(H, M([[1, 0], [0, c(0, 1)]]), H);
const CXref = refCtrl(refU(Math.PI, 0, Math.PI));
const SWAPref = mul(CXref, mul(M([[1, 0, 0, 0], [0, 0, 0, 1], [0, 0, 1, 0], [0, 1, 0, 0]])), CXref); // cx a,b; cx b,a; cx a,b

const REFERENCES: Readonly<Record<string, (p: number[]) => Matrix>> = {
  U: ([a, b, cc]) => refU(a!, b!, cc!),
  gphase: ([t]) => M([[eix(t!)]]),
  id: () => refU(0, 0, 0),
  x: () => refU(Math.PI, 0, Math.PI),
  y: () => refU(Math.PI, Math.PI / 2, Math.PI / 2),
  z: () => refP(Math.PI),
  h: () => H,
  s: () => refP(Math.PI / 2),
  sdg: () => refP(-Math.PI / 2),
  t: () => refP(Math.PI / 4),
  tdg: () => refP(-Math.PI / 4),
  sx: () => SX,
  sxdg: () => math.ctranspose(SX) as Matrix,
  p: ([l]) => refP(l!),
  u1: ([l]) => refU(0, 0, l!),
  rx: ([t]) => expRot(PX, t!),
  ry: ([t]) => expRot(PY, t!),
  rz: ([t]) => expRot(PZ, t!),
  u2: ([f, l]) => scale(eix(-(f! + l!) / 2), refU(Math.PI / 2, f!, l!)),
  u3: ([t, f, l]) => scale(eix(-(f! + l!) / 2), refU(t!, f!, l!)),
  cx: () => CXref,
  cy: () => refCtrl(refU(Math.PI, Math.PI / 2, Math.PI / 2)),
  cz: () => refCtrl(refP(Math.PI)),
  ch: () => refCtrl(H),
  csx: () => refCtrl(SX),
  cp: ([l]) => refCtrl(refP(l!)),
  crx: ([t]) => refCtrl(expRot(PX, t!)),
  cry: ([t]) => refCtrl(expRot(PY, t!)),
  crz: ([t]) => refCtrl(expRot(PZ, t!)),
  // cu(t,f,l,g) c, q { p(g) c; ctrl @ U(t,f,l) c, q; } (spec)
  cu: ([t, f, l, g]) => mul(refCtrl(refU(t!, f!, l!)), math.kron(refP(g!), I2) as Matrix),
  swap: () => SWAPref,
  ccx: () => refCtrl(PX, 2),
  cswap: () => refCtrl(SWAPref),
  c3x: () => refCtrl(PX, 3),
  c4x: () => refCtrl(PX, 4),
  c3sqrtx: () => refCtrl(SX, 3),
  c3sqrtxdg: () => refCtrl(math.ctranspose(SX) as Matrix, 3),
  // Pauli-pair rotations exp(-i t/2 P(x)Q) (common practice, no source; not in stdgates.inc)
  rxx: ([t]) => expRot(math.kron(PX, PX) as Matrix, t!),
  ryy: ([t]) => expRot(math.kron(PY, PY) as Matrix, t!),
  rzz: ([t]) => expRot(math.kron(PZ, PZ) as Matrix, t!),
  rzx: ([t]) => expRot(math.kron(PZ, PX) as Matrix, t!),
};
/** Checked elsewhere: the relative-phase Toffolis against qelib1's definitions (test/frontend/libraries.test.ts). */
const CHECKED_BY_DEFINITION = new Set(["rccx", "rc3x", "rc3xdg"]);

const randomParams = (n: number): number[] => Array.from({ length: n }, randomAngle);

describe("gate table", () => {
  it("has every gate of stdgates.inc and the builtins", () => {
    // OpenQASM 3 specification, stdgates.inc (from memory)
    for (const g of ["U", "gphase", "p", "x", "y", "z", "h", "s", "sdg", "t", "tdg", "sx", "rx", "ry", "rz", "cx", "cy", "cz", "cp", "crx", "cry", "crz", "ch", "swap", "ccx", "cswap", "cu", "id", "u1", "u2", "u3"])
      expect(GATES.has(g), g).toBe(true);
  });

  it("every matrix is unitary of the right size", () => {
    for (const info of GATES.values()) {
      for (let trial = 0; trial < 3; trial++) {
        const m = info.matrix(randomParams(info.numParams));
        expect(m.dim, info.name).toBe(1 << info.numQubits);
        expect(maxDiff(complexMatrixMul(m, adjointMatrix(m)), identityMatrix(m.dim)), info.name).toBeLessThan(TOL);
      }
    }
  });

  it("every matrix equals the OpenQASM 3 definition (mathjs reference)", () => {
    for (const info of GATES.values()) {
      if (CHECKED_BY_DEFINITION.has(info.name)) continue;
      const ref = REFERENCES[info.name];
      expect(ref, `reference for ${info.name}`).toBeDefined();
      for (let trial = 0; trial < 4; trial++) {
        const p = randomParams(info.numParams);
        expect(maxDiff(info.matrix(p), fromMath(ref!(p))), `${info.name}(${p.join(",")})`).toBeLessThan(1e-12);
      }
    }
  });

  it("keeps global phases that matter under ctrl (u3 is not U; rz is not p)", () => {
    // OpenQASM 3 spec: u3 carries gphase(-(phi+lambda)/2), rz carries gphase(-theta/2)
    const p = [0.7, 0.3, -1.1];
    expect(maxDiff(mat("u3", p.map(asAngle)), mat("U", p.map(asAngle)))).toBeGreaterThan(0.1);
    expect(maxDiff(mat("rz", [asAngle(0.9)]), mat("p", [asAngle(0.9)]))).toBeGreaterThan(0.1);
    expect(diffUpToPhase(mat("rz", [asAngle(0.9)]), mat("p", [asAngle(0.9)]))).toBeLessThan(TOL);
  });
});

describe("inverseGate", () => {
  it("gives the exact inverse matrix of every gate", () => {
    for (const info of GATES.values()) {
      for (let trial = 0; trial < 3; trial++) {
        const params = randomParams(info.numParams).map(asAngle);
        const inv = inverseGate(info.name, params);
        const prod = complexMatrixMul(mat(inv.name, inv.params), mat(info.name, params));
        expect(maxDiff(prod, identityMatrix(prod.dim)), `${info.name} -> ${inv.name}`).toBeLessThan(1e-12);
      }
    }
  });

  it("keeps exact pi-multiples exact", () => {
    const inv = inverseGate("rz", [anglePi(rational(3n, 8n))]);
    expect(inv.params[0]!.pi).toEqual(rational(-3n, 8n));
    expect(inverseGate("s", [])).toEqual({ name: "sdg", params: [] });
    const u = inverseGate("U", [anglePi(rational(1n, 2n)), anglePi(rational(1n, 3n)), anglePi(rational(1n, 5n))]);
    expect(u.params.map((a) => a.pi)).toEqual([rational(-1n, 2n), rational(-1n, 5n), rational(-1n, 3n)]);
  });
});

/** The k-th power of a matrix, k an integer (negative: of the inverse). */
function matPow(m: CMatrix, k: number): CMatrix {
  let base = k < 0 ? adjointMatrix(m) : m;
  let out = identityMatrix(m.dim);
  for (let i = 0; i < Math.abs(k); i++) out = complexMatrixMul(out, base);
  return out;
}

describe("powerGate", () => {
  const rotations = ["gphase", "p", "u1", "rx", "ry", "rz", "cp", "crx", "cry", "crz", "rxx", "ryy", "rzz", "rzx"];

  it("integer powers of rotations equal the matrix power", () => {
    for (const name of rotations)
      for (const k of [-3, -1, 0, 2, 5]) {
        const params = [asAngle(randomAngle())];
        const r = powerGate(name, params, rational(BigInt(k)));
        expect(r, name).not.toBeNull();
        expect(maxDiff(mat(r!.name, r!.params), matPow(mat(name, params), k)), `${name}^${k}`).toBeLessThan(1e-11);
      }
  });

  it("rational powers of rotations are roots: (G^(a/b))^b = G^a", () => {
    for (const name of rotations)
      for (const [a, b] of [[1, 2], [-2, 3], [3, 4]] as const) {
        const params = [asAngle(randomAngle())];
        const r = powerGate(name, params, rational(BigInt(a), BigInt(b)))!;
        expect(maxDiff(matPow(mat(r.name, r.params), b), matPow(mat(name, params), a)), `${name}^(${a}/${b})`).toBeLessThan(1e-11);
      }
  });

  it("follows the standard's roots: s = z^(1/2), t = s^(1/2), sx = x^(1/2)", () => {
    // OpenQASM 3 spec, stdgates.inc: s = pow(1/2) @ z, t = pow(1/2) @ s, sx = pow(1/2) @ x, sdg = inv @ pow(1/2) @ z
    const half = rational(1n, 2n);
    const cases: [string, string][] = [["z", "s"], ["s", "t"], ["x", "sx"]];
    for (const [g, root] of cases) {
      const r = powerGate(g, [], half)!;
      expect(maxDiff(mat(r.name, r.params), mat(root, [])), `${g}^(1/2)`).toBeLessThan(TOL);
    }
    const r = powerGate("z", [], rational(-1n, 2n))!;
    expect(maxDiff(mat(r.name, r.params), mat("sdg", []))).toBeLessThan(TOL);
    expect(r.params[0]!.pi).toEqual(rational(-1n, 2n));
  });

  it("returns null for integer powers of other gates and for roots without a closed form", () => {
    expect(powerGate("h", [], rational(2n))).toBeNull();
    expect(powerGate("cx", [], rational(3n))).toBeNull();
    expect(powerGate("h", [], rational(1n, 2n))).toBeNull();
    expect(powerGate("U", [asAngle(1), asAngle(2), asAngle(3)], rational(1n, 3n))).toBeNull();
  });

  it("keeps exactness: rz(pi/3)^(3/4) = rz(pi/4) exactly", () => {
    const r = powerGate("rz", [anglePi(rational(1n, 3n))], rational(3n, 4n))!;
    expect(r.params[0]!.pi).toEqual(rational(1n, 4n));
  });
});

describe("controlledName", () => {
  it("names a gate with exactly the controlled matrix", () => {
    const bases = ["x", "y", "z", "h", "p", "u1", "rz", "rx", "ry", "swap", "sx", "sxdg", "gphase", "cx", "ccx", "c3x", "cz", "p", "csx"];
    let named = 0;
    for (const base of bases) {
      const info = gateInfo(base)!;
      for (let n = 1; n <= 4; n++) {
        const cn = controlledName(base, n);
        if (cn === null) continue;
        named++;
        const params = randomParams(info.numParams);
        const want = controlledMatrix(info.matrix(params), new Array<boolean>(n).fill(true));
        expect(maxDiff(gateInfo(cn)!.matrix(params), want), `ctrl^${n} ${base} = ${cn}`).toBeLessThan(TOL);
      }
    }
    expect(named).toBeGreaterThan(20);
  });

  it("follows the standard chains and refuses where there is no name", () => {
    expect(controlledName("x", 1)).toBe("cx");
    expect(controlledName("cx", 1)).toBe("ccx");
    expect(controlledName("x", 4)).toBe("c4x");
    expect(controlledName("x", 5)).toBeNull();
    expect(controlledName("gphase", 1)).toBe("p");
    expect(controlledName("gphase", 2)).toBe("cp");
    expect(controlledName("sx", 3)).toBe("c3sqrtx");
    expect(controlledName("U", 1)).toBeNull();
    expect(controlledName("h", 2)).toBeNull();
    expect(controlledName("nosuchgate", 1)).toBeNull();
  });
});

describe("matrix helpers", () => {
  it("kron and controlledMatrix agree with mathjs", () => {
    const a = gateInfo("U")!.matrix([0.3, 1.2, -0.4]);
    const b = gateInfo("ry")!.matrix([0.8]);
    expect(maxDiff(kronMatrix(a, b), fromMath(math.kron(toM(a), toM(b)) as Matrix))).toBeLessThan(TOL);
    // negctrl @ G = |0><0| (x) G + |1><1| (x) I (spec, "Quantum gate modifiers")
    const want = math.add(math.kron(M([[1, 0], [0, 0]]), toM(b)), math.kron(M([[0, 0], [0, 1]]), I2)) as Matrix;
    expect(maxDiff(controlledMatrix(b, [false]), fromMath(want))).toBeLessThan(TOL);
    // ctrl @ negctrl @ G: G acts where the first control is 1 and the second 0
    const want2 = math.add(math.kron(M([[0, 0], [0, 1]]), math.kron(M([[1, 0], [0, 0]]), toM(b))), math.kron(M([[1, 0], [0, 0]]), math.identity(4) as Matrix), math.kron(M([[0, 0], [0, 1]]), math.kron(M([[0, 0], [0, 1]]), I2))) as Matrix;
    expect(maxDiff(controlledMatrix(b, [true, false]), fromMath(want2))).toBeLessThan(TOL);
  });
});

function toM(a: CMatrix): Matrix {
  const rows: Complex[][] = [];
  for (let i = 0; i < a.dim; i++) rows.push(Array.from({ length: a.dim }, (_, j) => c(a.re[i * a.dim + j]!, a.im[i * a.dim + j]!)));
  return math.matrix(rows);
}
