// What every command shares: diagnostics as text, exit codes (2 input error, 1 internal fault), atomic output files, common options.
import { closeSync, fsyncSync, openSync, readFileSync, renameSync, unlinkSync, writeSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { Chalk, type ChalkInstance } from "chalk";
import { DiagnosticError, type Diagnostic } from "../frontend/diagnostics.js";

/** Where a command writes. Tests pass their own; the real CLI writes to the process streams. */
export interface Io {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** Colour diagnostics (the CLI: stderr is a TTY and NO_COLOR is unset). */
  readonly color: boolean;
}

export function processIo(): Io {
  return {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    color: Boolean(process.stderr.isTTY) && process.env.NO_COLOR === undefined,
  };
}

export const EXIT_OK = 0;
export const EXIT_INTERNAL = 1;
export const EXIT_INPUT = 2;

/** An input error found by the CLI itself (a bad option value), reported like a diagnostic. */
export function usageError(message: string, hint?: string): DiagnosticError {
  return new DiagnosticError([{ severity: "error", file: "tledger", line: 0, col: 0, message, ...(hint ? { hint } : {}) }]);
}

/** The line `line` (1-based) of a file, or null when it cannot be read as text. */
export function sourceLine(file: string, line: number): string | null {
  if (line < 1) return null;
  try {
    const bytes = readFileSync(file);
    if (bytes.includes(0)) return null;
    const lines = bytes.toString("utf8").split("\n");
    const l = lines[line - 1];
    return l === undefined ? null : l.replace(/\r$/, "");
  } catch {
    return null;
  }
}

/**
 * A diagnostic as text:
 *   file:line:col: error: message
 *     the source line
 *     ^ (under the column)
 *   hint: ...
 * `source` gives the line's text (null: no source lines shown).
 */
export function formatDiagnostic(d: Diagnostic, source: string | null, color: boolean): string {
  const c: ChalkInstance = new Chalk({ level: color ? 1 : 0 });
  const file = d.file === "" ? "tledger" : d.file;
  const where = d.line > 0 ? `${file}:${d.line}:${d.col}:` : `${file}:`;
  const sev = d.severity === "error" ? c.red.bold("error:") : c.yellow.bold("warning:");
  const lines = [`${c.bold(where)} ${sev} ${d.message}`];
  if (source !== null && d.line > 0) {
    const chars = Array.from(source);
    const col = Math.max(1, d.col);
    const pad = chars
      .slice(0, col - 1)
      .map((ch) => (ch === "\t" ? "\t" : " "))
      .join("");
    lines.push(`  ${source}`);
    lines.push(`  ${pad}${c.green.bold("^")}`);
  }
  if (d.hint) lines.push(`${c.cyan.bold("hint:")} ${d.hint}`);
  return lines.join("\n") + "\n";
}

export interface RunOptions {
  /** Show stack traces of internal faults. */
  readonly debug?: boolean;
  readonly io?: Io;
  /** Source lines for diagnostics (default: read the file named by the diagnostic). */
  readonly readLine?: (file: string, line: number) => string | null;
}

/**
 * Run a command and turn its outcome into an exit code: 0 on success, 2 with formatted diagnostics on
 * an input error (DiagnosticError), 1 with one line (a stack trace only with `debug`) on anything else.
 */
export async function runCommand(fn: (io: Io) => Promise<void> | void, opts: RunOptions = {}): Promise<number> {
  const io = opts.io ?? processIo();
  try {
    await fn(io);
    return EXIT_OK;
  } catch (e) {
    if (e instanceof DiagnosticError) {
      const read = opts.readLine ?? sourceLine;
      for (const d of e.diagnostics) io.stderr(formatDiagnostic(d, read(d.file, d.line), io.color));
      if (opts.debug && e.stack) io.stderr(e.stack + "\n");
      return EXIT_INPUT;
    }
    const err = e instanceof Error ? e : new Error(String(e));
    io.stderr(`tledger: internal error: ${err.message}${opts.debug ? "" : " (run with --debug for details)"}\n`);
    if (opts.debug && err.stack) io.stderr(err.stack + "\n");
    return EXIT_INTERNAL;
  }
}

/**
 * Write a file so that it is either complete or untouched: `fill` writes the content to a temporary
 * file in the same folder, which is then renamed over the target. If anything throws (`fill` included),
 * the temporary file is removed and the target is left as it was.
 */
function writeAtomicWith(path: string, fill: (fd: number) => void): void {
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now()}.tmp`);
  let fd: number | null = null;
  try {
    fd = openSync(tmp, "w");
    fill(fd);
    fsyncSync(fd);
    closeSync(fd);
    fd = null;
    renameSync(tmp, path);
  } catch (e) {
    if (fd !== null) closeSync(fd);
    try {
      unlinkSync(tmp);
    } catch {
      // nothing to clean up
    }
    const code = (e as NodeJS.ErrnoException).code;
    if (code === "ENOENT" || code === "EACCES" || code === "EISDIR" || code === "ENOTDIR" || code === "EROFS") {
      throw usageError(`cannot write '${path}': ${code === "ENOENT" ? "no such folder" : code === "EACCES" ? "permission denied" : code.toLowerCase()}`);
    }
    throw e;
  }
}

/** Write all of `text` (a single write call may write less than asked, e.g. past 2 GB on Linux). */
function writeAll(fd: number, text: string): void {
  const bytes = Buffer.from(text, "utf8");
  for (let off = 0; off < bytes.length; ) off += writeSync(fd, bytes, off, bytes.length - off);
}

/** Write a file atomically (complete or untouched; see writeAtomicWith). */
export function writeFileAtomic(path: string, text: string): void {
  writeAtomicWith(path, (fd) => writeAll(fd, text));
}

/**
 * Write a file atomically from a producer of chunks: `write` hands each chunk to the sink it is given,
 * in order, and each goes straight to disk. If `write` throws midway, no file is left and an existing
 * target is untouched.
 */
export function writeFileAtomicChunks(path: string, write: (sink: (chunk: string) => void) => void): void {
  writeAtomicWith(path, (fd) => write((chunk) => writeAll(fd, chunk)));
}

/** Output of a command: to a file (atomically) when one is given, else to stdout. */
export function writeOutput(text: string, out: string | undefined, io: Io): void {
  if (out === undefined || out === "-") io.stdout(text);
  else writeFileAtomic(out, text);
}

/** `--param name=value` options as a record (values are OpenQASM expressions). */
export function parseParams(list: readonly string[] | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const item of list ?? []) {
    const eq = item.indexOf("=");
    const name = eq < 0 ? "" : item.slice(0, eq).trim();
    if (eq < 0 || !/^[A-Za-z_\p{L}][A-Za-z0-9_\p{L}]*$/u.test(name)) {
      throw usageError(`--param expects name=value, got '${item}'`, "for example --param theta=0.3 or --param phi=pi/8");
    }
    if (name in out) throw usageError(`--param '${name}' is given twice`);
    out[name] = item.slice(eq + 1);
  }
  return out;
}

/** Collects a repeatable option's values (commander's argParser). */
export function collect(value: string, previous: string[] | undefined): string[] {
  return [...(previous ?? []), value];
}
