// The standard include libraries (stdgates.inc, qelib1.inc): each library gate mapped to the canonical IR gate with the identical matrix.
import type { Angle } from "../ir/angle.js";
import { anglePi, angleScale, rational, ZERO_ANGLE } from "../ir/angle-ops.js";

/** A library gate call resolved to the IR: a canonical gate and, when the library's matrix differs from it by one, a global phase. */
export interface LibraryResolution {
  readonly name: string;
  readonly params: Angle[];
  /**
   * The library gate's matrix is e^{i phase} times the canonical gate's; absent when the two are identical.
   * Invisible on its own, it matters under `ctrl @`: the front end emits it as a `gphase` op with the
   * call's controls (uncontrolled, it may drop it). Only qelib1's ch, rxx and rzz carry one.
   */
  readonly phase?: Angle;
}

export interface LibraryGate {
  readonly name: string;
  readonly numParams: number;
  readonly numQubits: number;
  /** Map a call's parameters to the canonical IR gate with the identical matrix. */
  readonly resolve: (params: readonly Angle[]) => LibraryResolution;
}

const pi = (num: bigint, den: bigint = 1n): Angle => anglePi(rational(num, den));

function prm(params: readonly Angle[], i: number): Angle {
  const a = params[i];
  if (a === undefined) throw new RangeError(`library gate: missing parameter ${i}`);
  return a;
}

/** A library gate that is the canonical gate `target` with the same parameters. */
function same(name: string, numParams: number, numQubits: number, target: string = name): LibraryGate {
  return { name, numParams, numQubits, resolve: (params) => ({ name: target, params: params.slice(0, numParams) }) };
}

function custom(name: string, numParams: number, numQubits: number, resolve: (p: readonly Angle[]) => LibraryResolution): LibraryGate {
  return { name, numParams, numQubits, resolve };
}

function table(gates: readonly LibraryGate[]): ReadonlyMap<string, LibraryGate> {
  return new Map(gates.map((g) => [g.name, g]));
}

/** OpenQASM 3 stdgates.inc: every gate is canonical as it stands (CX, phase, cphase and u1 are aliases). */
const STDGATES = table([
  same("p", 1, 1),
  same("x", 0, 1),
  same("y", 0, 1),
  same("z", 0, 1),
  same("h", 0, 1),
  same("s", 0, 1),
  same("sdg", 0, 1),
  same("t", 0, 1),
  same("tdg", 0, 1),
  same("sx", 0, 1),
  same("rx", 1, 1),
  same("ry", 1, 1),
  same("rz", 1, 1),
  same("cx", 0, 2),
  same("cy", 0, 2),
  same("cz", 0, 2),
  same("cp", 1, 2),
  same("crx", 1, 2),
  same("cry", 1, 2),
  same("crz", 1, 2),
  same("ch", 0, 2),
  same("swap", 0, 2),
  same("ccx", 0, 3),
  same("cswap", 0, 3),
  same("cu", 4, 2),
  same("CX", 0, 2, "cx"),
  same("phase", 1, 1, "p"),
  same("cphase", 1, 2, "cp"),
  same("id", 0, 1),
  same("u1", 1, 1, "p"),
  same("u2", 2, 1),
  same("u3", 3, 1),
]);

/**
 * OpenQASM 2.0 qelib1.inc as commonly distributed (names and definitions from memory). Its u3/u2 carry no
 * phase (u3 is exactly U), its rz is u1 (= p), its sx is sdg h sdg (= rx(pi/2)); ch, rxx and rzz differ
 * from the canonical gates by a global phase. c4x maps to the exact 4-controlled X (see includeSource).
 * The 2.0 builtins: `U` is the canonical U, and `CX` (listed here too) is cx.
 */
const QELIB1 = table([
  custom("u3", 3, 1, (p) => ({ name: "U", params: [prm(p, 0), prm(p, 1), prm(p, 2)] })),
  custom("u2", 2, 1, (p) => ({ name: "U", params: [pi(1n, 2n), prm(p, 0), prm(p, 1)] })),
  same("u1", 1, 1, "p"),
  same("cx", 0, 2),
  same("CX", 0, 2, "cx"),
  same("id", 0, 1),
  custom("u0", 1, 1, () => ({ name: "id", params: [] })),
  same("u", 3, 1, "U"),
  same("p", 1, 1),
  same("x", 0, 1),
  same("y", 0, 1),
  same("z", 0, 1),
  same("h", 0, 1),
  same("s", 0, 1),
  same("sdg", 0, 1),
  same("t", 0, 1),
  same("tdg", 0, 1),
  same("rx", 1, 1),
  same("ry", 1, 1),
  same("rz", 1, 1, "p"),
  custom("sx", 0, 1, () => ({ name: "rx", params: [pi(1n, 2n)] })),
  custom("sxdg", 0, 1, () => ({ name: "rx", params: [pi(-1n, 2n)] })),
  same("cz", 0, 2),
  same("cy", 0, 2),
  same("swap", 0, 2),
  custom("ch", 0, 2, () => ({ name: "ch", params: [], phase: pi(1n, 4n) })),
  same("ccx", 0, 3),
  same("cswap", 0, 3),
  same("crx", 1, 2),
  same("cry", 1, 2),
  same("crz", 1, 2),
  same("cu1", 1, 2, "cp"),
  same("cp", 1, 2),
  custom("cu3", 3, 2, (p) => ({ name: "cu", params: [prm(p, 0), prm(p, 1), prm(p, 2), ZERO_ANGLE] })),
  same("csx", 0, 2),
  same("cu", 4, 2),
  custom("rxx", 1, 2, (p) => ({ name: "rxx", params: [prm(p, 0)], phase: angleScale(prm(p, 0), rational(-1n, 2n)) })),
  custom("rzz", 1, 2, (p) => ({ name: "rzz", params: [prm(p, 0)], phase: angleScale(prm(p, 0), rational(1n, 2n)) })),
  same("rccx", 0, 3),
  same("rc3x", 0, 4),
  same("c3x", 0, 4),
  same("c3sqrtx", 0, 4),
  same("c4x", 0, 5),
]);

/** The gate map of a standard include ("stdgates.inc" or "qelib1.inc"), else null. `U` and `gphase` are builtins, not listed. */
export function includeLibrary(file: string): ReadonlyMap<string, LibraryGate> | null {
  if (file === "stdgates.inc") return STDGATES;
  if (file === "qelib1.inc") return QELIB1;
  return null;
}

const STDGATES_SOURCE = `// stdgates.inc, as tledger reads it (OpenQASM 3).
// Every definition below fixes its gate's matrix exactly, global phase included: the phase is
// invisible on its own but becomes a relative phase under ctrl @. U and gphase are builtins.

// phase, Pauli, Clifford and T gates on one qubit
gate p(lambda) q { ctrl @ gphase(lambda) q; }
gate x q { U(pi, 0, pi) q; }
gate y q { U(pi, pi/2, pi/2) q; }
gate z q { p(pi) q; }
gate h q { U(pi/2, 0, pi) q; }
gate s q { p(pi/2) q; }
gate sdg q { p(-pi/2) q; }
gate t q { p(pi/4) q; }
gate tdg q { p(-pi/4) q; }
// the principal square root of x
gate sx q { gphase(pi/4); U(pi/2, -pi/2, pi/2) q; }

// rotations exp(-i theta P/2) about the three axes
gate rx(theta) q { U(theta, -pi/2, pi/2) q; }
gate ry(theta) q { U(theta, 0, 0) q; }
gate rz(theta) q { gphase(-theta/2); U(0, 0, theta) q; }

// controlled gates: exactly ctrl @ of the gate named after the c
gate cx c, q { ctrl @ x c, q; }
gate cy c, q { ctrl @ y c, q; }
gate cz c, q { ctrl @ z c, q; }
gate cp(lambda) c, q { ctrl @ p(lambda) c, q; }
gate crx(theta) c, q { ctrl @ rx(theta) c, q; }
gate cry(theta) c, q { ctrl @ ry(theta) c, q; }
gate crz(theta) c, q { ctrl @ rz(theta) c, q; }
gate ch c, q { ctrl @ h c, q; }
gate swap a, b { cx a, b; cx b, a; cx a, b; }
gate ccx c0, c1, q { ctrl @ ctrl @ x c0, c1, q; }
gate cswap c, a, b { ctrl @ swap c, a, b; }
// controlled U with an extra phase gamma on the controlled branch
gate cu(theta, phi, lambda, gamma) c, q { p(gamma) c; ctrl @ U(theta, phi, lambda) c, q; }

// kept for older programs
gate CX c, q { ctrl @ U(pi, 0, pi) c, q; }
gate phase(lambda) q { U(0, 0, lambda) q; }
gate cphase(lambda) c, q { ctrl @ phase(lambda) c, q; }
gate id q { U(0, 0, 0) q; }
gate u1(lambda) q { U(0, 0, lambda) q; }
gate u2(phi, lambda) q { gphase(-(phi + lambda)/2); U(pi/2, phi, lambda) q; }
gate u3(theta, phi, lambda) q { gphase(-(phi + lambda)/2); U(theta, phi, lambda) q; }
`;

const QELIB1_SOURCE = `// qelib1.inc, as tledger reads it (OpenQASM 2.0).
// The gate names and matrices follow the library as commonly distributed; the text is tledger's.
// U(theta,phi,lambda) and CX are the 2.0 builtins. OpenQASM 2.0 has no global phase, so a few
// gates here equal tledger's canonical gate of the same name only up to one (ch, rxx, rzz).

// one-qubit gates
gate u3(theta,phi,lambda) q { U(theta,phi,lambda) q; }
gate u2(phi,lambda) q { U(pi/2,phi,lambda) q; }
gate u1(lambda) q { U(0,0,lambda) q; }
gate cx c,q { CX c,q; }
gate id q { U(0,0,0) q; }
gate u0(gamma) q { U(0,0,0) q; }
gate u(theta,phi,lambda) q { U(theta,phi,lambda) q; }
gate p(lambda) q { U(0,0,lambda) q; }
gate x q { u3(pi,0,pi) q; }
gate y q { u3(pi,pi/2,pi/2) q; }
gate z q { u1(pi) q; }
gate h q { u2(0,pi) q; }
gate s q { u1(pi/2) q; }
gate sdg q { u1(-pi/2) q; }
gate t q { u1(pi/4) q; }
gate tdg q { u1(-pi/4) q; }
gate rx(theta) q { u3(theta,-pi/2,pi/2) q; }
gate ry(theta) q { u3(theta,0,0) q; }
gate rz(phi) q { u1(phi) q; }
gate sx q { sdg q; h q; sdg q; }
gate sxdg q { s q; h q; s q; }

// two- and three-qubit gates
gate cz c,q { h q; cx c,q; h q; }
gate cy c,q { sdg q; cx c,q; s q; }
gate swap a,b { cx a,b; cx b,a; cx a,b; }
gate ch c,q {
  h q; sdg q; cx c,q;
  h q; t q; cx c,q;
  t q; h q; s q; x q;
  s c;
}
gate ccx a,b,q {
  h q;
  cx b,q; tdg q;
  cx a,q; t q;
  cx b,q; tdg q;
  cx a,q; t b; t q; h q;
  cx a,b; t a; tdg b;
  cx a,b;
}
gate cswap c,a,b { cx b,a; ccx c,a,b; cx b,a; }
gate crx(theta) c,q {
  u1(pi/2) q; cx c,q;
  u3(-theta/2,0,0) q; cx c,q;
  u3(theta/2,-pi/2,0) q;
}
gate cry(theta) c,q { ry(theta/2) q; cx c,q; ry(-theta/2) q; cx c,q; }
gate crz(theta) c,q { rz(theta/2) q; cx c,q; rz(-theta/2) q; cx c,q; }
gate cu1(lambda) c,q { u1(lambda/2) c; cx c,q; u1(-lambda/2) q; cx c,q; u1(lambda/2) q; }
gate cp(lambda) c,q { p(lambda/2) c; cx c,q; p(-lambda/2) q; cx c,q; p(lambda/2) q; }
gate cu3(theta,phi,lambda) c,q {
  u1((lambda+phi)/2) c;
  u1((lambda-phi)/2) q; cx c,q;
  u3(-theta/2,0,-(phi+lambda)/2) q; cx c,q;
  u3(theta/2,phi,0) q;
}
gate csx c,q { h q; cu1(pi/2) c,q; h q; }
gate cu(theta,phi,lambda,gamma) c,q {
  p(gamma) c;
  p((lambda+phi)/2) c;
  p((lambda-phi)/2) q; cx c,q;
  u(-theta/2,0,-(phi+lambda)/2) q; cx c,q;
  u(theta/2,phi,0) q;
}
gate rxx(theta) a,b {
  u3(pi/2,theta,0) a; h b;
  cx a,b; u1(-theta) b; cx a,b;
  h b; u2(-pi,pi-theta) a;
}
gate rzz(theta) a,b { cx a,b; u1(theta) b; cx a,b; }

// Toffoli relatives: relative-phase Toffolis and multi-controlled X
gate rccx a,b,q {
  h q; t q;
  cx b,q; tdg q;
  cx a,q; t q;
  cx b,q; tdg q;
  h q;
}
gate rc3x a,b,c,q {
  h q; t q; cx c,q; tdg q; h q;
  cx a,q; t q;
  cx b,q; tdg q;
  cx a,q; t q;
  cx b,q; tdg q;
  h q; t q; cx c,q; tdg q; h q;
}
gate c3x a,b,c,q {
  h q;
  p(pi/8) a; p(pi/8) b; p(pi/8) c; p(pi/8) q;
  cx a,b; p(-pi/8) b; cx a,b;
  cx b,c; p(-pi/8) c;
  cx a,c; p(pi/8) c;
  cx b,c; p(-pi/8) c;
  cx a,c;
  cx c,q; p(-pi/8) q;
  cx b,q; p(pi/8) q;
  cx c,q; p(-pi/8) q;
  cx a,q; p(pi/8) q;
  cx c,q; p(-pi/8) q;
  cx b,q; p(pi/8) q;
  cx c,q; p(-pi/8) q;
  cx a,q;
  h q;
}
gate c3sqrtx a,b,c,q {
  h q; cu1(pi/8) a,q; h q;
  cx a,b;
  h q; cu1(-pi/8) b,q; h q;
  cx a,b;
  h q; cu1(pi/8) b,q; h q;
  cx b,c;
  h q; cu1(-pi/8) c,q; h q;
  cx a,c;
  h q; cu1(pi/8) c,q; h q;
  cx b,c;
  h q; cu1(-pi/8) c,q; h q;
  cx a,c;
  h q; cu1(pi/8) c,q; h q;
}
// 4-controlled X: a controlled sqrt(x) pair around rc3x and its inverse, then c3sqrtx.
// (The inverse of rc3x is spelled out: the same network reversed, t and tdg exchanged.)
gate c4x a,b,c,d,q {
  h q; cu1(pi/2) d,q; h q;
  rc3x a,b,c,d;
  h q; cu1(-pi/2) d,q; h q;
  h d; t d; cx c,d; tdg d; h d;
  t d; cx b,d; tdg d; cx a,d;
  t d; cx b,d; tdg d; cx a,d;
  h d; t d; cx c,d; tdg d; h d;
  c3sqrtx a,b,c,q;
}
`;

/** The text of a standard include as OpenQASM source (tledger's own wording), else null. */
export function includeSource(file: string): string | null {
  if (file === "stdgates.inc") return STDGATES_SOURCE;
  if (file === "qelib1.inc") return QELIB1_SOURCE;
  return null;
}
