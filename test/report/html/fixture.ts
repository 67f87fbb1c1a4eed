// Hand-built inputs for the HTML report tests: a small lowering report, a sweep, and hostile variants (test helper).
import type { LedgerRow, Report } from "../../../src/report/types.js";
import type { SweepPoint } from "../../../src/report/html/types.js";

const base = { conditional: false, inLoop: false };

/**
 * Four ledger rows of an invented spin-chain step lowered within 2e-4 (demo numbers). Seven
 * approximated copies share the budget equally (2e-4 / 7, rounded down to 12 digits); the bound
 * is 4 * 1.73e-5 + 2 * 2.21e-5 + 9.6e-6 = 1.23e-4; the exact row spends nothing.
 */
export function ledgerRows(): LedgerRow[] {
  return [
    { ...base, location: "spin-chain.qasm:14:3", gate: "rz", angle: { value: "0.42", pi: null }, epsilon: "2.85714285714e-5", error: "1.73e-5", tCount: 46, method: "grid", instances: 4 },
    { ...base, location: "spin-chain.qasm:15:3", gate: "rx", angle: { value: "1.0471975511965977462", pi: "pi/3" }, epsilon: "2.85714285714e-5", error: "2.21e-5", tCount: 44, method: "grid", instances: 2 },
    { ...base, location: "spin-chain.qasm:21:5", gate: "ry", angle: { value: "-1.25", pi: null }, epsilon: "2.85714285714e-5", error: "9.6e-6", tCount: 50, method: "grid", instances: 1, conditional: true },
    { ...base, location: "spin-chain.qasm:30:1", gate: "rz", angle: { value: "2.3561944901923449288", pi: "3*pi/4" }, epsilon: "0", error: "0", tCount: 1, method: "exact", instances: 2 },
  ];
}

export function fixtureReport(): Report {
  return {
    schemaVersion: 1,
    tool: { name: "tledger", version: "0.1.0" },
    options: { budget: "2e-4", seed: 11, snap: false },
    budget: "2e-4",
    errorBound: "1.23e-4",
    boundPerIteration: false,
    qubits: 3,
    gates: 905,
    depth: 612,
    tCount: 331,
    tDepth: 198,
    cxCount: 24,
    cliffordCount: 574,
    measurements: 3,
    resets: 0,
    conditionalOps: 52,
    remainingRotations: 0,
    rotations: { total: 9, exact: 2, approximated: 7, distinct: 3, cached: 1 },
    ledger: ledgerRows(),
    perQubit: [
      { qubit: 0, label: "q[0]", tCount: 140, tDepth: 140 },
      { qubit: 1, label: "q[1]", tCount: 121, tDepth: 198 },
      { qubit: 2, label: "q[2]", tCount: 70, tDepth: 131 },
    ],
    gateCounts: { cx: 24, h: 302, s: 160, sdg: 88, t: 170, tdg: 161 },
  };
}

/** Lowerings of the same program at six budgets (demo numbers, growing as the budget tightens). */
export function fixtureSweep(): SweepPoint[] {
  return [
    { budget: "1e-2", tCount: 151, tDepth: 92, errorBound: "6.1e-3", seconds: 0.21 },
    { budget: "1e-3", tCount: 214, tDepth: 129, errorBound: "7.4e-4", seconds: 0.34 },
    { budget: "2e-4", tCount: 331, tDepth: 198, errorBound: "1.23e-4", seconds: 0.52 },
    { budget: "1e-5", tCount: 390, tDepth: 236, errorBound: "8.8e-6", seconds: 0.9 },
    { budget: "1e-7", tCount: 528, tDepth: 318, errorBound: "9.05e-8", seconds: 1.7 },
    { budget: "1e-10", tCount: 741, tDepth: 447, errorBound: "7.7e-11", seconds: 4.25 },
  ];
}

/** Markup-breaking text for file names, labels and titles. */
export const HOSTILE = `<script>alert("x")</script>&amp;'"\u0001\uD800.qasm`;

/** The fixture with a hostile source file name in every location and label. */
export function hostileReport(): Report {
  const r = fixtureReport();
  return {
    ...r,
    tool: { name: "tledger", version: `0.1.0<img src=x onerror=alert(1)>` },
    options: { [`k<script>`]: `v"</script>` },
    ledger: r.ledger.map((row) => ({ ...row, location: row.location.replace("spin-chain.qasm", HOSTILE), method: `</td><script>bad()</script>` })),
    perQubit: r.perQubit.map((q) => ({ ...q, label: `${HOSTILE}[${q.qubit}]` })),
    gateCounts: { [`<svg onload=alert(1)>`]: 3, h: 2 },
  };
}
