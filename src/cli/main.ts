#!/usr/bin/env node
// The tledger executable: runs the program of src/cli/program.ts on the process arguments and sets the exit code.
import { CommanderError } from "commander";
import { EXIT_INPUT, EXIT_INTERNAL } from "./common.js";
import { buildProgram } from "./program.js";

async function main(argv: readonly string[]): Promise<void> {
  const program = buildProgram((code) => {
    process.exitCode = code;
  });
  try {
    await program.parseAsync([...argv]);
  } catch (e) {
    if (e instanceof CommanderError) {
      // --help and --version end with code 0; a usage error is an input error.
      process.exitCode = e.exitCode === 0 ? 0 : EXIT_INPUT;
      return;
    }
    const debug = argv.includes("--debug");
    process.stderr.write(`tledger: internal error: ${e instanceof Error ? e.message : String(e)}\n`);
    if (debug && e instanceof Error && e.stack) process.stderr.write(e.stack + "\n");
    process.exitCode = EXIT_INTERNAL;
  }
}

void main(process.argv);
