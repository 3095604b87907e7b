import { lineColumn } from "../format/index.ts";
import type { Branch } from "../core/index.ts";
import { drawMarker } from "./drawMarker.ts";
import type { SheetLineCell, SheetTableRow } from "./sheetContent.ts";
import { branchStyle, ink, rule, sheetFonts, zebra } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

export const tableRowHeightPt = 13.5;
export const tableHeadHeightPt = 31;
export const strongMark = "★";
/** Room right of the decimal point for the longest relative intensity, "5.863e-4" at 9 pt. */
const intensityPointInset = 36;
/** Cells at 9 pt: a position rounded to a ± of 10⁻⁶ cm⁻¹ has twelve digits, and its ± nine. */
const cellFontPt = 9;

interface Columns {
  j: [number, number];
  branch: Record<
    Branch,
    { start: number; mark: number; wavenumber: number; uncertainty: number; status: number; wavelength: number; intensity: number; end: number }
  >;
}

// Column right edges as fractions of the table width: J″ | mark ν̃ ± status λ rel.int. | the same for R.
function columns(x: number, width: number): Columns {
  const at = (f: number) => x + f * width;
  const branch = (start: number) => ({
    start: at(start),
    mark: at(start + 0.02),
    wavenumber: at(start + 0.151),
    uncertainty: at(start + 0.237),
    status: at(start + 0.256),
    wavelength: at(start + 0.35),
    intensity: at(start + 0.443),
    end: at(start + 0.475),
  });
  return { j: [x, at(0.05)], branch: { P: branch(0.05), R: branch(0.525) } };
}

function rightText(doc: Doc, text: string, rightX: number, y: number): void {
  doc.text(text, rightX - doc.widthOfString(text), y, { lineBreak: false });
}

/** Numbers of varying length (0.392, 1, 5.863e-4) aligned on their decimal point at pointX. */
function decimalText(doc: Doc, text: string, pointX: number, y: number): void {
  const dot = text.indexOf(".");
  const whole = dot < 0 ? text : text.slice(0, dot);
  doc.text(text, pointX - doc.widthOfString(whole), y, { lineBreak: false });
}

/** The two heading rows (branch names, then columns with units), repeated on every page. */
export function drawTableHead(doc: Doc, x: number, y: number, width: number): void {
  const c = columns(x, width);
  doc.save().rect(x, y, width, tableHeadHeightPt).fillColor("#d8d8d8").fill().restore();
  for (const branch of ["P", "R"] as Branch[]) {
    const b = c.branch[branch];
    const style = branchStyle[branch];
    drawMarker(doc, branch, b.start + 9, y + 8, 2.6);
    doc
      .font(sheetFonts.bold)
      .fontSize(9.5)
      .fillColor(ink)
      .text(`${branch}(J″)  ${style.name}, ${style.rule}`, b.start + 17, y + 3, { lineBreak: false });
    doc.font(sheetFonts.regular).fontSize(8.5);
    rightText(doc, lineColumn("wavenumber").table!, b.wavenumber, y + 18);
    rightText(doc, "±", b.uncertainty - 4, y + 18);
    rightText(doc, "st.", b.status, y + 18);
    rightText(doc, lineColumn("wavelengthVacuumUm").table!, b.wavelength, y + 18);
    doc.text(lineColumn("relativeIntensity").table!, b.intensity - intensityPointInset - 7, y + 18, { lineBreak: false });
  }
  doc.font(sheetFonts.bold).fontSize(9.5);
  rightText(doc, "J″", c.j[1] - 6, y + 18);
  doc
    .save()
    .lineWidth(0.8)
    .strokeColor(ink)
    .moveTo(x, y + tableHeadHeightPt)
    .lineTo(x + width, y + tableHeadHeightPt)
    .stroke()
    .restore();
}

function drawCell(doc: Doc, cell: SheetLineCell | null, b: Columns["branch"]["P"], y: number): void {
  if (!cell) {
    doc.font(sheetFonts.regular).fontSize(9.5).fillColor(rule);
    rightText(doc, "—", b.wavenumber, y);
    return;
  }
  doc
    .font(cell.strong ? sheetFonts.bold : sheetFonts.regular)
    .fontSize(cellFontPt)
    .fillColor(ink);
  if (cell.strong)
    doc
      .fontSize(7)
      .text(strongMark, b.start + 1.5, y + 0.5, { lineBreak: false })
      .fontSize(cellFontPt);
  rightText(doc, cell.wavenumber, b.wavenumber, y);
  doc.font(sheetFonts.regular).fontSize(7.5);
  rightText(doc, cell.uncertainty, b.uncertainty, y + 1);
  rightText(doc, cell.status, b.status - 2, y + 1);
  doc.font(cell.strong ? sheetFonts.bold : sheetFonts.regular).fontSize(cellFontPt);
  rightText(doc, cell.wavelengthVacuumUm, b.wavelength, y);
  decimalText(doc, cell.relativeIntensity, b.intensity - intensityPointInset, y);
}

/** Table rows from y down; shaded in pairs' alternation so a row can be followed across at arm's length. */
export function drawTableRows(doc: Doc, rows: SheetTableRow[], x: number, y: number, width: number, firstIndex: number): void {
  const c = columns(x, width);
  rows.forEach((row, i) => {
    const top = y + i * tableRowHeightPt;
    if ((firstIndex + i) % 2 === 1) doc.save().rect(x, top, width, tableRowHeightPt).fillColor(zebra).fill().restore();
    const textY = top + 2;
    doc.font(sheetFonts.bold).fontSize(10).fillColor(ink);
    rightText(doc, String(row.jLower), c.j[1] - 6, textY);
    drawCell(doc, row.p, c.branch.P, textY);
    drawCell(doc, row.r, c.branch.R, textY);
  });
  const bottom = y + rows.length * tableRowHeightPt;
  doc.save().lineWidth(0.8).strokeColor(ink);
  for (const sx of [c.j[1], c.branch.R.start])
    doc
      .moveTo(sx, y - tableHeadHeightPt)
      .lineTo(sx, bottom)
      .stroke();
  doc
    .moveTo(x, bottom)
    .lineTo(x + width, bottom)
    .stroke();
  doc.restore();
}
