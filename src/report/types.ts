// The report record of `tledger lower` (JSON schema version 1): error budget, ledger rows and circuit figures.

/** The JSON schema version this code writes and reads. */
export const SCHEMA_VERSION = 1;

/**
 * Decimal figures (budget, epsilon, errors) are decimal strings, never JSON numbers, so that a
 * report says exactly what was computed and reads back without a binary round trip:
 * - `budget` is the budget as given, exactly, in canonical form (see `canonicalDecimal`);
 * - errors (`errorBound`, row `error`) are rounded *up* to FIGURE_DIGITS significant digits, so
 *   the printed figure is still an upper bound;
 * - allocated shares (row `epsilon`) are rounded *down* to FIGURE_DIGITS significant digits, so
 *   printed shares never add up to more than was allocated.
 * A consumer wanting a float uses `Number(text)`; nothing exact should be decided from it.
 */
export const FIGURE_DIGITS = 12;

/** A value of a recorded option: only JSON scalars. */
export type OptionValue = string | number | boolean | null;

export interface ToolInfo {
  readonly name: "tledger";
  readonly version: string;
}

/** The rotation angle of a ledger row. */
export interface LedgerAngle {
  /** The angle in radians as a decimal string (exact for decimal literals, else ANGLE_REPORT_DIGITS significant digits). */
  readonly value: string;
  /** The exact form as an OpenQASM expression (`3*pi/8`, `-pi/4`, `0`) when the angle is a known rational multiple of pi, else null. */
  readonly pi: string | null;
}

/** One ledger row: identical lowerings of one source rotation, grouped. */
export interface LedgerRow {
  /** `file:line:col` of the source statement. */
  readonly location: string;
  /** The rotation gate that was lowered (after decomposition: rz, rx, ry, ...). */
  readonly gate: string;
  readonly angle: LedgerAngle;
  /** The error share allocated to one instance (decimal string, rounded down). */
  readonly epsilon: string;
  /** The error achieved by one instance, `d(U, V)` in the operator norm up to phase (decimal string, rounded up). */
  readonly error: string;
  /** T gates in the word of one instance. */
  readonly tCount: number;
  /** How the rotation was lowered (e.g. "exact", "grid", "sk"), as the lowering pass names it. */
  readonly method: string;
  /** How many times this row occurs in the lowered program text (loops unrolled count each copy). */
  readonly instances: number;
  /** Inside an if/else branch or a while body: counted once per appearance whether it runs or not. */
  readonly conditional: boolean;
  /** Inside a while body: its error is spent again on every iteration. */
  readonly inLoop: boolean;
}

/** The rotations the lowering pass met (instances). */
export interface RotationCounts {
  /** exact + approximated. */
  readonly total: number;
  /** Angles known exactly to be multiples of pi/4: lowered with no error. */
  readonly exact: number;
  /** Rotations approximated within an error share. */
  readonly approximated: number;
  /** Distinct approximation problems (angle, share) among the approximated ones. */
  readonly distinct: number;
  /** Distinct problems answered from the synthesis cache rather than a fresh search. */
  readonly cached: number;
}

/** Per-qubit T figures (see `QubitFigures` in metrics.ts). */
export interface QubitRow {
  readonly qubit: number;
  readonly label: string;
  readonly tCount: number;
  readonly tDepth: number;
}

/**
 * The report of one `tledger lower` run. Circuit figures describe the lowered circuit and
 * follow the definitions of `Metrics` (src/report/metrics.ts).
 */
export interface Report {
  readonly schemaVersion: typeof SCHEMA_VERSION;
  readonly tool: ToolInfo;
  /** The options that shape the output, keys in ascending code unit order. */
  readonly options: Readonly<Record<string, OptionValue>>;
  /** The error budget as given (decimal string, exact). */
  readonly budget: string;
  /** Sum over ledger rows of error * instances (decimal string, rounded up). */
  readonly errorBound: string;
  /** True when some approximated rotation sits in a while body: the bound then holds per loop iteration. */
  readonly boundPerIteration: boolean;
  readonly qubits: number;
  readonly gates: number;
  readonly depth: number;
  readonly tCount: number;
  readonly tDepth: number;
  readonly cxCount: number;
  readonly cliffordCount: number;
  readonly measurements: number;
  readonly resets: number;
  /** Gates, measurements and resets inside if/else branches or while bodies. */
  readonly conditionalOps: number;
  /** Gates of the lowered circuit still carrying an angle that is not a multiple of pi/4 (0 after a full lowering). */
  readonly remainingRotations: number;
  readonly rotations: RotationCounts;
  /** Rows sorted by location (file, line, column), then gate, angle, method, epsilon, error. */
  readonly ledger: readonly LedgerRow[];
  readonly perQubit: readonly QubitRow[];
  /** Gate counts of the lowered circuit by name (with control modifiers), keys in ascending code unit order. */
  readonly gateCounts: Readonly<Record<string, number>>;
}
