// Nearest-neighbour index over the base net: a k-d tree on the quaternions, exact nearest under the phase-blind distance.
import { netQuat, type BaseNet } from "./base-net.js";
import type { Quat } from "./quat.js";

const LEAF = 8;

/**
 * A k-d tree over the 4-vectors of a net. Because |p - q|^2 = 2 - 2 p.q for unit vectors,
 * the nearest point under d(U, V) = sqrt(2 - |tr(U^dag V)|) is the Euclidean nearest of q or -q:
 * a query searches both and keeps the better (ties go to the lower tree position).
 */
export interface NetIndex {
  readonly net: BaseNet;
  /** Point indices, permuted so that every tree node owns a contiguous range. */
  readonly order: Int32Array;
  /** Per node: range start, range end, split dimension (-1 for a leaf), children. */
  readonly lo: Int32Array;
  readonly hi: Int32Array;
  readonly dim: Int8Array;
  readonly split: Float64Array;
  readonly left: Int32Array;
  readonly right: Int32Array;
}

export interface Nearest {
  /** Index of the point in the net. */
  readonly index: number;
  /** d(target, point). */
  readonly dist: number;
}

/** Build the k-d tree: split at the median of the coordinate with the widest spread. */
export function buildNetIndex(net: BaseNet): NetIndex {
  const n = net.size;
  const pts = net.quats;
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const maxNodes = 2 * Math.ceil(n / (LEAF / 2)) + 1;
  const lo = new Int32Array(maxNodes);
  const hi = new Int32Array(maxNodes);
  const dim = new Int8Array(maxNodes);
  const split = new Float64Array(maxNodes);
  const left = new Int32Array(maxNodes);
  const right = new Int32Array(maxNodes);
  let nodes = 0;

  // Rearrange order[a..b) so that order[k] holds the k-th smallest by coordinate d (Hoare selection).
  const select = (a: number, b: number, k: number, d: number): void => {
    let l = a;
    let r = b - 1;
    while (r > l) {
      const pivot = pts[4 * order[(l + r) >> 1]! + d]!;
      let i = l;
      let j = r;
      while (i <= j) {
        while (pts[4 * order[i]! + d]! < pivot) i++;
        while (pts[4 * order[j]! + d]! > pivot) j--;
        if (i <= j) {
          const t = order[i]!;
          order[i] = order[j]!;
          order[j] = t;
          i++;
          j--;
        }
      }
      if (k <= j) r = j;
      else if (k >= i) l = i;
      else return;
    }
  };

  const build = (a: number, b: number): number => {
    const node = nodes++;
    lo[node] = a;
    hi[node] = b;
    if (b - a <= LEAF) {
      dim[node] = -1;
      return node;
    }
    let best = 0;
    let bestSpread = -1;
    for (let d = 0; d < 4; d++) {
      let mn = Infinity;
      let mx = -Infinity;
      for (let i = a; i < b; i++) {
        const v = pts[4 * order[i]! + d]!;
        if (v < mn) mn = v;
        if (v > mx) mx = v;
      }
      if (mx - mn > bestSpread) {
        bestSpread = mx - mn;
        best = d;
      }
    }
    const mid = (a + b) >> 1;
    select(a, b, mid, best);
    dim[node] = best;
    split[node] = pts[4 * order[mid]! + best]!;
    left[node] = build(a, mid);
    right[node] = build(mid, b);
    return node;
  };
  build(0, n);
  return { net, order, lo, hi, dim, split, left, right };
}

/**
 * The net point nearest to q modulo sign, and its distance d. The search keeps, per dimension,
 * the offset from the query to the current cell, so a far subtree is skipped when the whole cell
 * lies farther than the best point so far (the incremental-distance refinement of the k-d tree).
 */
export function nearest(index: NetIndex, q: Quat): Nearest {
  const pts = index.net.quats;
  const { order, lo, hi, dim, split, left, right } = index;
  let bestD2 = Infinity;
  let bestPos = -1;
  const x = new Float64Array(4);
  const off = new Float64Array(4);
  const search = (node: number, rd: number): void => {
    const d = dim[node]!;
    if (d < 0) {
      const x0 = x[0]!, x1 = x[1]!, x2 = x[2]!, x3 = x[3]!;
      for (let p = lo[node]!; p < hi[node]!; p++) {
        const o = 4 * order[p]!;
        const e0 = pts[o]! - x0;
        const e1 = pts[o + 1]! - x1;
        const e2 = pts[o + 2]! - x2;
        const e3 = pts[o + 3]! - x3;
        const d2 = e0 * e0 + e1 * e1 + e2 * e2 + e3 * e3;
        if (d2 < bestD2 || (d2 === bestD2 && p < bestPos)) {
          bestD2 = d2;
          bestPos = p;
        }
      }
      return;
    }
    const diff = x[d]! - split[node]!;
    const near = diff < 0 ? left[node]! : right[node]!;
    const far = diff < 0 ? right[node]! : left[node]!;
    search(near, rd);
    const old = off[d]!;
    const rdFar = rd - old * old + diff * diff;
    if (rdFar <= bestD2) {
      off[d] = diff;
      search(far, rdFar);
      off[d] = old;
    }
  };
  // The points sit on the half q0 >= 0, so search the sign of q on that half first: its bound
  // then prunes almost all of the second search.
  const first = q[0] < 0 ? -1 : 1;
  for (const sg of [first, -first]) {
    for (let k = 0; k < 4; k++) {
      x[k] = sg * q[k]!;
      off[k] = 0;
    }
    search(0, 0);
  }
  const index_ = order[bestPos]!;
  const r = netQuat(index.net, index_);
  // Report the distance through the accurate difference formula rather than the squared sum.
  const m = Math.hypot(r[0] - q[0], r[1] - q[1], r[2] - q[2], r[3] - q[3]);
  const s = Math.hypot(r[0] + q[0], r[1] + q[1], r[2] + q[2], r[3] + q[3]);
  return { index: index_, dist: Math.min(m, s) };
}
