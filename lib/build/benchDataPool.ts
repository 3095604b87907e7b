import { availableParallelism } from "node:os";
import type { Molecule } from "../molecules/index.ts";
import { startJobs, type JobRun, type SharedWorkers } from "../shared/jobPool.ts";
import { moleculeBenchData, type MoleculeBenchData } from "./benchData.ts";

/**
 * Below this many molecules a worker does not pay for itself: starting one (tsx, the atlas and
 * core modules) costs about a second of CPU, about one molecule's calibration marks.
 */
const moleculesPerExtraThread = 4;

export type BenchDataRun = JobRun<MoleculeBenchData>;

/**
 * Each molecule's bench data (calibration marks at every default resolution: the build's most
 * expensive physics) on a worker thread that starts at once, so this thread can render plots
 * meanwhile; `finish` makes this thread take molecules from the same queue. Every molecule is
 * computed exactly once, by one thread, with the same code, so the results are those of a
 * single-threaded build.
 */
export function startBenchData(
  molecules: Molecule[],
  threads = Math.min(2, availableParallelism(), 1 + Math.floor(molecules.length / moleculesPerExtraThread)),
  shared?: SharedWorkers,
): BenchDataRun {
  return startJobs({
    ...(shared ? { shared } : {}),
    jobs: molecules,
    workers: threads >= 2 && molecules.length >= 2 ? 1 : 0,
    workerEntry: new URL("./benchDataWorkerEntry.mjs", import.meta.url),
    runHere: moleculeBenchData,
    errorOf: (failure, molecule) => new Error(`${molecule.file}: ${failure.message}`),
  });
}
