// Compile-time evaluation of classical expressions against a scope, gate parameters as IR angles (cached by text), and run-time conditions as IR condition trees.
import type { Angle } from "../ir/angle.js";
import type { BitRef, CondExpr } from "../ir/circuit.js";
import type { Expr, Pos, TypeSpec } from "./ast.js";
import { DiagnosticError } from "./diagnostics.js";
import type { Scope } from "./scope.js";
import {
  add,
  builtinConstant,
  callFunction,
  compare,
  div,
  FUNCTIONS,
  isInteger,
  isNum,
  mod,
  mul,
  neg,
  parseNumberLiteral,
  pow,
  ratValue,
  sub,
  toAngle,
  truncInt,
  ValueError,
  type NumValue,
  type Value,
} from "./values.js";

/** Where an expression is evaluated: its file (for diagnostics) and scope. */
export interface EvalEnv {
  readonly file: string;
  readonly scope: Scope;
}

export function fail(file: string, pos: Pos, message: string, hint?: string): never {
  throw new DiagnosticError([{ severity: "error", file, line: pos.line, col: pos.col, message, ...(hint ? { hint } : {}) }]);
}

/** Names that cannot be declared: the built-in constants and functions. */
export function isBuiltinName(name: string): boolean {
  return builtinConstant(name) !== null || FUNCTIONS.has(name);
}

const numberCache = new Map<string, NumValue>();

function literalValue(text: string, env: EvalEnv, pos: Pos): NumValue {
  const hit = numberCache.get(text);
  if (hit) return hit;
  let v: NumValue;
  try {
    v = { t: "rat", r: parseNumberLiteral(text) };
  } catch (e) {
    if (e instanceof ValueError) fail(env.file, pos, e.message);
    throw e;
  }
  if (numberCache.size > 100_000) numberCache.clear();
  numberCache.set(text, v);
  return v;
}

/** A symbol's compile-time value, or a diagnostic saying why there is none. */
function identValue(name: string, env: EvalEnv, pos: Pos): Value {
  const c = builtinConstant(name);
  if (c) return c;
  const sym = env.scope.lookup(name);
  if (!sym) fail(env.file, pos, `unknown name '${name}'`);
  switch (sym.kind) {
    case "value":
      if (sym.value === null) {
        if (sym.input) fail(env.file, pos, `input '${name}' has no value`, `bind it on the command line: --param ${name}=VALUE`);
        fail(env.file, pos, `'${name}' has no value here`, "give the variable a value where it is declared");
      }
      return sym.value;
    case "qubits":
      fail(env.file, pos, `'${name}' is a qubit${sym.scalar ? "" : " register"}, not a classical value`);
    case "bits":
      fail(env.file, pos, `'${name}' is only known at run time, not at compile time`, "classical bits get their values from measurements");
    case "gate":
      fail(env.file, pos, `'${name}' is a gate, not a value`);
    case "def":
      fail(env.file, pos, `'${name}' is a subroutine, not a value`);
  }
}

function num(v: Value, env: EvalEnv, pos: Pos, what = "a number"): NumValue {
  if (isNum(v)) return v;
  if (v.t === "bool") return ratValue(v.b ? 1n : 0n);
  if (v.t === "bits") return ratValue(BigInt("0b" + (v.text.replace(/_/g, "") || "0")));
  fail(env.file, pos, `expected ${what}, found a duration`);
}

function bool(v: Value, env: EvalEnv, pos: Pos): boolean {
  if (v.t === "bool") return v.b;
  if (isNum(v)) return compare(v, ratValue(0n)) !== 0;
  if (v.t === "bits") return /1/.test(v.text);
  fail(env.file, pos, "expected a boolean, found a duration");
}

function int(v: Value, env: EvalEnv, pos: Pos): bigint {
  const n = num(v, env, pos, "an integer");
  if (!isInteger(n)) fail(env.file, pos, "expected an integer");
  return n.r.num;
}

/** Evaluate an expression at compile time. */
export function evaluate(e: Expr, env: EvalEnv): Value {
  try {
    return evalInner(e, env);
  } catch (err) {
    if (err instanceof ValueError) fail(env.file, e.pos, err.message, err.hint);
    throw err;
  }
}

function at<T>(env: EvalEnv, pos: Pos, f: () => T): T {
  try {
    return f();
  } catch (err) {
    if (err instanceof ValueError) fail(env.file, pos, err.message, err.hint);
    throw err;
  }
}

function evalInner(e: Expr, env: EvalEnv): Value {
  switch (e.k) {
    case "num":
      return literalValue(e.text, env, e.pos);
    case "ident":
      return identValue(e.name, env, e.pos);
    case "bool":
      return { t: "bool", b: e.value };
    case "bits":
      return { t: "bits", text: e.text };
    case "timing":
      return { t: "dur", text: e.text };
    case "unary": {
      const v = evalInner(e.e, env);
      switch (e.op) {
        case "-":
          return neg(num(v, env, e.pos));
        case "+":
          return num(v, env, e.pos);
        case "!":
          return { t: "bool", b: !bool(v, env, e.pos) };
        case "~":
          return ratValue(~int(v, env, e.pos));
      }
      return fail(env.file, e.pos, `unsupported operator '${e.op}'`);
    }
    case "binary":
      return binary(e.op, evalInner(e.l, env), evalInner(e.r, env), env, e.pos);
    case "call": {
      if (!FUNCTIONS.has(e.name)) {
        const sym = env.scope.lookup(e.name);
        if (sym?.kind === "def") fail(env.file, e.pos, `unsupported: a subroutine call inside an expression ('${e.name}')`, "call subroutines as statements of their own");
        fail(env.file, e.pos, `unknown function '${e.name}'`, "the functions are sin, cos, tan, arcsin, arccos, arctan, exp, ln, sqrt, floor, ceiling, abs, mod");
      }
      const args = e.args.map((a) => num(evalInner(a, env), env, a.pos));
      return at(env, e.pos, () => callFunction(e.name, args));
    }
    case "cast":
      return castValue(evalInner(e.e, env), e.type, env, e.pos, true);
    case "index":
      return fail(env.file, e.pos, "unsupported: indexing a classical value at compile time");
    case "measure":
      return fail(env.file, e.pos, "a measurement is only known at run time, not at compile time");
    case "unsupported":
      return fail(env.file, e.pos, `unsupported: ${e.what}`);
  }
}

function binary(op: string, a: Value, b: Value, env: EvalEnv, pos: Pos): Value {
  return at(env, pos, (): Value => {
    switch (op) {
      case "+":
        return add(num(a, env, pos), num(b, env, pos));
      case "-":
        return sub(num(a, env, pos), num(b, env, pos));
      case "*":
        return mul(num(a, env, pos), num(b, env, pos));
      case "/":
        return div(num(a, env, pos), num(b, env, pos));
      case "%":
        return mod(num(a, env, pos), num(b, env, pos));
      case "**":
        return pow(num(a, env, pos), num(b, env, pos));
      case "==":
      case "!=": {
        let eq: boolean;
        if (a.t === "bool" || b.t === "bool") eq = bool(a, env, pos) === bool(b, env, pos);
        else if (a.t === "dur" || b.t === "dur") eq = a.t === "dur" && b.t === "dur" && a.text === b.text;
        else eq = compare(num(a, env, pos), num(b, env, pos)) === 0;
        return { t: "bool", b: op === "==" ? eq : !eq };
      }
      case "<":
        return { t: "bool", b: compare(num(a, env, pos), num(b, env, pos)) < 0 };
      case ">":
        return { t: "bool", b: compare(num(a, env, pos), num(b, env, pos)) > 0 };
      case "<=":
        return { t: "bool", b: compare(num(a, env, pos), num(b, env, pos)) <= 0 };
      case ">=":
        return { t: "bool", b: compare(num(a, env, pos), num(b, env, pos)) >= 0 };
      case "&&":
        return { t: "bool", b: bool(a, env, pos) && bool(b, env, pos) };
      case "||":
        return { t: "bool", b: bool(a, env, pos) || bool(b, env, pos) };
      case "&":
        return ratValue(int(a, env, pos) & int(b, env, pos));
      case "|":
        return ratValue(int(a, env, pos) | int(b, env, pos));
      case "^":
        return ratValue(int(a, env, pos) ^ int(b, env, pos));
      case "<<":
      case ">>": {
        const x = int(a, env, pos);
        const s = int(b, env, pos);
        if (s < 0n || s > 4096n) fail(env.file, pos, `shift amount ${s} is out of range`);
        return ratValue(op === "<<" ? x << s : x >> s);
      }
    }
    return fail(env.file, pos, `unsupported operator '${op}'`);
  });
}

/**
 * Convert a value to a declared type. int/uint need an integer value (an explicit cast truncates);
 * float and angle keep the exact value (designator widths are not modelled); bool from any number.
 */
export function castValue(v: Value, type: TypeSpec, env: EvalEnv, pos: Pos, explicit: boolean): Value {
  switch (type.name) {
    case "int":
    case "uint": {
      const n = num(v, env, pos);
      if (!isInteger(n)) {
        if (!explicit) fail(env.file, pos, `expected an integer for a${type.name === "int" ? "n int" : " uint"}, found a non-integer value`, `write ${type.name}(...) to truncate`);
        const t = at(env, pos, () => truncInt(n));
        if (type.name === "uint" && t < 0n) fail(env.file, pos, "a uint cannot be negative");
        return ratValue(t);
      }
      if (type.name === "uint" && n.r.num < 0n) fail(env.file, pos, "a uint cannot be negative");
      return n;
    }
    case "float":
    case "angle":
      return num(v, env, pos);
    case "bool":
      return { t: "bool", b: bool(v, env, pos) };
    case "bit": {
      if (v.t === "bits") return v;
      return ratValue(bool(v, env, pos) ? 1n : 0n);
    }
    case "duration":
    case "stretch":
      if (v.t === "dur") return v;
      return fail(env.file, pos, "expected a duration");
    default:
      return fail(env.file, pos, `unsupported: the type '${type.name}'`);
  }
}

/** A compile-time integer (index, size, loop bound, control count), with `what` naming it in diagnostics. */
export function evalInteger(e: Expr, env: EvalEnv, what: string): bigint {
  // Plain decimal literals (the common case for indices) skip the general machinery.
  if (e.k === "num") {
    const t = e.text;
    if (t.length < 10) {
      let n = 0;
      let ok = true;
      for (let i = 0; i < t.length; i++) {
        const c = t.charCodeAt(i) - 48;
        if (c < 0 || c > 9) {
          ok = false;
          break;
        }
        n = n * 10 + c;
      }
      if (ok) return BigInt(n);
    }
  }
  const v = evaluateConstant(e, env, what);
  if (!isNum(v) || !isInteger(v)) fail(env.file, e.pos, `${what} must be an integer`);
  return v.r.num;
}

/** Evaluate where a compile-time constant is required; `what` names the place in the diagnostic. */
export function evaluateConstant(e: Expr, env: EvalEnv, what: string): Value {
  try {
    return evaluate(e, env);
  } catch (err) {
    if (err instanceof DiagnosticError) {
      const d = err.diagnostics[0];
      if (d && /only known at run time/.test(d.message)) {
        throw new DiagnosticError([{ ...d, message: `${what} must be a compile-time constant: ${d.message}` }]);
      }
    }
    throw err;
  }
}

// ---------------------------------------------------------------------------------------------
// Gate parameters: angles, cached by expression text when the text alone fixes the value.

const angleByKey = new Map<string, Angle>();

/** A text key for an expression whose value depends on nothing but its text (literals, pi/tau/euler, functions); else null. */
function constKey(e: Expr): string | null {
  switch (e.k) {
    case "num":
      return e.text;
    case "ident":
      return builtinConstant(e.name) ? e.name : null;
    case "unary": {
      const k = constKey(e.e);
      return k === null ? null : e.op + k;
    }
    case "binary": {
      const l = constKey(e.l);
      if (l === null) return null;
      const r = constKey(e.r);
      return r === null ? null : `(${l}${e.op}${r})`;
    }
    case "call": {
      if (!FUNCTIONS.has(e.name)) return null;
      const parts: string[] = [];
      for (const a of e.args) {
        const k = constKey(a);
        if (k === null) return null;
        parts.push(k);
      }
      return `${e.name}(${parts.join(",")})`;
    }
    default:
      return null;
  }
}

/** A gate parameter as an IR angle. */
export function evalAngle(e: Expr, env: EvalEnv): Angle {
  const key = constKey(e);
  if (key !== null) {
    const hit = angleByKey.get(key);
    if (hit) return hit;
  }
  const a = toAngle(evalNumber(e, env, "a gate parameter"));
  if (key !== null) {
    if (angleByKey.size > 100_000) angleByKey.clear();
    angleByKey.set(key, a);
  }
  return a;
}

/** A numeric compile-time value (gate parameters, pow exponents). */
export function evalNumber(e: Expr, env: EvalEnv, what: string): NumValue {
  const v = evaluateConstant(e, env, what);
  if (!isNum(v)) {
    if (v.t === "bool") fail(env.file, e.pos, `${what} must be a number, found a boolean`);
    if (v.t === "dur") fail(env.file, e.pos, `${what} must be a number, found a duration`);
    return num(v, env, e.pos);
  }
  return v;
}

// ---------------------------------------------------------------------------------------------
// Run-time conditions.

/** Resolves a bit operand (`c`, `c[2]`, an alias) for conditions; null when the name is not a bit symbol. */
export type BitLookup = (e: Expr) => { readonly bits: readonly BitRef[]; readonly reg: string | null; readonly single: boolean } | null;

const COND_BINARY = new Set(["==", "!=", "<", ">", "<=", ">=", "&&", "||", "&", "|", "^", "<<", ">>", "+", "-", "*", "/", "%", "**"]);

/**
 * A condition as the IR keeps it: classical bits and registers stay symbolic, everything else is
 * folded to an integer or boolean constant.
 */
export function toCondition(e: Expr, env: EvalEnv, bits: BitLookup): CondExpr {
  return cond(e, env, bits);
}

function isConst(c: CondExpr): c is Extract<CondExpr, { k: "int" | "bool" }> {
  return c.k === "int" || c.k === "bool";
}

function constToValue(c: Extract<CondExpr, { k: "int" | "bool" }>): Value {
  return c.k === "int" ? ratValue(c.value) : { t: "bool", b: c.value };
}

function valueToCond(v: Value, env: EvalEnv, pos: Pos): CondExpr {
  if (v.t === "bool") return { k: "bool", value: v.b };
  if (isNum(v) && isInteger(v)) return { k: "int", value: v.r.num };
  if (v.t === "bits") return { k: "int", value: BigInt("0b" + (v.text.replace(/_/g, "") || "0")) };
  return fail(env.file, pos, "a condition can only compare bits with integers or booleans");
}

function cond(e: Expr, env: EvalEnv, bits: BitLookup): CondExpr {
  if (e.k === "ident" || e.k === "index") {
    const b = bits(e);
    if (b) {
      if (b.single) return { k: "bit", bit: b.bits[0]! };
      if (b.reg !== null) return { k: "reg", reg: b.reg };
      return fail(env.file, e.pos, "unsupported: a condition on part of a register", "compare single bits, or the whole register");
    }
  }
  if (e.k === "unary" && (e.op === "!" || e.op === "~" || e.op === "-")) {
    const inner = cond(e.e, env, bits);
    if (isConst(inner)) return valueToCond(evaluateUnary(e.op, inner, env, e.pos), env, e.pos);
    return { k: "unary", op: e.op, e: inner };
  }
  if (e.k === "binary" && COND_BINARY.has(e.op)) {
    const l = cond(e.l, env, bits);
    const r = cond(e.r, env, bits);
    if (isConst(l) && isConst(r)) return valueToCond(binary(e.op, constToValue(l), constToValue(r), env, e.pos), env, e.pos);
    return { k: "binary", op: e.op, l, r };
  }
  if (e.k === "measure") return fail(env.file, e.pos, "unsupported: a measurement inside a condition", "measure into a bit first, then test the bit");
  return valueToCond(evaluate(e, env), env, e.pos);
}

function evaluateUnary(op: string, c: Extract<CondExpr, { k: "int" | "bool" }>, env: EvalEnv, pos: Pos): Value {
  const v = constToValue(c);
  if (op === "!") return { t: "bool", b: !bool(v, env, pos) };
  if (op === "~") return ratValue(~int(v, env, pos));
  return neg(num(v, env, pos));
}

