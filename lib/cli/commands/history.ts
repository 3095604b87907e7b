import { basename } from "node:path";
import { fileURLToPath } from "node:url";
import { historyChartScene, historySeries, historyTable, logInstruments, parseCalibrationLog, sceneSvg, textTable, trendRule } from "../../format/index.ts";
import { buildIdentity } from "../../shared/buildIdentity.ts";
import type { CommandResult } from "../../shared/commandResult.ts";
import { renderHistoryReport, writeFileAtomic } from "../../sheet/index.ts";
import { readLogText } from "../calibrationLogFile.ts";
import { parseCommandLine } from "../options.ts";
import { UsageError } from "../usageError.ts";
import { existsSync } from "node:fs";

export const historyHelp = `bandatlas history <log file> [options]

The runs of a calibration log (written by bandatlas calibrate --log) as a table, and a chart of
the scale k (and the offset c) against the date of measurement: each run with its ± U (k = 2),
the tolerance band, the mean ± 3 standard deviations of the instrument's runs, and the runs that
break the trend. A line of the log that is not a calibration record is reported with its number.

  <log file>              the JSON-lines log of calibrate --log
  --out <chart.pdf|chart.svg>   also write the chart: a PDF (charts and the table) or an SVG
  --instrument <name>     chart this instrument (default: every instrument in the log; an SVG
                          holds one chart: the instrument of the latest run unless named)

${trendRule}`;

const repoDir = fileURLToPath(new URL("../../..", import.meta.url));

export async function runHistory(args: string[]): Promise<CommandResult | string> {
  const { values, positionals } = parseCommandLine("history", args, { out: { type: "string" }, instrument: { type: "string" } }, 1);
  if (values.help) return historyHelp + "\n";
  if (positionals.length === 0) throw new UsageError("which log? e.g. `bandatlas history calibrations.jsonl` (see bandatlas history --help)");
  const path = positionals[0];
  if (!existsSync(path)) throw new UsageError(`cannot read ${path}: no such file`);
  const out = values.out as string | undefined;
  if (out !== undefined && !/\.(pdf|svg)$/i.test(out)) throw new UsageError(`--out ${out}: give a file name ending in .pdf or .svg`);
  const log = parseCalibrationLog(readLogText(path));
  const fileName = basename(path);
  if (log.entries.length === 0) {
    const why = log.problems.length ? `; ${log.problems.map((p) => `line ${p.line}: ${p.message}`).join("; ")}` : "";
    throw new UsageError(`${fileName} holds no calibration record${why}`);
  }
  const all = logInstruments(log);
  const wanted = values.instrument as string | undefined;
  if (wanted !== undefined && !all.includes(wanted)) throw new UsageError(`--instrument ${wanted}: the log has no run of it; it has: ${all.join(", ")}`);
  const latest = log.entries.reduce((a, b) => (b.entry.recordedAt >= a.entry.recordedAt ? b : a));
  const charted = wanted !== undefined ? [wanted] : out !== undefined && /\.svg$/i.test(out) ? [latest.entry.instrument ?? all.at(-1)!] : all;

  const table = historyTable(log);
  const text = [
    `Calibration history of ${fileName}: ${log.entries.length} run${log.entries.length === 1 ? "" : "s"}, ${all.length} instrument${all.length === 1 ? "" : "s"}`,
    ...log.problems.map((p) => `NOT READ: ${fileName} line ${p.line}: ${p.message}`),
    "",
    textTable(table.headings, table.rows, table.rightAligned),
    "",
    "k ± U and c ± U: the correction with its expanded uncertainty (k = 2).",
    trendRule,
  ];
  const chartable = charted.filter((name) => historySeries(log, name).points.length > 0);
  if (out !== undefined) {
    if (chartable.length === 0) throw new UsageError(`--out ${out}: no calibrated run to chart (only refusals)`);
    const bytes = /\.svg$/i.test(out)
      ? new TextEncoder().encode(sceneSvg(historyChartScene(historySeries(log, chartable[0]))))
      : await renderHistoryReport({ log, fileName, instruments: chartable, build: buildIdentity(repoDir) });
    writeFileAtomic(out, bytes);
    text.push(`wrote ${out} (${chartable.join(", ")})`);
  }
  return text.join("\n") + "\n";
}
