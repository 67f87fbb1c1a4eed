// Tests of the decompose pass: every gate and ctrl/negctrl variant equals its matrix up to one global phase, in the basis only.
import { describe, expect, it } from "vitest";
import { decompose, decomposeOp, DECOMPOSED_BASIS } from "../../src/passes/decompose.js";
import { GATES, controlledMatrix, gateInfo } from "../../src/ir/gates.js";
import { angleDecimal, anglePi, rational } from "../../src/ir/angle-ops.js";
import type { Angle } from "../../src/ir/angle.js";
import type { Circuit, GateOp, SourceLoc, Stmt } from "../../src/ir/circuit.js";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { diffUpToPhase, embed, seeded, unitaryOf } from "../ir/dense.js";

const LOC: SourceLoc = { file: "lab.qasm", line: 7, col: 3 };
const rnd = seeded(5150);
const TOL = 1e-9;

function shuffle<T>(xs: T[]): T[] {
  for (let i = xs.length - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1));
    [xs[i], xs[j]] = [xs[j]!, xs[i]!];
  }
  return xs;
}

const randomAngle = (): Angle => angleDecimal(((rnd() * 2 - 1) * 2 * Math.PI).toPrecision(17));
/** A random exact angle k pi / 8 (so both exact-word and continuous paths get exercised). */
const randomPiAngle = (): Angle => anglePi(rational(BigInt(Math.floor(rnd() * 33) - 16), 8n));

function gateOp(name: string, params: readonly Angle[], qubits: readonly number[], ctrl: readonly boolean[]): GateOp {
  return { kind: "gate", name, params, qubits, ctrl, loc: LOC };
}

function circuitOf(n: number, body: Stmt[]): Circuit {
  return { numQubits: n, qubitRegs: [{ name: "q", start: 0, size: n }], bits: [{ name: "c", size: 2, scalar: false }], body };
}

/** The reference matrix of one op on n qubits: the table's matrix with its controls, embedded (test/ir/dense.ts). */
function reference(op: GateOp, n: number) {
  const info = gateInfo(op.name)!;
  const m = controlledMatrix(info.matrix(op.params.map((p) => Number(p.value))), op.ctrl);
  return op.qubits.length === 0 ? unitaryOf([op], n) : embed(m, op.qubits, n);
}

function checkBasis(body: readonly Stmt[]): void {
  for (const s of body) {
    if (s.kind !== "gate") continue;
    expect(DECOMPOSED_BASIS.has(s.name), `${s.name} not in basis`).toBe(true);
    expect(s.ctrl, `${s.name} still controlled`).toEqual([]);
    expect(s.loc).toEqual(LOC);
    expect(s.params.length).toBe(gateInfo(s.name)!.numParams);
  }
}

/** Decompose one op on n qubits and compare unitaries up to one global phase. */
function checkOp(op: GateOp, n: number, borrow = false): GateOp[] {
  const out = decompose(circuitOf(n, [op]), { borrowIdleQubits: borrow }).body as GateOp[];
  checkBasis(out);
  const d = diffUpToPhase(unitaryOf(out, n), reference(op, n));
  expect(d, `${op.ctrl.map((c) => (c ? "ctrl" : "negctrl")).join(" ")} ${op.name}(${op.params.map((p) => p.value.slice(0, 8)).join(",")}) on ${op.qubits.join(",")}`).toBeLessThan(TOL);
  return out;
}

function randomOp(name: string, nCtrl: number, n: number, exact: boolean): GateOp {
  const info = gateInfo(name)!;
  const qubits = shuffle(Array.from({ length: n }, (_, i) => i)).slice(0, nCtrl + info.numQubits);
  const ctrl = Array.from({ length: nCtrl }, () => rnd() < 0.7);
  const params = Array.from({ length: info.numParams }, exact ? randomPiAngle : randomAngle);
  return gateOp(name, params, qubits, ctrl);
}

const countRz = (ops: readonly GateOp[]): number => ops.filter((o) => o.name === "rz" || o.name === "U").length;
const countT = (ops: readonly GateOp[]): number => ops.filter((o) => o.name === "t" || o.name === "tdg").length;

describe("decompose: every canonical gate", () => {
  for (const info of GATES.values()) {
    it(`${info.name}: uncontrolled and with up to ${Math.min(4, 5 - info.numQubits)} controls`, () => {
      for (let nCtrl = 0; nCtrl + info.numQubits <= 5 && nCtrl <= 4; nCtrl++) {
        const n = Math.max(1, Math.min(5, nCtrl + info.numQubits + (rnd() < 0.5 ? 1 : 0)));
        checkOp(randomOp(info.name, nCtrl, n, false), n);
        checkOp(randomOp(info.name, nCtrl, n, true), n);
      }
    });
  }
});

describe("decompose: exact constructions", () => {
  it("emits the Clifford+T word for rz by a multiple of pi/4, and nothing for 2 pi", () => {
    // rz(k pi/4) = e^{-ik pi/8} T^k (synthesis.md section 2)
    for (let k = -9; k <= 9; k++) {
      const out = checkOp(gateOp("rz", [anglePi(rational(BigInt(k), 4n))], [0], []), 1);
      expect(countRz(out)).toBe(0);
      expect(countT(out)).toBe(Math.abs(k) % 2);
    }
    expect(checkOp(gateOp("rz", [anglePi(rational(2n))], [0], []), 1)).toEqual([]);
    expect(checkOp(gateOp("gphase", [anglePi(rational(1n, 3n))], [], []), 2)).toEqual([]);
  });

  it("rz(2 pi) under a control is not dropped (it is -I, a relative phase)", () => {
    const out = checkOp(gateOp("rz", [anglePi(rational(2n))], [0, 1], [true]), 2);
    expect(out.length).toBeGreaterThan(0);
  });

  it("the Toffoli is the exact 7-T network and the Clifford controlled gates use no rotation", () => {
    const ccx = checkOp(gateOp("ccx", [], [2, 0, 1], []), 3);
    expect(countT(ccx)).toBe(7); // the standard Toffoli network has T-count 7 (common practice, no source)
    expect(countRz(ccx)).toBe(0);
    for (const g of ["cx", "cz", "cy", "swap"]) expect(countT(checkOp(gateOp(g, [], [1, 0], []), 2)), g).toBe(0);
    for (const g of ["ch", "csx", "cswap"]) expect(countRz(checkOp(gateOp(g, [], g === "cswap" ? [2, 0, 1] : [1, 0], []), g === "cswap" ? 3 : 2)), g).toBe(0);
  });

  it("controlled S and T: cs is exact Clifford+T, ct needs rotations by pi/8", () => {
    expect(countRz(checkOp(gateOp("s", [], [0, 1], [true]), 2))).toBe(0);
    const ct = checkOp(gateOp("t", [], [0, 1], [true]), 2);
    expect(countRz(ct)).toBeGreaterThan(0);
    for (const o of ct) if (o.name === "rz") expect(o.params[0]!.pi!.den).toBe(8n);
  });

  it("crz(pi/2), cp(pi/2) and ccz are exact; continuous angles stay rz with exact halves", () => {
    expect(countRz(checkOp(gateOp("crz", [anglePi(rational(1n, 2n))], [0, 1], []), 2))).toBe(0);
    expect(countRz(checkOp(gateOp("cp", [anglePi(rational(1n, 2n))], [1, 0], []), 2))).toBe(0);
    expect(countRz(checkOp(gateOp("z", [], [0, 1, 2], [true, true]), 3))).toBe(0);
    const crz = checkOp(gateOp("crz", [anglePi(rational(1n, 3n))], [0, 1], []), 2);
    const angles = crz.filter((o) => o.name === "rz").map((o) => o.params[0]!.pi);
    expect(angles).toEqual([rational(1n, 6n), rational(-1n, 6n)]);
  });

  it("multi-controlled X without ancilla uses few rotations, all exact multiples of pi", () => {
    const c3x = checkOp(gateOp("c3x", [], [3, 1, 0, 2], []), 4);
    expect(countRz(c3x)).toBeLessThanOrEqual(3);
    for (const o of c3x) if (o.name === "rz") expect(o.params[0]!.pi).not.toBeNull();
    const c4x = checkOp(gateOp("c4x", [], [0, 1, 2, 3, 4], []), 5);
    expect(countRz(c4x)).toBeGreaterThan(0);
    for (const o of c4x) if (o.name === "rz") expect(o.params[0]!.pi).not.toBeNull();
  });

  it("with borrowed idle qubits, multi-controlled X becomes an exact Toffoli network", () => {
    // Barenco et al. (1995), Lemmas 7.2-7.3 (from memory): dirty ancillas are returned to their state
    const c3x = checkOp(gateOp("c3x", [], [0, 1, 2, 3], []), 5, true);
    expect(countRz(c3x)).toBe(0);
    const c4x = checkOp(gateOp("c4x", [], [4, 0, 3, 1, 2], []), 6, true);
    expect(countRz(c4x)).toBe(0);
    const c5x = checkOp(gateOp("x", [], [0, 1, 2, 3, 4, 5], [true, true, true, true, true]), 7, true);
    expect(countRz(c5x)).toBe(0);
    // and nothing borrowed when the option is off: every op stays on the gate's qubits
    const own = checkOp(gateOp("c3x", [], [0, 1, 2, 3], []), 5, false);
    for (const o of own) for (const q of o.qubits) expect(q).toBeLessThan(4);
  });

  it("negctrl is X conjugation and matches the negative-control matrix", () => {
    const out = checkOp(gateOp("cp", [angleDecimal("0.3")], [0, 1, 2], [false]), 3);
    expect(out[0]).toMatchObject({ name: "x", qubits: [0] });
    checkOp(gateOp("h", [], [2, 0, 1], [false, false]), 3);
    checkOp(gateOp("U", [angleDecimal("0.4"), angleDecimal("-1.2"), angleDecimal("2.5")], [3, 1, 0, 2], [false, true, false]), 4);
  });

  it("more controls than the dense check usually sees: ctrl^5 @ rz and ctrl^3 @ cu on 6 qubits", () => {
    checkOp(randomOp("rz", 5, 6, false), 6);
    checkOp(randomOp("cu", 3, 6, false), 6);
    checkOp(randomOp("swap", 4, 6, true), 6);
  });
});

describe("decompose: circuit structure", () => {
  it("keeps non-gate statements and blocks, decomposing inside them", () => {
    const loc2: SourceLoc = { file: "lab.qasm", line: 9, col: 1 };
    const body: Stmt[] = [
      gateOp("ch", [], [0, 1], []),
      { kind: "measure", qubit: 0, bit: { reg: "c", index: 0 }, loc: loc2 },
      {
        kind: "if",
        cond: { k: "bit", bit: { reg: "c", index: 0 } },
        then: [gateOp("ccx", [], [0, 1, 2], [])],
        else: [{ kind: "box", duration: null, body: [gateOp("crx", [angleDecimal("0.25")], [2, 1], [])], loc: loc2 }],
        loc: loc2,
      },
      { kind: "while", cond: { k: "bool", value: false }, body: [gateOp("id", [], [1], []), { kind: "reset", qubit: 2, loc: loc2 }], loc: loc2 },
      { kind: "barrier", qubits: [0, 1, 2], loc: loc2 },
    ];
    const out = decompose(circuitOf(3, body), {});
    const kinds = out.body.map((s) => s.kind);
    expect(kinds.filter((k) => k !== "gate")).toEqual(["measure", "if", "while", "barrier"]);
    const ifBlock = out.body.find((s) => s.kind === "if")!;
    if (ifBlock.kind !== "if") throw new Error("unreachable");
    checkBasis(ifBlock.then);
    expect(diffUpToPhase(unitaryOf(ifBlock.then, 3), reference(gateOp("ccx", [], [0, 1, 2], []), 3))).toBeLessThan(TOL);
    const box = ifBlock.else[0]!;
    expect(box.kind).toBe("box");
    if (box.kind !== "box") throw new Error("unreachable");
    checkBasis(box.body);
    const wh = out.body.find((s) => s.kind === "while")!;
    if (wh.kind !== "while") throw new Error("unreachable");
    expect(wh.body.map((s) => s.kind)).toEqual(["reset"]); // id dropped
    expect(out.numQubits).toBe(3);
    expect(out.bits).toEqual(circuitOf(3, []).bits);
  });

  it("is deterministic", () => {
    const body: Stmt[] = [randomOp("c4x", 0, 5, false), randomOp("cu", 2, 5, false), randomOp("rc3x", 1, 5, false)];
    const a = JSON.stringify(decompose(circuitOf(5, body), {}), (_, v) => (typeof v === "bigint" ? v.toString() : v));
    const b = JSON.stringify(decompose(circuitOf(5, body), {}), (_, v) => (typeof v === "bigint" ? v.toString() : v));
    expect(a).toBe(b);
  });

  it("reports an unknown gate or a wrong arity as a diagnostic at the op", () => {
    expect(() => decomposeOp(gateOp("frobnicate", [], [0], []))).toThrow(DiagnosticError);
    try {
      decomposeOp(gateOp("rz", [], [0], []));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(DiagnosticError);
      expect((e as DiagnosticError).diagnostics[0]).toMatchObject({ file: "lab.qasm", line: 7, col: 3 });
    }
  });
});

describe("decompose: many controls (the recursions past the small cases)", () => {
  it("ctrl^6 @ x on 7 qubits without ancilla", () => {
    const out = checkOp(gateOp("x", [], [3, 0, 1, 5, 2, 6, 4], [true, true, false, true, true, true]), 7);
    for (const o of out) if (o.name === "rz") expect(o.params[0]!.pi).not.toBeNull();
  });

  it("ctrl^6 @ rz and ctrl^5 @ U on 7 qubits", () => {
    checkOp(randomOp("rz", 6, 7, false), 7);
    checkOp(randomOp("U", 5, 7, false), 7);
  });

  it("borrowing: the chain (k - 2 free qubits) and the split (one free qubit) for 4 and 5 controls", () => {
    for (const [k, n] of [[4, 7], [5, 9], [5, 7], [6, 8]] as const) {
      const qubits = shuffle(Array.from({ length: n }, (_, i) => i)).slice(0, k + 1);
      const out = checkOp(gateOp("x", [], qubits, new Array<boolean>(k).fill(true)), n, true);
      expect(countRz(out), `C${k}X on ${n}`).toBe(0);
    }
  });
});
