// Diagnostics: errors as values (file, line, column, message, hint); the CLI alone turns them into text and exit codes.

export type Severity = "error" | "warning";

export interface Diagnostic {
  readonly severity: Severity;
  readonly file: string;
  /** 1-based; 0 when the diagnostic has no position (a missing file, say). */
  readonly line: number;
  /** 1-based; 0 when unknown. */
  readonly col: number;
  readonly message: string;
  readonly hint?: string;
}

/** Thrown to abort a phase with one or more diagnostics; the CLI catches it and prints them. */
export class DiagnosticError extends Error {
  constructor(readonly diagnostics: readonly Diagnostic[]) {
    super(diagnostics.map((d) => `${d.file}:${d.line}:${d.col}: ${d.message}`).join("\n"));
    this.name = "DiagnosticError";
  }
}
