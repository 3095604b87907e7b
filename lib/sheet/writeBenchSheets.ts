import { availableParallelism } from "node:os";
import { join } from "node:path";
import type { AtlasEntry, CalibrationMarks } from "../atlas/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { SheetInputError, type SheetBuildIdentity } from "./sheetInput.ts";
import { startJobs, type JobRun, type SharedWorkers } from "../shared/jobPool.ts";
import { sheetPath } from "../shared/sitePaths.ts";
import { runBenchSheetJob, type BenchSheetJob } from "./benchSheetJob.ts";
import { paperNames, type PaperName } from "./paper.ts";

export interface WriteBenchSheetsOptions {
  molecules: Molecule[];
  /** Every atlas entry to print, computed once by the build. */
  entries: AtlasEntry[];
  /** The site folder; sheets go to <outDir>/sheets/<moleculeId>/<species>-<T>K-<paper>.pdf. */
  outDir: string;
  build: SheetBuildIdentity;
  /** Calibration-grade lines per molecule (plain data, computed once by the build); sheets name them under the plot. */
  calibration?: CalibrationMarks[];
  /** Default: every paper size (A4 and Letter). */
  papers?: PaperName[];
  /** Threads to render on, the main thread included; default 2 (both cores) when there are enough sheets to pay for starting a worker. */
  threads?: number;
  /** Worker threads kept across calls (a build's batches). */
  shared?: SharedWorkers;
}

/**
 * Below this many sheets a worker does not pay for itself: starting one (loading the TypeScript
 * sources through tsx, PDFKit and the fonts) cost about 2 s of CPU when measured, some 35 sheets.
 */
const sheetsPerExtraThread = 40;

export type BenchSheetRun = JobRun<string>;

function sheetJobs(options: WriteBenchSheetsOptions): BenchSheetJob[] {
  const byId = new Map(options.molecules.map((m) => [m.id, m]));
  const papers = options.papers ?? paperNames;
  const jobs: BenchSheetJob[] = [];
  for (const entry of options.entries) {
    const molecule = byId.get(entry.moleculeId);
    if (!molecule) throw new SheetInputError(`no molecule "${entry.moleculeId}" for the atlas entry of ${entry.species} at ${entry.temperatureK} K`);
    for (const paper of papers) {
      const calibration = options.calibration?.find((c) => c.moleculeId === molecule.id);
      jobs.push({
        request: { molecule, entry, paper, build: options.build, ...(calibration ? { calibration } : {}) },
        path: join(options.outDir, sheetPath(molecule.id, entry.species, entry.temperatureK, paper)),
      });
    }
  }
  return jobs;
}

/**
 * Starts writing the sheets on worker threads (when there are enough to pay for one) and returns
 * at once; the caller's `finish()` joins in on its own thread. writeBenchSheets is start + finish.
 */
export function startBenchSheets(options: WriteBenchSheetsOptions): BenchSheetRun {
  const jobs = sheetJobs(options);
  const threads = options.threads ?? Math.min(2, availableParallelism(), 1 + Math.floor(jobs.length / sheetsPerExtraThread));
  return startJobs({
    ...(options.shared ? { shared: options.shared } : {}),
    jobs,
    workers: threads >= 2 && jobs.length >= 2 ? Math.min(threads, jobs.length) - 1 : 0,
    workerEntry: new URL("./sheetWorkerEntry.mjs", import.meta.url),
    runHere: runBenchSheetJob,
    errorOf: (failure) => (failure.name === "SheetInputError" ? new SheetInputError(failure.message) : new Error(failure.message)),
  });
}

/**
 * Writes one sheet per entry and paper size, on the main thread and a worker thread when there
 * are many (rendering is CPU-bound: layout, font subsetting, compression). Returns the paths
 * written, in entry order.
 */
export async function writeBenchSheets(options: WriteBenchSheetsOptions): Promise<string[]> {
  return startBenchSheets(options).finish();
}
