// The command-line program: every command registered on one commander instance (add new commands here).
import { Command } from "commander";
import { registerDiff } from "./diff.js";
import { registerEmit } from "./emit.js";
import { registerLower } from "./lower.js";
import { registerParse } from "./parse.js";
import { registerReport } from "./report.js";
import { registerSweep } from "./sweep.js";
import { registerSynth } from "./synth.js";
import { registerVerify } from "./verify.js";
import { toolVersion } from "./version.js";

/** The program with every command registered; each command reports its exit code through `setExit`. */
export function buildProgram(setExit: (code: number) => void): Command {
  const program = new Command();
  program
    .name("tledger")
    .description("Lower OpenQASM rotations to Clifford+T within an error budget, and keep a ledger of what it cost.")
    .version(toolVersion())
    .option("--debug", "show stack traces of internal errors")
    .showHelpAfterError()
    .exitOverride();
  registerParse(program, setExit);
  registerEmit(program, setExit);
  registerSynth(program, setExit);
  registerLower(program, setExit);
  registerReport(program, setExit);
  registerVerify(program, setExit);
  registerDiff(program, setExit);
  registerSweep(program, setExit);
  return program;
}
