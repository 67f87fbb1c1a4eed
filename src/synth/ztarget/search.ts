// Number-theoretic approximation of z-rotations (Ross & Selinger 2014): a search by T-count over lattice candidates and norm equations.
//
// ## How the grid problem is solved here: lattice enumeration
//
// A single-qubit Clifford+T unitary of determinant 1 is (1/√2^k) [[u, -t†], [t, u†]] with u, t ∈ Z[ω]
// and u†u + t†t = 2^k. It is within ε of rz(phi) (up to global phase) iff z = u/√2^k lies in the cap
// { |z| ≤ 1, Re(z e^{i phi/2}) ≥ 1 - ε²/2 } (or its negative, which gives the same operator up to
// phase: we search only the positive cap), and a t exists with t†t = ξ := 2^k - u†u, which needs ξ
// doubly positive: ξ ≥ 0 is |z| ≤ 1, ξ• ≥ 0 is |u•|² ≤ 2^k.
//
// The map u = a + bω + cω² + dω³ ↦ (Re u, Im u, Re u•, Im u•) embeds Z[ω] as a lattice of covolume 4 in
// R⁴, and the level-k region is √2^k (Cap × Disk). We enclose the cap in the ellipse through its apex and
// both chord ends (semi-axes 2h/3 radial and 2s/√3 tangential for height h = ε²/2 and half chord s,
// inflated by 2^-10; a test checks containment along the arc), and Cap × Disk in the ellipsoid
// { q_Ellipse + |u•|² ≤ 2 } (twice the volume of the product, the least possible by symmetry). The
// ellipsoid's quadratic form on Z⁴ is the same at every level up to the factor 2^k and a centre that
// scales by √2^k, so ONE exact integral LLL reduction per target angle serves every level; each level is
// then a Fincke–Pohst enumeration around the scaled centre, followed by exact filtering: ξ doubly
// positive decided in Z[√2] with integers only, and d² = |z - z0|² + ξ/2^k ≤ ε² evaluated in fixed point
// with a conservative margin (a point within 2^-(prec-32) of the boundary is rejected, never accepted).
// Precision: prec = 6 log2(1/ε) + 128 bits; the Gram matrix keeps 48 fractional bits for LLL, enough
// because admissible points have coordinates O(2^{k/2}) (see region.ts).
//
// ## Search order: by T-count, using a law checked against brute force
//
// For a candidate u at level k (√2 ∤ u, so k is the least denominator exponent) the best of the eight
// operators obtained by t -> ω^j t (conjugation by T^j: same error) has T-count
//   even class (determinant 1, approximating rz(phi)):             2k - 2  (k ≥ 1), 0 at k = 0;
//   odd class  (V T with V of determinant 1 approximating rz(phi - π/4)):
//                                                                  2k - 3 if (1+ω) | u, else 2k - 1 (k ≥ 1), 1 at k = 0.
// test/synth/ztarget/law.test.ts checks this on every unitary up to level 4 against the exact normal
// form and breadth-first search over exact matrices, and optimal.test.ts checks the resulting T-counts
// against the brute-force optimum over all operators up to T-count 12. So target T-count τ = 0, 1, 2, ... is searched as:
//   even τ: even class at level τ/2 + 1 (and level 0 when τ = 0);
//   odd τ:  odd class at level (τ+3)/2 with (1+ω) | u, and at level (τ+1)/2 with (1+ω) ∤ u (level 0 when τ = 1);
// and the search stops at the first τ with a solvable candidate.
//
// Degenerate targets: an angle within a hair of a multiple of π/4 (δ away with
// ε ≪ δ ≪ √ε, say) makes the lattice degenerate (two very short vectors): no candidate at the usual
// levels, then whole sheets of them near level 2 log2(1/ε). A point budget per T-count and per search
// (TAU_POINT_BUDGET, TOTAL_POINT_BUDGET) bounds that work; when it runs out the result is not certified,
// and past the total the caller splits the rotation in two generic ones (rz.ts). Within a τ, candidates are tried by
// increasing error, so the first solution is also the most accurate one of that T-count.
//
// ## The norm equation
//
// See norm-equation.ts: factor N(ξ) by trial division, Miller–Rabin, Pollard–Brent with a work limit and
// then a few elliptic curves (stage 1 and 2), with a mod-8 test that proves unsolvability without
// factoring in most cases; a candidate whose factoring exceeds the work limit is skipped and counted. The result is certified optimal (least
// T-count over all Clifford+T operators within ε of the target, up to phase) when no candidate of a
// smaller T-count was skipped.
import { type ZOmega, zoDivisibleByDelta, zoDivisibleBySqrt2, zoMulOmega } from "../rings/zomega.js";
import { type ExactU2, exactU2FromColumn } from "../exact/matrix.js";
import { exactSynthesize } from "../exact/normal-form.js";
import { type Word, tCount, wordToString } from "../exact/word.js";
import { seededRng } from "../../numeric/prng.js";
import { fxPi } from "../../numeric/fixed.js";
import { type Candidate, type PointBudget, type TargetRegion, levelCandidateStream, prepareRegion } from "./region.js";
import { solveNormEquation } from "./norm-equation.js";

export interface ZSearchOptions {
  /** Seed of the generator used by Pollard–Brent (default 0). */
  readonly seed?: number;
  /** Multiplier of the factoring work limit: rho steps and elliptic curves per composite (default 1). */
  readonly effort?: number;
  /** Give up (DegenerateTargetError) beyond this T-count (default 4 log2(1/ε) + 80; degenerate targets need about 4 log2(1/ε)). */
  readonly maxTCount?: number;
}

/**
 * Lattice points enumerated per T-count and per search. Typical targets use a few thousand in all;
 * targets within a hair of a multiple of π/4 (but not within ε of it) make the lattice degenerate:
 * candidates then come in enormous sheets, and the enumeration is cut here (the result is then not
 * certified, or the search gives up with DegenerateTargetError so that the caller can split the rotation).
 */
export const TAU_POINT_BUDGET = 300_000;
export const TOTAL_POINT_BUDGET = 3_000_000;

/** The lattice of this target is too degenerate for the enumeration budget (see TOTAL_POINT_BUDGET). */
export class DegenerateTargetError extends Error {
  constructor() {
    super("number-theoretic search: degenerate target exceeded the enumeration budget");
    this.name = "DegenerateTargetError";
  }
}

/** Candidates per T-count sorted by error before trying; any beyond follow in enumeration order. */
const SORT_LIMIT = 512;

/** Rho steps per composite at effort 1. */
export const RHO_ITERATIONS = 1 << 13;
/** Elliptic curves per composite that resists rho, at effort 1 (bench/synth.ts measures the trade-off). */
export const ECM_CURVES = 40;

export interface ZSearchResult {
  readonly word: Word;
  readonly tCount: number;
  /** The T-count the search law predicted for the solution (equals tCount unless the law failed). */
  readonly tau: number;
  /** wordMatrix(word) · e^{i π phaseEighths / 8} approximates rz(phi); phaseEighths in -7..8. */
  readonly phaseEighths: number;
  /** The exact unitary chosen (u, t and level), before synthesis: U = ω^p wordMatrix(word). */
  readonly unitary: ExactU2;
  readonly certifiedOptimal: boolean;
  readonly skipped: number;
  /** Norm equations attempted. */
  readonly attempts: number;
}

interface Attempt {
  readonly cand: Candidate;
  readonly odd: boolean;
}

/**
 * Searches a least-T-count Clifford+T word within ε of rz(phi), up to global phase. `phi` is fixed point
 * at `prec` bits (already reduced mod 4π, |phi| ≤ 2π); epsUp ≥ ε and eps2Down ≤ ε² are fixed point.
 */
export function searchRz(phi: bigint, prec: number, epsUp: bigint, eps2Down: bigint, log2InvEps: number, opts: ZSearchOptions = {}): ZSearchResult {
  const rng = seededRng(opts.seed ?? 0);
  // The integers to factor grow with log(1/eps): below about 1e-19 the default work limit grows with
  // them, so that hard norm equations at 1e-30 and 1e-50 are skipped less often (bench/RESULTS.md).
  const effort = opts.effort ?? Math.max(1, log2InvEps / 64);
  const rho = Math.max(16, Math.round(RHO_ITERATIONS * effort));
  const ecm = Math.round(ECM_CURVES * effort);
  const maxT = opts.maxTCount ?? 4 * log2InvEps + 80;
  let evenRegion: TargetRegion | null = null;
  let oddRegion: TargetRegion | null = null;
  const even = (): TargetRegion => (evenRegion ??= prepareRegion(phi, epsUp, eps2Down, prec));
  const quarterPi = fxPi(prec) >> 2n;
  const odd = (): TargetRegion => (oddRegion ??= prepareRegion(phi - quarterPi, epsUp, eps2Down, prec));
  let skipped = 0;
  let skippedBelow = 0;
  let truncatedBelow = false;
  let attempts = 0;
  const total: PointBudget = { left: TOTAL_POINT_BUDGET, truncated: false };
  for (let tau = 0; tau <= maxT; tau++) {
    if (total.left <= 0) break;
    const budget: PointBudget = { left: Math.min(TAU_POINT_BUDGET, total.left), truncated: false };
    const startLeft = budget.left;
    const streams: Generator<Attempt>[] = [];
    const tag = function* (g: Generator<Candidate>, isOdd: boolean): Generator<Attempt> {
      for (const cand of g) yield { cand, odd: isOdd };
    };
    if (tau % 2 === 0) {
      if (tau === 0) streams.push(tag(levelCandidateStream(even(), 0, () => true, budget), false));
      streams.push(tag(levelCandidateStream(even(), tau / 2 + 1, (u) => !zoDivisibleBySqrt2(u), budget), false));
    } else {
      if (tau === 1) streams.push(tag(levelCandidateStream(odd(), 0, () => true, budget), true));
      streams.push(tag(levelCandidateStream(odd(), (tau + 1) / 2, (u) => !zoDivisibleByDelta(u), budget), true));
      streams.push(tag(levelCandidateStream(odd(), (tau + 3) / 2, (u) => zoDivisibleByDelta(u) && !zoDivisibleBySqrt2(u), budget), true));
    }
    // Up to SORT_LIMIT candidates are tried by increasing error; beyond that (degenerate targets with a
    // flood of candidates at one level) the rest follow in enumeration order, still all of them.
    const head: Attempt[] = [];
    const rest = (function* (): Generator<Attempt> {
      for (const st of streams) yield* st;
    })();
    for (let next = rest.next(); !next.done; next = head.length < SORT_LIMIT ? rest.next() : { done: true, value: undefined }) {
      head.push(next.value);
    }
    head.sort(compareAttempts);
    const skippedBefore = skipped;
    const all = (function* (): Generator<Attempt> {
      yield* head;
      if (head.length >= SORT_LIMIT) yield* rest;
    })();
    for (const at of all) {
      attempts++;
      const sol = solveNormEquation(at.cand.xi, rng, rho, ecm);
      if (sol.kind === "unsolvable") continue;
      if (sol.kind === "hard") {
        skipped++;
        continue;
      }
      const best = bestConjugate(at.cand.u, sol.t, at.cand.k, at.odd);
      return {
        word: best.word,
        tCount: tCount(best.word),
        tau,
        phaseEighths: best.phaseEighths,
        unitary: best.unitary,
        certifiedOptimal: skippedBelow === 0 && !truncatedBelow,
        skipped,
        attempts,
      };
    }
    skippedBelow += skipped - skippedBefore;
    if (budget.truncated) truncatedBelow = true;
    total.left -= startLeft - Math.max(0, budget.left);
  }
  throw new DegenerateTargetError();
}

/** Candidates by increasing error, then by level and coefficients (a total, deterministic order). */
function compareAttempts(x: Attempt, y: Attempt): number {
  if (x.cand.d2 !== y.cand.d2) return x.cand.d2 < y.cand.d2 ? -1 : 1;
  if (x.cand.k !== y.cand.k) return x.cand.k - y.cand.k;
  const ku = (u: ZOmega) => [u.a, u.b, u.c, u.d];
  const a = ku(x.cand.u);
  const b = ku(y.cand.u);
  for (let i = 0; i < 4; i++) if (a[i] !== b[i]) return a[i]! < b[i]! ? -1 : 1;
  return 0;
}

/**
 * Exact synthesis of the eight operators (1/√2^k)[[u, -(ω^j t)† ω^l], [ω^j t, u† ω^l]] (l = 1 for the odd
 * class: V·T), keeping the fewest T gates, then the fewest Cliffords, then the first word in text order.
 */
function bestConjugate(u: ZOmega, t: ZOmega, k: number, isOdd: boolean): { word: Word; phaseEighths: number; unitary: ExactU2 } {
  let best: { word: Word; phaseEighths: number; unitary: ExactU2; key: [number, number, string] } | null = null;
  for (let j = 0; j < 8; j++) {
    const U = exactU2FromColumn(u, zoMulOmega(t, j), isOdd ? 1 : 0, k);
    const syn = exactSynthesize(U);
    const tc = tCount(syn.word);
    const key: [number, number, string] = [tc, syn.word.length - tc, wordToString(syn.word)];
    if (best === null || key[0] < best.key[0] || (key[0] === best.key[0] && (key[1] < best.key[1] || (key[1] === best.key[1] && key[2] < best.key[2])))) {
      // U = ω^p M(word). Even class: U ≈ rz(phi). Odd class: U = V T ≈ rz(phi - π/4) e^{iπ/8} rz(π/4) = e^{iπ/8} rz(phi).
      // So rz(phi) ≈ M(word) e^{iπ(2p - [odd])/8}.
      let e8 = (2 * syn.phase - (isOdd ? 1 : 0)) % 16;
      if (e8 > 8) e8 -= 16;
      if (e8 <= -8) e8 += 16;
      best = { word: syn.word, phaseEighths: e8, unitary: U, key };
    }
  }
  return { word: best!.word, phaseEighths: best!.phaseEighths, unitary: best!.unitary };
}
