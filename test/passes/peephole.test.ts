import { describe, expect, it } from "vitest";
import { peephole } from "../../src/passes/peephole.js";
import { circuitDistance } from "../../src/sim/index.js";
import type { GateOp, Stmt } from "../../src/ir/circuit.js";
import { circuit, dAngle, g, randomBasisCircuit } from "../helpers/circuit-builder.js";

describe("peephole", () => {
  it("never changes the unitary and never adds gates (seeded random Clifford+T circuits)", () => {
    for (let seed = 1; seed <= 30; seed++) {
      const c = randomBasisCircuit(seed, 3, 80, 0);
      const p = peephole(c, new Map()).circuit;
      expect(p.body.length).toBeLessThanOrEqual(c.body.length);
      expect(circuitDistance(c, p).distance).toBeLessThan(1e-9);
    }
  });

  it("cancels back-to-back CX pairs and merges T T into S", () => {
    // One pass: the h flushed before the first CX is not re-merged with the one after the pair
    // (the cancel-pairs pass before merging catches such pairs earlier in the pipeline).
    const c = circuit(2, [g("h", [0]), g("cx", [0, 1]), g("cx", [0, 1]), g("h", [0]), g("t", [1]), g("t", [1])]);
    const p = peephole(c, new Map()).circuit;
    expect(p.body.map((s) => (s.kind === "gate" ? s.name : s.kind)).sort()).toEqual(["h", "h", "s"]);
    expect(circuitDistance(c, p).distance).toBeLessThan(1e-12);
  });

  it("gives notes of vanished words their own copy of the next op, even when that op object is shared", () => {
    // The same CX object stands 50,000 times (front ends and word tables share ops); before each, a
    // rotation's word and its inverse vanish, leaving their notes to the CX that follows.
    const shared = g("cx", [0, 1]);
    const rzA = (): GateOp => g("rz", [0], [dAngle("0.1")]);
    const rzB = (): GateOp => g("rz", [0], [dAngle("-0.1")]);
    const body: Stmt[] = [];
    const n = 50_000;
    for (let i = 0; i < n; i++) body.push(rzA(), rzB(), shared, g("h", [1]));
    const { circuit: out, comments } = peephole(circuit(2, body), new Map(), (op) =>
      op.name !== "rz" ? null : op.params[0]!.value.startsWith("-") ? { word: ["tdg"], note: "B" } : { word: ["t"], note: "A" },
    );
    const carriers = out.body.filter((s) => comments.has(s as GateOp));
    expect(carriers.length).toBe(n);
    for (const s of carriers) expect(comments.get(s as GateOp)).toEqual(["A", "B"]);
    expect(new Set(carriers).size).toBe(n);
  });

  it("keeps each note exactly once when CX pairs cancel around vanished words, again and again", () => {
    // cx, (t tdg: vanishes, note), cx on the same pair cancels; its notes move on. Repeated n times,
    // every note must reach the output exactly once (notes once doubled at every cancellation).
    const body: Stmt[] = [];
    const n = 40;
    for (let i = 0; i < n; i++) body.push(g("cx", [0, 1]), g("rz", [0], [dAngle(`0.${1001 + i}`)]), g("rz", [0], [dAngle(`-0.${1001 + i}`)]), g("cx", [0, 1]));
    body.push(g("h", [0]), g("h", [1]));
    const { comments } = peephole(circuit(2, body), new Map(), (op) =>
      op.name !== "rz" ? null : { word: op.params[0]!.value.startsWith("-") ? ["tdg"] : ["t"], note: op.params[0]!.value },
    );
    const all = [...comments.values()].flat();
    expect(all.length).toBe(2 * n);
    expect(new Set(all).size).toBe(2 * n);
  });
});
