// Pass: a general one-qubit U(theta, phi, lambda) becomes rz(lambda), ry(theta) as sdg h rz h s, rz(phi) (equal up to global phase).
import type { Circuit, GateOp, Stmt } from "../ir/circuit.js";
import { rzOp } from "./merge-rotations.js";

/**
 * U(t, p, l) = e^{i(p+l)/2} rz(p) ry(t) rz(l) and ry(t) = S H rz(t) H S^dag (matrix products,
 * synthesis.md sections 1-2), so in circuit order: rz(l), sdg, h, rz(t), h, s, rz(p). Each rz is then
 * merged, recognised as exact, or approximated on its own share of the budget (the Euler route).
 * Requires uncontrolled U (the decompose pass removes controls first).
 */
export function eulerSplit(circuit: Circuit): Circuit {
  const visit = (body: readonly Stmt[]): Stmt[] => {
    const out: Stmt[] = [];
    for (const s of body) {
      if (s.kind === "if") out.push({ ...s, then: visit(s.then), else: visit(s.else) });
      else if (s.kind === "while" || s.kind === "box") out.push({ ...s, body: visit(s.body) });
      else if (s.kind === "gate" && s.name === "U" && s.ctrl.length === 0) {
        const [t, p, l] = s.params;
        const q = s.qubits[0]!;
        const g = (name: string): GateOp => ({ kind: "gate", name, params: [], qubits: [q], ctrl: [], loc: s.loc });
        out.push(rzOp(q, l!, s.loc), g("sdg"), g("h"), rzOp(q, t!, s.loc), g("h"), g("s"), rzOp(q, p!, s.loc));
      } else out.push(s);
    }
    return out;
  };
  return { ...circuit, body: visit(circuit.body) };
}
