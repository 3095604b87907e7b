// The stages one batch of molecules goes through, from file to pages: each reads and writes the
// shared BuildContext, and the driver (buildSite.ts) runs them in order, timed the same way.
import { atlasEntry, defaultFindMinRelative, entryLines, standardTemperaturesK, type AtlasEntry } from "../atlas/index.ts";
import { forgetBandErrors } from "../core/index.ts";
import { linesCsv, linesDocument } from "../format/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { bandOverviewDescription, bandOverviewSvg } from "../plot/index.ts";
import { accuracyRows, siteData, type EntryPlots } from "../site/pageData.ts";
import { nearInfraredRowsOf } from "../site/nearInfraredIndex.ts";
import { runEleventy } from "../site/runEleventy.ts";
import { benchModelPath, downloadPath, speciesPagePath } from "../shared/sitePaths.ts";
import { startBenchData, type BenchDataRun } from "./benchDataPool.ts";
import type { BuildCache } from "./buildCache.ts";
import type { BuildContext } from "./buildContext.ts";

/** One batch of molecules and what its stages made so far. */
export interface Batch {
  molecules: Molecule[];
  entriesOf: Map<string, AtlasEntry[]>;
  entries: AtlasEntry[];
  plots: Map<AtlasEntry, EntryPlots>;
}

/** Entries: every species of the batch at every standard temperature, computed once and shared by the later stages. */
export function entriesStage(ctx: BuildContext, molecules: Molecule[]): Batch {
  const entriesOf = new Map(
    molecules.map((molecule) => [
      molecule.id,
      ctx.perMolecule("entries", molecule, () =>
        molecule.species.flatMap((species) => standardTemperaturesK.map((temperatureK) => atlasEntry(molecule, species, temperatureK))),
      ),
    ]),
  );
  const entries = [...entriesOf.values()].flat();
  ctx.counts.entries += entries.length;
  return { molecules, entriesOf, entries, plots: new Map() };
}

/** Bench data (calibration marks, the bench page's cell model): started on a worker, to run beside the plots. */
export function startBenchDataStage(ctx: BuildContext, batch: Batch): { run: BenchDataRun; missing: Molecule[] } {
  const missing = batch.molecules.filter((m) => !ctx.cache?.has("bench", m));
  return { run: startBenchData(missing, undefined, ctx.workers), missing };
}

/** Plots: each entry's band overview, linear and log, as SVG. */
export async function plotsStage(ctx: BuildContext, batch: Batch): Promise<void> {
  for (const molecule of batch.molecules) {
    const moleculeEntries = batch.entriesOf.get(molecule.id)!;
    const moleculePlots = await ctx.perMolecule("plots", molecule, async () => {
      const made: EntryPlots[] = [];
      for (const entry of moleculeEntries)
        made.push({
          linearSvg: await bandOverviewSvg(entry, "linear"),
          logSvg: await bandOverviewSvg(entry, "log"),
          description: bandOverviewDescription(entry, "linear"),
        });
      return made;
    });
    moleculeEntries.forEach((entry, i) => batch.plots.set(entry, moleculePlots[i]));
  }
}

/** Bench data, finished: kept for the pages and sheets, the cell models written for the bench page. */
export async function finishBenchDataStage(ctx: BuildContext, batch: Batch, started: { run: BenchDataRun; missing: Molecule[] }) {
  const computed = await started.run.finish();
  const byId = new Map(started.missing.map((m, i) => [m.id, computed[i]]));
  const batchBench = batch.molecules.map((m) => ctx.perMolecule("bench", m, () => byId.get(m.id)!));
  for (const b of batchBench) {
    ctx.bench.set(b.moleculeId, { marks: b.marks, defaultRangeCm: b.defaultRangeCm });
    ctx.site.write(benchModelPath(b.moleculeId), JSON.stringify(b.model));
  }
  return batchBench;
}

/** Whole-atlas tables gathered on the way: the search index's lines, the accuracy and near-infrared rows. */
export function tablesStage(ctx: BuildContext, batch: Batch): void {
  for (const temperatureK of standardTemperaturesK) {
    ctx.lineIndexes
      .get(temperatureK)!
      .add(entryLines(batch.entries, temperatureK, defaultFindMinRelative), (l) => speciesPagePath(l.molecule, l.species, temperatureK));
  }
  ctx.accuracy.push(...accuracyRows(batch.molecules, batch.entries));
  ctx.nearInfrared.push(...nearInfraredRowsOf(batch.molecules, batch.entries));
}

/** Downloads: every band's lines as CSV and JSON. */
export function downloadsStage(ctx: BuildContext, batch: Batch): void {
  for (const molecule of batch.molecules) {
    const downloads = ctx.perMolecule("downloads", molecule, () =>
      batch.entriesOf.get(molecule.id)!.flatMap((entry) =>
        entry.bands.flatMap((band) => [
          [downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "csv"), linesCsv(band.lines, molecule.limitations)],
          [
            downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "json"),
            JSON.stringify(linesDocument(entry.moleculeId, band.lines, molecule.limitations), null, 2) + "\n",
          ],
        ]),
      ),
    );
    for (const [path, text] of downloads) ctx.site.write(path, text);
  }
}

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

/** Pages: the batch's molecule and species pages through Eleventy (kept per molecule while serving). */
export async function pagesStage(ctx: BuildContext, batch: Batch): Promise<void> {
  if (ctx.cache) {
    const pages = await renderKeptPages(ctx.cache, ctx.pagesKind, batch.molecules, batch.entries, (stale, staleEntries, write) =>
      runEleventy(ctx.work, siteData(ctx.siteInput(), { molecules: stale, entries: staleEntries, plots: batch.plots }), "molecules", { write }),
    );
    for (const [path, text] of pages) ctx.site.write(path, text);
    ctx.counts.pages += pages.length;
  } else {
    ctx.counts.pages += await runEleventy(
      ctx.work,
      siteData(ctx.siteInput(), { molecules: batch.molecules, entries: batch.entries, plots: batch.plots }),
      "molecules",
      {
        write: (path, text) => ctx.site.write(path, text),
      },
    );
  }
}

/** The batch is done: the band errors cached on its species go, like its entries. */
export function releaseStage(batch: Batch): void {
  for (const molecule of batch.molecules) for (const species of molecule.species) forgetBandErrors(species.model);
}
