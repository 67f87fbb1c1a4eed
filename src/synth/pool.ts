// Synthesis across worker threads (piscina), falling back to the calling thread for --jobs 1.
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { dirname, join } from "node:path";
import { Piscina } from "piscina";
import type { SynthTask, SynthTaskResult } from "./worker.js";
import runTask from "./worker.js";

/** The compiled worker file: beside this module when running from dist/, else the build's copy. */
function workerFile(): string | null {
  const here = fileURLToPath(import.meta.url);
  const beside = join(dirname(here), "worker.js");
  if (here.endsWith(".js") && existsSync(beside)) return beside;
  // Running from TypeScript sources (tests): use the compiled worker that `npm run build` made.
  const root = join(dirname(here), "..", "..");
  const built = join(root, "dist", "src", "synth", "worker.js");
  return existsSync(built) ? built : null;
}

export interface SynthPool {
  readonly threads: number;
  run(tasks: readonly SynthTask[]): Promise<SynthTaskResult[]>;
  close(): Promise<void>;
}

/** Batches smaller than this run in the calling thread: starting workers costs more than they save. */
export const MIN_PARALLEL_BATCH = 8;

/**
 * A pool of `jobs` threads, started on the first batch big enough to be worth it; results come back
 * in task order whatever the thread count (and each task's result does not depend on where it ran).
 */
export function createPool(jobs: number): SynthPool {
  const file = jobs > 1 ? workerFile() : null;
  const inline = async (tasks: readonly SynthTask[]): Promise<SynthTaskResult[]> => tasks.map((t) => runTask(t));
  if (!file) return { threads: 1, run: inline, close: async () => {} };
  let piscina: Piscina | null = null;
  return {
    threads: jobs,
    run: (tasks) => {
      if (tasks.length < MIN_PARALLEL_BATCH && piscina === null) return inline(tasks);
      piscina ??= new Piscina({ filename: file, minThreads: jobs, maxThreads: jobs, idleTimeout: 60_000 });
      const p = piscina;
      return Promise.all(tasks.map((t) => p.run(t) as Promise<SynthTaskResult>));
    },
    close: async () => {
      if (piscina) await piscina.destroy();
    },
  };
}
