// Records the HTML report and the sweep chart draw from besides the lowering report: sweep points and rotation estimates.

/** One lowering of the same program at one error budget (what `tledger sweep` measures). */
export interface SweepPoint {
  /** The error budget given to this lowering (decimal string, > 0). */
  readonly budget: string;
  readonly tCount: number;
  readonly tDepth: number;
  /** The ledger's error bound for this lowering (decimal string, rounded up). */
  readonly errorBound: string;
  /** Wall-clock seconds the lowering took (shown as given; the page adds no time of its own). */
  readonly seconds: number;
}

/** The estimated cost of one source rotation that a lowering would have to approximate. */
export interface RotationEstimate {
  /** `file:line:col` of the source statement. */
  readonly location: string;
  readonly gate: string;
  /** The angle as an OpenQASM expression (`3*pi/8`) or a decimal string. */
  readonly angle: string;
  /** How many times the rotation occurs in the program text. */
  readonly instances: number;
  /** The error share one instance would get (decimal string). */
  readonly share: string;
  /** Estimated T gates for one instance at that share. */
  readonly tEach: number;
}

/** Estimates for the rotations of a circuit that has not been lowered (the `report` command). */
export interface EstimateTable {
  /** The budget the estimate assumes (decimal string). */
  readonly budget: string;
  /** One sentence saying how `tEach` was estimated (shown under the table). */
  readonly basis: string;
  /** In source order (file, line, column): the page shows them so and sorts "where" by this order. */
  readonly rows: readonly RotationEstimate[];
}
