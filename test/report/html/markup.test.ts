// Tests of markup escaping, coordinate numbers and display shortening.
import { describe, expect, it } from "vitest";
import { attrs, esc, num, shortenEnd, shortenStart } from "../../../src/report/html/markup.js";

describe("esc", () => {
  it("turns the five markup characters into entities (common practice, no source)", () => {
    expect(esc(`<a href="x" title='y'>&amp;</a>`)).toBe("&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;amp;&lt;/a&gt;");
  });

  it("replaces what XML 1.0 cannot carry and keeps what it can", () => {
    expect(esc("a\u0000b\u0008c\u000Bd\u001Fe\uFFFEf")).toBe("a\uFFFDb\uFFFDc\uFFFDd\uFFFDe\uFFFDf");
    expect(esc("tab\there\nline\rcr")).toBe("tab\there\nline\rcr");
    expect(esc("x\uD800y\uDC00z")).toBe("x\uFFFDy\uFFFDz");
    expect(esc("pair \uD83D\uDE00 ok, \u00e9, \u03b5")).toBe("pair \uD83D\uDE00 ok, \u00e9, \u03b5");
  });

  it("builds attribute lists in order, skipping undefined values", () => {
    expect(attrs([["a", "1<2"], ["b", undefined], ["c", 3.14159]])).toBe(` a="1&lt;2" c="3.14"`);
  });
});

describe("num", () => {
  it("rounds to two decimals without exponents or negative zero", () => {
    expect(num(1)).toBe("1");
    expect(num(1.005)).toBe("1");
    expect(num(12.3456)).toBe("12.35");
    expect(num(-0.001)).toBe("0");
    expect(num(-2.5)).toBe("-2.5");
    expect(num(1e-9)).toBe("0");
    expect(num(123456789.1)).toBe("123456789.1");
    expect(() => num(Number.NaN)).toThrow(RangeError);
    expect(() => num(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});

describe("shortening", () => {
  it("keeps the end of a location and the start of a label, by code points", () => {
    expect(shortenStart("a/very/long/path/file.qasm:12:5", 12)).toBe("\u2026e.qasm:12:5");
    expect(shortenStart("short", 12)).toBe("short");
    expect(shortenEnd("ancilla_register[12]", 8)).toBe("ancilla\u2026");
    expect(Array.from(shortenEnd("\uD83D\uDE00\uD83D\uDE00\uD83D\uDE00", 2))).toEqual(["\uD83D\uDE00", "\u2026"]);
    expect(Array.from(shortenStart("\uD83D\uDE00\uD83D\uDE00\uD83D\uDE00", 2))).toEqual(["\u2026", "\uD83D\uDE00"]);
  });
});
