// `tledger parse FILE`: read a program and print a short summary (or the same as JSON).
import type { Command } from "commander";
import { parseQasmFile } from "../frontend/frontend.js";
import { collect, parseParams, runCommand, type Io } from "./common.js";
import { formatSummary, summarizeCircuit } from "./summary.js";

export interface ParseOptions {
  readonly json?: boolean;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
}

/** The command itself: summary of FILE to io.stdout; throws DiagnosticError on input errors. */
export function parseCommand(file: string, opts: ParseOptions, io: Io): void {
  const circuit = parseQasmFile(file, { includeDirs: opts.include ?? [], params: parseParams(opts.param) });
  const summary = summarizeCircuit(circuit);
  if (opts.json) io.stdout(JSON.stringify({ file, ...summary }, null, 2) + "\n");
  else io.stdout(formatSummary(summary, file));
}

export function registerParse(program: Command, setExit: (code: number) => void): void {
  program
    .command("parse")
    .description("read an OpenQASM 3 (or 2.0) program and summarise it: qubits, operations by gate, rotations")
    .argument("<file>", "the program")
    .option("--json", "print the summary as JSON")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (file: string, opts: ParseOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      setExit(await runCommand((io) => parseCommand(file, opts, io), { debug }));
    });
}
