// `tledger synth --angle EXPR --epsilon EPS`: one z-rotation as a Clifford+T word, with its T-count, achieved error and time.
import type { Command } from "commander";
import { evaluateAngleText } from "../frontend/frontend.js";
import { synthRz } from "../synth/index.js";
import { runCommand, usageError, type Io } from "./common.js";
import { readMethod } from "./lower.js";
import { readPerRotation } from "./options.js";
import { dec } from "../numeric/decimal.js";
import { minEps } from "../synth/verify.js";

export interface SynthCliOptions {
  readonly angle?: string;
  readonly epsilon?: string;
  readonly method?: string;
  readonly json?: boolean;
  readonly seed?: string;
}

export function synthCommand(opts: SynthCliOptions, io: Io): void {
  if (opts.angle === undefined) throw usageError("synth needs --angle EXPR", "for example --angle pi/7 or --angle 0.3");
  if (opts.epsilon === undefined) throw usageError("synth needs --epsilon EPS", "for example --epsilon 1e-10");
  const eps = readPerRotation(opts.epsilon);
  const method = readMethod(opts.method);
  if (dec(eps).lt(dec(minEps(method)))) throw usageError(`--epsilon ${eps} is below ${minEps(method)}, the smallest the ${method} method supports`, method === "solovay-kitaev" ? "Solovay–Kitaev runs in double precision; use the number-theoretic method below 1e-14" : undefined);
  const seedText = opts.seed ?? "0";
  if (!/^\d+$/.test(seedText) || Number(seedText) > 2 ** 31) throw usageError(`--seed expects a whole number, got '${seedText}'`);
  const angle = evaluateAngleText(opts.angle, "--angle");
  const t0 = performance.now();
  const r = synthRz(angle, eps, { method, seed: Number(seedText) });
  const seconds = (performance.now() - t0) / 1000;
  if (opts.json) {
    io.stdout(
      JSON.stringify(
        {
          angle: angle.value,
          anglePi: angle.pi ? `${angle.pi.num}/${angle.pi.den}` : null,
          epsilon: eps,
          method: r.method,
          gates: r.word,
          tCount: r.tCount,
          cliffordCount: r.cliffordCount,
          error: Number(r.error),
          errorText: r.error,
          globalPhase: Number(r.globalPhase),
          globalPhaseText: r.globalPhase,
          certifiedOptimal: r.certifiedOptimal,
          skipped: r.skipped,
          seconds,
        },
        null,
        2,
      ) + "\n",
    );
    return;
  }
  const yard = 3 * Math.log2(1 / Number(eps));
  io.stdout(
    [
      `rz(${opts.angle}) within ${eps} (${r.method})`,
      `  word            ${r.word.length === 0 ? "(identity)" : r.word.join(" ")}`,
      `  T-count         ${r.tCount}   (3 log2(1/eps) = ${yard.toFixed(1)})`,
      `  Clifford count  ${r.cliffordCount}`,
      `  achieved error  ${r.error}`,
      `  global phase    ${Number(r.globalPhase).toPrecision(12)} rad (word * e^{i phase} approximates rz)`,
      `  optimality      ${r.certifiedOptimal ? "certified for the searched form" : `not certified: ${r.skipped} candidates skipped for hard factoring`}`,
      `  time            ${(seconds * 1000).toFixed(1)} ms`,
    ].join("\n") + "\n",
  );
}

export function registerSynth(program: Command, setExit: (code: number) => void): void {
  program
    .command("synth")
    .description("approximate one z-rotation rz(angle) by a Clifford+T word within eps (distance up to global phase)")
    .option("--angle <expr>", "the angle, an OpenQASM expression (pi/7, 0.3, 3*pi/8, ...)")
    .option("--epsilon <eps>", "the largest allowed distance up to global phase")
    .option("--method <name>", "number-theoretic or solovay-kitaev", "number-theoretic")
    .option("--seed <n>", "seed of the factoring's random choices", "0")
    .option("--json", "print the result as JSON")
    .action(async (opts: SynthCliOptions, cmd: Command) => {
      const debug = Boolean(cmd.optsWithGlobals().debug);
      setExit(await runCommand((io) => synthCommand(opts, io), { debug }));
    });
}
