// Pass: z-rotations by exact multiples of pi/4 become exact Clifford+T words at zero error; --snap also takes literals that equal one in double precision.
import type { Circuit, Stmt } from "../ir/circuit.js";
import { anglePi, angleValue, rational } from "../ir/angle-ops.js";
import { dec, PI } from "../numeric/decimal.js";
import { exactRotationWord } from "../synth/exact/exact-angles.js";
import type { LoweringContext } from "./lowering-context.js";
import { wordOps } from "./word-ops.js";

/** Error of replacing rz(a) by rz(b): d = 2 sin(|a - b| / 4) (synthesis.md section 1), as a decimal string. */
export function rzSnapError(delta: ReturnType<typeof dec>): string {
  return delta.abs().div(4).sin().times(2).toSignificantDigits(6, 0 /* ROUND_UP */).toString();
}

export function exactAngles(circuit: Circuit, ctx: LoweringContext): Circuit {
  const visit = (body: readonly Stmt[]): Stmt[] => {
    const out: Stmt[] = [];
    for (const s of body) {
      if (s.kind === "if") {
        out.push({ ...s, then: visit(s.then), else: visit(s.else) });
        continue;
      }
      if (s.kind === "while" || s.kind === "box") {
        out.push({ ...s, body: visit(s.body) });
        continue;
      }
      if (s.kind !== "gate" || s.name !== "rz") {
        out.push(s);
        continue;
      }
      let a = s.params[0]!;
      if (a.pi === null && ctx.snap) {
        // Snap only when the literal is, in double precision, exactly k*pi/4 for an integer k.
        const x = Number(a.value);
        const k = Math.round((x * 4) / Math.PI);
        if (Number.isSafeInteger(k) && (k * Math.PI) / 4 === x) {
          const snapped = anglePi(rational(BigInt(k), 4n));
          const err = rzSnapError(angleValue(a).minus(PI.times(k).div(4)));
          ctx.snaps.push({ loc: s.loc, from: a.value, to: snapped, error: err });
          a = snapped;
        }
      }
      if (a.pi !== null) {
        const w = exactRotationWord("rz", a.pi);
        if (w) {
          ctx.exactRotations++;
          out.push(...wordOps(w.word, s.qubits[0]!, s.loc));
          continue;
        }
      }
      out.push(s);
    }
    return out;
  };
  return { ...circuit, body: visit(circuit.body) };
}
