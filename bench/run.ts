// `npm run bench`: runs the benchmark sections and prints their tables (never part of `npm test`).
// Usage: npm run bench [-- SECTION...]   sections: frontend exact synth sk lower (default: all)
import { benchFrontend } from "./frontend.js";
import { benchExact } from "./exact.js";
import { benchSynth } from "./synth.js";
import { benchSk } from "./sk.js";
import { benchLower } from "./lower.js";

const SECTIONS: Record<string, { title: string; run: () => Promise<string> }> = {
  frontend: { title: "Front end: parse + expand", run: benchFrontend },
  exact: { title: "Exact synthesis (Matsumoto–Amano normal form)", run: benchExact },
  synth: { title: "z-rotation synthesis, number-theoretic", run: benchSynth },
  sk: { title: "z-rotation synthesis, Solovay–Kitaev baseline", run: benchSk },
  lower: { title: "Whole-circuit lowering", run: benchLower },
};

async function main(): Promise<void> {
  const wanted = process.argv.slice(2);
  const names = wanted.length > 0 ? wanted : Object.keys(SECTIONS);
  for (const n of names) {
    const s = SECTIONS[n];
    if (!s) {
      console.error(`unknown section '${n}'; sections: ${Object.keys(SECTIONS).join(", ")}`);
      process.exit(2);
    }
    const t0 = performance.now();
    console.log(`\n## ${s.title}\n`);
    console.log(await s.run());
    console.log(`\n(section took ${((performance.now() - t0) / 1000).toFixed(1)} s; node ${process.version}, ${(await import("node:os")).cpus().length} cores)`);
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
