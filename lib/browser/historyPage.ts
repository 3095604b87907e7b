// The history page's script: a calibration log the visitor chooses or drops is read here in the
// browser (nothing is uploaded) by the same functions as `bandatlas history` (parseCalibrationLog,
// historySeries, historyTable) and each instrument's chart is the same SVG (historyChartScene,
// sceneSvg). Every line that is not a record is listed with its number.
import { historySeries, historyTable, logInstruments, trendRule } from "../format/calibrationHistory.ts";
import { parseCalibrationLog } from "../format/calibrationLog.ts";
import { sceneSvg } from "../format/chartScene.ts";
import { historyChartScene } from "../format/historyChart.ts";
import { el } from "./dom.ts";

/** Largest log read: a year of daily runs is about 2 MB. */
const maxLogBytes = 50 * 1024 * 1024;

/** The SVG string as nodes: parsed as XML (never as HTML), its text escaped where it was made. */
function svgNode(svg: string): Node {
  const parsed = new DOMParser().parseFromString(svg, "image/svg+xml");
  return document.importNode(parsed.documentElement, true);
}

function show(text: string, fileName: string) {
  const status = document.getElementById("history-status")!;
  const problems = document.getElementById("history-problems")!;
  const result = document.getElementById("history-result")!;
  const charts = document.getElementById("history-charts")!;
  const tableBox = document.getElementById("history-table")!;
  const log = parseCalibrationLog(text);
  problems.replaceChildren(...log.problems.map((p) => el("p", `${fileName} line ${p.line} not read: ${p.message}`)));
  if (log.entries.length === 0) {
    status.textContent = `${fileName} holds no calibration record.`;
    result.hidden = true;
    return;
  }
  const instruments = logInstruments(log);
  status.textContent = `${fileName}: ${log.entries.length} runs of ${instruments.length} instrument${instruments.length === 1 ? "" : "s"}${log.problems.length ? `, ${log.problems.length} lines not read (listed)` : ""}.`;
  charts.replaceChildren(
    ...instruments
      .map((name) => historySeries(log, name))
      .filter((series) => series.points.length > 0)
      .map((series) => {
        const figure = el("figure", undefined, { class: "bench-plot history-chart" });
        figure.append(svgNode(sceneSvg(historyChartScene(series))));
        return figure;
      }),
  );
  document.getElementById("history-rule")!.textContent = `${trendRule} Bars: ± U, the expanded uncertainty (k = 2).`;
  const table = historyTable(log);
  const t = el("table", undefined, { class: "lines" });
  const head = el("tr");
  head.append(...table.headings.map((h) => el("th", h, { scope: "col" })));
  t.append(el("thead"), el("tbody"));
  t.tHead!.append(head);
  for (const row of table.rows) {
    const tr = el("tr");
    tr.append(...row.map((cell, i) => el("td", cell, table.rightAligned[i] ? { class: "num" } : {})));
    t.tBodies[0].append(tr);
  }
  tableBox.replaceChildren(t);
  result.hidden = false;
  document.getElementById("history")!.dataset.state = "shown";
}

async function read(file: File) {
  const status = document.getElementById("history-status")!;
  if (file.size > maxLogBytes) {
    status.textContent = `${file.name} is ${(file.size / 1048576).toFixed(0)} MB, more than a calibration log should be.`;
    return;
  }
  show(await file.text(), file.name);
}

function setup() {
  const input = document.getElementById("history-file") as HTMLInputElement | null;
  const drop = document.getElementById("history-drop");
  if (!input || !drop) return;
  input.addEventListener("change", () => {
    if (input.files?.[0]) void read(input.files[0]);
  });
  drop.addEventListener("dragover", (event) => event.preventDefault());
  drop.addEventListener("drop", (event) => {
    event.preventDefault();
    const file = event.dataTransfer?.files[0];
    if (file) void read(file);
  });
}

setup();
