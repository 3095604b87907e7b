import { deserialize } from "node:v8";
import { parentPort } from "node:worker_threads";
import { runBenchSheetJob, type BenchSheetJob } from "./benchSheetJob.ts";
import type { BenchSheetRequest } from "./renderBenchSheet.ts";
import type { SharedSheetJobs } from "./writeBenchSheets.ts";

type Message = { id: number; job: BenchSheetJob } | (SharedSheetJobs & { claim: SharedArrayBuffer });

const reply = (id: number, error?: unknown) =>
  parentPort!.postMessage(
    error === undefined ? { id, ok: true } : { id, ok: false, message: error instanceof Error ? error.message : String(error), name: error instanceof Error ? error.name : "Error" },
  );

// Either one job (its outcome posted back), or the whole queue: every thread claims the next
// job number from one shared counter, so no thread waits for another to hand out work.
parentPort!.on("message", async (message: Message) => {
  if ("claim" in message) {
    const next = new Int32Array(message.claim);
    const bytes = new Uint8Array(message.requests);
    // The A4 and Letter jobs of an entry follow each other: keep the last request read.
    let last = { k: -1, request: null as Omit<BenchSheetRequest, "paper"> | null };
    for (let id = Atomics.add(next, 0, 1); id < message.jobs.length; id = Atomics.add(next, 0, 1)) {
      const job = message.jobs[id];
      try {
        if (last.k !== job.request) last = { k: job.request, request: deserialize(bytes.slice(message.offsets[job.request], message.offsets[job.request + 1])) };
        await runBenchSheetJob({ request: { ...last.request!, paper: job.paper }, path: job.path });
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
