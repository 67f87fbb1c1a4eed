// Synthesis results cached in memory and, optionally, on disk; every disk entry is re-verified before use.
import { createHash } from "node:crypto";
import { mkdirSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { join } from "node:path";

/** What identifies one synthesis: the same key must always give the same word. */
export interface SynthKey {
  readonly method: string;
  /** The rotation angle in radians as the IR's decimal string. */
  readonly angle: string;
  readonly eps: string;
}

/** Bump when the engine can return a different word for the same key: older entries are then ignored. */
export const ENGINE_VERSION = "tledger-synth-2";

export function keyString(k: SynthKey): string {
  return `${ENGINE_VERSION}|${k.method}|${k.angle}|${k.eps}`;
}

/**
 * A two-level cache. `verify(key, value)` must recompute, from the stored word alone, that it meets
 * the key (its exact matrix is within eps of the target) and return the value to use (with the
 * error as recomputed), or null to reject it; a rejected or unreadable file is ignored and counted.
 */
export class SynthCache<V> {
  private readonly memory = new Map<string, V>();
  rejected = 0;

  constructor(
    private readonly dir: string | null,
    private readonly verify: (key: SynthKey, value: V) => V | null,
  ) {
    if (dir) mkdirSync(dir, { recursive: true });
  }

  private file(k: string): string {
    return join(this.dir!, createHash("sha256").update(k).digest("hex").slice(0, 40) + ".json");
  }

  /** The cached value and where it came from, or null. */
  get(key: SynthKey): { value: V; from: "memory" | "disk" } | null {
    const k = keyString(key);
    const m = this.memory.get(k);
    if (m !== undefined) return { value: m, from: "memory" };
    if (!this.dir) return null;
    let text: string;
    try {
      text = readFileSync(this.file(k), "utf8");
    } catch {
      return null;
    }
    try {
      const entry = JSON.parse(text) as { key?: string; value?: V };
      if (entry.key !== k || entry.value === undefined) {
        this.rejected++;
        return null;
      }
      const checked = this.verify(key, entry.value);
      if (checked === null) {
        this.rejected++;
        return null;
      }
      this.memory.set(k, checked);
      return { value: checked, from: "disk" };
    } catch {
      this.rejected++;
      return null;
    }
  }

  /** Remember a value; with a disk cache, write it atomically (temporary file, then rename). */
  set(key: SynthKey, value: V): void {
    const k = keyString(key);
    this.memory.set(k, value);
    if (!this.dir) return;
    const path = this.file(k);
    const tmp = `${path}.${process.pid}.tmp`;
    writeFileSync(tmp, JSON.stringify({ key: k, value }) + "\n");
    renameSync(tmp, path);
  }
}
