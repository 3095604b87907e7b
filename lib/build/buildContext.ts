import { mkdirSync, mkdtempSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { defaultFindMinRelative, standardTemperaturesK } from "../atlas/index.ts";
import type { Molecule } from "../molecules/index.ts";
import type { BenchInput, SiteDataInput } from "../site/pageData.ts";
import type { NearInfraredRow } from "../site/nearInfraredIndex.ts";
import { LineIndexBuilder } from "../shared/lineIndexCodec.ts";
import { temperatureToken } from "../shared/sitePaths.ts";
import { sharedWorkers } from "../shared/jobPool.ts";
import type { BuildIdentity } from "../shared/buildIdentity.ts";
import type { BuildCache } from "./buildCache.ts";
import { SiteWriter } from "./siteWriter.ts";
import { fileChunkStore } from "./lineIndexSpill.ts";

/** The buckets of the build's timing report (`npm run bench` prints them). */
export interface StageTimings {
  /** The AtlasEntry of every species at every temperature, and each molecule's bench data. */
  physicsMs: number;
  /** The band-overview SVGs (vega). */
  plotsMs: number;
  /** Search indexes, CSV/JSON downloads, the browser bundles and static assets. */
  filesMs: number;
  /** Eleventy: page data and templates rendered and written. */
  pagesMs: number;
  /** The PDF bench sheets still left once the pages were written (they start beside the plots). */
  sheetsMs: number;
  /** The internal link check and the swap into place. */
  finishMs: number;
}

export type StartBenchSheets = typeof import("../sheet/index.ts").startBenchSheets;

/** Everything the stages of one build share: where they write, what outlives a batch, and the caching and timing every stage goes through. */
export interface BuildContext {
  molecules: Molecule[];
  build: BuildIdentity;
  outDir: string;
  /** The fresh folder the site is written into, swapped in at the end. */
  work: string;
  site: SiteWriter;
  cache: BuildCache | undefined;
  workers: ReturnType<typeof sharedWorkers>;
  startBenchSheets: StartBenchSheets | null;
  /** The Eleventy render kind of a molecule's kept pages (build identity and whether sheets are linked). */
  pagesKind: string;
  // What outlives a batch: the small cross-molecule tables and each molecule's bench input.
  lineIndexes: Map<number, LineIndexBuilder>;
  lineIndexPaths: Array<{ temperatureK: number; path: string }>;
  nameIndexPath: string;
  accuracy: SiteDataInput["accuracy"];
  nearInfrared: NearInfraredRow[];
  bench: Map<string, BenchInput>;
  sheets: string[];
  counts: { entries: number; pages: number };
  timings: StageTimings;
  spillDir: string;
  /** A molecule's result of one kind: kept between rebuilds while serving, else computed. */
  perMolecule<T>(kind: string, molecule: Molecule, compute: () => T): T;
  /** Runs one stage and adds its wall time to its bucket. */
  timed<T>(bucket: keyof StageTimings, run: () => T): T;
  /** The page data's input, as it stands (the tables grow batch by batch). */
  siteInput(): SiteDataInput;
}

/** The BuildCache kind of a molecule's rendered pages; `bandatlas serve` forgets it when a template changes. */
export const keptPagesKind = "pages";

export function createBuildContext(options: {
  molecules: Molecule[];
  build: BuildIdentity;
  outDir: string;
  cache: BuildCache | undefined;
  startBenchSheets: StartBenchSheets | null;
  developersMarkdownPath: string;
}): BuildContext {
  const { molecules, build, cache, startBenchSheets } = options;
  const outDir = resolve(options.outDir);
  mkdirSync(dirname(outDir), { recursive: true });
  const work = mkdtempSync(join(dirname(outDir), ".site-build-"));
  // The search index's full chunks wait in files outside the site until the index is written.
  const spillDir = mkdtempSync(join(tmpdir(), "bandatlas-line-index-"));
  const timings: StageTimings = { physicsMs: 0, plotsMs: 0, filesMs: 0, pagesMs: 0, sheetsMs: 0, finishMs: 0 };
  const context: BuildContext = {
    molecules,
    build,
    outDir,
    work,
    // While serving, unchanged files are linked from the site being replaced (see SiteWriter).
    site: new SiteWriter(work, cache && existsSync(outDir) ? outDir : null),
    cache,
    // One worker per kind for the whole build, not one per batch.
    workers: sharedWorkers(),
    startBenchSheets,
    pagesKind: `${keptPagesKind} ${JSON.stringify({ build, sheets: startBenchSheets !== null })}`,
    lineIndexes: new Map(
      standardTemperaturesK.map((t) => [
        t,
        new LineIndexBuilder(t, defaultFindMinRelative, fileChunkStore(join(spillDir, `lines-${temperatureToken(t)}K.bin`))),
      ]),
    ),
    lineIndexPaths: standardTemperaturesK.map((temperatureK) => ({ temperatureK, path: `assets/search/lines-${temperatureToken(temperatureK)}K.json` })),
    nameIndexPath: "assets/search/names.json",
    accuracy: [],
    nearInfrared: [],
    bench: new Map(),
    sheets: [],
    counts: { entries: 0, pages: 0 },
    timings,
    spillDir,
    perMolecule: (kind, molecule, compute) => (cache ? cache.forMolecule(kind, molecule, compute) : compute()),
    timed(bucket, run) {
      const started = performance.now();
      const result = run();
      const add = () => (timings[bucket] += performance.now() - started);
      if (result instanceof Promise) return result.finally(add) as typeof result;
      add();
      return result;
    },
    siteInput: () => ({
      molecules,
      build,
      sheetsAvailable: startBenchSheets !== null,
      developersMarkdownPath: options.developersMarkdownPath,
      nameIndexPath: context.nameIndexPath,
      lineIndexPaths: context.lineIndexPaths,
      bench: context.bench,
      accuracy: context.accuracy,
      nearInfraredRows: context.nearInfrared,
    }),
  };
  return context;
}
