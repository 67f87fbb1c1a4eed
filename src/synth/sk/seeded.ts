// Haar-random SU(2) points from the project's seeded generator, for calibration, tests and benchmarks.
import { seededRng } from "../../numeric/prng.js";
import type { Quat } from "./quat.js";

/** Haar-random unit quaternions: four independent normal deviates (Box–Muller), normalized. */
export function seededHaarQuats(count: number, seed: number): Quat[] {
  const rng = seededRng(seed);
  const u = (): number => rng.nextFloat();
  const gauss = (): [number, number] => {
    const r = Math.sqrt(-2 * Math.log(1 - u()));
    const a = 2 * Math.PI * u();
    return [r * Math.cos(a), r * Math.sin(a)];
  };
  const out: Quat[] = [];
  while (out.length < count) {
    const [a, b] = gauss();
    const [c, d] = gauss();
    const n = Math.hypot(a, b, c, d);
    if (n > 1e-6) out.push([a / n, b / n, c / n, d / n]);
  }
  return out;
}
