// Source text to syntax-tree statements, one top-level statement at a time: the fast path for plain gate calls, the generated parser for everything else, syntax errors as diagnostics.
import {
  DefaultErrorStrategy,
  BailErrorStrategy,
  CommonTokenStream,
  IntervalSet,
  NoViableAltException,
  ParseCancellationException,
  PredictionMode,
  Token,
  type CharStream,
  type Interval,
  type Parser,
  type RecognitionException,
} from "antlr4ng";
import { QasmLexer } from "./generated/QasmLexer.js";
import { QasmParser } from "./generated/QasmParser.js";
import { AstBuilder } from "./build-ast.js";
import type { Expr, Stmt } from "./ast.js";
import { DiagnosticError } from "./diagnostics.js";
import { fastStatement } from "./fast-path.js";

/** A file's text as the front end reads it. */
export interface SourceText {
  readonly file: string;
  readonly text: string;
}

/** A position in a source text: UTF-16 offset, 1-based line, 1-based column (in code points). */
export interface Cursor {
  readonly i: number;
  readonly line: number;
  readonly col: number;
}

/**
 * Every statement of a file, in order. Top-level statements are parsed one at a time and handed out
 * before the next is read, so a large file never holds more than one statement's parse tree.
 */
export function* readStatements(src: SourceText): Generator<Stmt> {
  const text = src.text;
  let cur: Cursor = { i: 0, line: 1, col: 1 };
  for (;;) {
    cur = skipLayout(text, cur);
    if (cur.i >= text.length) return;
    const fast = fastStatement(text, cur);
    if (fast) {
      yield fast.stmt;
      cur = fast.next;
      continue;
    }
    let slow: { stmt: Stmt; next: Cursor };
    try {
      slow = parseStatementAt(src, cur);
    } catch (e) {
      if (e instanceof RangeError && /call stack/i.test(e.message)) {
        throw new DiagnosticError([{ severity: "error", file: src.file, line: cur.line, col: cur.col, message: "this statement is nested too deeply to parse" }]);
      }
      throw e;
    }
    yield slow.stmt;
    cur = slow.next;
  }
}

/** Skip blanks and complete comments (an unterminated block comment is left for the lexer to report). */
export function skipLayout(text: string, cur: Cursor): Cursor {
  let { i, line, col } = cur;
  const n = text.length;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === 10) {
      i++;
      line++;
      col = 1;
    } else if (c === 32 || c === 9 || c === 13 || c === 12) {
      i++;
      col++;
    } else if (c === 47 && text.charCodeAt(i + 1) === 47) {
      while (i < n && text.charCodeAt(i) !== 10) {
        if (!isLowSurrogate(text.charCodeAt(i))) col++;
        i++;
      }
    } else if (c === 47 && text.charCodeAt(i + 1) === 42) {
      const close = text.indexOf("*/", i + 2);
      if (close < 0) break;
      for (const end = close + 2; i < end; i++) {
        const d = text.charCodeAt(i);
        if (d === 10) {
          line++;
          col = 1;
        } else if (!isLowSurrogate(d)) col++;
      }
    } else break;
  }
  return { i, line, col };
}

const isLowSurrogate = (c: number): boolean => c >= 0xdc00 && c <= 0xdfff;
const isHighSurrogate = (c: number): boolean => c >= 0xd800 && c <= 0xdbff;

/**
 * The generated lexer's view of a window [start, limit) of a file's text, without copying it: the lexer
 * reads code points, positions stay UTF-16 offsets into the whole text (so token text is a slice).
 * Looking back (LA(-k)) may see before the window, for the annotation rule's start-of-line check.
 */
class SourceCharStream implements CharStream {
  name: string;
  index: number;
  constructor(
    private readonly text: string,
    private readonly start: number,
    private readonly limit: number,
    name: string,
  ) {
    this.name = name;
    this.index = start;
  }
  reset(): void {
    this.index = this.start;
  }
  consume(): void {
    if (this.index >= this.limit) throw new RangeError("cannot consume EOF");
    this.index += isHighSurrogate(this.text.charCodeAt(this.index)) && this.index + 1 < this.limit ? 2 : 1;
  }
  LA(offset: number): number {
    if (offset === 0) return 0;
    let i = this.index;
    if (offset > 0) {
      for (let k = 1; k < offset; k++) {
        if (i >= this.limit) return Token.EOF;
        i += isHighSurrogate(this.text.charCodeAt(i)) ? 2 : 1;
      }
      if (i >= this.limit) return Token.EOF;
      const c = this.text.codePointAt(i)!;
      return c > 0xffff && i + 1 >= this.limit ? this.text.charCodeAt(i) : c;
    }
    for (let k = 0; k < -offset; k++) {
      if (i <= 0) return Token.EOF;
      i -= i >= 2 && isLowSurrogate(this.text.charCodeAt(i - 1)) && isHighSurrogate(this.text.charCodeAt(i - 2)) ? 2 : 1;
    }
    return this.text.codePointAt(i)!;
  }
  mark(): number {
    return -1;
  }
  release(): void {}
  seek(index: number): void {
    this.index = index;
  }
  get size(): number {
    return this.limit;
  }
  getSourceName(): string {
    return this.name;
  }
  getTextFromRange(start: number, stop: number): string {
    return this.text.slice(start, stop + 1);
  }
  getTextFromInterval(interval: Interval): string {
    return this.text.slice(interval.start, interval.stop + 1);
  }
  toString(): string {
    return this.text.slice(this.start, this.limit);
  }
}

/** Words the lexer reserves (a fast-path identifier must not be one of them). */
export const KEYWORDS: ReadonlySet<string> = new Set([
  ...QasmLexer.literalNames
    .filter((n): n is string => n !== null)
    .map((n) => n.slice(1, -1))
    .filter((n) => /^[#A-Za-z_]/.test(n)),
  "true",
  "false",
  "pragma",
]);

interface Attempt {
  readonly stmt: Stmt;
  readonly next: Cursor;
  /** The token after the statement touches the window's end (it may be cut short). */
  readonly cutShort: boolean;
}

/** Parse the one statement (or braced scope) that starts at `cur` with the generated parser. */
export function parseStatementAt(src: SourceText, cur: Cursor): { stmt: Stmt; next: Cursor } {
  const n = src.text.length;
  for (let window = 4096; ; window *= 8) {
    const limit = Math.min(n, cur.i + window);
    const full = limit === n;
    let attempt: Attempt;
    try {
      attempt = attemptParse(src, cur, limit, false);
    } catch (e) {
      if (!(e instanceof ParseCancellationException)) throw e;
      try {
        attempt = attemptParse(src, cur, limit, true);
      } catch (e2) {
        if (e2 instanceof WindowSyntaxError) {
          if (!full && e2.touchesEnd) continue;
          throw e2.error;
        }
        throw e2;
      }
    }
    if (!full && attempt.cutShort) continue;
    return { stmt: attempt.stmt, next: attempt.next };
  }
}

/** A syntax error found in a window; `touchesEnd` when it may be an artefact of the window's end. */
class WindowSyntaxError extends Error {
  constructor(
    readonly error: DiagnosticError,
    readonly touchesEnd: boolean,
  ) {
    super(error.message);
  }
}

function attemptParse(src: SourceText, cur: Cursor, limit: number, reporting: boolean): Attempt {
  const chars = new SourceCharStream(src.text, cur.i, limit, src.file);
  const lexer = new QasmLexer(chars);
  lexer.removeErrorListeners();
  lexer.line = cur.line;
  lexer.column = cur.col - 1;
  const tokens = new CommonTokenStream(lexer);
  const parser = new QasmParser(tokens);
  parser.removeErrorListeners();
  if (reporting) {
    parser.interpreter.predictionMode = PredictionMode.LL;
    parser.errorHandler = new ReportingStrategy(src.file, limit);
  } else {
    parser.interpreter.predictionMode = PredictionMode.SLL;
    parser.errorHandler = new BailErrorStrategy();
  }
  const ctx = parser.statementOrScope();
  const stmt = new AstBuilder(src.text).statementOrScope(ctx);
  const stop = ctx.stop!;
  const after = tokens.LT(1)!;
  const cutShort = after.type === Token.EOF || after.stop >= limit - 1;
  const stopText = stop.text ?? "";
  return {
    stmt,
    next: { i: stop.stop + 1, line: stop.line, col: stop.column + 1 + codePointLength(stopText) },
    cutShort,
  };
}

function codePointLength(s: string): number {
  let n = 0;
  for (let i = 0; i < s.length; i++) if (!isLowSurrogate(s.charCodeAt(i))) n++;
  return n;
}

/** Error strategy of the second (full LL) attempt: the first syntax error becomes a diagnostic, no recovery. */
class ReportingStrategy extends DefaultErrorStrategy {
  constructor(
    private readonly file: string,
    private readonly limit: number,
  ) {
    super();
  }

  override reportError(recognizer: Parser, e: RecognitionException): never {
    let expected: IntervalSet | null = null;
    if (e instanceof NoViableAltException && e.deadEndConfigs) {
      expected = new IntervalSet();
      for (const c of e.deadEndConfigs.configs) expected.addSet(recognizer.atn.nextTokens(c.state));
    } else {
      expected = e.getExpectedTokens();
    }
    const t = e.offendingToken ?? recognizer.getCurrentToken();
    this.fail(t, expected);
  }

  override recoverInline(recognizer: Parser): never {
    this.fail(recognizer.getCurrentToken(), recognizer.getExpectedTokens());
  }

  override sync(recognizer: Parser): void {
    const s = recognizer.atn.states[recognizer.state];
    if (!s) return;
    const la = recognizer.tokenStream.LA(1);
    const next = recognizer.atn.nextTokens(s);
    if (next.contains(la) || next.contains(Token.EPSILON)) return;
    this.fail(recognizer.getCurrentToken(), recognizer.getExpectedTokens());
  }

  private fail(t: Token, expected: IntervalSet | null): never {
    const diag = syntaxDiagnostic(this.file, t, expected);
    throw new WindowSyntaxError(diag, t.type === Token.EOF || t.stop >= this.limit - 1);
  }
}

/** Display names of tokens in "expected ..." lists. */
function tokenDisplay(type: number): string {
  if (type === Token.EOF) return "end of file";
  const lit = QasmLexer.literalNames[type];
  if (lit) return lit;
  switch (type) {
    case QasmLexer.Identifier:
      return "an identifier";
    case QasmLexer.DecimalIntegerLiteral:
      return "an integer";
    case QasmLexer.FloatLiteral:
      return "a number";
    case QasmLexer.StringLiteral:
      return "a string";
    case QasmLexer.BitstringLiteral:
      return "a bitstring";
    case QasmLexer.TimingLiteral:
      return "a duration";
    case QasmLexer.BooleanLiteral:
      return "'true' or 'false'";
    case QasmLexer.HardwareQubit:
      return "a hardware qubit";
    case QasmLexer.EQUALITY_OPERATOR:
      return "'==' or '!='";
    case QasmLexer.COMPARISON_OPERATOR:
      return "a comparison";
    case QasmLexer.COMPOUND_ASSIGNMENT_OPERATOR:
      return "an assignment operator";
    case QasmLexer.BITSHIFT_OPERATOR:
      return "'<<' or '>>'";
    case QasmLexer.PRAGMA:
      return "a pragma";
    case QasmLexer.ANNOTATION:
      return "an annotation";
    default:
      return QasmLexer.symbolicNames[type] ?? `token ${type}`;
  }
}

const EXPRESSION_START = [
  QasmLexer.Identifier,
  QasmLexer.DecimalIntegerLiteral,
  QasmLexer.FloatLiteral,
  QasmLexer.LPAREN,
  QasmLexer.MINUS,
  QasmLexer.BinaryIntegerLiteral,
  QasmLexer.OctalIntegerLiteral,
  QasmLexer.HexIntegerLiteral,
  QasmLexer.ImaginaryLiteral,
  QasmLexer.BooleanLiteral,
  QasmLexer.BitstringLiteral,
  QasmLexer.TimingLiteral,
  QasmLexer.HardwareQubit,
  QasmLexer.TILDE,
  QasmLexer.EXCLAMATION_POINT,
  QasmLexer.PLUS,
  QasmLexer.MEASURE,
  QasmLexer.DURATIONOF,
  QasmLexer.BIT,
  QasmLexer.INT,
  QasmLexer.UINT,
  QasmLexer.FLOAT,
  QasmLexer.ANGLE,
  QasmLexer.BOOL,
  QasmLexer.DURATION,
  QasmLexer.STRETCH,
  QasmLexer.COMPLEX,
  QasmLexer.ARRAY,
];
const OPERATORS = [
  QasmLexer.LBRACKET,
  QasmLexer.PLUS,
  QasmLexer.MINUS,
  QasmLexer.ASTERISK,
  QasmLexer.DOUBLE_ASTERISK,
  QasmLexer.SLASH,
  QasmLexer.PERCENT,
  QasmLexer.PIPE,
  QasmLexer.DOUBLE_PIPE,
  QasmLexer.AMPERSAND,
  QasmLexer.DOUBLE_AMPERSAND,
  QasmLexer.CARET,
  QasmLexer.EQUALITY_OPERATOR,
  QasmLexer.COMPARISON_OPERATOR,
  QasmLexer.BITSHIFT_OPERATOR,
];
const OPERATOR_MARK = -100;
const STATEMENT_MARKERS = [QasmLexer.GATE, QasmLexer.QUBIT, QasmLexer.FOR];

/** "expected ..." for a set of token types, grouped into "a statement" or "an expression" when it is one. */
export function describeExpected(set: IntervalSet | null): string | null {
  if (!set) return null;
  let types = set.toArray().filter((t) => t !== Token.EPSILON && t > 0 || t === Token.EOF);
  if (types.length === 0) return null;
  const parts: string[] = [];
  if (STATEMENT_MARKERS.every((t) => types.includes(t))) return types.includes(QasmLexer.RBRACE) ? "a statement or '}'" : "a statement";
  const core = [QasmLexer.Identifier, QasmLexer.DecimalIntegerLiteral, QasmLexer.FloatLiteral, QasmLexer.LPAREN];
  if (core.every((t) => types.includes(t))) {
    parts.push("an expression");
    types = types.filter((t) => !EXPRESSION_START.includes(t));
  }
  // After an operand anything may continue with an operator; name the closing punctuation instead.
  const ops = types.filter((t) => OPERATORS.includes(t));
  if (ops.length > 0 && ops.length < types.length) {
    types = types.filter((t) => !OPERATORS.includes(t));
    if (ops.length > 2) types.push(OPERATOR_MARK);
  }
  const rest = types.map((t) => (t === OPERATOR_MARK ? "an operator" : tokenDisplay(t)));
  if (parts.length + rest.length > 6) return [...parts, ...rest.slice(0, 5 - parts.length)].join(", ") + ", ...";
  const all = [...parts, ...rest];
  return all.length <= 1 ? all.join("") : all.slice(0, -1).join(", ") + " or " + all[all.length - 1];
}

function quoteToken(t: Token): string {
  const text = t.text ?? "";
  const short = text.length > 24 ? text.slice(0, 21) + "..." : text;
  return `'${short}'`;
}

/** The diagnostic for a syntax error at token `t`. */
function syntaxDiagnostic(file: string, t: Token, expected: IntervalSet | null): DiagnosticError {
  const line = t.line;
  const col = t.column + 1;
  let message: string;
  let withExpected = true;
  switch (t.type) {
    case Token.EOF:
      message = "unexpected end of file";
      break;
    case QasmLexer.ErrorCharacter:
      message = `unexpected character ${quoteToken(t)}`;
      break;
    case QasmLexer.UnterminatedString:
      message = "unterminated string";
      withExpected = false;
      break;
    case QasmLexer.UnterminatedComment:
      message = "unterminated comment";
      withExpected = false;
      break;
    default:
      message = `unexpected ${quoteToken(t)}`;
  }
  const exp = withExpected ? describeExpected(expected) : null;
  if (exp) message += `; expected ${exp}`;
  const hint = t.type === QasmLexer.UnterminatedComment ? "close it with '*/'" : t.type === QasmLexer.UnterminatedString ? "close it with a quote on the same line" : undefined;
  return new DiagnosticError([{ severity: "error", file, line, col, message, ...(hint ? { hint } : {}) }]);
}

/** Parse a whole text as one expression (for `--param name=EXPR` values). */
export function parseExpressionText(src: SourceText): Expr {
  const chars = new SourceCharStream(src.text, 0, src.text.length, src.file);
  const lexer = new QasmLexer(chars);
  lexer.removeErrorListeners();
  const tokens = new CommonTokenStream(lexer);
  const parser = new QasmParser(tokens);
  parser.removeErrorListeners();
  parser.interpreter.predictionMode = PredictionMode.LL;
  parser.errorHandler = new ReportingStrategy(src.file, src.text.length + 1);
  try {
    const ctx = parser.standaloneExpression();
    return new AstBuilder(src.text).expression(ctx.expression());
  } catch (e) {
    if (e instanceof WindowSyntaxError) throw e.error;
    throw e;
  }
}
