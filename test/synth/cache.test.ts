import { describe, expect, it } from "vitest";
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createSynthCache } from "../../src/passes/pipeline.js";
import { synthRz } from "../../src/synth/index.js";
import { angleDecimal } from "../../src/ir/angle-ops.js";

describe("synthesis cache on disk", () => {
  const angle = angleDecimal("0.4321");
  const key = { method: "number-theoretic", angle: angle.value, eps: "1e-6" };

  it("serves a verified entry from disk in a fresh process-level cache", () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-cache-"));
    const r = synthRz(angle, "1e-6");
    createSynthCache(dir).set(key, r);
    const hit = createSynthCache(dir).get(key);
    expect(hit?.from).toBe("disk");
    expect(hit?.value.word).toEqual(r.word);
    expect(hit?.value.error).toBe(r.error);
  });

  it("rejects a tampered word, a tampered key and garbage, and counts each", () => {
    const dir = mkdtempSync(join(tmpdir(), "tledger-cache-"));
    const r = synthRz(angle, "1e-6");
    createSynthCache(dir).set(key, r);
    const file = join(dir, readdirSync(dir)[0]!);
    const entry = JSON.parse(readFileSync(file, "utf8"));

    // one gate flipped: the word no longer meets eps for this angle
    const flipped = structuredClone(entry);
    const i = flipped.value.word.indexOf("t");
    flipped.value.word[i] = "tdg";
    writeFileSync(file, JSON.stringify(flipped));
    let c = createSynthCache(dir);
    expect(c.get(key)).toBeNull();
    expect(c.rejected).toBe(1);

    // a lie about the error is corrected from the word itself
    const lying = structuredClone(entry);
    lying.value.error = "0";
    writeFileSync(file, JSON.stringify(lying));
    c = createSynthCache(dir);
    expect(c.get(key)?.value.error).toBe(r.error);

    // a gate name that does not exist
    const bogus = structuredClone(entry);
    bogus.value.word = ["h", "rm -rf"];
    writeFileSync(file, JSON.stringify(bogus));
    c = createSynthCache(dir);
    expect(c.get(key)).toBeNull();

    writeFileSync(file, "{not json");
    c = createSynthCache(dir);
    expect(c.get(key)).toBeNull();
    expect(c.rejected).toBe(1);
  });
});
