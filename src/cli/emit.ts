// `tledger emit FILE [-o OUT]`: the expanded, flattened program as OpenQASM 3.
import type { Command } from "commander";
import { parseQasmFile } from "../frontend/frontend.js";
import { writeQasm3 } from "../emit/qasm3.js";
import { collect, parseParams, runCommand, writeOutput, type Io } from "./common.js";

export interface EmitOptions {
  readonly output?: string;
  readonly include?: readonly string[];
  readonly param?: readonly string[];
}

/** The command itself: writes to OUT atomically, or to io.stdout; throws DiagnosticError on input errors. */
export function emitCommand(file: string, opts: EmitOptions, io: Io): void {
  const circuit = parseQasmFile(file, { includeDirs: opts.include ?? [], params: parseParams(opts.param) });
  writeOutput(writeQasm3(circuit), opts.output, io);
}

export function registerEmit(program: Command, setExit: (code: number) => void): void {
  program
    .command("emit")
    .description("write the program expanded and flattened (gates inlined, loops unrolled) as OpenQASM 3")
    .argument("<file>", "the program")
    .option("-o, --output <file>", "write to FILE (complete or not at all) instead of standard output")
    .option("-I, --include <dir>", "also look for include files in DIR (repeatable)", collect)
    .option("--param <name=value>", "give an input parameter a value, an OpenQASM expression (repeatable)", collect)
    .action(async (file: string, opts: EmitOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      setExit(await runCommand((io) => emitCommand(file, opts, io), { debug }));
    });
}
