import { workerJob } from "../shared/jobPool.ts";
import { moleculeBenchData } from "./benchData.ts";

/** One molecule's bench data on a worker thread of the pool (startBenchData): the same code the main thread runs. */
export default workerJob(moleculeBenchData);
