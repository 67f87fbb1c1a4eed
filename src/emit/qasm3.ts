// The OpenQASM 3 writer: the IR as program text that reads back (through the front end) to the same IR.
import type { Angle } from "../ir/angle.js";
import type { BitRef, Circuit, ClassicalReg, CondExpr, Stmt } from "../ir/circuit.js";
import { gateInfo } from "../ir/gates.js";
import { includeLibrary } from "../frontend/libraries.js";
import { CANONICAL_PRAGMA, gateDefinition } from "./gate-definitions.js";

export interface WriteOptions {
  /**
   * Called for every statement, nested ones included; a returned text is written as `//` comment
   * lines just before the statement (the ledger uses this).
   */
  readonly commentBefore?: (stmt: Stmt) => string | undefined;
  /** Declare one register `qubit[N] q;` instead of the circuit's own registers (qubitRegs). */
  readonly flatQubits?: boolean;
  /** Comment lines written after the OPENQASM line (e.g. what produced the file). */
  readonly header?: string;
}

const STD = includeLibrary("stdgates.inc")!;

/**
 * How a canonical gate is spelled: its own name when stdgates.inc (or the language) has it as such,
 * `p` for u1 (stdgates.inc's u1 is p: same matrix), else its own name with a definition from
 * src/emit/gate-definitions.ts written ahead of use.
 */
function spelling(name: string): { readonly name: string; readonly definition: string | null } {
  if (name === "U" || name === "gphase") return { name, definition: null };
  if (!gateInfo(name)) throw new RangeError(`writeQasm3: '${name}' is not a canonical gate`);
  const std = STD.get(name);
  if (std && std.resolve(new Array(std.numParams).fill({ pi: { num: 0n, den: 1n }, value: "0" })).name === name) return { name, definition: null };
  const def = gateDefinition(name);
  if (def !== null) return { name, definition: def };
  if (name === "u1") return { name: "p", definition: null };
  throw new RangeError(`writeQasm3: no way to write gate '${name}'`);
}

/** An angle as an expression that reads back to exactly the same angle. */
export function formatAngle(a: Angle): string {
  if (a.pi) {
    const { num, den } = a.pi;
    if (num === 0n) return "0";
    const sign = num < 0n ? "-" : "";
    const n = num < 0n ? -num : num;
    const head = n === 1n ? `${sign}pi` : `${sign}${n}*pi`;
    return den === 1n ? head : `${head}/${den}`;
  }
  return a.value;
}

/** Register names and how each qubit and bit reads. */
interface Names {
  readonly qubit: readonly string[];
  readonly qubitDecls: readonly string[];
  /** The operand list naming every qubit in order (for barrier/delay on all qubits). */
  readonly allQubits: string;
  readonly bits: ReadonlyMap<string, ClassicalReg>;
}

function freshName(base: string, taken: ReadonlySet<string>): string {
  if (!taken.has(base)) return base;
  for (let i = 1; ; i++) if (!taken.has(`${base}${i}`)) return `${base}${i}`;
}

function names(c: Circuit, flat: boolean, usedGates: ReadonlySet<string>): Names {
  const taken = new Set<string>([...c.bits.map((b) => b.name), ...usedGates, ...STD.keys(), "U", "pi", "tau", "euler"]);
  const qubit = new Array<string>(c.numQubits);
  const decls: string[] = [];
  const regs: string[] = [];
  let covered = 0;
  const contiguous = !flat && c.qubitRegs.every((r) => {
    const ok = r.start === covered && r.size > 0;
    covered += r.size;
    return ok;
  }) && covered <= c.numQubits;
  if (contiguous) {
    for (const r of c.qubitRegs) {
      decls.push(`qubit[${r.size}] ${r.name};`);
      regs.push(r.name);
      taken.add(r.name);
      for (let i = 0; i < r.size; i++) qubit[r.start + i] = `${r.name}[${i}]`;
    }
    if (covered < c.numQubits) {
      const extra = freshName("anc", taken);
      decls.push(`qubit[${c.numQubits - covered}] ${extra};`);
      regs.push(extra);
      for (let i = covered; i < c.numQubits; i++) qubit[i] = `${extra}[${i - covered}]`;
    }
  } else if (c.numQubits > 0) {
    const q = freshName("q", taken);
    decls.push(`qubit[${c.numQubits}] ${q};`);
    regs.push(q);
    for (let i = 0; i < c.numQubits; i++) qubit[i] = `${q}[${i}]`;
  }
  return { qubit, qubitDecls: decls, allQubits: regs.join(", "), bits: new Map(c.bits.map((b) => [b.name, b])) };
}

function collectGates(body: readonly Stmt[], into: Set<string>): void {
  for (const s of body) {
    if (s.kind === "gate") into.add(s.name);
    else if (s.kind === "if") {
      collectGates(s.then, into);
      collectGates(s.else, into);
    } else if (s.kind === "while" || s.kind === "box") collectGates(s.body, into);
  }
}

/** The circuit as OpenQASM 3 text. */
export function writeQasm3(c: Circuit, opts: WriteOptions = {}): string {
  const used = new Set<string>();
  collectGates(c.body, used);
  const spell = new Map<string, string>();
  const defs: string[] = [];
  for (const g of [...used].sort()) {
    const s = spelling(g);
    spell.set(g, s.name);
    if (s.definition !== null) defs.push(`pragma ${CANONICAL_PRAGMA} ${g}\n${s.definition}`);
  }
  const nm = names(c, opts.flatQubits ?? false, used);
  const out: string[] = ["OPENQASM 3.0;"];
  if (opts.header) for (const line of opts.header.split("\n")) out.push(`// ${line}`);
  out.push('include "stdgates.inc";');
  out.push(...defs);
  out.push(...nm.qubitDecls);
  for (const b of c.bits) out.push(b.scalar ? `bit ${b.name};` : `bit[${b.size}] ${b.name};`);
  const w = new Writer(out, nm, spell, opts.commentBefore, c.numQubits);
  w.block(c.body, "");
  return out.join("\n") + "\n";
}

const angleText = new WeakMap<Angle, string>();

/** Appends statements as lines; caches the text of angles and control prefixes. */
class Writer {
  private readonly ctrlPrefix = new Map<string, string>();
  constructor(
    private readonly out: string[],
    private readonly nm: Names,
    private readonly spell: ReadonlyMap<string, string>,
    private readonly comment: ((s: Stmt) => string | undefined) | undefined,
    private readonly numQubits: number,
  ) {}

  block(body: readonly Stmt[], indent: string): void {
    for (const s of body) this.stmt(s, indent);
  }

  private qubits(qs: readonly number[]): string {
    if (qs.length === 1) return this.nm.qubit[qs[0]!]!;
    let s = "";
    for (let i = 0; i < qs.length; i++) s += (i > 0 ? ", " : "") + this.nm.qubit[qs[i]!]!;
    return s;
  }

  private isAll(qs: readonly number[]): boolean {
    if (qs.length !== this.numQubits || qs.length === 0) return false;
    for (let i = 0; i < qs.length; i++) if (qs[i] !== i) return false;
    return true;
  }

  private bit(b: BitRef): string {
    const reg = this.nm.bits.get(b.reg);
    return reg?.scalar ? b.reg : `${b.reg}[${b.index}]`;
  }

  private prefix(ctrl: readonly boolean[]): string {
    if (ctrl.length === 0) return "";
    let key = "";
    for (const c of ctrl) key += c ? "1" : "0";
    let p = this.ctrlPrefix.get(key);
    if (p === undefined) {
      p = "";
      for (let i = 0; i < ctrl.length; ) {
        let j = i;
        while (j < ctrl.length && ctrl[j] === ctrl[i]) j++;
        const n = j - i;
        p += `${ctrl[i] ? "ctrl" : "negctrl"}${n > 1 ? `(${n})` : ""} @ `;
        i = j;
      }
      this.ctrlPrefix.set(key, p);
    }
    return p;
  }

  private angle(a: Angle): string {
    let t = angleText.get(a);
    if (t === undefined) {
      t = formatAngle(a);
      angleText.set(a, t);
    }
    return t;
  }

  private stmt(s: Stmt, ind: string): void {
    const out = this.out;
    if (this.comment) {
      const text = this.comment(s);
      if (text !== undefined) for (const line of text.split("\n")) out.push(`${ind}// ${line}`);
    }
    switch (s.kind) {
      case "gate": {
        let params = "";
        if (s.params.length > 0) {
          params = "(";
          for (let i = 0; i < s.params.length; i++) params += (i > 0 ? ", " : "") + this.angle(s.params[i]!);
          params += ")";
        }
        const name = this.spell.get(s.name) ?? s.name;
        const qs = s.qubits.length > 0 ? " " + this.qubits(s.qubits) : "";
        out.push(`${ind}${this.prefix(s.ctrl)}${name}${params}${qs};`);
        return;
      }
      case "measure": {
        const q = this.nm.qubit[s.qubit]!;
        out.push(s.bit ? `${ind}${this.bit(s.bit)} = measure ${q};` : `${ind}measure ${q};`);
        return;
      }
      case "reset":
        out.push(`${ind}reset ${this.nm.qubit[s.qubit]!};`);
        return;
      case "barrier":
        out.push(`${ind}barrier${s.qubits.length === 0 ? "" : " " + (this.isAll(s.qubits) ? this.nm.allQubits : this.qubits(s.qubits))};`);
        return;
      case "delay":
        out.push(`${ind}delay[${s.duration}]${s.qubits.length === 0 ? "" : " " + (this.isAll(s.qubits) ? this.nm.allQubits : this.qubits(s.qubits))};`);
        return;
      case "pragma":
        out.push(`${ind}pragma ${s.text}`);
        return;
      case "annotation":
        out.push(`${ind}@${s.text}`);
        return;
      case "if":
        out.push(`${ind}if (${this.cond(s.cond)}) {`);
        this.block(s.then, ind + "  ");
        if (s.else.length > 0) {
          out.push(`${ind}} else {`);
          this.block(s.else, ind + "  ");
        }
        out.push(`${ind}}`);
        return;
      case "while":
        out.push(`${ind}while (${this.cond(s.cond)}) {`);
        this.block(s.body, ind + "  ");
        out.push(`${ind}}`);
        return;
      case "box":
        out.push(`${ind}box${s.duration !== null ? `[${s.duration}]` : ""} {`);
        this.block(s.body, ind + "  ");
        out.push(`${ind}}`);
        return;
    }
  }

  /** A condition; every compound operand is parenthesised so that it reads back as the same tree. */
  private cond(c: CondExpr): string {
    switch (c.k) {
      case "bit":
        return this.bit(c.bit);
      case "reg":
        return c.reg;
      case "int":
        return c.value.toString();
      case "bool":
        return c.value ? "true" : "false";
      case "unary":
        return `${c.op}${this.operand(c.e)}`;
      case "binary":
        return `${this.operand(c.l)} ${c.op} ${this.operand(c.r)}`;
    }
  }

  private operand(c: CondExpr): string {
    return c.k === "unary" || c.k === "binary" || (c.k === "int" && c.value < 0n) ? `(${this.cond(c)})` : this.cond(c);
  }
}
