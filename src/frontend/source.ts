// Source files: reading them as text (rejecting binary files) and finding include files.
import { existsSync, readFileSync, statSync } from "node:fs";
import { dirname, isAbsolute, join } from "node:path";
import { DiagnosticError, type Diagnostic } from "./diagnostics.js";
import type { SourceText } from "./syntax.js";

/** Where a file was asked for (an include statement), for diagnostics about it. */
export interface Origin {
  readonly file: string;
  readonly line: number;
  readonly col: number;
}

function error(origin: Origin, message: string, hint?: string): DiagnosticError {
  const d: Diagnostic = { severity: "error", file: origin.file, line: origin.line, col: origin.col, message, ...(hint ? { hint } : {}) };
  return new DiagnosticError([d]);
}

/**
 * A file's text. Binary content (a NUL byte, or bytes that are not UTF-8) is an input error, as is a
 * file that cannot be read; `origin` is where the diagnostic points (the include, or the file itself).
 */
export function readSourceFile(path: string, origin?: Origin): SourceText {
  const at = origin ?? { file: path, line: 0, col: 0 };
  let bytes: Buffer;
  try {
    if (statSync(path).isDirectory()) throw error(at, `cannot read '${path}': it is a directory`);
    bytes = readFileSync(path);
  } catch (e) {
    if (e instanceof DiagnosticError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === "ENOENT" ? "no such file" : code === "EACCES" ? "permission denied" : (e as Error).message;
    throw error(at, `cannot read '${path}': ${why}`);
  }
  return { file: path, text: decodeText(bytes, path, at) };
}

/** Bytes as UTF-8 text without a byte-order mark; an input error when they are not text. */
export function decodeText(bytes: Uint8Array, path: string, origin?: Origin): string {
  const at = origin ?? { file: path, line: 0, col: 0 };
  const nul = bytes.indexOf(0);
  if (nul >= 0) throw error(at, `not a text file: '${path}' contains a NUL byte (at byte ${nul})`, "give an OpenQASM source file");
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw error(at, `not a text file: '${path}' is not valid UTF-8`, "give an OpenQASM source file (UTF-8)");
  }
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** The path an include names: relative to the including file's folder, then to each include folder in order. */
export function findInclude(name: string, fromFile: string, includeDirs: readonly string[]): string | null {
  if (isAbsolute(name)) return existsSync(name) ? name : null;
  const candidates = [join(dirname(fromFile), name), ...includeDirs.map((d) => join(d, name))];
  for (const c of candidates) if (existsSync(c)) return c;
  return null;
}
