// Benchmark of the Solovay–Kitaev baseline on seeded rz angles: T-count against 3 log2(1/eps), word length growth, time.
import { seededRng } from "../src/numeric/prng.js";
import { normalizeWord } from "../src/synth/exact/normal-form.js";
import { tCount } from "../src/synth/exact/word.js";
import { DEFAULT_NET_TCOUNT, skContext, skModel, skRz } from "../src/synth/sk/solovay-kitaev.js";

interface Row {
  readonly eps: number;
  readonly angles: number;
}

/** The eps values measured and how many angles each (fewer where a single run takes most of a second). */
const ROWS: readonly Row[] = [
  { eps: 1e-2, angles: 100 },
  { eps: 1e-3, angles: 100 },
  { eps: 1e-4, angles: 100 },
  { eps: 1e-6, angles: 100 },
  { eps: 1e-8, angles: 100 },
  { eps: 1e-10, angles: 100 },
  { eps: 1e-12, angles: 30 },
  { eps: 1e-14, angles: 10 },
];

/** Rows whose words also go through exact normalization, and on how many of their angles. */
const NORMALIZE_MAX_EPS = 1e-6;
const NORMALIZE_ANGLES = 20;

const quantile = (xs: readonly number[], p: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(p * s.length) - 1)]!;
};
const mean = (xs: readonly number[]): number => xs.reduce((a, b) => a + b, 0) / xs.length;
const fmt = (x: number, d = 1): string => x.toFixed(d);
const ms = (x: number): string => (x < 10 ? x.toFixed(2) : x.toFixed(0));

/**
 * Markdown tables: one row per eps with 100 seeded rz angles uniform in (-pi, pi] (fewer where
 * stated), mean T-count, mean T - 3 log2(1/eps), depth, word length, worst error, median and p95
 * time per angle (after the one-off net build, reported apart), and the fitted exponent c of
 * length ~ log^c(1/eps).
 */
export async function benchSk(): Promise<string> {
  const t0 = performance.now();
  const ctx = skContext();
  const buildMs = performance.now() - t0;
  const t1 = performance.now();
  const model = skModel();
  const modelMs = performance.now() - t1;

  const lines: string[] = [];
  lines.push(
    `Base net: all ${ctx.net.size} operators of T-count <= ${DEFAULT_NET_TCOUNT} (up to phase), built with its k-d tree in ${ms(buildMs)} ms; ` +
      `error model measured in ${ms(modelMs)} ms: level-0 error (90th percentile) ${model.eps0.toExponential(2)}, ` +
      `eps_n = ${model.c.toFixed(2)} eps_{n-1}^1.5. Errors are d(U, V) = sqrt(2 - |tr(U^dag V)|) of the returned word, evaluated in double-double arithmetic.`,
  );
  lines.push("");
  lines.push("| eps | angles | mean depth | mean T-count | mean T - 3 log2(1/eps) | mean length | max error | median ms | p95 ms |");
  lines.push("|---|---|---|---|---|---|---|---|---|");
  const fitX: number[] = [];
  const fitY: number[] = [];
  const normRows: string[] = [];
  for (const row of ROWS) {
    const rng = seededRng(0x5c0ffee ^ Math.round(-Math.log10(row.eps)));
    const ts: number[] = [];
    const tcs: number[] = [];
    const lens: number[] = [];
    const depths: number[] = [];
    let maxErr = 0;
    let missed = 0;
    const normT: number[] = [];
    const normSk: number[] = [];
    for (let i = 0; i < row.angles; i++) {
      const theta = (1 - 2 * rng.nextFloat()) * Math.PI;
      const s = performance.now();
      const r = skRz(theta, row.eps);
      ts.push(performance.now() - s);
      tcs.push(tCount(r.word));
      lens.push(r.word.length);
      depths.push(r.depth);
      maxErr = Math.max(maxErr, r.error);
      if (r.error > row.eps) missed++;
      fitX.push(Math.log(Math.log(1 / row.eps)));
      fitY.push(Math.log(r.word.length));
      if (row.eps >= NORMALIZE_MAX_EPS && i < NORMALIZE_ANGLES) {
        normSk.push(tCount(r.word));
        normT.push(tCount(normalizeWord(r.word).word));
      }
    }
    if (normT.length > 0)
      normRows.push(
        `| ${row.eps.toExponential(0)} | ${normT.length} | ${fmt(mean(normSk))} | ${fmt(mean(normT))} | ${fmt(100 * (1 - mean(normT) / mean(normSk)))}% |`,
      );
    const excess = mean(tcs) - 3 * Math.log2(1 / row.eps);
    lines.push(
      `| ${row.eps.toExponential(0)} | ${row.angles}${missed > 0 ? ` (${missed} above eps)` : ""} | ${fmt(mean(depths), 2)} | ${fmt(mean(tcs))} | ${fmt(excess)} | ${fmt(mean(lens))} | ${maxErr.toExponential(1)} | ${ms(quantile(ts, 0.5))} | ${ms(quantile(ts, 0.95))} |`,
    );
  }
  // Least-squares slope of log(length) on log(log(1/eps)) over every run above.
  const mx = mean(fitX);
  const my = mean(fitY);
  let sxy = 0;
  let sxx = 0;
  fitX.forEach((x, i) => {
    sxy += (x - mx) * (fitY[i]! - my);
    sxx += (x - mx) ** 2;
  });
  lines.push("");
  lines.push("Same words rewritten in Matsumoto–Amano normal form by the exact layer (least T-count for the same operator):");
  lines.push("");
  lines.push("| eps | angles | mean T-count as returned | mean T-count in normal form | saved |");
  lines.push("|---|---|---|---|---|");
  lines.push(...normRows);
  lines.push("");
  lines.push(
    `Fitted growth: word length ~ log^c(1/eps) with c = ${(sxy / sxx).toFixed(2)} over eps = ${ROWS[0]!.eps.toExponential(0)} .. ${ROWS[ROWS.length - 1]!.eps.toExponential(0)} ` +
      `(Dawson & Nielsen 2005, from memory: c = log 5 / log 1.5 = 3.97 asymptotically). Depth is chosen per angle: the first level within eps.`,
  );
  return lines.join("\n");
}
