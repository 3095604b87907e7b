import { parentPort } from "node:worker_threads";
import { runBenchSheetJob, type BenchSheetJob } from "./benchSheetJob.ts";

// One job at a time from the pool in writeBenchSheets.ts; every outcome is posted back.
parentPort!.on("message", async (message: { id: number; job: BenchSheetJob }) => {
  try {
    await runBenchSheetJob(message.job);
    parentPort!.postMessage({ id: message.id, ok: true });
  } catch (error) {
    parentPort!.postMessage({ id: message.id, ok: false, message: error instanceof Error ? error.message : String(error), name: error instanceof Error ? error.name : "Error" });
  }
});
