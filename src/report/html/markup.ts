// Safe markup text: escaping for XML/HTML text and attributes, coordinate numbers, and display shortening.

/** Code points XML 1.0 forbids (C0 controls but tab/LF/CR, U+FFFE, U+FFFF) and lone UTF-16 surrogates. */
const FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/**
 * `s` made safe as XML/HTML text or as a double- or single-quoted attribute value: the five
 * markup characters become entities and characters XML cannot carry become U+FFFD.
 */
export function esc(s: string): string {
  return s
    .replace(FORBIDDEN, "\uFFFD")
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** An attribute list ` k="v" ...` from pairs in the given order; values escaped, undefined values left out. */
export function attrs(pairs: readonly (readonly [string, string | number | undefined])[]): string {
  let out = "";
  for (const [k, v] of pairs) if (v !== undefined) out += ` ${k}="${esc(typeof v === "number" ? num(v) : v)}"`;
  return out;
}

/** A coordinate for markup: rounded to 2 decimals, no exponent, no negative zero. */
export function num(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`markup: coordinate ${x} is not finite`);
  const r = Math.round(x * 100) / 100;
  return r === 0 ? "0" : r.toFixed(2).replace(/\.?0+$/, "");
}

/** `s` cut to at most `max` code points, keeping the end (where a location's line and column are) behind a leading ellipsis. */
export function shortenStart(s: string, max: number): string {
  const cps = Array.from(s);
  if (cps.length <= max) return s;
  return "\u2026" + cps.slice(cps.length - (max - 1)).join("");
}

/** `s` cut to at most `max` code points, keeping the start, with a trailing ellipsis. */
export function shortenEnd(s: string, max: number): string {
  const cps = Array.from(s);
  if (cps.length <= max) return s;
  return cps.slice(0, max - 1).join("") + "\u2026";
}
