import { fileURLToPath } from "node:url";
import { calibrationLogEntry, refusalLogEntry, type CalibrationRun, type RefusedRun } from "../../format/index.ts";
import { buildIdentity } from "../../shared/buildIdentity.ts";
import { renderCalibrationReport, renderRefusalReport, SheetInputError, writeFileAtomic } from "../../sheet/index.ts";
import { appendLogEntry } from "../calibrationLogFile.ts";
import { UsageError } from "../usageError.ts";

const repoDir = fileURLToPath(new URL("../../..", import.meta.url));

async function writeReport(path: string, render: () => Promise<Uint8Array>): Promise<string> {
  try {
    writeFileAtomic(path, await render());
    return path;
  } catch (error) {
    if (error instanceof SheetInputError) throw new UsageError(error.message);
    throw error;
  }
}

/** Renders the PDF calibration report and writes it whole or not at all; returns the path written. */
export async function writeCalibrationReport(run: CalibrationRun, path: string): Promise<string> {
  return writeReport(path, () => renderCalibrationReport({ run, build: buildIdentity(repoDir), paper: "a4" }));
}

/** The short report of a refused run: who, what, and why no correction was given. */
export async function writeRefusalReport(refused: RefusedRun, path: string): Promise<string> {
  return writeReport(path, () => renderRefusalReport({ refused, build: buildIdentity(repoDir), paper: "a4" }));
}

/** Appends the run to the calibration log; returns the path. */
export function logCalibration(run: CalibrationRun, path: string): string {
  appendLogEntry(path, calibrationLogEntry(run, buildIdentity(repoDir), new Date()));
  return path;
}

/** Appends the refusal to the calibration log; returns the path. */
export function logRefusal(refused: RefusedRun, path: string): string {
  appendLogEntry(path, refusalLogEntry(refused, buildIdentity(repoDir), new Date()));
  return path;
}
