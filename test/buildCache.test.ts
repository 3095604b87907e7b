// bandatlas serve keeps per-molecule results between rebuilds (lib/build/buildCache.ts). What it
// must guarantee: a rebuild after a save is byte for byte the site a cold build makes of the same
// files, and only the saved molecule is computed again.
import { cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, relative } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { BuildCache, buildSite, keptPagesKind } from "../lib/build/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";

const work = mkdtempSync(join(tmpdir(), "bandatlas-cache-test-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));
const build = { version: "0.0.0-test", commit: "test", dateIso: "2026-01-01T00:00:00Z" };

function files(dir: string): Map<string, Buffer> {
  const out = new Map<string, Buffer>();
  const walk = (d: string) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const p = join(d, e.name);
      if (e.isDirectory()) walk(p);
      else out.set(relative(dir, p), readFileSync(p));
    }
  };
  walk(dir);
  return out;
}

describe("rebuilds with a build cache", () => {
  it("make the same bytes as a cold build and recompute only the saved molecule", async () => {
    const molecules = join(work, "molecules");
    mkdirSync(molecules);
    cpSync(join(shippedMoleculesDir, "hf.yaml"), join(molecules, "hf.yaml"));
    cpSync(join(shippedMoleculesDir, "hi.yaml"), join(molecules, "hi.yaml"));
    const cache = new BuildCache();
    await buildSite({ moleculesDir: molecules, outDir: join(work, "served"), sheets: false, build, cache });
    const first = cache.lastBuild;
    const hf = join(molecules, "hf.yaml");
    writeFileSync(hf, readFileSync(hf, "utf8").replace(/^name: (.*)$/m, "name: $1 (edited)"));
    const report = await buildSite({ moleculesDir: molecules, outDir: join(work, "served"), sheets: false, build, cache });
    const second = cache.lastBuild;
    // Unchanged files (all of hi's) are linked from the site being replaced, hf's written again.
    expect(report.files.linked).toBeGreaterThan(report.files.written);
    expect(report.files.written).toBeGreaterThan(0);
    await buildSite({ moleculesDir: molecules, outDir: join(work, "cold"), sheets: false, build });

    // Every per-molecule result of both molecules was computed the first time; the second time
    // hf's were computed again (its file changed) and hi's reused, as many of each.
    expect(first.reused).toBe(0);
    expect(second.computed).toBe(first.computed / 2);
    expect(second.reused).toBe(first.computed / 2);

    const served = files(join(work, "served"));
    const cold = files(join(work, "cold"));
    expect([...served.keys()].sort()).toEqual([...cold.keys()].sort());
    for (const [path, bytes] of cold) expect(Buffer.compare(served.get(path)!, bytes), path).toBe(0);
    expect(served.get("molecules/hf/index.html")!.toString()).toContain("(edited)");

    // A changed template (serve forgets the kept pages) renders both molecules' pages again, and
    // nothing else: one result per molecule computed, the same bytes written.
    cache.forget(keptPagesKind);
    await buildSite({ moleculesDir: molecules, outDir: join(work, "served"), sheets: false, build, cache });
    expect(cache.lastBuild.computed).toBe(2);
    const again = files(join(work, "served"));
    for (const [path, bytes] of cold) expect(Buffer.compare(again.get(path)!, bytes), path).toBe(0);
  }, 120_000);
});
