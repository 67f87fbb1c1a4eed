// Runs one tledger command in this process and prints its peak resident memory (for bench/lower.ts).
import { buildProgram } from "../src/cli/program.js";

process.on("exit", () => {
  process.stderr.write(`\nBENCH-MAXRSS-KB ${process.resourceUsage().maxRSS}\n`);
});
const program = buildProgram((code) => {
  process.exitCode = code;
});
await program.parseAsync(["node", "tledger", ...process.argv.slice(2)]);
