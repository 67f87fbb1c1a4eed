// Benchmark of z-rotation synthesis: T-count against 3 log2(1/eps), certified optimality and time, per eps, on seeded angles.
import { performance } from "node:perf_hooks";
import { synthRz } from "../src/synth/index.js";
import { seededRng } from "../src/numeric/prng.js";

export const BENCH_EPS: readonly string[] = ["1e-3", "1e-6", "1e-10", "1e-15", "1e-20", "1e-30", "1e-50"];

export interface SynthBenchRow {
  readonly eps: string;
  readonly count: number;
  readonly meanT: number;
  readonly maxT: number;
  /** mean of T - 3 log2(1/eps) */
  readonly meanExcess: number;
  readonly certifiedFraction: number;
  readonly medianMs: number;
  readonly p95Ms: number;
  readonly skippedTotal: number;
}

/** Seeded target angles, uniform in (-2π, 2π), as decimal strings. */
export function benchAngles(count: number, seed = 20261202): string[] {
  const rng = seededRng(seed);
  return Array.from({ length: count }, () => (rng.nextFloat() * 4 * Math.PI - 2 * Math.PI).toFixed(17));
}

/** Runs the z-rotation benchmark for one eps. */
export function benchSynthEps(eps: string, angles: readonly string[]): SynthBenchRow {
  const times: number[] = [];
  let sumT = 0;
  let maxT = 0;
  let cert = 0;
  let skipped = 0;
  const log = 3 * Math.log2(1 / Number(eps));
  for (const a of angles) {
    const t0 = performance.now();
    const r = synthRz({ pi: null, value: a }, eps);
    times.push(performance.now() - t0);
    if (Number(r.error) > Number(eps)) throw new Error(`bench: error ${r.error} above ${eps}`);
    sumT += r.tCount;
    maxT = Math.max(maxT, r.tCount);
    if (r.certifiedOptimal) cert++;
    skipped += r.skipped;
  }
  times.sort((x, y) => x - y);
  const n = angles.length;
  return {
    eps,
    count: n,
    meanT: sumT / n,
    maxT,
    meanExcess: sumT / n - log,
    certifiedFraction: cert / n,
    medianMs: times[Math.floor((n - 1) / 2)]!,
    p95Ms: times[Math.min(n - 1, Math.ceil(0.95 * n) - 1)]!,
    skippedTotal: skipped,
  };
}

/** The markdown table: one row per eps, `perEps` seeded angles each (default 100). */
export async function benchSynth(perEps = 100): Promise<string> {
  const angles = benchAngles(perEps);
  const rows: SynthBenchRow[] = [];
  for (const eps of BENCH_EPS) {
    rows.push(benchSynthEps(eps, angles));
    await new Promise((resolve) => setImmediate(resolve));
  }
  const head =
    "| eps | rotations | mean T | max T | mean T - 3 log2(1/eps) | certified optimal | skipped candidates | median ms | p95 ms |\n" +
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |";
  const body = rows.map(
    (r) =>
      `| ${r.eps} | ${r.count} | ${r.meanT.toFixed(1)} | ${r.maxT} | ${r.meanExcess >= 0 ? "+" : ""}${r.meanExcess.toFixed(2)} | ${(100 * r.certifiedFraction).toFixed(0)}% | ${r.skippedTotal} | ${r.medianMs.toFixed(1)} | ${r.p95Ms.toFixed(1)} |`,
  );
  return [head, ...body].join("\n");
}
