// Qubit and bit operands: registers, aliases, indices, slices, index sets and concatenation, resolved to qubit numbers and bit references.
import type { BitRef } from "../ir/circuit.js";
import type { Expr, IndexOp, Operand, Pos, RangeExpr } from "./ast.js";
import { evalInteger, fail, type EvalEnv } from "./evaluate.js";

/** A resolved operand: the elements it names, and whether it names exactly one (indexed or scalar). */
export interface Selection<T> {
  readonly items: readonly T[];
  readonly single: boolean;
  /** The register or alias name, for diagnostics. */
  readonly name: string;
}

/** Largest register or selection the front end accepts. */
export const MAX_REGISTER = 1 << 20;

/** Indices into a list of `size` elements selected by one bracket. */
function selectIndices(ix: IndexOp, size: number, name: string, env: EvalEnv, noun: string): { idx: number[]; single: boolean } {
  if (ix.k === "set") {
    return { idx: ix.items.map((e) => normIndex(evalInteger(e, env, "an index"), size, name, env, e.pos, noun)), single: false };
  }
  if (ix.items.length !== 1) fail(env.file, ix.pos, "unsupported: multi-dimensional indexing");
  const item = ix.items[0]!;
  if (item.k === "range") return { idx: rangeIndices(item, size, name, env, noun), single: false };
  return { idx: [normIndex(evalInteger(item, env, "an index"), size, name, env, item.pos, noun)], single: true };
}

function normIndex(i: bigint, size: number, name: string, env: EvalEnv, pos: Pos, noun: string): number {
  const j = i < 0n ? i + BigInt(size) : i;
  if (j < 0n || j >= BigInt(size)) {
    fail(env.file, pos, `index ${i} is out of range for '${name}' (${size} ${noun}${size === 1 ? "" : "s"})`);
  }
  return Number(j);
}

/** The indices of a range `[a:b]` / `[a:s:b]` (end included) over a register of `size` elements. */
function rangeIndices(r: RangeExpr, size: number, name: string, env: EvalEnv, noun: string): number[] {
  const step = r.step ? evalInteger(r.step, env, "a range step") : 1n;
  if (step === 0n) fail(env.file, r.step!.pos, "a range step cannot be zero");
  const first = r.start ? evalInteger(r.start, env, "a range start") : step > 0n ? 0n : BigInt(size - 1);
  const last = r.end ? evalInteger(r.end, env, "a range end") : step > 0n ? BigInt(size - 1) : 0n;
  const a = normIndex(first, size, name, env, r.start?.pos ?? r.pos, noun);
  const b = normIndex(last, size, name, env, r.end?.pos ?? r.pos, noun);
  const out: number[] = [];
  const s = Number(step);
  for (let i = a; s > 0 ? i <= b : i >= b; i += s) out.push(i);
  if (out.length === 0) fail(env.file, r.pos, `the range selects no element of '${name}'`);
  return out;
}

/** Apply the brackets of an operand to a base list. */
function applyIndices<T>(base: readonly T[], scalar: boolean, indices: readonly IndexOp[], name: string, env: EvalEnv, noun: string): Selection<T> {
  let items = base;
  let single = scalar;
  for (const ix of indices) {
    if (single) fail(env.file, ix.pos, `'${name}' is a single ${noun} and cannot be indexed`);
    const sel = selectIndices(ix, items.length, name, env, noun);
    const from = items;
    items = sel.idx.map((i) => from[i]!);
    single = sel.single;
  }
  return { items, single, name };
}

/** The qubits an operand names. */
export function resolveQubits(op: Operand, env: EvalEnv): Selection<number> {
  if (op.k === "hw") fail(env.file, op.pos, `unsupported: hardware qubit '${op.text}'`, "declare a register with 'qubit[n] q;' and use q[i]");
  const sym = env.scope.lookup(op.name);
  if (!sym) fail(env.file, op.pos, `unknown qubit register '${op.name}'`);
  if (sym.kind !== "qubits") fail(env.file, op.pos, `'${op.name}' is not a qubit register`);
  return applyIndices(sym.qubits, sym.scalar, op.indices, op.name, env, "qubit");
}

/** The bits an operand names, with the register's name when the operand is a whole register. */
export function resolveBits(op: Operand, env: EvalEnv): Selection<BitRef> & { readonly reg: string | null } {
  if (op.k === "hw") fail(env.file, op.pos, `'${op.text}' is a qubit, not a classical bit`);
  const sym = env.scope.lookup(op.name);
  if (!sym) fail(env.file, op.pos, `unknown classical register '${op.name}'`);
  if (sym.kind !== "bits") fail(env.file, op.pos, `'${op.name}' is not a classical bit register`);
  const sel = applyIndices(sym.bits, sym.scalar, op.indices, op.name, env, "bit");
  return { ...sel, reg: op.indices.length === 0 ? sym.reg : null };
}

/** An expression used as an operand (`let` parts, loop sets, conditions): an identifier with brackets, or null. */
export function exprAsOperand(e: Expr): Operand | null {
  const indices: IndexOp[] = [];
  let cur: Expr = e;
  while (cur.k === "index") {
    indices.unshift(cur.index);
    cur = cur.e;
  }
  if (cur.k !== "ident") return null;
  return { k: "ref", name: cur.name, indices, pos: cur.pos };
}
