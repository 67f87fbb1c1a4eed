// Reading the numeric options of the lowering commands: error budgets, per-rotation eps, job counts.
import { availableParallelism } from "node:os";
import { dec } from "../numeric/decimal.js";
import { MAX_EPS, MIN_EPS } from "../synth/verify.js";
import { usageError } from "./common.js";

const DECIMAL = /^(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/** A budget or eps as a canonical decimal string: a positive decimal below 1 and not absurdly small. */
export function readErrorOption(flag: string, text: string): string {
  const t = text.trim();
  if (!DECIMAL.test(t)) throw usageError(`${flag} expects a positive decimal number such as 1e-6, got '${text}'`, "write the error as a plain decimal: 0.001, 1e-3, 2.5e-8");
  const v = dec(t);
  if (v.lte(0)) throw usageError(`${flag} must be greater than 0, got '${text}'`, "an error budget of 0 cannot be met by approximation; exact rotations need no budget");
  if (v.gte(1)) throw usageError(`${flag} must be below 1, got '${text}'`, "distances up to phase between unitaries are at most 2, and a bound near 1 says nothing useful");
  if (v.lt(dec("1e-300"))) throw usageError(`${flag} of ${text} is absurdly small`, `the synthesis engine supports per-rotation errors down to ${MIN_EPS}`);
  return v.toString();
}

/** --per-rotation eps: within what the engine supports. */
export function readPerRotation(text: string): string {
  const v = readErrorOption("--per-rotation", text);
  if (dec(v).lt(dec(MIN_EPS)) || dec(v).gt(dec(MAX_EPS)))
    throw usageError(`--per-rotation ${text} is outside what the synthesis engine supports (${MIN_EPS} to ${MAX_EPS})`, `choose an eps between ${MIN_EPS} and ${MAX_EPS}`);
  return v;
}

/** --jobs N: 1 to 256 threads; default the number of cores. */
export function readJobs(text: string | undefined): number {
  if (text === undefined) return availableParallelism();
  if (!/^\d+$/.test(text.trim()) || Number(text) < 1 || Number(text) > 256) throw usageError(`--jobs expects a whole number from 1 to 256, got '${text}'`);
  return Number(text);
}
