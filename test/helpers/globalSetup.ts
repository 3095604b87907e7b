// Builds the shipped atlas once for the whole test run (site and bench sheets): the tests that
// only read it (links, the browser pages) take it from here instead of building it again each.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { TestProject } from "vitest/node";
import { buildSite, type BuildReport } from "../../lib/build/index.ts";
import { shippedMoleculesDir } from "../../lib/cli/moleculeSource.ts";

declare module "vitest" {
  export interface ProvidedContext {
    /** The shipped atlas built once for the run (read it; do not change it). */
    shippedSite: Pick<BuildReport, "outDir" | "molecules" | "entries" | "sheets">;
  }
}

export default async function setup(project: TestProject): Promise<() => void> {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-shipped-"));
  const report = await buildSite({ moleculesDir: shippedMoleculesDir, outDir: join(work, "site") });
  project.provide("shippedSite", { outDir: report.outDir, molecules: report.molecules, entries: report.entries, sheets: report.sheets });
  return () => rmSync(work, { recursive: true, force: true });
}
