import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { findJsonSyntaxError } from "../../src/report/json-syntax.js";

describe("findJsonSyntaxError", () => {
  it("accepts what JSON.stringify writes", () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.constantFrom(0, 2), (v, indent) => {
        expect(findJsonSyntaxError(JSON.stringify(v, null, indent))).toBeNull();
      }),
      { numRuns: 300, seed: 11 },
    );
  });

  it("agrees with JSON.parse on whether a text is JSON (JSON.parse as the reference)", () => {
    const alphabet = fc.constantFrom(..."{}[]:,\"\\ 0123456789-+.eEtrufalsn\nux".split(""));
    fc.assert(
      fc.property(fc.array(alphabet, { maxLength: 14 }).map((cs) => cs.join("")), (s) => {
        let valid = true;
        try {
          JSON.parse(s);
        } catch {
          valid = false;
        }
        expect([s, findJsonSyntaxError(s) === null]).toEqual([s, valid]);
      }),
      { numRuns: 3000, seed: 5 },
    );
  });

  it("agrees with JSON.parse on valid JSON with one character removed or inserted", () => {
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 3 }), fc.nat(), fc.constantFrom("", ",", "}", "]", '"', ":", "0", "-", "e", "\\"), (v, at, ins) => {
        const s0 = JSON.stringify(v, null, 1);
        const k = at % (s0.length + 1);
        const s = ins === "" ? s0.slice(0, k) + s0.slice(k + 1) : s0.slice(0, k) + ins + s0.slice(k);
        let valid = true;
        try {
          JSON.parse(s);
        } catch {
          valid = false;
        }
        expect([s, findJsonSyntaxError(s) === null]).toEqual([s, valid]);
      }),
      { numRuns: 1000, seed: 9 },
    );
  });

  it("points at the first bad character", () => {
    expect(findJsonSyntaxError('{"a": 1,\n "b": tru}')).toMatchObject({ line: 2, col: 7, message: "expected a JSON value, found \"t\"" });
    expect(findJsonSyntaxError("[1 2]")).toMatchObject({ offset: 3, message: 'expected "," or "]", found "2"' });
    expect(findJsonSyntaxError('"a\tb"')).toMatchObject({ offset: 2 });
    expect(findJsonSyntaxError("01")).toMatchObject({ offset: 1, message: 'expected the end of the text, found "1"' });
  });
});
