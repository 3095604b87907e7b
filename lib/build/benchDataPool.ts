import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import type { Molecule } from "../molecules/index.ts";
import { moleculeBenchData, type MoleculeBenchData } from "./benchData.ts";

/**
 * Below this many molecules a worker does not pay for itself: starting one (tsx, the atlas and
 * core modules) costs about a second of CPU, about one molecule's calibration marks.
 */
const moleculesPerExtraThread = 4;

export interface BenchDataRun {
  /** Computes on this thread too until every molecule is done; results in the molecules' order. */
  finish(): Promise<MoleculeBenchData[]>;
  /** Stops the worker (when the build failed elsewhere). */
  cancel(): Promise<void>;
}

/**
 * Each molecule's bench data (calibration marks at every default resolution: the build's most
 * expensive physics) on a worker thread that starts at once, so this thread can render plots
 * meanwhile; `finish` makes this thread take molecules from the same shared counter. Every
 * molecule is computed exactly once, by one thread, with the same code, so the results are
 * those of a single-threaded build.
 */
export function startBenchData(molecules: Molecule[], threads = Math.min(2, availableParallelism(), 1 + Math.floor(molecules.length / moleculesPerExtraThread))): BenchDataRun {
  const next = new Int32Array(new SharedArrayBuffer(4));
  const results: Array<MoleculeBenchData | undefined> = new Array(molecules.length);
  let worker: Worker | null = null;
  let workerDone: Promise<void> = Promise.resolve();
  if (threads >= 2 && molecules.length >= 2) {
    const w = new Worker(new URL("./benchDataWorkerEntry.mjs", import.meta.url));
    worker = w;
    workerDone = new Promise<void>((resolve, reject) => {
      w.on("message", (m: { index?: number; data?: MoleculeBenchData; error?: string; finished?: boolean }) => {
        if (m.error !== undefined) reject(new Error(`${molecules[m.index!].file}: ${m.error}`));
        else if (m.finished) resolve();
        else results[m.index!] = m.data;
      });
      w.on("error", reject);
      w.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`the bench-data worker stopped with exit code ${code}`))));
    });
    workerDone.catch(() => {}); // reported by finish()
    w.postMessage({ molecules, claim: next.buffer });
  }
  const stop = async () => {
    Atomics.store(next, 0, molecules.length);
    if (worker) await worker.terminate();
  };
  return {
    async finish() {
      try {
        for (let i = Atomics.add(next, 0, 1); i < molecules.length; i = Atomics.add(next, 0, 1)) results[i] = moleculeBenchData(molecules[i]);
        await workerDone;
      } finally {
        await stop();
      }
      return results.map((r, i) => {
        if (!r) throw new Error(`no bench data for ${molecules[i].id}`);
        return r;
      });
    },
    cancel: stop,
  };
}
