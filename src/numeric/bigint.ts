// Small exact BigInt primitives: bit length, integer roots, rounding division, gcd, modular power and inverse.

/** |n|. */
export function bigAbs(n: bigint): bigint {
  return n < 0n ? -n : n;
}

/** Number of bits of |n| (0 for n = 0). */
export function bitLength(n: bigint): number {
  if (n < 0n) n = -n;
  if (n === 0n) return 0;
  // toString(16) is linear time; refine the last hex digit.
  const hex = n.toString(16);
  const top = parseInt(hex[0]!, 16);
  return (hex.length - 1) * 4 + (32 - Math.clz32(top));
}

/** ⌊√n⌋ for n ≥ 0. */
export function isqrt(n: bigint): bigint {
  if (n < 0n) throw new RangeError("isqrt of a negative number");
  if (n < 2n) return n;
  if (n < 1n << 52n) {
    // Doubles are exact here up to one unit: fix up.
    let r = BigInt(Math.floor(Math.sqrt(Number(n))));
    while (r * r > n) r--;
    while ((r + 1n) * (r + 1n) <= n) r++;
    return r;
  }
  // Newton from an upper bound 2^ceil(bits/2).
  let x = 1n << BigInt((bitLength(n) + 1) >> 1);
  for (;;) {
    const y = (x + n / x) >> 1n;
    if (y >= x) return x;
    x = y;
  }
}

/** ⌈√n⌉ for n ≥ 0. */
export function isqrtCeil(n: bigint): bigint {
  const r = isqrt(n);
  return r * r === n ? r : r + 1n;
}

/** ⌊p/q⌋ for q ≠ 0. */
export function divFloor(p: bigint, q: bigint): bigint {
  if (q < 0n) {
    p = -p;
    q = -q;
  }
  const r = p / q;
  return p < 0n && r * q !== p ? r - 1n : r;
}

/** ⌈p/q⌉ for q ≠ 0. */
export function divCeil(p: bigint, q: bigint): bigint {
  return -divFloor(-p, q);
}

/** The nearest integer to p/q (q ≠ 0), ties rounded up: ⌊(2p + q) / 2q⌋. */
export function divRound(p: bigint, q: bigint): bigint {
  if (q < 0n) {
    p = -p;
    q = -q;
  }
  return divFloor(2n * p + q, 2n * q);
}

/** gcd(|a|, |b|) (gcd(0, 0) = 0). */
export function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** a mod m in [0, m) for m > 0. */
export function mod(a: bigint, m: bigint): bigint {
  const r = a % m;
  return r < 0n ? r + m : r;
}

/** base^exp mod m for exp ≥ 0, m ≥ 1 (left-to-right square and multiply). */
export function modPow(base: bigint, exp: bigint, m: bigint): bigint {
  if (m === 1n) return 0n;
  if (exp < 0n) throw new RangeError("modPow: negative exponent");
  base = mod(base, m);
  let result = 1n;
  const bits = exp.toString(2);
  for (let i = 0; i < bits.length; i++) {
    result = (result * result) % m;
    if (bits.charCodeAt(i) === 49) result = (result * base) % m;
  }
  return result;
}

/** The inverse of a modulo m (m > 1), or null when gcd(a, m) ≠ 1 (extended Euclid). */
export function modInverse(a: bigint, m: bigint): bigint | null {
  let [r0, r1] = [mod(a, m), m];
  let [s0, s1] = [1n, 0n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  if (r0 !== 1n) return null;
  return mod(s0, m);
}

/** The exponent of the prime power p in n (n ≠ 0), and n with those factors removed. */
export function removeFactor(n: bigint, p: bigint): { readonly e: number; readonly rest: bigint } {
  let e = 0;
  while (n % p === 0n) {
    n /= p;
    e++;
  }
  return { e, rest: n };
}
