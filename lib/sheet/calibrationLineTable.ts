import { calibrationLineRows, type CalibrationRun } from "../format/index.ts";
import { drawCalibrationMark, type CalibrationMark } from "./calibrationMarkers.ts";
import type { CalibrationPageFlow } from "./calibrationPageFlow.ts";
import { displayText } from "./displayText.ts";
import { ink, sheetFonts, zebra } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

const size = 7.5;
const pad = 3.5;
const headHeightPt = 22;
const rowMinPt = 10.5;
/** The used column carries the plot's marker before yes/no, so a row and its point are found together. */
const markRoomPt = 9;

interface Layout {
  headings: string[][];
  rows: string[][];
  marks: CalibrationMark[];
  rightAligned: boolean[];
  lefts: number[];
  widths: number[];
  usedColumn: number;
}

// Headings with a unit ("reference/cm⁻¹") go on two lines, name over unit, so the number columns
// stay as narrow as their numbers.
const headingLines = (heading: string) => {
  const slash = heading.indexOf("/");
  return slash < 0 ? [heading] : [heading.slice(0, slash), heading.slice(slash + 1)];
};

function layout(doc: Doc, run: CalibrationRun, x: number, width: number): Layout {
  const table = calibrationLineRows(run);
  const marks = run.calibration.result.lines.map((l): CalibrationMark => (l.used ? "used" : (l.reason ?? "residual")));
  const headings = table.headings.map(headingLines);
  const rows = table.rows.map((r) => r.map(displayText));
  const usedColumn = table.headings.indexOf("used");
  const last = headings.length - 1;
  const widths = headings.map((lines, c) => {
    if (c === last) return 0;
    doc.font(sheetFonts.bold).fontSize(size);
    const head = Math.max(...lines.map((l) => doc.widthOfString(l)));
    // Used rows are bold: measure every cell in bold so no bold number runs into its neighbour.
    const body = Math.max(0, ...rows.map((r) => doc.widthOfString(r[c])));
    return Math.max(head, body + (c === usedColumn ? markRoomPt : 0)) + 2 * pad;
  });
  // The last column (why a line was not used) takes what is left and wraps.
  widths[last] = width - widths.reduce((a, b) => a + b, 0);
  const lefts = widths.map((_, c) => x + widths.slice(0, c).reduce((a, b) => a + b, 0));
  return { headings, rows, marks, rightAligned: table.rightAligned, lefts, widths, usedColumn };
}

function drawHead(doc: Doc, t: Layout, x: number, y: number, width: number): void {
  doc.save().rect(x, y, width, headHeightPt).fillColor("#d8d8d8").fill().restore();
  doc.font(sheetFonts.bold).fontSize(size).fillColor(ink);
  t.headings.forEach((lines, c) => {
    lines.forEach((line, i) => {
      const w = doc.widthOfString(line);
      const lx = t.rightAligned[c] ? t.lefts[c] + t.widths[c] - pad - w : t.lefts[c] + pad;
      doc.text(line, lx, y + 2 + i * 9.5, { lineBreak: false });
    });
  });
  doc
    .save()
    .lineWidth(0.8)
    .strokeColor(ink)
    .moveTo(x, y + headHeightPt)
    .lineTo(x + width, y + headHeightPt)
    .stroke()
    .restore();
}

function rowHeight(doc: Doc, t: Layout, row: string[]): number {
  const last = row.length - 1;
  doc.font(sheetFonts.regular).fontSize(size);
  return Math.max(rowMinPt, doc.heightOfString(row[last] || " ", { width: t.widths[last] - 2 * pad }) + 3);
}

/** The line table, continued on further pages with its head repeated; one row is never split. */
export function drawCalibrationLineTable(flow: CalibrationPageFlow, run: CalibrationRun): void {
  const { doc, x, width } = flow;
  const t = layout(doc, run, x, width);
  const heights = t.rows.map((r) => rowHeight(doc, t, r));
  flow.ensure(headHeightPt + heights.slice(0, 3).reduce((a, b) => a + b, 0));
  drawHead(doc, t, x, flow.y, width);
  flow.y += headHeightPt;
  t.rows.forEach((row, r) => {
    if (flow.ensure(heights[r])) {
      drawHead(doc, t, x, flow.y, width);
      flow.y += headHeightPt;
    }
    const top = flow.y;
    if (r % 2 === 1) doc.save().rect(x, top, width, heights[r]).fillColor(zebra).fill().restore();
    doc
      .font(t.marks[r] === "used" ? sheetFonts.bold : sheetFonts.regular)
      .fontSize(size)
      .fillColor(ink);
    row.forEach((cell, c) => {
      const left = t.lefts[c] + pad + (c === t.usedColumn ? markRoomPt : 0);
      const inner = t.widths[c] - 2 * pad - (c === t.usedColumn ? markRoomPt : 0);
      if (c === row.length - 1) doc.text(cell, left, top + 1.5, { width: inner });
      else if (t.rightAligned[c]) doc.text(cell, t.lefts[c] + t.widths[c] - pad - doc.widthOfString(cell), top + 1.5, { lineBreak: false });
      else doc.text(cell, left, top + 1.5, { lineBreak: false });
    });
    drawCalibrationMark(doc, t.marks[r], t.lefts[t.usedColumn] + pad + 3, top + 5.2, 2.4);
    flow.y += heights[r];
  });
  doc
    .save()
    .lineWidth(0.8)
    .strokeColor(ink)
    .moveTo(x, flow.y)
    .lineTo(x + width, flow.y)
    .stroke()
    .restore();
  flow.y += 8;
}
