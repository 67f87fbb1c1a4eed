// Names in scope: registers, aliases, classical values, gates and subroutines, with OpenQASM's visibility rules for gate and subroutine bodies.
import type { BitRef } from "../ir/circuit.js";
import type { LibraryGate } from "./libraries.js";
import type { Stmt, ArgDef, TypeName } from "./ast.js";
import type { Value } from "./values.js";

/** A user `gate` definition, kept as syntax and expanded at each call. */
export interface UserGate {
  readonly kind: "user";
  readonly name: string;
  readonly params: readonly string[];
  readonly qubits: readonly string[];
  readonly body: readonly Stmt[];
  readonly file: string;
  /** Definition order: a body may only call gates defined before it. */
  readonly order: number;
}

/** A gate that is a canonical IR gate as it stands (the builtin U, OpenQASM 2's CX, or one of the writer's definitions). */
export interface CanonicalGate {
  readonly kind: "canonical";
  readonly name: string;
  /** The canonical name in the gate table (U, cx, rxx, ...). */
  readonly target: string;
  readonly numParams: number;
  readonly numQubits: number;
  readonly order: number;
}

export interface LibGate {
  readonly kind: "library";
  readonly lib: LibraryGate;
  readonly order: number;
}

export type GateSym = UserGate | CanonicalGate | LibGate;

export interface Subroutine {
  readonly name: string;
  readonly args: readonly ArgDef[];
  readonly returns: boolean;
  readonly body: readonly Stmt[];
  readonly file: string;
}

export type Sym =
  /** Qubits: a register (`qubit[3] q`), an alias, a gate's or subroutine's qubit argument, a loop variable. */
  | { readonly kind: "qubits"; readonly qubits: readonly number[]; readonly scalar: boolean }
  /** Classical bits: a register (then `reg` is its name), an alias, an argument or a loop variable. */
  | { readonly kind: "bits"; readonly bits: readonly BitRef[]; readonly scalar: boolean; readonly reg: string | null }
  /**
   * A classical value known at compile time (or not yet: `value` null for an unbound input or a
   * variable declared without a value). `constant` for `const`, loop variables and gate parameters.
   */
  | {
      readonly kind: "value";
      readonly type: TypeName;
      value: Value | null;
      readonly constant: boolean;
      readonly input: boolean;
      readonly loopVar: boolean;
    }
  | { readonly kind: "gate"; readonly gate: GateSym }
  | { readonly kind: "def"; readonly def: Subroutine };

export type ScopeKind = "global" | "gate" | "def" | "block";

/** Thrown by `declare` when the name is taken in the same scope. */
export class DuplicateName extends Error {}

/** A lexical scope: names declared here, then the enclosing scopes (filtered at gate and subroutine bodies). */
export class Scope {
  private readonly names = new Map<string, Sym>();
  constructor(
    readonly kind: ScopeKind,
    readonly parent: Scope | null,
  ) {}

  /** Declare `name` here; throws DuplicateName when this scope already has it. */
  declare(name: string, sym: Sym): void {
    if (this.names.has(name)) throw new DuplicateName(name);
    this.names.set(name, sym);
  }

  /** The symbol declared under `name` in this scope itself (not the enclosing ones). */
  getOwn(name: string): Sym | undefined {
    return this.names.get(name);
  }

  /**
   * Look a name up. Gate bodies see only their own names plus global gates, subroutines and constants;
   * subroutine bodies see everything global except mutable classical variables.
   */
  lookup(name: string): Sym | undefined {
    const own = this.names.get(name);
    if (own !== undefined) return own;
    let filter: ScopeKind | null = this.kind === "gate" || this.kind === "def" ? this.kind : null;
    for (let s = this.parent; s !== null; s = s.parent) {
      const sym = s.names.get(name);
      if (sym !== undefined) {
        if (filter === "gate" && !(sym.kind === "gate" || sym.kind === "def" || (sym.kind === "value" && sym.constant && !sym.loopVar))) return undefined;
        if (filter === "def" && sym.kind === "value" && !sym.constant) return undefined;
        return sym;
      }
      if (s.kind === "gate" || s.kind === "def") filter = s.kind;
    }
    return undefined;
  }

  /** True for the program's global scope. */
  get isGlobal(): boolean {
    return this.kind === "global";
  }
}
