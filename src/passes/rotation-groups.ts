// Collect the z-rotations left for approximation, grouped by distinct angle and by source location, in program order.
import type { Angle } from "../ir/angle.js";
import type { GateOp, SourceLoc, Stmt } from "../ir/circuit.js";

/** One distinct angle to synthesize: every executed instance of rz by this angle shares one word. */
export interface RotationGroup {
  readonly key: string;
  readonly angle: Angle;
  instances: number;
}

/** One ledger line: the instances of one distinct angle that come from one source location. */
export interface RotationSite {
  readonly loc: SourceLoc;
  readonly group: number;
  instances: number;
  /** True when the site lies inside an if/else or while block (counted once per appearance). */
  conditional: boolean;
  /** True when the site lies inside a while body (its error is spent again on every iteration). */
  inLoop: boolean;
}

export interface RotationCensus {
  readonly groups: RotationGroup[];
  readonly sites: RotationSite[];
  /** For each rz op in program order (depth first), the index of its group. */
  readonly opGroup: Map<GateOp, number>;
}

/** The key two rotations share when one synthesized word serves both. */
export function angleKey(a: Angle): string {
  return a.value;
}

export function locKey(loc: SourceLoc): string {
  return `${loc.file}:${loc.line}:${loc.col}`;
}

/** Census of the rz ops in `body` (which must hold no exact pi/4-multiples any more). */
export function censusRotations(body: readonly Stmt[]): RotationCensus {
  const groups: RotationGroup[] = [];
  const sites: RotationSite[] = [];
  const byKey = new Map<string, number>();
  const siteByKey = new Map<string, number>();
  const opGroup = new Map<GateOp, number>();

  const visit = (stmts: readonly Stmt[], conditional: boolean, inLoop: boolean): void => {
    for (const s of stmts) {
      switch (s.kind) {
        case "gate": {
          if (s.name !== "rz") break;
          const a = s.params[0]!;
          const key = angleKey(a);
          let g = byKey.get(key);
          if (g === undefined) {
            g = groups.length;
            byKey.set(key, g);
            groups.push({ key, angle: a, instances: 0 });
          }
          groups[g]!.instances++;
          opGroup.set(s, g);
          const sk = `${locKey(s.loc)}\u0000${g}`;
          let si = siteByKey.get(sk);
          if (si === undefined) {
            si = sites.length;
            siteByKey.set(sk, si);
            sites.push({ loc: s.loc, group: g, instances: 0, conditional, inLoop });
          }
          const site = sites[si]!;
          site.instances++;
          site.conditional ||= conditional;
          site.inLoop ||= inLoop;
          break;
        }
        case "if":
          visit(s.then, true, inLoop);
          visit(s.else, true, inLoop);
          break;
        case "while":
          visit(s.body, true, true);
          break;
        case "box":
          visit(s.body, conditional, inLoop);
          break;
        default:
          break;
      }
    }
  };
  visit(body, false, false);
  return { groups, sites, opGroup };
}
