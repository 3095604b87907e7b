import { parentPort } from "node:worker_threads";
import { runBenchSheetJob, type BenchSheetJob } from "./benchSheetJob.ts";

type Message = { id: number; job: BenchSheetJob } | { jobs: BenchSheetJob[]; claim: SharedArrayBuffer };

const reply = (id: number, error?: unknown) =>
  parentPort!.postMessage(
    error === undefined ? { id, ok: true } : { id, ok: false, message: error instanceof Error ? error.message : String(error), name: error instanceof Error ? error.name : "Error" },
  );

// Either one job (its outcome posted back), or the whole queue: every thread claims the next
// job number from one shared counter, so no thread waits for another to hand out work.
parentPort!.on("message", async (message: Message) => {
  if ("claim" in message) {
    const next = new Int32Array(message.claim);
    for (let id = Atomics.add(next, 0, 1); id < message.jobs.length; id = Atomics.add(next, 0, 1)) {
      try {
        await runBenchSheetJob(message.jobs[id]);
      } catch (error) {
        return reply(id, error);
      }
      reply(id);
    }
    return;
  }
  try {
    await runBenchSheetJob(message.job);
    reply(message.id);
  } catch (error) {
    reply(message.id, error);
  }
});
