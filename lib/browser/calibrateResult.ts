// The words of one calibration run on the page, all from lib/format as the CLI prints them: the
// report's header lines, the correction box, the line table, notes, rules, and the two downloads
// (the JSON the same bytes as `--format json`, the text the same as the table output).
import { calibrationDocument } from "../format/calibrationDocument.ts";
import {
  calibrationLineRows,
  calibrationNotes,
  calibrationRulesText,
  calibrationText,
  correctionLines,
  type CalibrationRun,
} from "../format/spectrumCalibrationText.ts";
import { budgetTable, referenceStandingLine } from "../format/correctionBudgetText.ts";
import { el } from "./dom.ts";

/** The text report's lines above its box: file, hash, spectrum, cell, model. */
function headerLines(text: string): string[] {
  const lines = text.split("\n");
  return lines.slice(0, lines.indexOf(""));
}

/**
 * A result table from lib/format's headings and rows: one cell per row is its row header, and
 * each row may carry a class (used/rejected lines, the budget's total).
 */
function resultTable(
  id: string,
  caption: string,
  { headings, rows, rightAligned }: { headings: string[]; rows: string[][]; rightAligned: boolean[] },
  rowHeaderColumn: number,
  rowClass: (r: number) => string | null,
): HTMLTableElement {
  const table = el("table", undefined, { class: "calibration-result", id });
  table.append(el("caption", caption));
  const head = el("tr");
  headings.forEach((h, i) => head.append(el("th", h, { scope: "col", ...(rightAligned[i] ? { class: "num" } : {}) })));
  table.append(el("thead"));
  table.tHead!.append(head);
  const body = el("tbody");
  rows.forEach((cells, r) => {
    const cls = rowClass(r);
    const tr = el("tr", undefined, cls ? { class: cls } : {});
    cells.forEach((c, i) => {
      const header = i === rowHeaderColumn;
      tr.append(el(header ? "th" : "td", c, { ...(header ? { scope: "row" } : {}), ...(rightAligned[i] ? { class: "num" } : {}) }));
    });
    body.append(tr);
  });
  table.append(body);
  return table;
}

function lineTable(run: CalibrationRun): HTMLTableElement {
  const lines = run.calibration.result.lines;
  return resultTable(
    "calibrate-line-table",
    `${lines.length} lines of ${run.gasName} in the range, ${run.calibration.result.usedCount} used in the fit; residual = reference − corrected measured position`,
    calibrationLineRows(run),
    2,
    (r) => (lines[r].used ? "used" : "rejected"),
  );
}

/** The uncertainty budget of k and c, part by part, the total last. */
function budgetElement(run: CalibrationRun): HTMLTableElement {
  const budget = budgetTable(run.calibration.result);
  return resultTable(
    "calibrate-budget-table",
    "Uncertainty budget: each part's standard uncertainty of k and c; sources shared by many lines are propagated as shared",
    budget,
    0,
    (r) => (r === budget.rows.length - 1 ? "total" : null),
  );
}

/** Blob URLs of the last run, released when the next one replaces them. */
let downloadUrls: string[] = [];

function setDownload(anchor: HTMLAnchorElement, text: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  downloadUrls.push(url);
  anchor.href = url;
}

export function showCalibrationRun(run: CalibrationRun): void {
  const text = calibrationText(run);
  document.getElementById("calibrate-summary")!.replaceChildren(...headerLines(text).map((l) => el("li", l)));
  const standing = referenceStandingLine(run.calibration.result);
  document
    .getElementById("calibrate-correction")!
    .replaceChildren(...correctionLines(run).map((l) => el("p", l, l === standing ? { class: "not-traceable" } : {})));
  document.getElementById("calibrate-budget")!.replaceChildren(budgetElement(run));
  document.getElementById("calibrate-lines")!.replaceChildren(lineTable(run));
  document.getElementById("calibrate-notes")!.replaceChildren(...calibrationNotes(run).map((n) => el("li", n)));
  document.getElementById("calibrate-rules")!.textContent = calibrationRulesText(run);
  document.getElementById("calibrate-sources")!.replaceChildren(...run.sources.map((s) => el("li", s)));
  for (const url of downloadUrls) URL.revokeObjectURL(url);
  downloadUrls = [];
  setDownload(document.getElementById("calibrate-json") as HTMLAnchorElement, JSON.stringify(calibrationDocument(run), null, 2) + "\n", "application/json");
  setDownload(document.getElementById("calibrate-txt") as HTMLAnchorElement, text, "text/plain;charset=utf-8");
}
