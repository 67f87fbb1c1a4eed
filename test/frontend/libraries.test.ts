// Tests of the include libraries: each library gate resolves to a canonical gate with the matrix its definition text gives.
import { describe, expect, it } from "vitest";
import type { Complex, Matrix } from "mathjs";
import { includeLibrary, includeSource } from "../../src/frontend/libraries.js";
import { gateInfo, type CMatrix } from "../../src/ir/gates.js";
import { angleDecimal } from "../../src/ir/angle-ops.js";
import { embed, fromMath, math, maxDiff, seeded, toMath } from "../ir/dense.js";

// ---- a tiny evaluator for the library texts: gate definitions over U, CX, gphase, ctrl @ and earlier gates ----

interface Def {
  readonly params: readonly string[];
  readonly qubits: readonly string[];
  readonly body: readonly string[];
}

function parseDefs(text: string): Map<string, Def> {
  const clean = text.replace(/\/\/[^\n]*/g, "");
  const defs = new Map<string, Def>();
  const re = /gate\s+(\w+)\s*(?:\(([^)]*)\))?\s*([^{]*)\{([^}]*)\}/g;
  for (const m of clean.matchAll(re)) {
    const list = (s: string | undefined): string[] => (s ?? "").split(",").map((x) => x.trim()).filter((x) => x !== "");
    defs.set(m[1]!, { params: list(m[2]), qubits: list(m[3]), body: m[4]!.split(";").map((x) => x.trim()).filter((x) => x !== "") });
  }
  return defs;
}

/** Split "name(args) q1, q2" into its parts, args at top-level commas. */
function splitCall(stmt: string): { ctrls: number; name: string; args: string[]; qargs: string[] } {
  let s = stmt;
  let ctrls = 0;
  for (let m = /^ctrl\s*@\s*/.exec(s); m; m = /^ctrl\s*@\s*/.exec(s)) {
    ctrls++;
    s = s.slice(m[0].length);
  }
  const name = /^\w+/.exec(s)![0];
  s = s.slice(name.length).trim();
  const args: string[] = [];
  if (s.startsWith("(")) {
    let depth = 0;
    let cur = "";
    let i = 0;
    for (; i < s.length; i++) {
      const ch = s[i]!;
      if (ch === "(") {
        depth++;
        if (depth === 1) continue;
      } else if (ch === ")") {
        depth--;
        if (depth === 0) break;
      } else if (ch === "," && depth === 1) {
        args.push(cur.trim());
        cur = "";
        continue;
      }
      cur += ch;
    }
    args.push(cur.trim());
    s = s.slice(i + 1);
  }
  const qargs = s.split(",").map((x) => x.trim()).filter((x) => x !== "");
  return { ctrls, name, args, qargs };
}

const c = (re: number, im = 0): Complex => math.complex(re, im);
const eix = (t: number): Complex => math.exp(c(0, t)) as Complex;
/** OpenQASM 3 builtin U (spec, "Built-in gates"); OpenQASM 2.0's U is the same up to phase, which 2.0 cannot see. */
const builtinU = (a: number, b: number, cc: number): Matrix =>
  math.matrix([
    [c(Math.cos(a / 2)), math.multiply(-Math.sin(a / 2), eix(cc)) as Complex],
    [math.multiply(Math.sin(a / 2), eix(b)) as Complex, math.multiply(Math.cos(a / 2), eix(b + cc)) as Complex],
  ]);
const builtinCX = math.matrix([[1, 0, 0, 0], [0, 1, 0, 0], [0, 0, 0, 1], [0, 0, 1, 0]].map((r) => r.map((v) => c(v))));

function ctrlOf(g: Matrix, n: number): Matrix {
  let m = g;
  for (let k = 0; k < n; k++) {
    const d = m.size()[0]!;
    const res = math.identity(2 * d) as Matrix;
    for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) res.set([d + i, d + j], m.get([i, j]));
    m = res;
  }
  return m;
}

/** The matrix the text defines for gate `name` at numeric parameters `vals`. */
function evalGate(defs: Map<string, Def>, name: string, vals: readonly number[]): Matrix {
  if (name === "U") return builtinU(vals[0]!, vals[1]!, vals[2]!);
  if (name === "CX") return builtinCX;
  if (name === "gphase") return math.matrix([[eix(vals[0]!)]]);
  const def = defs.get(name);
  if (!def) throw new Error(`undefined gate ${name}`);
  const n = def.qubits.length;
  const scope: Record<string, number> = { pi: Math.PI };
  def.params.forEach((p, i) => (scope[p] = vals[i]!));
  let u: CMatrix = fromMath(math.identity(1 << n) as Matrix);
  for (const stmt of def.body) {
    const call = splitCall(stmt);
    const args = call.args.map((a) => Number(math.evaluate(a, { ...scope })));
    const g = ctrlOf(evalGate(defs, call.name, args), call.ctrls);
    const idx = call.qargs.map((q) => {
      const k = def.qubits.indexOf(q);
      if (k < 0) throw new Error(`unknown qubit ${q} in ${name}`);
      return k;
    });
    const full: Matrix =
      idx.length === 0 ? (math.multiply(g.get([0, 0]) as Complex, math.identity(1 << n)) as Matrix) : toMath(embed(fromMath(g), idx, n));
    u = fromMath(math.multiply(full, toMath(u)) as Matrix);
  }
  return toMath(u);
}

const rnd = seeded(77);

describe("include libraries", () => {
  for (const file of ["stdgates.inc", "qelib1.inc"]) {
    describe(file, () => {
      const lib = includeLibrary(file)!;
      const defs = parseDefs(includeSource(file)!);

      it("the text defines exactly the gates of the map, with the same arity", () => {
        const builtins = file === "qelib1.inc" ? ["CX"] : []; // 2.0's builtin CX is in the map, not defined in the text
        expect([...defs.keys()].sort()).toEqual([...lib.keys()].filter((k) => !builtins.includes(k)).sort());
        for (const [name, d] of defs) {
          expect(lib.get(name)!.numParams, name).toBe(d.params.length);
          expect(lib.get(name)!.numQubits, name).toBe(d.qubits.length);
        }
      });

      it("every library gate resolves to a canonical gate with the matrix its definition gives", () => {
        for (const g of lib.values()) {
          for (let trial = 0; trial < 2; trial++) {
            const vals = Array.from({ length: g.numParams }, () => (rnd() * 2 - 1) * 2 * Math.PI);
            const r = g.resolve(vals.map((v) => angleDecimal(v.toPrecision(17))));
            const info = gateInfo(r.name);
            expect(info, `${g.name} -> ${r.name}`).toBeDefined();
            expect(info!.numQubits).toBe(g.numQubits);
            let got = info!.matrix(r.params.map((p) => Number(p.value)));
            if (r.phase) got = fromMath(math.multiply(eix(Number(r.phase.value)), toMath(got)) as Matrix);
            const want = defs.has(g.name) ? evalGate(defs, g.name, vals) : builtinCX;
            expect(maxDiff(got, fromMath(want)), `${file} ${g.name}(${vals.join(",")})`).toBeLessThan(1e-10);
          }
        }
      });
    });
  }

  it("qelib1's multi-controlled gates are the exact controlled gates (derivation from its definitions)", () => {
    // qelib1.inc definitions of c3x, c3sqrtx, c4x recalled from memory; the text's c4x uses the inverse of rc3x
    const lib = includeLibrary("qelib1.inc")!;
    expect(lib.get("c3x")!.resolve([]).name).toBe("c3x");
    expect(lib.get("c4x")!.resolve([]).name).toBe("c4x");
    expect(lib.get("c3sqrtx")!.resolve([]).name).toBe("c3sqrtx");
    expect(lib.get("cu3")!.resolve([angleDecimal("0.1"), angleDecimal("0.2"), angleDecimal("0.3")]).name).toBe("cu");
  });

  it("knows only the two standard includes", () => {
    expect(includeLibrary("mylib.inc")).toBeNull();
    expect(includeSource("mylib.inc")).toBeNull();
    expect(includeLibrary("stdgates.inc")!.has("U")).toBe(false);
    expect(includeLibrary("stdgates.inc")!.has("gphase")).toBe(false);
  });
});
