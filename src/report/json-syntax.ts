// Locating the first syntax error of a JSON text (RFC 8259 grammar), for messages that do not depend on the JavaScript engine.

/** The first syntax error: character offset, 1-based line and column, and what was expected there. */
export interface JsonSyntaxError {
  readonly offset: number;
  readonly line: number;
  readonly col: number;
  readonly message: string;
}

class Fail {
  constructor(
    readonly offset: number,
    readonly message: string,
  ) {}
}

/** Scans `text` as one JSON value; returns null when it is valid JSON, else where and why it is not. */
export function findJsonSyntaxError(text: string): JsonSyntaxError | null {
  let i = 0;
  const n = text.length;

  const ws = (): void => {
    while (i < n) {
      const c = text.charCodeAt(i);
      if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d) i++;
      else break;
    }
  };
  const found = (): string => (i >= n ? "the end of the text" : JSON.stringify(text[i]));
  const fail = (expected: string): never => {
    throw new Fail(i, `expected ${expected}, found ${found()}`);
  };
  const literal = (word: string): void => {
    if (text.startsWith(word, i)) i += word.length;
    else fail("a JSON value");
  };
  const digits = (): void => {
    if (i >= n || text[i] < "0" || text[i] > "9") fail("a digit");
    while (i < n && text[i] >= "0" && text[i] <= "9") i++;
  };
  const number = (): void => {
    if (text[i] === "-") i++;
    if (text[i] === "0") i++;
    else digits();
    if (text[i] === ".") {
      i++;
      digits();
    }
    if (text[i] === "e" || text[i] === "E") {
      i++;
      if (text[i] === "+" || text[i] === "-") i++;
      digits();
    }
  };
  const string = (): void => {
    i++; // opening quote
    for (;;) {
      if (i >= n) fail("a closing quote");
      const c = text.charCodeAt(i);
      if (c === 0x22) {
        i++;
        return;
      }
      if (c < 0x20) fail("a character allowed in a string (control characters must be escaped)");
      if (c === 0x5c) {
        i++;
        const e = text[i];
        if (e === "u") {
          i++;
          for (let k = 0; k < 4; k++) {
            if (!/[0-9a-fA-F]/.test(text[i] ?? "")) fail("four hexadecimal digits after \\u");
            i++;
          }
        } else if (e !== undefined && '"\\/bfnrt'.includes(e)) i++;
        else fail("an escape character");
      } else i++;
    }
  };
  const value = (): void => {
    ws();
    const c = text[i];
    if (c === "{") {
      i++;
      ws();
      if (text[i] === "}") {
        i++;
        return;
      }
      for (;;) {
        ws();
        if (text[i] !== '"') fail("a double-quoted key");
        string();
        ws();
        if (text[i] !== ":") fail('":" after the key');
        i++;
        value();
        ws();
        if (text[i] === ",") i++;
        else if (text[i] === "}") {
          i++;
          return;
        } else fail('"," or "}"');
      }
    }
    if (c === "[") {
      i++;
      ws();
      if (text[i] === "]") {
        i++;
        return;
      }
      for (;;) {
        value();
        ws();
        if (text[i] === ",") i++;
        else if (text[i] === "]") {
          i++;
          return;
        } else fail('"," or "]"');
      }
    }
    if (c === '"') return string();
    if (c === "-" || (c !== undefined && c >= "0" && c <= "9")) return number();
    if (c === "t") return literal("true");
    if (c === "f") return literal("false");
    if (c === "n") return literal("null");
    fail("a JSON value");
  };

  try {
    value();
    ws();
    if (i < n) fail("the end of the text");
    return null;
  } catch (e) {
    if (!(e instanceof Fail)) throw e;
    let line = 1;
    let start = 0;
    for (let k = 0; k < e.offset; k++) {
      if (text.charCodeAt(k) === 0x0a) {
        line++;
        start = k + 1;
      }
    }
    return { offset: e.offset, line, col: e.offset - start + 1, message: e.message };
  }
}
