import { fileURLToPath } from "node:url";
import { Piscina } from "piscina";

/** A worker's failure as it crosses threads: a thrown Error's class does not survive the copy, its name and message do. */
export interface JobFailure {
  name: string;
  message: string;
}

export interface JobRun<R> {
  /** Takes jobs on this thread too until none are left; the results in job order, or the first failure. */
  finish(): Promise<R[]>;
  /** Hands out no more jobs and stops the workers (when the caller failed elsewhere); resolves once they have stopped. */
  cancel(): Promise<void>;
}

export interface JobPoolOptions<J, R> {
  jobs: J[];
  /** Worker threads to start at once; 0 runs every job on this thread in `finish`. */
  workers: number;
  /** The worker module: its default export runs one job (see `workerJob`) and returns the result. */
  workerEntry: URL;
  /** One job on this thread: the same code the worker runs, so results do not depend on the thread. */
  runHere: (job: J) => R | Promise<R>;
  /** The error to report for a job that failed on a worker. */
  errorOf: (failure: JobFailure, job: J) => Error;
}

/**
 * Runs each job exactly once: the workers (a piscina pool) start on the jobs at once, while this
 * thread is busy elsewhere; `finish` makes this thread take jobs from the same queue. A worker is
 * sent its next job when it has finished the last, so a slow job never holds up the others.
 */
export function startJobs<J, R>(options: JobPoolOptions<J, R>): JobRun<R> {
  const { jobs } = options;
  const results: R[] = new Array(jobs.length);
  let next = 0;
  let failure: Error | null = null;
  const take = () => (failure ? jobs.length : next++);
  const fail = (error: Error) => {
    failure ??= error;
  };
  const pool =
    options.workers > 0 && jobs.length > 0
      ? new Piscina({ filename: fileURLToPath(options.workerEntry), minThreads: options.workers, maxThreads: options.workers })
      : null;
  let stopped: Promise<void> | null = null;
  const stop = () => (stopped ??= pool ? pool.destroy() : Promise.resolve());
  const onWorker = async (workerPool: Piscina) => {
    for (let i = take(); i < jobs.length; i = take()) {
      try {
        results[i] = (await workerPool.run(jobs[i])) as R;
      } catch (thrown) {
        const f = thrown as Partial<JobFailure>;
        fail(options.errorOf({ name: String(f?.name ?? "Error"), message: String(f?.message ?? thrown) }, jobs[i]));
      }
    }
  };
  const onWorkers = pool ? Promise.all(Array.from({ length: options.workers }, () => onWorker(pool))) : Promise.resolve([]);
  return {
    async finish() {
      try {
        for (let i = take(); i < jobs.length; i = take()) {
          try {
            results[i] = await options.runHere(jobs[i]);
          } catch (error) {
            fail(error as Error);
          }
        }
        await onWorkers;
      } finally {
        await stop();
      }
      if (failure) throw failure;
      return results;
    },
    async cancel() {
      fail(new Error("cancelled"));
      await stop();
    },
  };
}

/** A worker module's default export: runs one job, and throws a failure that keeps its error's name. */
export function workerJob<J, R>(run: (job: J) => R | Promise<R>): (job: J) => Promise<R> {
  return async (job) => {
    try {
      return await run(job);
    } catch (error) {
      throw (error instanceof Error ? { name: error.name, message: error.message } : { name: "Error", message: String(error) }) satisfies JobFailure;
    }
  };
}
