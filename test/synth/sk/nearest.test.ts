// Tests of the nearest-neighbour index: the k-d tree agrees with a brute-force scan under the phase-blind distance.
import { describe, expect, it } from "vitest";
import { buildBaseNet, netQuat, type BaseNet } from "../../../src/synth/sk/base-net.js";
import { buildNetIndex, nearest } from "../../../src/synth/sk/nearest.js";
import { qdist, type Quat } from "../../../src/synth/sk/quat.js";
import { seededHaarQuats } from "../../../src/synth/sk/seeded.js";
import { skContext } from "../../../src/synth/sk/solovay-kitaev.js";

/** Brute force: the largest |p.q| over the net, i.e. the smallest sqrt(2 - |tr(U^dag V)|). */
function bruteForce(net: BaseNet, q: Quat): { index: number; absDot: number } {
  let best = -1;
  let index = -1;
  for (let i = 0; i < net.size; i++) {
    const o = 4 * i;
    const dot = Math.abs(net.quats[o]! * q[0] + net.quats[o + 1]! * q[1] + net.quats[o + 2]! * q[2] + net.quats[o + 3]! * q[3]);
    if (dot > best) {
      best = dot;
      index = i;
    }
  }
  return { index, absDot: best };
}

function checkAgainstBruteForce(net: BaseNet, queries: readonly Quat[]): void {
  const index = buildNetIndex(net);
  for (const q of queries) {
    const got = nearest(index, q);
    const want = bruteForce(net, q);
    // Same distance (an exact tie between two different points would be the only reason for another index).
    const wantDist = qdist(netQuat(net, want.index), q);
    expect(Math.abs(got.dist - wantDist)).toBeLessThan(1e-15);
    expect(Math.abs(got.dist - qdist(netQuat(net, got.index), q))).toBe(0);
    if (got.index !== want.index) expect(got.dist).toBe(wantDist);
  }
}

describe("nearest-neighbour index", () => {
  it("agrees with brute force on a small net: random queries, both signs, and points near net points", () => {
    const net = buildBaseNet(5);
    const queries: Quat[] = [...seededHaarQuats(400, 21)];
    for (const q of seededHaarQuats(50, 22)) queries.push([-q[0], -q[1], -q[2], -q[3]]);
    for (let i = 0; i < net.size; i += 37) {
      const p = netQuat(net, i);
      queries.push(p, [-p[0], -p[1], -p[2], -p[3]]);
      const e: Quat = [p[0] + 1e-3, p[1] - 2e-3, p[2], p[3] + 1e-3];
      const n = Math.hypot(...e);
      queries.push([e[0] / n, e[1] / n, e[2] / n, e[3] / n]);
    }
    checkAgainstBruteForce(net, queries);
  });

  it("a query at a net point finds that point at distance 0", () => {
    const net = buildBaseNet(4);
    const index = buildNetIndex(net);
    for (let i = 0; i < net.size; i += 5) {
      const r = nearest(index, netQuat(net, i));
      expect(r.index).toBe(i);
      expect(r.dist).toBe(0);
    }
  });

  it("agrees with brute force on the default net", () => {
    const { net } = skContext();
    checkAgainstBruteForce(net, seededHaarQuats(60, 23));
  });
});
