// tledger's version, read once from the package's own package.json (found by walking up from this module).
import { existsSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

let cached: string | null = null;

export function toolVersion(): string {
  if (cached !== null) return cached;
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i++) {
    const p = join(dir, "package.json");
    if (existsSync(p)) {
      const pkg = JSON.parse(readFileSync(p, "utf8")) as { name?: string; version?: string };
      if (pkg.name === "tledger" && pkg.version) return (cached = pkg.version);
    }
    dir = dirname(dir);
  }
  return (cached = "0.0.0");
}
