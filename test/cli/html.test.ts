import { describe, expect, it } from "vitest";
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { lowerCommand } from "../../src/cli/lower.js";
import { reportCommand } from "../../src/cli/report.js";
import { runCommand, EXIT_INPUT, EXIT_OK } from "../../src/cli/common.js";
import { capture, freshDir } from "./helpers.js";

describe("--html on lower and report", () => {
  it("lower writes one self-contained page whose figures are the JSON report's", async () => {
    const dir = freshDir("html");
    const html = join(dir, "r.html");
    const json = join(dir, "r.json");
    const io = capture();
    const code = await runCommand(async (x) => void (await lowerCommand("fixtures/qasm2-heisenberg.qasm", { output: join(dir, "o.qasm"), budget: "1e-3", json, html, jobs: "1", progress: false }, x)), { io });
    expect(code).toBe(EXIT_OK);
    const page = readFileSync(html, "utf8");
    const report = JSON.parse(readFileSync(json, "utf8"));
    expect(page.startsWith("<!DOCTYPE html>") || page.startsWith("<!doctype html>")).toBe(true);
    expect(page).toContain("<svg");
    expect(page).not.toMatch(/(src|href)="https?:/);
    expect(page).toContain(String(report.tCount));
    expect(page).toContain(report.errorBound);
  });

  it("report writes a page with the circuit's figures and the rotation estimates", async () => {
    const dir = freshDir("html");
    const html = join(dir, "c.html");
    const io = capture();
    expect(await runCommand(async (x) => void (await reportCommand("fixtures/ising-quench.qasm", { html, budget: ["1e-4"], json: true }, x)), { io })).toBe(EXIT_OK);
    const r = JSON.parse(io.out);
    const page = readFileSync(html, "utf8");
    expect(page).toContain(String(r.metrics.tCount));
    expect(page).toContain(r.estimate.budgets[0].budget);
    expect(page).toContain(String(r.estimate.budgets[0].tEach));
  });

  it("an unwritable --html path fails before any work, leaving no file", async () => {
    const dir = freshDir("html");
    const io = capture();
    const out = join(dir, "o.qasm");
    expect(await runCommand(async (x) => void (await lowerCommand("fixtures/qasm2-heisenberg.qasm", { output: out, html: join(dir, "missing", "r.html"), jobs: "1", progress: false }, x)), { io })).toBe(EXIT_INPUT);
    expect(existsSync(out)).toBe(false);
  });
});
