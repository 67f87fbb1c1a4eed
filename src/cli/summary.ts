// The `parse` command's summary of a circuit: registers, operations by gate, rotations whose angles are not free, distinct inexact angles.
import type { Circuit, GateOp, Stmt } from "../ir/circuit.js";
import { isExactQuarterPi } from "../ir/angle-ops.js";
import { dec } from "../numeric/decimal.js";

export interface CircuitSummary {
  readonly qubits: number;
  readonly qubitRegisters: readonly { readonly name: string; readonly size: number }[];
  readonly classicalBits: number;
  readonly classicalRegisters: readonly { readonly name: string; readonly size: number }[];
  /** Every statement of the IR (operations in blocks included; a block counts as one too). */
  readonly operations: number;
  /** Gate applications by spelling: the gate's name, after its modifiers when it has controls (`negctrl @ x`). */
  readonly gates: Readonly<Record<string, number>>;
  /** Measurements, resets, barriers, delays, pragmas, annotations and blocks. */
  readonly other: Readonly<Record<string, number>>;
  readonly rotations: {
    /** Gates with an angle that is not known to be a multiple of pi/4 (they will need approximation). */
    readonly nonTrivial: number;
    /** The distinct angles not known as rational multiples of pi, as decimal strings, in increasing order. */
    readonly distinctNonExactAngles: readonly string[];
  };
}

function gateKey(g: GateOp): string {
  if (g.ctrl.length === 0) return g.name;
  return g.ctrl.map((c) => (c ? "ctrl @ " : "negctrl @ ")).join("") + g.name;
}

export function summarizeCircuit(c: Circuit): CircuitSummary {
  const gates = new Map<string, number>();
  const other = new Map<string, number>();
  const inexact = new Set<string>();
  let operations = 0;
  let nonTrivial = 0;
  const bump = (m: Map<string, number>, k: string): void => {
    m.set(k, (m.get(k) ?? 0) + 1);
  };
  const walk = (body: readonly Stmt[]): void => {
    for (const s of body) {
      operations++;
      switch (s.kind) {
        case "gate": {
          bump(gates, gateKey(s));
          if (s.params.length > 0 && !(s.name === "gphase" && s.ctrl.length === 0)) {
            if (s.params.some((p) => !isExactQuarterPi(p))) nonTrivial++;
          }
          for (const p of s.params) if (p.pi === null) inexact.add(p.value);
          break;
        }
        case "if":
          bump(other, "if");
          walk(s.then);
          walk(s.else);
          break;
        case "while":
          bump(other, "while");
          walk(s.body);
          break;
        case "box":
          bump(other, "box");
          walk(s.body);
          break;
        default:
          bump(other, s.kind);
      }
    }
  };
  walk(c.body);
  const sorted = <T>(m: Map<string, T>): Record<string, T> => Object.fromEntries([...m].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
  const angles = [...inexact].sort((a, b) => dec(a).comparedTo(dec(b)) || (a < b ? -1 : a > b ? 1 : 0));
  return {
    qubits: c.numQubits,
    qubitRegisters: c.qubitRegs.map((r) => ({ name: r.name, size: r.size })),
    classicalBits: c.bits.reduce((n, b) => n + b.size, 0),
    classicalRegisters: c.bits.map((b) => ({ name: b.name, size: b.size })),
    operations,
    gates: sorted(gates),
    other: sorted(other),
    rotations: { nonTrivial, distinctNonExactAngles: angles },
  };
}

/** At most `digits` significant digits of a decimal string, marked with "..." when cut. */
function shortDecimal(s: string, digits = 20): string {
  const d = dec(s);
  const r = d.toSignificantDigits(digits).toString();
  return d.eq(dec(r)) ? r : `${r}...`;
}

function regList(regs: readonly { readonly name: string; readonly size: number }[]): string {
  return regs.length === 0 ? "" : ` (${regs.map((r) => `${r.name}[${r.size}]`).join(", ")})`;
}

/** The summary as text for the terminal. */
export function formatSummary(s: CircuitSummary, file: string): string {
  const lines: string[] = [];
  lines.push(`file: ${file}`);
  lines.push(`qubits: ${s.qubits}${regList(s.qubitRegisters)}`);
  lines.push(`classical bits: ${s.classicalBits}${regList(s.classicalRegisters)}`);
  lines.push(`operations: ${s.operations}`);
  const table = (rec: Readonly<Record<string, number>>): void => {
    const entries = Object.entries(rec);
    const w = Math.max(0, ...entries.map(([k]) => k.length));
    for (const [k, v] of entries) lines.push(`  ${k.padEnd(w)}  ${v}`);
  };
  if (Object.keys(s.gates).length > 0) {
    lines.push("gates:");
    table(s.gates);
  }
  if (Object.keys(s.other).length > 0) {
    lines.push("other operations:");
    table(s.other);
  }
  lines.push(`rotations with non-trivial angles: ${s.rotations.nonTrivial}`);
  lines.push(`distinct non-exact angles (not known as rational multiples of pi): ${s.rotations.distinctNonExactAngles.length}`);
  for (const a of s.rotations.distinctNonExactAngles) lines.push(`  ${shortDecimal(a)}`);
  return lines.join("\n") + "\n";
}
