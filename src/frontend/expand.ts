// Analysis and expansion: statements in, IR out — declarations and scopes, gate and subroutine inlining, modifiers, loop unrolling, kept control flow, includes.
import { resolve as resolvePath } from "node:path";
import type { Angle, Rational } from "../ir/angle.js";
import type {
  BitRef,
  Circuit,
  ClassicalReg,
  GateOp,
  QubitReg,
  SourceLoc,
  Stmt as IrStmt,
} from "../ir/circuit.js";
import { CANONICAL_PRAGMA, gateDefinition, sameDefinitionText } from "../emit/gate-definitions.js";
import type { Expr, Modifier, Operand, Pos, Stmt, TypeSpec } from "./ast.js";
import { DiagnosticError } from "./diagnostics.js";
import {
  castValue,
  evalAngle,
  evalInteger,
  evalNumber,
  evaluate,
  evaluateConstant,
  fail,
  isBuiltinName,
  toCondition,
  type BitLookup,
  type EvalEnv,
} from "./evaluate.js";
import { canonicalOps, controlOps, invertOps, ModifierError, powerOps, type TOp } from "./gate-ops.js";
import { includeLibrary } from "./libraries.js";
import { exprAsOperand, MAX_REGISTER, resolveBits, resolveQubits, type Selection } from "./operands.js";
import { DuplicateName, Scope, type GateSym, type Subroutine, type Sym, type UserGate } from "./scope.js";
import { findInclude, readSourceFile } from "./source.js";
import { parseExpressionText, readStatements, type SourceText } from "./syntax.js";
import { isInteger, isNum, type NumValue, type Value } from "./values.js";

export interface FrontendOptions {
  /** Folders searched for `include "file";` after the including file's own folder. */
  readonly includeDirs?: readonly string[];
  /** Values of `input` declarations, as OpenQASM expressions (`{ theta: "0.3", phi: "pi/8" }`). */
  readonly params?: Readonly<Record<string, string>>;
  /** Upper limit on operations (and loop iterations) the expansion may produce; default 10 million (about 2 GB of IR). */
  readonly maxOps?: number;
  /** Accept --param values the program does not declare as inputs (commands that read several files at once). */
  readonly allowUnusedParams?: boolean;
}

/** The mutable state of one front-end run. */
interface Program {
  numQubits: number;
  readonly qubitRegs: QubitReg[];
  readonly bits: ClassicalReg[];
  readonly body: IrStmt[];
  readonly global: Scope;
  readonly includeDirs: readonly string[];
  readonly includeStack: string[];
  readonly params: Map<string, { readonly text: string; used: boolean }>;
  readonly defStack: string[];
  readonly templateCache: Map<UserGate, Map<string, readonly TOp[]>>;
  readonly maxOps: number;
  work: number;
  gateOrder: number;
  qasm2: boolean;
  pendingCanonical: { readonly name: string; readonly file: string; readonly pos: Pos } | null;
}

/** Where statements are being expanded. */
interface Ctx extends EvalEnv {
  readonly prog: Program;
  /** IR statements go here (null inside a gate body, whose calls go to `template`). */
  readonly out: IrStmt[] | null;
  readonly template: TOp[] | null;
  /** Inside an if or while block: classical state is only known at run time. */
  readonly runtime: boolean;
  /** In an unrolled loop body, outside any run-time block: break and continue are allowed. */
  readonly breakable: boolean;
  readonly inDef: boolean;
  /** Inside an inlined subroutine: the call's location, given to every operation. */
  readonly callLoc: SourceLoc | null;
  /** In a gate body: only gates defined before it may be called. */
  readonly gateOrderLimit: number;
  /** How a qubit number reads in diagnostics (`q[3]`, or a gate's argument name). */
  readonly qubitLabel: (q: number) => string;
  /** Per file: whether a statement has been seen (the version line must come first). */
  readonly fileState: { seen: boolean };
}

class LoopSignal {
  constructor(readonly kind: "break" | "continue") {}
}
class ReturnSignal {}

const DEFAULT_MAX_OPS = 10_000_000;

/** Expand a whole program (the main file's text) into the IR. */
export function expandProgram(main: SourceText, opts: FrontendOptions = {}): Circuit {
  const prog: Program = {
    numQubits: 0,
    qubitRegs: [],
    bits: [],
    body: [],
    global: new Scope("global", null),
    includeDirs: opts.includeDirs ?? [],
    includeStack: [resolvePath(main.file)],
    params: new Map(Object.entries(opts.params ?? {}).map(([k, v]) => [k, { text: v, used: false }])),
    defStack: [],
    templateCache: new Map(),
    maxOps: opts.maxOps ?? DEFAULT_MAX_OPS,
    work: 0,
    gateOrder: 0,
    qasm2: false,
    pendingCanonical: null,
  };
  prog.global.declare("U", { kind: "gate", gate: { kind: "canonical", name: "U", target: "U", numParams: 3, numQubits: 1, order: 0 } });
  expandFile(main, prog);
  for (const [name, p] of prog.params) {
    if (!p.used && !opts.allowUnusedParams) {
      throw new DiagnosticError([
        { severity: "error", file: `--param ${name}`, line: 0, col: 0, message: `'${name}' is not an input of the program`, hint: "the program's inputs are its 'input' declarations" },
      ]);
    }
  }
  return { numQubits: prog.numQubits, qubitRegs: prog.qubitRegs, bits: prog.bits, body: prog.body };
}

function expandFile(src: SourceText, prog: Program): void {
  const ctx: Ctx = {
    prog,
    file: src.file,
    scope: prog.global,
    out: prog.body,
    template: null,
    runtime: false,
    breakable: false,
    inDef: false,
    callLoc: null,
    gateOrderLimit: Infinity,
    qubitLabel: (q) => globalQubitLabel(prog, q),
    fileState: { seen: false },
  };
  for (const s of readStatements(src)) {
    if (prog.pendingCanonical && s.k !== "gate") {
      const pc = prog.pendingCanonical;
      fail(pc.file, pc.pos, `'pragma ${CANONICAL_PRAGMA} ${pc.name}' must be followed by the definition of '${pc.name}'`);
    }
    try {
      statement(s, ctx);
    } catch (e) {
      if (isStackOverflow(e)) fail(ctx.file, s.pos, "this statement is nested too deeply to expand");
      throw e;
    }
    ctx.fileState.seen = true;
  }
  if (prog.pendingCanonical) {
    const pc = prog.pendingCanonical;
    fail(pc.file, pc.pos, `'pragma ${CANONICAL_PRAGMA} ${pc.name}' must be followed by the definition of '${pc.name}'`);
  }
}

/** The engine's "Maximum call stack size exceeded" (deeply nested input). */
export function isStackOverflow(e: unknown): boolean {
  return e instanceof RangeError && /call stack/i.test(e.message);
}

function globalQubitLabel(prog: Program, q: number): string {
  for (const r of prog.qubitRegs) if (q >= r.start && q < r.start + r.size) return `${r.name}[${q - r.start}]`;
  return `qubit ${q}`;
}

function loc(ctx: Ctx, pos: Pos): SourceLoc {
  return ctx.callLoc ?? { file: ctx.file, line: pos.line, col: pos.col };
}

/** Count work (operations, loop iterations) against the limit. */
function spend(ctx: Ctx, pos: Pos, n: number): void {
  ctx.prog.work += n;
  if (ctx.prog.work > ctx.prog.maxOps) {
    fail(ctx.file, pos, `the expanded program is too large (more than ${ctx.prog.maxOps} operations or loop iterations)`, "check loop bounds and pow(k) exponents");
  }
}

function emitIr(ctx: Ctx, s: IrStmt): void {
  ctx.out!.push(s);
}

function declare(ctx: Ctx, name: string, pos: Pos, sym: Sym): void {
  if (isBuiltinName(name)) fail(ctx.file, pos, `'${name}' is a built-in name and cannot be declared`);
  try {
    ctx.scope.declare(name, sym);
  } catch (e) {
    if (e instanceof DuplicateName) {
      const prev = ctx.scope.getOwn(name);
      const what = prev?.kind === "gate" ? (prev.gate.kind === "library" ? "a gate of an included library" : prev.gate.kind === "canonical" && prev.gate.order === 0 ? "a built-in gate" : "a gate") : prev?.kind === "def" ? "a subroutine" : prev?.kind === "qubits" ? "a qubit register or alias" : prev?.kind === "bits" ? "a classical register or alias" : "a classical variable";
      fail(ctx.file, pos, `duplicate declaration of '${name}': it is already ${what}`, "choose another name");
    }
    throw e;
  }
}

function requireGlobal(ctx: Ctx, pos: Pos, what: string): void {
  if (!ctx.scope.isGlobal || ctx.template) fail(ctx.file, pos, `${what} only at global scope`);
}

function requireNotGateBody(ctx: Ctx, pos: Pos, what: string): void {
  if (ctx.template) fail(ctx.file, pos, `${what} cannot appear in a gate body`, "a gate body holds gate calls, gphase and for loops");
}

// ---------------------------------------------------------------------------------------------
// Statements.

function statement(s: Stmt, ctx: Ctx): void {
  switch (s.k) {
    case "call":
      return gateCall(s, ctx);
    case "version":
      return version(s.version, s.pos, ctx);
    case "include":
      return include(s.path, s.pos, ctx);
    case "qubit":
      return qubitDecl(s, ctx);
    case "decl":
      return classicalDecl(s, ctx);
    case "gate":
      return gateDef(s, ctx);
    case "def":
      return subroutineDef(s, ctx);
    case "measure":
      requireNotGateBody(ctx, s.pos, "measure");
      return measure(s.operand, s.target, s.pos, ctx);
    case "reset": {
      requireNotGateBody(ctx, s.pos, "reset");
      const q = resolveQubits(s.operand, ctx);
      spend(ctx, s.pos, q.items.length);
      for (const qubit of q.items) emitIr(ctx, { kind: "reset", qubit, loc: loc(ctx, s.pos) });
      return;
    }
    case "barrier": {
      requireNotGateBody(ctx, s.pos, "barrier");
      spend(ctx, s.pos, 1);
      emitIr(ctx, { kind: "barrier", qubits: qubitUnion(s.operands, ctx), loc: loc(ctx, s.pos) });
      return;
    }
    case "delay": {
      requireNotGateBody(ctx, s.pos, "delay");
      spend(ctx, s.pos, 1);
      emitIr(ctx, { kind: "delay", duration: durationText(s.duration, ctx), qubits: qubitUnion(s.operands, ctx), loc: loc(ctx, s.pos) });
      return;
    }
    case "box": {
      requireNotGateBody(ctx, s.pos, "box");
      const body: IrStmt[] = [];
      block(s.body, { ...ctx, out: body, breakable: false, scope: new Scope("block", ctx.scope) });
      emitIr(ctx, { kind: "box", duration: s.duration ? durationText(s.duration, ctx) : null, body, loc: loc(ctx, s.pos) });
      return;
    }
    case "pragma":
      return pragma(s.text, s.pos, ctx);
    case "annotation":
      requireNotGateBody(ctx, s.pos, "an annotation");
      emitIr(ctx, { kind: "annotation", text: s.text, loc: loc(ctx, s.pos) });
      return;
    case "block":
      return block(s.body, { ...ctx, scope: new Scope("block", ctx.scope) });
    case "for":
      return forLoop(s, ctx);
    case "if":
      return ifStatement(s, ctx);
    case "while":
      return whileLoop(s, ctx);
    case "let":
      return alias(s, ctx);
    case "assign":
      requireNotGateBody(ctx, s.pos, "an assignment");
      return assign(s, ctx);
    case "expr":
      return expressionStatement(s.e, s.pos, ctx);
    case "break":
    case "continue":
      if (!ctx.breakable) {
        if (ctx.runtime) fail(ctx.file, s.pos, `unsupported: '${s.k}' inside a run-time if or while block`);
        fail(ctx.file, s.pos, `'${s.k}' outside a loop`);
      }
      throw new LoopSignal(s.k);
    case "return":
      if (!ctx.inDef) fail(ctx.file, s.pos, "'return' outside a subroutine");
      if (s.value) fail(ctx.file, s.pos, "unsupported: a subroutine that returns a value", "tledger inlines subroutines whose bodies are gates");
      if (ctx.runtime) fail(ctx.file, s.pos, "unsupported: 'return' inside a run-time if or while block");
      throw new ReturnSignal();
    case "end":
      return fail(ctx.file, s.pos, "unsupported: 'end'");
    case "unsupported":
      return fail(ctx.file, s.pos, `unsupported: ${s.what}`, "tledger compiles the gate-level part of OpenQASM 3");
  }
}

function block(body: readonly Stmt[], ctx: Ctx): void {
  for (const s of body) statement(s, ctx);
}

function version(v: string, pos: Pos, ctx: Ctx): void {
  if (ctx.fileState.seen || !ctx.scope.isGlobal) fail(ctx.file, pos, "the OPENQASM version line must be the first statement of the file");
  const major = v.split(".")[0];
  if (major !== "2" && major !== "3") fail(ctx.file, pos, `unsupported OpenQASM version '${v}'`, "tledger reads OpenQASM 3 and OpenQASM 2.0");
  if (major === "2" && ctx.prog.includeStack.length === 1) ctx.prog.qasm2 = true;
}

function pragma(text: string, pos: Pos, ctx: Ctx): void {
  const m = /^tledger\s+canonical\s+(\S+)\s*$/.exec(text);
  if (m || text.startsWith(CANONICAL_PRAGMA)) {
    requireGlobal(ctx, pos, `'pragma ${CANONICAL_PRAGMA}' is allowed`);
    if (!m || gateDefinition(m[1]!) === null) fail(ctx.file, pos, `'pragma ${CANONICAL_PRAGMA}' names no gate tledger defines`);
    ctx.prog.pendingCanonical = { name: m[1]!, file: ctx.file, pos };
    return;
  }
  requireNotGateBody(ctx, pos, "a pragma");
  emitIr(ctx, { kind: "pragma", text, loc: loc(ctx, pos) });
}

// ---------------------------------------------------------------------------------------------
// Includes.

function include(path: string, pos: Pos, ctx: Ctx): void {
  requireGlobal(ctx, pos, "'include' is allowed");
  const lib = includeLibrary(path);
  const prog = ctx.prog;
  if (lib) {
    for (const [name, g] of lib) {
      const existing = prog.global.getOwn(name);
      if (existing) {
        if (existing.kind === "gate" && existing.gate.kind === "library" && existing.gate.lib === g) continue;
        fail(ctx.file, pos, `'${path}' defines '${name}', which is already declared`);
      }
      prog.global.declare(name, { kind: "gate", gate: { kind: "library", lib: g, order: ++prog.gateOrder } });
    }
    return;
  }
  const found = findInclude(path, ctx.file, prog.includeDirs);
  if (found === null) {
    const dirs = ["the including file's folder", ...prog.includeDirs];
    fail(ctx.file, pos, `cannot find include file '${path}'`, `searched ${dirs.join(", ")}; add a folder with -I`);
  }
  const abs = resolvePath(found);
  const at = prog.includeStack.indexOf(abs);
  if (at >= 0) {
    const chain = [...prog.includeStack.slice(at), abs].map((p) => shortName(p)).join(" -> ");
    fail(ctx.file, pos, `include cycle: ${chain}`);
  }
  const src = readSourceFile(found, { file: ctx.file, line: pos.line, col: pos.col });
  prog.includeStack.push(abs);
  try {
    expandFile(src, prog);
  } finally {
    prog.includeStack.pop();
  }
}

function shortName(p: string): string {
  const parts = p.split(/[\\/]/);
  return parts[parts.length - 1] ?? p;
}

// ---------------------------------------------------------------------------------------------
// Declarations.

function qubitDecl(s: Extract<Stmt, { k: "qubit" }>, ctx: Ctx): void {
  requireGlobal(ctx, s.pos, "qubits can be declared");
  const size = s.size ? evalInteger(s.size, ctx, "a register size") : null;
  if (size !== null && size < 1n) fail(ctx.file, s.size!.pos, `a register needs at least one qubit, not ${size}`);
  const n = size === null ? 1 : Number(size);
  const prog = ctx.prog;
  if (size !== null && size > BigInt(MAX_REGISTER - prog.numQubits)) fail(ctx.file, s.size!.pos, `too many qubits (more than ${MAX_REGISTER})`);
  const start = prog.numQubits;
  const qubits = new Array<number>(n);
  for (let i = 0; i < n; i++) qubits[i] = start + i;
  declare(ctx, s.name, s.namePos, { kind: "qubits", qubits, scalar: size === null });
  prog.numQubits += n;
  prog.qubitRegs.push({ name: s.name, start, size: n });
}

function classicalDecl(s: Extract<Stmt, { k: "decl" }>, ctx: Ctx): void {
  const t = s.type;
  if (t.name === "bit") return bitDecl(s, ctx);
  if (t.name === "complex" || t.name === "array" || t.name === "stretch") fail(ctx.file, t.pos, `unsupported: the type '${t.name}'`);
  if (t.size) evalInteger(t.size, ctx, "a type width");
  if (s.mode === "input") return inputDecl(s, ctx);
  if (ctx.template && s.mode !== "const") requireNotGateBody(ctx, s.pos, "a variable declaration");
  let value: Value | null = null;
  if (s.init) {
    const v = s.mode === "const" ? evaluateConstant(s.init, ctx, "a constant's value") : evaluate(s.init, ctx);
    value = castValue(v, t, ctx, s.init.pos, false);
  }
  declare(ctx, s.name, s.namePos, { kind: "value", type: t.name, value, constant: s.mode === "const", input: false, loopVar: false });
}

function inputDecl(s: Extract<Stmt, { k: "decl" }>, ctx: Ctx): void {
  requireGlobal(ctx, s.pos, "'input' declarations are allowed");
  const p = ctx.prog.params.get(s.name);
  let value: Value | null = null;
  if (p) {
    p.used = true;
    const file = `--param ${s.name}`;
    const expr = parseExpressionText({ file, text: p.text });
    const env: EvalEnv = { file, scope: new Scope("global", null) };
    value = castValue(evaluateConstant(expr, env, "a --param value"), s.type, env, expr.pos, false);
  }
  declare(ctx, s.name, s.namePos, { kind: "value", type: s.type.name, value, constant: true, input: true, loopVar: false });
}

function bitDecl(s: Extract<Stmt, { k: "decl" }>, ctx: Ctx): void {
  if (s.mode === "const" || s.mode === "input") fail(ctx.file, s.pos, `unsupported: ${s.mode} bits`);
  requireGlobal(ctx, s.pos, "classical bit registers can be declared");
  const size = s.type.size ? evalInteger(s.type.size, ctx, "a register size") : null;
  if (size !== null && (size < 1n || size > BigInt(MAX_REGISTER))) fail(ctx.file, s.type.size!.pos, `a bit register needs between 1 and ${MAX_REGISTER} bits, not ${size}`);
  const n = size === null ? 1 : Number(size);
  const bits: BitRef[] = [];
  for (let i = 0; i < n; i++) bits.push({ reg: s.name, index: i });
  declare(ctx, s.name, s.namePos, { kind: "bits", bits, scalar: size === null, reg: s.name });
  ctx.prog.bits.push({ name: s.name, size: n, scalar: size === null });
  if (s.init) {
    if (s.init.k === "measure") {
      measure(s.init.operand, { k: "ref", name: s.name, indices: [], pos: s.namePos }, s.init.pos, ctx);
      return;
    }
    const v = evaluateConstant(s.init, ctx, "a bit register's initial value");
    const zero = (isNum(v) && isInteger(v) && v.r.num === 0n) || (v.t === "bits" && !/1/.test(v.text)) || (v.t === "bool" && !v.b);
    if (!zero) fail(ctx.file, s.init.pos, "unsupported: initialising bits to a value other than 0", "set bits by measuring into them");
  }
}

function alias(s: Extract<Stmt, { k: "let" }>, ctx: Ctx): void {
  const ops = s.parts.map((p) => {
    const o = exprAsOperand(p);
    if (!o) fail(ctx.file, p.pos, "'let' aliases a register, a part of one, or a concatenation of them");
    return o;
  });
  const first = ops[0]!;
  const sym = first.k === "ref" ? ctx.scope.lookup(first.name) : undefined;
  if (sym?.kind === "bits") {
    const bits: BitRef[] = [];
    let single = ops.length === 1;
    for (const o of ops) {
      const sel = resolveBits(o, ctx);
      if (ops.length === 1) single = sel.single;
      bits.push(...sel.items);
    }
    const whole = ops.length === 1 && first.k === "ref" && first.indices.length === 0 ? sym.reg : null;
    declare(ctx, s.name, s.namePos, { kind: "bits", bits, scalar: single, reg: whole });
    return;
  }
  const qubits: number[] = [];
  let single = ops.length === 1;
  for (const o of ops) {
    if (o.k === "ref") {
      const sy = ctx.scope.lookup(o.name);
      if (sy?.kind === "bits") fail(ctx.file, o.pos, "an alias cannot mix qubits and bits");
    }
    const sel = resolveQubits(o, ctx);
    if (ops.length === 1) single = sel.single;
    qubits.push(...sel.items);
  }
  declare(ctx, s.name, s.namePos, { kind: "qubits", qubits, scalar: single });
}

// ---------------------------------------------------------------------------------------------
// Gate and subroutine definitions.

function gateDef(s: Extract<Stmt, { k: "gate" }>, ctx: Ctx): void {
  requireGlobal(ctx, s.pos, "gates can be defined");
  const prog = ctx.prog;
  const pc = prog.pendingCanonical;
  const names = [...s.params, ...s.qubits];
  const dup = names.find((n, i) => names.indexOf(n) !== i);
  if (dup) fail(ctx.file, s.namePos, `gate '${s.name}' names '${dup}' twice`);
  if (s.qubits.length === 0) fail(ctx.file, s.namePos, `gate '${s.name}' needs at least one qubit argument`);
  if (pc) {
    prog.pendingCanonical = null;
    const expected = gateDefinition(pc.name);
    if (pc.name !== s.name || expected === null || !sameDefinitionText(expected, s.text)) {
      fail(pc.file, pc.pos, `'pragma ${CANONICAL_PRAGMA} ${pc.name}' must be followed by tledger's own definition of '${pc.name}'`, "remove the pragma to use your own definition");
    }
    declare(ctx, s.name, s.namePos, {
      kind: "gate",
      gate: { kind: "canonical", name: s.name, target: s.name, numParams: s.params.length, numQubits: s.qubits.length, order: ++prog.gateOrder },
    });
    return;
  }
  const gate: UserGate = { kind: "user", name: s.name, params: s.params, qubits: s.qubits, body: s.body, file: ctx.file, order: prog.gateOrder + 1 };
  checkGateBody(s.body, gate, ctx);
  prog.gateOrder++;
  declare(ctx, s.name, s.namePos, { kind: "gate", gate });
}

/** Definition-time checks of a gate body: statement kinds, and that called gates exist with the right parameter count. */
function checkGateBody(body: readonly Stmt[], gate: UserGate, ctx: Ctx): void {
  for (const st of body) {
    switch (st.k) {
      case "call": {
        if (st.name === "gphase") break;
        if (st.name === gate.name) fail(ctx.file, st.namePos, `gate '${gate.name}' cannot call itself`);
        const sym = lookupGate(st.name, st.namePos, { ...ctx, gateOrderLimit: gate.order });
        const shape = gateShape(sym);
        if (st.params.length !== shape.numParams) fail(ctx.file, st.namePos, paramCountMessage(st.name, shape.numParams, st.params.length));
        if (st.modifiers.length === 0 && st.operands.length !== shape.numQubits) {
          fail(ctx.file, st.operands[0]?.pos ?? st.namePos, qubitCountMessage(st.name, shape.numQubits, 0, st.operands.length));
        }
        for (const o of st.operands) {
          if (o.k === "ref" && !gate.qubits.includes(o.name)) {
            const known = ctx.scope.lookup(o.name);
            if (known?.kind === "qubits") fail(ctx.file, o.pos, `gate '${gate.name}' cannot use the global qubit '${o.name}'`, "pass it as a qubit argument of the gate");
          }
        }
        break;
      }
      case "for":
        checkGateBody(st.body, gate, ctx);
        break;
      case "block":
        checkGateBody(st.body, gate, ctx);
        break;
      case "decl":
        if (st.mode !== "const") fail(ctx.file, st.pos, "a gate body can only declare constants");
        break;
      case "let":
        break;
      default:
        fail(ctx.file, st.pos, `${describeStmt(st)} cannot appear in a gate body`, "a gate body holds gate calls, gphase and for loops");
    }
  }
}

function describeStmt(s: Stmt): string {
  switch (s.k) {
    case "measure":
      return "measure";
    case "reset":
      return "reset";
    case "barrier":
      return "barrier";
    case "qubit":
      return "a qubit declaration";
    case "gate":
      return "a gate definition";
    case "def":
      return "a subroutine definition";
    case "if":
      return "an if statement";
    case "while":
      return "a while loop";
    case "include":
      return "include";
    default:
      return "this statement";
  }
}

function subroutineDef(s: Extract<Stmt, { k: "def" }>, ctx: Ctx): void {
  requireGlobal(ctx, s.pos, "subroutines can be defined");
  const names = s.args.map((a) => a.name);
  const dup = names.find((n, i) => names.indexOf(n) !== i);
  if (dup) fail(ctx.file, s.namePos, `subroutine '${s.name}' names '${dup}' twice`);
  for (const a of s.args) if (a.k === "unsupported") fail(ctx.file, a.pos, `unsupported: ${a.what}`);
  const def: Subroutine = { name: s.name, args: s.args, returns: s.returns !== null, body: s.body, file: ctx.file };
  declare(ctx, s.name, s.namePos, { kind: "def", def });
}

// ---------------------------------------------------------------------------------------------
// Gate calls.

interface GateShape {
  readonly numParams: number;
  readonly numQubits: number;
}

function gateShape(g: GateSym): GateShape {
  switch (g.kind) {
    case "user":
      return { numParams: g.params.length, numQubits: g.qubits.length };
    case "canonical":
      return g;
    case "library":
      return g.lib;
  }
}

const GPHASE: GateSym = { kind: "canonical", name: "gphase", target: "gphase", numParams: 1, numQubits: 0, order: 0 };
const CX2: GateSym = { kind: "canonical", name: "CX", target: "cx", numParams: 0, numQubits: 2, order: 0 };

function lookupGate(name: string, pos: Pos, ctx: Ctx): GateSym {
  if (name === "gphase") return GPHASE;
  const sym = ctx.scope.lookup(name);
  if (sym?.kind === "gate" && sym.gate.order < ctx.gateOrderLimit) return sym.gate;
  if (sym?.kind === "gate") fail(ctx.file, pos, `gate '${name}' is not defined before this gate`, "a gate body can only call gates defined before it");
  if (sym?.kind === "def") fail(ctx.file, pos, `'${name}' is a subroutine, not a gate`, `call it as ${name}(arguments);`);
  if (sym) fail(ctx.file, pos, `'${name}' is not a gate`);
  if (name === "CX" && ctx.prog.qasm2) return CX2;
  let hint: string | undefined;
  if (includeLibrary("stdgates.inc")!.has(name)) hint = `add 'include "stdgates.inc";' at the top`;
  else if (includeLibrary("qelib1.inc")!.has(name)) hint = `add 'include "qelib1.inc";' at the top`;
  fail(ctx.file, pos, `unknown gate '${name}'`, hint);
}

const plural = (n: number, w: string): string => `${n} ${w}${n === 1 ? "" : "s"}`;

function paramCountMessage(name: string, want: number, got: number): string {
  return `gate '${name}' takes ${plural(want, "parameter")}, got ${got}`;
}

function qubitCountMessage(name: string, want: number, ctrls: number, got: number): string {
  const extra = ctrls > 0 ? ` plus ${plural(ctrls, "control")}` : "";
  return `gate '${name}' takes ${plural(want, "qubit")}${extra}, got ${got}`;
}

type EvalModifier =
  | { readonly k: "inv" }
  | { readonly k: "pow"; readonly exp: Rational; readonly pos: Pos }
  | { readonly k: "ctrl"; readonly n: number; readonly positive: boolean };

function evalModifier(m: Modifier, ctx: Ctx): EvalModifier {
  switch (m.k) {
    case "inv":
      return { k: "inv" };
    case "pow": {
      const v = evalNumber(m.e, ctx, "a pow() exponent");
      if (v.t !== "rat") fail(ctx.file, m.e.pos, "unsupported: a pow() exponent that is not an exact rational number");
      return { k: "pow", exp: v.r, pos: m.pos };
    }
    case "ctrl":
    case "negctrl": {
      const n = m.n ? evalInteger(m.n, ctx, "a control count") : 1n;
      if (n < 1n || n > 64n) fail(ctx.file, m.n!.pos, `a control count must be between 1 and 64, not ${n}`);
      return { k: "ctrl", n: Number(n), positive: m.k === "ctrl" };
    }
  }
}

function gateCall(s: Extract<Stmt, { k: "call" }>, ctx: Ctx): void {
  const gate = lookupGate(s.name, s.namePos, ctx);
  const shape = gateShape(gate);
  const mods = s.modifiers.length === 0 ? NO_MODS : s.modifiers.map((m) => evalModifier(m, ctx));
  let nCtrl = 0;
  for (const m of mods) if (m.k === "ctrl") nCtrl += m.n;
  if (s.params.length !== shape.numParams) fail(ctx.file, s.namePos, paramCountMessage(s.name, shape.numParams, s.params.length));
  if (s.designator) fail(ctx.file, s.designator.pos, "unsupported: a duration on a gate call");
  const width = nCtrl + shape.numQubits;
  if (s.operands.length !== width) {
    fail(ctx.file, s.operands[0]?.pos ?? s.namePos, qubitCountMessage(s.name, shape.numQubits, nCtrl, s.operands.length));
  }
  // The gate's own expansion over positions nCtrl .. width-1, then the modifiers, innermost first.
  let ops = gateTemplate(gate, s.params, ctx, nCtrl);
  let ctrlEnd = nCtrl;
  for (let i = mods.length - 1; i >= 0; i--) {
    const m = mods[i]!;
    if (m.k === "inv") ops = invertOps(ops);
    else if (m.k === "pow") {
      try {
        ops = powerOps(ops, m.exp, s.name, ctx.prog.maxOps - ctx.prog.work);
      } catch (e) {
        if (e instanceof ModifierError) fail(ctx.file, m.pos, e.message, e.hint);
        throw e;
      }
    } else {
      const controls: number[] = [];
      for (let q = ctrlEnd - m.n; q < ctrlEnd; q++) controls.push(q);
      ctrlEnd -= m.n;
      ops = controlOps(ops, controls, m.positive);
    }
  }
  const sels = s.operands.map((o) => resolveQubits(o, ctx));
  let instances = 1;
  let wide: Selection<number> | null = null;
  for (let i = 0; i < sels.length; i++) {
    const sel = sels[i]!;
    if (sel.single) continue;
    if (wide === null) {
      wide = sel;
      instances = sel.items.length;
    } else if (sel.items.length !== instances) {
      fail(
        ctx.file,
        s.operands[i]!.pos,
        `register sizes differ in a broadcast call: '${wide.name}' has ${plural(wide.items.length, "qubit")}, '${sel.name}' has ${sel.items.length}`,
        "broadcasting applies the gate to registers of the same size, element by element",
      );
    }
  }
  if (ctx.template) {
    // Inside a gate body: keep the raw form (phases included); the outermost call canonicalises.
    for (let k = 0; k < instances; k++) {
      const qs = instanceQubits(sels, k, s, ctx);
      for (const op of ops) ctx.template.push({ ...op, qubits: op.qubits.map((p) => qs[p]!) });
    }
    spend(ctx, s.pos, instances * ops.length);
    return;
  }
  const canonical: TOp[] = [];
  for (const op of ops) canonicalOps(op, canonical);
  spend(ctx, s.pos, instances * canonical.length);
  const out = ctx.out!;
  const l = loc(ctx, s.pos);
  const ctrls = canonical.map((op) => (op.ctrl.length === 0 ? NO_CTRL : internCtrl(op.ctrl)));
  for (let k = 0; k < instances; k++) {
    const qs = instanceQubits(sels, k, s, ctx);
    for (let o = 0; o < canonical.length; o++) {
      const op = canonical[o]!;
      let qubits: number[];
      if (op.qubits.length === 1) qubits = [qs[op.qubits[0]!]!];
      else {
        qubits = new Array<number>(op.qubits.length);
        for (let j = 0; j < qubits.length; j++) qubits[j] = qs[op.qubits[j]!]!;
      }
      const g: GateOp = { kind: "gate", name: op.name, params: op.params, qubits, ctrl: ctrls[o]!, loc: l };
      out.push(g);
    }
  }
}

const NO_MODS: readonly EvalModifier[] = [];
const CTRL_PATTERNS = new Map<string, readonly boolean[]>();

/** One shared array per control pattern (operations keep them; the IR never mutates them). */
function internCtrl(ctrl: readonly boolean[]): readonly boolean[] {
  let key = "";
  for (const c of ctrl) key += c ? "1" : "0";
  let hit = CTRL_PATTERNS.get(key);
  if (!hit) {
    hit = Object.freeze(ctrl.slice());
    CTRL_PATTERNS.set(key, hit);
  }
  return hit;
}
const NO_CTRL: readonly boolean[] = Object.freeze([]) as readonly boolean[];

/** The qubits of broadcast instance k, checked to be distinct. */
function instanceQubits(sels: readonly Selection<number>[], k: number, s: Extract<Stmt, { k: "call" }>, ctx: Ctx): number[] {
  const qs = new Array<number>(sels.length);
  for (let i = 0; i < sels.length; i++) {
    const sel = sels[i]!;
    const q = sel.single ? sel.items[0]! : sel.items[k]!;
    for (let j = 0; j < i; j++) {
      if (qs[j] === q) fail(ctx.file, s.operands[i]!.pos, `qubit ${ctx.qubitLabel(q)} is used twice in one gate call`, "a gate's qubits must all be different");
    }
    qs[i] = q;
  }
  return qs;
}

/** A gate's expansion as operations over positions offset .. offset+numQubits-1. */
function gateTemplate(gate: GateSym, params: readonly Expr[], ctx: Ctx, offset: number): TOp[] {
  const shift = (q: number): number => q + offset;
  switch (gate.kind) {
    case "canonical":
    case "library": {
      const angles: Angle[] = new Array<Angle>(params.length);
      for (let i = 0; i < params.length; i++) angles[i] = evalAngle(params[i]!, ctx);
      const qubits: number[] = [];
      const nq = gate.kind === "canonical" ? gate.numQubits : gate.lib.numQubits;
      for (let i = 0; i < nq; i++) qubits.push(shift(i));
      if (gate.kind === "canonical") return [{ name: gate.target, params: angles, qubits, ctrl: NO_CTRL, phaseOnly: false }];
      const r = gate.lib.resolve(angles);
      const op: TOp = { name: r.name, params: r.params, qubits, ctrl: NO_CTRL, phaseOnly: false };
      if (r.phase) return [{ name: "gphase", params: [r.phase], qubits: [], ctrl: NO_CTRL, phaseOnly: true }, op];
      return [op];
    }
    case "user": {
      const values: NumValue[] = params.map((p) => evalNumber(p, ctx, "a gate parameter"));
      const key = values.map(valueKey).join(",");
      let byParams = ctx.prog.templateCache.get(gate);
      if (!byParams) {
        byParams = new Map();
        ctx.prog.templateCache.set(gate, byParams);
      }
      let body = byParams.get(key);
      if (!body) {
        body = userGateBody(gate, values, ctx);
        if (byParams.size < 1000) byParams.set(key, body);
      }
      return offset === 0 ? body.slice() : body.map((o) => ({ ...o, qubits: o.qubits.map(shift) }));
    }
  }
}

function valueKey(v: NumValue): string {
  switch (v.t) {
    case "rat":
      return `r${v.r.num}/${v.r.den}`;
    case "pi":
      return `p${v.r.num}/${v.r.den}`;
    case "real":
      return `d${v.d.toString()}`;
  }
}

/** Expand a user gate's body with its parameters bound; qubit arguments are positions 0 .. n-1. */
function userGateBody(gate: UserGate, values: readonly NumValue[], ctx: Ctx): TOp[] {
  const scope = new Scope("gate", ctx.prog.global);
  gate.params.forEach((p, i) => scope.declare(p, { kind: "value", type: "angle", value: values[i]!, constant: true, input: false, loopVar: false }));
  gate.qubits.forEach((q, i) => scope.declare(q, { kind: "qubits", qubits: [i], scalar: true }));
  const template: TOp[] = [];
  const inner: Ctx = {
    ...ctx,
    file: gate.file,
    scope,
    out: null,
    template,
    runtime: false,
    breakable: false,
    inDef: false,
    gateOrderLimit: gate.order,
    qubitLabel: (q) => gate.qubits[q] ?? `qubit ${q}`,
  };
  block(gate.body, inner);
  return template;
}

// ---------------------------------------------------------------------------------------------
// Subroutine calls.

function expressionStatement(e: Expr, pos: Pos, ctx: Ctx): void {
  if (e.k === "call") {
    const sym = ctx.scope.lookup(e.name);
    if (sym?.kind === "def") return callSubroutine(sym.def, e, ctx);
    if (sym?.kind === "gate") fail(ctx.file, e.pos, `gate '${e.name}' needs qubits`, `write ${e.name}(...) q;`);
    if (!sym && !isBuiltinName(e.name)) fail(ctx.file, e.pos, `unknown subroutine '${e.name}'`);
  }
  if (e.k === "measure") {
    requireNotGateBody(ctx, pos, "measure");
    return measure(e.operand, null, pos, ctx);
  }
  fail(ctx.file, pos, "this statement has no effect", "assign the value, or remove the statement");
}

function callSubroutine(def: Subroutine, e: Extract<Expr, { k: "call" }>, ctx: Ctx): void {
  requireNotGateBody(ctx, e.pos, "a subroutine call");
  if (e.args.length !== def.args.length) fail(ctx.file, e.pos, `subroutine '${def.name}' takes ${plural(def.args.length, "argument")}, got ${e.args.length}`);
  const prog = ctx.prog;
  if (prog.defStack.includes(def.name)) fail(ctx.file, e.pos, `unsupported: recursive call of subroutine '${def.name}'`);
  const scope = new Scope("def", prog.global);
  def.args.forEach((a, i) => {
    const arg = e.args[i]!;
    switch (a.k) {
      case "classical": {
        const v = castValue(evaluateConstant(arg, ctx, "a subroutine argument"), a.type, ctx, arg.pos, false);
        scope.declare(a.name, { kind: "value", type: a.type.name, value: v, constant: true, input: false, loopVar: false });
        break;
      }
      case "qubit": {
        const o = exprAsOperand(arg);
        if (!o) fail(ctx.file, arg.pos, `argument '${a.name}' of '${def.name}' must be qubits`);
        const sel = resolveQubits(o, ctx);
        const want = a.size ? Number(evalInteger(a.size, { file: def.file, scope: prog.global }, "a register size")) : null;
        if (want === null ? !sel.single : sel.items.length !== want) {
          fail(ctx.file, arg.pos, `argument '${a.name}' of '${def.name}' takes ${want === null ? "one qubit" : plural(want, "qubit")}, got ${sel.items.length}`);
        }
        scope.declare(a.name, { kind: "qubits", qubits: sel.items, scalar: want === null });
        break;
      }
      case "creg": {
        const o = exprAsOperand(arg);
        if (!o) fail(ctx.file, arg.pos, `argument '${a.name}' of '${def.name}' must be bits`);
        const sel = resolveBits(o, ctx);
        scope.declare(a.name, { kind: "bits", bits: sel.items, scalar: sel.single, reg: sel.reg });
        break;
      }
      case "unsupported":
        fail(def.file, a.pos, `unsupported: ${a.what}`);
    }
  });
  const inner: Ctx = {
    ...ctx,
    file: def.file,
    scope,
    breakable: false,
    inDef: true,
    callLoc: ctx.callLoc ?? loc(ctx, e.pos),
  };
  prog.defStack.push(def.name);
  try {
    block(def.body, inner);
  } catch (sig) {
    if (!(sig instanceof ReturnSignal)) throw sig;
  } finally {
    prog.defStack.pop();
  }
}

// ---------------------------------------------------------------------------------------------
// Measurement, qubit lists, durations.

function measure(operand: Operand, target: Operand | null, pos: Pos, ctx: Ctx): void {
  const q = resolveQubits(operand, ctx);
  spend(ctx, pos, q.items.length);
  if (!target) {
    for (const qubit of q.items) emitIr(ctx, { kind: "measure", qubit, bit: null, loc: loc(ctx, pos) });
    return;
  }
  const b = resolveBits(target, ctx);
  if (q.items.length !== b.items.length || (q.single !== b.single && q.items.length !== 1)) {
    fail(ctx.file, target.pos, `measure: ${plural(q.items.length, "qubit")} into ${plural(b.items.length, "bit")}`, "measure as many qubits as there are bits");
  }
  for (let i = 0; i < q.items.length; i++) emitIr(ctx, { kind: "measure", qubit: q.items[i]!, bit: b.items[i]!, loc: loc(ctx, pos) });
}

/** The qubits of a barrier or delay (all qubits when none are named), without repeats. */
function qubitUnion(operands: readonly Operand[], ctx: Ctx): number[] {
  if (operands.length === 0) {
    const all: number[] = [];
    for (let q = 0; q < ctx.prog.numQubits; q++) all.push(q);
    return all;
  }
  const seen = new Set<number>();
  const out: number[] = [];
  for (const o of operands) {
    for (const q of resolveQubits(o, ctx).items) {
      if (!seen.has(q)) {
        seen.add(q);
        out.push(q);
      }
    }
  }
  return out;
}

function durationText(e: Expr, ctx: Ctx): string {
  const v = evaluateConstant(e, ctx, "a duration");
  if (v.t !== "dur") fail(ctx.file, e.pos, "expected a duration such as 100ns");
  return v.text;
}

// ---------------------------------------------------------------------------------------------
// Classical assignment.

function assign(s: Extract<Stmt, { k: "assign" }>, ctx: Ctx): void {
  const t = s.target;
  if (t.k === "hw") fail(ctx.file, t.pos, "cannot assign to a qubit");
  const sym = ctx.scope.lookup(t.name);
  if (!sym) fail(ctx.file, t.pos, `unknown name '${t.name}'`);
  if (sym.kind === "bits") {
    if (s.value.k === "measure" && s.op === "=") return measure(s.value.operand, t, s.pos, ctx);
    fail(ctx.file, s.pos, "unsupported: assigning a value to classical bits", "set bits by measuring into them");
  }
  if (sym.kind !== "value") fail(ctx.file, t.pos, `cannot assign to '${t.name}'`);
  if (sym.loopVar) fail(ctx.file, t.pos, `cannot assign to the loop variable '${t.name}'`);
  if (sym.constant) fail(ctx.file, t.pos, `cannot assign to ${sym.input ? "input" : "constant"} '${t.name}'`);
  if (t.indices.length > 0) fail(ctx.file, t.pos, "unsupported: assigning to part of a classical variable");
  if (ctx.runtime) fail(ctx.file, s.pos, `unsupported: assigning to '${t.name}' inside a run-time if or while block`, "tledger keeps classical variables as compile-time values");
  if (s.value.k === "measure") fail(ctx.file, s.value.pos, `unsupported: assigning a measurement to '${t.name}'`);
  let v = evaluate(s.value, ctx);
  if (s.op !== "=") {
    const old = sym.value;
    if (old === null) fail(ctx.file, t.pos, `'${t.name}' has no value here`);
    const op = s.op.slice(0, -1);
    v = evaluate({ k: "binary", op, l: { k: "ident", name: t.name, pos: t.pos }, r: s.value, pos: s.pos }, ctx);
  }
  const type: TypeSpec = { name: sym.type, size: null, pos: t.pos };
  sym.value = castValue(v, type, ctx, s.value.pos, false);
}

// ---------------------------------------------------------------------------------------------
// Control flow.

function forLoop(s: Extract<Stmt, { k: "for" }>, ctx: Ctx): void {
  const each = (bind: (scope: Scope) => void, pos: Pos): boolean => {
    spend(ctx, pos, 1);
    const scope = new Scope("block", ctx.scope);
    bind(scope);
    try {
      block(s.body, { ...ctx, scope, breakable: true });
    } catch (sig) {
      if (sig instanceof LoopSignal) return sig.kind === "continue";
      throw sig;
    }
    return true;
  };
  const bindValue = (v: Value) => (scope: Scope) => {
    const typed = s.varType ? castValue(v, s.varType, ctx, s.namePos, false) : v;
    if (isBuiltinName(s.name)) fail(ctx.file, s.namePos, `'${s.name}' is a built-in name and cannot be declared`);
    scope.declare(s.name, { kind: "value", type: s.varType?.name ?? "int", value: typed, constant: true, input: false, loopVar: true });
  };
  const set = s.set;
  if (set.k === "range") {
    const r = set.range;
    if (!r.start || !r.end) fail(ctx.file, r.pos, "a loop range needs a start and an end");
    const a = evalInteger(r.start, ctx, "a for-loop bound");
    const step = r.step ? evalInteger(r.step, ctx, "a for-loop step") : 1n;
    const b = evalInteger(r.end, ctx, "a for-loop bound");
    if (step === 0n) fail(ctx.file, r.step!.pos, "a loop step cannot be zero");
    for (let i = a; step > 0n ? i <= b : i >= b; i += step) {
      if (!each(bindValue({ t: "rat", r: { num: i, den: 1n } }), s.pos)) break;
    }
    return;
  }
  if (set.k === "set") {
    const values = set.items.map((e) => evaluateConstant(e, ctx, "a for-loop set element"));
    for (const v of values) if (!each(bindValue(v), s.pos)) break;
    return;
  }
  const o = exprAsOperand(set.e);
  const sym = o && o.k === "ref" ? ctx.scope.lookup(o.name) : undefined;
  if (o && sym?.kind === "qubits") {
    const sel = resolveQubits(o, ctx);
    for (const q of sel.items) {
      if (!each((scope) => scope.declare(s.name, { kind: "qubits", qubits: [q], scalar: true }), s.pos)) break;
    }
    return;
  }
  if (o && sym?.kind === "bits") {
    const sel = resolveBits(o, ctx);
    for (const b of sel.items) {
      if (!each((scope) => scope.declare(s.name, { kind: "bits", bits: [b], scalar: true, reg: null }), s.pos)) break;
    }
    return;
  }
  evaluateConstant(set.e, ctx, "a for-loop set");
  fail(ctx.file, set.e.pos, "unsupported: a for loop over this value", "loop over a range [a:b], a set {a, b}, or a register");
}

function bitLookup(ctx: Ctx): BitLookup {
  return (e) => {
    const o = exprAsOperand(e);
    if (!o || o.k !== "ref") return null;
    const sym = ctx.scope.lookup(o.name);
    if (sym?.kind !== "bits") return null;
    const sel = resolveBits(o, ctx);
    return { bits: sel.items, reg: sel.reg, single: sel.single };
  };
}

function ifStatement(s: Extract<Stmt, { k: "if" }>, ctx: Ctx): void {
  const cond = toCondition(s.cond, ctx, bitLookup(ctx));
  if (cond.k === "bool" || cond.k === "int") {
    const taken = cond.k === "bool" ? cond.value : cond.value !== 0n;
    const body = taken ? s.then : s.else;
    if (body) block(body, { ...ctx, scope: new Scope("block", ctx.scope) });
    return;
  }
  requireNotGateBody(ctx, s.pos, "an if statement on run-time bits");
  const thenOut: IrStmt[] = [];
  const elseOut: IrStmt[] = [];
  block(s.then, { ...ctx, out: thenOut, runtime: true, breakable: false, scope: new Scope("block", ctx.scope) });
  if (s.else) block(s.else, { ...ctx, out: elseOut, runtime: true, breakable: false, scope: new Scope("block", ctx.scope) });
  spend(ctx, s.pos, 1);
  emitIr(ctx, { kind: "if", cond, then: thenOut, else: elseOut, loc: loc(ctx, s.pos) });
}

function whileLoop(s: Extract<Stmt, { k: "while" }>, ctx: Ctx): void {
  const cond = toCondition(s.cond, ctx, bitLookup(ctx));
  if ((cond.k === "bool" && !cond.value) || (cond.k === "int" && cond.value === 0n)) return;
  requireNotGateBody(ctx, s.pos, "a while loop");
  const body: IrStmt[] = [];
  block(s.body, { ...ctx, out: body, runtime: true, breakable: false, scope: new Scope("block", ctx.scope) });
  spend(ctx, s.pos, 1);
  emitIr(ctx, { kind: "while", cond, body, loc: loc(ctx, s.pos) });
}

