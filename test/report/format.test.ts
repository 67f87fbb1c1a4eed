import { describe, expect, it } from "vitest";
import { budgetSpent, formatMarkdown, formatText, toJson, withinBudget } from "../../src/report/format.js";
import { readReport } from "../../src/report/read.js";
import type { Report } from "../../src/report/types.js";
import { awkwardReport, sampleReport } from "./sample.js";

const ESC = "\u001b";
const stripAnsi = (s: string) => s.replace(/\u001b\[[0-9;]*m/g, "");

/** Every figure a reader should find in a text or Markdown report. */
function figures(r: Report): string[] {
  const out = [r.budget, r.errorBound, r.tool.version];
  out.push(...[r.qubits, r.gates, r.depth, r.tCount, r.tDepth, r.cxCount, r.cliffordCount, r.measurements, r.resets, r.conditionalOps, r.remainingRotations].map(String));
  out.push(...Object.values(r.rotations).map(String));
  for (const row of r.ledger) out.push(row.location, row.gate, row.angle.pi ?? row.angle.value, row.epsilon, row.error, String(row.tCount), row.method, String(row.instances));
  for (const [k, v] of Object.entries(r.gateCounts)) out.push(k, String(v));
  for (const q of r.perQubit) out.push(q.label, String(q.tCount), String(q.tDepth));
  for (const [k, v] of Object.entries(r.options)) out.push(`${k}=${String(v)}`);
  return out;
}

describe("formatText", () => {
  it("contains every figure and no escape codes without colour", () => {
    const r = sampleReport();
    const s = formatText(r, { color: false });
    expect(s).not.toContain(ESC);
    for (const f of figures(r)) expect([f, s.includes(f)]).toEqual([f, true]);
    expect(s.endsWith("\n")).toBe(true);
  });

  it("adds colour only when asked, and colour changes nothing but escapes", () => {
    const r = sampleReport();
    const plain = formatText(r, { color: false });
    const coloured = formatText(r, { color: true });
    expect(coloured).toContain(ESC);
    expect(stripAnsi(coloured)).toBe(plain);
  });

  it("aligns the ledger columns", () => {
    const lines = formatText(sampleReport(), { color: false }).split("\n");
    const head = lines.findIndex((l) => l.trimStart().startsWith("where"));
    const rows = lines.slice(head, head + 5);
    // The error column is right-aligned: in every row the figure ends where the header "error" ends.
    const end = rows[0].indexOf("error") + "error".length;
    sampleReport().ledger.forEach((row, i) => {
      const line = rows[i + 1];
      expect(line.slice(end - row.error.length, end)).toBe(row.error);
      expect(line[end]).toBe(" ");
    });
  });

  it("says when the bound holds per loop iteration and when the budget is exceeded", () => {
    const r = awkwardReport();
    const s = formatText(r, { color: false });
    expect(s).toContain("per loop iteration");
    expect(s).toContain("OVER BUDGET");
    expect(s).not.toContain("OVER BUDGET".toLowerCase());
    expect(formatText(sampleReport(), { color: false })).not.toContain("OVER BUDGET");
    expect(formatText(sampleReport(), { color: false })).not.toContain("per loop iteration");
  });

  it("cuts long tables when asked and says how many rows are hidden", () => {
    const s = formatText(sampleReport(), { color: false, maxRows: 1 });
    expect(s).toContain("3 more rows");
    expect(s).toContain("2 more rows");
  });
});

describe("budget wording", () => {
  it("computes the spent share exactly from the decimal strings", () => {
    const r = sampleReport();
    // 8.07e-11 of 1e-10 = 80.7%.
    expect(budgetSpent(r)).toBe("80.7%");
    expect(withinBudget(r)).toBe(true);
    expect(budgetSpent({ ...r, errorBound: "1e-10" })).toBe("100%");
    expect(withinBudget({ ...r, errorBound: "1e-10" })).toBe(true);
    expect(withinBudget({ ...r, errorBound: "1.00000000001e-10" })).toBe(false);
    expect(budgetSpent({ ...r, errorBound: "0" })).toBe("0%");
    expect(budgetSpent({ ...r, errorBound: "1e-20" })).toBe("<0.01%");
    expect(budgetSpent({ ...r, budget: "0" })).toBe(null);
  });
});

/** Splits a Markdown table row into cells, honouring `\|` escapes. */
function cells(line: string): string[] {
  expect(line.startsWith("|") && line.endsWith("|")).toBe(true);
  const out: string[] = [];
  let cur = "";
  for (let i = 1; i < line.length - 1; i++) {
    const ch = line[i];
    if (ch === "\\" && i + 1 < line.length - 1) {
      cur += ch + line[i + 1];
      i++;
    } else if (ch === "|") {
      out.push(cur.trim());
      cur = "";
    } else cur += ch;
  }
  out.push(cur.trim());
  return out;
}

function tables(md: string): string[][] {
  const blocks: string[][] = [];
  let cur: string[] = [];
  for (const line of md.split("\n")) {
    if (line.startsWith("|")) cur.push(line);
    else if (cur.length > 0) {
      blocks.push(cur);
      cur = [];
    }
  }
  if (cur.length > 0) blocks.push(cur);
  return blocks;
}

describe("formatMarkdown", () => {
  for (const [name, make] of [["sample", sampleReport], ["awkward", awkwardReport]] as const) {
    it(`writes valid tables (${name}): a header, a separator, the same number of cells in every row`, () => {
      const r = make();
      const md = formatMarkdown(r);
      const ts = tables(md);
      expect(ts.length).toBe(4);
      for (const t of ts) {
        const width = cells(t[0]).length;
        expect(t.length).toBeGreaterThanOrEqual(2);
        expect(cells(t[1]).every((c) => /^:?-{3,}:?$/.test(c))).toBe(true);
        for (const line of t) expect([line, cells(line).length]).toEqual([line, width]);
      }
      // Ledger rows: one table line per row.
      expect(ts[1].length).toBe(2 + r.ledger.length);
      expect(ts[3].length).toBe(2 + r.perQubit.length);
    });
  }

  it("escapes pipes and backslashes in cells and keeps every figure", () => {
    const r = awkwardReport();
    const md = formatMarkdown(r);
    expect(md).toContain("odd\\|name\\\\x.qasm:3:1");
    const sr = sampleReport();
    const smd = formatMarkdown(sr);
    for (const f of figures(sr)) expect([f, smd.includes(f)]).toEqual([f, true]);
  });
});

describe("toJson", () => {
  it("writes 2-space indented JSON with a trailing newline, keys in schema order", () => {
    const s = toJson(sampleReport());
    expect(s.endsWith("}\n")).toBe(true);
    expect(s.split("\n")[1]).toBe('  "schemaVersion": 1,');
    const keys = Object.keys(JSON.parse(s) as object);
    expect(keys.slice(0, 6)).toEqual(["schemaVersion", "tool", "options", "budget", "errorBound", "boundPerIteration"]);
    expect(keys[keys.length - 1]).toBe("gateCounts");
  });

  it("gives the same bytes for a report whose objects were built in another key order", () => {
    const r = sampleReport();
    const shuffled = JSON.parse(JSON.stringify(r), (_k, v: unknown) => {
      if (v === null || typeof v !== "object" || Array.isArray(v)) return v;
      return Object.fromEntries(Object.entries(v as Record<string, unknown>).reverse());
    }) as Report;
    expect(Object.keys(shuffled)[0]).toBe("gateCounts");
    expect(toJson(shuffled)).toBe(toJson(r));
  });

  it("round-trips through readReport", () => {
    for (const r of [sampleReport(), awkwardReport()]) {
      const s = toJson(r);
      const back = readReport(s, "r.json");
      expect(back).toEqual(r);
      expect(toJson(back)).toBe(s);
    }
  });
});
