// Benchmark: exact synthesis time against the least denominator exponent of random Clifford+T unitaries (should grow linearly).
import { seededRng } from "../src/numeric/prng.js";
import { type ExactU2, u2ApplyGate, u2MulOmega } from "../src/synth/exact/matrix.js";
import { CLIFFORDS } from "../src/synth/exact/clifford.js";
import { exactSynthesize } from "../src/synth/exact/normal-form.js";
import { tCount } from "../src/synth/exact/word.js";

/** Seeded floats in [0, 1) from the project's one generator (numeric/prng.ts). */
function rng(seed: number): () => number {
  const g = seededRng(seed);
  return () => g.nextFloat();
}

/** A random unitary with least denominator exponent exactly k: a random Clifford, then random syllables H·T or S·H·T, a random phase. */
function randomUnitary(r: () => number, k: number): ExactU2 {
  let u = CLIFFORDS[Math.floor(r() * 24)]!.matrix;
  while (u.k < k) {
    // left-multiply by the syllable H·T or S·H·T (circuit order: t, h[, s])
    u = u2ApplyGate("h", u2ApplyGate("t", u));
    if (r() < 0.5) u = u2ApplyGate("s", u);
  }
  if (r() < 0.5) u = u2ApplyGate("t", u);
  return u2MulOmega(u, Math.floor(r() * 8));
}

export async function benchExact(): Promise<string> {
  const r = rng(2024);
  const rows: string[] = [];
  rows.push("Random Clifford+T unitaries with least denominator exponent k; time is process CPU time per call (robust to other load).");
  rows.push("");
  rows.push("| lde k | samples | mean T-count | mean CPU time (µs) | µs per unit of k |");
  rows.push("|------:|--------:|-------------:|---------------:|-----------------:|");
  // warm up the JIT on a mix of sizes before timing anything
  for (let i = 0; i < 2000; i++) exactSynthesize(randomUnitary(r, 1 + (i % 60)));
  for (const [k, samples] of [
    [10, 4000],
    [50, 1000],
    [100, 500],
    [200, 250],
  ] as const) {
    const us: ExactU2[] = [];
    for (let i = 0; i < samples; i++) us.push(randomUnitary(r, k));
    let tsum = 0;
    const c0 = process.cpuUsage();
    for (const u of us) tsum += tCount(exactSynthesize(u).word);
    const c1 = process.cpuUsage(c0);
    const dt = (c1.user + c1.system) / samples;
    rows.push(`| ${k} | ${samples} | ${(tsum / samples).toFixed(1)} | ${dt.toFixed(1)} | ${(dt / k).toFixed(2)} |`);
  }
  return rows.join("\n");
}
