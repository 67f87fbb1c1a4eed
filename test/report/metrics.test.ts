import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computeMetrics } from "../../src/report/metrics.js";
import type { Stmt } from "../../src/ir/circuit.js";
import { barrier, boxBlock, circuit, gate, ifBlock, lit, measure, pi, reset, whileBlock } from "./circuits.js";

const t = (q: number) => gate("t", [q]);
const tdg = (q: number) => gate("tdg", [q]);
const h = (q: number) => gate("h", [q]);
const x = (q: number) => gate("x", [q]);
const cx = (a: number, b: number) => gate("cx", [a, b]);

describe("computeMetrics on hand-built circuits", () => {
  it("gives zeros for an empty circuit, one row per qubit", () => {
    const m = computeMetrics(circuit(3, []));
    expect(m).toMatchObject({ qubits: 3, gates: 0, tCount: 0, tDepth: 0, depth: 0, cxCount: 0, cliffordCount: 0, rotations: 0, conditionalOps: 0 });
    expect(m.perQubit.map((q) => q.label)).toEqual(["q[0]", "q[1]", "q[2]"]);
    expect(Object.keys(m.gateCounts)).toEqual([]);
  });

  it("counts a T chain on one qubit: each T is one more T layer, h adds a layer but no T layer", () => {
    // t, t, h, tdg on q0: 3 T gates in series -> T-depth 3; 4 gates in series -> depth 4.
    const m = computeMetrics(circuit(1, [t(0), t(0), h(0), tdg(0)]));
    expect(m.tCount).toBe(3);
    expect(m.tDepth).toBe(3);
    expect(m.depth).toBe(4);
  });

  it("puts T gates on different qubits in one layer", () => {
    // t q0; t q1: no shared qubit, both at layer 1.
    const m = computeMetrics(circuit(2, [t(0), t(1)]));
    expect(m).toMatchObject({ tCount: 2, tDepth: 1, depth: 1 });
  });

  it("carries the T-level through a CX", () => {
    // t q0 (q0 level 1); cx q0,q1 (both level 1, clock 2); t q1 (q1 level 2, clock 3).
    const m = computeMetrics(circuit(2, [t(0), cx(0, 1), t(1)]));
    expect(m).toMatchObject({ tCount: 2, tDepth: 2, depth: 3, cxCount: 1 });
    expect(m.perQubit.map((q) => [q.tCount, q.tDepth])).toEqual([
      [1, 1],
      [1, 2],
    ]);
  });

  it("separates T-depth from depth", () => {
    // q0: t t (levels 1, 2). q1: t (1), cx q1,q2 joins q2 at level 1, clock 2; t q2: level 2, clock 3.
    const m = computeMetrics(circuit(3, [t(0), t(0), t(1), cx(1, 2), t(2)]));
    expect(m).toMatchObject({ tCount: 4, tDepth: 2, depth: 3 });
    // Three h in series and one t elsewhere: depth 3, T-depth 1.
    expect(computeMetrics(circuit(2, [h(0), h(0), h(0), t(1)]))).toMatchObject({ tDepth: 1, depth: 3 });
  });

  it("lets a barrier order the qubits it names without adding a layer", () => {
    // Without the barrier t q0 and t q1 share layer 1; with it, t q1 waits: layers 1 and 2.
    expect(computeMetrics(circuit(2, [t(0), t(1)]))).toMatchObject({ tDepth: 1, depth: 1 });
    expect(computeMetrics(circuit(2, [t(0), barrier([0, 1]), t(1)]))).toMatchObject({ tDepth: 2, depth: 2 });
    // A bare barrier (no qubits) covers every qubit.
    expect(computeMetrics(circuit(3, [t(0), barrier([]), t(2)]))).toMatchObject({ tDepth: 2, depth: 2 });
    // A barrier on other qubits changes nothing.
    expect(computeMetrics(circuit(3, [t(0), barrier([1, 2]), t(1)]))).toMatchObject({ tDepth: 1, depth: 1 });
  });

  it("gives measurements and resets a layer", () => {
    // h, measure, reset on q0: three layers.
    const m = computeMetrics(circuit(1, [h(0), measure(0), reset(0)]));
    expect(m).toMatchObject({ depth: 3, gates: 1, measurements: 1, resets: 1 });
  });

  it("counts both branches of an if once each and schedules the longer branch", () => {
    // h q0 (q0 clock 1). The if touches q1 only: then = 1 T, else = 2 T in series, so q1 ends
    // at clock 2 and T-level 2. t q2 at layer 1. Appearances: 4 T gates, 3 of them conditional.
    const m = computeMetrics(circuit(3, [h(0), ifBlock([t(1)], [t(1), t(1)]), t(2)]));
    expect(m).toMatchObject({ tCount: 4, tDepth: 2, depth: 2, conditionalOps: 3, gates: 5 });
    expect(m.perQubit[1]).toMatchObject({ tCount: 3, tDepth: 2 });
  });

  it("treats a block as a barrier on the qubits it touches", () => {
    // h q0; h q0 (q0 clock 2). The block touches q0 and q1: both synchronised to 2 on entry;
    // x q1 -> 3, x q0 -> 3; exit sync at 3; t q1 -> 4. Without the barrier rule x q1 would
    // run at layer 1 and t q1 at layer 2.
    const m = computeMetrics(circuit(3, [h(0), h(0), ifBlock([x(1), x(0)]), t(1), t(2)]));
    expect(m.depth).toBe(4);
    expect(m.perQubit[2].tDepth).toBe(1);
    // T-levels are synchronised too: t q0 inside the block raises q1's level on exit.
    const m2 = computeMetrics(circuit(2, [t(0), ifBlock([x(0), x(1)]), t(1)]));
    expect(m2.tDepth).toBe(2);
  });

  it("counts while bodies once and marks them conditional; a box alone is not conditional", () => {
    const m = computeMetrics(circuit(1, [whileBlock([t(0), measure(0)])]));
    expect(m).toMatchObject({ tCount: 1, conditionalOps: 2, depth: 2, measurements: 1 });
    const b = computeMetrics(circuit(1, [boxBlock([t(0), h(0)])]));
    expect(b).toMatchObject({ tCount: 1, conditionalOps: 0, depth: 2 });
    const nested = computeMetrics(circuit(1, [ifBlock([boxBlock([t(0)])]), boxBlock([ifBlock([h(0)])])]));
    expect(nested.conditionalOps).toBe(2);
  });

  it("classifies and counts gates by name, with control modifiers in the key", () => {
    const ops: Stmt[] = [
      gate("h", [0]),
      gate("s", [0]),
      gate("sdg", [0]),
      gate("x", [0]),
      gate("y", [0]),
      gate("z", [0]),
      gate("cx", [0, 1]),
      gate("cz", [0, 1]),
      gate("swap", [0, 1]),
      gate("x", [0, 1], [], [true]),
      gate("x", [0, 1], [], [false]),
      gate("x", [0, 1, 2], [], [true, true]),
      gate("z", [0, 1, 2], [], [true, false]),
      gate("ccx", [0, 1, 2]),
      gate("t", [2]),
      gate("rz", [1], [pi(1, 2)]),
      gate("rz", [1], [pi(1, 4)]),
      gate("rz", [1], [lit("0.3")]),
      gate("rx", [1], [pi(1, 3)]),
      gate("U", [1], [pi(1, 2), pi(0), pi(1)]),
      gate("cp", [0, 1], [pi(1)]),
      gate("gphase", [], [lit("0.3")]),
    ];
    const m = computeMetrics(circuit(3, ops));
    // Clifford: h s sdg x y z cx cz swap, ctrl@x, negctrl@x, rz(pi/2), U(pi/2,0,pi) (= h), cp(pi) (= cz).
    expect(m.cliffordCount).toBe(14);
    // CNOTs: cx and ctrl @ x (negctrl @ x is not a CNOT as written).
    expect(m.cxCount).toBe(2);
    // Open rotations: rz(0.3) and rx(pi/3); rz(pi/4) is exact, uncontrolled gphase is unobservable.
    expect(m.rotations).toBe(2);
    expect(m.tCount).toBe(1);
    expect(m.gates).toBe(ops.length);
    expect(m.gateCounts).toEqual({
      U: 1,
      ccx: 1,
      cp: 1,
      "ctrl @ negctrl @ z": 1,
      "ctrl @ x": 1,
      "ctrl(2) @ x": 1,
      cx: 1,
      cz: 1,
      gphase: 1,
      h: 1,
      "negctrl @ x": 1,
      rx: 1,
      rz: 3,
      s: 1,
      sdg: 1,
      swap: 1,
      t: 1,
      x: 1,
      y: 1,
      z: 1,
    });
    // Keys come out in code unit order (upper case before lower case).
    const keys = Object.keys(m.gateCounts);
    expect(keys).toEqual([...keys].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
  });

  it("does not count a controlled T as a T gate", () => {
    const m = computeMetrics(circuit(2, [gate("t", [0, 1], [], [true])]));
    expect(m.tCount).toBe(0);
    expect(m.tDepth).toBe(0);
    expect(m.gateCounts).toEqual({ "ctrl @ t": 1 });
  });

  it("labels qubits by register, and $i where no register covers them", () => {
    const c = circuit(4, [], [
      { name: "a", start: 0, size: 2 },
      { name: "anc", start: 2, size: 1 },
    ]);
    expect(computeMetrics(c).perQubit.map((q) => q.label)).toEqual(["a[0]", "a[1]", "anc[0]", "$3"]);
  });

  it("rejects a qubit index outside the circuit", () => {
    expect(() => computeMetrics(circuit(2, [t(2)]))).toThrow(/qubit index 2/);
    expect(() => computeMetrics(circuit(2, [ifBlock([cx(0, 5)])]))).toThrow(RangeError);
  });

  it("handles a million operations (typed-array clocks)", () => {
    // 500k t on q0 in series and 500k h on q1: T-count = T-depth = depth = 500k.
    const n = 500_000;
    const tq0 = t(0);
    const hq1 = h(1);
    const body: Stmt[] = new Array<Stmt>(2 * n);
    for (let i = 0; i < n; i++) {
      body[2 * i] = tq0;
      body[2 * i + 1] = hq1;
    }
    const m = computeMetrics(circuit(2, body));
    expect(m).toMatchObject({ gates: 2 * n, tCount: n, tDepth: n, depth: n, cliffordCount: n });
  });
});

// ---------------------------------------------------------------------------------------------
// Property tests.

const NAMES = ["h", "s", "sdg", "t", "tdg", "x", "y", "z", "cx", "cz", "ccx", "measure", "reset", "barrier"] as const;
type Name = (typeof NAMES)[number];
const ARITY: Record<Name, number> = { h: 1, s: 1, sdg: 1, t: 1, tdg: 1, x: 1, y: 1, z: 1, cx: 2, cz: 2, ccx: 3, measure: 1, reset: 1, barrier: 2 };

/** A flat random operation on distinct qubits of 0..n-1 (only names whose arity fits in n qubits). */
const arbOp = (n: number) =>
  fc
    .constantFrom(...NAMES.filter((name) => ARITY[name] <= n))
    .chain((name) => fc.tuple(fc.constant(name), fc.uniqueArray(fc.integer({ min: 0, max: n - 1 }), { minLength: ARITY[name], maxLength: ARITY[name] })))
    .map(([name, q]): Stmt => {
      if (name === "measure") return measure(q[0]);
      if (name === "reset") return reset(q[0]);
      if (name === "barrier") return barrier(q);
      return gate(name, q);
    });

const flatCircuit = fc.integer({ min: 3, max: 6 }).chain((n) => fc.tuple(fc.constant(n), fc.array(arbOp(n), { maxLength: 60 })));

function opQubits(s: Stmt): readonly number[] {
  if (s.kind === "gate" || s.kind === "barrier") return s.qubits;
  if (s.kind === "measure" || s.kind === "reset") return [s.qubit];
  return [];
}

/**
 * Reference by a different route (common practice, no source): the dependency DAG where a later
 * operation depends on every earlier one sharing a qubit, longest paths by quadratic dynamic
 * programming over all pairs. A barrier is a node of weight 0 (layers and T layers).
 */
function reference(n: number, ops: readonly Stmt[]) {
  const len: number[] = [];
  const tl: number[] = [];
  for (let j = 0; j < ops.length; j++) {
    const qj = opQubits(ops[j]);
    let bestLen = 0;
    let bestT = 0;
    for (let i = 0; i < j; i++) {
      if (opQubits(ops[i]).some((q) => qj.includes(q))) {
        bestLen = Math.max(bestLen, len[i]);
        bestT = Math.max(bestT, tl[i]);
      }
    }
    const s = ops[j];
    const isT = s.kind === "gate" && (s.name === "t" || s.name === "tdg");
    len.push(bestLen + (s.kind === "barrier" ? 0 : 1));
    tl.push(bestT + (isT ? 1 : 0));
  }
  const perQubitT = new Array<number>(n).fill(0);
  for (let j = 0; j < ops.length; j++) for (const q of opQubits(ops[j])) perQubitT[q] = Math.max(perQubitT[q], tl[j]);
  return { depth: Math.max(0, ...len), tDepth: Math.max(0, ...tl), perQubitT };
}

/** Random nested circuits: flat ops plus if/else, while and box blocks. */
const nested = (n: number) =>
  fc.letrec<{ body: Stmt[]; stmt: Stmt }>((tie) => ({
    body: fc.array(tie("stmt"), { maxLength: 8 }) as fc.Arbitrary<Stmt[]>,
    stmt: fc.oneof(
      { depthSize: "small", withCrossShrink: true },
      { arbitrary: arbOp(n), weight: 6 },
      { arbitrary: fc.tuple(tie("body"), tie("body")).map(([a, b]) => ifBlock(a as Stmt[], b as Stmt[])), weight: 1 },
      { arbitrary: tie("body").map((b) => whileBlock(b as Stmt[])), weight: 1 },
      { arbitrary: tie("body").map((b) => boxBlock(b as Stmt[])), weight: 1 },
    ) as fc.Arbitrary<Stmt>,
  })).body;

interface Tally {
  ops: number;
  ts: number;
  conditional: number;
}

function tally(body: readonly Stmt[], inCond: boolean, acc: Tally): Tally {
  for (const s of body) {
    if (s.kind === "if") {
      tally(s.then, true, acc);
      tally(s.else, true, acc);
    } else if (s.kind === "while") tally(s.body, true, acc);
    else if (s.kind === "box") tally(s.body, inCond, acc);
    else if (s.kind === "gate" || s.kind === "measure" || s.kind === "reset") {
      acc.ops += 1;
      if (inCond) acc.conditional += 1;
      if (s.kind === "gate" && (s.name === "t" || s.name === "tdg")) acc.ts += 1;
    }
  }
  return acc;
}

describe("computeMetrics properties", () => {
  it("matches the quadratic DAG reference on flat random circuits", () => {
    fc.assert(
      fc.property(flatCircuit, ([n, ops]) => {
        const m = computeMetrics(circuit(n, ops));
        const r = reference(n, ops);
        expect(m.depth).toBe(r.depth);
        expect(m.tDepth).toBe(r.tDepth);
        expect(m.perQubit.map((q) => q.tDepth)).toEqual(r.perQubitT);
      }),
      { numRuns: 300, seed: 20240611 },
    );
  });

  it("keeps the invariants on random circuits with blocks", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 5 }).chain((n) => fc.tuple(fc.constant(n), nested(n))),
        ([n, body]) => {
          const m = computeMetrics(circuit(n, body));
          const k = tally(body, false, { ops: 0, ts: 0, conditional: 0 });
          // T-count is the number of t/tdg operations in the text.
          expect(m.tCount).toBe(k.ts);
          expect(m.conditionalOps).toBe(k.conditional);
          expect(m.tDepth).toBeLessThanOrEqual(m.depth);
          expect(m.depth).toBeLessThanOrEqual(k.ops);
          expect(m.perQubit.reduce((s, q) => s + q.tCount, 0)).toBe(m.tCount);
          expect(Math.max(0, ...m.perQubit.map((q) => q.tDepth))).toBe(m.tDepth);
          expect(Object.values(m.gateCounts).reduce((s, c) => s + c, 0)).toBe(m.gates);
        },
      ),
      { numRuns: 300, seed: 7 },
    );
  });
});
