// Tests of the cancel-pairs pass: what it removes and keeps, the unitary on seeded random circuits, and its effect on the pipeline.
import { describe, expect, it, vi } from "vitest";
import { cancelPairs } from "../../src/passes/cancel-pairs.js";
import { lowerCircuit } from "../../src/passes/pipeline.js";
import { parseQasmFile } from "../../src/frontend/frontend.js";
import { computeMetrics } from "../../src/report/metrics.js";
import { circuitDistance } from "../../src/sim/index.js";
import { dec } from "../../src/numeric/decimal.js";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import { circuit, dAngle, g, LOC, rng } from "../helpers/circuit-builder.js";

/** A compact spelling of a body: `name q,q` per gate, the kind for other statements, blocks in brackets. */
function spell(body: readonly Stmt[]): string[] {
  return body.map((s) => {
    if (s.kind === "gate") return `${s.name} ${s.qubits.join(",")}`;
    if (s.kind === "if") return `if[${spell(s.then).join("; ")}|${spell(s.else).join("; ")}]`;
    if (s.kind === "while" || s.kind === "box") return `${s.kind}[${spell(s.body).join("; ")}]`;
    return s.kind;
  });
}

function gateCount(body: readonly Stmt[]): number {
  let n = 0;
  for (const s of body) {
    if (s.kind === "gate") n++;
    else if (s.kind === "if") n += gateCount(s.then) + gateCount(s.else);
    else if (s.kind === "while" || s.kind === "box") n += gateCount(s.body);
  }
  return n;
}

const run = (n: number, body: Stmt[]): string[] => spell(cancelPairs(circuit(n, body)).body);

describe("cancel-pairs: what cancels", () => {
  it("removes each inverse pair of the basis on one qubit", () => {
    // Inverse pairs of the Clifford+T basis: H^2 = X^2 = Y^2 = Z^2 = I, S S^dag = T T^dag = I (common practice, no source).
    for (const [a, b] of [["h", "h"], ["x", "x"], ["y", "y"], ["z", "z"], ["s", "sdg"], ["sdg", "s"], ["t", "tdg"], ["tdg", "t"]]) {
      expect(run(1, [g(a!, [0]), g(b!, [0])]), `${a} ${b}`).toEqual([]);
    }
  });

  it("keeps pairs that are not inverses: s s, t t, h x, cx with swapped roles", () => {
    expect(run(1, [g("s", [0]), g("s", [0])])).toEqual(["s 0", "s 0"]);
    expect(run(1, [g("t", [0]), g("t", [0])])).toEqual(["t 0", "t 0"]);
    expect(run(1, [g("h", [0]), g("x", [0])])).toEqual(["h 0", "x 0"]);
    expect(run(2, [g("cx", [0, 1]), g("cx", [1, 0])])).toEqual(["cx 0,1", "cx 1,0"]);
  });

  it("cancels repeatedly through the pairs it exposes: h x x h, and nested s t tdg sdg", () => {
    expect(run(1, [g("h", [0]), g("x", [0]), g("x", [0]), g("h", [0])])).toEqual([]);
    expect(run(1, [g("s", [0]), g("t", [0]), g("tdg", [0]), g("sdg", [0]), g("h", [0])])).toEqual(["h 0"]);
    // Three in a row: only one pair goes.
    expect(run(1, [g("h", [0]), g("h", [0]), g("h", [0])])).toEqual(["h 0"]);
  });

  it("ignores gates on other qubits between a pair, but not gates on the pair's qubits", () => {
    expect(run(2, [g("h", [0]), g("x", [1]), g("h", [0])])).toEqual(["x 1"]);
    expect(run(2, [g("h", [0]), g("cx", [0, 1]), g("h", [0])])).toEqual(["h 0", "cx 0,1", "h 0"]);
    expect(run(1, [g("h", [0]), g("rz", [0], [dAngle("0.1")]), g("h", [0])])).toEqual(["h 0", "rz 0", "h 0"]);
  });

  it("cancels cx cx on the same control and target, unless a gate touches either qubit in between", () => {
    expect(run(3, [g("cx", [0, 1]), g("x", [2]), g("cx", [0, 1])])).toEqual(["x 2"]);
    expect(run(2, [g("cx", [0, 1]), g("t", [0]), g("cx", [0, 1])])).toEqual(["cx 0,1", "t 0", "cx 0,1"]);
    expect(run(2, [g("cx", [0, 1]), g("h", [1]), g("cx", [0, 1])])).toEqual(["cx 0,1", "h 1", "cx 0,1"]);
    // A cancelled pair between them makes them adjacent.
    expect(run(2, [g("cx", [0, 1]), g("h", [1]), g("h", [1]), g("cx", [0, 1])])).toEqual([]);
    // Once the cx pair goes, the gates around it meet and cancel too.
    expect(run(2, [g("h", [0]), g("cx", [0, 1]), g("cx", [0, 1]), g("h", [0])])).toEqual([]);
  });

  it("treats measure, reset, barrier and blocks as fences, and recurses into blocks", () => {
    const m = { kind: "measure" as const, qubit: 0, bit: null, loc: LOC };
    expect(run(1, [g("h", [0]), m, g("h", [0])])).toEqual(["h 0", "measure", "h 0"]);
    expect(run(2, [g("h", [1]), m, g("h", [1])])).toEqual(["measure"]);
    expect(run(1, [g("x", [0]), { kind: "reset", qubit: 0, loc: LOC }, g("x", [0])])).toEqual(["x 0", "reset", "x 0"]);
    expect(run(2, [g("x", [0]), { kind: "barrier", qubits: [0], loc: LOC }, g("x", [0])])).toEqual(["x 0", "barrier", "x 0"]);
    expect(run(2, [g("x", [1]), { kind: "barrier", qubits: [0], loc: LOC }, g("x", [1])])).toEqual(["barrier"]);
    expect(run(2, [g("x", [1]), { kind: "barrier", qubits: [], loc: LOC }, g("x", [1])])).toEqual(["x 1", "barrier", "x 1"]);
    const block: Stmt = { kind: "box", duration: null, body: [g("t", [1]), g("tdg", [1]), g("h", [0])], loc: LOC };
    expect(run(2, [g("h", [0]), block, g("h", [0])])).toEqual(["h 0", "box[h 0]", "h 0"]);
    const branch: Stmt = { kind: "if", cond: { k: "bool", value: true }, then: [g("s", [0]), g("sdg", [0])], else: [g("z", [1]), g("z", [1])], loc: LOC };
    expect(run(2, [branch])).toEqual(["if[|]"]);
  });

  it("leaves its input untouched and keeps the circuit's other fields", () => {
    const c = circuit(2, [g("h", [0]), g("h", [0])]);
    const out = cancelPairs(c);
    expect(c.body.length).toBe(2);
    expect(out.numQubits).toBe(2);
    expect(out.qubitRegs).toEqual(c.qubitRegs);
  });

  it("takes 5e5 ops in one sweep: a palindrome of self-inverse gates vanishes entirely", () => {
    // A word followed by its reverse is the identity when every letter is self-inverse; the stack cancels it all.
    const r = rng(7);
    const half: Stmt[] = [];
    for (let i = 0; i < 250_000; i++) {
      const q = Math.floor(r() * 4);
      const x = r();
      half.push(x < 0.25 ? g("cx", [q, (q + 1) % 4]) : g(["h", "x", "y", "z"][Math.floor(x * 4)]!, [q]));
    }
    const out = cancelPairs(circuit(4, [...half, ...[...half].reverse()]));
    expect(out.body.length).toBe(0);
  });
});

/** A random circuit over the decomposed basis, biased towards inverse pairs, with barriers as fences. */
function randomPairsCircuit(seed: number, n: number, len: number): Circuit {
  const r = rng(seed);
  const one = ["h", "x", "y", "z", "s", "sdg", "t", "tdg"];
  const body: Stmt[] = [];
  for (let i = 0; i < len; i++) {
    const x = r();
    const q = Math.floor(r() * n);
    let t = Math.floor(r() * (n - 1));
    if (t >= q) t++;
    if (x < 0.08) body.push(g("rz", [q], [dAngle((r() * 6 - 3).toFixed(5))]));
    else if (x < 0.1) body.push({ kind: "barrier", qubits: r() < 0.5 ? [q] : [], loc: LOC });
    else if (x < 0.3) body.push(g("cx", [q, t]));
    else body.push(g(one[Math.floor(r() * one.length)]!, [q]));
  }
  return circuit(n, body);
}

describe("cancel-pairs keeps the unitary", () => {
  it("on seeded random circuits: same unitary, never more gates, and some pairs do cancel", () => {
    let removed = 0;
    for (let seed = 1; seed <= 40; seed++) {
      const c = randomPairsCircuit(seed, seed % 3 === 0 ? 2 : 3, 80);
      const out = cancelPairs(c);
      const before = gateCount(c.body);
      const after = gateCount(out.body);
      expect(after).toBeLessThanOrEqual(before);
      removed += before - after;
      const d = circuitDistance(c, out);
      expect(d.distance, `seed ${seed}`).toBeLessThan(1e-9);
    }
    expect(removed).toBeGreaterThan(0);
  });

  it("is idempotent: a second run finds nothing left to cancel", () => {
    for (let seed = 100; seed < 120; seed++) {
      const once = cancelPairs(randomPairsCircuit(seed, 3, 120));
      expect(spell(cancelPairs(once).body)).toEqual(spell(once.body));
    }
  });
});

describe("cancel-pairs in the lowering pipeline", () => {
  it("rx(a) rx(b) on one qubit lowers through a single approximated rotation rz(a + b)", async () => {
    const c = circuit(1, [g("rx", [0], [dAngle("0.1")]), g("rx", [0], [dAngle("0.2")])]);
    const out = await lowerCircuit(c, { policy: { kind: "budget", budget: "1e-3" } });
    expect(out.census.groups.length).toBe(1);
    expect(out.census.groups[0]!.instances).toBe(1);
    expect(dec(out.census.groups[0]!.angle.value).eq(dec("0.3"))).toBe(true);
    // rx(0.1) rx(0.2) = rx(0.3) (rotations about one axis add; common practice, no source), within the budget.
    expect(circuitDistance(c, out.circuit).distance).toBeLessThanOrEqual(1e-3);
  });

  it("lowers fixtures/ising-quench.qasm at budget 1e-2 with fewer T gates and rotations than without the pass", async () => {
    const source = parseQasmFile("fixtures/ising-quench.qasm");
    const opts = { policy: { kind: "budget" as const, budget: "1e-2" } };
    const withPass = await lowerCircuit(source, opts);
    // The same pipeline module, loaded again with cancel-pairs replaced by the identity.
    vi.resetModules();
    vi.doMock("../../src/passes/cancel-pairs.js", () => ({ cancelPairs: (c: Circuit) => c }));
    try {
      const plain = await import("../../src/passes/pipeline.js");
      const without = await plain.lowerCircuit(source, opts);
      const instances = (o: typeof withPass): number => o.census.groups.reduce((n, gr) => n + gr.instances, 0);
      expect(instances(withPass)).toBeLessThan(instances(without));
      expect(computeMetrics(withPass.circuit).tCount).toBeLessThan(computeMetrics(without.circuit).tCount);
    } finally {
      vi.doUnmock("../../src/passes/cancel-pairs.js");
      vi.resetModules();
    }
  });
});
