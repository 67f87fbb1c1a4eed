// What the lowering passes share besides the circuit: options in, counts and ledger facts out.
import type { Angle } from "../ir/angle.js";
import type { SourceLoc } from "../ir/circuit.js";

/** A literal angle snapped to an exact multiple of pi/4 (only with --snap); its error enters the ledger. */
export interface SnapRecord {
  readonly loc: SourceLoc;
  readonly from: string;
  readonly to: Angle;
  readonly error: string;
}

export interface LoweringContext {
  /** Snap literal angles equal to k*pi/4 in double precision (the snap error is booked). */
  readonly snap: boolean;
  readonly snaps: SnapRecord[];
  /** Rotation instances that became exact words at zero error. */
  exactRotations: number;
}

export function newLoweringContext(opts: { snap?: boolean } = {}): LoweringContext {
  return { snap: opts.snap ?? false, snaps: [], exactRotations: 0 };
}
