import { describe, expect, it } from "vitest";
import { readReport } from "../../src/report/read.js";
import { toJson } from "../../src/report/format.js";
import { DiagnosticError, type Diagnostic } from "../../src/frontend/diagnostics.js";
import { sampleReport } from "./sample.js";

/** The diagnostics readReport throws for `text` (fails the test if it does not throw one). */
function problems(text: string): readonly Diagnostic[] {
  try {
    readReport(text, "old.json");
  } catch (e) {
    expect(e).toBeInstanceOf(DiagnosticError);
    return (e as DiagnosticError).diagnostics;
  }
  throw new Error("readReport accepted the input");
}

/** The sample report as a plain JSON object, edited by `edit`, back to text. */
function edited(edit: (o: Record<string, unknown>) => void): string {
  const o = JSON.parse(toJson(sampleReport())) as Record<string, unknown>;
  edit(o);
  return JSON.stringify(o, null, 2);
}

describe("readReport", () => {
  it("reads what toJson writes", () => {
    const r = sampleReport();
    expect(readReport(toJson(r), "r.json")).toEqual(r);
  });

  it("refuses another schema version before looking at the shape", () => {
    const d = problems(JSON.stringify({ schemaVersion: 2, whatever: true }));
    expect(d).toHaveLength(1);
    expect(d[0].message).toBe("unsupported report schemaVersion 2: this tledger reads version 1");
    expect(d[0].file).toBe("old.json");
    expect(d[0].hint).toBeDefined();
    expect(problems(edited((o) => (o.schemaVersion = "1")))[0].message).toMatch(/unsupported report schemaVersion "1"/);
    expect(problems("{}")[0].message).toBe("not a tledger report: no schemaVersion");
  });

  it("gives the line and column of a JSON syntax error", () => {
    const d = problems('{\n  "schemaVersion": 1,\n  "tool": }\n');
    // Line 3 is `  "tool": }`: the value should start at column 11.
    expect(d[0].message).toBe('not valid JSON at line 3, column 11: expected a JSON value, found "}"');
    expect([d[0].line, d[0].col]).toEqual([3, 11]);
    expect(problems('{"schemaVersion": 1,}')[0].message).toBe('not valid JSON at line 1, column 21: expected a double-quoted key, found "}"');
    expect(problems("")[0].message).toBe("not valid JSON at line 1, column 1: expected a JSON value, found the end of the text");
  });

  it("refuses JSON that is not an object", () => {
    expect(problems("[1, 2]")[0].message).toBe("not a tledger report: expected a JSON object at the top, found an array");
    expect(problems("null")[0].message).toMatch(/found null/);
  });

  it("names the path of each wrong field", () => {
    const d = problems(
      edited((o) => {
        (o.ledger as Record<string, unknown>[])[2].error = 1e-11;
        (o.ledger as Record<string, unknown>[])[0].instances = -1;
        o.tCount = "3";
        delete o.depth;
        o.colour = "blue";
        (o.tool as Record<string, unknown>).name = "other";
      }),
    ).map((x) => x.message);
    expect(d).toContain('report: missing key "depth"');
    expect(d).toContain('report: unexpected key "colour"');
    expect(d).toContain('tool.name: expected "tledger", found the string "other"');
    expect(d).toContain('tCount: expected a non-negative integer, found the string "3"');
    expect(d).toContain('ledger[2].error: expected a decimal number written as a string (like "1e-10"), found number 1e-11');
    expect(d).toContain("ledger[0].instances: expected a non-negative integer, found number -1");
  });

  it("checks angles, flags and decimal strings", () => {
    const msgs = problems(
      edited((o) => {
        const rows = o.ledger as { angle: Record<string, unknown>; [k: string]: unknown }[];
        rows[0].angle.pi = "pi/0.5";
        rows[1].epsilon = "-1e-3";
        rows[2].inLoop = true;
        o.budget = "0x1";
      }),
    ).map((x) => x.message);
    expect(msgs).toContain('ledger[0].angle.pi: expected null or an exact form like "3*pi/8", found the string "pi/0.5"');
    expect(msgs).toContain("ledger[1].epsilon: expected a non-negative number, found -1e-3");
    expect(msgs).toContain("ledger[2]: a row inside a while body (inLoop) is also conditional");
    expect(msgs.some((m) => m.startsWith("budget: expected a decimal number"))).toBe(true);
  });

  it("checks the sums a report always satisfies", () => {
    expect(problems(edited((o) => (o.tCount = 4))).map((x) => x.message)).toEqual(["perQubit: T-counts add up to 3, but tCount is 4"]);
    expect(problems(edited((o) => ((o.rotations as Record<string, number>).total = 9)))[0].message).toBe("rotations.total: 9 is not exact + approximated = 5");
    expect(problems(edited((o) => ((o.gateCounts as Record<string, number>).h = 5)))[0].message).toBe("gateCounts: counts add up to 11, but gates is 7");
    expect(problems(edited((o) => (o.perQubit as unknown[]).pop())).map((x) => x.message)).toContain("perQubit: 2 rows for 3 qubits");
  });

  it("reports at most twenty problems and says how many more there were", () => {
    const d = problems(
      edited((o) => {
        for (const k of Object.keys(o)) if (k !== "schemaVersion") delete o[k];
        for (let i = 0; i < 30; i++) o[`extra${i}`] = i;
      }),
    );
    expect(d).toHaveLength(21);
    expect(d[20].message).toMatch(/^\.\.\. and \d+ more problems$/);
  });
});
