// The build works molecule batch by molecule batch so its memory does not grow with the atlas;
// the site it writes must not depend on the batch size.
import { createHash } from "node:crypto";
import { mkdtempSync, readdirSync, readFileSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { buildSite } from "../lib/build/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";

function digests(root: string): Map<string, string> {
  const out = new Map<string, string>();
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) walk(path);
      else out.set(relative(root, path), createHash("sha256").update(readFileSync(path)).digest("hex"));
    }
  };
  walk(root);
  return out;
}

describe("a build in batches of molecules", () => {
  it("writes byte-identical files with one molecule per batch and with the whole atlas in one batch", async () => {
    const dir = mkdtempSync(join(tmpdir(), "bandatlas-batches-"));
    const build = { version: "0.0.0-test", commit: "test", dateIso: "2026-01-01T00:00:00Z" };
    const one = await buildSite({ moleculesDir: shippedMoleculesDir, outDir: join(dir, "one"), sheets: false, build, moleculesPerBatch: 1 });
    const all = await buildSite({ moleculesDir: shippedMoleculesDir, outDir: join(dir, "all"), sheets: false, build, moleculesPerBatch: 1000 });
    expect(one.pages).toBe(all.pages);
    const a = digests(join(dir, "one"));
    const b = digests(join(dir, "all"));
    expect([...a.keys()].sort()).toEqual([...b.keys()].sort());
    const differing = [...a].filter(([path, digest]) => b.get(path) !== digest).map(([path]) => path);
    expect(differing).toEqual([]);
  }, 120_000);
});
