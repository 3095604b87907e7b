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
  /** Worker threads kept across runs (a build's batches); without, the run starts and stops its own. */
  shared?: SharedWorkers;
}

/**
 * Worker threads that outlive one run: starting a worker (tsx, then the modules it needs) costs
 * about a second of CPU, and a build in batches would otherwise pay it for every batch. One
 * piscina pool per worker module, made at first use with the threads asked for then; `close`
 * stops them all.
 */
export interface SharedWorkers {
  poolFor(workerEntry: URL, threads: number): Piscina;
  close(): Promise<void>;
}

export function sharedWorkers(): SharedWorkers {
  const pools = new Map<string, Piscina>();
  return {
    poolFor(workerEntry, threads) {
      const key = workerEntry.href;
      let pool = pools.get(key);
      if (!pool) pools.set(key, (pool = new Piscina({ filename: fileURLToPath(workerEntry), minThreads: threads, maxThreads: threads })));
      return pool;
    },
    async close() {
      const all = [...pools.values()];
      pools.clear();
      await Promise.all(all.map((pool) => pool.destroy()));
    },
  };
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
  const useWorkers = options.workers > 0 && jobs.length > 0;
  const pool = !useWorkers
    ? null
    : options.shared
      ? options.shared.poolFor(options.workerEntry, options.workers)
      : new Piscina({ filename: fileURLToPath(options.workerEntry), minThreads: options.workers, maxThreads: options.workers });
  let stopped: Promise<void> | null = null;
  // A shared pool stays up for the next run: stopping means handing out no more jobs and waiting for those out.
  const stop = () => (stopped ??= pool && !options.shared ? pool.destroy() : Promise.resolve());
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
      if (options.shared) await onWorkers;
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
