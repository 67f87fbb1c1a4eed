import { seededRng } from "../../src/numeric/prng.js";
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { CharStream, Token } from "antlr4ng";
import { QasmLexer } from "../../src/frontend/generated/QasmLexer.js";
import { parseQasmText } from "../../src/frontend/frontend.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { writeQasm3 } from "../../src/emit/qasm3.js";
import { GOOD, readParams, withoutLocations } from "./helpers.js";

/** The file as gaps and tokens: text = gap[0] + tok[0] + gap[1] + tok[1] + ... + gap[n]. */
function tokenize(text: string): { tokens: string[]; types: number[]; gaps: string[] } {
  const lexer = new QasmLexer(CharStream.fromString(text));
  lexer.removeErrorListeners();
  const tokens: string[] = [];
  const types: number[] = [];
  const gaps: string[] = [];
  let pos = 0;
  for (let t = lexer.nextToken(); t.type !== Token.EOF; t = lexer.nextToken()) {
    // Lexer offsets count code points; the fixtures are ASCII apart from comments, so slice by code points.
    gaps.push(Array.from(text).slice(pos, t.start).join(""));
    tokens.push(t.text!);
    types.push(t.type);
    pos = t.stop + 1;
  }
  gaps.push(Array.from(text).slice(pos).join(""));
  return { tokens, types, gaps };
}

/** Seeded floats in [0, 1) from the project's one generator (numeric/prng.ts). */
function rng(seed: number): () => number {
  const g = seededRng(seed);
  return () => g.nextFloat();
}

describe("fuzzing the front end with token-level mutations of the fixtures", () => {
  it("ends every run in success or a DiagnosticError, and successes round-trip through the writer", () => {
    const next = rng(424242);
    const sources = GOOD.map((f) => ({ f, text: readFileSync(`fixtures/${f}`, "utf8") })).map((s) => ({ ...s, ...tokenize(s.text) }));
    const vqeParams = readParams("fixtures/params/vqe-ansatz.txt");
    const RUNS = 6000;
    let ok = 0;
    let diagnostics = 0;
    for (let run = 0; run < RUNS; run++) {
      const src = sources[Math.floor(next() * sources.length)]!;
      const tokens = src.tokens.slice();
      const nMut = 1 + Math.floor(next() * 3);
      for (let m = 0; m < nMut; m++) {
        const i = Math.floor(next() * tokens.length);
        const kind = next();
        if (kind < 0.3) tokens[i] = "";
        else if (kind < 0.45) tokens[i] = `${tokens[i]} ${tokens[i]}`;
        else if (kind < 0.7) {
          // replace with another token of the same kind from the file (names, numbers, keywords)
          const same = src.types.flatMap((t, k) => (t === src.types[i] ? [k] : []));
          tokens[i] = src.tokens[same[Math.floor(next() * same.length)]!]!;
        } else {
          const j = next() < 0.5 ? Math.min(tokens.length - 1, i + 1) : Math.floor(next() * tokens.length);
          [tokens[i], tokens[j]] = [tokens[j]!, tokens[i]!];
        }
      }
      let text = src.gaps[0]!;
      for (let k = 0; k < tokens.length; k++) text += tokens[k] + src.gaps[k + 1]!;
      try {
        const c = parseQasmText(text, `fixtures/${src.f}`, { maxOps: 200_000, params: src.f === "vqe-ansatz.qasm" && text.includes("input") ? vqeParams : {} });
        ok++;
        const again = parseQasmText(writeQasm3(c), "mutant.qasm");
        expect(withoutLocations(again)).toEqual(withoutLocations(c));
      } catch (e) {
        if (!(e instanceof DiagnosticError)) {
          throw new Error(`run ${run} (${src.f}) threw ${String(e)}\n--- input ---\n${text}`);
        }
        const d = e.diagnostics[0]!;
        expect(d.message.length).toBeGreaterThan(0);
        diagnostics++;
      }
    }
    expect(ok + diagnostics).toBe(RUNS);
    // Both outcomes occur: the mutations are neither all harmless nor all fatal.
    expect(ok).toBeGreaterThan(RUNS / 30);
    expect(diagnostics).toBeGreaterThan(RUNS / 4);
  });
});
