import { existsSync, mkdirSync, mkdtempSync, rmSync, cpSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { tmpdir } from "node:os";
import { fileURLToPath } from "node:url";
import { atlasEntry, defaultFindMinRelative, entryLines, standardTemperaturesK, type AtlasEntry } from "../atlas/index.ts";
import { linesCsv, linesDocument } from "../format/index.ts";
import { loadMoleculesOrThrow, type Molecule } from "../molecules/index.ts";
import { bandOverviewDescription, bandOverviewSvg } from "../plot/index.ts";
import { contentDir, runEleventy } from "../site/runEleventy.ts";
import { accuracyRows, siteData, type BenchInput, type EntryPlots, type SiteDataInput } from "../site/pageData.ts";
import { nearInfraredRowsOf, type NearInfraredRow } from "../site/nearInfraredIndex.ts";
import { nameIndexJson } from "../site/searchIndexes.ts";
import { forgetBandErrors } from "../core/index.ts";
import { LineIndexBuilder, lineIndexBytesPerLine } from "../shared/lineIndexCodec.ts";
import { benchModelPath, downloadPath, speciesPagePath, temperatureToken } from "../shared/sitePaths.ts";
import { startBenchData, type BenchDataRun } from "./benchDataPool.ts";
import { sharedWorkers } from "../shared/jobPool.ts";
import { browserScripts, bundleBrowserScript } from "./bundleBrowser.ts";
import type { BuildCache } from "./buildCache.ts";
import { buildIdentity, type BuildIdentity } from "../shared/buildIdentity.ts";
import { checkInternalLinks } from "./checkLinks.ts";
import { swapDirectory } from "./swapDirectory.ts";
import { SiteWriter } from "./siteWriter.ts";
import { fileChunkStore } from "./lineIndexSpill.ts";

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

/**
 * Molecules whose pages, plots, downloads and sheets are made together before the next ones:
 * the build's peak memory is about one batch's (a molecule's entries, plots and pages take a
 * few MB), whatever the size of the atlas; each batch costs one more Eleventy run (≈0.2 s).
 */
export const moleculesPerBatch = 16;

type StartBenchSheets = typeof import("../sheet/index.ts").startBenchSheets;

/** Loaded only when sheets are wanted: PDFKit and the fonts take about 0.4 s to load, which page-only builds (the tests) skip. */
async function loadSheetWriter(): Promise<StartBenchSheets> {
  return (await import("../sheet/index.ts")).startBenchSheets;
}

/** Base64 of `bytes` in pieces that join to the base64 of the whole (each a multiple of 3 bytes). */
function* base64Pieces(bytes: Uint8Array): Generator<string> {
  const piece = 3 << 16;
  for (let at = 0; at < bytes.length; at += piece)
    yield Buffer.from(bytes.buffer, bytes.byteOffset + at, Math.min(piece, bytes.length - at)).toString("base64");
}

/** The BuildCache kind of a molecule's rendered pages; `bandatlas serve` forgets it when a template changes. */
export const keptPagesKind = "pages";

/**
 * The pages of a batch's molecules while serving: each molecule's rendered pages are kept with its
 * content, and only the molecules without kept pages are rendered (in one Eleventy run). Every
 * page of a molecules run lies under its molecule's folder, molecules/<id>/.
 */
async function renderKeptPages(
  cache: BuildCache,
  kind: string,
  batch: Molecule[],
  entries: AtlasEntry[],
  render: (stale: Molecule[], staleEntries: AtlasEntry[], write: (path: string, content: string) => void) => Promise<number>,
): Promise<Array<[string, string]>> {
  const stale = batch.filter((m) => !cache.has(kind, m));
  const rendered = new Map<string, Array<[string, string]>>(stale.map((m) => [m.id, []]));
  if (stale.length) {
    const ids = new Set(stale.map((m) => m.id));
    await render(
      stale,
      entries.filter((e) => ids.has(e.moleculeId)),
      (path, content) => {
        const owner = rendered.get(/^molecules\/([^/]+)\//.exec(path)?.[1] ?? "");
        if (!owner) throw new Error(`a molecule page outside its molecule's folder: ${path}`);
        owner.push([path, content]);
      },
    );
  }
  return batch.flatMap((m) => cache.forMolecule(kind, m, () => rendered.get(m.id)!));
}

/**
 * The whole atlas: every molecule loaded and validated first (a bad file stops the build before
 * anything is written), then batch by batch of molecules each AtlasEntry computed once and shared
 * by that batch's pages, plots, downloads and sheets, and dropped before the next batch; the
 * pages about the whole atlas come last, from small tables gathered on the way. Everything is
 * written into a fresh folder beside the target and swapped in only when all of it succeeded.
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
  const build = options.build ?? buildIdentity(repoDir);
  const startBenchSheets = options.sheets === false ? null : await loadSheetWriter();
  // A molecule's pages also carry the build identity (footers) and whether sheets are linked.
  const pagesKind = `${keptPagesKind} ${JSON.stringify({ build, sheets: startBenchSheets !== null })}`;

  const outDir = resolve(options.outDir);
  mkdirSync(dirname(outDir), { recursive: true });
  const work = mkdtempSync(join(dirname(outDir), ".site-build-"));
  // While serving, unchanged files are linked from the site being replaced (see SiteWriter).
  const site = new SiteWriter(work, cache && existsSync(outDir) ? outDir : null);
  const writePage = (path: string, text: string) => site.write(path, text);
  const timings = { physicsMs: 0, plotsMs: 0, filesMs: 0, pagesMs: 0, sheetsMs: 0 };
  let entryCount = 0;
  let pageCount = 0;
  const sheets: string[] = [];
  // What outlives a batch: the small cross-molecule tables and each molecule's bench input.
  // The search index's full chunks wait in files outside the site until the index is written.
  const spillDir = mkdtempSync(join(tmpdir(), "bandatlas-line-index-"));
  const lineIndexes = new Map(
    standardTemperaturesK.map((t) => [t, new LineIndexBuilder(t, defaultFindMinRelative, fileChunkStore(join(spillDir, `lines-${temperatureToken(t)}K.bin`)))]),
  );
  const accuracy: SiteDataInput["accuracy"] = [];
  const nearInfrared: NearInfraredRow[] = [];
  const bench = new Map<string, BenchInput>();
  const nameIndexPath = "assets/search/names.json";
  const lineIndexPaths = standardTemperaturesK.map((temperatureK) => ({ temperatureK, path: `assets/search/lines-${temperatureToken(temperatureK)}K.json` }));
  const siteInput = (): SiteDataInput => ({
    molecules,
    build,
    sheetsAvailable: startBenchSheets !== null,
    developersMarkdownPath: join(repoDir, "DEVELOPERS.md"),
    nameIndexPath,
    lineIndexPaths,
    bench,
    accuracy,
    nearInfraredRows: nearInfrared,
  });
  let sheetRun: ReturnType<StartBenchSheets> | null = null;
  let benchRun: BenchDataRun | null = null;
  // One worker per kind for the whole build, not one per batch.
  const workers = sharedWorkers();
  try {
    // Molecule by molecule, a batch at a time, from file to pages, plots, downloads and sheets:
    // memory holds one batch's entries, plots and pages (plus one batch of sheets in flight), not
    // the atlas. Batches are whole molecules in id order, so every output is that of one pass.
    const perBatch = Math.max(1, options.moleculesPerBatch ?? moleculesPerBatch);
    for (let first = 0; first < molecules.length; first += perBatch) {
      const batch = molecules.slice(first, first + perBatch);
      lap();
      const entriesOf = new Map(
        batch.map((molecule) => [
          molecule.id,
          perMolecule("entries", molecule, () =>
            molecule.species.flatMap((species) => standardTemperaturesK.map((temperatureK) => atlasEntry(molecule, species, temperatureK))),
          ),
        ]),
      );
      const entries: AtlasEntry[] = [...entriesOf.values()].flat();
      entryCount += entries.length;
      timings.physicsMs += lap();

      // Calibration marks and the bench page's cell model: once per molecule, shared by pages and
      // sheets; computed on a worker beside the plots, this thread joining in after them.
      const benchMissing = batch.filter((m) => !cache?.has("bench", m));
      benchRun = startBenchData(benchMissing, undefined, workers);
      const plots = new Map<AtlasEntry, EntryPlots>();
      for (const molecule of batch) {
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
      timings.plotsMs += lap();
      const computedBench = await benchRun.finish();
      benchRun = null;
      const benchById = new Map(benchMissing.map((m, i) => [m.id, computedBench[i]]));
      const batchBench = batch.map((m) => perMolecule("bench", m, () => benchById.get(m.id)!));
      for (const b of batchBench) {
        bench.set(b.moleculeId, { marks: b.marks, defaultRangeCm: b.defaultRangeCm });
        site.write(benchModelPath(b.moleculeId), JSON.stringify(b.model));
      }
      timings.physicsMs += lap();
      sheetRun = startBenchSheets
        ? startBenchSheets({ molecules: batch, entries, outDir: work, build, calibration: batchBench.map((b) => b.marks), shared: workers })
        : null;

      for (const temperatureK of standardTemperaturesK) {
        lineIndexes
          .get(temperatureK)!
          .add(entryLines(entries, temperatureK, defaultFindMinRelative), (l) => speciesPagePath(l.molecule, l.species, temperatureK));
      }
      accuracy.push(...accuracyRows(batch, entries));
      nearInfrared.push(...nearInfraredRowsOf(batch, entries));
      for (const molecule of batch) {
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
        for (const [path, text] of downloads) site.write(path, text);
      }
      timings.filesMs += lap();

      if (cache) {
        const pages = await renderKeptPages(cache, pagesKind, batch, entries, (stale, staleEntries, write) =>
          runEleventy(work, siteData(siteInput(), { molecules: stale, entries: staleEntries, plots }), "molecules", { write }),
        );
        for (const [path, text] of pages) site.write(path, text);
        pageCount += pages.length;
      } else pageCount += await runEleventy(work, siteData(siteInput(), { molecules: batch, entries, plots }), "molecules", { write: writePage });
      timings.pagesMs += lap();
      if (sheetRun) {
        sheets.push(...(await sheetRun.finish()));
        sheetRun = null;
        timings.sheetsMs += lap();
      }
      // The batch is done: the band errors cached on its species go, like its entries.
      for (const molecule of batch) for (const species of molecule.species) forgetBandErrors(species.model);
    }
    // The workers have no more jobs: their memory goes before the whole-atlas part begins.
    await workers.close();
    log(`atlas: ${entryCount} entries of ${molecules.length} molecules, in batches of ${perBatch}`);
    log(startBenchSheets ? `bench sheets: ${sheets.length} PDFs` : "bench sheets: not requested");

    site.write(nameIndexPath, nameIndexJson(molecules));
    const lineIndexReport = [];
    for (const { temperatureK, path } of lineIndexPaths) {
      // Written a piece at a time: the same bytes as JSON.stringify(builder.finish()) without
      // holding the base64 text, its JSON copy and their UTF-8 copy at once (about 50 MB each
      // at one temperature of 2000 molecules).
      const { head, packed } = lineIndexes.get(temperatureK)!.finishPacked();
      lineIndexes.delete(temperatureK);
      const [before, after] = JSON.stringify({ ...head, data: "" }).split(/(?<="data":")(?="\}$)/);
      const bytes = site.writeParts(path, [before, ...base64Pieces(packed), after]);
      lineIndexReport.push({ temperatureK, lines: head.count, bytes });
    }
    log(
      `search index: ${lineIndexReport.map((r) => `${r.lines} lines at ${r.temperatureK} K`).join(", ")} (${lineIndexBytesPerLine} bytes a line before base64)`,
    );
    for (const script of browserScripts) {
      const bytes = await (cache ? cache.forSession(`bundle ${script.path}`, () => bundleBrowserScript(script.entry)) : bundleBrowserScript(script.entry));
      site.write(script.path, bytes);
    }
    for (const asset of ["site.css", "favicon.svg"]) cpSync(join(contentDir, "assets", asset), join(work, "assets", asset));
    timings.filesMs += lap();

    pageCount += await runEleventy(work, siteData(siteInput(), null), "site", { write: writePage });
    timings.pagesMs += lap();
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
    const finished = { loadingMs, ...timings, finishMs, totalMs: performance.now() - started };
    return {
      outDir,
      molecules: molecules.length,
      pages: links.pages,
      entries: entryCount,
      sheets: sheets.length,
      lineIndex: lineIndexReport,
      build,
      files: { ...site.counts },
      timings: finished,
    };
  } catch (error) {
    await Promise.all([sheetRun?.cancel(), benchRun?.cancel()]);
    rmSync(work, { recursive: true, force: true });
    throw error;
  } finally {
    await workers.close();
    rmSync(spillDir, { recursive: true, force: true });
  }
}
