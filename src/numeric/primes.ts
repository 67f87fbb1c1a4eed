// Primes and factoring on BigInt: trial division, Miller–Rabin, Pollard–Brent rho with a work limit, Jacobi symbol, Tonelli–Shanks.
import { gcd, modPow, mod, bitLength } from "./bigint.js";
import type { Rng } from "./prng.js";

/** The primes below `limit`, by the sieve of Eratosthenes. */
export function primesBelow(limit: number): number[] {
  const sieve = new Uint8Array(Math.max(limit, 2));
  const out: number[] = [];
  for (let i = 2; i < limit; i++) {
    if (sieve[i]) continue;
    out.push(i);
    for (let j = i * i; j < limit; j += i) sieve[j] = 1;
  }
  return out;
}

/** Trial-division bound used by default (all primes below it are removed by trial division). */
export const TRIAL_BOUND = 4096;
const SMALL_PRIMES: readonly number[] = primesBelow(TRIAL_BOUND);

/** Primes grouped so that each group's product stays below 2^52: one BigInt remainder per group. */
const PRIME_GROUPS: readonly { readonly prod: bigint; readonly primes: readonly number[] }[] = (() => {
  const groups: { prod: bigint; primes: number[] }[] = [];
  let cur: number[] = [];
  let prod = 1;
  for (const p of SMALL_PRIMES) {
    if (prod * p >= 2 ** 52) {
      groups.push({ prod: BigInt(prod), primes: cur });
      cur = [];
      prod = 1;
    }
    cur.push(p);
    prod *= p;
  }
  if (cur.length > 0) groups.push({ prod: BigInt(prod), primes: cur });
  return groups;
})();

/** A prime with its exponent. */
export interface PrimePower {
  readonly p: bigint;
  readonly e: number;
}

/**
 * Removes every prime below TRIAL_BOUND from n > 0: the prime powers found (ascending) and the rest,
 * which has no prime factor below TRIAL_BOUND.
 */
export function trialDivide(n: bigint): { readonly found: PrimePower[]; readonly rest: bigint } {
  if (n <= 0n) throw new RangeError("trialDivide: n must be positive");
  const found: PrimePower[] = [];
  for (const g of PRIME_GROUPS) {
    if (n === 1n) break;
    const r = Number(n % g.prod);
    for (const p of g.primes) {
      if (r % p !== 0) continue;
      const bp = BigInt(p);
      let e = 0;
      while (n % bp === 0n) {
        n /= bp;
        e++;
      }
      found.push({ p: bp, e });
    }
  }
  return { found, rest: n };
}

/** Miller–Rabin bases: the first 13 primes. */
const MR_BASES: readonly bigint[] = [2n, 3n, 5n, 7n, 11n, 13n, 17n, 19n, 23n, 29n, 31n, 37n, 41n];
/**
 * Below this bound the 13 bases above make Miller–Rabin a proof of primality
 * (Sorenson & Webster 2015, from memory: the least strong pseudoprime to the first 13 primes
 * exceeds 3.3 * 10^24). Above it the test says "strong probable prime to 13 fixed bases": no
 * composite passing it is known to us, and every use in synthesis ends in an exact check anyway.
 */
export const MR_DETERMINISTIC_BELOW = 3317044064679887385961981n;

/** Miller–Rabin with the fixed bases above: a proof below MR_DETERMINISTIC_BELOW, a strong probable-prime test beyond. */
export function isProbablePrime(n: bigint): boolean {
  if (n < 2n) return false;
  if (n < 4n) return true;
  if ((n & 1n) === 0n) return false;
  if (n < BigInt(TRIAL_BOUND) * BigInt(TRIAL_BOUND)) {
    for (const p of SMALL_PRIMES) {
      const bp = BigInt(p);
      if (bp * bp > n) return true;
      if (n % bp === 0n) return false;
    }
    return true;
  }
  for (const p of SMALL_PRIMES.slice(0, 50)) if (n % BigInt(p) === 0n) return false;
  let d = n - 1n;
  let s = 0;
  while ((d & 1n) === 0n) {
    d >>= 1n;
    s++;
  }
  outer: for (const a of MR_BASES) {
    let x = modPow(a, d, n);
    if (x === 1n || x === n - 1n) continue;
    for (let r = 1; r < s; r++) {
      x = (x * x) % n;
      if (x === n - 1n) continue outer;
      if (x === 1n) return false;
    }
    return false;
  }
  return true;
}

/**
 * Pollard's rho in Brent's variant: a non-trivial factor of the odd composite n, or null when
 * `maxIterations` evaluations of x -> x² + c (over several seeded restarts) found none.
 */
export function pollardBrent(n: bigint, rng: Rng, maxIterations: number): bigint | null {
  if ((n & 1n) === 0n) return 2n;
  const m = 64; // iterations per batched gcd
  let budget = maxIterations;
  while (budget > 0) {
    const c = 1n + rng.nextBelow(n - 3n);
    let y = 2n + rng.nextBelow(n - 3n);
    let g = 1n;
    let r = 1;
    let q = 1n;
    let x = y;
    let ys = y;
    do {
      x = y;
      for (let i = 0; i < r; i++) y = (y * y + c) % n;
      budget -= r;
      let k = 0;
      while (k < r && g === 1n) {
        ys = y;
        const lim = Math.min(m, r - k);
        for (let i = 0; i < lim; i++) {
          y = (y * y + c) % n;
          const diff = x > y ? x - y : y - x;
          q = (q * diff) % n;
        }
        budget -= lim;
        g = gcd(q, n);
        k += m;
      }
      r *= 2;
    } while (g === 1n && budget > 0);
    if (g === n) {
      // The batch overshot: step back one at a time from the saved point.
      g = 1n;
      for (let i = 0; i < m && g === 1n; i++) {
        ys = (ys * ys + c) % n;
        g = gcd(x > ys ? x - ys : ys - x, n);
      }
    }
    if (g !== 1n && g !== n) return g;
    // else: a degenerate cycle, or the budget ran out; restart with fresh constants while budget remains
  }
  return null;
}

/** Outcome of factoring with a work limit: the primes found, and composites that resisted (empty when complete). */
export interface Factorization {
  readonly primes: PrimePower[];
  readonly hard: bigint[];
}

/**
 * Factors n ≥ 1: trial division, then Miller–Rabin and Pollard–Brent (at most `maxIterations`
 * rho steps per composite met). Primes are merged and sorted ascending.
 */
export function factorize(n: bigint, rng: Rng, maxIterations: number): Factorization {
  const { found, rest } = trialDivide(n);
  const acc = new Map<bigint, number>();
  for (const f of found) acc.set(f.p, f.e);
  const hard: bigint[] = [];
  const stack: bigint[] = rest === 1n ? [] : [rest];
  while (stack.length > 0) {
    const m = stack.pop()!;
    if (m === 1n) continue;
    if (isProbablePrime(m)) {
      acc.set(m, (acc.get(m) ?? 0) + 1);
      continue;
    }
    const r = perfectPowerRoot(m);
    if (r !== null) {
      for (let i = 0; i < r.k; i++) stack.push(r.root);
      continue;
    }
    const f = pollardBrent(m, rng, maxIterations);
    if (f === null) {
      hard.push(m);
      continue;
    }
    stack.push(f, m / f);
  }
  const primes = [...acc.entries()].map(([p, e]) => ({ p, e })).sort((x, y) => (x.p < y.p ? -1 : x.p > y.p ? 1 : 0));
  return { primes, hard };
}

/** m = root^k with k ≥ 2 maximal-first search over prime k, or null (m > 1). Rho cannot split prime powers. */
export function perfectPowerRoot(m: bigint): { readonly root: bigint; readonly k: number } | null {
  const bits = bitLength(m);
  for (const k of SMALL_PRIMES) {
    if (k > bits) break;
    const r = iroot(m, k);
    if (r ** BigInt(k) === m) return { root: r, k };
  }
  return null;
}

/** ⌊m^(1/k)⌋ for m ≥ 0, k ≥ 1. */
export function iroot(m: bigint, k: number): bigint {
  if (m < 2n || k === 1) return m;
  const bk = BigInt(k);
  let x = 1n << BigInt(Math.ceil(bitLength(m) / k)); // ≥ the root
  for (;;) {
    const y = ((bk - 1n) * x + m / x ** (bk - 1n)) / bk;
    if (y >= x) return x;
    x = y;
  }
}

/** The Jacobi symbol (a/n) for odd n > 0. */
export function jacobi(a: bigint, n: bigint): -1 | 0 | 1 {
  if (n <= 0n || (n & 1n) === 0n) throw new RangeError("jacobi: n must be odd and positive");
  a = mod(a, n);
  let t = 1;
  while (a !== 0n) {
    while ((a & 1n) === 0n) {
      a >>= 1n;
      const r = n & 7n;
      if (r === 3n || r === 5n) t = -t;
    }
    [a, n] = [n, a];
    if ((a & 3n) === 3n && (n & 3n) === 3n) t = -t;
    a %= n;
  }
  return n === 1n ? (t as -1 | 1) : 0;
}

/**
 * A square root of a modulo the odd prime p (Tonelli–Shanks): r with r² ≡ a (mod p), 0 ≤ r < p,
 * or null when a is not a square mod p. The non-residue is the least one, so the result is deterministic.
 */
export function sqrtMod(a: bigint, p: bigint): bigint | null {
  a = mod(a, p);
  if (a === 0n) return 0n;
  if (p === 2n) return a;
  if (jacobi(a, p) !== 1) return null;
  if ((p & 3n) === 3n) {
    const r = modPow(a, (p + 1n) >> 2n, p);
    return (r * r) % p === a ? r : null;
  }
  let q = p - 1n;
  let s = 0;
  while ((q & 1n) === 0n) {
    q >>= 1n;
    s++;
  }
  let z = 2n;
  while (jacobi(z, p) !== -1) z++;
  let m = s;
  let c = modPow(z, q, p);
  let t = modPow(a, q, p);
  let r = modPow(a, (q + 1n) >> 1n, p);
  while (t !== 1n) {
    let i = 0;
    let t2 = t;
    while (t2 !== 1n) {
      t2 = (t2 * t2) % p;
      i++;
      if (i === m) return null; // p was not prime
    }
    let b = c;
    for (let j = 0; j < m - i - 1; j++) b = (b * b) % p;
    m = i;
    c = (b * b) % p;
    t = (t * c) % p;
    r = (r * b) % p;
  }
  return (r * r) % p === a ? r : null;
}
