// Pass: rewrite every gate, with its ctrl/negctrl lists, into {h s sdg x y z cx t tdg rz U}, exact up to one global phase.
import type { Angle, Rational } from "../ir/angle.js";
import type { Circuit, GateOp, SourceLoc, Stmt } from "../ir/circuit.js";
import { angleAdd, angleNeg, anglePi, angleScale, angleSub, angleValue, rational, ZERO_ANGLE } from "../ir/angle-ops.js";
import { gateInfo } from "../ir/gates.js";
import { DiagnosticError } from "../frontend/diagnostics.js";
import type { PassContext } from "./context.js";

/** The gates the pass emits (never with controls). */
export const DECOMPOSED_BASIS: ReadonlySet<string> = new Set(["h", "s", "sdg", "x", "y", "z", "cx", "t", "tdg", "rz", "U"]);

/**
 * Decompose every gate of the circuit (inside if/while/box blocks too) into DECOMPOSED_BASIS.
 * Each operation is replaced by ops whose product equals its matrix up to a global phase of that
 * operation alone; controls are handled from the exact matrices (global phase included), so
 * `ctrl @` never sees a dropped phase. Non-gate statements are kept; every produced op carries the
 * source location of the op it came from. An rz whose angle is an exact multiple of pi/4 is emitted
 * as its Clifford+T word (rz(k pi/4) = e^{-ik pi/8} T^k).
 */
export function decompose(circuit: Circuit, ctx: PassContext): Circuit {
  const all = Array.from({ length: circuit.numQubits }, (_, i) => i);
  const visit = (body: readonly Stmt[]): Stmt[] => {
    const out: Stmt[] = [];
    for (const s of body) {
      switch (s.kind) {
        case "gate": {
          const borrow = ctx.borrowIdleQubits ? all.filter((q) => !s.qubits.includes(q)) : [];
          for (const op of decomposeOp(s, borrow)) out.push(op);
          break;
        }
        case "if":
          out.push({ ...s, then: visit(s.then), else: visit(s.else) });
          break;
        case "while":
        case "box":
          out.push({ ...s, body: visit(s.body) });
          break;
        default:
          out.push(s);
      }
    }
    return out;
  };
  return { ...circuit, body: visit(circuit.body) };
}

/**
 * The basis ops for one gate op, equal to it up to global phase. `borrow` lists qubits outside the op
 * that multi-controlled X may use as dirty ancillas (empty: stay on the op's own qubits).
 */
export function decomposeOp(op: GateOp, borrow: readonly number[] = []): GateOp[] {
  const info = gateInfo(op.name);
  const fail = (message: string): never => {
    throw new DiagnosticError([{ severity: "error", file: op.loc.file, line: op.loc.line, col: op.loc.col, message }]);
  };
  if (!info) return fail(`decompose: unknown gate '${op.name}'`);
  if (op.params.length !== info.numParams) return fail(`decompose: gate '${op.name}' takes ${info.numParams} parameters, got ${op.params.length}`);
  if (op.qubits.length !== op.ctrl.length + info.numQubits)
    return fail(`decompose: gate '${op.name}' with ${op.ctrl.length} controls needs ${op.ctrl.length + info.numQubits} qubits, got ${op.qubits.length}`);
  const e = new Emitter(op.loc, borrow);
  const negs = op.qubits.slice(0, op.ctrl.length).filter((_, i) => !op.ctrl[i]);
  for (const q of negs) e.g("x", q);
  e.gate(op.name, op.params, op.qubits.slice(0, op.ctrl.length), op.qubits.slice(op.ctrl.length));
  for (const q of negs) e.g("x", q);
  return e.out;
}

// ---------------------------------------------------------------------------------------------
// Angles.

const pi = (num: bigint, den: bigint = 1n): Angle => anglePi(rational(num, den));
const half = (a: Angle): Angle => angleScale(a, rational(1n, 2n));

function isZero(a: Angle): boolean {
  return a.pi ? a.pi.num === 0n : angleValue(a).isZero();
}

/** k in 0..7 when a = k pi/4 (mod 2 pi) exactly, else null. */
function quarterTurns(a: Angle): number | null {
  if (a.pi === null) return isZero(a) ? 0 : null;
  if (4n % a.pi.den !== 0n) return null;
  const k = (a.pi.num * (4n / a.pi.den)) % 8n;
  return Number(k < 0n ? k + 8n : k);
}

/** A key for the cost class of an angle: its exact pi-fraction, or "r" for any other real. */
function angleKey(a: Angle): string {
  if (a.pi) return `${a.pi.num}/${a.pi.den}`;
  return isZero(a) ? "0/1" : "r";
}

/** Cost of a candidate: [approximated rotations, T gates, all gates], compared in that order. */
function cost(ops: readonly GateOp[]): [number, number, number] {
  let approx = 0;
  let t = 0;
  for (const o of ops) {
    if (o.name === "rz") approx += 1;
    else if (o.name === "U") approx += 3;
    else if (o.name === "t" || o.name === "tdg") t += 1;
  }
  return [approx, t, ops.length];
}

function cheaper(a: [number, number, number], b: [number, number, number]): boolean {
  for (let i = 0; i < 3; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return false;
}

/** Which candidate won, per problem shape (structure depends only on the shape, not on qubit labels). */
const CHOICES = new Map<string, number>();

// ---------------------------------------------------------------------------------------------
// The emitter: exact constructions for controlled gates.

/**
 * Collects the ops of one decomposition. Invariant: every op it holds is an uncontrolled basis gate
 * carrying the source location of the op being decomposed, and it touches only that op's qubits and
 * the borrowable ones (which every construction returns to their state).
 */
class Emitter {
  readonly out: GateOp[] = [];
  constructor(
    private readonly loc: SourceLoc,
    private readonly borrow: readonly number[],
  ) {}

  /** An uncontrolled basis gate. */
  g(name: string, ...qubits: number[]): void {
    this.out.push({ kind: "gate", name, params: [], qubits, ctrl: [], loc: this.loc });
  }

  /** rz(a) up to phase: nothing for a multiple of 2 pi, the Clifford+T word for k pi/4, else rz. */
  rz(q: number, a: Angle): void {
    const k = quarterTurns(a);
    if (k === null) {
      this.out.push({ kind: "gate", name: "rz", params: [a], qubits: [q], ctrl: [], loc: this.loc });
      return;
    }
    const words: readonly (readonly string[])[] = [[], ["t"], ["s"], ["s", "t"], ["z"], ["z", "t"], ["sdg"], ["tdg"]];
    for (const w of words[k]!) this.g(w, q);
  }

  /** rx(a) = H rz(a) H. */
  rx(q: number, a: Angle): void {
    if (quarterTurns(a) === 0) return;
    this.g("h", q);
    this.rz(q, a);
    this.g("h", q);
  }

  /** ry(a) = S H rz(a) H S^dag (circuit order: sdg h rz h s). */
  ry(q: number, a: Angle): void {
    if (quarterTurns(a) === 0) return;
    this.g("sdg", q);
    this.g("h", q);
    this.rz(q, a);
    this.g("h", q);
    this.g("s", q);
  }

  /** Run `body` on a scratch emitter and return its ops (for comparing candidates). */
  private trial(body: (e: Emitter) => void): GateOp[] {
    const e = new Emitter(this.loc, this.borrow);
    body(e);
    return e.out;
  }

  /** Emit the cheapest of the candidates, remembering the winner for this problem shape. */
  private choose(key: string, candidates: readonly ((e: Emitter) => void)[]): void {
    const known = CHOICES.get(key);
    if (known !== undefined) {
      candidates[known]!(this);
      return;
    }
    let best = -1;
    let bestOps: GateOp[] = [];
    let bestCost: [number, number, number] = [Infinity, Infinity, Infinity];
    candidates.forEach((c, i) => {
      const ops = this.trial(c);
      const k = cost(ops);
      if (best < 0 || cheaper(k, bestCost)) {
        best = i;
        bestOps = ops;
        bestCost = k;
      }
    });
    CHOICES.set(key, best);
    for (const o of bestOps) this.out.push(o);
  }

  /** The canonical gate `name` on `targets`, under positive controls `ctrls`, exactly (up to global phase of the whole). */
  gate(name: string, params: readonly Angle[], ctrls: readonly number[], targets: readonly number[]): void {
    const p = (i: number): Angle => params[i]!;
    const q = targets[0]!;
    const withCtrl = (base: string, bp: readonly Angle[], k: number): void =>
      this.gate(base, bp, [...ctrls, ...targets.slice(0, k)], targets.slice(k));
    switch (name) {
      case "id":
        return;
      case "gphase":
        return this.mcPhase(ctrls, p(0), []);
      case "p":
      case "u1":
        return this.mcPhase([...ctrls, q], p(0), []);
      case "x":
        return this.mcx(ctrls, q, []);
      case "y":
        // Y = S X S^dag
        this.g("sdg", q);
        this.mcx(ctrls, q, []);
        this.g("s", q);
        return;
      case "z":
        return this.mcz(ctrls, q);
      case "h":
        if (ctrls.length === 0) return this.g("h", q);
        // H = ry(pi/4) Z ry(-pi/4)
        this.ry(q, pi(-1n, 4n));
        this.mcz(ctrls, q);
        this.ry(q, pi(1n, 4n));
        return;
      case "s":
      case "sdg":
      case "t":
      case "tdg": {
        if (ctrls.length === 0) return this.g(name, q);
        const quarter: Readonly<Record<string, Rational>> = { s: rational(1n, 2n), sdg: rational(-1n, 2n), t: rational(1n, 4n), tdg: rational(-1n, 4n) };
        return this.mcPhase([...ctrls, q], anglePi(quarter[name]!), []);
      }
      case "sx":
      case "sxdg":
        // sx = H S H exactly
        this.g("h", q);
        this.mcPhase([...ctrls, q], pi(name === "sx" ? 1n : -1n, 2n), []);
        this.g("h", q);
        return;
      case "rz":
        return this.mcRz(ctrls, q, p(0), []);
      case "rx":
        if (ctrls.length === 0) return this.rx(q, p(0));
        this.g("h", q);
        this.mcRz(ctrls, q, p(0), []);
        this.g("h", q);
        return;
      case "ry":
        if (ctrls.length === 0) return this.ry(q, p(0));
        this.g("sdg", q);
        this.g("h", q);
        this.mcRz(ctrls, q, p(0), []);
        this.g("h", q);
        this.g("s", q);
        return;
      case "U":
        // U(t, f, l) = e^{i(f+l)/2} u3(t, f, l)
        if (isZero(p(0))) return this.mcPhase([...ctrls, q], angleAdd(p(1), p(2)), []);
        return this.mcU(ctrls, q, p(0), p(1), p(2), half(angleAdd(p(1), p(2))));
      case "u3":
        if (isZero(p(0))) return this.mcRz(ctrls, q, angleAdd(p(1), p(2)), []);
        return this.mcU(ctrls, q, p(0), p(1), p(2), ZERO_ANGLE);
      case "u2":
        return this.mcU(ctrls, q, pi(1n, 2n), p(0), p(1), ZERO_ANGLE);
      case "cx":
      case "ccx":
      case "c3x":
      case "c4x":
        return withCtrl("x", [], targets.length - 1);
      case "cy":
        return withCtrl("y", [], 1);
      case "cz":
        return withCtrl("z", [], 1);
      case "ch":
        return withCtrl("h", [], 1);
      case "csx":
        return withCtrl("sx", [], 1);
      case "c3sqrtx":
        return withCtrl("sx", [], 3);
      case "c3sqrtxdg":
        return withCtrl("sxdg", [], 3);
      case "cp":
        return withCtrl("p", params, 1);
      case "crx":
        return withCtrl("rx", params, 1);
      case "cry":
        return withCtrl("ry", params, 1);
      case "crz":
        return withCtrl("rz", params, 1);
      case "cswap":
        return withCtrl("swap", [], 1);
      case "cu": {
        // cu(t, f, l, g) = ctrl @ (e^{i g} U(t, f, l))
        const cs = [...ctrls, q];
        this.mcPhase(cs, p(3), []);
        this.gate("U", [p(0), p(1), p(2)], cs, [targets[1]!]);
        return;
      }
      case "swap": {
        const [a, b] = [q, targets[1]!];
        this.g("cx", b, a);
        this.mcx([...ctrls, a], b, []);
        this.g("cx", b, a);
        return;
      }
      case "rzz":
        return this.pauliPair(ctrls, q, targets[1]!, p(0), [], []);
      case "rxx":
        return this.pauliPair(ctrls, q, targets[1]!, p(0), ["h"], ["h"]);
      case "ryy":
        return this.pauliPair(ctrls, q, targets[1]!, p(0), ["sdg", "h"], ["sdg", "h"]);
      case "rzx":
        return this.pauliPair(ctrls, q, targets[1]!, p(0), [], ["h"]);
      case "rccx":
      case "rc3x":
      case "rc3xdg":
        return this.network(RELATIVE_TOFFOLIS[name]!, ctrls, targets);
    }
    throw new RangeError(`decompose: no rule for gate '${name}'`);
  }

  /** exp(-i t/2 P(x)Q) = V (cx a,b; rz(t) b; cx a,b) V^dag with V mapping Z to P on a and to Q on b (`pre` lists V^dag's gates in circuit order). */
  private pauliPair(ctrls: readonly number[], a: number, b: number, t: Angle, preA: readonly string[], preB: readonly string[]): void {
    const inverse: Readonly<Record<string, string>> = { h: "h", sdg: "s" };
    for (const g of preA) this.g(g, a);
    for (const g of preB) this.g(g, b);
    this.g("cx", a, b);
    this.mcRz(ctrls, b, t, []);
    this.g("cx", a, b);
    for (const g of [...preA].reverse()) this.g(inverse[g]!, a);
    for (const g of [...preB].reverse()) this.g(inverse[g]!, b);
  }

  /** A fixed network of canonical gates (on indices into `targets`), each gate taken under the controls. */
  private network(net: readonly (readonly [string, ...number[]])[], ctrls: readonly number[], targets: readonly number[]): void {
    for (const [name, ...idx] of net) this.gate(name, [], ctrls, idx.map((i) => targets[i]!));
  }

  /** Qubits free to serve as dirty ancillas: the borrowable ones plus those passed down. */
  private dirty(extra: readonly number[], busy: readonly number[]): number[] {
    return [...extra, ...this.borrow].filter((q, i, arr) => !busy.includes(q) && arr.indexOf(q) === i);
  }

  /** ctrl^n @ z on t (symmetric in all its qubits). */
  private mcz(ctrls: readonly number[], t: number): void {
    if (ctrls.length === 0) return this.g("z", t);
    this.choose(`z|${ctrls.length}|${this.dirty([], [...ctrls, t]).length}`, [
      (e) => {
        e.g("h", t);
        e.mcx(ctrls, t, []);
        e.g("h", t);
      },
      (e) => e.mcPhase([...ctrls, t], pi(1n), []),
    ]);
  }

  /** Multi-controlled X: exact Toffoli networks when enough dirty qubits are free, else square-root recursion. */
  mcx(ctrls: readonly number[], t: number, extraDirty: readonly number[]): void {
    const k = ctrls.length;
    if (k === 0) return this.g("x", t);
    if (k === 1) return this.g("cx", ctrls[0]!, t);
    if (k === 2) return this.toffoli(ctrls[0]!, ctrls[1]!, t);
    const free = this.dirty(extraDirty, [...ctrls, t]);
    if (free.length >= k - 2) return this.mcxChain(ctrls, t, free.slice(0, k - 2));
    if (free.length >= 1) return this.mcxSplit(ctrls, t, free[0]!);
    const cands: ((e: Emitter) => void)[] = [
      // Barenco et al. (1995), Lemma 7.5 with W = sx: the inner C^{k-1}X may borrow t.
      (e) => {
        const last = ctrls[k - 1]!;
        const rest = ctrls.slice(0, k - 1);
        e.gate("sx", [], [last], [t]);
        e.mcxAround(rest, last, [t], () => e.gate("sxdg", [], [last], [t]));
        e.g("h", t);
        e.mcPhase([...rest, t], pi(1n, 2n), [last]);
        e.g("h", t);
      },
    ];
    // X = H Z H with ctrl^k @ z as a parity network (not through mcPhase: its split form calls back here)
    if (k + 1 <= 5)
      cands.push((e) => {
        e.g("h", t);
        e.phaseParities([...ctrls, t], pi(1n));
        e.g("h", t);
      });
    this.choose(`x|${k}`, cands);
  }

  /**
   * C^kX, middle, C^kX, where the middle never changes the value of a qubit of the C^kX (it may act on
   * other qubits conditioned on them, or by a diagonal gate on them). Then MCX middle MCX commutes with
   * any diagonal D on those qubits, so a relative-phase R = MCX D and its inverse may stand in for the
   * pair: R middle R^dag = D^dag (MCX middle MCX) D = MCX middle MCX. R is qelib1's rccx (4 T, self-
   * inverse) for two controls and rc3x / its inverse (8 T, no rotation) for three.
   */
  private mcxAround(ctrls: readonly number[], t: number, extraDirty: readonly number[], middle: () => void): void {
    const k = ctrls.length;
    if (k === 2) {
      this.rccx(ctrls[0]!, ctrls[1]!, t);
      middle();
      this.rccx(ctrls[0]!, ctrls[1]!, t);
      return;
    }
    if (k === 3) {
      const qs = [...ctrls, t];
      this.network(RELATIVE_TOFFOLIS.rc3x!, [], qs);
      middle();
      this.network(RELATIVE_TOFFOLIS.rc3xdg!, [], qs);
      return;
    }
    this.mcx(ctrls, t, extraDirty);
    middle();
    this.mcx(ctrls, t, extraDirty);
  }

  /** The exact 7-T Toffoli network (h on the target around a phase network on a, b, c). */
  private toffoli(a: number, b: number, c: number): void {
    this.g("h", c);
    this.g("cx", b, c);
    this.g("tdg", c);
    this.g("cx", a, c);
    this.g("t", c);
    this.g("cx", b, c);
    this.g("tdg", c);
    this.g("cx", a, c);
    this.g("t", b);
    this.g("t", c);
    this.g("h", c);
    this.g("cx", a, b);
    this.g("t", a);
    this.g("tdg", b);
    this.g("cx", a, b);
  }

  /**
   * The relative-phase Toffoli (qelib1's rccx network, 4 T): a Toffoli followed by a diagonal phase,
   * self-inverse (its matrix is Hermitian).
   */
  private rccx(a: number, b: number, c: number): void {
    this.g("h", c);
    this.g("t", c);
    this.g("cx", b, c);
    this.g("tdg", c);
    this.g("cx", a, c);
    this.g("t", c);
    this.g("cx", b, c);
    this.g("tdg", c);
    this.g("h", c);
  }

  /**
   * C^k X with k - 2 dirty ancillas (Barenco et al. 1995, Lemma 7.2, from memory): 4(k - 2) Toffolis.
   * M toggles a[k-3] by c0...c[k-2] (leaving the other ancillas toggled); M twice restores them.
   * M is a palindrome of self-inverse gates, so M^2 = I even when they are relative-phase Toffolis:
   * M' = M D for a diagonal D, and the phases of the two M' (which never touch t) cancel, as
   * M'^2 = I. Only the two Toffolis onto t must be exact.
   */
  private mcxChain(c: readonly number[], t: number, a: readonly number[]): void {
    const k = c.length;
    const m = (): void => {
      for (let i = k - 2; i >= 2; i--) this.rccx(c[i]!, a[i - 2]!, a[i - 1]!);
      this.rccx(c[0]!, c[1]!, a[0]!);
      for (let i = 2; i <= k - 2; i++) this.rccx(c[i]!, a[i - 2]!, a[i - 1]!);
    };
    this.toffoli(c[k - 1]!, a[k - 3]!, t);
    m();
    this.toffoli(c[k - 1]!, a[k - 3]!, t);
    m();
  }

  /** C^k X with one dirty ancilla (Barenco et al. 1995, Lemma 7.3): two halves, each borrowing the other's qubits. */
  private mcxSplit(c: readonly number[], t: number, a: number): void {
    const k1 = Math.ceil(c.length / 2);
    const c1 = c.slice(0, k1);
    const c2 = [...c.slice(k1), a];
    this.mcxAround(c1, a, [...c2, t], () => this.mcx(c2, t, c1));
    this.mcx(c2, t, c1);
  }

  /** The phase e^{i l} on the all-ones state of `qs` (ctrl^(m-1) @ p(l); m = 0 is a global phase). */
  mcPhase(qs: readonly number[], l: Angle, extraDirty: readonly number[]): void {
    const m = qs.length;
    if (m === 0 || quarterTurns(l) === 0) return;
    if (m === 1) return this.rz(qs[0]!, l);
    const t = qs[m - 1]!;
    if (m === 2) {
      // cp(l) = p(l/2) a; cx a,b; p(-l/2) b; cx a,b; p(l/2) b (p = rz up to phase, uncontrolled)
      const a = qs[0]!;
      const h = half(l);
      this.rz(a, h);
      this.rz(t, h);
      this.g("cx", a, t);
      this.rz(t, angleNeg(h));
      this.g("cx", a, t);
      return;
    }
    const rest = qs.slice(0, m - 1);
    const cands: ((e: Emitter) => void)[] = [
      // split: e^{i l x1..xm} = e^{i l/2 x1..x(m-1)} * ctrl^(m-1) @ rz(l) on xm
      (e) => {
        e.mcPhase(rest, half(l), extraDirty);
        e.mcRzFlip(rest, t, l, extraDirty);
      },
      // Barenco et al. (1995), Lemma 7.5 with W = p(l/2): the inner C^(m-2)X may borrow t.
      (e) => {
        const c = qs[m - 2]!;
        const front = qs.slice(0, m - 2);
        e.mcPhase([c, t], half(l), []);
        e.mcxAround(front, c, [...extraDirty, t], () => e.mcPhase([c, t], angleNeg(half(l)), []));
        e.mcPhase([...front, t], half(l), [...extraDirty, c]);
      },
    ];
    if (m <= 5) cands.push((e) => e.phaseParities(qs, l));
    this.choose(`p|${m}|${angleKey(l)}|${this.dirty(extraDirty, qs).length}`, cands);
  }

  /**
   * e^{i l x1...xm} as a sum over parities: x1...xm = 2^(1-m) sum over non-empty S of (-1)^(|S|+1) xor(S),
   * and e^{i a y} = rz(a) on the parity y up to phase (the Gray-code phase network).
   */
  private phaseParities(qs: readonly number[], l: Angle): void {
    const m = qs.length;
    const unit = angleScale(l, rational(1n, 1n << BigInt(m - 1)));
    for (let mask = 1; mask < 1 << m; mask++) {
      const members = qs.filter((_, i) => (mask >> i) & 1);
      const size = members.length;
      const top = members[size - 1]!;
      const fan = members.slice(0, size - 1);
      for (const q of fan) this.g("cx", q, top);
      this.rz(top, size % 2 === 1 ? unit : angleNeg(unit));
      for (const q of [...fan].reverse()) this.g("cx", q, top);
    }
  }

  /** ctrl^n @ rz(a) on t, by rz(a/2) X rz(-a/2) X around C^nX. */
  private mcRzFlip(ctrls: readonly number[], t: number, a: Angle, extraDirty: readonly number[]): void {
    const h = half(a);
    this.rz(t, h);
    this.mcxAround(ctrls, t, extraDirty, () => this.rz(t, angleNeg(h)));
  }

  /** ctrl^n @ rz(a) on t. */
  mcRz(ctrls: readonly number[], t: number, a: Angle, extraDirty: readonly number[]): void {
    const n = ctrls.length;
    if (isZero(a) || (a.pi !== null && a.pi.den === 1n && a.pi.num % 4n === 0n)) return; // rz(4k pi) = I, even under control
    if (n === 0) return this.rz(t, a);
    if (n === 1) return this.mcRzFlip(ctrls, t, a, extraDirty);
    this.choose(`rz|${n}|${angleKey(a)}|${this.dirty(extraDirty, [...ctrls, t]).length}`, [
      (e) => e.mcRzFlip(ctrls, t, a, extraDirty),
      // Barenco et al. (1995), Lemma 7.5 with W = rz(a/2)
      (e) => {
        const last = ctrls[n - 1]!;
        const rest = ctrls.slice(0, n - 1);
        e.mcRz([last], t, half(a), []);
        e.mcxAround(rest, last, [...extraDirty, t], () => e.mcRz([last], t, angleNeg(half(a)), []));
        e.mcRz(rest, t, half(a), [...extraDirty, last]);
      },
      // rz(a) = e^{-ia/2} p(a)
      (e) => {
        e.mcPhase([...ctrls, t], a, extraDirty);
        e.mcPhase(ctrls, angleNeg(half(a)), [...extraDirty, t]);
      },
    ]);
  }

  /**
   * ctrl^n @ (e^{i alpha} u3(theta, phi, lambda)) on t, where u3 = rz(phi) ry(theta) rz(lambda) (det 1).
   * Uncontrolled: U(theta, phi, lambda). Controlled: Nielsen & Chuang, Corollary 4.2 (from memory):
   * V = e^{i alpha} A X B X C with A = rz(phi) ry(theta/2), B = ry(-theta/2) rz(-(lambda+phi)/2),
   * C = rz((lambda-phi)/2), ABC = I; the phase becomes ctrl^(n-1) @ p(alpha) on the controls.
   */
  private mcU(ctrls: readonly number[], t: number, theta: Angle, phi: Angle, lambda: Angle, alpha: Angle): void {
    if (ctrls.length === 0) {
      this.out.push({ kind: "gate", name: "U", params: [theta, phi, lambda], qubits: [t], ctrl: [], loc: this.loc });
      return;
    }
    this.rz(t, half(angleSub(lambda, phi)));
    this.mcx(ctrls, t, []);
    this.rz(t, angleNeg(half(angleAdd(lambda, phi))));
    this.ry(t, angleNeg(half(theta)));
    this.mcx(ctrls, t, []);
    this.ry(t, half(theta));
    this.rz(t, phi);
    this.mcPhase(ctrls, alpha, [t]);
  }
}

/**
 * qelib1's relative-phase Toffolis as exact networks of canonical gates (indices into the op's qubits;
 * from memory of qelib1.inc, matrices checked in test/frontend/libraries.test.ts). rc3xdg is rc3x reversed
 * with t and tdg exchanged.
 */
const RC3X_NET: readonly (readonly [string, ...number[]])[] = [
  ["h", 3], ["t", 3], ["cx", 2, 3], ["tdg", 3], ["h", 3],
  ["cx", 0, 3], ["t", 3], ["cx", 1, 3], ["tdg", 3],
  ["cx", 0, 3], ["t", 3], ["cx", 1, 3], ["tdg", 3],
  ["h", 3], ["t", 3], ["cx", 2, 3], ["tdg", 3], ["h", 3],
];
const INVERSE_OF: Readonly<Record<string, string>> = { t: "tdg", tdg: "t", h: "h", cx: "cx" };
const RELATIVE_TOFFOLIS: Readonly<Record<string, readonly (readonly [string, ...number[]])[]>> = {
  rccx: [["h", 2], ["t", 2], ["cx", 1, 2], ["tdg", 2], ["cx", 0, 2], ["t", 2], ["cx", 1, 2], ["tdg", 2], ["h", 2]],
  rc3x: RC3X_NET,
  rc3xdg: [...RC3X_NET].reverse().map(([g, ...q]) => [INVERSE_OF[g]!, ...q] as const),
};
