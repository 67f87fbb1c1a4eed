// Tests of the state-vector and unitary simulators: known states, qubit order, controls, gphase, both paths agreeing, mathjs references.
import { describe, expect, test } from "vitest";
import { all, create, type Complex, type Matrix } from "mathjs";
import type { Stmt } from "../../src/ir/circuit.js";
import { controlledMatrix, gateInfo, identityMatrix, kronMatrix, type CMatrix } from "../../src/ir/gates.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { circuitOps } from "../../src/sim/ops.js";
import { seededRng } from "../../src/sim/rng.js";
import { applyOp, simulateState, zeroState, type Amplitudes } from "../../src/sim/statevector.js";
import { circuitAdjointTimes, circuitUnitary } from "../../src/sim/unitary.js";
import { circuit, gate, LOC, maxEntryDiff, randomCircuit, randomUnitary } from "./helpers.js";

const math = create(all);
const S = Math.SQRT1_2;

function expectState(got: Amplitudes, want: [number, number][], tol = 1e-14): void {
  expect(got.re.length).toBe(want.length);
  want.forEach(([r, i], k) => {
    expect(Math.abs(got.re[k] - r)).toBeLessThan(tol);
    expect(Math.abs(got.im[k] - i)).toBeLessThan(tol);
  });
}

describe("known states (common practice, no source)", () => {
  test("Bell state: h q0; cx q0, q1 gives (|00> + |11>)/sqrt2", () => {
    const st = simulateState(circuit(2, [gate("h", [0]), gate("cx", [0, 1])]));
    expectState(st, [[S, 0], [0, 0], [0, 0], [S, 0]]);
  });

  test("GHZ on 5 qubits", () => {
    const body: Stmt[] = [gate("h", [0])];
    for (let q = 1; q < 5; q++) body.push(gate("cx", [q - 1, q]));
    const st = simulateState(circuit(5, body));
    const want: [number, number][] = Array.from({ length: 32 }, () => [0, 0]);
    want[0] = [S, 0];
    want[31] = [S, 0];
    expectState(st, want);
  });

  test("qubit 0 is the most significant bit: x q0 on 3 qubits gives |100> = index 4", () => {
    const st = simulateState(circuit(3, [gate("x", [0])]));
    expect(st.re[4]).toBe(1);
    const st2 = simulateState(circuit(3, [gate("x", [2])]));
    expect(st2.re[1]).toBe(1);
  });

  test("one gate on qubits 0..k-1 in order has the gate's own matrix as the circuit unitary", () => {
    for (const [name, params] of [
      ["cx", []],
      ["crz", [0.7]],
      ["rxx", [1.1]],
      ["ccx", []],
      ["cswap", []],
      ["U", [0.3, -1.2, 2.2]],
    ] as [string, number[]][]) {
      const info = gateInfo(name)!;
      const qs = Array.from({ length: info.numQubits }, (_, i) => i);
      const u = circuitUnitary(circuit(info.numQubits, [gate(name, qs, params)]));
      expect(maxEntryDiff(u, info.matrix(params))).toBeLessThan(1e-15);
    }
  });

  test("negctrl: negctrl @ x q0, q1 flips q1 only when q0 is |0>", () => {
    const c = circuit(2, [gate("x", [0, 1], [], [false])]);
    const u = circuitUnitary(c);
    // columns: |00> -> |01>, |01> -> |00>, |10> -> |10>, |11> -> |11>
    const perm = [1, 0, 2, 3];
    perm.forEach((row, col) => expect(u.re[row * 4 + col]).toBe(1));
  });

  test("gphase: a global phase alone; under ctrl it is a phase gate (OpenQASM 3 spec: ctrl @ gphase(a) = p(a))", () => {
    const st = simulateState(circuit(2, [gate("h", [1]), gate("gphase", [], [0.9])]));
    expectState(st, [[S * Math.cos(0.9), S * Math.sin(0.9)], [S * Math.cos(0.9), S * Math.sin(0.9)], [0, 0], [0, 0]]);
    const cg = circuitUnitary(circuit(1, [gate("gphase", [0], [0.9], [true])]));
    expect(maxEntryDiff(cg, gateInfo("p")!.matrix([0.9]))).toBeLessThan(1e-15);
    const ncg = circuitUnitary(circuit(2, [gate("gphase", [1, 0], [0.4], [true, false])]));
    // phase e^{0.4i} exactly on |q0 q1> = |01> (q1 = 1, q0 = 0): index 1
    for (let k = 0; k < 4; k++) {
      expect(ncg.re[k * 4 + k]).toBeCloseTo(k === 1 ? Math.cos(0.4) : 1, 15);
      expect(ncg.im[k * 4 + k]).toBeCloseTo(k === 1 ? Math.sin(0.4) : 0, 15);
    }
  });
});

/** Permutation gates act on bit strings: the reference moves bits classically (test-side code). */
function classicalImage(body: Stmt[], n: number, input: number): number {
  let bits = Array.from({ length: n }, (_, q) => (input >> (n - 1 - q)) & 1);
  for (const s of body) {
    if (s.kind !== "gate") continue;
    const nc = s.ctrl.length;
    const on = s.ctrl.every((want, i) => bits[s.qubits[i]] === (want ? 1 : 0));
    if (!on) continue;
    const t = s.qubits.slice(nc);
    bits = bits.slice();
    if (s.name === "x") bits[t[0]] ^= 1;
    else if (s.name === "cx") bits[t[1]] ^= bits[t[0]];
    else if (s.name === "ccx") bits[t[2]] ^= bits[t[0]] & bits[t[1]];
    else if (s.name === "swap") [bits[t[0]], bits[t[1]]] = [bits[t[1]], bits[t[0]]];
    else if (s.name === "cswap") {
      if (bits[t[0]]) [bits[t[1]], bits[t[2]]] = [bits[t[2]], bits[t[1]]];
    } else throw new Error(s.name);
  }
  return bits.reduce((acc, b) => acc * 2 + b, 0);
}

describe("qubit placement against classical bit moves", () => {
  test("random permutation circuits on 5 qubits, any qubit order, with ctrl/negctrl", () => {
    const rng = seededRng(77);
    const names: [string, number][] = [["x", 1], ["cx", 2], ["ccx", 3], ["swap", 2], ["cswap", 3]];
    for (let trial = 0; trial < 10; trial++) {
      const n = 5;
      const body: Stmt[] = [];
      for (let g = 0; g < 25; g++) {
        const [name, k] = names[Math.floor(rng.uniform() * names.length)];
        const nc = Math.floor(rng.uniform() * (n - k + 1) * 0.6);
        const qs = Array.from({ length: n }, (_, i) => i);
        for (let i = n - 1; i > 0; i--) {
          const j = Math.floor(rng.uniform() * (i + 1));
          [qs[i], qs[j]] = [qs[j], qs[i]];
        }
        body.push(gate(name, qs.slice(0, k + nc), [], Array.from({ length: nc }, () => rng.uniform() < 0.5)));
      }
      const u = circuitUnitary(circuit(n, body));
      for (let col = 0; col < 32; col++) {
        const row = classicalImage(body, n, col);
        for (let r = 0; r < 32; r++) {
          expect(u.re[r * 32 + col]).toBe(r === row ? 1 : 0);
          expect(u.im[r * 32 + col]).toBe(0);
        }
      }
    }
  });
});

function toMath(a: CMatrix): Matrix {
  const rows: Complex[][] = [];
  for (let i = 0; i < a.dim; i++) {
    const row: Complex[] = [];
    for (let j = 0; j < a.dim; j++) row.push(math.complex(a.re[i * a.dim + j], a.im[i * a.dim + j]));
    rows.push(row);
  }
  return math.matrix(rows);
}

function fromMath(m: Matrix): CMatrix {
  const arr = m.toArray() as (number | Complex)[][];
  return {
    dim: arr.length,
    re: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? z : z.re))),
    im: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? 0 : z.im))),
  };
}

describe("unitary against mathjs (independent reference)", () => {
  test("gates on consecutive qubits: product of I (x) G (x) I built with mathjs kron and multiply", () => {
    const rng = seededRng(5);
    const n = 4;
    const oneQ = ["h", "t", "sx", "rx", "ry", "rz", "U", "y"];
    for (let trial = 0; trial < 4; trial++) {
      const body: Stmt[] = [];
      let ref: Matrix = math.identity(16) as Matrix;
      for (let g = 0; g < 20; g++) {
        const two = rng.uniform() < 0.4;
        const name = two ? ["cx", "crz", "swap", "rzz"][Math.floor(rng.uniform() * 4)] : oneQ[Math.floor(rng.uniform() * oneQ.length)];
        const info = gateInfo(name)!;
        const ctrlOn = !two && rng.uniform() < 0.3 ? [rng.uniform() < 0.5] : [];
        const k = info.numQubits + ctrlOn.length;
        const q0 = Math.floor(rng.uniform() * (n - k + 1));
        const params = Array.from({ length: info.numParams }, () => rng.uniform() * 6 - 3);
        body.push(gate(name, Array.from({ length: k }, (_, i) => q0 + i), params, ctrlOn));
        const gm = ctrlOn.length ? controlledMatrix(info.matrix(params), ctrlOn) : info.matrix(params);
        const full = math.kron(math.kron(math.identity(2 ** q0) as Matrix, toMath(gm)), math.identity(2 ** (n - q0 - k)) as Matrix);
        ref = math.multiply(full, ref) as Matrix;
      }
      expect(maxEntryDiff(circuitUnitary(circuit(n, body)), fromMath(ref))).toBeLessThan(1e-12);
    }
  });

  test("rx, ry, rzz, rxx match mathjs expm of their generators (OpenQASM 3 stdgates definitions)", () => {
    const X = math.matrix([[0, 1], [1, 0]]);
    const Y = math.matrix([[0, math.complex(0, -1)], [math.complex(0, 1), 0]]);
    const Z = math.matrix([[1, 0], [0, -1]]);
    const expm = (t: number, gen: Matrix): CMatrix => fromMath(math.expm(math.multiply(math.complex(0, -t / 2), gen) as Matrix));
    const t = 0.83;
    expect(maxEntryDiff(circuitUnitary(circuit(1, [gate("rx", [0], [t])])), expm(t, X))).toBeLessThan(1e-13);
    expect(maxEntryDiff(circuitUnitary(circuit(1, [gate("ry", [0], [t])])), expm(t, Y))).toBeLessThan(1e-13);
    expect(maxEntryDiff(circuitUnitary(circuit(2, [gate("rzz", [0, 1], [t])])), expm(t, math.kron(Z, Z) as Matrix))).toBeLessThan(1e-13);
    // rxx on qubits (1, 0): X (x) X is symmetric in the two qubits.
    expect(maxEntryDiff(circuitUnitary(circuit(2, [gate("rxx", [1, 0], [t])])), expm(t, math.kron(X, X) as Matrix))).toBeLessThan(1e-13);
  });
});

function matVec(u: CMatrix, x: Amplitudes): Amplitudes {
  const n = u.dim;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      re[i] += u.re[i * n + j] * x.re[j] - u.im[i * n + j] * x.im[j];
      im[i] += u.re[i * n + j] * x.im[j] + u.im[i * n + j] * x.re[j];
    }
  return { re, im };
}

function randomState(seed: number, dim: number): Amplitudes {
  const rng = seededRng(seed);
  const re = new Float64Array(dim);
  const im = new Float64Array(dim);
  let s = 0;
  for (let k = 0; k < dim; k++) {
    [re[k], im[k]] = rng.gaussianPair();
    s += re[k] ** 2 + im[k] ** 2;
  }
  return { re: re.map((x) => x / Math.sqrt(s)), im: im.map((x) => x / Math.sqrt(s)) };
}

describe("state-vector and unitary paths agree", () => {
  test("random circuits (mixed gates, controls, gphase): U psi = simulateState(c, psi)", () => {
    for (let seed = 1; seed <= 8; seed++) {
      const n = 2 + (seed % 4);
      const c = randomCircuit(seed, n, 60);
      const u = circuitUnitary(c);
      const psi = randomState(seed + 100, 2 ** n);
      const a = matVec(u, psi);
      const b = simulateState(c, psi);
      expect(maxEntryDiff({ dim: 1, re: a.re, im: a.im }, { dim: 1, re: b.re, im: b.im })).toBeLessThan(1e-12);
      // Column 0 of U is the state from |0...0>.
      const z = simulateState(c);
      for (let r = 0; r < 2 ** n; r++) {
        expect(Math.abs(z.re[r] - u.re[r * 2 ** n])).toBeLessThan(1e-12);
        expect(Math.abs(z.im[r] - u.im[r * 2 ** n])).toBeLessThan(1e-12);
      }
    }
  });

  test("fusing one-qubit runs changes nothing beyond rounding", () => {
    for (let seed = 20; seed < 24; seed++) {
      const c = randomCircuit(seed, 4, 120);
      expect(maxEntryDiff(circuitUnitary(c, { fuse: true }), circuitUnitary(c, { fuse: false }))).toBeLessThan(1e-12);
      expect(circuitOps(c, { fuse: true }).length).toBeLessThan(circuitOps(c, { fuse: false }).length);
    }
  });

  test("every kernel shape gives the dense answer: ops applied to I vs a plain matrix product", () => {
    // Dense 2^n matrices of each op built with kron and a test-side embedding (qubits permuted by a reference gather).
    const rng = seededRng(9);
    const n = 4;
    const mats: [string, number[]][] = [["rz", [0.5]], ["x", []], ["y", []], ["h", []], ["rxx", [0.4]], ["swap", []], ["ccx", []], ["cu", [0.1, 0.2, 0.3, 0.4]], ["rc3x", []]];
    // Fully dense random unitaries on 1, 2 and 3 qubits too (no zero or one entries to skip).
    const dense = [1, 2, 3].map((k) => ({ name: `dense${k}`, numQubits: k, numParams: 0, matrix: () => randomUnitary(60 + k, 2 ** k) }));
    for (const [name, params] of [...mats, ["dense1", []], ["dense2", []], ["dense3", []]] as [string, number[]][]) {
      const info = gateInfo(name) ?? dense.find((d) => d.name === name)!;
      const k = info.numQubits;
      for (let trial = 0; trial < 3; trial++) {
        const qs = Array.from({ length: n }, (_, i) => i);
        for (let i = n - 1; i > 0; i--) {
          const j = Math.floor(rng.uniform() * (i + 1));
          [qs[i], qs[j]] = [qs[j], qs[i]];
        }
        const nc = Math.min(n - k, trial);
        const ctrlOn = Array.from({ length: nc }, () => rng.uniform() < 0.5);
        const targets = qs.slice(nc, nc + k);
        const controls = qs.slice(0, nc);
        const u = identityMatrix(16);
        applyOp(u, n, 16, { matrix: info.matrix(params), targets, controls, ctrlOn });
        // Reference: G' = controlled(G) (x) I on the wires (controls, targets, rest), then conjugate by the wire permutation.
        const order = [...controls, ...targets, ...qs.slice(nc + k)];
        const g = kronMatrix(nc ? controlledMatrix(info.matrix(params), ctrlOn) : info.matrix(params), identityMatrix(2 ** (n - nc - k)));
        const toLocal = (idx: number): number => order.reduce((acc, q) => acc * 2 + ((idx >> (n - 1 - q)) & 1), 0);
        for (let r = 0; r < 16; r++)
          for (let c = 0; c < 16; c++) {
            const e = toLocal(r) * 16 + toLocal(c);
            expect(Math.abs(u.re[r * 16 + c] - g.re[e])).toBeLessThan(1e-14);
            expect(Math.abs(u.im[r * 16 + c] - g.im[e])).toBeLessThan(1e-14);
          }
      }
    }
  });

  test("random circuits give unitary matrices: U^dag U = I", () => {
    for (let seed = 40; seed < 44; seed++) {
      const c = randomCircuit(seed, 5, 200);
      const w = circuitAdjointTimes(c, c);
      expect(maxEntryDiff(w, identityMatrix(32))).toBeLessThan(1e-12);
      const u = circuitUnitary(c);
      let worst = 0;
      for (let i = 0; i < 32; i++)
        for (let j = 0; j < 32; j++) {
          let sr = 0;
          let si = 0;
          for (let k = 0; k < 32; k++) {
            sr += u.re[k * 32 + i] * u.re[k * 32 + j] + u.im[k * 32 + i] * u.im[k * 32 + j];
            si += u.re[k * 32 + i] * u.im[k * 32 + j] - u.im[k * 32 + i] * u.re[k * 32 + j];
          }
          worst = Math.max(worst, Math.hypot(sr - (i === j ? 1 : 0), si));
        }
      expect(worst).toBeLessThan(1e-12);
    }
  });
});

describe("statements that are not gates", () => {
  const bad = (s: Stmt, where: { line: number; col: number } = s.loc): void => {
    const c = circuit(2, [gate("h", [0]), s]);
    let err: unknown;
    try {
      circuitUnitary(c);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(DiagnosticError);
    const d = (err as DiagnosticError).diagnostics[0];
    expect(d.line).toBe(where.line);
    expect(d.col).toBe(where.col);
    expect(d.message).toMatch(/not a unitary/);
  };
  const at = { file: "lab.qasm", line: 7, col: 3 };

  test("measure, reset, if and while are refused with their position", () => {
    bad({ kind: "measure", qubit: 1, bit: { reg: "c", index: 0 }, loc: at });
    bad({ kind: "reset", qubit: 0, loc: at });
    bad({ kind: "if", cond: { k: "bool", value: true }, then: [], else: [], loc: at });
    bad({ kind: "while", cond: { k: "bool", value: false }, body: [], loc: at });
    // inside a box: the diagnostic points at the reset, not at the box
    bad({ kind: "box", duration: null, body: [{ kind: "reset", qubit: 0, loc: at }], loc: { ...at, line: 6 } }, at);
  });

  test("barrier, delay, pragma and annotation are skipped; box bodies are entered", () => {
    const c = circuit(2, [
      { kind: "barrier", qubits: [0, 1], loc: LOC },
      { kind: "pragma", text: "lab keep", loc: LOC },
      { kind: "box", duration: "10ns", body: [gate("h", [0]), { kind: "delay", duration: "5ns", qubits: [0], loc: LOC }], loc: LOC },
      { kind: "annotation", text: "tag", loc: LOC },
      gate("cx", [0, 1]),
    ]);
    expectState(simulateState(c), [[S, 0], [0, 0], [0, 0], [S, 0]]);
  });

  test("malformed gates are diagnostics: unknown name, wrong arity, bad qubits", () => {
    expect(() => circuitUnitary(circuit(2, [gate("nosuch", [0])]))).toThrow(DiagnosticError);
    expect(() => circuitUnitary(circuit(2, [gate("rz", [0])]))).toThrow(/parameter/);
    expect(() => circuitUnitary(circuit(2, [gate("cx", [0, 0])]))).toThrow(/twice/);
    expect(() => circuitUnitary(circuit(2, [gate("x", [2])]))).toThrow(/outside/);
    expect(() => circuitUnitary(circuit(2, [gate("x", [0, 1])]))).toThrow(/needs 1 qubit/);
  });

  test("size limits: the unitary stops at 10 qubits, the state vector at 22", () => {
    expect(() => circuitUnitary(circuit(11, []))).toThrow(/11 qubits/);
    expect(() => simulateState(circuit(23, []))).toThrow(/23 qubits/);
    expect(zeroState(3).re[0]).toBe(1);
  });
});
