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
  /** Worker threads to use; default: up to two when there are enough sheets to pay for starting them. */
  workers?: number;
}

/** Where the build puts one sheet, relative to the site folder (for links from the pages). */
export function sheetPath(moleculeId: string, species: string, temperatureK: number, paper: PaperName): string {
  return join("sheets", moleculeId, sheetFileName(species, temperatureK, paper));
}

const sheetsPerWorkerStart = 8;

function runInWorkers(jobs: BenchSheetJob[], count: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const workers: Worker[] = [];
    let next = 0;
    let done = 0;
    let failed = false;
    const finish = (error?: Error) => {
      if (failed) return;
      if (error) failed = true;
      if (error || done === jobs.length) {
        for (const w of workers) void w.terminate();
        if (error) reject(error);
        else resolve();
      }
    };
    const feed = (worker: Worker) => {
      if (next < jobs.length) {
        const id = next++;
        worker.postMessage({ id, job: jobs[id] });
      }
    };
    for (let i = 0; i < count; i++) {
      const worker = new Worker(new URL("./sheetWorkerEntry.mjs", import.meta.url));
      workers.push(worker);
      worker.on("message", (m: { ok: boolean; message?: string; name?: string }) => {
        if (!m.ok) return finish(m.name === "SheetInputError" ? new SheetInputError(m.message!) : new Error(m.message));
        done++;
        if (done === jobs.length) finish();
        else feed(worker);
      });
      worker.on("error", (error) => finish(error));
      worker.on("exit", (code) => {
        if (code !== 0 && done < jobs.length) finish(new Error(`a sheet worker stopped with exit code ${code}`));
      });
      feed(worker);
    }
  });
}

/**
 * Writes one sheet per entry and paper size, on worker threads when there are many (rendering is
 * CPU-bound: font subsetting and compression). Returns the paths written, in entry order.
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
  const workers = Math.min(options.workers ?? Math.min(2, availableParallelism(), Math.floor(jobs.length / sheetsPerWorkerStart)), jobs.length);
  if (workers >= 2) await runInWorkers(jobs, workers);
  else for (const job of jobs) await runBenchSheetJob(job);
  return jobs.map((j) => j.path);
}
