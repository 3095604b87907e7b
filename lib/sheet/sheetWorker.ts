import { workerJob } from "../shared/jobPool.ts";
import { runBenchSheetJob } from "./benchSheetJob.ts";

/** One sheet on a worker thread of the pool (writeBenchSheets): the same code the main thread runs. */
export default workerJob(runBenchSheetJob);
