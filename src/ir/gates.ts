// The canonical gate table of the IR: each canonical name fixes one exact matrix (global phase included), its inverse, powers and controlled forms.
import type { Angle, Rational } from "./angle.js";
import { anglePi, angleNeg, angleScale, rational } from "./angle-ops.js";

/** A dense complex matrix, row-major, dim x dim. */
export interface CMatrix {
  readonly dim: number;
  readonly re: Float64Array;
  readonly im: Float64Array;
}

export interface GateInfo {
  /** Canonical IR name. */
  readonly name: string;
  readonly numParams: number;
  /** Qubits the gate acts on, without extra `ctrl @` controls. */
  readonly numQubits: number;
  /** The gate's matrix; the first listed qubit is the most significant bit of the row index. */
  readonly matrix: (params: readonly number[]) => CMatrix;
}

// ---------------------------------------------------------------------------------------------
// Small dense complex matrices (also used by the simulator and tests).

/** The dim x dim zero matrix. */
export function zeroMatrix(dim: number): CMatrix {
  return { dim, re: new Float64Array(dim * dim), im: new Float64Array(dim * dim) };
}

/** The dim x dim identity. */
export function identityMatrix(dim: number): CMatrix {
  const m = zeroMatrix(dim);
  for (let i = 0; i < dim; i++) m.re[i * dim + i] = 1;
  return m;
}

/** The product a * b (a applied after b). */
export function complexMatrixMul(a: CMatrix, b: CMatrix): CMatrix {
  if (a.dim !== b.dim) throw new RangeError(`complexMatrixMul: dimension ${a.dim} vs ${b.dim}`);
  const n = a.dim;
  const out = zeroMatrix(n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      const ar = a.re[i * n + k]!;
      const ai = a.im[i * n + k]!;
      if (ar === 0 && ai === 0) continue;
      for (let j = 0; j < n; j++) {
        const br = b.re[k * n + j]!;
        const bi = b.im[k * n + j]!;
        out.re[i * n + j]! += ar * br - ai * bi;
        out.im[i * n + j]! += ar * bi + ai * br;
      }
    }
  }
  return out;
}

/** The conjugate transpose. */
export function adjointMatrix(a: CMatrix): CMatrix {
  const n = a.dim;
  const out = zeroMatrix(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out.re[j * n + i] = a.re[i * n + j]!;
      out.im[j * n + i] = -a.im[i * n + j]!;
    }
  }
  return out;
}

/** The Kronecker product a (x) b: a acts on the more significant bits. */
export function kronMatrix(a: CMatrix, b: CMatrix): CMatrix {
  const n = a.dim * b.dim;
  const out = zeroMatrix(n);
  for (let i1 = 0; i1 < a.dim; i1++)
    for (let j1 = 0; j1 < a.dim; j1++) {
      const ar = a.re[i1 * a.dim + j1]!;
      const ai = a.im[i1 * a.dim + j1]!;
      if (ar === 0 && ai === 0) continue;
      for (let i2 = 0; i2 < b.dim; i2++)
        for (let j2 = 0; j2 < b.dim; j2++) {
          const br = b.re[i2 * b.dim + j2]!;
          const bi = b.im[i2 * b.dim + j2]!;
          const idx = (i1 * b.dim + i2) * n + (j1 * b.dim + j2);
          out.re[idx] = ar * br - ai * bi;
          out.im[idx] = ar * bi + ai * br;
        }
    }
  return out;
}

/** e^{i t} * a. */
export function phaseMatrix(a: CMatrix, t: number): CMatrix {
  const c = Math.cos(t);
  const s = Math.sin(t);
  const out = zeroMatrix(a.dim);
  for (let i = 0; i < a.re.length; i++) {
    out.re[i] = c * a.re[i]! - s * a.im[i]!;
    out.im[i] = c * a.im[i]! + s * a.re[i]!;
  }
  return out;
}

/**
 * The matrix of `a` with leading controls: `ctrl[i]` true for a control on |1>, false for one on |0>.
 * Controls are the most significant qubits, in order; `a` acts on the least significant ones.
 */
export function controlledMatrix(a: CMatrix, ctrl: readonly boolean[]): CMatrix {
  const k = ctrl.length;
  const n = a.dim << k;
  const out = identityMatrix(n);
  let sel = 0;
  for (const c of ctrl) sel = (sel << 1) | (c ? 1 : 0);
  const off = sel * a.dim;
  for (let i = 0; i < a.dim; i++)
    for (let j = 0; j < a.dim; j++) {
      out.re[(off + i) * n + off + j] = a.re[i * a.dim + j]!;
      out.im[(off + i) * n + off + j] = a.im[i * a.dim + j]!;
    }
  return out;
}

/** A matrix from complex entries given row by row as [re, im] pairs. */
export function matrixOf(dim: number, entries: readonly (readonly [number, number])[]): CMatrix {
  if (entries.length !== dim * dim) throw new RangeError("matrixOf: wrong number of entries");
  const m = zeroMatrix(dim);
  entries.forEach(([r, i], idx) => {
    m.re[idx] = r;
    m.im[idx] = i;
  });
  return m;
}

// ---------------------------------------------------------------------------------------------
// The matrices.

type Cx = readonly [number, number];
const expi = (t: number): Cx => [Math.cos(t), Math.sin(t)];
const cmul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const real = (x: number): Cx => [x, 0];
const O: Cx = [0, 0];
const ONE: Cx = [1, 0];
const I_: Cx = [0, 1];
const SQRT1_2 = Math.SQRT1_2;

/** The OpenQASM 3 builtin U(a, b, c) = [[cos(a/2), -e^{ic} sin(a/2)], [e^{ib} sin(a/2), e^{i(b+c)} cos(a/2)]]. */
function uMatrix(a: number, b: number, c: number): CMatrix {
  const co = Math.cos(a / 2);
  const si = Math.sin(a / 2);
  return matrixOf(2, [real(co), cmul(real(-si), expi(c)), cmul(real(si), expi(b)), cmul(real(co), expi(b + c))]);
}

const diag2 = (a: Cx, b: Cx): CMatrix => matrixOf(2, [a, O, O, b]);
const X_M = matrixOf(2, [O, ONE, ONE, O]);
const Y_M = matrixOf(2, [O, [0, -1], I_, O]);
const Z_M = diag2(ONE, [-1, 0]);
const H_M = matrixOf(2, [real(SQRT1_2), real(SQRT1_2), real(SQRT1_2), real(-SQRT1_2)]);
const SX_M = matrixOf(2, [[0.5, 0.5], [0.5, -0.5], [0.5, -0.5], [0.5, 0.5]]);
const SWAP_M = matrixOf(4, [ONE, O, O, O, O, O, ONE, O, O, ONE, O, O, O, O, O, ONE]);
const pMatrix = (l: number): CMatrix => diag2(ONE, expi(l));
const rzMatrix = (t: number): CMatrix => diag2(expi(-t / 2), expi(t / 2));
const rxMatrix = (t: number): CMatrix =>
  matrixOf(2, [real(Math.cos(t / 2)), [0, -Math.sin(t / 2)], [0, -Math.sin(t / 2)], real(Math.cos(t / 2))]);
const ryMatrix = (t: number): CMatrix =>
  matrixOf(2, [real(Math.cos(t / 2)), real(-Math.sin(t / 2)), real(Math.sin(t / 2)), real(Math.cos(t / 2))]);

/** exp(-i t/2 P (x) Q) = cos(t/2) I - i sin(t/2) P (x) Q for Paulis P, Q (P on the first qubit). */
function pauliPairRotation(p: CMatrix, q: CMatrix, t: number): CMatrix {
  const pq = kronMatrix(p, q);
  const out = identityMatrix(4);
  const c = Math.cos(t / 2);
  const s = Math.sin(t / 2);
  for (let i = 0; i < 16; i++) {
    // c*I - i*s*PQ
    out.re[i] = c * out.re[i]! + s * pq.im[i]!;
    out.im[i] = -s * pq.re[i]!;
  }
  return out;
}

/** The 2^n permutation-with-phases matrix sending basis state j to phases[j] * |perm[j]>. */
function monomial(perm: readonly number[], phases: readonly Cx[]): CMatrix {
  const n = perm.length;
  const m = zeroMatrix(n);
  for (let j = 0; j < n; j++) {
    m.re[perm[j]! * n + j] = phases[j]![0];
    m.im[perm[j]! * n + j] = phases[j]![1];
  }
  return m;
}

const ctrlN = (a: CMatrix, n: number): CMatrix => controlledMatrix(a, new Array<boolean>(n).fill(true));

/**
 * qelib1's relative-phase Toffoli `rccx a,b,c` (from memory of qelib1.inc: h c; t c; cx b,c; tdg c; cx a,c;
 * t c; cx b,c; tdg c; h c). Multiplying that out: identity except |101> -> -|101> and, on a = b = 1,
 * the target gets [[0, -i], [i, 0]]. Checked against the definition in test/ir/gates.test.ts.
 */
const RCCX_M = monomial(
  [0, 1, 2, 3, 4, 5, 7, 6],
  [ONE, ONE, ONE, ONE, ONE, [-1, 0], I_, [0, -1]],
);

/**
 * qelib1's relative-phase 3-controlled X `rc3x a,b,c,d` (from memory of qelib1.inc's network of h, t, tdg
 * and cx). Multiplied out: identity except, on a = b = 1: c = 0 gives the target diag(i, -i), and
 * c = 1 gives the target [[0, 1], [-1, 0]]. Checked against the definition in test/ir/gates.test.ts.
 */
const RC3X_M = monomial(
  [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 15, 14],
  [ONE, ONE, ONE, ONE, ONE, ONE, ONE, ONE, ONE, ONE, ONE, ONE, I_, [0, -1], [-1, 0], ONE],
);

interface GateDef {
  readonly numParams: number;
  readonly numQubits: number;
  readonly matrix: (p: readonly number[]) => CMatrix;
}

const p0 = (p: readonly number[], i: number): number => {
  const v = p[i];
  if (v === undefined) throw new RangeError("gate matrix: missing parameter");
  return v;
};
const fixed = (q: number, m: CMatrix): GateDef => ({ numParams: 0, numQubits: q, matrix: () => m });
const one = (q: number, f: (t: number) => CMatrix): GateDef => ({ numParams: 1, numQubits: q, matrix: (p) => f(p0(p, 0)) });

const DEFS: readonly (readonly [string, GateDef])[] = [
  // OpenQASM 3 builtins.
  ["U", { numParams: 3, numQubits: 1, matrix: (p) => uMatrix(p0(p, 0), p0(p, 1), p0(p, 2)) }],
  ["gphase", one(0, (t) => matrixOf(1, [expi(t)]))],
  // One-qubit gates of stdgates.inc (and qelib1.inc where the matrices agree).
  ["id", fixed(1, identityMatrix(2))],
  ["x", fixed(1, X_M)],
  ["y", fixed(1, Y_M)],
  ["z", fixed(1, Z_M)],
  ["h", fixed(1, H_M)],
  ["s", fixed(1, diag2(ONE, I_))],
  ["sdg", fixed(1, diag2(ONE, [0, -1]))],
  ["t", fixed(1, diag2(ONE, expi(Math.PI / 4)))],
  ["tdg", fixed(1, diag2(ONE, expi(-Math.PI / 4)))],
  ["sx", fixed(1, SX_M)],
  ["sxdg", fixed(1, adjointMatrix(SX_M))],
  ["p", one(1, pMatrix)],
  ["u1", one(1, pMatrix)],
  ["rx", one(1, rxMatrix)],
  ["ry", one(1, ryMatrix)],
  ["rz", one(1, rzMatrix)],
  // OpenQASM 3's u2 and u3 carry the phase e^{-i(phi+lambda)/2} on top of U.
  ["u2", { numParams: 2, numQubits: 1, matrix: (p) => phaseMatrix(uMatrix(Math.PI / 2, p0(p, 0), p0(p, 1)), -(p0(p, 0) + p0(p, 1)) / 2) }],
  ["u3", { numParams: 3, numQubits: 1, matrix: (p) => phaseMatrix(uMatrix(p0(p, 0), p0(p, 1), p0(p, 2)), -(p0(p, 1) + p0(p, 2)) / 2) }],
  // Controlled gates: exactly `ctrl @` of the base gate.
  ["cx", fixed(2, ctrlN(X_M, 1))],
  ["cy", fixed(2, ctrlN(Y_M, 1))],
  ["cz", fixed(2, ctrlN(Z_M, 1))],
  ["ch", fixed(2, ctrlN(H_M, 1))],
  ["csx", fixed(2, ctrlN(SX_M, 1))],
  ["cp", one(2, (l) => ctrlN(pMatrix(l), 1))],
  ["crx", one(2, (t) => ctrlN(rxMatrix(t), 1))],
  ["cry", one(2, (t) => ctrlN(ryMatrix(t), 1))],
  ["crz", one(2, (t) => ctrlN(rzMatrix(t), 1))],
  // cu(theta, phi, lambda, gamma) = ctrl @ (e^{i gamma} U(theta, phi, lambda)).
  ["cu", { numParams: 4, numQubits: 2, matrix: (p) => ctrlN(phaseMatrix(uMatrix(p0(p, 0), p0(p, 1), p0(p, 2)), p0(p, 3)), 1) }],
  ["swap", fixed(2, SWAP_M)],
  ["ccx", fixed(3, ctrlN(X_M, 2))],
  ["cswap", fixed(3, ctrlN(SWAP_M, 1))],
  ["c3x", fixed(4, ctrlN(X_M, 3))],
  ["c4x", fixed(5, ctrlN(X_M, 4))],
  ["c3sqrtx", fixed(4, ctrlN(SX_M, 3))],
  ["c3sqrtxdg", fixed(4, ctrlN(adjointMatrix(SX_M), 3))],
  // Two-qubit Pauli-pair rotations exp(-i t/2 P(x)Q), determinant 1 (the first qubit carries P).
  ["rxx", one(2, (t) => pauliPairRotation(X_M, X_M, t))],
  ["ryy", one(2, (t) => pauliPairRotation(Y_M, Y_M, t))],
  ["rzz", one(2, (t) => pauliPairRotation(Z_M, Z_M, t))],
  ["rzx", one(2, (t) => pauliPairRotation(Z_M, X_M, t))],
  // qelib1's relative-phase Toffolis (and the inverse of the one that is not self-inverse).
  ["rccx", fixed(3, RCCX_M)],
  ["rc3x", fixed(4, RC3X_M)],
  ["rc3xdg", fixed(4, adjointMatrix(RC3X_M))],
];

/** Every canonical gate of the IR, by name. */
export const GATES: ReadonlyMap<string, GateInfo> = new Map(
  DEFS.map(([name, d]) => [name, { name, numParams: d.numParams, numQubits: d.numQubits, matrix: d.matrix }] as const),
);

export function gateInfo(name: string): GateInfo | undefined {
  return GATES.get(name);
}

// ---------------------------------------------------------------------------------------------
// Inverses, powers and controlled names (exact: angles go through angle-ops).

const SELF_INVERSE = new Set(["id", "x", "y", "z", "h", "cx", "cy", "cz", "ch", "swap", "ccx", "cswap", "c3x", "c4x", "rccx"]);
const INVERSE_PAIRS: ReadonlyMap<string, string> = new Map([
  ["s", "sdg"],
  ["sdg", "s"],
  ["t", "tdg"],
  ["tdg", "t"],
  ["sx", "sxdg"],
  ["sxdg", "sx"],
  ["c3sqrtx", "c3sqrtxdg"],
  ["c3sqrtxdg", "c3sqrtx"],
  ["rc3x", "rc3xdg"],
  ["rc3xdg", "rc3x"],
]);
/** Gates whose parameter is an angle t with G(t)^k = G(k t) (one-parameter groups) and G(t)^-1 = G(-t). */
const ROTATIONS = new Set(["gphase", "p", "u1", "rx", "ry", "rz", "cp", "crx", "cry", "crz", "rxx", "ryy", "rzz", "rzx"]);

function arg(params: readonly Angle[], i: number, name: string): Angle {
  const a = params[i];
  if (a === undefined) throw new RangeError(`${name}: missing parameter ${i}`);
  return a;
}

function checkArity(name: string, params: readonly Angle[]): GateInfo {
  const info = GATES.get(name);
  if (!info) throw new RangeError(`unknown canonical gate '${name}'`);
  if (params.length !== info.numParams) throw new RangeError(`gate '${name}' takes ${info.numParams} parameters, got ${params.length}`);
  return info;
}

const piOver = (num: bigint, den: bigint): Angle => anglePi(rational(num, den));

/**
 * Exact inverse of a gate (same matrix as the inverse, global phase included),
 * e.g. s -> sdg, rz(t) -> rz(-t), U(a,b,c) -> U(-a,-c,-b).
 */
export function inverseGate(name: string, params: readonly Angle[]): { name: string; params: Angle[] } {
  checkArity(name, params);
  if (SELF_INVERSE.has(name)) return { name, params: [] };
  const pair = INVERSE_PAIRS.get(name);
  if (pair !== undefined) return { name: pair, params: [] };
  if (ROTATIONS.has(name)) return { name, params: [angleNeg(arg(params, 0, name))] };
  const a = (i: number): Angle => arg(params, i, name);
  switch (name) {
    case "U":
      return { name: "U", params: [angleNeg(a(0)), angleNeg(a(2)), angleNeg(a(1))] };
    case "u3":
      // u3(t,f,l) = e^{-i(f+l)/2} U(t,f,l); its inverse e^{i(f+l)/2} U(-t,-l,-f) is u3(-t,-l,-f).
      return { name: "u3", params: [angleNeg(a(0)), angleNeg(a(2)), angleNeg(a(1))] };
    case "u2":
      // u2(f,l) = u3(pi/2,f,l).
      return { name: "u3", params: [piOver(-1n, 2n), angleNeg(a(1)), angleNeg(a(0))] };
    case "cu":
      return { name: "cu", params: [angleNeg(a(0)), angleNeg(a(2)), angleNeg(a(1)), angleNeg(a(3))] };
    case "csx":
      // sxdg = e^{-i pi/4} rx(-pi/2) = e^{-i pi/4} U(-pi/2, -pi/2, pi/2).
      return { name: "cu", params: [piOver(-1n, 2n), piOver(-1n, 2n), piOver(1n, 2n), piOver(-1n, 4n)] };
  }
  throw new RangeError(`inverseGate: no rule for '${name}'`);
}

const isInteger = (k: Rational): boolean => k.den === 1n;

/**
 * Exact k-th power. Rotation and phase gates (rz, rx, ry, p, u1, gphase, crz, crx, cry, cp, rxx, ryy,
 * rzz, rzx) multiply their angle: G(t)^k = G(k t), the power along the gate's one-parameter group
 * (it is the principal-branch power when |t| stays within the principal range). z, s, sdg, t, tdg
 * become p(k pi), p(k pi/2), ... (their principal powers), and x^(1/2) = sx, x^(-1/2) = sxdg.
 * Otherwise, for an integer k, returns null and the caller repeats the gate (or its inverse);
 * for a non-integer k with no exact closed form, also null.
 */
export function powerGate(name: string, params: readonly Angle[], k: Rational): { name: string; params: Angle[] } | null {
  checkArity(name, params);
  if (ROTATIONS.has(name)) return { name, params: [angleScale(arg(params, 0, name), k)] };
  const phaseOf: Readonly<Record<string, Rational>> = {
    z: rational(1n),
    s: rational(1n, 2n),
    sdg: rational(-1n, 2n),
    t: rational(1n, 4n),
    tdg: rational(-1n, 4n),
  };
  const ph = phaseOf[name];
  if (ph !== undefined) return { name: "p", params: [anglePi(rational(ph.num * k.num, ph.den * k.den))] };
  if (name === "id") return { name: "id", params: [] };
  if (isInteger(k)) return null;
  if (name === "x" && k.den === 2n && (k.num === 1n || k.num === -1n)) return { name: k.num === 1n ? "sx" : "sxdg", params: [] };
  return null;
}

/** Controlled families: canonical name -> [base gate, number of controls on it]. */
const FAMILY: ReadonlyMap<string, readonly [string, number]> = new Map([
  ["x", ["x", 0]],
  ["cx", ["x", 1]],
  ["ccx", ["x", 2]],
  ["c3x", ["x", 3]],
  ["c4x", ["x", 4]],
  ["y", ["y", 0]],
  ["cy", ["y", 1]],
  ["z", ["z", 0]],
  ["cz", ["z", 1]],
  ["h", ["h", 0]],
  ["ch", ["h", 1]],
  ["gphase", ["gphase", 0]],
  ["p", ["gphase", 1]],
  ["cp", ["gphase", 2]],
  ["u1", ["gphase", 1]],
  ["rz", ["rz", 0]],
  ["crz", ["rz", 1]],
  ["rx", ["rx", 0]],
  ["crx", ["rx", 1]],
  ["ry", ["ry", 0]],
  ["cry", ["ry", 1]],
  ["swap", ["swap", 0]],
  ["cswap", ["swap", 1]],
  ["sx", ["sx", 0]],
  ["csx", ["sx", 1]],
  ["c3sqrtx", ["sx", 3]],
  ["sxdg", ["sxdg", 0]],
  ["c3sqrtxdg", ["sxdg", 3]],
]);
const BY_FAMILY: ReadonlyMap<string, string> = new Map(
  [...FAMILY].filter(([name]) => name !== "u1").map(([name, [base, n]]) => [`${base}/${n}`, name]),
);

/**
 * The canonical name for `ctrl @` applied nCtrl times to gate `name` when one exists with the identical
 * matrix and the same parameters (x -> cx -> ccx -> c3x -> c4x, z -> cz, p -> cp, gphase -> p -> cp, ...),
 * else null. nCtrl = 0 returns the name itself.
 */
export function controlledName(name: string, nCtrl: number): string | null {
  if (nCtrl === 0) return GATES.has(name) ? name : null;
  const fam = FAMILY.get(name);
  if (!fam) return null;
  return BY_FAMILY.get(`${fam[0]}/${fam[1] + nCtrl}`) ?? null;
}
