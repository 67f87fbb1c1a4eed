import { describe, expect, test } from "vitest";
import { diffSides } from "../../src/diff/compare.js";
import { pairLedgers } from "../../src/diff/ledger-pairs.js";
import { diffJson, diffMarkdown, diffText } from "../../src/diff/format.js";
import { circuit, dAngle, g, piAngle } from "../helpers/circuit-builder.js";
import { at, entry, reportOf, row } from "./fixtures.js";

const v = (value: string) => ({ value, pi: null });

describe("pairing rows by location, gate and angle", () => {
  test("a changed row, a removed row, an added row and an unchanged row", () => {
    const a = [row("c.qasm:3:1", "rz", v("0.3"), 40, "3e-11"), row("c.qasm:5:1", "rx", v("1.2"), 44, "2e-11"), row("c.qasm:9:1", "rz", v("0.7"), 38, "4e-11")];
    const b = [row("c.qasm:3:1", "rz", v("0.3"), 40, "3e-11"), row("c.qasm:5:1", "rx", v("1.2"), 46, "1.25e-11"), row("c.qasm:12:1", "ry", v("-0.5"), 42, "2.5e-11")];
    const l = pairLedgers(a, b);
    expect(l.unchanged).toBe(1);
    expect(l.changed.length).toBe(1);
    const p = l.changed[0];
    expect([p.a, p.b]).toEqual([a[1], b[1]]);
    expect(p.tCountChange).toBe(2);
    expect(p.errorChange).toBe("-7.5e-12"); // 1.25e-11 - 2e-11, exactly
    expect(p.fields).toEqual(["error", "tCount"]);
    expect(l.onlyA).toEqual([a[2]]);
    expect(l.onlyB).toEqual([b[2]]);
    expect(l.otherwiseChanged).toEqual([]);
    expect(l.ignoredFileNames).toBe(false);
  });

  test("several rows at one location pair by gate and angle, whatever their order", () => {
    // One statement expanding to three rotations (say, an Euler split): rows share the location.
    const a = [row("c.qasm:7:3", "rz", v("0.1"), 30, "1e-11"), row("c.qasm:7:3", "rz", v("0.2"), 32, "1e-11"), row("c.qasm:7:3", "ry", v("0.2"), 34, "1e-11")];
    const b = [row("c.qasm:7:3", "ry", v("0.2"), 36, "1e-11"), row("c.qasm:7:3", "rz", v("0.2"), 32, "1e-11"), row("c.qasm:7:3", "rz", v("0.1"), 31, "1e-11")];
    const l = pairLedgers(a, b);
    expect(l.unchanged).toBe(1); // rz 0.2
    expect(l.changed.map((p) => [p.a.gate, p.a.angle.value, p.b.gate, p.b.angle.value, p.tCountChange])).toEqual([
      // In the new ledger's order.
      ["ry", "0.2", "ry", "0.2", 2],
      ["rz", "0.1", "rz", "0.1", 1],
    ]);
    expect(l.onlyA).toEqual([]);
    expect(l.onlyB).toEqual([]);
  });

  test("equal angles: exact pi forms, or equal decimal values however written", () => {
    const a = [row("c.qasm:2:1", "rz", { value: "0.39269908169872415481", pi: "pi/8" }, 20, "1e-11"), row("c.qasm:2:1", "rz", v("0.25"), 25, "1e-11")];
    const b = [row("c.qasm:2:1", "rz", v("2.50e-1"), 26, "1e-11"), row("c.qasm:2:1", "rz", { value: "0.39269908169872415481", pi: "pi/8" }, 21, "1e-11")];
    const l = pairLedgers(a, b);
    expect(l.changed.map((p) => [p.a.tCount, p.b.tCount])).toEqual([
      [25, 26],
      [20, 21],
    ]);
  });

  test("a statement moved to another line pairs with itself; a lone row whose angle changed pairs at its location", () => {
    const a = [row("c.qasm:4:1", "rz", v("0.3"), 40, "3e-11"), row("c.qasm:8:1", "rz", v("0.9"), 41, "3e-11")];
    const b = [row("c.qasm:6:1", "rz", v("0.3"), 40, "3e-11"), row("c.qasm:8:1", "rz", v("0.95"), 43, "2e-11")];
    const l = pairLedgers(a, b);
    expect(l.otherwiseChanged.map((p) => [p.a.location, p.b.location, p.fields])).toEqual([["c.qasm:4:1", "c.qasm:6:1", ["location"]]]);
    expect(l.changed.map((p) => [p.a.angle.value, p.b.angle.value, p.fields])).toEqual([["0.9", "0.95", ["angle", "error", "tCount"]]]);
    expect(l.onlyA.length + l.onlyB.length).toBe(0);
  });

  test("identical rows pair first, so a duplicated location keeps its unchanged row unchanged", () => {
    const same = row("c.qasm:3:1", "rz", v("0.3"), 40, "3e-11");
    const a = [same];
    const b = [row("c.qasm:3:1", "rz", v("0.3"), 44, "3e-11", { conditional: true }), same];
    const l = pairLedgers(a, b);
    expect(l.unchanged).toBe(1);
    expect(l.onlyB).toEqual([b[0]]);
  });

  test("a share or method change alone is 'changed otherwise', not a cost change; instances count as cost", () => {
    const a = [row("c.qasm:3:1", "rz", v("0.3"), 40, "3e-11"), row("c.qasm:4:1", "rz", v("0.4"), 40, "3e-11")];
    const b = [row("c.qasm:3:1", "rz", v("0.3"), 40, "3e-11", { epsilon: "4e-11", method: "cached" }), row("c.qasm:4:1", "rz", v("0.4"), 40, "3e-11", { instances: 3 })];
    const l = pairLedgers(a, b);
    expect(l.otherwiseChanged.map((p) => p.fields)).toEqual([["epsilon", "method"]]);
    expect(l.changed.map((p) => [p.fields, p.tCountChange, p.errorChange])).toEqual([[["instances"], 0, "0"]]);
  });

  test("one file on each side under different names: paired by line and column", () => {
    const a = [row("old/chain.qasm:3:1", "rz", v("0.3"), 40, "3e-11")];
    const b = [row("new/chain.qasm:3:1", "rz", v("0.3"), 42, "3e-11")];
    const l = pairLedgers(a, b);
    expect(l.ignoredFileNames).toBe(true);
    expect(l.changed.map((p) => p.fields)).toEqual([["tCount"]]);
    // With two files on a side, names matter again: the rows pair only as a moved statement.
    const l2 = pairLedgers([...a, row("lib.qasm:1:1", "rz", v("0.5"), 40, "3e-11")], b);
    expect(l2.ignoredFileNames).toBe(false);
    expect(l2.changed.map((p) => p.fields)).toEqual([["location", "tCount"]]);
    expect(l2.onlyA.map((r) => r.location)).toEqual(["lib.qasm:1:1"]);
  });

  test("empty ledgers", () => {
    expect(pairLedgers([], [])).toEqual({ ignoredFileNames: false, changed: [], otherwiseChanged: [], onlyA: [], onlyB: [], unchanged: 0 });
    const r = [row("c.qasm:1:1", "rz", v("0.3"), 40, "3e-11")];
    expect(pairLedgers(r, []).onlyA).toEqual(r);
    expect(pairLedgers([], r).onlyB).toEqual(r);
  });
});

describe("ledger pairing through diffSides, as reports give it", () => {
  const c = circuit(2, [g("h", [0]), g("t", [0]), g("cx", [0, 1])]);
  const before = reportOf(c, [
    entry(at(3, 1), "rz", dAngle("0.3"), 40, "3e-11"),
    entry(at(3, 1), "rz", dAngle("0.3"), 40, "3e-11"),
    entry(at(6, 5), "rx", piAngle(1, 3), 44, "2e-11"),
    entry(at(9, 1), "rz", piAngle(1, 4), 1, "0"),
  ]);
  const after = reportOf(c, [
    entry(at(3, 1), "rz", dAngle("0.3"), 40, "3e-11"),
    entry(at(3, 1), "rz", dAngle("0.3"), 40, "3e-11"),
    entry(at(6, 5), "rx", piAngle(1, 3), 48, "1e-11"),
    entry(at(11, 1), "ry", dAngle("-0.5"), 42, "2.5e-11"),
  ]);

  test("changed, removed and added rows, and the texts name them", () => {
    const d = diffSides({ label: "before.json", report: before }, { label: "after.json", report: after });
    const l = d.ledger;
    expect(l).not.toBeNull();
    if (l === null) return;
    expect(l.unchanged).toBe(1);
    expect(l.changed.map((p) => [p.b.location, p.tCountChange, p.errorChange])).toEqual([["chain.qasm:6:5", 4, "-1e-11"]]);
    expect(l.onlyA.map((r) => r.location)).toEqual(["chain.qasm:9:1"]);
    expect(l.onlyB.map((r) => r.location)).toEqual(["chain.qasm:11:1"]);
    expect(d.identical).toBe(false);

    const text = diffText(d, { color: false });
    expect(text).toMatch(/chain\.qasm:6:5\s+rx\s+pi\/3\s+44 -> 48 \(\+4\)\s+2e-11 -> 1e-11 \(-1e-11\)/);
    expect(text).toContain("only before");
    expect(text).toMatch(/chain\.qasm:9:1\s+rz\s+pi\/4/);
    expect(text).toContain("only after");
    expect(text).toMatch(/chain\.qasm:11:1\s+ry\s+-0\.5/);
    const md = diffMarkdown(d);
    expect(md).toContain("| chain.qasm:6:5 | rx | pi/3 | 44 -> 48 (+4) |");
    const json = JSON.parse(diffJson(d));
    expect(json.ledger.onlyA[0].location).toBe("chain.qasm:9:1");
    expect(json.ledger.changed[0].fields).toEqual(["error", "tCount"]);
  });
});
