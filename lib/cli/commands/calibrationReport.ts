import { UsageError } from "../usageError.ts";
import type { CalibrationRun } from "../../format/index.ts";

/** Writes the PDF calibration report (not built yet: refuses plainly rather than write half a file). */
export async function writeCalibrationReport(run: CalibrationRun, path: string): Promise<string> {
  void run;
  throw new UsageError(`--report ${path}: the PDF calibration report is not available yet`);
}
