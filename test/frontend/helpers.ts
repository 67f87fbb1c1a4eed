// Test helpers for the front end: IR without locations, a small unitary builder, mathjs reference matrices.
import { complex, kron as mkron, multiply, matrix, expm, identity, type Complex, type Matrix } from "mathjs";
import { readdirSync, readFileSync } from "node:fs";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import { parseQasmFile } from "../../src/frontend/frontend.js";
import { controlledMatrix, gateInfo, type CMatrix } from "../../src/ir/gates.js";
import { angleToNumber } from "../../src/ir/angle-ops.js";

/** The IR as plain data without source locations (bigints as strings), for deep comparison. */
export function withoutLocations(x: unknown): unknown {
  return JSON.parse(JSON.stringify(x, (k, v) => (typeof v === "bigint" ? `${v}n` : k === "loc" ? undefined : v)));
}

/** The gate operations of a circuit body (no blocks, no measurements), for unitary checks. */
function gateOps(body: readonly Stmt[]): Extract<Stmt, { kind: "gate" }>[] {
  return body.filter((s): s is Extract<Stmt, { kind: "gate" }> => s.kind === "gate");
}

/**
 * The unitary of a circuit's top-level gates, from the gate table's matrices (qubit 0 is the most
 * significant bit of the basis index), as a row-major complex array.
 */
export function circuitMatrix(c: Circuit): { re: number[]; im: number[]; dim: number } {
  const n = c.numQubits;
  const dim = 2 ** n;
  let re = new Array<number>(dim * dim).fill(0);
  let im = new Array<number>(dim * dim).fill(0);
  for (let i = 0; i < dim; i++) re[i * dim + i] = 1;
  for (const op of gateOps(c.body)) {
    const info = gateInfo(op.name);
    if (!info) throw new Error(`no gate ${op.name}`);
    let m: CMatrix = info.matrix(op.params.map(angleToNumber));
    if (op.ctrl.length > 0) m = controlledMatrix(m, op.ctrl);
    const k = op.qubits.length;
    if (op.name === "gphase" && k === 0) {
      const ph = complex(m.re[0]!, m.im[0]!);
      for (let i = 0; i < dim * dim; i++) {
        const z = multiply(ph, complex(re[i]!, im[i]!)) as Complex;
        re[i] = z.re;
        im[i] = z.im;
      }
      continue;
    }
    // new = G * old, with G acting on the listed qubits.
    const nre = new Array<number>(dim * dim).fill(0);
    const nim = new Array<number>(dim * dim).fill(0);
    const bitOf = (q: number): number => n - 1 - q;
    for (let row = 0; row < dim; row++) {
      let sub = 0;
      for (let j = 0; j < k; j++) sub = (sub << 1) | ((row >> bitOf(op.qubits[j]!)) & 1);
      for (let s2 = 0; s2 < 2 ** k; s2++) {
        const gre = m.re[sub * m.dim + s2]!;
        const gim = m.im[sub * m.dim + s2]!;
        if (gre === 0 && gim === 0) continue;
        let src = row;
        for (let j = 0; j < k; j++) {
          const b = bitOf(op.qubits[j]!);
          const v = (s2 >> (k - 1 - j)) & 1;
          src = (src & ~(1 << b)) | (v << b);
        }
        for (let col = 0; col < dim; col++) {
          const ore = re[src * dim + col]!;
          const oim = im[src * dim + col]!;
          nre[row * dim + col]! += gre * ore - gim * oim;
          nim[row * dim + col]! += gre * oim + gim * ore;
        }
      }
    }
    re = nre;
    im = nim;
  }
  return { re, im, dim };
}

/** Largest entry-wise distance between a circuit's unitary and a mathjs reference matrix (exact phase). */
export function distanceTo(u: { re: number[]; im: number[]; dim: number }, ref: Matrix): number {
  const arr = ref.toArray() as unknown as (Complex | number)[][];
  let worst = 0;
  for (let r = 0; r < u.dim; r++) {
    for (let c = 0; c < u.dim; c++) {
      const z = arr[r]![c]!;
      const zr = typeof z === "number" ? z : z.re;
      const zi = typeof z === "number" ? 0 : z.im;
      worst = Math.max(worst, Math.hypot(u.re[r * u.dim + c]! - zr, u.im[r * u.dim + c]! - zi));
    }
  }
  return worst;
}

// Reference matrices from the OpenQASM 3 specification's definitions, built with mathjs only.
const i = complex(0, 1);
export const M = {
  I: identity(2) as Matrix,
  X: matrix([[0, 1], [1, 0]]),
  Y: matrix([[0, complex(0, -1)], [i, 0]]),
  Z: matrix([[1, 0], [0, -1]]),
  H: multiply(1 / Math.SQRT2, matrix([[1, 1], [1, -1]])) as Matrix,
  S: matrix([[1, 0], [0, i]]),
  T: matrix([[1, 0], [0, complex({ r: 1, phi: Math.PI / 4 })]]),
  /** exp(-i t P / 2) for a Pauli (or Pauli product) matrix P. */
  rot: (P: Matrix, t: number): Matrix => expm(multiply(complex(0, -t / 2), P) as Matrix),
  p: (l: number): Matrix => matrix([[1, 0], [0, complex({ r: 1, phi: l })]]),
  /** The matrix with `n` leading controls (on |1>, or on |0> where pos[k] is false). */
  ctrl: (U: Matrix, pos: readonly boolean[]): Matrix => {
    const d = U.size()[0]!;
    const n = pos.length;
    const D = d * 2 ** n;
    const out = (identity(D) as Matrix).toArray() as unknown as (number | Complex)[][];
    let sel = 0;
    for (const b of pos) sel = (sel << 1) | (b ? 1 : 0);
    const u = U.toArray() as unknown as (number | Complex)[][];
    for (let r = 0; r < d; r++) for (let c = 0; c < d; c++) out[sel * d + r]![sel * d + c] = u[r]![c]!;
    return matrix(out as never);
  },
  kron: (...ms: Matrix[]): Matrix => ms.reduce((a, b) => mkron(a, b) as Matrix),
  phase: (t: number, U: Matrix): Matrix => multiply(complex({ r: 1, phi: t }), U) as Matrix,
  mul: (...ms: Matrix[]): Matrix => ms.reduce((a, b) => multiply(a, b) as Matrix),
};

/** name=value lines of a params file, as FrontendOptions.params. */
export function readParams(path: string): Record<string, string> {
  return Object.fromEntries(
    readFileSync(path, "utf8")
      .split("\n")
      .filter((l) => l.trim() !== "")
      .map((l) => [l.slice(0, l.indexOf("=")), l.slice(l.indexOf("=") + 1)]),
  );
}

export const GOOD = readdirSync("fixtures")
  .filter((f) => f.endsWith(".qasm"))
  .sort();

export function parseFixture(name: string): Circuit {
  const params = name === "vqe-ansatz.qasm" ? readParams("fixtures/params/vqe-ansatz.txt") : {};
  return parseQasmFile(`fixtures/${name}`, { params });
}

