// End-to-end tests of `tledger lower`: every fixture lowered and re-read, determinism across runs, jobs and cache, the budget options, and bad input.
import { describe, expect, it } from "vitest";
import { existsSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { EXIT_INPUT, EXIT_OK, parseParams } from "../../src/cli/common.js";
import { parseQasmFile } from "../../src/frontend/frontend.js";
import { dec, PI } from "../../src/numeric/decimal.js";
import { computeMetrics } from "../../src/report/metrics.js";
import type { Report } from "../../src/report/types.js";
import { circuitDistance, MAX_UNITARY_QUBITS, nonUnitaryStatement } from "../../src/sim/index.js";
import { withoutFinalMeasurements } from "../../src/sim/final-measurements.js";
import { createPool } from "../../src/synth/pool.js";
import { MIN_EPS } from "../../src/synth/verify.js";
import type { Circuit } from "../../src/ir/circuit.js";
import { allGates, fixtureFiles, fixtureParams, freshDir, metricFigures, reportFigures, runLower, statementsOtherThan } from "./helpers.js";

/** The Clifford+T gate set the written circuit may use (design note synthesis.md, section 1; cx the only two-qubit gate). */
const CLIFFORD_T = new Set(["h", "s", "sdg", "t", "tdg", "x", "y", "z", "cx"]);

/**
 * Non-gate statements a lowered circuit may keep: measurement, reset, barrier and the if/while blocks, plus what passes
 * through from a source unchanged (box, delay, pragma and annotation in lab-feature-tour).
 */
const KEPT = ["gate", "measure", "reset", "barrier", "if", "while", "box", "delay", "pragma", "annotation"] as const;

/** Float tolerance of a simulated distance against an exact bound (rounding of thousands of double-precision gate products). */
const FLOAT_TOL = 1e-12;

/** A ledger comment the writer puts before a synthesized block. */
interface BlockComment {
  readonly location: string;
  readonly eps: string;
  readonly achieved: string;
  /** The first line after the comment that is not itself a ledger comment. */
  readonly next: string;
}

const COMMENT_RE = /^\s*\/\/ (\S+:\d+:\d+) .*\beps ([0-9.eE+-]+), achieved ([0-9.eE+-]+)/;

function blockComments(text: string): BlockComment[] {
  const lines = text.split("\n");
  const out: BlockComment[] = [];
  lines.forEach((l, i) => {
    const m = COMMENT_RE.exec(l);
    if (!m) return;
    // Where the peephole pass merged the one-qubit runs of two adjacent blocks, both comments stand before the run.
    let j = i + 1;
    while (j < lines.length && COMMENT_RE.test(lines[j]!)) j++;
    out.push({ location: m[1]!, eps: m[2]!, achieved: m[3]!, next: lines[j] ?? "" });
  });
  return out;
}

/** Relative difference of two positive decimals (for figures printed at different precision). */
function relDiff(a: string, b: string): number {
  const x = dec(a);
  const y = dec(b);
  if (x.isZero() && y.isZero()) return 0;
  return x.minus(y).abs().div(x.abs().plus(y.abs())).toNumber();
}

/** Fixtures whose unitary part (final measurements aside) the simulator can take: no mid-circuit measurement, reset, if or while. */
function simulable(source: Circuit): boolean {
  return source.numQubits <= MAX_UNITARY_QUBITS && nonUnitaryStatement(withoutFinalMeasurements(source).circuit) === null;
}

const BUDGETS = ["1e-2", "1e-5"];

describe("lower on every fixture", () => {
  for (const file of fixtureFiles()) {
    for (const budget of BUDGETS) {
      it(`${file} at ${budget}: Clifford+T only, figures of the written file, bound within budget, comments, distance`, async () => {
        const dir = freshDir("lower");
        const out = join(dir, "out.qasm");
        const json = join(dir, "out.json");
        const param = fixtureParams(file);
        const { code, io, report } = await runLower(file, { output: out, json, budget, param });
        expect(code, io.err).toBe(EXIT_OK);
        expect(report).not.toBeNull();
        const r = report as unknown as Report;
        // The JSON file is the same report.
        expect(JSON.parse(readFileSync(json, "utf8"))).toEqual(JSON.parse(JSON.stringify(r)));

        const text = readFileSync(out, "utf8");
        const lowered = parseQasmFile(out);
        const source = parseQasmFile(file, { params: parseParams(param) });

        // Only Clifford+T gates, uncontrolled and without angles; only the statements a lowering keeps.
        const gates = allGates(lowered);
        const foreign = gates.filter((g) => !CLIFFORD_T.has(g.name) || g.ctrl.length > 0 || g.params.length > 0).map((g) => g.name);
        expect(foreign).toEqual([]);
        expect(statementsOtherThan(lowered, KEPT).map((s) => s.kind)).toEqual([]);
        expect(lowered.numQubits).toBe(source.numQubits);

        // The bound is within the budget (exact decimal comparison).
        expect(dec(r.errorBound).lte(dec(budget)), `bound ${r.errorBound} > budget ${budget}`).toBe(true);
        expect(dec(r.budget).eq(dec(budget))).toBe(true);
        expect(r.remainingRotations).toBe(0);

        // T-count: the t and tdg gates of the written file.
        expect(r.tCount).toBe(gates.filter((g) => g.name === "t" || g.name === "tdg").length);
        // Every figure of the report is that of the written circuit.
        expect(reportFigures(r)).toEqual(metricFigures(computeMetrics(lowered)));

        // One ledger comment before each synthesized block: location, eps and achieved error of a ledger row.
        const comments = blockComments(text);
        const synthRows = r.ledger.filter((row) => row.method !== "snap");
        expect(comments.length).toBe(r.rotations.approximated);
        expect(comments.length).toBe(synthRows.reduce((n, row) => n + row.instances, 0));
        const sourceLines = readFileSync(file, "utf8").split("\n");
        const unmatched = synthRows.flatMap((row) => Array.from({ length: row.instances }, () => row));
        for (const c of comments) {
          // The comment (and any next to it) is followed by a gate of the block, not by a blank line or another statement.
          expect(c.next).toMatch(/^\s*[a-z]+ [a-z_]\w*\[\d+\];$/);
          const [f, line] = c.location.split(":");
          expect(f).toBe(file);
          expect(sourceLines[Number(line) - 1]?.trim().length ?? 0).toBeGreaterThan(0);
          // Achieved within the share (exact decimal comparison).
          expect(dec(c.achieved).lte(dec(c.eps)), `${c.location}: achieved ${c.achieved} > eps ${c.eps}`).toBe(true);
          // The row printed the same figures, rounded to 12 digits (error up, share down).
          const k = unmatched.findIndex((row) => row.location === c.location && relDiff(row.error, c.achieved) < 1e-11 && relDiff(row.epsilon, c.eps) < 1e-11);
          expect(k, `no ledger row for the comment at ${c.location} (eps ${c.eps}, achieved ${c.achieved})`).toBeGreaterThanOrEqual(0);
          unmatched.splice(k, 1);
        }
        expect(unmatched).toEqual([]);

        // The simulated distance between source and lowered circuit is within the bound.
        if (simulable(source)) {
          const d = circuitDistance(withoutFinalMeasurements(source).circuit, withoutFinalMeasurements(lowered).circuit);
          expect(d.exact).toBe(true);
          expect(d.distance, `distance ${d.distance} > bound ${r.errorBound}`).toBeLessThanOrEqual(Number(r.errorBound) + FLOAT_TOL);
        }
      });
    }
  }

  it("checks the distance on every fixture whose unitary part is simulable", () => {
    // From reading the fixtures: qasm2-qft measures before an `if` on the same qubit, teleport-reset measures
    // mid-circuit; every other fixture ends in its measurements and has at most 8 qubits.
    const expected = fixtureFiles().filter((f) => !/qasm2-qft|teleport-reset/.test(f));
    expect(fixtureFiles().filter((f) => simulable(parseQasmFile(f, { params: parseParams(fixtureParams(f)) })))).toEqual(expected);
  });
});

describe("lower is deterministic", () => {
  const file = "fixtures/vqe-ansatz.qasm";
  const param = fixtureParams(file);

  async function lowerTo(dir: string, extra: { jobs?: string; cache?: string } = {}): Promise<{ circuit: string; json: string; report: Report; summary: string }> {
    const out = join(dir, "out.qasm");
    const json = join(dir, "out.json");
    const { code, io, report } = await runLower(file, { output: out, json, budget: "1e-6", param, ...extra });
    expect(code, io.err).toBe(EXIT_OK);
    return { circuit: readFileSync(out, "utf8"), json: readFileSync(json, "utf8"), report: report as unknown as Report, summary: io.out };
  }

  it("gives byte-identical circuit and report when run twice, and with --jobs 1 and --jobs 2", async () => {
    const a = await lowerTo(freshDir("det"));
    const b = await lowerTo(freshDir("det"));
    expect(b.circuit).toBe(a.circuit);
    expect(b.json).toBe(a.json);
    expect(a.report.rotations.distinct).toBeGreaterThan(1);

    // --jobs 2 runs synthesis in worker threads from the compiled worker; without it the pool would quietly
    // fall back to the calling thread and this test would compare the one path with itself.
    const worker = "dist/src/synth/worker.js";
    if (!existsSync(worker)) throw new Error(`${worker} is missing: run \`npm run build\` before the tests (npm ci does it) so that --jobs 2 uses worker threads`);
    const pool = createPool(2);
    try {
      expect(pool.threads, "the synthesis pool did not start worker threads for --jobs 2").toBe(2);
    } finally {
      await pool.close();
    }
    const c = await lowerTo(freshDir("det"), { jobs: "2" });
    const stale = "(if src/synth changed since the last build, the compiled worker is stale: run `npm run build`)";
    expect(c.circuit, stale).toBe(a.circuit);
    expect(c.json, stale).toBe(a.json);
  });

  it("writes the same circuit to standard output (the report then goes to standard error)", async () => {
    const a = await lowerTo(freshDir("det"));
    const { code, io } = await runLower(file, { budget: "1e-6", param });
    expect(code, io.err).toBe(EXIT_OK);
    expect(io.out).toBe(a.circuit);
    expect(io.err).toMatch(new RegExp(`\\n +T-count +${a.report.tCount}\\n`));
  });

  it("gives the same circuit and ledger from a warm --cache, and the report says the rotations came from the cache", async () => {
    const cache = join(freshDir("cache"), "synth-cache");
    const plain = await lowerTo(freshDir("det"));
    const cold = await lowerTo(freshDir("det"), { cache });
    expect(readdirSync(cache).length).toBeGreaterThan(0);
    const warm = await lowerTo(freshDir("det"), { cache });
    expect(cold.circuit).toBe(plain.circuit);
    expect(warm.circuit).toBe(plain.circuit);
    expect(cold.report.rotations.cached).toBe(0);
    expect(warm.report.rotations.cached).toBe(warm.report.rotations.distinct);
    expect(warm.report.rotations.cached).toBeGreaterThan(0);
    expect(warm.summary).toContain(`${warm.report.rotations.distinct} distinct, ${warm.report.rotations.cached} from cache`);
    // Everything else in the JSON report is byte-identical: only the count of cached problems may differ.
    const withoutCached = (json: string): string => json.replace(/("cached": )\d+/, "$1_");
    expect(withoutCached(warm.json)).toBe(withoutCached(plain.json));
    expect(cold.json).toBe(plain.json);
  });
});

describe("lower's budget options", () => {
  it("--per-rotation 1e-4 gives every ledger row epsilon 1e-4 and a budget equal to the sum of the shares", async () => {
    const dir = freshDir("per");
    const out = join(dir, "out.qasm");
    const { code, io, report } = await runLower("fixtures/qasm2-heisenberg.qasm", { output: out, perRotation: "1e-4" });
    expect(code, io.err).toBe(EXIT_OK);
    const r = report as unknown as Report;
    expect(r.ledger.length).toBeGreaterThan(0);
    for (const row of r.ledger) {
      expect(dec(row.epsilon).eq(dec("1e-4")), `${row.location}: epsilon ${row.epsilon}`).toBe(true);
      expect(dec(row.error).lte(dec("1e-4"))).toBe(true);
    }
    const instances = r.ledger.reduce((n, row) => n + row.instances, 0);
    expect(instances).toBe(r.rotations.approximated);
    expect(dec(r.budget).eq(dec("1e-4").times(instances))).toBe(true);
    expect(dec(r.errorBound).lte(dec(r.budget))).toBe(true);
    expect(r.options.perRotation).not.toBeNull();
  });

  const quarter = ["OPENQASM 3.0;", 'include "stdgates.inc";', "qubit[2] q;", "h q[0];", "rz(0.7853981633974483) q[0];", "cx q[0], q[1];", "rz(0.3) q[1];", ""].join("\n");

  it("--snap books the double-precision pi/4 literal as a snap row with a nonzero error, without synthesizing it", async () => {
    const dir = freshDir("snap");
    const src = join(dir, "quarter.qasm");
    writeFileSync(src, quarter);
    const out = join(dir, "out.qasm");
    const { code, io, report } = await runLower(src, { output: out, snap: true, budget: "1e-3" });
    expect(code, io.err).toBe(EXIT_OK);
    const r = report as unknown as Report;
    const snaps = r.ledger.filter((row) => row.method === "snap");
    expect(snaps.length).toBe(1);
    const snap = snaps[0]!;
    expect(snap.location).toBe(`${src}:5:1`);
    expect(snap.tCount).toBe(0);
    expect(dec(snap.error).gt(0)).toBe(true);
    // The distance between rz(a) and rz(b) up to phase is 2 sin(|a - b| / 4) (eigenphase arc |a - b|; design note
    // synthesis.md, section 1): here a - b is the double's distance from pi/4, about 3e-17.
    const delta = dec("0.7853981633974483").minus(PI.div(4)).abs();
    const expected = delta.div(4).sin().times(2);
    // The ledger rounds it up (an upper bound stays one) to a few significant digits.
    expect(dec(snap.error).gte(expected)).toBe(true);
    expect(relDiff(snap.error, expected.toString())).toBeLessThan(1e-5);
    // Only rz(0.3) was synthesized; the snapped rotation has no synthesized block.
    expect(r.rotations.approximated).toBe(1);
    const comments = blockComments(readFileSync(out, "utf8"));
    expect(comments.map((c) => c.location)).toEqual([`${src}:7:1`]);
    // The bound adds the snap error to the synthesized one.
    const synthRow = r.ledger.find((row) => row.method !== "snap")!;
    expect(dec(r.errorBound).gte(dec(snap.error).plus(dec(synthRow.error)))).toBe(true);
    expect(dec(r.errorBound).lte(dec("1e-3"))).toBe(true);
    // The circuit still implements the source within the bound.
    const d = circuitDistance(parseQasmFile(src), parseQasmFile(out));
    expect(d.distance).toBeLessThanOrEqual(Number(r.errorBound) + FLOAT_TOL);
  });

  it("without --snap the same literal is approximated like any other angle", async () => {
    const dir = freshDir("snap");
    const src = join(dir, "quarter.qasm");
    writeFileSync(src, quarter);
    const out = join(dir, "out.qasm");
    const { code, io, report } = await runLower(src, { output: out, budget: "1e-3" });
    expect(code, io.err).toBe(EXIT_OK);
    const r = report as unknown as Report;
    expect(r.ledger.some((row) => row.method === "snap")).toBe(false);
    expect(r.rotations.approximated).toBe(2);
    const row = r.ledger.find((x) => x.location === `${src}:5:1`);
    expect(row).toBeDefined();
    expect(row!.method).not.toBe("snap");
    expect(blockComments(readFileSync(out, "utf8")).map((c) => c.location)).toContain(`${src}:5:1`);
  });
});

describe("lower refuses bad input", () => {
  const file = "fixtures/ising-quench.qasm";

  for (const [budget, words] of [
    ["0", /greater than 0/],
    ["-1", /positive decimal/],
    ["1", /below 1/],
    ["2", /below 1/],
    ["NaN", /positive decimal/],
    ["abc", /positive decimal/],
    ["1e-400", /small/],
  ] as const) {
    it(`--budget ${budget}: exit 2, a message naming --budget, no output file`, async () => {
      const dir = freshDir("bad");
      const { code, io } = await runLower(file, { output: join(dir, "out.qasm"), json: join(dir, "out.json"), budget });
      expect(code).toBe(EXIT_INPUT);
      expect(io.err).toContain("--budget");
      expect(io.err).toContain(budget === "1e-400" ? budget : `'${budget}'`);
      expect(io.err).toMatch(words);
      expect(io.err).not.toMatch(/internal error/);
      expect(readdirSync(dir)).toEqual([]);
    });
  }

  it("--budget 1e-60 over 48 rotations: exit 2 naming the engine's smallest eps, no output file", async () => {
    const dir = freshDir("bad");
    const { code, io } = await runLower(file, { output: join(dir, "out.qasm"), budget: "1e-60" });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toContain(MIN_EPS);
    expect(io.err).toMatch(/smallest/);
    expect(readdirSync(dir)).toEqual([]);
  });

  it("--budget with --per-rotation: exit 2", async () => {
    const dir = freshDir("bad");
    const { code, io } = await runLower(file, { output: join(dir, "out.qasm"), budget: "1e-3", perRotation: "1e-4" });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toMatch(/--budget and --per-rotation/);
    expect(readdirSync(dir)).toEqual([]);
  });

  it("--per-rotation outside the engine's range: exit 2 naming the range", async () => {
    const dir = freshDir("bad");
    const { code, io } = await runLower(file, { output: join(dir, "out.qasm"), perRotation: "0.5" });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toContain("--per-rotation");
    expect(io.err).toContain(MIN_EPS);
    expect(readdirSync(dir)).toEqual([]);
  });

  it("an unknown --method: exit 2, naming the methods there are", async () => {
    const dir = freshDir("bad");
    const { code, io } = await runLower(file, { output: join(dir, "out.qasm"), method: "brute-force" });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toContain("'brute-force'");
    expect(io.err).toContain("number-theoretic");
    expect(readdirSync(dir)).toEqual([]);
  });

  it("-o into a folder that does not exist: exit 2 and no file", async () => {
    const dir = freshDir("bad");
    const missing = join(dir, "no-such-folder", "out.qasm");
    const { code, io } = await runLower(file, { output: missing, json: join(dir, "out.json") });
    expect(code).toBe(EXIT_INPUT);
    expect(io.err).toContain("no-such-folder");
    expect(existsSync(missing)).toBe(false);
    expect(readdirSync(dir)).toEqual([]);
  });

  it("leaves an existing output file untouched when the run fails, early or late", async () => {
    const dir = freshDir("bad");
    const out = join(dir, "out.qasm");
    const json = join(dir, "out.json");
    writeFileSync(out, "OLD");
    writeFileSync(json, "OLD");
    // Refused while reading the options.
    expect((await runLower(file, { output: out, json, budget: "abc" })).code).toBe(EXIT_INPUT);
    // Refused after parsing, when the budget is shared out.
    expect((await runLower(file, { output: out, json, budget: "1e-60" })).code).toBe(EXIT_INPUT);
    // Refused by the front end.
    expect((await runLower("fixtures/bad/06-wrong-arity.qasm", { output: out, json })).code).toBe(EXIT_INPUT);
    expect(readFileSync(out, "utf8")).toBe("OLD");
    expect(readFileSync(json, "utf8")).toBe("OLD");
    expect(readdirSync(dir).sort()).toEqual(["out.json", "out.qasm"]);
  });
});

describe("lower's ledger names what was approximated", () => {
  // A controlled rotation by an exact multiple of pi/4 still needs approximating: crz(t) = rz(t/2) CX rz(-t/2) CX
  // (design note synthesis.md, section 9), and t/2 = pi/8 is not a multiple of pi/4.
  const program = (dir: string): string => {
    const src = join(dir, "ent.qasm");
    writeFileSync(src, ["OPENQASM 3.0;", 'include "stdgates.inc";', "gate ent(a) x, y { h x; ctrl @ rz(a) x, y; }", "qubit[2] q;", "ent(pi/4) q[0], q[1];", ""].join("\n"));
    return src;
  };

  it("names the controlled rotation, not the Hadamard inlined before it at the same location (bug: src/lower.ts sourceGates)", async () => {
    const dir = freshDir("names");
    const src = program(dir);
    const { code, io, report } = await runLower(src, { output: join(dir, "out.qasm"), budget: "1e-3" });
    expect(code, io.err).toBe(EXIT_OK);
    const r = report as unknown as Report;
    expect(r.ledger.length).toBeGreaterThan(0);
    for (const row of r.ledger) expect(row.gate, `${row.location}: ${row.gate}`).toMatch(/rz/);
  });

  it("does not count a rotation as exact when its lowering needed approximation (bug: src/lower.ts exactSourceRotations)", async () => {
    const dir = freshDir("names");
    const src = join(dir, "cp.qasm");
    writeFileSync(src, ["OPENQASM 3.0;", 'include "stdgates.inc";', "qubit[2] q;", "cp(pi/4) q[0], q[1];", ""].join("\n"));
    const { code, io, report } = await runLower(src, { output: join(dir, "out.qasm"), budget: "1e-3" });
    expect(code, io.err).toBe(EXIT_OK);
    const r = report as unknown as Report;
    // RotationCounts.exact (src/report/types.ts): "Angles known exactly to be multiples of pi/4: lowered with no error".
    // The one source rotation was approximated (its halves are pi/8), so none was lowered with no error.
    expect(r.rotations.approximated).toBeGreaterThan(0);
    expect(r.rotations.exact).toBe(0);
  });
});
