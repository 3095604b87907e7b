import { mkdirSync, mkdtempSync, rmSync, writeFileSync, cpSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { atlasEntry, standardTemperaturesK, type AtlasEntry } from "../atlas/index.ts";
import { linesCsv, linesDocument } from "../format/index.ts";
import { loadMoleculesOrThrow, type Molecule } from "../molecules/index.ts";
import { bandOverviewDescription, bandOverviewSvg } from "../plot/index.ts";
import { lineIndexBytesPerLine } from "../shared/lineIndexCodec.ts";
import { contentDir, runEleventy } from "../site/runEleventy.ts";
import { siteData, type EntryPlots } from "../site/pageData.ts";
import { lineIndex, nameIndexJson } from "../site/searchIndexes.ts";
import { benchModelPath, downloadPath, temperatureToken } from "../shared/sitePaths.ts";
import { startBenchData, type BenchDataRun } from "./benchDataPool.ts";
import { bundleBenchScript, bundleBrowserScript, bundleCalibrateScript } from "./bundleBrowser.ts";
import type { BuildCache } from "./buildCache.ts";
import { buildIdentity, type BuildIdentity } from "../shared/buildIdentity.ts";
import { checkInternalLinks } from "./checkLinks.ts";
import { swapDirectory } from "./swapDirectory.ts";

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
  /** Wall time of each stage in ms, for `npm run bench` (stages run one after another). */
  timings: BuildTimings;
}

export interface BuildTimings {
  /** Reading and validating the molecule files. */
  loadingMs: number;
  /** The AtlasEntry of every species at every temperature, and each molecule's bench data (calibration marks; the part left after the plots it runs beside). */
  physicsMs: number;
  /** The band-overview SVGs (vega). */
  plotsMs: number;
  /** Search indexes, CSV/JSON downloads, the browser bundle and static assets. */
  filesMs: number;
  /** Eleventy: page data and templates rendered and written. */
  pagesMs: number;
  /** The PDF bench sheets still left once the pages were written (they start beside the plots; 0 when not built). */
  sheetsMs: number;
  /** The internal link check and the swap into place. */
  finishMs: number;
  totalMs: number;
}

/** A build that cannot finish for a reason the person running it can fix (not a bug). */
export class BuildError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "BuildError";
  }
}

type StartBenchSheets = typeof import("../sheet/index.ts").startBenchSheets;

/** Loaded only when sheets are wanted: PDFKit and the fonts take about 0.4 s to load, which page-only builds (the tests) skip. */
async function loadSheetWriter(): Promise<StartBenchSheets> {
  return (await import("../sheet/index.ts")).startBenchSheets;
}

function writeFile(root: string, path: string, text: string) {
  const full = join(root, path);
  mkdirSync(dirname(full), { recursive: true });
  writeFileSync(full, text);
}

/**
 * The whole atlas: every molecule loaded and validated first (a bad file stops the build before
 * anything is written), each AtlasEntry computed once and shared by pages, plots, downloads and
 * sheets, everything written into a fresh folder beside the target and swapped in only when all
 * of it succeeded.
 */
export async function buildSite(options: BuildOptions): Promise<BuildReport> {
  const log = options.log ?? (() => {});
  const started = performance.now();
  let mark = started;
  /** Milliseconds since the previous lap. */
  const lap = () => {
    const now = performance.now();
    const ms = now - mark;
    mark = now;
    return ms;
  };
  const molecules = loadMoleculesOrThrow(options.moleculesDir).sort((a, b) => a.id.localeCompare(b.id));
  const loadingMs = lap();
  const cache = options.cache;
  const perMolecule = <T>(kind: string, molecule: Molecule, compute: () => T): T => (cache ? cache.forMolecule(kind, molecule, compute) : compute());
  const entriesOf = new Map(
    molecules.map((molecule) => [
      molecule.id,
      perMolecule("entries", molecule, () =>
        molecule.species.flatMap((species) => standardTemperaturesK.map((temperatureK) => atlasEntry(molecule, species, temperatureK))),
      ),
    ]),
  );
  const entries: AtlasEntry[] = [...entriesOf.values()].flat();
  const entriesMs = lap();
  const build = options.build ?? buildIdentity(repoDir);
  const startBenchSheets = options.sheets === false ? null : await loadSheetWriter();

  const outDir = resolve(options.outDir);
  mkdirSync(dirname(outDir), { recursive: true });
  const work = mkdtempSync(join(dirname(outDir), ".site-build-"));
  // The sheets start on a worker thread as soon as the calibration marks are known, beside the
  // indexes and pages on this thread; this thread joins in once the pages are written (the
  // entries are shared, never recomputed).
  let sheetRun: ReturnType<StartBenchSheets> | null = null;
  let benchRun: BenchDataRun | null = null;
  try {
    // Calibration marks and the bench page's cell model: once per molecule, shared by pages and
    // sheets; computed on a worker beside the plots, this thread joining in after them.
    const benchMissing = molecules.filter((m) => !cache?.has("bench", m));
    benchRun = startBenchData(benchMissing);
    const plots = new Map<AtlasEntry, EntryPlots>();
    for (const molecule of molecules) {
      const moleculeEntries = entriesOf.get(molecule.id)!;
      const moleculePlots = await perMolecule("plots", molecule, async () => {
        const made: EntryPlots[] = [];
        for (const entry of moleculeEntries)
          made.push({
            linearSvg: await bandOverviewSvg(entry, "linear"),
            logSvg: await bandOverviewSvg(entry, "log"),
            description: bandOverviewDescription(entry, "linear"),
          });
        return made;
      });
      moleculeEntries.forEach((entry, i) => plots.set(entry, moleculePlots[i]));
    }
    log(`plots: ${plots.size * 2} SVGs`);
    const plotsMs = lap();
    const computedBench = await benchRun.finish();
    const benchById = new Map(benchMissing.map((m, i) => [m.id, computedBench[i]]));
    const bench = new Map(molecules.map((m) => [m.id, perMolecule("bench", m, () => benchById.get(m.id)!)]));
    const physicsMs = entriesMs + lap();
    sheetRun = startBenchSheets ? startBenchSheets({ molecules, entries, outDir: work, build, calibration: [...bench.values()].map((b) => b.marks) }) : null;

    const nameIndexPath = "assets/search/names.json";
    writeFile(work, nameIndexPath, nameIndexJson(molecules));
    const lineIndexPaths = [];
    const lineIndexReport = [];
    for (const temperatureK of standardTemperaturesK) {
      const path = `assets/search/lines-${temperatureToken(temperatureK)}K.json`;
      const file = lineIndex(molecules, temperatureK, entries);
      const text = JSON.stringify(file);
      writeFile(work, path, text);
      lineIndexPaths.push({ temperatureK, path });
      lineIndexReport.push({ temperatureK, lines: file.count, bytes: Buffer.byteLength(text) });
    }
    log(
      `search index: ${lineIndexReport.map((r) => `${r.lines} lines at ${r.temperatureK} K`).join(", ")} (${lineIndexBytesPerLine} bytes a line before base64)`,
    );

    for (const molecule of molecules) {
      const downloads = perMolecule("downloads", molecule, () =>
        entriesOf.get(molecule.id)!.flatMap((entry) =>
          entry.bands.flatMap((band) => [
            [downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "csv"), linesCsv(band.lines, molecule.limitations)],
            [
              downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "json"),
              JSON.stringify(linesDocument(entry.moleculeId, band.lines, molecule.limitations), null, 2) + "\n",
            ],
          ]),
        ),
      );
      for (const [path, text] of downloads) writeFile(work, path, text);
    }

    await bundleBrowserScript(join(work, "assets/search.js"));
    for (const b of bench.values()) writeFile(work, benchModelPath(b.moleculeId), JSON.stringify(b.model));
    await bundleBenchScript(join(work, "assets/bench.js"));
    await bundleCalibrateScript(join(work, "assets/calibrate.js"));
    for (const asset of ["site.css", "favicon.svg"]) cpSync(join(contentDir, "assets", asset), join(work, "assets", asset));

    const filesMs = lap();
    const data = siteData({
      molecules,
      entries,
      plots,
      build,
      sheetsAvailable: startBenchSheets !== null,
      developersMarkdownPath: join(repoDir, "DEVELOPERS.md"),
      nameIndexPath,
      lineIndexPaths,
      bench,
    });
    await runEleventy(work, data);
    const pagesMs = lap();

    let sheets: string[] = [];
    if (sheetRun) {
      sheets = await sheetRun.finish();
      log(`bench sheets: ${sheets.length} PDFs`);
    } else log("bench sheets: not requested");

    const sheetsMs = sheetRun ? lap() : 0;
    const links = checkInternalLinks(work);
    if (links.broken.length) {
      const sample = links.broken
        .slice(0, 10)
        .map((b) => `  ${b.page}: ${b.href} (${b.reason})`)
        .join("\n");
      throw new BuildError(
        `${links.broken.length} broken internal link${links.broken.length === 1 ? "" : "s"}; the previous site is left in place:\n${sample}`,
      );
    }

    swapDirectory(work, outDir);
    cache?.endBuild();
    const finishMs = lap();
    const timings = { loadingMs, physicsMs, plotsMs, filesMs, pagesMs, sheetsMs, finishMs, totalMs: performance.now() - started };
    return {
      outDir,
      molecules: molecules.length,
      pages: links.pages,
      entries: entries.length,
      sheets: sheets.length,
      lineIndex: lineIndexReport,
      build,
      timings,
    };
  } catch (error) {
    await Promise.all([sheetRun?.cancel(), benchRun?.cancel()]);
    rmSync(work, { recursive: true, force: true });
    throw error;
  }
}
