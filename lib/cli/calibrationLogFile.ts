import { closeSync, existsSync, fsyncSync, openSync, readFileSync, statSync, writeSync } from "node:fs";
import { appendProblem, type CalibrationLogEntry } from "../format/index.ts";
import { UsageError } from "./usageError.ts";

/** A log larger than this is not read whole to check its last line (a year of daily runs is ~2 MB). */
const maxLogBytes = 200 * 1024 * 1024;

/** The text of a log file, or a plain message; a missing file is an empty log. */
export function readLogText(path: string): string {
  if (!existsSync(path)) return "";
  const stat = statSync(path);
  if (stat.isDirectory()) throw new UsageError(`${path} is a folder; give a log file`);
  if (stat.size > maxLogBytes)
    throw new UsageError(`${path} is ${(stat.size / 1048576).toFixed(0)} MB, more than a calibration log should be; start a new log`);
  return readFileSync(path, "utf8");
}

/**
 * Appends one record as one line, safely: the existing file's last line must be whole and one of
 * ours (else refused, naming the line, and nothing is written); the line goes out in one write()
 * to a file opened for appending (O_APPEND: each write lands at the end) and is fsync'ed before
 * the command reports success, so a crash leaves either the whole line or none of it on disk.
 */
export function appendLogEntry(path: string, entry: CalibrationLogEntry): void {
  const problem = appendProblem(readLogText(path));
  if (problem) throw new UsageError(`--log ${path}: line ${problem.line} ${problem.message}; nothing was written`);
  const bytes = Buffer.from(JSON.stringify(entry) + "\n", "utf8");
  let fd: number;
  try {
    fd = openSync(path, "a");
  } catch (error) {
    throw new UsageError(`--log ${path}: cannot open it for appending (${(error as NodeJS.ErrnoException).code ?? "error"})`);
  }
  try {
    const written = writeSync(fd, bytes, 0, bytes.length);
    if (written !== bytes.length)
      throw new UsageError(`--log ${path}: only ${written} of ${bytes.length} bytes were written (disk full?); the last line is incomplete`);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}
