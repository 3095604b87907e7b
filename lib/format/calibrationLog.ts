// The calibration log: one JSON object per line (JSON Lines), one line per `calibrate --log` run.
// The schema is documented in docs/calibration-log.md; readers refuse a line of a newer version.
import type { BuildIdentity } from "../shared/buildIdentity.ts";
import { toleranceAtCm } from "../core/index.ts";
import { checkWavenumbersCm } from "./calibrationVerdict.ts";
import { calibrationDocument } from "./calibrationDocument.ts";
import type { CalibrationRun } from "./spectrumCalibrationText.ts";
import { noRecordFields, type CalibrationRecordFields } from "./calibrationRecord.ts";

/** The value of every record's `schema` field: a line without it is not ours. */
export const calibrationLogSchema = "bandatlas-calibration-log";
/** The version this bandatlas writes and the newest it reads. */
export const calibrationLogVersion = 1;

type CorrectionDocument = ReturnType<typeof calibrationDocument>["correction"];

/** One line of the log. */
export interface CalibrationLogEntry {
  schema: typeof calibrationLogSchema;
  version: number;
  /** When the line was written, ISO 8601 UTC. */
  recordedAt: string;
  /** "calibrated", or "refused" with the reason in `refusal` and no correction. */
  outcome: "calibrated" | "refused";
  refusal: string | null;
  measuredOn: string | null;
  measuredOnFrom: CalibrationRecordFields["measuredOnFrom"];
  instrument: string | null;
  operator: string | null;
  cell: { id: string | null; filledOn: string | null };
  gas: string;
  file: string;
  sha256: string;
  conditions: CalibrationRun["conditions"];
  conditionsAssumed: CalibrationRecordFields["assumedConditions"];
  model: string | null;
  correction: CorrectionDocument | null;
  tolerance: CalibrationRecordFields["tolerance"];
  /** The tolerance as a scale (ppm) at the strictest check wavenumber, for the history chart; null without a tolerance. */
  toleranceScalePpm: number | null;
  /** The tolerance in cm⁻¹ when it was given in cm⁻¹ (the offset chart's band), else null. */
  toleranceOffsetCm: number | null;
  verdict: "pass" | "fail" | "undecided" | null;
  verdictChecks: ReturnType<typeof calibrationDocument>["verdictChecks"];
  build: BuildIdentity;
}

/** What a refused run still records. */
export interface RefusedRun {
  gas: string;
  gasName: string;
  /** The molecule's hazard caution, shown on the refusal's report too. */
  caution: string;
  fileName: string;
  sha256: string;
  conditions: CalibrationRun["conditions"];
  record: CalibrationRecordFields;
  reason: string;
}

function head(record: CalibrationRecordFields, recordedAt: Date) {
  return {
    schema: calibrationLogSchema,
    version: calibrationLogVersion,
    recordedAt: recordedAt.toISOString(),
    measuredOn: record.measuredOn,
    measuredOnFrom: record.measuredOnFrom,
    instrument: record.instrument,
    operator: record.operator,
    cell: { id: record.cellId, filledOn: record.cellFilledOn },
  } as const;
}

/** The log line of a calibrated run (as an object; JSON.stringify makes the line). */
export function calibrationLogEntry(run: CalibrationRun, build: BuildIdentity, recordedAt: Date): CalibrationLogEntry {
  const record = run.record ?? noRecordFields;
  const doc = calibrationDocument(run);
  const setting = record.tolerance;
  let toleranceScalePpm: number | null = null;
  if (setting) {
    const checks = checkWavenumbersCm(run, setting);
    toleranceScalePpm = Math.min(...checks.map((nu) => (toleranceAtCm(setting.tolerance, nu) / nu) * 1e6));
  }
  return {
    ...head(record, recordedAt),
    outcome: "calibrated",
    refusal: null,
    gas: run.gas,
    file: run.fileName,
    sha256: run.sha256,
    conditions: run.conditions,
    conditionsAssumed: record.assumedConditions,
    model: doc.model,
    correction: doc.correction,
    tolerance: setting,
    toleranceScalePpm: toleranceScalePpm === null ? null : Number(toleranceScalePpm.toPrecision(4)),
    toleranceOffsetCm: setting?.tolerance.unit === "cm-1" ? setting.tolerance.valueCm : null,
    verdict: doc.verdict,
    verdictChecks: doc.verdictChecks,
    build,
  };
}

/** The log line of a refused run: who, what and why, no correction and no verdict. */
export function refusalLogEntry(refused: RefusedRun, build: BuildIdentity, recordedAt: Date): CalibrationLogEntry {
  return {
    ...head(refused.record, recordedAt),
    outcome: "refused",
    refusal: refused.reason,
    gas: refused.gas,
    file: refused.fileName,
    sha256: refused.sha256,
    conditions: refused.conditions,
    conditionsAssumed: refused.record.assumedConditions,
    model: null,
    correction: null,
    tolerance: refused.record.tolerance,
    toleranceScalePpm: null,
    toleranceOffsetCm: null,
    verdict: null,
    verdictChecks: [],
    build,
  };
}

/** A problem with one line of a log, by its 1-based line number. */
export interface LogLineProblem {
  line: number;
  message: string;
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const shown = (text: string) => (text.length > 60 ? `${text.slice(0, 57)}…` : text);

/** Why a parsed line is not a record this bandatlas reads, or null when it is one. */
export function logEntryProblem(value: unknown): string | null {
  if (!isObject(value) || value.schema !== calibrationLogSchema) return `not a bandatlas calibration record (no "schema": "${calibrationLogSchema}")`;
  if (typeof value.version !== "number" || !Number.isInteger(value.version) || value.version < 1) return `"version" must be a whole number from 1`;
  if (value.version > calibrationLogVersion)
    return `written by a newer bandatlas (version ${value.version}; this one reads up to ${calibrationLogVersion}): update bandatlas to read it`;
  if (typeof value.recordedAt !== "string" || Number.isNaN(Date.parse(value.recordedAt))) return `"recordedAt" is not a date and time`;
  if (value.measuredOn !== null && (typeof value.measuredOn !== "string" || !/^\d{4}-\d{2}-\d{2}$/.test(value.measuredOn)))
    return `"measuredOn" is not a YYYY-MM-DD date`;
  if (value.outcome === "refused") return typeof value.refusal === "string" ? null : `a refused run needs its "refusal"`;
  if (value.outcome !== "calibrated") return `"outcome" must be "calibrated" or "refused"`;
  const c = value.correction;
  if (!isObject(c)) return `"correction" is missing`;
  for (const field of ["scalePpm", "scalePpmUncertainty", "offsetCm", "offsetCmUncertainty"])
    if (typeof c[field] !== "number" || !Number.isFinite(c[field])) return `"correction.${field}" is not a number`;
  return null;
}

export interface ParsedLog {
  /** The records, each with the line it was read from. */
  entries: Array<{ line: number; entry: CalibrationLogEntry }>;
  /** Every line that is not a record: never dropped without a word. */
  problems: LogLineProblem[];
}

/**
 * Reads a log's text line by line; blank lines are skipped, every other line is a record or a
 * problem naming its line. A last line without its line end is a write that was cut short.
 */
export function parseCalibrationLog(text: string): ParsedLog {
  const lines = text.split("\n");
  const entries: ParsedLog["entries"] = [];
  const problems: LogLineProblem[] = [];
  const cut = !text.endsWith("\n") && text.length > 0;
  lines.forEach((raw, i) => {
    const content = raw.replace(/\r$/, "");
    if (content.trim() === "") return;
    const line = i + 1;
    let value: unknown;
    try {
      value = JSON.parse(content);
    } catch {
      problems.push({
        line,
        message:
          cut && i === lines.length - 1
            ? "incomplete: the last line has no line end and is not whole JSON (a write cut short?)"
            : `not JSON: ${shown(content)}`,
      });
      return;
    }
    const problem = logEntryProblem(value);
    if (problem) problems.push({ line, message: problem });
    else entries.push({ line, entry: value as CalibrationLogEntry });
  });
  return { entries, problems };
}

/**
 * Whether a line may be appended after this text: the last line must be whole (end in a line
 * end) and one of ours. Returns the problem with its line number, or null.
 */
export function appendProblem(text: string): LogLineProblem | null {
  if (text.length === 0) return null;
  const lines = text.split("\n");
  const lastIndex = text.endsWith("\n") ? lines.length - 2 : lines.length - 1;
  let i = lastIndex;
  while (i >= 0 && lines[i].trim() === "") i--;
  if (i < 0) return null;
  if (!text.endsWith("\n"))
    return { line: lastIndex + 1, message: "incomplete (no line end): a write was cut short or the file was edited; repair or remove that line first" };
  let value: unknown;
  try {
    value = JSON.parse(lines[i]);
  } catch {
    return { line: i + 1, message: "not JSON: this file does not look like a calibration log" };
  }
  const problem = logEntryProblem(value);
  return problem ? { line: i + 1, message: problem } : null;
}
