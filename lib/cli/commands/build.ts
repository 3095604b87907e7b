import { join } from "node:path";
import { BuildError, buildSite, repoDir, siteStats } from "../../build/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { parseCommandLine } from "../options.ts";
import type { CommandResult } from "../../shared/commandResult.ts";

export const buildHelp = `bandatlas build [options]

Builds the whole atlas as a static website (pages, plots, CSV/JSON downloads, search indexes,
bench sheets) into site/. Every molecule file is checked first; the new site replaces the old
one only when everything succeeded, so a failed build leaves the previous site untouched.

  --out <dir>             write the site to <dir> instead of site/
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones`;

const kib = (bytes: number) => `${(bytes / 1024).toFixed(1)} KiB`;

export async function runBuild(args: string[]): Promise<CommandResult | string> {
  const { values } = parseCommandLine("build", args, { out: { type: "string" }, molecules: { type: "string" } }, 0);
  if (values.help) return buildHelp + "\n";
  const started = performance.now();
  const progress: string[] = [];
  try {
    const report = await buildSite({
      moleculesDir: moleculesDir(values.molecules as string | undefined),
      outDir: (values.out as string | undefined) ?? join(repoDir, "site"),
      log: (line) => progress.push(line),
    });
    const seconds = ((performance.now() - started) / 1000).toFixed(1);
    const stats = siteStats(report.outDir);
    return [
      ...progress,
      `built ${report.outDir} in ${seconds} s: ${report.molecules} molecules, ${report.entries} species pages, ${stats.pages} pages in all, ${report.sheets} bench sheets`,
      `site size ${kib(stats.totalBytes)} in ${stats.files} files; largest page ${stats.largestPage ? `${stats.largestPage.path} (${kib(stats.largestPage.bytes)})` : "none"}`,
      "",
    ].join("\n");
  } catch (error) {
    if (error instanceof BuildError) return { output: `bandatlas build: ${error.message}\n`, exitCode: 1 };
    throw error;
  }
}
