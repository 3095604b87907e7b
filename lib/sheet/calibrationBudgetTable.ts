import { budgetTable, type CalibrationRun } from "../format/index.ts";
import type { CalibrationPageFlow } from "./calibrationPageFlow.ts";
import { ink, sheetFonts } from "./sheetStyle.ts";

const size = 8;
const rowPt = 11;
const pad = 3;

/**
 * The correction's uncertainty budget under its box on page 1: one row per part, σ of k (ppm) and
 * of c (cm⁻¹) and the number of sources, the total last and bold; the same rows as the CLI and page.
 */
export function drawCalibrationBudget(flow: CalibrationPageFlow, run: CalibrationRun): void {
  const { doc, x, width } = flow;
  const table = budgetTable(run.calibration.result);
  const height = rowPt * (table.rows.length + 1) + 6;
  flow.ensure(height + 6);
  const numberWidth = 70;
  const lefts = [x, x + width - 3 * numberWidth, x + width - 2 * numberWidth, x + width - numberWidth];
  const widths = [width - 3 * numberWidth, numberWidth, numberWidth, numberWidth];
  const drawRow = (cells: string[], y: number, bold: boolean) => {
    doc
      .font(bold ? sheetFonts.bold : sheetFonts.regular)
      .fontSize(size)
      .fillColor(ink);
    cells.forEach((cell, c) => {
      const w = doc.widthOfString(cell);
      const left = table.rightAligned[c] ? lefts[c] + widths[c] - pad - w : lefts[c] + pad;
      doc.text(cell, left, y, { lineBreak: false });
    });
  };
  let y = flow.y;
  drawRow(table.headings, y, true);
  y += rowPt;
  // A rule under the headings and one above the total.
  const rule = (at: number) =>
    doc
      .save()
      .lineWidth(0.6)
      .strokeColor(ink)
      .moveTo(x, at - 1.5)
      .lineTo(x + width, at - 1.5)
      .stroke()
      .restore();
  rule(y);
  table.rows.forEach((row, i) => {
    const last = i === table.rows.length - 1;
    if (last) rule(y);
    drawRow(row, y, last);
    y += rowPt;
  });
  flow.y = y + 6;
}
