import { describe, expect, test } from "vitest";
import { diffSides, METRIC_NAMES } from "../../src/diff/compare.js";
import { diffJson, diffMarkdown, diffText, percentText } from "../../src/diff/format.js";
import type { Stmt } from "../../src/ir/circuit.js";
import type { Report } from "../../src/report/types.js";
import { circuit, dAngle, g, piAngle } from "../helpers/circuit-builder.js";
import { at, entry, reportOf } from "./fixtures.js";

const ESC = "\u001b[";
const stripAnsi = (s: string): string => s.replace(/\u001b\[[0-9;]*m/g, "");

const body: Stmt[] = [g("h", [0]), g("t", [0]), g("cx", [0, 1]), g("tdg", [1]), g("s", [2])];
const before = reportOf(circuit(3, body), [entry(at(3, 1), "rz", dAngle("0.3"), 40, "3e-11"), entry(at(5, 2), "rx", piAngle(1, 3), 44, "2e-11")]);
const after = reportOf(circuit(3, [...body, g("t", [2]), g("t", [2]), g("cx", [1, 2])]), [
  entry(at(3, 1), "rz", dAngle("0.3"), 46, "1e-11"),
  entry(at(8, 4), "ry", dAngle("-1.25"), 42, "2.5e-11"),
]);

/** The same report with every record's keys in reverse order (as another writer might produce them). */
function reversedKeys(r: Report): Report {
  const rev = <T>(o: Readonly<Record<string, T>>): Record<string, T> => Object.fromEntries(Object.entries(o).reverse());
  return { ...r, gateCounts: rev(r.gateCounts), options: rev(r.options) };
}

describe("diff formats", () => {
  const d = diffSides({ label: "before.json", report: before }, { label: "after.json", report: after });

  test("the text shows each figure before, after and its change", () => {
    const text = diffText(d, { color: false });
    expect(text.startsWith("tledger diff: before.json (report) -> after.json (report)\n")).toBe(true);
    expect(text).toMatch(/T-count\s+2\s+4\s+\+2 \(\+100%\)/);
    expect(text).toMatch(/CX count\s+1\s+2\s+\+1 \(\+100%\)/);
    expect(text).toMatch(/error bound\s+5e-11\s+3.5e-11\s+-1.5e-11 \(-30%\)/);
    expect(text).toMatch(/error budget\s+1e-10\s+1e-10\s+=/);
    expect(text).toContain("gate counts: 2 of 5 changed");
    expect(text).toMatch(/t\s+1\s+3\s+\+2/);
    expect(text).toContain("T per qubit: 1 of 3 changed");
    expect(text).toMatch(/q\[2\]\s+0 -> 2 \(\+2\)\s+0 -> 2 \(\+2\)/);
    expect(text.endsWith("\n")).toBe(true);
  });

  test("colour only adds escapes", () => {
    const plain = diffText(d, { color: false });
    const colored = diffText(d, { color: true });
    expect(plain).not.toContain(ESC);
    expect(colored).toContain(ESC);
    expect(stripAnsi(colored)).toBe(plain);
  });

  test("maxRows cuts long tables and says how many rows are hidden", () => {
    const text = diffText(d, { color: false, maxRows: 1 });
    expect(text).toContain("... 1 more rows");
  });

  test("Markdown: a heading, a figure table and escaped cells", () => {
    const md = diffMarkdown(d);
    expect(md.startsWith("### tledger diff: `before.json` (report) → `after.json` (report)\n")).toBe(true);
    expect(md).toContain("| figure | before | after | change |");
    expect(md).toContain("| T-count | 2 | 4 | +2 (+100%) |");
    const odd = reportOf(circuit(1, [g("h", [0])]), [{ ...entry(at(1, 1, "a|b`c.qasm"), "rz", dAngle("0.5"), 30, "1e-11") }]);
    const md2 = diffMarkdown(diffSides({ label: "x`y", report: before }, { label: "odd", report: odd }));
    expect(md2).toContain("``x`y``");
    expect(md2).toContain("a\\|b`c.qasm:1:1");
  });

  test("JSON: fixed key order, every metric, deterministic bytes whatever the input key order", () => {
    const text = diffJson(d);
    const o = JSON.parse(text);
    expect(Object.keys(o)).toEqual(["tool", "kind", "schemaVersion", "a", "b", "identical", "sameCircuits", "warnings", "metrics", "gates", "qubits", "ledger", "limits", "violations", "equivalence"]);
    expect(Object.keys(o.metrics)).toEqual(METRIC_NAMES);
    expect(o.metrics.errorBound).toEqual({ a: "5e-11", b: "3.5e-11", change: "-1.5e-11", relative: -0.3 });
    expect([o.limits, o.violations, o.equivalence]).toEqual([null, null, null]);
    const again = diffJson(diffSides({ label: "before.json", report: reversedKeys(before) }, { label: "after.json", report: reversedKeys(after) }));
    expect(again).toBe(text);
    expect(text.endsWith("}\n")).toBe(true);
  });

  test("percentages: three significant digits, signed", () => {
    expect(percentText(1 / 120)).toBe("+0.833%");
    expect(percentText(-0.25)).toBe("-25%");
    expect(percentText(12.5)).toBe("+1250%");
    expect(percentText(0)).toBe("0%");
  });
});
