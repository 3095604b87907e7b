import { mkdirSync } from "node:fs";
import { dirname } from "node:path";
import { SheetInputError } from "./sheetInput.ts";
import { renderBenchSheet, type BenchSheetRequest } from "./renderBenchSheet.ts";
import { writeFileAtomic } from "./writeFileAtomic.ts";

/** One sheet to render and where to put it: plain data, so it can cross to a worker thread. */
export interface BenchSheetJob {
  request: BenchSheetRequest;
  path: string;
}

export async function runBenchSheetJob(job: BenchSheetJob): Promise<string> {
  const bytes = await renderBenchSheet(job.request);
  try {
    mkdirSync(dirname(job.path), { recursive: true });
  } catch (error) {
    throw new SheetInputError(`cannot create the folder ${dirname(job.path)}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
  }
  writeFileAtomic(job.path, bytes);
  return job.path;
}
