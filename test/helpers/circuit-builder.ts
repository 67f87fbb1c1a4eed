// Test helper: build small IR circuits by hand, and seeded random ones.
import { seededRng } from "../../src/numeric/prng.js";
import type { Angle } from "../../src/ir/angle.js";
import type { Circuit, GateOp, Stmt } from "../../src/ir/circuit.js";
import { angleDecimal, anglePi, rational } from "../../src/ir/angle-ops.js";

export const LOC = { file: "test.qasm", line: 1, col: 1 };

export function g(name: string, qubits: number[], params: Angle[] = [], ctrl: boolean[] = []): GateOp {
  return { kind: "gate", name, params, qubits, ctrl, loc: LOC };
}

export function circuit(numQubits: number, body: Stmt[]): Circuit {
  return { numQubits, qubitRegs: [{ name: "q", start: 0, size: numQubits }], bits: [], body };
}

export const dAngle = (s: string): Angle => angleDecimal(s);
export const piAngle = (num: number, den: number): Angle => anglePi(rational(BigInt(num), BigInt(den)));

/** Seeded floats in [0, 1) from the project's one generator (numeric/prng.ts). */
export function rng(seed: number): () => number {
  const g = seededRng(seed);
  return () => g.nextFloat();
}

const ONE = ["h", "s", "sdg", "t", "tdg", "x", "y", "z"];

/** A random circuit over the decomposed basis (one-qubit Clifford+T, cx, rz with decimal or pi angles). */
export function randomBasisCircuit(seed: number, n: number, len: number, rzShare = 0.3): Circuit {
  const r = rng(seed);
  const body: Stmt[] = [];
  for (let i = 0; i < len; i++) {
    const x = r();
    const q = Math.floor(r() * n);
    if (x < rzShare) {
      const a = r() < 0.3 ? piAngle(Math.floor(r() * 16) - 8, 4) : dAngle((r() * 6 - 3).toFixed(6));
      body.push(g("rz", [q], [a]));
    } else if (x < 0.75 || n < 2) body.push(g(ONE[Math.floor(r() * ONE.length)]!, [q]));
    else {
      let t = Math.floor(r() * n);
      if (t === q) t = (q + 1) % n;
      body.push(g("cx", [q, t]));
    }
  }
  return circuit(n, body);
}
