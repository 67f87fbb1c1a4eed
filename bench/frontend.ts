// Front-end benchmark: parse + expand time and peak memory for generated spin-chain programs of 10^4, 10^5 and 10^6 gate statements.
import { fork } from "node:child_process";
import { fileURLToPath } from "node:url";
import { parseQasmText } from "../src/frontend/frontend.js";

const SIZES = [10_000, 100_000, 1_000_000];
const QUBITS = 12;
const ANGLES = ["0.0625", "pi/7", "-0.3125", "3*pi/16", "0.123456789", "-tau/40", "2.5e-2"];

/** A Heisenberg-chain Trotter program with `n` gate statements (rotations with several distinct angles, CX ladders). */
export function spinChainProgram(n: number): string {
  const parts: string[] = ['OPENQASM 3.0;\ninclude "stdgates.inc";\n', `qubit[${QUBITS}] q;\n`];
  for (let i = 0; i < n; i++) {
    const a = i % QUBITS;
    const b = (a + 1) % QUBITS;
    switch (i % 6) {
      case 0:
        parts.push(`h q[${a}];\n`);
        break;
      case 1:
        parts.push(`cx q[${a}], q[${b}];\n`);
        break;
      case 2:
        parts.push(`rz(${ANGLES[i % ANGLES.length]}) q[${b}];\n`);
        break;
      case 3:
        parts.push(`cx q[${a}], q[${b}];\n`);
        break;
      case 4:
        parts.push(`rx(${ANGLES[(i * 3) % ANGLES.length]}) q[${a}];\n`);
        break;
      default:
        parts.push(`ry(-${ANGLES[(i * 5) % ANGLES.length]}) q[${b}];\n`);
    }
  }
  return parts.join("");
}

interface Measurement {
  readonly statements: number;
  readonly ops: number;
  readonly seconds: number;
  readonly peakRssMb: number;
  readonly heapAfterMb: number;
}

/** One size, in this process: generate, then time parse + expand; peak RSS is the process's maximum. */
function measure(n: number): Measurement {
  const text = spinChainProgram(n);
  const t0 = performance.now();
  const c = parseQasmText(text, "bench.qasm");
  const seconds = (performance.now() - t0) / 1000;
  const heapAfterMb = process.memoryUsage().heapUsed / 1e6;
  return { statements: n, ops: c.body.length, seconds, peakRssMb: process.resourceUsage().maxRSS / 1024, heapAfterMb };
}

/** Each size in a fresh child process, so peak memory is that size's own. */
function measureInChild(n: number): Promise<Measurement> {
  return new Promise((resolve, reject) => {
    const child = fork(fileURLToPath(import.meta.url), [], { env: { ...process.env, TLEDGER_BENCH_FRONTEND: String(n) }, stdio: ["ignore", "inherit", "inherit", "ipc"] });
    let result: Measurement | null = null;
    child.on("message", (m) => {
      result = m as Measurement;
    });
    child.on("error", reject);
    child.on("exit", (code) => (result ? resolve(result) : reject(new Error(`benchmark child exited with code ${code}`))));
  });
}

export async function benchFrontend(): Promise<string> {
  const rows: string[] = [
    "| gate statements | IR ops | parse + expand (s) | statements/s | peak RSS (MB) | heap after (MB) |",
    "| ---: | ---: | ---: | ---: | ---: | ---: |",
  ];
  for (const n of SIZES) {
    const m = await measureInChild(n);
    rows.push(
      `| ${m.statements.toLocaleString("en-US")} | ${m.ops.toLocaleString("en-US")} | ${m.seconds.toFixed(2)} | ${Math.round(m.statements / m.seconds).toLocaleString("en-US")} | ${m.peakRssMb.toFixed(0)} | ${m.heapAfterMb.toFixed(0)} |`,
    );
  }
  rows.push("", `Programs: ${QUBITS}-qubit spin chain (h, cx, rz, rx, ry; ${ANGLES.length} distinct angle spellings), generated in memory; each size runs in its own process.`);
  return rows.join("\n");
}

if (process.env.TLEDGER_BENCH_FRONTEND && process.send) {
  const m = measure(Number(process.env.TLEDGER_BENCH_FRONTEND));
  process.send(m, () => process.exit(0));
}
