import { describe, expect, test } from "vitest";
import { DiagnosticError } from "../../src/frontend/diagnostics.js";
import { BASE_TOLERANCE, equivalence } from "../../src/diff/equiv.js";
import { diffSides } from "../../src/diff/compare.js";
import { diffJson, diffMarkdown, diffText } from "../../src/diff/format.js";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import { circuit, dAngle, g, randomBasisCircuit } from "../helpers/circuit-builder.js";

const NONE = { a: null, b: null };

describe("circuits known equal (standard identities, common practice, no source)", () => {
  const cases: [string, Circuit, Circuit][] = [
    ["H Z H = X", circuit(1, [g("h", [0]), g("z", [0]), g("h", [0])]), circuit(1, [g("x", [0])])],
    ["CX = (1 x H) CZ (1 x H) on the target", circuit(2, [g("cx", [0, 1])]), circuit(2, [g("h", [1]), g("cz", [0, 1]), g("h", [1])])],
    ["S S = Z", circuit(1, [g("s", [0]), g("s", [0])]), circuit(1, [g("z", [0])])],
    ["T T = S", circuit(1, [g("t", [0]), g("t", [0])]), circuit(1, [g("s", [0])])],
    ["X Z = -Z X (equal up to global phase)", circuit(1, [g("x", [0]), g("z", [0])]), circuit(1, [g("z", [0]), g("x", [0])])],
    ["SWAP = three alternating CX", circuit(2, [g("swap", [0, 1])]), circuit(2, [g("cx", [0, 1]), g("cx", [1, 0]), g("cx", [0, 1])])],
  ];
  test.each(cases)("%s", (_name, a, b) => {
    const e = equivalence(a, b, NONE);
    expect(e.exact).toBe(true);
    expect(e.distance).toBeLessThan(1e-14);
    expect(e.within).toBe(true);
    expect(e.boundSum).toBe("0");
    expect(e.states).toBe(0);
  });

  test("a larger circuit against the same circuit rewritten gate by gate (H Z H for X, S S for Z, H CZ H for CX)", () => {
    const a = randomBasisCircuit(17, 4, 120, 0.2);
    const body: Stmt[] = [];
    for (const s of a.body) {
      if (s.kind !== "gate") throw new Error("flat circuits only");
      const q = s.qubits;
      if (s.name === "x") body.push(g("h", [q[0]]), g("z", [q[0]]), g("h", [q[0]]));
      else if (s.name === "z") body.push(g("s", [q[0]]), g("s", [q[0]]));
      else if (s.name === "cx") body.push(g("h", [q[1]]), g("cz", [q[0], q[1]]), g("h", [q[1]]));
      else body.push(s);
    }
    const b = circuit(4, body);
    expect(b.body.length).toBeGreaterThan(a.body.length); // something was rewritten
    const e = equivalence(a, b, NONE);
    expect(e.within).toBe(true);
    expect(e.distance).toBeLessThan(1e-13);
    // The figures differ although the programs agree: the diff and the verdict are separate questions.
    expect(diffSides({ label: "a", circuit: a }, { label: "b", circuit: b }).identical).toBe(false);
  });
});

describe("circuits known different", () => {
  test("one T removed: the distance is d(T, I) = 2 sin(pi/16) whatever surrounds it", () => {
    // d(PTQ, PQ) = d(T, I) by unitary invariance; eigenphases of T are 0 and pi/4, so d = 2 sin((pi/4)/4)
    // (the eigenphase-arc formula of the design note, synthesis.md section 1).
    const a = randomBasisCircuit(5, 3, 60, 0.2);
    const k = a.body.findIndex((s) => s.kind === "gate" && s.name === "t");
    expect(k).toBeGreaterThanOrEqual(0);
    const b = circuit(3, a.body.filter((_, i) => i !== k));
    const e = equivalence(a, b, { a: "1e-3", b: "1e-3" });
    expect(e.distance).toBeCloseTo(2 * Math.sin(Math.PI / 16), 12);
    expect(e.within).toBe(false);
  });

  test("a rotation off by delta: within the declared bounds only when they add up to 2 sin(delta/4)", () => {
    // rz(a)^dag rz(b) has eigenphases +-(b - a)/2: arc b - a, d = 2 sin((b - a)/4) ~ 5e-5 for delta = 1e-4.
    const a = circuit(2, [g("h", [0]), g("rz", [0], [dAngle("0.3")]), g("cx", [0, 1])]);
    const b = circuit(2, [g("h", [0]), g("rz", [0], [dAngle("0.3001")]), g("cx", [0, 1])]);
    const d = 2 * Math.sin(1e-4 / 4);
    const near = equivalence(a, b, { a: "3e-5", b: "2.1e-5" });
    expect(near.distance).toBeCloseTo(d, 12);
    expect(near.boundSum).toBe("5.1e-5");
    expect(near.within).toBe(true);
    expect(equivalence(a, b, { a: "2.5e-5", b: "2.4e-5" }).within).toBe(false);
    expect(equivalence(a, b, { a: "5.1e-5", b: null }).within).toBe(true);
    expect(equivalence(a, b, NONE).within).toBe(false);
  });
});

describe("details", () => {
  const a = circuit(1, [g("h", [0])]);

  test("the bound sum is exact and the tolerance grows with the gate count unless given", () => {
    const e = equivalence(a, a, { a: "1e-10", b: "2.5e-11" });
    expect(e.boundSum).toBe("1.25e-10");
    expect(e.tolerance).toBeGreaterThanOrEqual(BASE_TOLERANCE);
    const big = randomBasisCircuit(3, 2, 500, 0);
    expect(equivalence(big, big, NONE).tolerance).toBeGreaterThan(e.tolerance);
    expect(equivalence(a, a, NONE, { tolerance: 0 }).tolerance).toBe(0);
    expect(() => equivalence(a, a, NONE, { tolerance: -1 })).toThrow(RangeError);
    expect(() => equivalence(a, a, { a: "-1e-3", b: null })).toThrow(RangeError);
  });

  test("different qubit counts and non-unitary statements are the simulator's DiagnosticErrors", () => {
    expect(() => equivalence(a, circuit(2, [g("h", [0])]), NONE)).toThrow(DiagnosticError);
    const measured: Circuit = { ...a, body: [...a.body, { kind: "measure", qubit: 0, bit: null, loc: { file: "m.qasm", line: 1, col: 1 } }] };
    expect(() => equivalence(a, measured, NONE)).toThrow(DiagnosticError);
  });

  test("above 10 qubits: a seeded random-state lower bound, labelled as such", () => {
    const n = 11;
    const wide: Stmt[] = [];
    for (let q = 0; q < n; q++) wide.push(g("h", [q]), g("t", [q]));
    for (let q = 0; q + 1 < n; q++) wide.push(g("cx", [q, q + 1]));
    const a = circuit(n, wide);
    // H = X H Z (since H Z = X H): each h becomes z, h, x in time order.
    const b = circuit(n, wide.flatMap((s) => (s.kind === "gate" && s.name === "h" ? [g("z", [...s.qubits]), g("h", [...s.qubits]), g("x", [...s.qubits])] : [s])));
    const same = equivalence(a, b, NONE, { seed: 3, states: 2 });
    expect([same.exact, same.states, same.within]).toEqual([false, 2, true]);
    expect(same.distance).toBeLessThan(1e-13);
    const c = circuit(n, wide.filter((s, i) => !(s.kind === "gate" && s.name === "t" && i === 1)));
    const diff = equivalence(a, c, NONE, { seed: 3, states: 2 });
    expect(diff.within).toBe(false);
    expect(diff.distance).toBeGreaterThan(1e-3);
    expect(diff.distance).toBeLessThanOrEqual(2 * Math.sin(Math.PI / 16) + 1e-12); // a lower bound never exceeds the distance
    expect(diffText(diffSides({ label: "a", circuit: a }, { label: "b", circuit: b }), { color: false, checks: { equivalence: same } })).toContain("a lower bound, not a proof");
  });

  test("the verdict appears in every format", () => {
    const x = circuit(1, [g("x", [0])]);
    const hzh = circuit(1, [g("h", [0]), g("z", [0]), g("h", [0])]);
    const d = diffSides({ label: "x.qasm", circuit: x }, { label: "hzh.qasm", circuit: hzh });
    const good = equivalence(x, hzh, NONE);
    expect(diffText(d, { color: false, checks: { equivalence: good } })).toContain("equivalent within the ledgers");
    expect(diffMarkdown(d, { equivalence: good })).toContain("**Equivalence held**");
    const bad = equivalence(x, circuit(1, [g("h", [0]), g("h", [0])]), NONE);
    expect(diffText(d, { color: false, checks: { equivalence: bad } })).toContain("do not implement the same program");
    expect(diffMarkdown(d, { equivalence: bad })).toContain("**Equivalence FAILED**");
    const json = JSON.parse(diffJson(d, { equivalence: bad }));
    expect(json.equivalence.within).toBe(false);
    expect(json.equivalence.distance).toBeCloseTo(Math.SQRT2, 12); // d(X, I): eigenphases 0 and pi, arc pi, 2 sin(pi/4)
  });
});
