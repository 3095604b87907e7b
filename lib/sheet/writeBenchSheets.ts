import { availableParallelism } from "node:os";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import type { AtlasEntry } from "../atlas/index.ts";
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

/**
 * Runs the jobs on the main thread and `extraThreads` worker threads at once, each taking the
 * next job from one queue, so the main thread is busy while the workers start.
 */
function runOnThreads(jobs: BenchSheetJob[], extraThreads: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const workers: Worker[] = [];
    let next = 0;
    let done = 0;
    let settled = false;
    const finish = (error?: Error) => {
      if (settled) return;
      if (!error && done < jobs.length) return;
      settled = true;
      for (const w of workers) void w.terminate();
      if (error) reject(error);
      else resolve();
    };
    const fail = (m: { message?: string; name?: string }) => finish(m.name === "SheetInputError" ? new SheetInputError(m.message!) : new Error(m.message));
    const feed = (worker: Worker) => {
      if (settled || next >= jobs.length) return;
      const id = next++;
      worker.postMessage({ id, job: jobs[id] });
    };
    for (let i = 0; i < extraThreads; i++) {
      const worker = new Worker(new URL("./sheetWorkerEntry.mjs", import.meta.url));
      workers.push(worker);
      worker.on("message", (m: { ok: boolean; message?: string; name?: string }) => {
        if (!m.ok) return fail(m);
        done++;
        finish();
        feed(worker);
      });
      worker.on("error", (error) => finish(error));
      worker.on("exit", (code) => {
        if (code !== 0 && !settled) finish(new Error(`a sheet worker stopped with exit code ${code}`));
      });
      feed(worker);
    }
    void (async () => {
      while (!settled && next < jobs.length) {
        const job = jobs[next++];
        try {
          await runBenchSheetJob(job);
        } catch (error) {
          return finish(error as Error);
        }
        done++;
        finish();
      }
    })();
  });
}

/**
 * Writes one sheet per entry and paper size, on the main thread and a worker thread when there
 * are many (rendering is CPU-bound: layout, font subsetting, compression). Returns the paths
 * written, in entry order.
 */
export async function writeBenchSheets(options: WriteBenchSheetsOptions): Promise<string[]> {
  const byId = new Map(options.molecules.map((m) => [m.id, m]));
  const papers = options.papers ?? paperNames;
  const jobs: BenchSheetJob[] = [];
  for (const entry of options.entries) {
    const molecule = byId.get(entry.moleculeId);
    if (!molecule) throw new SheetInputError(`no molecule "${entry.moleculeId}" for the atlas entry of ${entry.species} at ${entry.temperatureK} K`);
    for (const paper of papers) {
      jobs.push({ request: { molecule, entry, paper, build: options.build }, path: join(options.outDir, sheetPath(molecule.id, entry.species, entry.temperatureK, paper)) });
    }
  }
  const threads = options.threads ?? Math.min(2, availableParallelism(), 1 + Math.floor(jobs.length / sheetsPerExtraThread));
  if (threads >= 2 && jobs.length >= 2) await runOnThreads(jobs, Math.min(threads, jobs.length) - 1);
  else for (const job of jobs) await runBenchSheetJob(job);
  return jobs.map((j) => j.path);
}
