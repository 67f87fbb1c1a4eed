// Parse tree (generated from grammar/QasmParser.g4) to syntax tree: one function per grammar rule, nothing semantic.
import type { ParserRuleContext, TerminalNode, Token } from "antlr4ng";
import * as P from "./generated/QasmParser.js";
import type { ArgDef, Expr, ForSet, IndexOp, Modifier, Operand, Pos, RangeExpr, Stmt, TypeName, TypeSpec } from "./ast.js";

/** Position of a token (lexer columns are 0-based, ours 1-based). */
export function tokenPos(t: Token): Pos {
  return { line: t.line, col: t.column + 1 };
}

const nodePos = (n: TerminalNode): Pos => tokenPos(n.symbol);
const startPos = (c: ParserRuleContext): Pos => tokenPos(c.start!);

/** Builds syntax-tree statements from parse-tree contexts; `source` is the file's text (for gate definition text). */
export class AstBuilder {
  constructor(private readonly source: string) {}

  statementOrScope(c: P.StatementOrScopeContext): Stmt {
    const s = c.statement();
    if (s) return this.statement(s);
    const sc = c.scope()!;
    return { k: "block", body: this.scope(sc), pos: startPos(sc) };
  }

  scope(c: P.ScopeContext): Stmt[] {
    return c.statementOrScope().map((s) => this.statementOrScope(s));
  }

  /** A body that is either one statement or a braced scope, as a statement list. */
  private body(c: P.StatementOrScopeContext): Stmt[] {
    const sc = c.scope();
    if (sc) return this.scope(sc);
    return [this.statement(c.statement()!)];
  }

  statement(c: P.StatementContext): Stmt {
    const pos = startPos(c);
    if (c instanceof P.GateCallStatementContext) {
      const ident = c.Identifier();
      return {
        k: "call",
        modifiers: c.gateModifier().map((m) => this.modifier(m)),
        name: ident.getText(),
        namePos: nodePos(ident),
        params: this.expressionList(c.expressionList()),
        designator: this.designatorOf(c.designator()),
        operands: this.operandList(c.gateOperandList()),
        pos,
      };
    }
    if (c instanceof P.GphaseStatementContext) {
      const ol = c.gateOperandList();
      return {
        k: "call",
        modifiers: c.gateModifier().map((m) => this.modifier(m)),
        name: "gphase",
        namePos: nodePos(c.GPHASE()),
        params: this.expressionList(c.expressionList()),
        designator: this.designatorOf(c.designator()),
        operands: ol ? this.operandList(ol) : [],
        pos,
      };
    }
    if (c instanceof P.PragmaStatementContext) {
      return { k: "pragma", text: pragmaText(c.PRAGMA().getText()), pos };
    }
    if (c instanceof P.AnnotationStatementContext) {
      return { k: "annotation", text: c.ANNOTATION().getText().slice(1).trim(), pos };
    }
    if (c instanceof P.VersionStatementContext) {
      const v = c.DecimalIntegerLiteral() ?? c.FloatLiteral();
      return { k: "version", version: v!.getText(), pos };
    }
    if (c instanceof P.IncludeStatementContext) {
      const s = (c.StringLiteral() ?? c.BitstringLiteral())!.getText();
      return { k: "include", path: s.slice(1, -1), pos };
    }
    if (c instanceof P.MeasureArrowStatementContext) {
      const target = c.indexedIdentifier();
      return { k: "measure", operand: this.operand(c.gateOperand()), target: target ? this.indexedIdentifier(target) : null, pos };
    }
    if (c instanceof P.ResetStatementContext) return { k: "reset", operand: this.operand(c.gateOperand()), pos };
    if (c instanceof P.BarrierStatementContext) {
      const ol = c.gateOperandList();
      return { k: "barrier", operands: ol ? this.operandList(ol) : [], pos };
    }
    if (c instanceof P.DelayStatementContext) {
      const ol = c.gateOperandList();
      return { k: "delay", duration: this.expression(c.designator().expression()), operands: ol ? this.operandList(ol) : [], pos };
    }
    if (c instanceof P.BoxStatementContext) {
      return { k: "box", duration: this.designatorOf(c.designator()), body: this.scope(c.scope()), pos };
    }
    if (c instanceof P.ForStatementContext) {
      const ident = c.Identifier();
      const st = c.scalarType();
      return {
        k: "for",
        varType: st ? this.scalarType(st) : null,
        name: ident.getText(),
        namePos: nodePos(ident),
        set: this.forSet(c.forSet()),
        body: this.body(c._body!),
        pos,
      };
    }
    if (c instanceof P.IfStatementContext) {
      return {
        k: "if",
        cond: this.expression(c.expression()),
        then: this.body(c._thenBody!),
        else: c._elseBody ? this.body(c._elseBody) : null,
        pos,
      };
    }
    if (c instanceof P.WhileStatementContext) {
      return { k: "while", cond: this.expression(c.expression()), body: this.body(c._body!), pos };
    }
    if (c instanceof P.AliasStatementContext) {
      const ident = c.Identifier();
      return {
        k: "let",
        name: ident.getText(),
        namePos: nodePos(ident),
        parts: c.aliasExpression().expression().map((e) => this.expression(e)),
        pos,
      };
    }
    if (c instanceof P.ConstStatementContext) {
      const ident = c.Identifier();
      return {
        k: "decl",
        mode: "const",
        type: this.scalarType(c.scalarType()),
        name: ident.getText(),
        namePos: nodePos(ident),
        init: this.declarationExpression(c.declarationExpression()),
        pos,
      };
    }
    if (c instanceof P.IoStatementContext) {
      const ident = c.Identifier();
      return {
        k: "decl",
        mode: c.INPUT() ? "input" : "output",
        type: this.anyType(c.scalarType(), c.arrayType()),
        name: ident.getText(),
        namePos: nodePos(ident),
        init: null,
        pos,
      };
    }
    if (c instanceof P.ClassicalStatementContext) {
      const ident = c.Identifier();
      const init = c.declarationExpression();
      return {
        k: "decl",
        mode: "var",
        type: this.anyType(c.scalarType(), c.arrayType()),
        name: ident.getText(),
        namePos: nodePos(ident),
        init: init ? this.declarationExpression(init) : null,
        pos,
      };
    }
    if (c instanceof P.OldStyleStatementContext) {
      const ident = c.Identifier();
      const size = this.designatorOf(c.designator());
      if (c.QREG()) return { k: "qubit", name: ident.getText(), namePos: nodePos(ident), size, pos };
      return {
        k: "decl",
        mode: "var",
        type: { name: "bit", size, pos },
        name: ident.getText(),
        namePos: nodePos(ident),
        init: null,
        pos,
      };
    }
    if (c instanceof P.QubitStatementContext) {
      const ident = c.Identifier();
      return { k: "qubit", name: ident.getText(), namePos: nodePos(ident), size: this.designatorOf(c.designator()), pos };
    }
    if (c instanceof P.GateStatementContext) {
      const ident = c.Identifier();
      const lists = c.identifierList();
      const hasParams = c.LPAREN() !== null;
      const paramList = hasParams && lists.length === 2 ? lists[0]! : null;
      const qubitList = lists[lists.length - 1]!;
      return {
        k: "gate",
        name: ident.getText(),
        namePos: nodePos(ident),
        params: paramList ? paramList.Identifier().map((i) => i.getText()) : [],
        qubits: qubitList.Identifier().map((i) => i.getText()),
        body: this.scope(c.scope()),
        text: this.source.slice(c.start!.start, c.stop!.stop + 1),
        pos,
      };
    }
    if (c instanceof P.DefStatementContext) {
      const ident = c.Identifier();
      const al = c.argumentList();
      const rs = c.returnSignature();
      return {
        k: "def",
        name: ident.getText(),
        namePos: nodePos(ident),
        args: al ? al.argumentDefinition().map((a) => this.argumentDefinition(a)) : [],
        returns: rs ? this.scalarType(rs.scalarType()) : null,
        body: this.scope(c.scope()),
        pos,
      };
    }
    if (c instanceof P.AssignmentStatementContext) {
      const e = c.expression();
      const m = c.measureExpression();
      return {
        k: "assign",
        target: this.indexedIdentifier(c.indexedIdentifier()),
        op: c._op!.text!,
        value: e ? this.expression(e) : this.measureExpression(m!),
        pos,
      };
    }
    if (c instanceof P.ExpressionStatementContext) return { k: "expr", e: this.expression(c.expression()), pos };
    if (c instanceof P.ReturnStatementContext) {
      const e = c.expression();
      const m = c.measureExpression();
      return { k: "return", value: e ? this.expression(e) : m ? this.measureExpression(m) : null, pos };
    }
    if (c instanceof P.BreakStatementContext) return { k: "break", pos };
    if (c instanceof P.ContinueStatementContext) return { k: "continue", pos };
    if (c instanceof P.EndStatementContext) return { k: "end", pos };
    if (c instanceof P.CalStatementContext) return { k: "unsupported", what: "calibration blocks ('cal')", pos };
    if (c instanceof P.DefcalStatementContext) return { k: "unsupported", what: "calibration definitions ('defcal')", pos };
    if (c instanceof P.DefcalgrammarStatementContext) return { k: "unsupported", what: "'defcalgrammar'", pos };
    if (c instanceof P.SwitchStatementContext) return { k: "unsupported", what: "'switch' statements", pos };
    if (c instanceof P.ExternStatementContext) return { k: "unsupported", what: "'extern' functions", pos };
    if (c instanceof P.OpaqueStatementContext) return { k: "unsupported", what: "'opaque' gates", pos };
    return { k: "unsupported", what: "this statement", pos };
  }

  private argumentDefinition(c: P.ArgumentDefinitionContext): ArgDef {
    const ident = c.Identifier();
    const name = ident?.getText() ?? "";
    const pos = startPos(c);
    const st = c.scalarType();
    if (c.arrayReferenceType()) return { k: "unsupported", what: "array arguments", name, pos };
    if (st) return { k: "classical", type: this.scalarType(st), name, pos };
    if (c.QUBIT() || c.QREG()) return { k: "qubit", size: this.designatorOf(c.designator()), name, pos };
    return { k: "creg", size: this.designatorOf(c.designator()), name, pos };
  }

  private declarationExpression(c: P.DeclarationExpressionContext): Expr {
    const m = c.measureExpression();
    if (m) return this.measureExpression(m);
    const e = c.expression();
    if (e) return this.expression(e);
    return { k: "unsupported", what: "array literals", pos: startPos(c) };
  }

  private measureExpression(c: P.MeasureExpressionContext): Expr {
    return { k: "measure", operand: this.operand(c.gateOperand()), pos: startPos(c) };
  }

  private modifier(c: P.GateModifierContext): Modifier {
    const pos = startPos(c);
    if (c.INV()) return { k: "inv", pos };
    if (c.POW()) return { k: "pow", e: this.expression(c.expression()!), pos };
    const e = c.expression();
    return { k: c.CTRL() ? "ctrl" : "negctrl", n: e ? this.expression(e) : null, pos };
  }

  private designatorOf(c: P.DesignatorContext | null): Expr | null {
    return c ? this.expression(c.expression()) : null;
  }

  private anyType(s: P.ScalarTypeContext | null, a: P.ArrayTypeContext | null): TypeSpec {
    if (s) return this.scalarType(s);
    return { name: "array", size: null, pos: startPos(a!) };
  }

  scalarType(c: P.ScalarTypeContext): TypeSpec {
    const pos = startPos(c);
    const name = c.start!.text as TypeName;
    return { name, size: name === "complex" ? null : this.designatorOf(c.designator()), pos };
  }

  private forSet(c: P.ForSetContext): ForSet {
    const se = c.setExpression();
    if (se) return { k: "set", items: se.expression().map((e) => this.expression(e)) };
    const re = c.rangeExpression();
    if (re) return { k: "range", range: this.range(re) };
    return { k: "expr", e: this.expression(c.expression()!) };
  }

  private range(c: P.RangeExpressionContext): RangeExpr {
    const hasStep = c.COLON().length === 2;
    const s = c._start ? this.expression(c._start) : null;
    const m = c._mid ? this.expression(c._mid) : null;
    const e = c._end ? this.expression(c._end) : null;
    return { k: "range", start: s, step: hasStep ? m : null, end: hasStep ? e : m, pos: startPos(c) };
  }

  operandList(c: P.GateOperandListContext): Operand[] {
    return c.gateOperand().map((o) => this.operand(o));
  }

  operand(c: P.GateOperandContext): Operand {
    const ii = c.indexedIdentifier();
    if (ii) return this.indexedIdentifier(ii);
    const hw = c.HardwareQubit()!;
    return { k: "hw", text: hw.getText(), pos: nodePos(hw) };
  }

  private indexedIdentifier(c: P.IndexedIdentifierContext): Operand {
    const ident = c.Identifier();
    return { k: "ref", name: ident.getText(), indices: c.indexOperator().map((i) => this.indexOperator(i)), pos: nodePos(ident) };
  }

  private indexOperator(c: P.IndexOperatorContext): IndexOp {
    const pos = startPos(c);
    const se = c.setExpression();
    if (se) return { k: "set", items: se.expression().map((e) => this.expression(e)), pos };
    return {
      k: "items",
      items: c.indexItem().map((it) => {
        const r = it.rangeExpression();
        return r ? this.range(r) : this.expression(it.expression()!);
      }),
      pos,
    };
  }

  private expressionList(c: P.ExpressionListContext | null): Expr[] {
    return c ? c.expression().map((e) => this.expression(e)) : [];
  }

  expression(c: P.ExpressionContext): Expr {
    if (c instanceof P.LiteralExpressionContext) return literal(c.start!);
    if (c instanceof P.ParenthesisExpressionContext) return this.expression(c.expression());
    if (c instanceof P.UnaryExpressionContext) {
      return { k: "unary", op: c._op!.text!, e: this.expression(c.expression()), pos: tokenPos(c._op!) };
    }
    if (
      c instanceof P.PowerExpressionContext ||
      c instanceof P.MultiplicativeExpressionContext ||
      c instanceof P.AdditiveExpressionContext ||
      c instanceof P.BitshiftExpressionContext ||
      c instanceof P.ComparisonExpressionContext ||
      c instanceof P.EqualityExpressionContext ||
      c instanceof P.BitwiseAndExpressionContext ||
      c instanceof P.BitwiseXorExpressionContext ||
      c instanceof P.BitwiseOrExpressionContext ||
      c instanceof P.LogicalAndExpressionContext ||
      c instanceof P.LogicalOrExpressionContext
    ) {
      const [l, r] = c.expression();
      const opTok = c instanceof P.PowerExpressionContext ? c.DOUBLE_ASTERISK().symbol : c._op!;
      return { k: "binary", op: opTok.text!, l: this.expression(l!), r: this.expression(r!), pos: tokenPos(opTok) };
    }
    if (c instanceof P.CallExpressionContext) {
      const ident = c.Identifier();
      return { k: "call", name: ident.getText(), args: this.expressionList(c.expressionList()), pos: nodePos(ident) };
    }
    if (c instanceof P.CastExpressionContext) {
      return { k: "cast", type: this.anyType(c.scalarType(), c.arrayType()), e: this.expression(c.expression()), pos: startPos(c) };
    }
    if (c instanceof P.IndexExpressionContext) {
      const io = c.indexOperator();
      return { k: "index", e: this.expression(c.expression()), index: this.indexOperator(io), pos: startPos(io) };
    }
    if (c instanceof P.MeasureInExpressionContext) {
      return { k: "measure", operand: this.operand(c.gateOperand()), pos: startPos(c) };
    }
    if (c instanceof P.DurationofExpressionContext) return { k: "unsupported", what: "'durationof'", pos: startPos(c) };
    return { k: "unsupported", what: "this expression", pos: startPos(c) };
  }
}

/** The text of a pragma after the `pragma`/`#pragma` keyword. */
export function pragmaText(raw: string): string {
  return raw.replace(/^#?pragma/, "").trim();
}

function literal(t: Token): Expr {
  const pos = tokenPos(t);
  const text = t.text!;
  switch (t.type) {
    case P.QasmParser.Identifier:
      return { k: "ident", name: text, pos };
    case P.QasmParser.BooleanLiteral:
      return { k: "bool", value: text === "true", pos };
    case P.QasmParser.BitstringLiteral:
      return { k: "bits", text: text.slice(1, -1), pos };
    case P.QasmParser.TimingLiteral:
      return { k: "timing", text, pos };
    case P.QasmParser.ImaginaryLiteral:
      return { k: "unsupported", what: "complex numbers", pos };
    case P.QasmParser.HardwareQubit:
      return { k: "unsupported", what: "hardware qubits in expressions", pos };
    default:
      return { k: "num", text, pos };
  }
}
