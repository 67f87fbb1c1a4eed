// A report built the way the lowering command builds one, for the formatter and reader tests (test helper).
import type { SourceLoc } from "../../src/ir/circuit.js";
import { buildReport, type LedgerEntry } from "../../src/report/ledger.js";
import { computeMetrics } from "../../src/report/metrics.js";
import type { Report } from "../../src/report/types.js";
import { circuit, gate, ifBlock, lit, pi, whileBlock } from "./circuits.js";

const at = (line: number, col: number, file = "chain.qasm"): SourceLoc => ({ file, line, col });

export function sampleEntries(): LedgerEntry[] {
  const base = { method: "grid", conditional: false, inLoop: false };
  return [
    { ...base, loc: at(12, 5), gate: "rz", angle: lit("0.3"), epsilon: "2.5e-11", error: "1.93e-11", tCount: 102 },
    { ...base, loc: at(12, 5), gate: "rz", angle: lit("0.3"), epsilon: "2.5e-11", error: "1.93e-11", tCount: 102 },
    { ...base, loc: at(9, 3), gate: "rx", angle: pi(1, 3), epsilon: "2.5e-11", error: "2.01e-11", tCount: 98 },
    { ...base, loc: at(20, 7), gate: "rz", angle: pi(1, 4), epsilon: "0", error: "0", tCount: 1, method: "exact" },
    { ...base, loc: at(31, 9), gate: "ry", angle: lit("-1.25"), epsilon: "2.5e-11", error: "2.2e-11", tCount: 100, conditional: true },
  ];
}

export function sampleReport(): Report {
  const c = circuit(3, [
    gate("h", [0]),
    gate("t", [0]),
    gate("cx", [0, 1]),
    gate("tdg", [1]),
    ifBlock([gate("s", [2]), gate("t", [2])]),
    gate("x", [0, 1], [], [true]),
  ]);
  return buildReport({
    version: "0.1.0",
    budget: "1e-10",
    options: { seed: 7, budget: "1e-10", snap: false },
    metrics: computeMetrics(c),
    entries: sampleEntries(),
    rotations: { exact: 1, approximated: 4, distinct: 3, cached: 1 },
  });
}

/** A report with a loop row, a conditional row and an awkward file name (pipes, backslash). */
export function awkwardReport(): Report {
  const c = circuit(2, [whileBlock([gate("t", [0]), gate("h", [1])])]);
  return buildReport({
    version: "0.1.0",
    budget: "0.001",
    options: {},
    metrics: computeMetrics(c),
    entries: [
      { loc: { file: "odd|name\\x.qasm", line: 3, col: 1 }, gate: "rz", angle: lit("0.125"), epsilon: "1e-3", error: "2e-3", tCount: 30, method: "grid", conditional: true, inLoop: true },
    ],
    rotations: { exact: 0, approximated: 1, distinct: 1, cached: 0 },
  });
}
