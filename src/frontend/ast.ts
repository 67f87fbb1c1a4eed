// The syntax tree the front end works on: plain records built from the grammar's parse tree (or the fast path), one top-level statement at a time.

/** A position in the current file: 1-based line and 1-based column (in characters). */
export interface Pos {
  readonly line: number;
  readonly col: number;
}

export type Expr =
  /** An integer or float literal, as spelled (e.g. "0.25", "1_000", "0x1F", "1e-3"). */
  | { readonly k: "num"; readonly text: string; readonly pos: Pos }
  | { readonly k: "ident"; readonly name: string; readonly pos: Pos }
  | { readonly k: "bool"; readonly value: boolean; readonly pos: Pos }
  /** A bitstring literal without its quotes (underscores kept). */
  | { readonly k: "bits"; readonly text: string; readonly pos: Pos }
  /** A duration literal as spelled, e.g. "100ns". */
  | { readonly k: "timing"; readonly text: string; readonly pos: Pos }
  /** `op e`; `pos` is the operator's. */
  | { readonly k: "unary"; readonly op: string; readonly e: Expr; readonly pos: Pos }
  /** `l op r`; `pos` is the operator's. */
  | { readonly k: "binary"; readonly op: string; readonly l: Expr; readonly r: Expr; readonly pos: Pos }
  | { readonly k: "call"; readonly name: string; readonly args: readonly Expr[]; readonly pos: Pos }
  | { readonly k: "cast"; readonly type: TypeSpec; readonly e: Expr; readonly pos: Pos }
  | { readonly k: "index"; readonly e: Expr; readonly index: IndexOp; readonly pos: Pos }
  | { readonly k: "measure"; readonly operand: Operand; readonly pos: Pos }
  /** Something the grammar reads but tledger does not support in an expression (named in `what`). */
  | { readonly k: "unsupported"; readonly what: string; readonly pos: Pos };

/** `[a:b]`, `[a:s:b]` (start, step, end; the end is included), any part may be absent. */
export interface RangeExpr {
  readonly k: "range";
  readonly start: Expr | null;
  readonly step: Expr | null;
  readonly end: Expr | null;
  readonly pos: Pos;
}

/** One bracket: `[{1, 3}]` (a set) or `[i]`, `[a:b]`, `[i, j]` (items; more than one is multi-dimensional). */
export type IndexOp =
  | { readonly k: "set"; readonly items: readonly Expr[]; readonly pos: Pos }
  | { readonly k: "items"; readonly items: readonly (Expr | RangeExpr)[]; readonly pos: Pos };

/** A register reference with zero or more brackets, or a hardware qubit `$n`. */
export type Operand =
  | { readonly k: "ref"; readonly name: string; readonly indices: readonly IndexOp[]; readonly pos: Pos }
  | { readonly k: "hw"; readonly text: string; readonly pos: Pos };

export type TypeName = "bit" | "int" | "uint" | "float" | "angle" | "bool" | "duration" | "stretch" | "complex" | "array";

export interface TypeSpec {
  readonly name: TypeName;
  /** The designator `[n]`, or null. */
  readonly size: Expr | null;
  readonly pos: Pos;
}

export type Modifier =
  | { readonly k: "inv"; readonly pos: Pos }
  | { readonly k: "pow"; readonly e: Expr; readonly pos: Pos }
  | { readonly k: "ctrl" | "negctrl"; readonly n: Expr | null; readonly pos: Pos };

export type ForSet =
  | { readonly k: "range"; readonly range: RangeExpr }
  | { readonly k: "set"; readonly items: readonly Expr[] }
  | { readonly k: "expr"; readonly e: Expr };

export type ArgDef =
  | { readonly k: "classical"; readonly type: TypeSpec; readonly name: string; readonly pos: Pos }
  | { readonly k: "qubit"; readonly size: Expr | null; readonly name: string; readonly pos: Pos }
  | { readonly k: "creg"; readonly size: Expr | null; readonly name: string; readonly pos: Pos }
  | { readonly k: "unsupported"; readonly what: string; readonly name: string; readonly pos: Pos };

export type Stmt =
  | { readonly k: "pragma"; readonly text: string; readonly pos: Pos }
  | { readonly k: "annotation"; readonly text: string; readonly pos: Pos }
  | { readonly k: "version"; readonly version: string; readonly pos: Pos }
  | { readonly k: "include"; readonly path: string; readonly pos: Pos }
  /** A statement the grammar reads but tledger does not support (calibrations, switch, extern, ...). */
  | { readonly k: "unsupported"; readonly what: string; readonly pos: Pos }
  | { readonly k: "break" | "continue" | "end"; readonly pos: Pos }
  | { readonly k: "return"; readonly value: Expr | null; readonly pos: Pos }
  | { readonly k: "block"; readonly body: readonly Stmt[]; readonly pos: Pos }
  | {
      readonly k: "for";
      readonly varType: TypeSpec | null;
      readonly name: string;
      readonly namePos: Pos;
      readonly set: ForSet;
      readonly body: readonly Stmt[];
      readonly pos: Pos;
    }
  | { readonly k: "if"; readonly cond: Expr; readonly then: readonly Stmt[]; readonly else: readonly Stmt[] | null; readonly pos: Pos }
  | { readonly k: "while"; readonly cond: Expr; readonly body: readonly Stmt[]; readonly pos: Pos }
  | { readonly k: "barrier"; readonly operands: readonly Operand[]; readonly pos: Pos }
  | { readonly k: "box"; readonly duration: Expr | null; readonly body: readonly Stmt[]; readonly pos: Pos }
  | { readonly k: "delay"; readonly duration: Expr; readonly operands: readonly Operand[]; readonly pos: Pos }
  | {
      /** A gate call; `name` is "gphase" for the builtin global phase. */
      readonly k: "call";
      readonly modifiers: readonly Modifier[];
      readonly name: string;
      readonly namePos: Pos;
      readonly params: readonly Expr[];
      readonly designator: Expr | null;
      readonly operands: readonly Operand[];
      readonly pos: Pos;
    }
  | { readonly k: "measure"; readonly operand: Operand; readonly target: Operand | null; readonly pos: Pos }
  | { readonly k: "reset"; readonly operand: Operand; readonly pos: Pos }
  | { readonly k: "let"; readonly name: string; readonly namePos: Pos; readonly parts: readonly Expr[]; readonly pos: Pos }
  | {
      /** Classical declarations: `const`, `input`, `output` or a plain variable (`bit[2] c;`, `creg c[2];`, `int n = 3;`). */
      readonly k: "decl";
      readonly mode: "const" | "input" | "output" | "var";
      readonly type: TypeSpec;
      readonly name: string;
      readonly namePos: Pos;
      readonly init: Expr | null;
      readonly pos: Pos;
    }
  | { readonly k: "qubit"; readonly name: string; readonly namePos: Pos; readonly size: Expr | null; readonly pos: Pos }
  | {
      readonly k: "def";
      readonly name: string;
      readonly namePos: Pos;
      readonly args: readonly ArgDef[];
      readonly returns: TypeSpec | null;
      readonly body: readonly Stmt[];
      readonly pos: Pos;
    }
  | {
      readonly k: "gate";
      readonly name: string;
      readonly namePos: Pos;
      readonly params: readonly string[];
      readonly qubits: readonly string[];
      readonly body: readonly Stmt[];
      /** The definition's source text (for recognising the writer's own definitions). */
      readonly text: string;
      readonly pos: Pos;
    }
  | { readonly k: "assign"; readonly target: Operand; readonly op: string; readonly value: Expr; readonly pos: Pos }
  | { readonly k: "expr"; readonly e: Expr; readonly pos: Pos };
