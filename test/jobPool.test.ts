import { describe, expect, it } from "vitest";
import { sharedWorkers, startJobs, workerJob } from "../lib/shared/jobPool.ts";

const workerEntry = new URL("./helpers/doublingWorker.mjs", import.meta.url);
const double = (n: number) => ({ doubled: 2 * n, thread: "main" });
const errorOf = (failure: { name: string; message: string }, job: number) => new Error(`job ${job}: ${failure.name}: ${failure.message}`);

describe("startJobs", () => {
  it("runs every job once, on the worker and on this thread, with the results in job order", async () => {
    const jobs = [1, 2, 3, 4, 5, 6, 7, 8];
    const results = await startJobs({ jobs, workers: 1, workerEntry, runHere: double, errorOf }).finish();
    expect(results.map((r) => r.doubled)).toEqual([2, 4, 6, 8, 10, 12, 14, 16]);
    // The worker claims the first job as the run starts, before this thread can.
    expect(results[0].thread).toBe("worker");
  });

  it("runs everything on this thread when asked for no workers", async () => {
    const results = await startJobs({ jobs: [3, 4], workers: 0, workerEntry, runHere: double, errorOf }).finish();
    expect(results).toEqual([
      { doubled: 6, thread: "main" },
      { doubled: 8, thread: "main" },
    ]);
  });

  it("reports a worker's failure with its error's name, through errorOf", async () => {
    const run = startJobs({ jobs: [-1, 5], workers: 1, workerEntry, runHere: double, errorOf });
    await expect(run.finish()).rejects.toThrow("job -1: RangeError: -1 is negative");
  });

  it("reports a failure on this thread as thrown", async () => {
    const refuse = () => {
      throw new TypeError("not here");
    };
    await expect(startJobs({ jobs: [1], workers: 0, workerEntry, runHere: refuse, errorOf }).finish()).rejects.toThrow(TypeError);
  });
});

describe("sharedWorkers", () => {
  it("keeps one pool across runs (a build's batches) until closed", async () => {
    const shared = sharedWorkers();
    const first = await startJobs({ jobs: [1, 2, 3, 4], workers: 1, workerEntry, runHere: double, errorOf, shared }).finish();
    const pool = shared.poolFor(workerEntry, 1);
    const second = await startJobs({ jobs: [5, 6, 7, 8], workers: 1, workerEntry, runHere: double, errorOf, shared }).finish();
    expect([...first, ...second].map((r) => r.doubled)).toEqual([2, 4, 6, 8, 10, 12, 14, 16]);
    expect(second.some((r) => r.thread === "worker")).toBe(true);
    // The same pool served both runs and is still up; close stops it, and the next use makes a new one.
    expect(shared.poolFor(workerEntry, 1)).toBe(pool);
    expect(pool.threads.length).toBe(1);
    await shared.close();
    expect(shared.poolFor(workerEntry, 1)).not.toBe(pool);
    await shared.close();
  });
});

describe("workerJob", () => {
  it("turns a thrown error into its name and message, which survive the copy to the main thread", async () => {
    class SheetProblem extends Error {
      name = "SheetProblem";
    }
    const job = workerJob((n: number) => {
      if (n > 1) throw new SheetProblem(`${n} is too many`);
      return n;
    });
    expect(await job(1)).toBe(1);
    await expect(job(2)).rejects.toEqual({ name: "SheetProblem", message: "2 is too many" });
  });
});
