// The norm equation t†t = ξ over Z[ω] for a doubly positive ξ ∈ Z[√2]: factor N(ξ), split each prime, fix the unit, check exactly.
import { type ZOmega, ZO_ONE, ZO_ZERO, zoBullet, zoFromZSqrt2, zoGcd, zoMul, zoNormSq, zoPow } from "../rings/zomega.js";
import {
  type ZSqrt2,
  ZS_ONE,
  zsDivExact,
  zsEq,
  zsGcd,
  zsIsDoublyPositive,
  zsIsZero,
  zsLambdaPow,
  zsNorm,
} from "../rings/zsqrt2.js";
import { bitLength, gcd, mod } from "../../numeric/bigint.js";
import { isProbablePrime, perfectPowerRoot, pollardBrent, sqrtMod, trialDivide } from "../../numeric/primes.js";
import { ecmFactor } from "../../numeric/ecm.js";
import type { Rng } from "../../numeric/prng.js";

/** Outcome: a solution, a proof that none exists, or "hard" (a composite could not be split within the work limit). */
export type NormSolution =
  | { readonly kind: "solved"; readonly t: ZOmega }
  | { readonly kind: "unsolvable" }
  | { readonly kind: "hard" };

const UNSOLVABLE: NormSolution = { kind: "unsolvable" };
const HARD: NormSolution = { kind: "hard" };

/** δ = 1 + ω: δ†δ = √2 λ. */
const DELTA: ZOmega = { a: 1n, b: 1n, c: 0n, d: 0n };

/**
 * Solves t†t = ξ (ξ ∈ Z[√2]). Rho gets at most `rhoIterations` steps per composite; a composite that
 * resists rho then gets `ecmCurves` elliptic curves (stage-1 bound 500 up to 110 bits, 1000 beyond; stage 2 to 50 times that).
 *
 * Why the early exits are sound: write n = N(ξ) = ξξ•. Primes p ≡ 3, 5 (mod 8) are inert in Z[√2], so
 * they divide n to even powers; a prime p ≡ 7 (mod 8) splits as ηη• in Z[√2] and each of η, η• stays
 * prime in Z[ω], so a solution needs both exponents even, hence an even exponent in n. So when a
 * solution exists, the odd part of n is a product of primes ≡ 1 (mod 8) and odd squares, i.e. ≡ 1
 * (mod 8); and the same holds for any part of n made of whole prime powers. A part ≢ 1 (mod 8) proves
 * that no solution exists without factoring it.
 */
export function solveNormEquation(xi: ZSqrt2, rng: Rng, rhoIterations: number, ecmCurves = 0): NormSolution {
  if (zsIsZero(xi)) return { kind: "solved", t: ZO_ZERO };
  if (!zsIsDoublyPositive(xi)) return UNSOLVABLE;
  let n = zsNorm(xi);
  // The √2-part: ξ = √2^m ξ' with ξ' odd; n = (-2)^m N(ξ').
  let m = 0;
  while ((n & 1n) === 0n) {
    n >>= 1n;
    m++;
  }
  const { found, rest } = trialDivide(n);
  const primes: { p: bigint; e: number }[] = [];
  for (const f of found) {
    if (!admissible(f.p, f.e)) return UNSOLVABLE;
    primes.push({ p: f.p, e: f.e });
  }
  let left = rest; // product of whole prime powers not yet found
  const stack: bigint[] = left === 1n ? [] : [left];
  while (left !== 1n) {
    if ((left & 7n) !== 1n) return UNSOLVABLE;
    let c = stack.pop();
    if (c === undefined) {
      c = left; // every piece was consumed but something remains (a shared prime): start again from it
    }
    c = gcd(c, left);
    if (c === 1n) continue;
    if (isProbablePrime(c)) {
      let e = 0;
      while (left % c === 0n) {
        left /= c;
        e++;
      }
      if (!admissible(c, e)) return UNSOLVABLE;
      primes.push({ p: c, e });
      continue;
    }
    const pw = perfectPowerRoot(c);
    if (pw !== null) {
      stack.push(pw.root);
      continue;
    }
    const f = pollardBrent(c, rng, rhoIterations) ?? (ecmCurves > 0 ? ecmFactor(c, rng, ecmCurves, bitLength(c) <= 110 ? 500 : 1000) : null);
    if (f === null) return HARD;
    stack.push(c / f, f);
  }
  return assemble(xi, m, primes);
}

/** The exponent e of p in N(ξ) allows a solution: p ≡ 7 (mod 8) needs e even (p ≡ 3, 5 always have e even). */
function admissible(p: bigint, e: number): boolean {
  const r = p & 7n;
  if (r === 7n || r === 3n || r === 5n) return e % 2 === 0;
  return true;
}

/** A prime of Z[√2] above the rational prime p ≡ ±1 (mod 8): gcd(p, x + √2) with x² ≡ 2 (mod p). */
function splitInZSqrt2(p: bigint): ZSqrt2 | null {
  const x = sqrtModPrime(2n, p);
  if (x === null) return null;
  return zsGcd({ a: p, b: 0n }, { a: x, b: 1n });
}

/** v_η(x) and x / η^v, for η a prime of Z[√2]. */
function valuation(x: ZSqrt2, eta: ZSqrt2): { readonly v: number; readonly rest: ZSqrt2 } {
  let v = 0;
  for (;;) {
    const q = zsDivExact(x, eta);
    if (q === null) return { v, rest: x };
    x = q;
    v++;
  }
}

function assemble(xi: ZSqrt2, m: number, primes: readonly { p: bigint; e: number }[]): NormSolution {
  let t: ZOmega = m > 0 ? zoPow(DELTA, m) : ZO_ONE;
  let x = xi; // what remains to be matched, as an element of Z[√2] (only used for valuations)
  for (const { p, e } of primes) {
    const r = p & 7n;
    if (r === 3n || r === 5n) {
      // p inert in Z[√2], splits in Z[ω]: t_p = gcd(p, h + i) (h² = -1) or gcd(p, h + i√2) (h² = -2)
      const h = sqrtModPrime(r === 5n ? -1n : -2n, p);
      if (h === null) return HARD; // p was not prime after all
      const g = r === 5n ? { a: h, b: 0n, c: 1n, d: 0n } : { a: h, b: 1n, c: 0n, d: 1n };
      const tp = zoGcd({ a: p, b: 0n, c: 0n, d: 0n }, g);
      t = zoMul(t, zoPow(tp, e / 2));
      continue;
    }
    const eta = splitInZSqrt2(p);
    if (eta === null) return HARD;
    const etaB: ZSqrt2 = { a: eta.a, b: -eta.b };
    const va = valuation(x, eta);
    const vb = valuation(va.rest, etaB);
    x = vb.rest;
    if (va.v + vb.v !== e) return HARD; // inconsistent: p was not prime
    if (r === 7n) {
      if (va.v % 2 !== 0 || vb.v % 2 !== 0) return UNSOLVABLE;
      t = zoMul(t, zoMul(zoPow(zoFromZSqrt2(eta), va.v / 2), zoPow(zoFromZSqrt2(etaB), vb.v / 2)));
      continue;
    }
    // p ≡ 1 (mod 8): η splits in Z[ω] as s s† with s = gcd(η, h + i), h² = -1 (mod p)
    const h = sqrtModPrime(-1n, p);
    if (h === null) return HARD;
    const s = zoGcd(zoFromZSqrt2(eta), { a: h, b: 0n, c: 1n, d: 0n });
    t = zoMul(t, zoMul(zoPow(s, va.v), zoPow(zoBullet(s), vb.v)));
  }
  return fixUnit(t, xi);
}

/** Given t0 with t0†t0 = ξ·v for a doubly positive unit v = λ^{2j}, returns t = t0 λ^{-j} with t†t = ξ, checked exactly. */
function fixUnit(t0: ZOmega, xi: ZSqrt2): NormSolution {
  const n0 = zoNormSq(t0);
  const v = zsDivExact(n0, xi);
  if (v === null || (zsNorm(v) !== 1n && zsNorm(v) !== -1n)) return HARD;
  // log_λ v ≈ log2(v)/log2(λ); v ≈ 2|a| when |v| is large; j = log_λ(v)/2.
  let j = 0;
  if (!zsEq(v, ZS_ONE)) {
    const lg = bitLength(v.a) / Math.log2(1 + Math.SQRT2);
    j = Math.round(lg / 2) * (v.b > 0n ? 1 : -1);
  }
  let t = zoMul(t0, zoFromZSqrt2(zsLambdaPow(-j)));
  // correct a possible off-by-one in the estimate
  for (let guard = 0; guard < 8; guard++) {
    const nt = zoNormSq(t);
    if (zsEq(nt, xi)) return { kind: "solved", t };
    const w = zsDivExact(nt, xi);
    if (w === null) return HARD;
    t = zoMul(t, zoFromZSqrt2(zsLambdaPow(w.b > 0n ? -1 : 1)));
  }
  return HARD;
}

/** A square root of a modulo the (probable) prime p, or null (delegates to Tonelli–Shanks). */
function sqrtModPrime(a: bigint, p: bigint): bigint | null {
  return sqrtMod(mod(a, p), p);
}
