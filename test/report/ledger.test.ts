import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { buildReport, ledgerRows, type LedgerEntry } from "../../src/report/ledger.js";
import { computeMetrics } from "../../src/report/metrics.js";
import { toJson } from "../../src/report/format.js";
import { circuit, lit, pi } from "./circuits.js";
import { sampleEntries, sampleReport } from "./sample.js";

const entry = (over: Partial<LedgerEntry>): LedgerEntry => ({
  loc: { file: "a.qasm", line: 1, col: 1 },
  gate: "rz",
  angle: lit("0.1"),
  epsilon: "1e-3",
  error: "1e-4",
  tCount: 20,
  method: "grid",
  conditional: false,
  inLoop: false,
  ...over,
});

describe("ledgerRows", () => {
  it("groups identical instances and counts them", () => {
    const { rows } = ledgerRows([entry({}), entry({}), entry({ angle: lit("0.2") })]);
    expect(rows.map((r) => [r.angle.value, r.instances])).toEqual([
      ["0.1", 2],
      ["0.2", 1],
    ]);
  });

  it("sums errors exactly, instance by instance", () => {
    // 0.1 + 0.2 is 0.30000000000000004 in binary floating point; the ledger must say 0.3.
    const { errorBound } = ledgerRows([entry({ error: "0.1" }), entry({ error: "0.2", angle: lit("0.2") })]);
    expect(errorBound).toBe("3e-1");
    // Three instances of 1/3 * 1e-10 (given with 30 digits): rounded up, never below the sum.
    const third = "3.33333333333333333333333333333e-11";
    const r = ledgerRows([entry({ error: third }), entry({ error: third }), entry({ error: third })]);
    expect(r.rows[0].error).toBe("3.33333333334e-11");
    expect(r.errorBound).toBe("1e-10");
    expect(ledgerRows([]).errorBound).toBe("0");
  });

  it("orders rows by file, then line and column numerically", () => {
    const at = (file: string, line: number, col: number) => entry({ loc: { file, line, col } });
    const { rows } = ledgerRows([at("b.qasm", 1, 1), at("a.qasm", 10, 2), at("a.qasm", 9, 30), at("a.qasm", 10, 1)]);
    expect(rows.map((r) => r.location)).toEqual(["a.qasm:9:30", "a.qasm:10:1", "a.qasm:10:2", "b.qasm:1:1"]);
  });

  it("does not depend on the order of the entries", () => {
    const entries = sampleEntries();
    const expected = ledgerRows(entries);
    fc.assert(
      fc.property(fc.shuffledSubarray(entries, { minLength: entries.length, maxLength: entries.length }), (shuffled) => {
        expect(ledgerRows(shuffled)).toEqual(expected);
      }),
      { numRuns: 50, seed: 3 },
    );
  });

  it("flags a bound that holds per loop iteration only for approximated rows in loops", () => {
    expect(ledgerRows([entry({ conditional: true, inLoop: true })]).boundPerIteration).toBe(true);
    expect(ledgerRows([entry({ conditional: true, inLoop: true, error: "0", angle: pi(1, 4) })]).boundPerIteration).toBe(false);
    expect(ledgerRows([entry({ conditional: true })]).boundPerIteration).toBe(false);
  });

  it("rejects negative or malformed errors and bad counts", () => {
    expect(() => ledgerRows([entry({ error: "-1e-5" })])).toThrow(/a.qasm:1:1: error: negative/);
    expect(() => ledgerRows([entry({ epsilon: "tiny" })])).toThrow(/not a decimal number/);
    expect(() => ledgerRows([entry({ tCount: 2.5 })])).toThrow(/tCount/);
  });
});

describe("buildReport", () => {
  it("assembles the figures", () => {
    const r = sampleReport();
    expect(r.schemaVersion).toBe(1);
    expect(r.tool).toEqual({ name: "tledger", version: "0.1.0" });
    expect(Object.keys(r.options)).toEqual(["budget", "seed", "snap"]);
    expect(r.budget).toBe("1e-10");
    // 2 * 1.93e-11 + 2.01e-11 + 0 + 2.2e-11 = 8.07e-11.
    expect(r.errorBound).toBe("8.07e-11");
    expect(r.rotations).toEqual({ total: 5, exact: 1, approximated: 4, distinct: 3, cached: 1 });
    expect(r.ledger.map((x) => x.location)).toEqual(["chain.qasm:9:3", "chain.qasm:12:5", "chain.qasm:20:7", "chain.qasm:31:9"]);
    expect(r.ledger[2].angle).toEqual({ value: "0.78539816339744830962", pi: "pi/4" });
    expect(r.ledger[1].instances).toBe(2);
    expect(r.tCount).toBe(3);
  });

  it("gives identical JSON for options given in another order", () => {
    const metrics = computeMetrics(circuit(1, []));
    const rotations = { exact: 0, approximated: 0, distinct: 0, cached: 0 };
    const a = buildReport({ version: "1", budget: "1e-3", options: { a: 1, b: "x" }, metrics, entries: [], rotations });
    const b = buildReport({ version: "1", budget: "0.001", options: { b: "x", a: 1 }, metrics, entries: [], rotations });
    expect(toJson(a)).toBe(toJson(b));
  });

  it("rejects a non-finite option and a bad budget", () => {
    const metrics = computeMetrics(circuit(1, []));
    const rotations = { exact: 0, approximated: 0, distinct: 0, cached: 0 };
    expect(() => buildReport({ version: "1", budget: "1e-3", options: { x: Number.NaN }, metrics, entries: [], rotations })).toThrow(/option x/);
    expect(() => buildReport({ version: "1", budget: "-1", options: {}, metrics, entries: [], rotations })).toThrow(/budget/);
  });
});
