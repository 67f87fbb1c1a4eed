// The front end's entry points: an OpenQASM file or text in, the circuit IR out (or a DiagnosticError).
import type { Circuit } from "../ir/circuit.js";
import { expandProgram, type FrontendOptions } from "./expand.js";
import { readSourceFile } from "./source.js";
import type { Angle } from "../ir/angle.js";
import { parseExpressionText } from "./syntax.js";
import { evalAngle } from "./evaluate.js";
import { Scope } from "./scope.js";

export type { FrontendOptions };

/** Parse, analyse and expand an OpenQASM 3 (or 2.0) file into the IR. Throws DiagnosticError on input errors. */
export function parseQasmFile(path: string, opts: FrontendOptions = {}): Circuit {
  return expandProgram(readSourceFile(path), opts);
}

/**
 * The same for program text already in memory; `file` names it in diagnostics and locations, and
 * relative includes are looked for next to it.
 */
export function parseQasmText(text: string, file: string = "<input>", opts: FrontendOptions = {}): Circuit {
  return expandProgram({ file, text: text.charCodeAt(0) === 0xfeff ? text.slice(1) : text }, opts);
}

/** An OpenQASM expression (e.g. `3*pi/8`, `0.1`, `sin(0.3)`) as an exact-when-known angle; `file` names it in diagnostics. */
export function evaluateAngleText(text: string, file: string = "<expression>"): Angle {
  const expr = parseExpressionText({ file, text });
  return evalAngle(expr, { file, scope: new Scope("global", null) });
}
