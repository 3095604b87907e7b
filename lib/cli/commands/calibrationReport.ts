import { fileURLToPath } from "node:url";
import type { CalibrationRun } from "../../format/index.ts";
import { buildIdentity } from "../../shared/buildIdentity.ts";
import { renderCalibrationReport, SheetInputError, writeFileAtomic } from "../../sheet/index.ts";
import { UsageError } from "../usageError.ts";

const repoDir = fileURLToPath(new URL("../../..", import.meta.url));

/** Renders the PDF calibration report and writes it whole or not at all; returns the path written. */
export async function writeCalibrationReport(run: CalibrationRun, path: string): Promise<string> {
  try {
    const bytes = await renderCalibrationReport({ run, build: buildIdentity(repoDir), paper: "a4" });
    writeFileAtomic(path, bytes);
    return path;
  } catch (error) {
    if (error instanceof SheetInputError) throw new UsageError(error.message);
    throw error;
  }
}
