import { describe, expect, it } from "vitest";
import { lowerCircuit } from "../../src/passes/pipeline.js";
import { circuitDistance } from "../../src/sim/index.js";
import { dec } from "../../src/numeric/decimal.js";
import type { Circuit, Stmt } from "../../src/ir/circuit.js";
import { circuit, dAngle, g, piAngle } from "../helpers/circuit-builder.js";

const CLIFFORD_T = new Set(["h", "s", "sdg", "t", "tdg", "x", "y", "z", "cx"]);

function gatesOf(body: readonly Stmt[]): string[] {
  const out: string[] = [];
  for (const s of body) {
    if (s.kind === "gate") out.push(s.name);
    else if (s.kind === "if") out.push(...gatesOf(s.then), ...gatesOf(s.else));
    else if (s.kind === "while" || s.kind === "box") out.push(...gatesOf(s.body));
  }
  return out;
}

function errorBound(o: Awaited<ReturnType<typeof lowerCircuit>>) {
  let sum = dec(0);
  o.results.forEach((r, i) => (sum = sum.plus(dec(r.error).times(o.census.groups[i]!.instances))));
  return sum;
}

const demo: Circuit = circuit(3, [
  g("h", [0]),
  g("crz", [0, 1], [dAngle("0.3")]),
  g("rx", [2], [dAngle("0.7")]),
  g("ccx", [0, 1, 2]),
  g("U", [1], [dAngle("0.4"), dAngle("-1.1"), piAngle(1, 4)]),
  g("rz", [2], [piAngle(3, 4)]),
  g("rzz", [1, 2], [dAngle("0.25")]),
  g("rx", [2], [dAngle("0.7")]),
  g("cp", [2, 0], [piAngle(1, 2)]),
]);

describe("lowering pipeline", () => {
  it("writes only Clifford+T gates and keeps the distance within the bound within the budget", async () => {
    for (const budget of ["1e-2", "1e-4"]) {
      const o = await lowerCircuit(demo, { policy: { kind: "budget", budget } });
      expect(new Set(gatesOf(o.circuit.body)).size).toBeGreaterThan(0);
      for (const name of gatesOf(o.circuit.body)) expect(CLIFFORD_T.has(name)).toBe(true);
      const bound = errorBound(o);
      expect(bound.lte(dec(budget))).toBe(true);
      const d = circuitDistance(demo, o.circuit);
      expect(d.exact).toBe(true);
      expect(d.distance).toBeLessThanOrEqual(bound.toNumber() + 1e-12);
    }
  });

  it("is deterministic and independent of the cache state", async () => {
    const a = await lowerCircuit(demo, { policy: { kind: "budget", budget: "1e-3" } });
    const b = await lowerCircuit(demo, { policy: { kind: "budget", budget: "1e-3" } });
    expect(gatesOf(b.circuit.body)).toEqual(gatesOf(a.circuit.body));
    expect(b.results.map((r) => r.error)).toEqual(a.results.map((r) => r.error));
  });

  it("lowers exact rotations at zero error and with no synthesis", async () => {
    const c = circuit(2, [g("rz", [0], [piAngle(1, 4)]), g("cp", [0, 1], [piAngle(1, 2)]), g("rx", [1], [piAngle(-3, 4)])]);
    const o = await lowerCircuit(c, { policy: { kind: "budget", budget: "1e-6" } });
    expect(o.census.groups.length).toBe(0);
    expect(circuitDistance(c, o.circuit).distance).toBeLessThan(1e-12);
  });
});
