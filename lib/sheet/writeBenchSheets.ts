import { availableParallelism } from "node:os";
import { serialize } from "node:v8";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import type { AtlasEntry, CalibrationMarks } from "../atlas/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { SheetInputError, type SheetBuildIdentity } from "./buildIdentity.ts";
import { runBenchSheetJob, type BenchSheetJob } from "./benchSheetJob.ts";
import { paperNames, type PaperName } from "./paper.ts";
import { sheetFileName } from "./sheetFileName.ts";

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
}

/** Where the build puts one sheet, relative to the site folder (for links from the pages). */
export function sheetPath(moleculeId: string, species: string, temperatureK: number, paper: PaperName): string {
  return join("sheets", moleculeId, sheetFileName(species, temperatureK, paper));
}

/**
 * Below this many sheets a worker does not pay for itself: starting one (loading the TypeScript
 * sources through tsx, PDFKit and the fonts) cost about 2 s of CPU when measured, some 35 sheets.
 */
const sheetsPerExtraThread = 40;

export interface BenchSheetRun {
  /** Renders on this thread too, from the shared queue, until every sheet is written; the paths in entry order. */
  finish(): Promise<string[]>;
  /** Stops the workers (when the build failed elsewhere); resolves once they have stopped. */
  cancel(): Promise<void>;
}

/** What the workers get of the jobs: see sharedJobs. */
export interface SharedSheetJobs {
  /** Each distinct request without its paper (molecule, entry, build, calibration), serialized (node:v8) one after another. */
  requests: SharedArrayBuffer;
  /** Byte offsets of request k: offsets[k] to offsets[k + 1]. */
  offsets: number[];
  jobs: Array<{ request: number; paper: PaperName; path: string }>;
}

/**
 * The jobs as the workers read them: each entry's request serialized once into one shared buffer
 * (an entry's A4 and Letter sheets share it), read back by a worker only when it claims a job.
 * Posting the jobs themselves would give every worker a full copy of every atlas entry at once:
 * on a 500-molecule atlas, hundreds of MB.
 */
function sharedJobs(jobs: BenchSheetJob[]): SharedSheetJobs {
  const index = new Map<AtlasEntry, number>();
  const parts: Buffer[] = [];
  const out: SharedSheetJobs["jobs"] = [];
  for (const job of jobs) {
    const { paper, ...rest } = job.request;
    let k = index.get(rest.entry);
    if (k === undefined) {
      k = parts.length;
      parts.push(serialize(rest));
      index.set(rest.entry, k);
    }
    out.push({ request: k, paper, path: job.path });
  }
  const offsets = [0];
  for (const part of parts) offsets.push(offsets[offsets.length - 1] + part.length);
  const requests = new SharedArrayBuffer(offsets[offsets.length - 1]);
  const bytes = new Uint8Array(requests);
  parts.forEach((part, k) => bytes.set(part, offsets[k]));
  return { requests, offsets, jobs: out };
}

/**
 * Starts `extraThreads` worker threads on the jobs at once; every thread claims the next job
 * number from one shared counter (Atomics), so a worker never waits for this thread to hand out
 * work while this thread is busy elsewhere (the site's plots and pages). `finish` makes this
 * thread claim jobs too. The workers share the jobs in one serialized buffer (sharedJobs).
 */
function startOnThreads(jobs: BenchSheetJob[], extraThreads: number): BenchSheetRun {
  const workers: Worker[] = [];
  const next = new Int32Array(new SharedArrayBuffer(4));
  const claim = () => Atomics.add(next, 0, 1);
  let done = 0;
  let settled = false;
  let resolveAll!: () => void;
  let rejectAll!: (error: Error) => void;
  const all = new Promise<void>((resolve, reject) => {
    resolveAll = resolve;
    rejectAll = reject;
  });
  all.catch(() => {}); // reported by finish(); never an unhandled rejection while the caller is busy
  const stopWorkers = () => Promise.all(workers.map((w) => w.terminate())).then(() => {});
  const settle = (error?: Error) => {
    if (settled) return;
    if (!error && done < jobs.length) return;
    settled = true;
    Atomics.store(next, 0, jobs.length);
    void stopWorkers();
    if (error) rejectAll(error);
    else resolveAll();
  };
  const fail = (m: { message?: string; name?: string }) => settle(m.name === "SheetInputError" ? new SheetInputError(m.message!) : new Error(m.message));
  const shared = extraThreads > 0 ? sharedJobs(jobs) : null;
  for (let i = 0; i < extraThreads; i++) {
    const worker = new Worker(new URL("./sheetWorkerEntry.mjs", import.meta.url));
    workers.push(worker);
    worker.on("message", (m: { ok: boolean; message?: string; name?: string }) => {
      if (!m.ok) return fail(m);
      done++;
      settle();
    });
    worker.on("error", (error) => settle(error));
    worker.on("exit", (code) => {
      if (code !== 0 && !settled) settle(new Error(`a sheet worker stopped with exit code ${code}`));
    });
    worker.postMessage({ ...shared!, claim: next.buffer });
  }
  if (jobs.length === 0) settle();
  return {
    async finish() {
      for (let id = claim(); !settled && id < jobs.length; id = claim()) {
        try {
          await runBenchSheetJob(jobs[id]);
        } catch (error) {
          settle(error as Error);
          break;
        }
        done++;
        settle();
      }
      await all;
      return jobs.map((j) => j.path);
    },
    async cancel() {
      settle(new Error("cancelled"));
      await stopWorkers();
    },
  };
}

function sheetJobs(options: WriteBenchSheetsOptions): BenchSheetJob[] {
  const byId = new Map(options.molecules.map((m) => [m.id, m]));
  const papers = options.papers ?? paperNames;
  const jobs: BenchSheetJob[] = [];
  for (const entry of options.entries) {
    const molecule = byId.get(entry.moleculeId);
    if (!molecule) throw new SheetInputError(`no molecule "${entry.moleculeId}" for the atlas entry of ${entry.species} at ${entry.temperatureK} K`);
    for (const paper of papers) {
      const calibration = options.calibration?.find((c) => c.moleculeId === molecule.id);
      jobs.push({ request: { molecule, entry, paper, build: options.build, ...(calibration ? { calibration } : {}) }, path: join(options.outDir, sheetPath(molecule.id, entry.species, entry.temperatureK, paper)) });
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
  return startOnThreads(jobs, threads >= 2 && jobs.length >= 2 ? Math.min(threads, jobs.length) - 1 : 0);
}

/**
 * Writes one sheet per entry and paper size, on the main thread and a worker thread when there
 * are many (rendering is CPU-bound: layout, font subsetting, compression). Returns the paths
 * written, in entry order.
 */
export async function writeBenchSheets(options: WriteBenchSheetsOptions): Promise<string[]> {
  return startBenchSheets(options).finish();
}
