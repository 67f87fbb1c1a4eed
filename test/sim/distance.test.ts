// Tests of the distance up to global phase: closed forms, mathjs as an independent reference, designed spectra, accuracy on tiny arcs.
import { describe, expect, test } from "vitest";
import { all, create, type Complex, type Matrix } from "mathjs";
import { gateInfo, type CMatrix } from "../../src/ir/gates.js";
import {
  adjointTimes,
  arc2x2,
  distance2x2,
  distanceFromArc,
  distanceToIdentity,
  distanceUpToPhase,
  halfDiamondFromArc,
  phaseArc,
} from "../../src/sim/distance.js";
import { seededRng } from "../../src/sim/rng.js";
import { arcOfPhases, randomUnitary, unitaryWithPhases } from "./helpers.js";

const math = create(all);

function toMath(a: CMatrix): Matrix {
  const rows: Complex[][] = [];
  for (let i = 0; i < a.dim; i++) {
    const row: Complex[] = [];
    for (let j = 0; j < a.dim; j++) row.push(math.complex(a.re[i * a.dim + j], a.im[i * a.dim + j]));
    rows.push(row);
  }
  return math.matrix(rows);
}

function scale(a: CMatrix, phi: number): CMatrix {
  const c = Math.cos(phi);
  const s = Math.sin(phi);
  const re = a.re.map((x, k) => x * c - a.im[k] * s);
  const im = a.im.map((y, k) => a.re[k] * s + y * c);
  return { dim: a.dim, re, im };
}

/**
 * ||A|| (operator norm) by repeated squaring of M = A^dag A (test-side code, plain loops): with M_0 = M / tr M and
 * M_k = M_{k-1}^2 / tr(M_{k-1}^2), the top eigenvalue satisfies log lambda(M_0) = (log lambda(M_s) + sum_k 2^(s-k)
 * log tr(M_{k-1}^2)) / 2^s and lambda(M_s) lies in [1/n, 1]: the error is at most ln(n) / 2^s (common practice, no source).
 */
function opNormSquaring(a: CMatrix): number {
  const n = a.dim;
  const mul = (xr: Float64Array, xi: Float64Array, yr: Float64Array, yi: Float64Array, adjX: boolean): [Float64Array, Float64Array] => {
    const or = new Float64Array(n * n);
    const oi = new Float64Array(n * n);
    for (let i = 0; i < n; i++)
      for (let k = 0; k < n; k++) {
        const er = adjX ? xr[k * n + i] : xr[i * n + k];
        const ei = adjX ? -xi[k * n + i] : xi[i * n + k];
        for (let j = 0; j < n; j++) {
          or[i * n + j] += er * yr[k * n + j] - ei * yi[k * n + j];
          oi[i * n + j] += er * yi[k * n + j] + ei * yr[k * n + j];
        }
      }
    return [or, oi];
  };
  const trace = (xr: Float64Array): number => {
    let t = 0;
    for (let i = 0; i < n; i++) t += xr[i * n + i];
    return t;
  };
  let [mr, mi] = mul(a.re, a.im, a.re, a.im, true);
  const t0 = trace(mr);
  mr = mr.map((x) => x / t0);
  mi = mi.map((x) => x / t0);
  const s = 40;
  let acc = 0;
  for (let k = 1; k <= s; k++) {
    [mr, mi] = mul(mr, mi, mr, mi, false);
    const tau = trace(mr);
    acc += 2 ** (s - k) * Math.log(tau);
    mr = mr.map((x) => x / tau);
    mi = mi.map((x) => x / tau);
  }
  // lambda(M_s) in [1/n, 1]: take the middle of the bracket for log lambda(M_s).
  const logLambda0 = (acc - Math.log(n) / 2) / 2 ** s;
  return Math.sqrt(t0 * Math.exp(logLambda0));
}

/** min over phi of ||U - e^{i phi} V|| by a grid and golden-section refinement (independent of src/sim). */
function bruteForceDistance(u: CMatrix, v: CMatrix): number {
  const f = (phi: number): number => {
    const w = scale(v, phi);
    return opNormSquaring({ dim: u.dim, re: u.re.map((x, k) => x - w.re[k]), im: u.im.map((x, k) => x - w.im[k]) });
  };
  const N = 72;
  let best = 0;
  let bestVal = Infinity;
  for (let k = 0; k < N; k++) {
    const phi = (2 * Math.PI * k) / N;
    const val = f(phi);
    if (val < bestVal) {
      bestVal = val;
      best = phi;
    }
  }
  let lo = best - (2 * Math.PI) / N;
  let hi = best + (2 * Math.PI) / N;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 50; it++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (f(x1) < f(x2)) hi = x2;
    else lo = x1;
  }
  return f((lo + hi) / 2);
}

/** Eigenphases of W by mathjs eigs (general complex eigenvalue routine), then the smallest arc by brute force. */
function arcMathjs(w: CMatrix): number {
  const vals = math.eigs(toMath(w)).values as Matrix;
  const phases = (vals.toArray() as (number | Complex)[]).map((v) => (typeof v === "number" ? (v >= 0 ? 0 : Math.PI) : Math.atan2(v.im, v.re)));
  return arcOfPhases(phases);
}

const rz = (t: number): CMatrix => gateInfo("rz")!.matrix([t]);
const rx = (t: number): CMatrix => gateInfo("rx")!.matrix([t]);
const u3 = (a: number, b: number, c: number): CMatrix => gateInfo("U")!.matrix([a, b, c]);

describe("closed forms", () => {
  test("d(rz(a), rz(b)) = 2 sin(|a - b|/4) while |a - b| <= pi", () => {
    // rz(a)^dag rz(b) has eigenphases -+(b - a)/2, an arc of |b - a| (synthesis.md s.1 conventions).
    const rng = seededRng(11);
    for (let k = 0; k < 50; k++) {
      const a = (rng.uniform() * 2 - 1) * 4;
      const b = a + (rng.uniform() * 2 - 1) * Math.PI;
      expect(distance2x2(rz(a), rz(b))).toBeCloseTo(2 * Math.sin(Math.abs(a - b) / 4), 14);
    }
  });

  test("2x2: agrees with sqrt(2 - |tr(U^dag V)|) at moderate distances (trace by mathjs)", () => {
    // Closed form for 2x2 unitaries: synthesis.md s.1 (the trade's usual metric, Ross & Selinger 2014).
    const rng = seededRng(12);
    for (let k = 0; k < 40; k++) {
      const p = () => (rng.uniform() * 2 - 1) * Math.PI;
      const u = u3(p(), p(), p());
      const v = scale(u3(p(), p(), p()), p());
      const tr = math.trace(math.multiply(math.ctranspose(toMath(u)), toMath(v)) as Matrix) as unknown as Complex;
      const closed = Math.sqrt(2 - math.abs(tr) as number);
      expect(distance2x2(u, v)).toBeCloseTo(closed, 12);
      expect(distanceUpToPhase(u, v)).toBeCloseTo(closed, 12);
    }
  });

  test("2x2: d(e^{-i t X/2} by mathjs expm, rx(s)) = 2 sin(|t - s|/4)", () => {
    // mathjs expm as an independent construction of the rotation (OpenQASM 3 stdgates rx(t) = exp(-i t X/2)).
    for (const [t, s] of [
      [0.3, 0.1],
      [-1.2, 0.7],
      [2.5, 2.5 - 1e-3],
    ]) {
      const e = math.expm(math.multiply(math.complex(0, -t / 2), math.matrix([[0, 1], [1, 0]])) as Matrix);
      const arr = e.toArray() as (number | Complex)[][];
      const m: CMatrix = {
        dim: 2,
        re: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? z : z.re))),
        im: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? 0 : z.im))),
      };
      expect(distanceUpToPhase(m, rx(s))).toBeCloseTo(2 * Math.sin(Math.abs(t - s) / 4), 12);
    }
  });

  test("halfDiamondFromArc: sin(arc/2) below pi, 1 from pi on, never more than d", () => {
    expect(halfDiamondFromArc(Math.PI / 3)).toBeCloseTo(0.5, 15);
    expect(halfDiamondFromArc(Math.PI)).toBe(1);
    expect(halfDiamondFromArc(5)).toBe(1);
    for (let a = 0; a < 2 * Math.PI; a += 0.01) expect(halfDiamondFromArc(a)).toBeLessThanOrEqual(distanceFromArc(a) + 1e-15);
  });
});

describe("phase invariance", () => {
  test("d(U, e^{i phi} U) = 0 for random phi, sizes 2 to 32", () => {
    const rng = seededRng(21);
    for (const dim of [2, 4, 8, 32]) {
      for (let k = 0; k < 4; k++) {
        const u = randomUnitary(100 * dim + k, dim);
        const phi = (rng.uniform() * 2 - 1) * Math.PI;
        expect(distanceUpToPhase(u, scale(u, phi))).toBeLessThan(1e-13);
      }
    }
  });

  test("d is symmetric and phase-blind in both arguments", () => {
    const u = randomUnitary(31, 8);
    const v = randomUnitary(32, 8);
    const d = distanceUpToPhase(u, v);
    expect(distanceUpToPhase(v, u)).toBeCloseTo(d, 12);
    expect(distanceUpToPhase(scale(u, 0.4), scale(v, -2))).toBeCloseTo(d, 12);
  });
});

describe("n-qubit arc method against independent references", () => {
  test("matches brute-force minimisation over phi of the operator norm (repeated squaring), 4x4 and 8x8", () => {
    for (const [dim, seed] of [
      [4, 1],
      [4, 2],
      [8, 3],
    ]) {
      const u = randomUnitary(seed, dim);
      // V close to U so the minimiser is well inside the moderate-distance regime, and one far away.
      for (const t of [0.2, 1.0]) {
        const q = randomUnitary(seed + 50, dim);
        const phases = Array.from({ length: dim }, (_, k) => t * Math.sin(3 * k + seed));
        const v = complexMul(u, unitaryWithPhases(q, phases));
        expect(distanceUpToPhase(u, v)).toBeCloseTo(bruteForceDistance(u, v), 8);
      }
    }
  });

  test("random unitaries: arc equals the arc of mathjs eigenvalues (general complex eigs)", () => {
    for (const dim of [3, 4, 6, 8, 16]) {
      for (let k = 0; k < 3; k++) {
        const w = randomUnitary(1000 + 10 * dim + k, dim);
        expect(phaseArc(w).arc).toBeCloseTo(arcMathjs(w), 9);
      }
    }
  });

  test("designed spectra: every path and the wrap-around", () => {
    const cases: { phases: number[]; method: string }[] = [
      { phases: [0.1, 0.2, -0.3, 0.05], method: "hermitian-part" },
      { phases: [2.0, 2.1, 2.05, 1.9, 2.2, 2.0, 1.95, 2.15], method: "hermitian-part" },
      { phases: [0, 1, 2, 3, -1, -2, 0.5, 2.5], method: "cayley" },
      // Clustered around pi: the arc wraps through pi.
      { phases: [Math.PI - 0.1, -Math.PI + 0.2, Math.PI - 0.05, -Math.PI + 0.01], method: "hermitian-part" },
      // Spread around pi and zero (candidates theta and pi - theta coincide in pairs).
      { phases: [0.3, Math.PI - 0.3, 0.3, Math.PI - 0.3, 1.2, 2.0], method: "cayley" },
      { phases: [0, Math.PI, 0, Math.PI], method: "cayley" },
      { phases: [0, 2.1, 4.2, 1.0, 3.0, 5.0, 0.5, 6.0], method: "cayley" },
      // The trace is real and positive, and one phase sits exactly opposite it: the pole must avoid it.
      { phases: [0, 0.5, -0.5, Math.PI, 2.0, -2.0], method: "cayley" },
    ];
    cases.forEach(({ phases, method }, idx) => {
      const q = randomUnitary(300 + idx, phases.length);
      const w = unitaryWithPhases(q, phases);
      const r = phaseArc(w);
      expect(r.method).toBe(method);
      expect(r.arc).toBeCloseTo(arcOfPhases(phases), 11);
    });
  });
});

describe("random spectra", () => {
  test("60 seeded random phase sets of 3..12 phases, spread from narrow to the whole circle", () => {
    const rng = seededRng(606);
    for (let k = 0; k < 60; k++) {
      const n = 3 + Math.floor(rng.uniform() * 10);
      const centre = (rng.uniform() * 2 - 1) * Math.PI;
      const spread = [0.01, 0.5, 2, 4, 6.2][k % 5];
      const phases = Array.from({ length: n }, () => centre + (rng.uniform() - 0.5) * spread);
      const w = unitaryWithPhases(randomUnitary(5000 + k, n), phases);
      expect(phaseArc(w).arc).toBeCloseTo(arcOfPhases(phases), 10);
    }
  });
});

describe("accuracy on tiny distances", () => {
  test("arcs of 1e-6 .. 1e-12 come out with small relative error (no sqrt(2 - |tr|) cancellation)", () => {
    for (const [dim, arc] of [
      [8, 1e-6],
      [16, 1e-9],
      [32, 1e-10],
      [64, 1e-12],
    ]) {
      const q = randomUnitary(7 * dim, dim);
      const base = 1.3; // a common phase far from zero: the method must remove it
      const phases = Array.from({ length: dim }, (_, k) => base + (arc * k) / (dim - 1) - arc / 2);
      const w = unitaryWithPhases(q, phases);
      const got = phaseArc(w).arc;
      // Absolute accuracy of a few hundred ulps is all float input allows: 64 * 2^-52 * sqrt(dim).
      expect(Math.abs(got - arc)).toBeLessThan(Math.max(1e-4 * arc, 64 * 2 ** -52 * Math.sqrt(dim)));
      expect(distanceToIdentity(w)).toBeCloseTo(distanceFromArc(arc), 15);
    }
  });

  test("2x2 tiny rotations: d(rz(t), rz(t + e)) = 2 sin(e/4) to relative 1e-6", () => {
    for (const e of [1e-5, 1e-8, 1e-10, 1e-12]) {
      const d = distance2x2(rz(0.7), rz(0.7 + e));
      expect(Math.abs(d - 2 * Math.sin(e / 4)) / (e / 2)).toBeLessThan(1e-3);
      const a = arc2x2(adjointTimes(rx(-2), rx(-2 + e)));
      expect(Math.abs(a - e) / e).toBeLessThan(1e-3);
    }
  });
});

function complexMul(a: CMatrix, b: CMatrix): CMatrix {
  const m = math.multiply(toMath(a), toMath(b)) as Matrix;
  const arr = m.toArray() as (number | Complex)[][];
  return {
    dim: a.dim,
    re: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? z : z.re))),
    im: Float64Array.from(arr.flat().map((z) => (typeof z === "number" ? 0 : z.im))),
  };
}
