import { rmSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadMoleculesOrThrow } from "../molecules/index.ts";
import { buildIdentity, type BuildIdentity } from "../shared/buildIdentity.ts";
import { searchIndexLog, searchIndexStage, scriptsAndAssetsStage, atlasPagesStage, linkCheckStage, swapStage } from "./atlasStages.ts";
import { entriesStage, finishBenchDataStage, pagesStage, plotsStage, releaseStage, startBenchDataStage, tablesStage, downloadsStage } from "./batchStages.ts";
import type { BenchDataRun } from "./benchDataPool.ts";
import type { BuildCache } from "./buildCache.ts";
import { createBuildContext, type StageTimings, type StartBenchSheets } from "./buildContext.ts";

export { keptPagesKind } from "./buildContext.ts";
export { BuildError } from "./atlasStages.ts";

export const repoDir = fileURLToPath(new URL("../..", import.meta.url));

export interface BuildOptions {
  moleculesDir: string;
  outDir: string;
  /** Default: from package.json and git. */
  build?: BuildIdentity;
  /** Write the PDF bench sheets (default true; tests of the pages turn them off for speed). */
  sheets?: boolean;
  /** Results kept between rebuilds of one `bandatlas serve` session (entries and plots of unchanged molecules). */
  cache?: BuildCache;
  /** Molecules per batch (default moleculesPerBatch); the output does not depend on it. */
  moleculesPerBatch?: number;
  /** Progress lines for the person running the build. */
  log?: (line: string) => void;
}

export interface BuildReport {
  outDir: string;
  molecules: number;
  pages: number;
  entries: number;
  sheets: number;
  lineIndex: Array<{ temperatureK: number; lines: number; bytes: number }>;
  build: BuildIdentity;
  /** Files this process wrote, and files linked unchanged from the site it replaced (serving only). */
  files: { written: number; linked: number };
  /** Wall time of each stage in ms, for `npm run bench`, summed over the batches of molecules. */
  timings: BuildTimings;
}

/** Wall time of each stage bucket in ms (see StageTimings), with the loading of the molecule files and the total. */
export interface BuildTimings extends StageTimings {
  /** Reading and validating the molecule files. */
  loadingMs: number;
  totalMs: number;
}

/**
 * Molecules whose pages, plots, downloads and sheets are made together before the next ones:
 * the build's peak memory is about one batch's (a molecule's entries, plots and pages take a
 * few MB), whatever the size of the atlas; each batch costs one more Eleventy run (≈0.2 s).
 */
export const moleculesPerBatch = 16;

/** Loaded only when sheets are wanted: PDFKit and the fonts take about 0.4 s to load, which page-only builds (the tests) skip. */
async function loadSheetWriter(): Promise<StartBenchSheets> {
  return (await import("../sheet/index.ts")).startBenchSheets;
}

/**
 * The whole atlas: every molecule loaded and validated first (a bad file stops the build before
 * anything is written), then batch by batch of molecules each AtlasEntry computed once and shared
 * by that batch's pages, plots, downloads and sheets, and dropped before the next batch; the
 * pages about the whole atlas come last, from small tables gathered on the way. Everything is
 * written into a fresh folder beside the target and swapped in only when all of it succeeded.
 * The stages are in batchStages.ts and atlasStages.ts; this driver runs them in order, each timed
 * into its bucket and, while serving, each molecule's results kept (BuildContext.perMolecule).
 */
export async function buildSite(options: BuildOptions): Promise<BuildReport> {
  const log = options.log ?? (() => {});
  const started = performance.now();
  const molecules = loadMoleculesOrThrow(options.moleculesDir).sort((a, b) => a.id.localeCompare(b.id));
  const loadingMs = performance.now() - started;
  const ctx = createBuildContext({
    molecules,
    build: options.build ?? buildIdentity(repoDir),
    outDir: options.outDir,
    cache: options.cache,
    startBenchSheets: options.sheets === false ? null : await loadSheetWriter(),
    developersMarkdownPath: join(repoDir, "DEVELOPERS.md"),
  });
  const { timed } = ctx;
  let sheetRun: ReturnType<StartBenchSheets> | null = null;
  let benchRun: BenchDataRun | null = null;
  try {
    // Memory holds one batch's entries, plots and pages (plus one batch of sheets in flight), not
    // the atlas. Batches are whole molecules in id order, so every output is that of one pass.
    const perBatch = Math.max(1, options.moleculesPerBatch ?? moleculesPerBatch);
    for (let first = 0; first < molecules.length; first += perBatch) {
      const batch = timed("physicsMs", () => entriesStage(ctx, molecules.slice(first, first + perBatch)));
      const bench = startBenchDataStage(ctx, batch);
      benchRun = bench.run;
      await timed("plotsMs", () => plotsStage(ctx, batch));
      const batchBench = await timed("physicsMs", () => finishBenchDataStage(ctx, batch, bench));
      benchRun = null;
      sheetRun = ctx.startBenchSheets
        ? ctx.startBenchSheets({
            molecules: batch.molecules,
            entries: batch.entries,
            outDir: ctx.work,
            build: ctx.build,
            calibration: batchBench.map((b) => b.marks),
            shared: ctx.workers,
          })
        : null;
      timed("filesMs", () => {
        tablesStage(ctx, batch);
        downloadsStage(ctx, batch);
      });
      await timed("pagesMs", () => pagesStage(ctx, batch));
      if (sheetRun) {
        const run = sheetRun;
        ctx.sheets.push(...(await timed("sheetsMs", () => run.finish())));
        sheetRun = null;
      }
      releaseStage(batch);
    }
    // The workers have no more jobs: their memory goes before the whole-atlas part begins.
    await ctx.workers.close();
    log(`atlas: ${ctx.counts.entries} entries of ${molecules.length} molecules, in batches of ${perBatch}`);
    log(ctx.startBenchSheets ? `bench sheets: ${ctx.sheets.length} PDFs` : "bench sheets: not requested");

    const lineIndex = timed("filesMs", () => searchIndexStage(ctx));
    log(searchIndexLog(lineIndex));
    await timed("filesMs", () => scriptsAndAssetsStage(ctx));
    await timed("pagesMs", () => atlasPagesStage(ctx));
    const links = timed("finishMs", () => {
      const checked = linkCheckStage(ctx);
      swapStage(ctx);
      return checked;
    });
    return {
      outDir: ctx.outDir,
      molecules: molecules.length,
      pages: links.pages,
      entries: ctx.counts.entries,
      sheets: ctx.sheets.length,
      lineIndex,
      build: ctx.build,
      files: { ...ctx.site.counts },
      timings: { loadingMs, ...ctx.timings, totalMs: performance.now() - started },
    };
  } catch (error) {
    await Promise.all([sheetRun?.cancel(), benchRun?.cancel()]);
    rmSync(ctx.work, { recursive: true, force: true });
    throw error;
  } finally {
    await ctx.workers.close();
    rmSync(ctx.spillDir, { recursive: true, force: true });
  }
}
