// The fast path: plain gate calls, measure, reset and barrier statements (`rz(0.5) q[3];`, `ctrl @ x a[0], b[1];`, `c[0] = measure q[0];`) read straight from the text, giving the same syntax tree as the generated parser.
//
// The generated parser is the definition of the language; this reader accepts only a small, common
// subset of it and declines (returns null) on anything else, which then goes to the generated parser.
// It declines on any doubt: a keyword, a non-ASCII character, a comment inside the statement, an
// underscore or prefix in a number, a function call, `**` or `%`, a trailing comma, a designator,
// an index that is not a plain decimal integer. test/frontend/fast-path.test.ts checks that whenever it
// accepts, its tree equals the generated parser's.
import type { Expr, IndexOp, Modifier, Operand, Pos, Stmt } from "./ast.js";
import type { Cursor } from "./syntax.js";
import { KEYWORDS } from "./syntax.js";

/** Why the reader gave up (never shown: the generated parser takes over). */
const DECLINE = Symbol("decline");

/** The statement at `cur` if it is a plain gate call, with the cursor after its `;`; else null. */
export function fastStatement(text: string, cur: Cursor): { stmt: Stmt; next: Cursor } | null {
  const r = new Reader(text, cur);
  try {
    const stmt = r.statement();
    return { stmt, next: { i: r.i, line: r.line, col: r.col } };
  } catch (e) {
    // Declined, or nested deeper than the engine's stack: the generated parser decides (and reports).
    if (e === DECLINE || (e instanceof RangeError && /call stack/i.test(e.message))) return null;
    throw e;
  }
}

const isIdStart = (c: number): boolean => (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || c === 95;
const isDigit = (c: number): boolean => c >= 48 && c <= 57;
const isIdChar = (c: number): boolean => isIdStart(c) || isDigit(c);

/** A cursor over one statement's characters; throws DECLINE when the text leaves the subset. */
class Reader {
  i: number;
  line: number;
  col: number;
  constructor(
    private readonly text: string,
    cur: Cursor,
  ) {
    this.i = cur.i;
    this.line = cur.line;
    this.col = cur.col;
  }

  private pos(): Pos {
    return { line: this.line, col: this.col };
  }

  /** Skip blanks; decline on comments and non-ASCII. Returns the next character code (NaN at the end). */
  private peek(): number {
    const t = this.text;
    for (;;) {
      const c = t.charCodeAt(this.i);
      if (c === 32 || c === 9 || c === 13 || c === 12) {
        this.i++;
        this.col++;
      } else if (c === 10) {
        this.i++;
        this.line++;
        this.col = 1;
      } else if (c === 47) {
        const d = t.charCodeAt(this.i + 1);
        if (d === 47 || d === 42) throw DECLINE;
        return c;
      } else if (c > 126) throw DECLINE;
      else return c;
    }
  }

  private expect(c: number): void {
    if (this.peek() !== c) throw DECLINE;
    this.i++;
    this.col++;
  }

  /** An identifier that is not a keyword. */
  private identifier(): string {
    const w = this.word();
    if (KEYWORDS.has(w)) throw DECLINE;
    return w;
  }

  /** A word (identifier or keyword) without the keyword check. */
  private word(): string {
    const t = this.text;
    const start = this.i;
    if (!isIdStart(t.charCodeAt(start))) throw DECLINE;
    let j = start + 1;
    while (isIdChar(t.charCodeAt(j))) j++;
    if (t.charCodeAt(j) > 126) throw DECLINE;
    this.col += j - start;
    this.i = j;
    return t.slice(start, j);
  }

  private accept(c: number): boolean {
    if (this.peek() !== c) return false;
    this.i++;
    this.col++;
    return true;
  }

  statement(): Stmt {
    this.peek();
    const pos = this.pos();
    const save = { i: this.i, line: this.line, col: this.col };
    const w = this.word();
    switch (w) {
      case "measure": {
        const operand = this.operand();
        let target: Operand | null = null;
        if (this.peek() === 45 && this.text.charCodeAt(this.i + 1) === 62) {
          this.i += 2;
          this.col += 2;
          target = this.operand();
        }
        this.expect(59);
        return { k: "measure", operand, target, pos };
      }
      case "reset": {
        const operand = this.operand();
        this.expect(59);
        return { k: "reset", operand, pos };
      }
      case "barrier": {
        const operands: Operand[] = [];
        if (!this.accept(59)) {
          operands.push(this.operand());
          while (this.accept(44)) operands.push(this.operand());
          this.expect(59);
        }
        return { k: "barrier", operands, pos };
      }
      case "inv":
      case "pow":
      case "ctrl":
      case "negctrl":
      case "gphase":
        this.i = save.i;
        this.line = save.line;
        this.col = save.col;
        return this.gateCall();
    }
    if (KEYWORDS.has(w)) throw DECLINE;
    // `c = measure q;` / `c[1] = measure q[0];`
    const after = this.peek();
    if (after === 61 || after === 91) {
      if (after === 61 && this.text.charCodeAt(this.i + 1) === 61) throw DECLINE;
      const target = this.indexedRest(w, pos);
      if (this.peek() !== 61 || this.text.charCodeAt(this.i + 1) === 61) throw DECLINE;
      this.i++;
      this.col++;
      this.peek();
      const mpos = this.pos();
      if (this.word() !== "measure") throw DECLINE;
      const operand = this.operand();
      this.expect(59);
      return { k: "assign", target, op: "=", value: { k: "measure", operand, pos: mpos }, pos };
    }
    this.i = save.i;
    this.line = save.line;
    this.col = save.col;
    return this.gateCall();
  }

  private modifier(): Modifier | null {
    const c = this.peek();
    if (c !== 105 && c !== 112 && c !== 99 && c !== 110) return null;
    const save = { i: this.i, line: this.line, col: this.col };
    const pos = this.pos();
    const w = this.word();
    let endLine = this.line;
    let m: Modifier;
    if (w === "inv") m = { k: "inv", pos };
    else if (w === "pow") {
      this.expect(40);
      const e = this.expression();
      this.expect(41);
      endLine = this.line;
      m = { k: "pow", e, pos };
    } else if (w === "ctrl" || w === "negctrl") {
      let n: Expr | null = null;
      if (this.accept(40)) {
        n = this.expression();
        this.expect(41);
        endLine = this.line;
      }
      m = { k: w, n, pos };
    } else {
      this.i = save.i;
      this.line = save.line;
      this.col = save.col;
      return null;
    }
    // An '@' first on its line would be read as an annotation by the lexer.
    if (this.peek() !== 64 || this.line !== endLine) throw DECLINE;
    this.i++;
    this.col++;
    return m;
  }

  gateCall(): Stmt {
    this.peek();
    const pos = this.pos();
    const modifiers: Modifier[] = [];
    for (let m = this.modifier(); m !== null; m = this.modifier()) modifiers.push(m);
    this.peek();
    const namePos = this.pos();
    const isGphase = this.text.startsWith("gphase", this.i) && !isIdChar(this.text.charCodeAt(this.i + 6));
    const name = isGphase ? this.word() : this.identifier();
    const params: Expr[] = [];
    let c = this.peek();
    if (c === 40) {
      this.i++;
      this.col++;
      params.push(this.expression());
      while ((c = this.peek()) === 44) {
        this.i++;
        this.col++;
        params.push(this.expression());
      }
      this.expect(41);
    }
    const operands: Operand[] = [];
    if (!(isGphase && this.peek() === 59)) {
      operands.push(this.operand());
      while ((c = this.peek()) === 44) {
        this.i++;
        this.col++;
        operands.push(this.operand());
      }
    }
    this.expect(59);
    return { k: "call", modifiers, name, namePos, params, designator: null, operands, pos };
  }

  private operand(): Operand {
    if (!isIdStart(this.peek())) throw DECLINE;
    const pos = this.pos();
    return this.indexedRest(this.identifier(), pos);
  }

  /** The optional `[integer]` after a register name. */
  private indexedRest(name: string, pos: Pos): Operand {
    if (this.peek() !== 91) return { k: "ref", name, indices: [], pos };
    const bpos = this.pos();
    this.i++;
    this.col++;
    this.peek();
    const npos = this.pos();
    const t = this.text;
    const start = this.i;
    let j = start;
    while (isDigit(t.charCodeAt(j))) j++;
    if (j === start || isIdChar(t.charCodeAt(j)) || t.charCodeAt(j) === 46) throw DECLINE;
    this.col += j - start;
    this.i = j;
    const index: IndexOp = { k: "items", items: [{ k: "num", text: t.slice(start, j), pos: npos }], pos: bpos };
    this.expect(93);
    return { k: "ref", name, indices: [index], pos };
  }

  private expression(): Expr {
    let l = this.term();
    for (;;) {
      const c = this.peek();
      if (c !== 43 && c !== 45) return l;
      if (this.text.charCodeAt(this.i + 1) === 43 || this.text.charCodeAt(this.i + 1) === 61) throw DECLINE;
      const pos = this.pos();
      this.i++;
      this.col++;
      const r = this.term();
      l = { k: "binary", op: c === 43 ? "+" : "-", l, r, pos };
    }
  }

  private term(): Expr {
    let l = this.unary();
    for (;;) {
      const c = this.peek();
      if (c !== 42 && c !== 47) return l;
      const d = this.text.charCodeAt(this.i + 1);
      if (d === 42 || d === 61) throw DECLINE;
      const pos = this.pos();
      this.i++;
      this.col++;
      const r = this.unary();
      l = { k: "binary", op: c === 42 ? "*" : "/", l, r, pos };
    }
  }

  private unary(): Expr {
    const c = this.peek();
    if (c === 45) {
      const d = this.text.charCodeAt(this.i + 1);
      if (d === 61 || d === 62) throw DECLINE;
      const pos = this.pos();
      this.i++;
      this.col++;
      return { k: "unary", op: "-", e: this.unary(), pos };
    }
    const e = this.primary();
    const n = this.peek();
    // `**` binds tighter than unary minus; `[`, `(` after a primary are index/call forms: all declined.
    if (n === 42 && this.text.charCodeAt(this.i + 1) === 42) throw DECLINE;
    if (n === 91 || n === 40) throw DECLINE;
    return e;
  }

  private primary(): Expr {
    const c = this.peek();
    if (c === 40) {
      this.i++;
      this.col++;
      const e = this.expression();
      this.expect(41);
      return e;
    }
    const pos = this.pos();
    if (isIdStart(c)) return { k: "ident", name: this.identifier(), pos };
    if (isDigit(c) || c === 46) return { k: "num", text: this.number(), pos };
    throw DECLINE;
  }

  /** A decimal integer or float literal exactly as the lexer would take it; declines on anything longer. */
  private number(): string {
    const t = this.text;
    const start = this.i;
    let j = start;
    while (isDigit(t.charCodeAt(j))) j++;
    const intDigits = j - start;
    if (t.charCodeAt(j) === 46) {
      j++;
      const fs = j;
      while (isDigit(t.charCodeAt(j))) j++;
      if (intDigits === 0 && j === fs) throw DECLINE;
    }
    const e = t.charCodeAt(j);
    if (e === 101 || e === 69) {
      let k = j + 1;
      const s = t.charCodeAt(k);
      if (s === 43 || s === 45) k++;
      const ds = k;
      while (isDigit(t.charCodeAt(k))) k++;
      if (k === ds) throw DECLINE;
      j = k;
    }
    const after = t.charCodeAt(j);
    // A letter, digit, underscore or dot right after the number: a duration, `im`, `_` digit groups, ... .
    if (isIdChar(after) || after === 46 || after > 126) throw DECLINE;
    this.col += j - start;
    this.i = j;
    return t.slice(start, j);
  }
}
