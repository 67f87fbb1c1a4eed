import { describe, expect, test } from "vitest";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import { diffSides, METRIC_NAMES, metricChange, type CountChange, type DiffResult } from "../../src/diff/compare.js";
import { diffJson, diffMarkdown, diffText } from "../../src/diff/format.js";
import { circuit, dAngle, g, piAngle, randomBasisCircuit } from "../helpers/circuit-builder.js";
import { at, entry, naiveFigures, reportOf } from "./fixtures.js";

function count(d: DiffResult, m: Parameters<typeof metricChange>[1]): CountChange {
  const c = metricChange(d, m);
  if (c.kind !== "count") throw new Error(`${m} is not a count`);
  return c;
}

describe("figures of two circuits, recounted by hand", () => {
  const pairs: [Circuit, Circuit][] = [];
  for (let s = 1; s <= 12; s++) pairs.push([randomBasisCircuit(100 + s, 1 + (s % 5), 10 + 7 * s), randomBasisCircuit(200 + s, 1 + ((s * 3) % 5), 12 + 5 * s)]);

  test.each(pairs.map((p, i) => [i, p] as const))("pair %i", (_i, [a, b]) => {
    const d = diffSides({ label: "a", circuit: a }, { label: "b", circuit: b });
    const na = naiveFigures(a);
    const nb = naiveFigures(b);
    const expectCount = (m: Parameters<typeof count>[1], x: number, y: number): void => {
      const c = count(d, m);
      expect([c.a, c.b, c.change]).toEqual([x, y, y - x]);
      if (x === 0) expect(c.relative).toBeNull();
      else expect(c.relative).toBeCloseTo((y - x) / x, 12);
    };
    expectCount("tCount", na.tCount, nb.tCount);
    expectCount("tDepth", na.tDepth, nb.tDepth);
    expectCount("depth", na.depth, nb.depth);
    expectCount("cxCount", na.cxCount, nb.cxCount);
    expectCount("cliffordCount", na.cliffordCount, nb.cliffordCount);
    expectCount("gates", na.gates, nb.gates);
    expectCount("qubits", a.numQubits, b.numQubits);
    expectCount("remainingRotations", na.rotations, nb.rotations);
    // A bare circuit has no ledger figures.
    for (const m of ["rotations", "exactRotations", "approximatedRotations", "errorBound", "budget"] as const) {
      const c = metricChange(d, m);
      expect([c.a, c.b, c.change, c.relative]).toEqual([null, null, null, null]);
    }

    // Histogram: every name of either side, with both counts.
    const names = new Set([...na.histogram.keys(), ...nb.histogram.keys()]);
    expect(new Set(d.gates.map((x) => x.gate))).toEqual(names);
    for (const x of d.gates) expect([x.a, x.b, x.change]).toEqual([na.histogram.get(x.gate) ?? 0, nb.histogram.get(x.gate) ?? 0, (nb.histogram.get(x.gate) ?? 0) - (na.histogram.get(x.gate) ?? 0)]);
    for (let i = 1; i < d.gates.length; i++) {
      const p = d.gates[i - 1];
      const q = d.gates[i];
      expect(Math.abs(p.change) > Math.abs(q.change) || (Math.abs(p.change) === Math.abs(q.change) && p.gate < q.gate)).toBe(true);
    }

    // Per qubit: every index of either side, missing qubits counted as 0 in the change.
    expect(d.qubits.map((q) => q.qubit).sort((x, y) => x - y)).toEqual([...Array(Math.max(a.numQubits, b.numQubits)).keys()]);
    for (const q of d.qubits) {
      const ta = q.qubit < a.numQubits ? na.tPerQubit[q.qubit] : null;
      const tb = q.qubit < b.numQubits ? nb.tPerQubit[q.qubit] : null;
      const da = q.qubit < a.numQubits ? na.tDepthPerQubit[q.qubit] : null;
      const db = q.qubit < b.numQubits ? nb.tDepthPerQubit[q.qubit] : null;
      expect([q.tCountA, q.tCountB, q.tCountChange]).toEqual([ta, tb, (tb ?? 0) - (ta ?? 0)]);
      expect([q.tDepthA, q.tDepthB, q.tDepthChange]).toEqual([da, db, (db ?? 0) - (da ?? 0)]);
    }
    for (let i = 1; i < d.qubits.length; i++) {
      const p = d.qubits[i - 1];
      const q = d.qubits[i];
      const key = (x: typeof p): [number, number, number] => [-Math.abs(x.tCountChange), -Math.abs(x.tDepthChange), x.qubit];
      const [k1, k2] = [key(p), key(q)];
      expect(k1[0] < k2[0] || (k1[0] === k2[0] && (k1[1] < k2[1] || (k1[1] === k2[1] && k1[2] < k2[2])))).toBe(true);
    }
    expect(d.metrics.map((m) => m.metric)).toEqual(METRIC_NAMES);
    expect(d.identical).toBe(false);
  });
});

describe("identical and nearly identical inputs", () => {
  const body: Stmt[] = [g("h", [0]), g("t", [0]), g("cx", [0, 1]), g("tdg", [1]), g("rz", [2], [dAngle("0.3")]), g("s", [2]), g("t", [2])];
  const base = circuit(3, body);

  test("a circuit against itself (a fresh copy) is identical, and every format says so", () => {
    const d = diffSides({ label: "old.qasm", circuit: base }, { label: "new.qasm", circuit: circuit(3, [...body]) });
    expect(d.identical).toBe(true);
    expect(d.metrics.every((m) => m.change === null || m.change === 0)).toBe(true);
    expect(d.warnings).toEqual([]);
    expect(diffText(d, { color: false })).toContain("no change");
    expect(diffMarkdown(d)).toContain("No change.");
    expect(JSON.parse(diffJson(d)).identical).toBe(true);
  });

  test("a report against itself is identical, ledger included", () => {
    const r = reportOf(base, [entry(at(5, 1), "rz", dAngle("0.3"), 40, "3e-11")]);
    const d = diffSides({ label: "a.json", report: r }, { label: "b.json", report: r });
    expect(d.identical).toBe(true);
    expect(d.ledger?.unchanged).toBe(1);
    expect(diffText(d, { color: false })).toContain("no change");
  });

  test.each([0, 1, 2])("one T added on qubit %i: T-count +1 on that qubit, first in the per-qubit list", (q) => {
    const more = circuit(3, [...body, g("t", [q])]);
    const d = diffSides({ label: "a", circuit: base }, { label: "b", circuit: more });
    expect(d.identical).toBe(false);
    const t = count(d, "tCount");
    expect(t.change).toBe(1);
    expect(t.b).toBe((t.a as number) + 1);
    expect(count(d, "gates").change).toBe(1);
    expect(count(d, "cxCount").change).toBe(0);
    expect(d.qubits[0].qubit).toBe(q);
    expect(d.qubits[0].tCountChange).toBe(1);
    for (const other of d.qubits.slice(1)) expect(other.tCountChange).toBe(0);
    // T added at the end of the qubit's chain: its T-depth grows by one too.
    expect(d.qubits[0].tDepthChange).toBe(1);
    expect(d.gates[0]).toEqual({ gate: "t", a: 2, b: 3, change: 1 }); // body has t on q0 and q2, tdg on q1
    for (const x of d.gates.slice(1)) expect(x.change).toBe(0);
  });

  test("an angle changed in place: no figure moves, yet the diff is not identical and says why", () => {
    const other = circuit(3, body.map((s) => (s.kind === "gate" && s.name === "rz" ? g("rz", [2], [dAngle("0.31")]) : s)));
    const d = diffSides({ label: "a", circuit: base }, { label: "b", circuit: other });
    expect(d.metrics.every((m) => m.change === null || m.change === 0)).toBe(true);
    expect(d.gates.every((x) => x.change === 0)).toBe(true);
    expect(d.sameCircuits).toBe(false);
    expect(d.identical).toBe(false);
    expect(diffText(d, { color: false })).toContain("the circuits differ");
  });

  test("source locations alone do not make circuits differ", () => {
    const moved = circuit(3, body.map((s) => ({ ...s, loc: { file: "other.qasm", line: 40, col: 2 } })));
    const d = diffSides({ label: "a", circuit: base }, { label: "b", circuit: moved });
    expect(d.sameCircuits).toBe(true);
    expect(d.identical).toBe(true);
  });

  test("an rz(pi/2) replaced by s: one Clifford either way, rotations unchanged, histogram moves", () => {
    const a = circuit(1, [g("rz", [0], [piAngle(1, 2)])]);
    const b = circuit(1, [g("s", [0])]);
    const d = diffSides({ label: "a", circuit: a }, { label: "b", circuit: b });
    expect(count(d, "cliffordCount").change).toBe(0);
    expect(d.gates.map((x) => [x.gate, x.change])).toEqual([
      ["rz", -1],
      ["s", 1],
    ]);
  });
});

describe("reports and circuits with reports", () => {
  const c = circuit(2, [g("h", [0]), g("t", [0]), g("cx", [0, 1]), g("t", [1])]);
  const ra = reportOf(c, [entry(at(3, 1), "rz", dAngle("0.3"), 40, "3e-11"), entry(at(4, 1), "rz", piAngle(1, 4), 1, "0")], "1e-10");
  const rb = reportOf(c, [entry(at(3, 1), "rz", dAngle("0.3"), 44, "1.5e-11")], "5e-11");

  test("error bound and budget compared as exact decimals", () => {
    const d = diffSides({ label: "a", report: ra }, { label: "b", report: rb });
    const e = metricChange(d, "errorBound");
    expect(e.kind).toBe("decimal");
    expect([e.a, e.b, e.change]).toEqual(["3e-11", "1.5e-11", "-1.5e-11"]);
    expect(e.relative).toBeCloseTo(-0.5, 14);
    const b = metricChange(d, "budget");
    expect([b.a, b.b, b.change]).toEqual(["1e-10", "5e-11", "-5e-11"]);
    expect([count(d, "rotations").a, count(d, "rotations").b]).toEqual([2, 1]);
    expect([count(d, "exactRotations").a, count(d, "approximatedRotations").a]).toEqual([1, 1]);
    expect(count(d, "tCount").change).toBe(0);
    expect(d.identical).toBe(false);
  });

  test("a report against a bare circuit: ledger figures on one side only, no ledger pairing", () => {
    const d = diffSides({ label: "a", report: ra }, { label: "b", circuit: c });
    expect(metricChange(d, "errorBound")).toMatchObject({ a: "3e-11", b: null, change: null });
    expect(d.ledger).toBeNull();
    expect(d.identical).toBe(false);
    expect(d.a.source).toBe("report");
    expect(d.b.source).toBe("circuit");
  });

  test("a circuit with its own report: circuit figures, report's bound, no warning", () => {
    const d = diffSides({ label: "a", circuit: c, report: ra }, { label: "b", circuit: c, report: rb });
    expect(d.a.source).toBe("circuit+report");
    expect(d.warnings).toEqual([]);
    expect(d.ledger?.changed.length).toBe(1);
  });

  test("a circuit with a report of another circuit: circuit figures used, warning names the figures", () => {
    const other = circuit(2, [g("h", [0]), g("t", [0]), g("t", [0]), g("cx", [0, 1]), g("t", [1])]);
    const d = diffSides({ label: "old", circuit: other, report: ra }, { label: "new", circuit: c, report: ra });
    expect(count(d, "tCount").a).toBe(3);
    expect(d.warnings.length).toBe(1);
    expect(d.warnings[0]).toContain("old");
    expect(d.warnings[0]).toContain("tCount 2 (circuit: 3)");
    expect(d.warnings[0]).toContain("gate counts of t");
  });

  test("a side with neither circuit nor report is refused", () => {
    expect(() => diffSides({ label: "a" }, { label: "b", circuit: c })).toThrow(RangeError);
  });
});
