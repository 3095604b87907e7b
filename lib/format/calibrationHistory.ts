import { controlLimitSigmas, drawnLimits, trendBreaks, verdictCoverageFactor, type ControlLimits } from "../core/index.ts";
import type { CalibrationLogEntry, ParsedLog } from "./calibrationLog.ts";

/** The name a run without --instrument is filed under. */
export const unnamedInstrument = "(instrument not given)";

const instrumentOf = (e: CalibrationLogEntry) => e.instrument ?? unnamedInstrument;
/** A run's date: the date of measurement, else the day it was logged. */
export const runDate = (e: CalibrationLogEntry) => e.measuredOn ?? e.recordedAt.slice(0, 10);

export interface HistoryPoint {
  /** The log line the run was read from. */
  line: number;
  date: string;
  kPpm: number;
  /** Expanded uncertainty of k (k = 2), ppm. */
  kExpandedPpm: number;
  cCm: number;
  cExpandedCm: number;
  verdict: CalibrationLogEntry["verdict"];
  /** Outside mean ± 3 SD of the instrument's other runs. */
  breaksTrend: boolean;
}

export interface HistorySeries {
  instrument: string;
  points: HistoryPoint[];
  /** Refused runs of the instrument: listed, not plotted. */
  refusedLines: number[];
  kLimits: ControlLimits | null;
  cLimits: ControlLimits | null;
  /** The latest run's tolerance as a scale, ppm (the band drawn on the k chart), and in cm⁻¹ for the c chart. */
  toleranceScalePpm: number | null;
  toleranceOffsetCm: number | null;
  /** Whether any run fitted an offset (then c is charted too). */
  showOffset: boolean;
}

/** The instruments of a log, in the order they first appear. */
export function logInstruments(log: ParsedLog): string[] {
  return [...new Set(log.entries.map((e) => instrumentOf(e.entry)))];
}

/**
 * One instrument's runs in date order, with the ±3 SD limits of its history and the runs that
 * break the trend (core trendBreaks: outside mean ± 3 SD of its other runs, k and, when offsets
 * were fitted, c).
 */
export function historySeries(log: ParsedLog, instrument: string): HistorySeries {
  const runs = log.entries.filter((e) => instrumentOf(e.entry) === instrument);
  const calibrated = runs
    .filter((e) => e.entry.outcome === "calibrated" && e.entry.correction !== null)
    .sort((a, b) => runDate(a.entry).localeCompare(runDate(b.entry)) || a.line - b.line);
  const showOffset = calibrated.some((e) => e.entry.model !== "scale");
  const k = calibrated.map((e) => e.entry.correction!.scalePpm);
  const c = calibrated.map((e) => e.entry.correction!.offsetCm);
  const kBreaks = trendBreaks(k);
  const cBreaks = showOffset ? trendBreaks(c) : k.map(() => false);
  const withTolerance = [...calibrated].reverse().find((e) => e.entry.toleranceScalePpm !== null);
  return {
    instrument,
    points: calibrated.map((e, i) => ({
      line: e.line,
      date: runDate(e.entry),
      kPpm: k[i],
      kExpandedPpm: verdictCoverageFactor * e.entry.correction!.scalePpmUncertainty,
      cCm: c[i],
      cExpandedCm: verdictCoverageFactor * e.entry.correction!.offsetCmUncertainty,
      verdict: e.entry.verdict,
      breaksTrend: kBreaks[i] || cBreaks[i],
    })),
    refusedLines: runs.filter((e) => e.entry.outcome === "refused").map((e) => e.line),
    kLimits: drawnLimits(k, kBreaks),
    cLimits: showOffset ? drawnLimits(c, cBreaks) : null,
    toleranceScalePpm: withTolerance?.entry.toleranceScalePpm ?? null,
    toleranceOffsetCm: withTolerance?.entry.toleranceOffsetCm ?? null,
    showOffset,
  };
}

/** The rule that flags a run, in words (the table, the chart, the page). */
export const trendRule = `A run breaks the trend when its k (or c) lies outside the mean ± ${controlLimitSigmas} standard deviations of the same instrument's other runs (at least 4 of them); the band drawn is the mean ± ${controlLimitSigmas} SD of the runs that do not (a control chart of individual runs; common practice, no source).`;

function pm(value: number, expanded: number, digits: number): string {
  const v = value.toFixed(digits).replace(/^-/, "−");
  return `${value >= 0 ? "+" : ""}${v} ± ${expanded.toFixed(digits)}`;
}

/** Every run of the log as table rows, in the log's order; refused runs say so. */
export function historyTable(log: ParsedLog): { headings: string[]; rows: string[][]; rightAligned: boolean[] } {
  const breaks = new Set<number>();
  for (const instrument of logInstruments(log)) for (const p of historySeries(log, instrument).points) if (p.breaksTrend) breaks.add(p.line);
  const rows = log.entries.map(({ line, entry: e }) => {
    const c = e.correction;
    const cell = e.cell.id === null ? "—" : e.cell.id;
    return [
      String(line),
      runDate(e),
      instrumentOf(e),
      e.operator ?? "—",
      cell,
      e.gas,
      e.model ?? "—",
      c && e.model !== "offset" ? pm(c.scalePpm, verdictCoverageFactor * c.scalePpmUncertainty, decimalsFor(c.scalePpmUncertainty)) : "—",
      c && e.model !== "scale" ? pm(c.offsetCm, verdictCoverageFactor * c.offsetCmUncertainty, 4) : "—",
      e.outcome === "refused" ? "refused" : (e.verdict ?? "no tolerance"),
      breaks.has(line) ? "BREAKS TREND" : "",
    ];
  });
  return {
    headings: ["line", "date", "instrument", "operator", "cell", "gas", "model", "k ± U / ppm", "c ± U / cm⁻¹", "verdict", "trend"],
    rows,
    rightAligned: [true, false, false, false, false, false, false, true, true, false, false],
  };
}

function decimalsFor(sigmaPpm: number): number {
  return sigmaPpm > 0 ? Math.max(0, Math.min(4, 1 - Math.floor(Math.log10(2 * sigmaPpm)))) : 2;
}
