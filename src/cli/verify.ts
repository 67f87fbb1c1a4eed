// `tledger verify ORIGINAL LOWERED`: simulate both and check the actual distance against the ledger's bound.
import { readFileSync } from "node:fs";
import type { Command } from "commander";
import { parseQasmFile } from "../frontend/frontend.js";
import { readReport } from "../report/read.js";
import { equivalence } from "../diff/equiv.js";
import { withoutFinalMeasurements } from "../sim/final-measurements.js";
import { collect, parseParams, runCommand, usageError, type Io } from "./common.js";

export interface VerifyOptions {
  readonly report?: string;
  readonly seed?: string;
  readonly states?: string;
  readonly json?: boolean;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
}

/** Exit code when the distance exceeds the bound (the check ran, and failed). */
export const EXIT_BOUND_VIOLATED = 3;

/** The bound `lower` wrote into the lowered file's header, when there is one. */
export function headerBound(text: string): string | null {
  const m = /^\/\/ .*error bound ([0-9][0-9.]*(?:[eE][-+]?\d+)?)/m.exec(text.slice(0, 4096));
  return m ? m[1]! : null;
}

function readCount(flag: string, text: string | undefined, dflt: number): number {
  if (text === undefined) return dflt;
  if (!/^\d+$/.test(text) || Number(text) < 1 || Number(text) > 1_000_000) throw usageError(`${flag} expects a whole number from 1 to 1000000, got '${text}'`);
  return Number(text);
}

/** Returns the exit code: 0 when the distance is within the bound, EXIT_BOUND_VIOLATED when not. */
export function verifyCommand(original: string, lowered: string, opts: VerifyOptions, io: Io): number {
  const fopts = { includeDirs: opts.include ?? [], params: parseParams(opts.param) };
  const seed = readCount("--seed", opts.seed, 1);
  const states = readCount("--states", opts.states, 4);
  let bound: string | null;
  let boundFrom: string;
  if (opts.report) {
    let text: string;
    try {
      text = readFileSync(opts.report, "utf8");
    } catch {
      throw usageError(`cannot read the report '${opts.report}'`);
    }
    bound = readReport(text, opts.report).errorBound;
    boundFrom = opts.report;
  } else {
    let text = "";
    try {
      text = readFileSync(lowered, "utf8");
    } catch {
      // the front end reports the unreadable file below
    }
    bound = headerBound(text);
    boundFrom = `the header of ${lowered}`;
  }
  if (bound === null)
    throw usageError(`no error bound to check: ${lowered} has no tledger header`, "pass the report written by `tledger lower --json` with --report REPORT.json");
  // Final measurements read out the state the unitary part prepared; that part is what is compared.
  const a = withoutFinalMeasurements(parseQasmFile(original, fopts));
  // The lowered circuit has no inputs left: --param binds the source's.
  const b = withoutFinalMeasurements(parseQasmFile(lowered, { includeDirs: fopts.includeDirs }));
  const eq = equivalence(a.circuit, b.circuit, { a: null, b: bound }, { seed, states });
  const dropped = a.removed + b.removed;
  const verdict = eq.within ? "holds" : "VIOLATED";
  if (opts.json) {
    io.stdout(
      JSON.stringify(
        { original, lowered, finalMeasurementsIgnored: dropped, qubits: eq.qubits, distance: eq.distance, exact: eq.exact, method: eq.method, states: eq.states, bound, boundFrom, tolerance: eq.tolerance, holds: eq.within },
        null,
        2,
      ) + "\n",
    );
  } else {
    const kind = eq.exact ? "exact" : `a lower bound from ${eq.states} seeded random states (seed ${seed}), not a proof`;
    io.stdout(
      [
        `qubits:   ${eq.qubits}`,
        `distance: ${eq.distance.toPrecision(6)} (${kind}; ${eq.method})`,
        `bound:    ${bound} (from ${boundFrom}; float tolerance ${eq.tolerance.toPrecision(2)})`,
        `verdict:  the bound ${verdict}`,
        ...(dropped > 0 ? [`(final measurements are not part of the unitary and were left out: ${a.removed} in the source, ${b.removed} in the lowered circuit)`] : []),
      ].join("\n") + "\n",
    );
  }
  return eq.within ? 0 : EXIT_BOUND_VIOLATED;
}

export function registerVerify(program: Command, setExit: (code: number) => void): void {
  program
    .command("verify")
    .description("simulate the source and the lowered circuit and check their distance against the ledger's bound")
    .argument("<original>", "the source program")
    .argument("<lowered>", "the circuit written by tledger lower")
    .option("--report <file>", "take the bound from this JSON report (default: the lowered file's header)")
    .option("--seed <n>", "seed of the random states used above 10 qubits", "1")
    .option("--states <n>", "random states used above 10 qubits", "4")
    .option("--json", "print the result as JSON")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (original: string, lowered: string, opts: VerifyOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      let code = 0;
      const run = await runCommand((io) => void (code = verifyCommand(original, lowered, opts, io)), { debug });
      setExit(run !== 0 ? run : code);
    });
}
