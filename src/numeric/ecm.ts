// Lenstra's elliptic-curve method, stage 1 only, on Montgomery curves with x-only arithmetic and Suyama's parametrization.
import { gcd, mod, modInverse } from "./bigint.js";
import { primesBelow } from "./primes.js";
import type { Rng } from "./prng.js";

// A point is (X : Z) on By² = x³ + Ax² + x; only x = X/Z is tracked (Montgomery 1987).
// xDBL and xADD use a24 = (A + 2)/4. Stage 1 multiplies a random point by every prime power ≤ B1;
// when the group order mod some prime p | n is B1-smooth, Z ≡ 0 (mod p) and gcd(Z, n) reveals p.

const primeCache = new Map<number, number[]>();
function primesUpTo(b: number): number[] {
  let ps = primeCache.get(b);
  if (!ps) {
    ps = primesBelow(b + 1);
    primeCache.set(b, ps);
  }
  return ps;
}

/**
 * A non-trivial factor of the odd composite n (not a prime power), or null after `curves` curves with
 * stage-1 bound B1. Curves are drawn from `rng` (deterministic for a seeded generator).
 */
export function ecmFactor(n: bigint, rng: Rng, curves: number, B1: number, B2 = 50 * B1): bigint | null {
  const primes = primesUpTo(B1);
  const primes2 = primesUpTo(B2).filter((q) => q > B1);
  // scalars: the prime powers p^e ≤ B1, as bit strings for the ladder
  const scalars: string[] = [];
  for (const p of primes) {
    let q = p;
    while (q * p <= B1) q *= p;
    scalars.push(BigInt(q).toString(2));
  }
  for (let c = 0; c < curves; c++) {
    const sigma = 6n + rng.nextBelow(n - 7n);
    const u = mod(sigma * sigma - 5n, n);
    const v = mod(4n * sigma, n);
    const u3 = (u * u % n) * u % n;
    const den = mod(16n * u3 * v, n);
    const inv = modInverse(den, n);
    if (inv === null) {
      const g = gcd(den, n);
      if (g !== 1n && g !== n) return g;
      continue;
    }
    const vmu = mod(v - u, n);
    const a24 = ((vmu * vmu % n) * vmu % n) * mod(3n * u + v, n) % n * inv % n;
    let X = u3;
    let Z = (v * v % n) * v % n;
    for (const bits of scalars) {
      // Montgomery ladder for k = bits (MSB first): R0 = P, R1 = 2P
      const PX = X;
      const PZ = Z;
      let X0 = PX;
      let Z0 = PZ;
      let [X1, Z1] = xdbl(PX, PZ, a24, n);
      for (let i = 1; i < bits.length; i++) {
        if (bits.charCodeAt(i) === 49) {
          [X0, Z0] = xadd(X0, Z0, X1, Z1, PX, PZ, n);
          [X1, Z1] = xdbl(X1, Z1, a24, n);
        } else {
          [X1, Z1] = xadd(X0, Z0, X1, Z1, PX, PZ, n);
          [X0, Z0] = xdbl(X0, Z0, a24, n);
        }
      }
      X = X0;
      Z = Z0;
    }
    const g = gcd(Z, n);
    if (g !== 1n && g !== n) return g;
    if (g === n) continue;
    const g2 = gcd(stage2(X, Z, a24, n, primes2), n);
    if (g2 !== 1n && g2 !== n) return g2;
  }
  return null;
}

/** Half-width of the stage-2 baby steps: giant steps are odd multiples of D, baby steps the odd d < D. */
const D = 210;

/**
 * Stage 2 (standard continuation): for every prime q in the list, q = m ± d with m an odd multiple of D
 * and d < D odd; if [q]Q = O mod p then x([m]Q) = x([d]Q) mod p, so the product of
 * X_m Z_d - X_d Z_m over all q is ≡ 0 (mod p).
 */
function stage2(X: bigint, Z: bigint, a24: bigint, n: bigint, primes2: readonly number[]): bigint {
  if (primes2.length === 0) return 1n;
  // baby steps [d]Q for odd d < D
  const bx: bigint[] = new Array(D).fill(0n);
  const bz: bigint[] = new Array(D).fill(0n);
  bx[1] = X;
  bz[1] = Z;
  const [X2, Z2] = xdbl(X, Z, a24, n);
  if (D > 3) [bx[3], bz[3]] = xadd(X2, Z2, X, Z, X, Z, n);
  for (let d = 5; d < D; d += 2) [bx[d], bz[d]] = xadd(bx[d - 2]!, bz[d - 2]!, X2, Z2, bx[d - 4]!, bz[d - 4]!, n);
  // giant steps R_j = [(2j+1) D]Q
  const ladder = (k: number): [bigint, bigint] => {
    const bits = k.toString(2);
    let [X0, Z0] = [X, Z];
    let [X1, Z1] = xdbl(X, Z, a24, n);
    for (let i = 1; i < bits.length; i++) {
      if (bits.charCodeAt(i) === 49) {
        [X0, Z0] = xadd(X0, Z0, X1, Z1, X, Z, n);
        [X1, Z1] = xdbl(X1, Z1, a24, n);
      } else {
        [X1, Z1] = xadd(X0, Z0, X1, Z1, X, Z, n);
        [X0, Z0] = xdbl(X0, Z0, a24, n);
      }
    }
    return [X0, Z0];
  };
  const [XD2, ZD2] = ladder(2 * D);
  let j = Math.max(0, Math.floor((primes2[0]! / D - 1) / 2));
  let [Xp, Zp] = j === 0 ? ladder(D) : ladder((2 * j - 1) * D); // R_{j-1} (R_{-1} has the x of R_0)
  let [Xc, Zc] = ladder((2 * j + 1) * D);
  let acc = 1n;
  let qi = 0;
  while (qi < primes2.length) {
    const m = (2 * j + 1) * D;
    while (qi < primes2.length && primes2[qi]! < m + D) {
      const q = primes2[qi]!;
      const d = q > m ? q - m : m - q;
      acc = (acc * (Xc * bz[d]! - bx[d]! * Zc)) % n;
      qi++;
    }
    const [Xn, Zn] = j === 0 ? xadd(XD2, ZD2, Xc, Zc, Xc, Zc, n) : xadd(Xc, Zc, XD2, ZD2, Xp, Zp, n);
    [Xp, Zp] = [Xc, Zc];
    [Xc, Zc] = [Xn, Zn];
    j++;
  }
  return mod(acc, n);
}

function xdbl(X: bigint, Z: bigint, a24: bigint, n: bigint): [bigint, bigint] {
  const s = X + Z;
  const d = X - Z;
  const t1 = (s * s) % n;
  const t2 = (d * d) % n;
  const t3 = t1 - t2;
  return [(t1 * t2) % n, mod(t3 * ((t2 + a24 * t3) % n), n)];
}

function xadd(Xp: bigint, Zp: bigint, Xq: bigint, Zq: bigint, Xd: bigint, Zd: bigint, n: bigint): [bigint, bigint] {
  const u = ((Xp - Zp) * (Xq + Zq)) % n;
  const v = ((Xp + Zp) * (Xq - Zq)) % n;
  const s = u + v;
  const d = u - v;
  return [(Zd * ((s * s) % n)) % n, mod(Xd * ((d * d) % n), n)];
}
