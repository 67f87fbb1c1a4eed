// The OpenQASM 3 writer: the IR as program text, streamed in bounded chunks, that reads back (through the front end) to the same IR.
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

/** Adds to `into` the name of every gate applied in `body` (blocks included). */
function collectGates(body: readonly Stmt[], into: Set<string>): void {
  // Lowered bodies hold tens of millions of ops over a handful of names: a short list of the names
  // seen so far (compared by ===, cheap for the engine's interned strings) beats a set lookup per op.
  const seen: string[] = [];
  for (let i = 0; i < body.length; i++) {
    const s = body[i]!;
    if (s.kind === "gate") {
      const name = s.name;
      let j = 0;
      while (j < seen.length && seen[j] !== name) j++;
      if (j === seen.length) {
        if (seen.length < 16) seen.push(name);
        into.add(name);
      }
    } else if (s.kind === "if") {
      collectGates(s.then, into);
      collectGates(s.else, into);
    } else if (s.kind === "while" || s.kind === "box") collectGates(s.body, into);
  }
}

/**
 * The default chunk size in bytes (UTF-8). 64 KiB rather than 1 MiB: a chunk string that small is
 * allocated in V8's young generation and dies there, whereas 1 MiB strings go to the old generation
 * and, next to a large circuit, cost about 0.5 s of full collections per 25 million lines (measured).
 */
export const CHUNK_BYTES = 1 << 16;

/**
 * The circuit as OpenQASM 3 text, handed to `sink` in order in chunks of at most `chunkBytes` bytes as
 * UTF-8 (that many characters for ASCII text). Every chunk ends at a line end and none is empty; only
 * a single line longer than `chunkBytes` makes a longer chunk (of that line alone). The chunks
 * concatenated are exactly `writeQasm3(c, opts)`. Extra memory: one chunk plus small caches.
 */
export function writeQasm3Chunks(c: Circuit, opts: WriteOptions, sink: (chunk: string) => void, chunkBytes: number = CHUNK_BYTES): void {
  if (!Number.isSafeInteger(chunkBytes) || chunkBytes < 1) throw new RangeError(`writeQasm3Chunks: chunkBytes must be a positive integer, got ${chunkBytes}`);
  const used = new Set<string>();
  collectGates(c.body, used);
  const spell = new Map<string, string>();
  const defs: string[] = [];
  for (const g of [...used].sort()) {
    const s = spelling(g);
    spell.set(g, s.name);
    if (s.definition !== null) defs.push(`pragma ${CANONICAL_PRAGMA} ${g}`, s.definition);
  }
  const nm = names(c, opts.flatQubits ?? false, used);
  const w = new Writer(sink, chunkBytes, nm, spell, opts.commentBefore, c.numQubits);
  w.line("OPENQASM 3.0;");
  if (opts.header) for (const line of opts.header.split("\n")) w.line(`// ${line}`);
  w.line('include "stdgates.inc";');
  for (const d of defs) w.line(d);
  for (const d of nm.qubitDecls) w.line(d);
  for (const b of c.bits) w.line(b.scalar ? `bit ${b.name};` : `bit[${b.size}] ${b.name};`);
  w.block(c.body, "");
  w.flush();
}

/** The circuit as OpenQASM 3 text. */
export function writeQasm3(c: Circuit, opts: WriteOptions = {}): string {
  const parts: string[] = [];
  writeQasm3Chunks(c, opts, (chunk) => parts.push(chunk));
  return parts.join("");
}

const angleText = new WeakMap<Angle, string>();
/** Marks a plain line that is not cached as bytes. */
const EMPTY_BYTES = Buffer.alloc(0);

/** By qubit: gate name -> the bytes of the line `indent name qubit;\n` (ASCII lines only). */
type PlainLines = (Map<string, Buffer> | undefined)[];

/**
 * Appends statements as lines, as UTF-8, to a buffer of `chunkBytes` that goes to the sink (decoded)
 * when the next line does not fit. Caches the text of angles and control prefixes, and the bytes of
 * the whole line of each uncontrolled, parameterless one-qubit gate on each qubit at each indent (the
 * bulk of a lowered circuit, written by copying a few bytes: no allocation per line).
 */
class Writer {
  private readonly ctrlPrefix = new Map<string, string>();
  private readonly plainByIndent = new Map<string, PlainLines>();
  private readonly buf: Buffer;
  /** Bytes of `buf` in use. */
  private pos = 0;
  /** Whether those bytes are all ASCII (then they decode much faster). */
  private ascii = true;
  constructor(
    private readonly sink: (chunk: string) => void,
    private readonly chunkBytes: number,
    private readonly nm: Names,
    private readonly spell: ReadonlyMap<string, string>,
    private readonly comment: ((s: Stmt) => string | undefined) | undefined,
    private readonly numQubits: number,
  ) {
    this.buf = Buffer.alloc(chunkBytes);
  }

  /** One line (`text` has no line end). */
  line(text: string): void {
    const t = text + "\n";
    // At most 3 UTF-8 bytes per UTF-16 code unit.
    if (this.pos + 3 * t.length > this.chunkBytes) {
      this.flush();
      if (3 * t.length > this.chunkBytes && Buffer.byteLength(t, "utf8") > this.chunkBytes) {
        // A line longer than a chunk is a chunk of its own.
        this.sink(t);
        return;
      }
    }
    const n = this.buf.write(t, this.pos, "utf8");
    if (n !== t.length) this.ascii = false;
    this.pos += n;
  }

  /** The bytes of whole lines, all ASCII (at most `chunkBytes`). */
  private asciiBytes(b: Buffer): void {
    if (this.pos + b.length > this.chunkBytes) this.flush();
    const buf = this.buf;
    let p = this.pos;
    for (let i = 0; i < b.length; i++) buf[p++] = b[i]!;
    this.pos = p;
  }

  /** Hands the buffered lines to the sink (nothing when empty). */
  flush(): void {
    if (this.pos > 0) {
      const chunk = this.buf.toString(this.ascii ? "ascii" : "utf8", 0, this.pos);
      this.pos = 0;
      this.ascii = true;
      this.sink(chunk);
    }
  }

  block(body: readonly Stmt[], indent: string): void {
    let plain = this.plainByIndent.get(indent);
    if (plain === undefined) {
      plain = [];
      this.plainByIndent.set(indent, plain);
    }
    const comment = this.comment;
    for (let i = 0; i < body.length; i++) {
      const s = body[i]!;
      if (comment !== undefined) {
        const text = comment(s);
        if (text !== undefined) for (const line of text.split("\n")) this.line(`${indent}// ${line}`);
      }
      if (s.kind === "gate" && s.qubits.length === 1 && s.params.length === 0 && s.ctrl.length === 0) {
        // The hot path: one lookup, a few bytes copied.
        const b = this.plainLine(plain, s.name, s.qubits[0]!, indent);
        if (b !== null) {
          this.asciiBytes(b);
          continue;
        }
      }
      this.stmt(s, indent);
    }
  }

  /**
   * The bytes of the line of an uncontrolled, parameterless gate on qubit q, or null when that line is
   * not plain ASCII of at most a chunk (then it goes the general way).
   */
  private plainLine(plain: PlainLines, name: string, q: number, ind: string): Buffer | null {
    const byName = (plain[q] ??= new Map<string, Buffer>());
    let b = byName.get(name);
    if (b === undefined) {
      const text = `${ind}${this.spell.get(name) ?? name} ${this.nm.qubit[q]!};\n`;
      b = Buffer.from(text, "utf8");
      if (b.length !== text.length || b.length > this.chunkBytes) b = EMPTY_BYTES;
      byName.set(name, b);
    }
    return b === EMPTY_BYTES ? null : b;
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

  /** One statement (its comment is written by `block`). */
  private stmt(s: Stmt, ind: string): void {
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
        this.line(`${ind}${this.prefix(s.ctrl)}${name}${params}${qs};`);
        return;
      }
      case "measure": {
        const q = this.nm.qubit[s.qubit]!;
        this.line(s.bit ? `${ind}${this.bit(s.bit)} = measure ${q};` : `${ind}measure ${q};`);
        return;
      }
      case "reset":
        this.line(`${ind}reset ${this.nm.qubit[s.qubit]!};`);
        return;
      case "barrier":
        this.line(`${ind}barrier${s.qubits.length === 0 ? "" : " " + (this.isAll(s.qubits) ? this.nm.allQubits : this.qubits(s.qubits))};`);
        return;
      case "delay":
        this.line(`${ind}delay[${s.duration}]${s.qubits.length === 0 ? "" : " " + (this.isAll(s.qubits) ? this.nm.allQubits : this.qubits(s.qubits))};`);
        return;
      case "pragma":
        this.line(`${ind}pragma ${s.text}`);
        return;
      case "annotation":
        this.line(`${ind}@${s.text}`);
        return;
      case "if":
        this.line(`${ind}if (${this.cond(s.cond)}) {`);
        this.block(s.then, ind + "  ");
        if (s.else.length > 0) {
          this.line(`${ind}} else {`);
          this.block(s.else, ind + "  ");
        }
        this.line(`${ind}}`);
        return;
      case "while":
        this.line(`${ind}while (${this.cond(s.cond)}) {`);
        this.block(s.body, ind + "  ");
        this.line(`${ind}}`);
        return;
      case "box":
        this.line(`${ind}box${s.duration !== null ? `[${s.duration}]` : ""} {`);
        this.block(s.body, ind + "  ");
        this.line(`${ind}}`);
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
