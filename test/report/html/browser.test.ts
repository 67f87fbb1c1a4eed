// The HTML report in headless Chromium: renders without errors or network, shows the report's numbers, sorts the ledger on click.
// Skipped only when TLEDGER_SKIP_BROWSER=1; otherwise a missing /usr/bin/chromium fails the test (CI installs it).
import { existsSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { all, create } from "mathjs";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { renderHtml } from "../../../src/report/html/page.js";
import { sweepSvg } from "../../../src/report/html/svg-charts.js";
import type { Report } from "../../../src/report/types.js";
import { fixtureReport, fixtureSweep, HOSTILE, hostileReport } from "./fixture.js";

// mathjs as an independent reference for ordering decimal strings.
const math = create(all, { number: "BigNumber", precision: 64 });
const big = (s: string) => math.bignumber(s);

const CHROMIUM = "/usr/bin/chromium";
const FLAGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];
const OUT_DIR = fileURLToPath(new URL("../../../test-output/", import.meta.url));

/** What a page did that it must not: console errors, uncaught exceptions, dialogs, requests off the page. */
interface Trouble {
  readonly errors: string[];
  readonly requests: string[];
}

/** The few DOM shapes the page callbacks touch (the project compiles without the DOM library). */
interface Node0 {
  readonly textContent: string | null;
  getAttribute(name: string): string | null;
}
interface Row0 extends Node0 {
  readonly cells: ArrayLike<Node0>;
}
interface Box0 {
  getBoundingClientRect(): { readonly width: number };
}
interface Doc0 {
  getElementsByTagName(name: string): { readonly length: number };
  readonly documentElement: { readonly localName: string; readonly namespaceURI: string | null };
}
type Parser0 = new () => { parseFromString(text: string, type: string): Doc0 };

function localUrl(u: string): boolean {
  return u.startsWith("data:") || u.startsWith("about:");
}

describe.skipIf(process.env.TLEDGER_SKIP_BROWSER === "1")("the HTML report in Chromium", () => {
  let context: BrowserContext;
  let userDir = "";

  beforeAll(async () => {
    if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: install Debian's chromium (apt-get install -y chromium) or set TLEDGER_SKIP_BROWSER=1`);
    // A fresh profile directory (Playwright takes it as the persistent context's user data dir).
    userDir = mkdtempSync(join(tmpdir(), "tledger-chromium-"));
    context = await chromium.launchPersistentContext(userDir, { executablePath: CHROMIUM, headless: true, args: FLAGS, viewport: { width: 1100, height: 900 } });
  });

  afterAll(async () => {
    await context?.close();
    if (userDir !== "") rmSync(userDir, { recursive: true, force: true });
  });

  /** Opens `html` in a new tab that records console errors, uncaught exceptions, dialogs and every request off the page (and refuses them). */
  async function open(html: string, ours = true): Promise<{ page: Page; trouble: Trouble }> {
    const trouble: Trouble = { errors: [], requests: [] };
    const page = await context.newPage();
    page.on("console", (m) => {
      if (m.type() === "error") trouble.errors.push(`console error: ${m.text()}`);
    });
    page.on("pageerror", (e) => trouble.errors.push(`page error: ${e.message}`));
    page.on("dialog", async (d) => {
      trouble.errors.push(`dialog: ${d.message()}`);
      await d.dismiss();
    });
    page.on("request", (req) => {
      if (!localUrl(req.url())) trouble.requests.push(req.url());
    });
    await page.route("**/*", async (route) => {
      const url = route.request().url();
      if (!localUrl(url)) trouble.requests.push(`routed: ${url}`);
      await route.abort();
    });
    await page.setContent(html, { waitUntil: "load" });
    // the inline script marks the document once it has wired the tables (so the policy let it run)
    if (ours) await page.waitForSelector("html[data-ready]", { state: "attached", timeout: 10_000 });
    return { page, trouble };
  }

  async function ledgerColumn(page: Page, col: number): Promise<string[]> {
    return page.$$eval(`table[data-table="ledger"] tbody tr`, (trs, c) => trs.map((tr) => (tr as unknown as Row0).cells[c].getAttribute("data-v") ?? ""), col);
  }

  it("renders the report's numbers without errors or requests, and sorts the ledger", async () => {
    const report = fixtureReport();
    const { page, trouble } = await open(renderHtml({ report, sweep: fixtureSweep(), title: "Spin chain step", source: "spin-chain.qasm" }));

    const fig = (key: string) => page.$eval(`[data-figure="${key}"] .v`, (e) => e.textContent ?? "");
    expect(await fig("tCount")).toBe(String(report.tCount));
    expect(await fig("tDepth")).toBe(String(report.tDepth));
    expect(await fig("errorBound")).toBe(report.errorBound);
    expect(await fig("budget")).toBe(report.budget);

    // the ledger as the reader sees it
    const shown = await page.$$eval(`table[data-table="ledger"] tbody tr`, (trs) => trs.map((tr) => Array.from((tr as unknown as Row0).cells, (td) => td.textContent ?? "")));
    expect(shown).toHaveLength(report.ledger.length);
    shown.forEach((cells, i) => {
      const l = report.ledger[i];
      expect([cells[0], cells[1], cells[2], cells[3], cells[4], cells[5], cells[6], cells[8], cells[9]]).toEqual([
        l.location, l.gate, l.angle.pi ?? l.angle.value, l.epsilon, l.error, String(l.tCount), String(l.instances), l.method, l.inLoop ? "loop" : l.conditional ? "if" : "",
      ]);
    });

    // every chart is drawn with a size, and every qubit has its bar
    const charts = await page.$$eval("svg[data-chart]", (ss) => ss.map((s) => [s.getAttribute("data-chart"), (s as unknown as Box0).getBoundingClientRect().width > 100]));
    expect(charts).toEqual([["budget", true], ["qubits", true], ["sweep", true]]);
    const bars = await page.$$eval("rect[data-qubit]", (rs) => rs.map((r) => [r.getAttribute("data-label"), r.getAttribute("data-t")]));
    expect(bars).toEqual(report.perQubit.map((q) => [q.label, String(q.tCount)]));

    // sorting: the error column (decimal strings), both ways
    const errorHead = page.locator(`table[data-table="ledger"] th[data-key="error"]`);
    const byError = (dir: 1 | -1) => report.ledger.map((l) => l.error).sort((a, b) => dir * big(a).comparedTo(big(b)));
    await errorHead.locator("button").click();
    expect(await errorHead.getAttribute("aria-sort")).toBe("ascending");
    expect(await ledgerColumn(page, 4)).toEqual(byError(1));
    expect(await page.locator(`table[data-table="ledger"] th[data-key="where"]`).getAttribute("aria-sort")).toBe("none");
    await errorHead.locator("button").click();
    expect(await errorHead.getAttribute("aria-sort")).toBe("descending");
    expect(await ledgerColumn(page, 4)).toEqual(byError(-1));

    // the angle column holds negative and pi-form angles: sorted by value
    const angleHead = page.locator(`table[data-table="ledger"] th[data-key="angle"]`);
    await angleHead.locator("button").click();
    const angles = await ledgerColumn(page, 2);
    expect(angles).toEqual(report.ledger.map((l) => l.angle.value).sort((a, b) => big(a).comparedTo(big(b))));
    expect(await page.$eval(`table[data-table="ledger"]`, (t) => t.getAttribute("data-sorted"))).toBe("angle ascending");

    // copies (integers), descending after two clicks; ties keep the original order
    const copiesHead = page.locator(`table[data-table="ledger"] th[data-key="copies"] button`);
    await copiesHead.click();
    await copiesHead.click();
    const order = await page.$$eval(`table[data-table="ledger"] tbody tr`, (trs) => trs.map((tr) => Number(tr.getAttribute("data-i"))));
    const expected = report.ledger.map((_, i) => i).sort((a, b) => report.ledger[b].instances - report.ledger[a].instances || a - b);
    expect(order).toEqual(expected);

    // the keyboard works too: focus a header button and press Enter
    await page.locator(`table[data-table="ledger"] th[data-key="where"] button`).focus();
    await page.keyboard.press("Enter");
    expect(await ledgerColumn(page, 0)).toEqual(["0", "1", "2", "3"]);

    mkdirSync(OUT_DIR, { recursive: true });
    await page.screenshot({ path: join(OUT_DIR, "html-report.png"), fullPage: true });
    await page.close();
    expect(trouble.errors).toEqual([]);
    expect(trouble.requests).toEqual([]);
  });

  it("keeps hostile names as text: no script of theirs runs, nothing is fetched", async () => {
    const report: Report = hostileReport();
    const { page, trouble } = await open(renderHtml({ report, title: HOSTILE, source: HOSTILE }));
    expect(await page.$$eval("script", (s) => s.length)).toBe(1);
    expect(await page.$$eval("img", (s) => s.length)).toBe(0);
    expect(await page.title()).toContain(`<script>alert("x")</script>`);
    expect(await page.$eval("code[data-source]", (e) => e.textContent)).toContain(`<script>alert("x")</script>&amp;'"`);
    const methods = await ledgerColumn(page, 8);
    expect(methods).toEqual(report.ledger.map((l) => l.method));
    await page.close();
    expect(trouble.errors).toEqual([]);
    expect(trouble.requests).toEqual([]);
  });

  it("parses the standalone sweep SVG as an XML document", async () => {
    const { page, trouble } = await open("<!DOCTYPE html><title>x</title><p>svg</p>", false);
    const doc = sweepSvg(fixtureSweep(), { rotations: 7, standalone: true });
    const parsed = await page.evaluate((text) => {
      const P = (globalThis as unknown as { DOMParser: Parser0 }).DOMParser;
      const d = new P().parseFromString(text, "image/svg+xml");
      return { error: d.getElementsByTagName("parsererror").length, root: d.documentElement.localName, ns: d.documentElement.namespaceURI, circles: d.getElementsByTagName("circle").length };
    }, doc);
    expect(parsed).toEqual({ error: 0, root: "svg", ns: "http://www.w3.org/2000/svg", circles: fixtureSweep().length + 1 });
    await page.close();
    expect(trouble.errors).toEqual([]);
  });

  it("would notice a page that fetches or fails (the watch itself can fail)", async () => {
    const { page, trouble } = await open(`<!DOCTYPE html><title>bad</title><img src="http://tledger.invalid/x.png"><script>console.error("boom")</script>`, false);
    await page.waitForTimeout(200);
    await page.close();
    expect(trouble.requests.some((u) => u.includes("tledger.invalid"))).toBe(true);
    expect(trouble.errors.some((e) => e.includes("boom"))).toBe(true);
  });
});
