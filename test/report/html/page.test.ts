// Tests of the HTML page: escaping of hostile input, nothing to fetch, exact figures and ledger cells, determinism, the sort order script.
import { createHash } from "node:crypto";
import fc from "fast-check";
import { all, create } from "mathjs";
import { afterEach, describe, expect, it, vi } from "vitest";
import { renderHtml } from "../../../src/report/html/page.js";
import { COMPARE_JS, PAGE_SCRIPT } from "../../../src/report/html/page-script.js";
import { computeMetrics } from "../../../src/report/metrics.js";
import type { Report } from "../../../src/report/types.js";
import { circuit, gate, lit } from "../circuits.js";
import { fixtureReport, fixtureSweep, HOSTILE, hostileReport } from "./fixture.js";
import { elements, unescapeXml, xmlProblems } from "./xml-check.js";

// mathjs as an independent reference for decimal products and comparisons.
const math = create(all, { number: "BigNumber", precision: 64 });
const big = (s: string | number) => math.bignumber(s);

const page = (r: Report = fixtureReport()) => renderHtml({ report: r, sweep: fixtureSweep(), title: "Spin chain step", source: "spin-chain.qasm" });

/** The text of the first element carrying `data-figure="key"`, its value span. */
function figure(html: string, key: string): string {
  const m = new RegExp(`data-figure="${key}"><dt>[^<]*</dt><dd><span class="v">([^<]*)</span>`).exec(html);
  if (m === null) throw new Error(`no figure ${key}`);
  return unescapeXml(m[1]);
}

/** The rows of a table: each row's `data-v` cell values. */
function tableValues(html: string, name: string): string[][] {
  const start = html.indexOf(`data-table="${name}"`);
  const body = html.slice(html.indexOf("<tbody>", start), html.indexOf("</tbody>", start));
  return body.split("</tr>").filter((r) => r.includes("<td")).map((r) => [...r.matchAll(/data-v="([^"]*)"/g)].map((m) => unescapeXml(m[1])));
}

describe("renderHtml with a lowering report", () => {
  const html = page();

  it("shows the report's headline figures exactly", () => {
    const r = fixtureReport();
    expect(figure(html, "tCount")).toBe(String(r.tCount));
    expect(figure(html, "tDepth")).toBe(String(r.tDepth));
    expect(figure(html, "errorBound")).toBe(r.errorBound);
    expect(figure(html, "budget")).toBe(r.budget);
    expect(figure(html, "qubits")).toBe(String(r.qubits));
    expect(figure(html, "approximated")).toBe(String(r.rotations.approximated));
    expect(html).toContain("61.5% of the budget");
    expect(html).not.toContain(`data-note="over"`);
  });

  it("puts every ledger row in the table, with exact values to sort on", () => {
    const r = fixtureReport();
    const rows = tableValues(html, "ledger");
    expect(rows).toHaveLength(r.ledger.length);
    rows.forEach((cells, i) => {
      const l = r.ledger[i];
      expect(cells.slice(0, 10)).toEqual([
        String(i), l.gate, l.angle.value, l.epsilon, l.error, String(l.tCount), String(l.instances), cells[7], l.method, l.inLoop ? "loop" : l.conditional ? "if" : "",
      ]);
      expect(big(cells[7]).equals(big(l.error).times(l.instances))).toBe(true);
    });
    // the headers know their types and the starting order
    const heads = elements(html, "th", "data-key").filter((_, i) => i < 10);
    expect(heads.map((h) => h["data-type"])).toEqual(["num", "text", "dec", "dec", "dec", "num", "num", "dec", "text", "text"]);
    expect(heads.map((h) => h["aria-sort"])).toEqual(["ascending", ...Array(9).fill("none")]);
  });

  it("includes the three charts as well-formed SVG", () => {
    for (const kind of ["budget", "qubits", "sweep"]) {
      const at = html.indexOf(`data-chart="${kind}"`);
      expect(at).toBeGreaterThan(0);
      const start = html.lastIndexOf("<svg", at);
      const svg = html.slice(start, html.indexOf("</svg>", at) + 6);
      expect(xmlProblems(svg)).toEqual([]);
    }
  });

  it("flags an exceeded budget and a bound that holds per loop iteration", () => {
    const r: Report = { ...fixtureReport(), budget: "1e-4", boundPerIteration: true };
    const h = page(r);
    expect(h).toContain(`data-note="over"`);
    expect(h).toContain(`data-note="loop"`);
    expect(h).toMatch(/data-figure="errorBound"/);
    expect(h).toContain(`class="figure key over" data-figure="errorBound"`);
  });

  it("shows an empty ledger as a sentence", () => {
    const r: Report = { ...fixtureReport(), ledger: [], errorBound: "0" };
    const h = page(r);
    expect(h).toContain("the ledger is empty");
    expect(h).not.toContain(`data-table="ledger"`);
  });
});

describe("nothing to fetch, nothing to inject", () => {
  it("admits only its own style and script, by hash", () => {
    const html = page();
    const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]*)">/.exec(html);
    expect(csp).not.toBeNull();
    const policy = unescapeXml((csp as RegExpExecArray)[1]);
    expect(policy).toContain("default-src 'none'");
    const style = /<style>([\s\S]*?)<\/style>/.exec(html)?.[1] ?? "";
    const script = /<script>([\s\S]*?)<\/script>/.exec(html)?.[1] ?? "";
    const hash = (t: string) => `'sha256-${createHash("sha256").update(t, "utf8").digest("base64")}'`;
    expect(policy).toContain(`style-src ${hash(style)};`);
    expect(policy).toContain(`script-src ${hash(script)};`);
    expect(script).toBe(PAGE_SCRIPT);
  });

  it("links to nothing outside the page", () => {
    const html = page();
    const refs = [...html.matchAll(/\b(?:href|src|action|xlink:href)\s*=\s*"([^"]*)"/g)].map((m) => m[1]);
    expect(refs.length).toBeGreaterThan(0);
    for (const ref of refs) expect(ref.startsWith("#") || ref.startsWith("data:")).toBe(true);
    const urls = [...html.matchAll(/[a-z]+:\/\/[^\s"'<)]*/gi)].map((m) => m[0]);
    expect(new Set(urls)).toEqual(new Set(["http://www.w3.org/2000/svg"]));
    expect(html).not.toMatch(/@import|url\(/);
  });

  it("escapes a hostile file name, labels, options and gate names everywhere", () => {
    const r = hostileReport();
    const html = renderHtml({ report: r, sweep: fixtureSweep(), title: `Report of ${HOSTILE}`, source: HOSTILE });
    expect(html.match(/<script/gi)).toHaveLength(1);
    expect(html).not.toMatch(/<img|<svg onload|<\/td><script/i);
    expect(html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;&amp;amp;&#39;&quot;");
    const src = /<code data-source="">([^<]*)<\/code>/.exec(html);
    expect(unescapeXml((src as RegExpExecArray)[1])).toBe(HOSTILE.replace("\u0001", "\uFFFD").replace("\uD800", "\uFFFD"));
    expect(/<title>([^<]*)<\/title>/.exec(html)?.[1]).toContain("Report of &lt;script&gt;");
    const rows = tableValues(html, "ledger");
    expect(rows.map((c) => c[8])).toEqual(r.ledger.map((l) => l.method));
  });
});

describe("determinism", () => {
  afterEach(() => vi.useRealTimers());

  it("gives the same bytes whatever the clock and the key order of the input", () => {
    vi.useFakeTimers();
    vi.setSystemTime(new Date("2001-02-03T04:05:06Z"));
    const a = page();
    vi.setSystemTime(new Date("2039-11-12T13:14:15Z"));
    const b = page();
    expect(b).toBe(a);
    const r = fixtureReport();
    const reordered: Report = {
      ...r,
      options: { snap: false, seed: 11, budget: "2e-4" },
      gateCounts: Object.fromEntries(Object.entries(r.gateCounts).reverse()),
    };
    expect(page(reordered)).toBe(a);
  });
});

describe("renderHtml without a lowering", () => {
  it("shows circuit figures, T per qubit and a rotation estimate", () => {
    const c = circuit(2, [gate("h", [0]), gate("t", [0]), gate("rz", [1], [lit("0.3")]), gate("cx", [0, 1]), gate("tdg", [1]), gate("t", [1])]);
    const m = computeMetrics(c);
    const html = renderHtml({
      metrics: m,
      title: "Circuit figures",
      source: "vqe.qasm",
      version: "0.1.0",
      estimates: {
        budget: "1e-3",
        basis: "About 3 log2(1/share) T gates per rotation.",
        rows: [
          { location: "vqe.qasm:4:1", gate: "rz", angle: "0.3", instances: 3, share: "3.3e-4", tEach: 35 },
          { location: "vqe.qasm:7:1", gate: "ry", angle: "1.1", instances: 1, share: "3.3e-4", tEach: 37 },
        ],
      },
    });
    expect(figure(html, "tCount")).toBe(String(m.tCount));
    expect(figure(html, "tDepth")).toBe(String(m.tDepth));
    expect(figure(html, "rotations")).toBe(String(m.rotations));
    expect(figure(html, "estimateT")).toBe(String(3 * 35 + 37));
    expect(figure(html, "estimateCopies")).toBe("4");
    expect(html).not.toContain(`data-table="ledger"`);
    expect(html).toContain("tledger 0.1.0");
    const bars = elements(html, "rect", "data-qubit");
    expect(bars.map((b) => b["data-t"])).toEqual(m.perQubit.map((q) => String(q.tCount)));
    expect(tableValues(html, "estimates").map((r) => r[6])).toEqual(["105", "37"]);
  });

  it("renders a sweep alone", () => {
    const html = renderHtml({ sweep: fixtureSweep(), title: "Sweep", source: "chain.qasm", rotations: 7 });
    expect(html).toContain(`data-chart="sweep"`);
    expect(html).toContain(`data-series="yardstick"`);
    expect(tableValues(html, "sweep").map((r) => r[0])).toEqual(["1e-2", "1e-3", "2e-4", "1e-5", "1e-7", "1e-10"]);
  });
});

describe("the sort script's order (evaluated from the very text the page runs)", () => {
  const api = new Function(`${COMPARE_JS}; return { compareDecimal: compareDecimal, compareCells: compareCells };`)() as {
    compareDecimal: (a: string, b: string) => number;
    compareCells: (type: string, a: string, b: string) => number;
  };
  const sign = (x: number) => (x < 0 ? -1 : x > 0 ? 1 : 0);

  it("orders decimal strings exactly, beyond float precision and range", () => {
    const cases: [string, string, number][] = [
      ["1.2e-7", "1.3e-7", -1],
      ["9e-8", "1.2e-7", -1],
      ["0", "-0", 0],
      ["0.000", "0e5", 0],
      ["-1.25", "0.42", -1],
      ["-1.25", "-1.3", 1],
      ["1e-400", "2e-400", -1],
      ["1e-400", "0", 1],
      ["1.00000000000000000001", "1.00000000000000000002", -1],
      ["12.5", "1.25e1", 0],
      [".5", "0.50", 0],
      ["1e+3", "999.999", 1],
      ["abc", "1", 1],
      ["1", "", -1],
    ];
    for (const [a, b, want] of cases) {
      expect(sign(api.compareDecimal(a, b)), `${a} vs ${b}`).toBe(want);
      expect(sign(api.compareDecimal(b, a)), `${b} vs ${a}`).toBe(want === 0 ? 0 : -want);
    }
  });

  it("agrees with mathjs on random decimals in every spelling", () => {
    const spelled = fc
      .tuple(fc.boolean(), fc.bigInt({ min: 0n, max: 10n ** 25n }), fc.integer({ min: -60, max: 60 }), fc.integer({ min: 0, max: 3 }))
      .map(([neg, mant, exp, style]) => {
        const digits = mant.toString();
        const body = style === 0 ? `${digits}e${exp}` : style === 1 ? `${digits}.000e${exp}` : style === 2 ? `0.${digits}E${exp >= 0 ? "+" : ""}${exp}` : `${digits.slice(0, 1)}.${digits.slice(1)}e${exp}`;
        return (neg ? "-" : "") + body;
      });
    fc.assert(
      fc.property(spelled, spelled, (a, b) => {
        expect(sign(api.compareDecimal(a, b))).toBe(big(a).comparedTo(big(b)));
      }),
      { numRuns: 2000, seed: 20240601 },
    );
  });

  it("orders counts as numbers and text by code units", () => {
    expect(sign(api.compareCells("num", "9", "10"))).toBe(-1);
    expect(sign(api.compareCells("num", "0.34", "0.21"))).toBe(1);
    expect(sign(api.compareCells("text", "rz", "Rz"))).toBe(1);
    expect(sign(api.compareCells("text", "grid", "exact"))).toBe(1);
  });
});
