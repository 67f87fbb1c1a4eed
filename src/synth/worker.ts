// One synthesis task, as run inside a worker thread (and, for --jobs 1, in the calling thread).
import type { Angle } from "../ir/angle.js";
import { synthRz, type SynthResult } from "./rz.js";
import type { SynthMethod } from "./verify.js";

export interface SynthTask {
  readonly angle: Angle;
  readonly eps: string;
  readonly method: SynthMethod;
}

export type SynthTaskResult = SynthResult;

export default function runTask(task: SynthTask): SynthTaskResult {
  return synthRz(task.angle, task.eps, { method: task.method });
}
