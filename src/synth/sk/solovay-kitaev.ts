// Solovay–Kitaev (Dawson–Nielsen recursion) over the Clifford+T base net: any single-qubit unitary to a gate word.
import { inverseWord, simplifyWord, type Word } from "../exact/word.js";
import { buildBaseNet, netQuat, netWord, type BaseNet } from "./base-net.js";
import { balancedCommutator } from "./commutator.js";
import { ddWordDist } from "./dd-quat.js";
import { buildNetIndex, nearest, type NetIndex } from "./nearest.js";
import { matToQuat, qdist, qinv, qmul, qnormalize, rzQuat, type Mat2, type Quat } from "./quat.js";
import { seededHaarQuats } from "./seeded.js";

/**
 * T-count of the default base net: 24 (3 * 2^12 - 2) = 294,864 operators, built with its index in
 * about 0.3 s on an idle machine (bench/sk.ts prints the figure); a typical target lies about 0.02
 * from its nearest point, the worst seen about 0.05. T-count 13 doubles the net for a 25% smaller
 * level-0 error and about three times the build time.
 */
export const DEFAULT_NET_TCOUNT = 12;

/**
 * Deepest recursion tried when the depth is chosen from eps. Words grow five-fold per level:
 * depth 6 (about 4e5 gates) typically lands near 1e-15, depth 7 (2e6 gates, seconds) near
 * 2.5e-16, where the double-precision arithmetic of the recursion itself stops improving.
 */
export const DEFAULT_MAX_DEPTH = 7;

export interface SkOptions {
  /** Use exactly this recursion depth instead of choosing it from eps. */
  readonly depth?: number;
  /** Cap on the chosen depth (default DEFAULT_MAX_DEPTH). */
  readonly maxDepth?: number;
  /** T-count of the base net (default DEFAULT_NET_TCOUNT); each net is built once per process. */
  readonly netTCount?: number;
}

export interface SkResult {
  /** The gate word in circuit order, shortened by the exact layer's simplifyWord (same matrix exactly). */
  readonly word: Word;
  /**
   * d(word, target) = sqrt(2 - |tr(W^dag U)|), recomputed from the returned word in double-double
   * arithmetic (accurate to about 1e-16 absolute, the target taken as exact).
   */
  readonly error: number;
  /** The recursion depth used. */
  readonly depth: number;
}

/** A base net with its nearest-neighbour index. */
export interface SkContext {
  readonly net: BaseNet;
  readonly index: NetIndex;
}

const contexts = new Map<number, SkContext>();

/** The base net and its index for a T-count, built on first use and cached for the process. */
export function skContext(netTCount: number = DEFAULT_NET_TCOUNT): SkContext {
  let ctx = contexts.get(netTCount);
  if (ctx === undefined) {
    const net = buildBaseNet(netTCount);
    ctx = { net, index: buildNetIndex(net) };
    contexts.set(netTCount, ctx);
  }
  return ctx;
}

interface Approx {
  readonly word: Word;
  readonly q: Quat;
}

function level0(ctx: SkContext, target: Quat): Approx {
  const { index } = nearest(ctx.index, target);
  return { word: netWord(ctx.net, index), q: netQuat(ctx.net, index) };
}

/**
 * One Dawson–Nielsen step: from prev = SK(U, n-1), Delta = U prev^dag = V W V^dag W^dag,
 * return Vn Wn Vn^dag Wn^dag prev with Vn = SK(V, n-1), Wn = SK(W, n-1).
 * Circuit order is the reverse of the matrix product: prev first, then Wn^dag, Vn^dag, Wn, Vn.
 */
function step(ctx: SkContext, target: Quat, prev: Approx, n: number): Approx {
  const delta = qmul(target, qinv(prev.q));
  const { v, w } = balancedCommutator(delta);
  const vn = approx(ctx, v, n - 1);
  const wn = approx(ctx, w, n - 1);
  const word = simplifyWord([...prev.word, ...inverseWord(wn.word), ...inverseWord(vn.word), ...wn.word, ...vn.word]);
  const q = qnormalize(qmul(qmul(qmul(qmul(vn.q, wn.q), qinv(vn.q)), qinv(wn.q)), prev.q));
  return { word, q };
}

/** SK(U, n) by the recursion. */
function approx(ctx: SkContext, target: Quat, n: number): Approx {
  let a = level0(ctx, target);
  for (let k = 1; k <= n; k++) a = step(ctx, target, a, k);
  return a;
}

/** The measured error model: level-0 error eps0 and the constant c of eps_n = c eps_{n-1}^{3/2}. */
export interface SkModel {
  readonly eps0: number;
  readonly c: number;
}

const models = new Map<number, SkModel>();

/** Number of levels and of seeded Haar-random targets the model is measured on. */
const MODEL_LEVELS = 3;
const MODEL_TARGETS = 32;

/**
 * Measure the model on seeded Haar-random targets: e_n is the 90th percentile of the level-n
 * error (n = 0..3), eps0 = e_0, and c is the geometric mean of e_n / e_{n-1}^{3/2} over n = 1..3
 * (Dawson & Nielsen 2005 predict eps_n ~ c eps_{n-1}^{3/2}; the constant is measured here).
 */
export function skModel(netTCount: number = DEFAULT_NET_TCOUNT): SkModel {
  let m = models.get(netTCount);
  if (m === undefined) {
    const ctx = skContext(netTCount);
    const errs: number[][] = Array.from({ length: MODEL_LEVELS + 1 }, () => []);
    for (const q of seededHaarQuats(MODEL_TARGETS, 0x5eed5c)) {
      let a = level0(ctx, q);
      errs[0]!.push(qdist(a.q, q));
      for (let n = 1; n <= MODEL_LEVELS; n++) {
        a = step(ctx, q, a, n);
        errs[n]!.push(qdist(a.q, q));
      }
    }
    const p90 = (xs: number[]): number => [...xs].sort((x, y) => x - y)[Math.floor(0.9 * (xs.length - 1))]!;
    const e = errs.map(p90);
    let logC = 0;
    for (let n = 1; n <= MODEL_LEVELS; n++) logC += Math.log(e[n]!) - 1.5 * Math.log(e[n - 1]!);
    m = { eps0: e[0]!, c: Math.exp(logC / MODEL_LEVELS) };
    models.set(netTCount, m);
  }
  return m;
}

/** The smallest depth whose model error is <= eps (Infinity when the model stops shrinking first). */
export function skPredictDepth(eps: number, netTCount: number = DEFAULT_NET_TCOUNT): number {
  const { eps0, c } = skModel(netTCount);
  let e = eps0;
  for (let n = 0; n <= 64; n++) {
    if (e <= eps) return n;
    const next = c * e ** 1.5;
    if (!(next < e)) return Infinity;
    e = next;
  }
  return Infinity;
}

/**
 * Approximate a single-qubit unitary (any 2x2 unitary; global phase ignored) by a Clifford+T word.
 *
 * Depth: with `opts.depth`, exactly that. Otherwise levels 0, 1, 2, ... are built in turn (each
 * level reuses the previous one, so nothing is recomputed) and the first whose word is within
 * eps is returned: never deeper than "predicted depth, then one deeper while the error exceeds
 * eps". The search stops at min(predicted + 2, maxDepth); if no level reaches eps, the level with
 * the smallest error is returned and `error > eps` tells the caller.
 */
export function skSynthesize(target: Mat2, eps: number, opts: SkOptions = {}): SkResult {
  return skSynthesizeQuat(matToQuat(target), eps, opts);
}

/** skSynthesize for a target already given as a unit quaternion (see quat.ts for the convention). */
export function skSynthesizeQuat(q: Quat, eps: number, opts: SkOptions = {}): SkResult {
  if (!(eps > 0)) throw new RangeError("skSynthesize: eps must be positive");
  if (!q.every(Number.isFinite) || !(Math.hypot(...q) > 0.5)) throw new RangeError("skSynthesize: the target is not a unit quaternion");
  const target = qnormalize(q); // for the recursion; errors are measured against q itself, scaled in double-double
  const L = opts.netTCount ?? DEFAULT_NET_TCOUNT;
  const ctx = skContext(L);
  if (opts.depth !== undefined) {
    if (!Number.isInteger(opts.depth) || opts.depth < 0) throw new RangeError("skSynthesize: depth must be a non-negative integer");
    const a = approx(ctx, target, opts.depth);
    return { word: a.word, error: ddWordDist(a.word, q), depth: opts.depth };
  }
  const maxDepth = opts.maxDepth ?? DEFAULT_MAX_DEPTH;
  const cap = Math.min(maxDepth, skPredictDepth(eps, L) + 2);
  let a = level0(ctx, target);
  let best: SkResult = { word: a.word, error: ddWordDist(a.word, q), depth: 0 };
  for (let n = 1; n <= cap && best.error > eps; n++) {
    a = step(ctx, target, a, n);
    const error = ddWordDist(a.word, q);
    if (error < best.error || error <= eps) best = { word: a.word, error, depth: n };
  }
  return best;
}

/** Approximate rz(theta) = diag(e^{-i theta/2}, e^{i theta/2}) within eps (up to global phase). */
export function skRz(theta: number, eps: number, opts: SkOptions = {}): SkResult {
  return skSynthesizeQuat(rzQuat(theta), eps, opts);
}
