import { describe, expect, it } from "vitest";
import { add, complex, multiply, type Complex, type Matrix, matrix, exp, sqrt, abs } from "mathjs";
import { synthCommand } from "../../src/cli/synth.js";
import { runCommand, EXIT_INPUT, EXIT_OK, type Io } from "../../src/cli/common.js";

function capture(): Io & { out: string; err: string } {
  const io = { out: "", err: "", color: false, stdout: (t: string) => void (io.out += t), stderr: (t: string) => void (io.err += t) };
  return io;
}

// Gate matrices as the OpenQASM 3 specification defines them, built independently with mathjs.
const r2 = 1 / Math.SQRT2;
const GATE: Record<string, Matrix> = {
  h: matrix([[r2, r2], [r2, -r2]]),
  s: matrix([[1, 0], [0, complex(0, 1)]]),
  sdg: matrix([[1, 0], [0, complex(0, -1)]]),
  t: matrix([[1, 0], [0, complex(r2, r2)]]),
  tdg: matrix([[1, 0], [0, complex(r2, -r2)]]),
  x: matrix([[0, 1], [1, 0]]),
  y: matrix([[0, complex(0, -1)], [complex(0, 1), 0]]),
  z: matrix([[1, 0], [0, -1]]),
};

/** d(U, V) = sqrt(2 - |tr(U^dag V)|) for 2x2 unitaries (synthesis.md section 1), with U given as a gate list in circuit order. */
function distanceToRz(gates: string[], phase: number, theta: number): number {
  let m = matrix([[1, 0], [0, 1]]) as Matrix;
  for (const g of gates) m = multiply(GATE[g]!, m) as Matrix;
  const e = exp(complex(0, phase)) as Complex;
  const a = m.get([0, 0]) as Complex | number;
  const d = m.get([1, 1]) as Complex | number;
  // tr(Rz^dag e^{i phase} W) with Rz = diag(e^{-i t/2}, e^{i t/2})
  const tr = add(
    multiply(multiply(e, complex(Math.cos(theta / 2), Math.sin(theta / 2))), a),
    multiply(multiply(e, complex(Math.cos(theta / 2), -Math.sin(theta / 2))), d),
  ) as Complex;
  // the phase is supposed to make the trace real and close to 2
  expect(Math.abs(tr.im)).toBeLessThan(1e-3);
  return Number(sqrt(Math.max(0, 2 - Number(abs(tr)))));
}

describe("tledger synth", () => {
  it("prints a word whose matrix, with the stated phase, is within the stated error of rz (checked with mathjs)", async () => {
    for (const [angle, theta, method, eps] of [
      ["pi/7", Math.PI / 7, "number-theoretic", "1e-4"],
      ["0.3", 0.3, "number-theoretic", "1e-6"],
      ["-1.2", -1.2, "solovay-kitaev", "1e-2"],
    ] as const) {
      const io = capture();
      expect(await runCommand((x) => synthCommand({ angle, epsilon: eps, method, json: true }, x), { io })).toBe(EXIT_OK);
      const r = JSON.parse(io.out);
      expect(r.method).toBe(method);
      expect(r.tCount).toBe(r.gates.filter((g: string) => g === "t" || g === "tdg").length);
      expect(r.error).toBeLessThanOrEqual(Number(eps));
      const d = distanceToRz(r.gates, r.globalPhase, theta);
      // float evaluation of sqrt(2 - |tr|) is only good to ~1e-8 absolute
      expect(d).toBeLessThanOrEqual(r.error + 1e-7);
    }
  });

  it("gives the exact word at zero error for multiples of pi/4", async () => {
    const io = capture();
    expect(await runCommand((x) => synthCommand({ angle: "3*pi/4", epsilon: "1e-9", json: true }, x), { io })).toBe(EXIT_OK);
    const r = JSON.parse(io.out);
    expect(r.errorText).toBe("0");
    expect(r.tCount).toBe(1);
    expect(distanceToRz(r.gates, r.globalPhase, (3 * Math.PI) / 4)).toBeLessThan(1e-7);
  });

  it("refuses what it cannot do with exit code 2", async () => {
    for (const opts of [
      { epsilon: "1e-3" },
      { angle: "0.3" },
      { angle: "0.3", epsilon: "0" },
      { angle: "0.3", epsilon: "1e-20", method: "solovay-kitaev" },
      { angle: "0.3", epsilon: "1e-60" },
      { angle: "0.3 +", epsilon: "1e-3" },
      { angle: "0.3", epsilon: "1e-3", method: "guess" },
    ]) {
      const io = capture();
      expect(await runCommand((x) => synthCommand(opts, x), { io })).toBe(EXIT_INPUT);
      expect(io.err).toMatch(/error:/);
      expect(io.out).toBe("");
    }
  });
});
