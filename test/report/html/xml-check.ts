// A small XML well-formedness checker for the SVG tests: one root, balanced tags, quoted attributes, valid references (test helper).

const NAME = "[A-Za-z_:][-A-Za-z0-9_:.]*";
const REFERENCE = /^&(?:lt|gt|amp|quot|apos|#[0-9]+|#x[0-9A-Fa-f]+);/;
/** Characters XML 1.0 allows (tab, LF, CR, and U+0020 up, minus surrogates handled as pairs, minus U+FFFE/U+FFFF). */
const BAD_CHAR = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Problems with character data or an attribute value: a raw `<`, or an `&` that starts no valid reference. */
function checkChars(s: string, where: string, out: string[]): void {
  if (BAD_CHAR.test(s)) out.push(`${where}: character not allowed in XML`);
  for (let i = s.indexOf("&"); i >= 0; i = s.indexOf("&", i + 1)) {
    if (!REFERENCE.test(s.slice(i))) out.push(`${where}: bare '&' at ${i}`);
  }
}

/** Every well-formedness problem found in `doc` (empty when it is a well-formed XML document). */
export function xmlProblems(doc: string): string[] {
  const out: string[] = [];
  let s = doc;
  const decl = /^<\?xml version="1\.0" encoding="UTF-8"\?>\n?/.exec(s);
  if (decl !== null) s = s.slice(decl[0].length);
  const stack: string[] = [];
  let roots = 0;
  let i = 0;
  const tagRe = new RegExp(`^<(/?)(${NAME})((?:\\s+${NAME}\\s*=\\s*(?:"[^"<]*"|'[^'<]*'))*)\\s*(/?)>`);
  const attrRe = new RegExp(`(${NAME})\\s*=\\s*(?:"([^"<]*)"|'([^'<]*)')`, "g");
  while (i < s.length) {
    const lt = s.indexOf("<", i);
    const textEnd = lt < 0 ? s.length : lt;
    const chunk = s.slice(i, textEnd);
    if (chunk.length > 0) {
      if (stack.length === 0 && chunk.trim() !== "") out.push(`text outside the root: ${JSON.stringify(chunk.slice(0, 40))}`);
      checkChars(chunk, "text", out);
      if (chunk.includes(">") && chunk.includes("]]>")) out.push("']]>' in text");
    }
    if (lt < 0) break;
    const m = tagRe.exec(s.slice(lt));
    if (m === null) {
      out.push(`malformed tag at ${lt}: ${JSON.stringify(s.slice(lt, lt + 60))}`);
      break;
    }
    const [whole, close, name, attrText, selfClose] = m;
    if (close === "/") {
      if (attrText.trim() !== "" || selfClose === "/") out.push(`bad closing tag </${name}>`);
      const top = stack.pop();
      if (top !== name) out.push(`</${name}> closes <${top ?? "nothing"}>`);
    } else {
      if (stack.length === 0) roots += 1;
      const seen = new Set<string>();
      for (const a of attrText.matchAll(attrRe)) {
        if (seen.has(a[1])) out.push(`<${name}>: attribute ${a[1]} repeated`);
        seen.add(a[1]);
        checkChars(a[2] ?? a[3] ?? "", `<${name} ${a[1]}>`, out);
      }
      if (selfClose !== "/") stack.push(name);
    }
    i = lt + whole.length;
  }
  if (stack.length > 0) out.push(`unclosed: ${stack.join(" > ")}`);
  if (roots !== 1) out.push(`${roots} root elements`);
  return out;
}

/** The attributes of every element named `tag` carrying attribute `having`, in document order. */
export function elements(doc: string, tag: string, having: string): Record<string, string>[] {
  const re = new RegExp(`<${tag}((?:\\s+${NAME}="[^"]*")*)\\s*/?>`, "g");
  const out: Record<string, string>[] = [];
  for (const m of doc.matchAll(re)) {
    const a: Record<string, string> = {};
    for (const x of m[1].matchAll(new RegExp(`(${NAME})="([^"]*)"`, "g"))) a[x[1]] = unescapeXml(x[2]);
    if (having in a) out.push(a);
  }
  return out;
}

/** Undoes the five entity escapes the writer uses. */
export function unescapeXml(s: string): string {
  return s.replace(/&(lt|gt|quot|#39|amp);/g, (_, e: string) => ({ lt: "<", gt: ">", quot: '"', "#39": "'", amp: "&" })[e] as string);
}
