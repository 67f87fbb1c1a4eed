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

/** A pool of `jobs` threads; results come back in task order whatever the thread count. */
export function createPool(jobs: number): SynthPool {
  const file = jobs > 1 ? workerFile() : null;
  if (!file) {
    return {
      threads: 1,
      run: async (tasks) => tasks.map((t) => runTask(t)),
      close: async () => {},
    };
  }
  const piscina = new Piscina({ filename: file, minThreads: jobs, maxThreads: jobs, idleTimeout: 1000 });
  return {
    threads: jobs,
    run: (tasks) => Promise.all(tasks.map((t) => piscina.run(t) as Promise<SynthTaskResult>)),
    close: () => piscina.destroy(),
  };
}
