// Which gate operations are T gates, CX gates, Clifford gates or continuous rotations, decided exactly from names and exact angles.
import type { Angle, Rational } from "../ir/angle.js";
import type { GateOp } from "../ir/circuit.js";
import { isExactQuarterPi, ratAdd, rational } from "../ir/angle-ops.js";

/**
 * The histogram key of a gate operation: its name, preceded by its control modifiers written
 * as OpenQASM 3 spells them (`ctrl @ x`, `ctrl(2) @ negctrl @ h`), runs of equal modifiers merged.
 */
export function gateKey(op: GateOp): string {
  if (op.ctrl.length === 0) return op.name;
  let out = "";
  let i = 0;
  while (i < op.ctrl.length) {
    const positive = op.ctrl[i];
    let j = i;
    while (j < op.ctrl.length && op.ctrl[j] === positive) j++;
    const run = j - i;
    out += (positive ? "ctrl" : "negctrl") + (run > 1 ? `(${run})` : "") + " @ ";
    i = j;
  }
  return out + op.name;
}

/** True for a T gate: an uncontrolled `t` or `tdg` (nothing else counts, whatever its matrix). */
export function isTGate(op: GateOp): boolean {
  return op.ctrl.length === 0 && (op.name === "t" || op.name === "tdg");
}

/**
 * True for a CNOT: an uncontrolled `cx` (or its OpenQASM 2 spelling `CX`), or `ctrl @ x` with a
 * single positive control. `negctrl @ x` and other two-qubit gates are counted only by name.
 */
export function isCxGate(op: GateOp): boolean {
  if (op.ctrl.length === 0) return op.name === "cx" || op.name === "CX";
  return op.ctrl.length === 1 && op.ctrl[0] === true && op.name === "x";
}

/** Uncontrolled gates without parameters that are Clifford (OpenQASM 3 standard names). */
const FIXED_CLIFFORDS: ReadonlySet<string> = new Set(["id", "x", "y", "z", "h", "s", "sdg", "sx", "cx", "CX", "cy", "cz", "swap"]);

/** One-parameter rotations about a Pauli axis (up to global phase): Clifford iff the angle is a multiple of pi/2. */
const PAULI_ROTATIONS: ReadonlySet<string> = new Set(["rx", "ry", "rz", "p", "phase", "u1"]);

/** Controlled Pauli-axis rotations: Clifford iff the angle is a multiple of pi (crz(pi) = CZ * sdg on the control). */
const CONTROLLED_ROTATIONS: ReadonlySet<string> = new Set(["crx", "cry", "crz", "cp", "cphase"]);

/** The angle as an exact fraction of pi, or null when it is not known exactly. */
function piFraction(a: Angle | undefined): Rational | null {
  return a === undefined ? null : a.pi;
}

/** True when r * pi is an exact multiple of (pi / d), i.e. d * r is an integer. */
function multipleOf(r: Rational | null, d: bigint): boolean {
  return r !== null && d % r.den === 0n;
}

/**
 * U(theta, phi, lambda) = rz(phi) ry(theta) rz(lambda) up to phase is Clifford exactly when
 * - theta = m pi with m even and phi + lambda a multiple of pi/2 (a phase gate), or
 * - theta = m pi with m odd and phi - lambda a multiple of pi/2 (X times a phase gate), or
 * - theta an odd multiple of pi/2 and phi, lambda multiples of pi/2;
 * otherwise the image of Z or X under conjugation is not a Pauli.
 */
function isCliffordU(theta: Rational | null, phi: Rational | null, lambda: Rational | null): boolean {
  if (theta === null || phi === null || lambda === null) return false;
  if (theta.den === 1n) {
    const even = theta.num % 2n === 0n;
    const combined = even ? ratAdd(phi, lambda) : ratAdd(phi, rational(-lambda.num, lambda.den));
    return multipleOf(combined, 2n);
  }
  if (theta.den === 2n) return multipleOf(phi, 2n) && multipleOf(lambda, 2n);
  return false;
}

/**
 * True when the operation is known exactly to be a Clifford gate. Recognised:
 * the fixed standard Cliffords (id x y z h s sdg sx cx CX cy cz swap); rx ry rz p phase u1 at
 * multiples of pi/2; crx cry crz cp cphase at multiples of pi; U/u3/u2 by the rule of
 * `isCliffordU`; and a single (positive or negative) control on x, y, z, on rx ry rz p phase u1
 * at multiples of pi, or on gphase at multiples of pi/2. Anything else (t, tdg, ch, ccx, an
 * unknown name, an inexact angle) counts as not Clifford. Uncontrolled `gphase` is not a gate
 * on any qubit and is not counted.
 */
export function isCliffordGate(op: GateOp): boolean {
  const a0 = piFraction(op.params[0]);
  if (op.ctrl.length === 0) {
    if (op.params.length === 0) return FIXED_CLIFFORDS.has(op.name);
    if (PAULI_ROTATIONS.has(op.name)) return multipleOf(a0, 2n);
    if (CONTROLLED_ROTATIONS.has(op.name)) return multipleOf(a0, 1n);
    if (op.name === "U" || op.name === "u3") return isCliffordU(a0, piFraction(op.params[1]), piFraction(op.params[2]));
    if (op.name === "u2") return isCliffordU(rational(1n, 2n), a0, piFraction(op.params[1]));
    return false;
  }
  if (op.ctrl.length !== 1) return false;
  if (op.params.length === 0) return op.name === "x" || op.name === "y" || op.name === "z";
  if (PAULI_ROTATIONS.has(op.name)) return multipleOf(a0, 1n);
  if (op.name === "gphase") return multipleOf(a0, 2n);
  return false;
}

/**
 * True for a continuous rotation still waiting to be lowered: a gate with at least one angle
 * that is not known exactly to be a multiple of pi/4. Uncontrolled `gphase` is excluded (a
 * global phase is unobservable); under `ctrl @` it is a real rotation and counts.
 */
export function isOpenRotation(op: GateOp): boolean {
  if (op.name === "gphase" && op.ctrl.length === 0) return false;
  for (const a of op.params) if (!isExactQuarterPi(a)) return true;
  return false;
}
