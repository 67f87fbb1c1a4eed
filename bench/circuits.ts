// Generated benchmark programs of the invented lab's scenario: a driven spin chain and a QFT-style register.

/** Angles as plain decimals with 12 significant digits (what a generator script would print). */
function lit(x: number): string {
  return x.toPrecision(12);
}

/**
 * Transverse-field Ising chain on `n` qubits under an annealing ramp: step s applies
 * exp(-i J(s) dt Z Z) on every bond and exp(-i h(s) dt X) on every site, J ramping up and h down,
 * so each step has two fresh angles. With n = 100 and 503 steps: 100,097 rotation instances and
 * 1,006 distinct angles.
 */
export function spinChainProgram(n: number, steps: number): string {
  const dt = 0.05;
  const lines = [
    "OPENQASM 3.0;",
    'include "stdgates.inc";',
    "// Halvorsen Materials Lab: annealing ramp of a transverse-field Ising chain (generated)",
    "gate zz(theta) a, b { cx a, b; rz(theta) b; cx a, b; }",
    `qubit[${n}] chain;`,
    `for uint i in [0:${n - 1}] { h chain[i]; }`,
  ];
  for (let s = 1; s <= steps; s++) {
    const f = s / steps;
    const j = 2 * (1.0 * f) * dt;
    const h = 2 * (1.3 * (1 - f) + 0.01) * dt;
    lines.push(`for uint i in [0:${n - 2}] { zz(${lit(j)}) chain[i], chain[i + 1]; }`);
    lines.push(`for uint i in [0:${n - 1}] { rx(${lit(h)}) chain[i]; }`);
  }
  return lines.join("\n") + "\n";
}

/** The textbook QFT on `n` qubits with controlled phases cp(pi/2^k), no final swaps. */
export function qftProgram(n: number): string {
  const lines = ["OPENQASM 3.0;", 'include "stdgates.inc";', "// Halvorsen Materials Lab: phase-readout register (generated)", `qubit[${n}] r;`];
  for (let i = 0; i < n; i++) {
    lines.push(`h r[${i}];`);
    for (let j = i + 1; j < n; j++) lines.push(`cp(pi/${(1n << BigInt(j - i)).toString()}) r[${j}], r[${i}];`);
  }
  return lines.join("\n") + "\n";
}
