// Gate modifiers on lists of gate applications (inv @, pow(k) @, ctrl @, negctrl @) and the canonical form each application takes in the IR.
import type { Angle, Rational } from "../ir/angle.js";
import { angleNeg } from "../ir/angle-ops.js";
import { controlledName, GATES, inverseGate, powerGate } from "../ir/gates.js";

/**
 * A gate application during expansion: a canonical gate of src/ir/gates.ts on `qubits` (controls
 * first, one per `ctrl` entry). Qubits are positions of the call being expanded, mapped to actual
 * qubits at the end. `phaseOnly`: a global phase a library gate carries relative to its canonical
 * gate, kept only when it ends up controlled.
 */
export interface TOp {
  readonly name: string;
  readonly params: readonly Angle[];
  readonly qubits: readonly number[];
  readonly ctrl: readonly boolean[];
  readonly phaseOnly: boolean;
}

/** Why a modifier cannot be applied (the caller reports it at the modifier). */
export class ModifierError extends Error {
  constructor(
    message: string,
    readonly hint?: string,
  ) {
    super(message);
  }
}

export function invertOps(ops: readonly TOp[]): TOp[] {
  const out: TOp[] = new Array<TOp>(ops.length);
  for (let i = 0; i < ops.length; i++) {
    const op = ops[ops.length - 1 - i]!;
    const inv = inverseGate(op.name, op.params);
    out[i] = { name: inv.name, params: inv.params, qubits: op.qubits, ctrl: op.ctrl, phaseOnly: op.phaseOnly };
  }
  return out;
}

/** The gate a controlled canonical name stands for, with how many controls it adds (cx -> x, 1). */
const BASE_OF: ReadonlyMap<string, { readonly base: string; readonly n: number }> = (() => {
  const m = new Map<string, { base: string; n: number }>();
  for (const name of GATES.keys()) {
    for (const base of GATES.keys()) {
      for (let n = 1; n <= 6; n++) {
        if (controlledName(base, n) === name) {
          const cur = m.get(name);
          if (!cur || n > cur.n) m.set(name, { base, n });
        }
      }
    }
  }
  return m;
})();

/**
 * pow(k) @ on an expanded gate. Integer k: the gate's own power rule when there is one (rotations
 * multiply their angle), else repetition (of the inverse for k < 0). Non-integer k: only a single gate
 * with an exact power rule (rotations, phase gates, x^(1/2)), looked up on its uncontrolled base too.
 */
export function powerOps(ops: readonly TOp[], k: Rational, gateName: string, remaining: number): TOp[] {
  const real = ops.filter((o) => !o.phaseOnly);
  if (real.length === 1) {
    const powered = ops.map((o) => powerOne(o, k));
    if (powered.every((p) => p !== null)) return powered as TOp[];
  }
  if (k.den !== 1n) {
    throw new ModifierError(
      `unsupported: pow(${k.num}/${k.den}) @ ${gateName}: a non-integer power needs a single rotation or phase gate`,
      "use an integer power, or write the fractional power as a rotation angle",
    );
  }
  const n = k.num < 0n ? -k.num : k.num;
  if (n * BigInt(ops.length) > BigInt(remaining)) throw new ModifierError(`pow(${k.num}) @ ${gateName} is too large to expand`);
  const unit = k.num < 0n ? invertOps(ops) : ops.slice();
  const out: TOp[] = [];
  for (let i = 0n; i < n; i++) for (const o of unit) out.push(o);
  return out;
}

function powerOne(op: TOp, k: Rational): TOp | null {
  const p = powerGate(op.name, op.params, k);
  if (p) return { ...op, name: p.name, params: p.params };
  const fam = BASE_OF.get(op.name);
  if (fam && fam.base !== "gphase") {
    const q = powerGate(fam.base, op.params, k);
    if (q) return { ...op, name: q.name, params: q.params, ctrl: [...op.ctrl, ...new Array<boolean>(fam.n).fill(true)] };
  }
  return null;
}

/** ctrl @ / negctrl @ with the given control positions, outermost first. */
export function controlOps(ops: readonly TOp[], controls: readonly number[], positive: boolean): TOp[] {
  const pol = new Array<boolean>(controls.length).fill(positive);
  return ops.map((o) => ({ ...o, qubits: [...controls, ...o.qubits], ctrl: [...pol, ...o.ctrl] }));
}

/** Map positions to actual qubits. */
export function mapQubits(ops: readonly TOp[], map: (q: number) => number): TOp[] {
  return ops.map((o) => ({ ...o, qubits: o.qubits.map(map) }));
}

const canonicalCache = new Map<string, boolean>();

/**
 * The IR's canonical form of one application (several when a controlled global phase is split up):
 * controls gathered into the gate's controlled name where one exists (ctrl @ x -> cx, ctrl @ cx -> ccx,
 * ctrl @ gphase -> p), absorbing the controls nearest the gate; a controlled gphase whose last control is
 * negative becomes gphase * p(-t) (negctrl @ gphase(t) = diag(e^{it}, 1)); an uncontrolled phaseOnly
 * op disappears.
 */
export function canonicalOps(op: TOp, out: TOp[]): void {
  if (op.ctrl.length === 0) {
    if (op.phaseOnly) return;
    let plain = canonicalCache.get(op.name);
    if (plain === undefined) {
      const fam = BASE_OF.get(op.name);
      plain = !fam || controlledName(fam.base, fam.n) === op.name;
      canonicalCache.set(op.name, plain);
    }
    if (plain) {
      out.push(op);
      return;
    }
  }
  const fam = BASE_OF.get(op.name);
  let name = fam ? fam.base : op.name;
  let ctrl = fam ? [...op.ctrl, ...new Array<boolean>(fam.n).fill(true)] : op.ctrl.slice();
  let trailing = 0;
  while (trailing < ctrl.length && ctrl[ctrl.length - 1 - trailing]) trailing++;
  for (let m = trailing; m >= 1; m--) {
    const c = controlledName(name, m);
    if (c !== null) {
      name = c;
      ctrl = ctrl.slice(0, ctrl.length - m);
      break;
    }
  }
  if (name === "gphase" && ctrl.length > 0) {
    // The last control is negative here: e^{it} on |0> of that qubit = gphase(t) * p(-t).
    const t = op.params[0]!;
    const rest = ctrl.slice(0, -1);
    const restQ = op.qubits.slice(0, rest.length);
    canonicalOps({ name: "gphase", params: [t], qubits: restQ, ctrl: rest, phaseOnly: false }, out);
    canonicalOps({ name: "p", params: [angleNeg(t)], qubits: op.qubits.slice(0, ctrl.length), ctrl: rest, phaseOnly: false }, out);
    return;
  }
  if (name === "gphase" && op.phaseOnly) return;
  out.push({ name, params: op.params, qubits: op.qubits, ctrl, phaseOnly: false });
}
