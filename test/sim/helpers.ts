// Test helpers for the simulator: build small IR circuits by hand and at random (seeded), and dense reference matrices.
import type { Angle } from "../../src/ir/angle.js";
import type { Circuit, GateOp, Stmt } from "../../src/ir/circuit.js";
import { gateInfo, type CMatrix } from "../../src/ir/gates.js";
import { seededRng, type Rng } from "../../src/sim/rng.js";

export const LOC = { file: "test.qasm", line: 1, col: 1 };

/** An angle holding a double exactly (the shortest round-trip decimal). */
export function num(x: number): Angle {
  return { pi: null, value: x.toString() };
}

export function gate(name: string, qubits: number[], params: number[] = [], ctrl: boolean[] = []): GateOp {
  return { kind: "gate", name, params: params.map(num), qubits, ctrl, loc: LOC };
}

export function circuit(numQubits: number, body: Stmt[]): Circuit {
  return { numQubits, qubitRegs: [{ name: "q", start: 0, size: numQubits }], bits: [], body };
}

const ONE_QUBIT = ["h", "x", "y", "z", "s", "sdg", "t", "tdg", "sx", "rx", "ry", "rz", "p", "U"];
const TWO_QUBIT = ["cx", "cz", "swap", "crz", "cp", "rzz", "rxx", "cu"];

function pick<T>(rng: Rng, xs: readonly T[]): T {
  return xs[Math.floor(rng.uniform() * xs.length)];
}

function distinct(rng: Rng, n: number, k: number): number[] {
  const qs = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rng.uniform() * (i + 1));
    [qs[i], qs[j]] = [qs[j], qs[i]];
  }
  return qs.slice(0, k);
}

/** A random circuit from a mixed gate set, with occasional ctrl/negctrl modifiers and gphase. */
export function randomCircuit(seed: number, numQubits: number, numGates: number): Circuit {
  const rng = seededRng(seed);
  const body: Stmt[] = [];
  for (let g = 0; g < numGates; g++) {
    const r = rng.uniform();
    let name: string;
    if (numQubits >= 2 && r < 0.3) name = pick(rng, TWO_QUBIT);
    else if (r < 0.33) name = "gphase";
    else name = pick(rng, ONE_QUBIT);
    if (numQubits >= 3 && r > 0.9) name = pick(rng, ["ccx", "cswap"]);
    const info = gateInfo(name);
    if (!info) throw new Error(`no gate ${name}`);
    const maxCtrl = numQubits - info.numQubits;
    const nCtrl = maxCtrl > 0 && rng.uniform() < 0.15 ? 1 + Math.floor(rng.uniform() * Math.min(2, maxCtrl)) : 0;
    const qs = distinct(rng, numQubits, info.numQubits + nCtrl);
    const ctrl = Array.from({ length: nCtrl }, () => rng.uniform() < 0.7);
    const params = Array.from({ length: info.numParams }, () => (rng.uniform() * 2 - 1) * 2 * Math.PI);
    body.push(gate(name, qs, params, ctrl));
  }
  return circuit(numQubits, body);
}

/** Max |a_ij - b_ij| over all entries. */
export function maxEntryDiff(a: CMatrix, b: CMatrix): number {
  let m = 0;
  for (let i = 0; i < a.re.length; i++) m = Math.max(m, Math.hypot(a.re[i] - b.re[i], a.im[i] - b.im[i]));
  return m;
}

/** A Haar-like random unitary from Gram-Schmidt on a seeded complex Gaussian matrix (test-side code, independent of src/sim). */
export function randomUnitary(seed: number, dim: number): CMatrix {
  const rng = seededRng(seed);
  const re = new Float64Array(dim * dim);
  const im = new Float64Array(dim * dim);
  for (let k = 0; k < dim * dim; k++) [re[k], im[k]] = rng.gaussianPair();
  // Orthonormalise the columns (modified Gram-Schmidt, twice for stability).
  for (let pass = 0; pass < 2; pass++) {
    for (let j = 0; j < dim; j++) {
      for (let i = 0; i < j; i++) {
        let pr = 0;
        let pi = 0;
        for (let r = 0; r < dim; r++) {
          // <col i | col j>
          pr += re[r * dim + i] * re[r * dim + j] + im[r * dim + i] * im[r * dim + j];
          pi += re[r * dim + i] * im[r * dim + j] - im[r * dim + i] * re[r * dim + j];
        }
        for (let r = 0; r < dim; r++) {
          re[r * dim + j] -= pr * re[r * dim + i] - pi * im[r * dim + i];
          im[r * dim + j] -= pr * im[r * dim + i] + pi * re[r * dim + i];
        }
      }
      let nn = 0;
      for (let r = 0; r < dim; r++) nn += re[r * dim + j] ** 2 + im[r * dim + j] ** 2;
      const inv = 1 / Math.sqrt(nn);
      for (let r = 0; r < dim; r++) {
        re[r * dim + j] *= inv;
        im[r * dim + j] *= inv;
      }
    }
  }
  return { dim, re, im };
}

/** Q diag(e^{i phases}) Q^dag: a unitary with exactly the given eigenphases (up to rounding). */
export function unitaryWithPhases(q: CMatrix, phases: readonly number[]): CMatrix {
  const n = q.dim;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sr = 0;
      let si = 0;
      for (let k = 0; k < n; k++) {
        // Q[i][k] e^{i p_k} conj(Q[j][k])
        const ar = q.re[i * n + k];
        const ai = q.im[i * n + k];
        const br = q.re[j * n + k];
        const bi = -q.im[j * n + k];
        const c = Math.cos(phases[k]);
        const s = Math.sin(phases[k]);
        const xr = ar * c - ai * s;
        const xi = ar * s + ai * c;
        sr += xr * br - xi * bi;
        si += xr * bi + xi * br;
      }
      re[i * n + j] = sr;
      im[i * n + j] = si;
    }
  }
  return { dim: n, re, im };
}

/** The smallest arc holding the given phases, by brute force over every phase as the arc's start (test-side reference). */
export function arcOfPhases(phases: readonly number[]): number {
  const TWO_PI = 2 * Math.PI;
  const norm = (x: number): number => ((x % TWO_PI) + TWO_PI) % TWO_PI;
  let best = Infinity;
  for (const start of phases) {
    let span = 0;
    for (const p of phases) span = Math.max(span, norm(p - start));
    best = Math.min(best, span);
  }
  return best;
}
