import { continuationCaution, type CalibrationFact } from "../format/index.ts";
import { displayText } from "./displayText.ts";
import type { CalibrationPageFlow } from "./calibrationPageFlow.ts";
import { ink, rule, sheetFonts, softInk } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

/** The SHA-256 is read digit by digit against another copy: monospace, so no digit hides. */
export const reportMonoFont = "report-mono";
export const reportMonoFontFile = "dejavu-fonts-ttf/ttf/DejaVuSansMono.ttf";

/** The first page's heading; returns the y below it. */
export function drawReportHeader(doc: Doc, buildText: string, subtitle: string, x: number, y: number, width: number): number {
  doc.font(sheetFonts.regular).fontSize(7.5).fillColor(softInk);
  const tag = `${buildText} · wavenumber calibration report`;
  doc.text(tag, x + width - doc.widthOfString(tag), y, { lineBreak: false });
  y += 11;
  doc.font(sheetFonts.bold).fontSize(19).fillColor(ink).text("Wavenumber calibration report", x, y, { width, lineBreak: false });
  y += 25;
  doc.font(sheetFonts.bold).fontSize(11.5);
  const h = doc.heightOfString(subtitle, { width });
  doc.text(subtitle, x, y, { width });
  return y + h + 7;
}

/** A framed box of paragraphs (heading bold); returns the y below it. */
function framedBox(doc: Doc, heading: string, body: string, x: number, y: number, width: number, lineWidth: number, draw: boolean): number {
  const pad = 7;
  const inner = width - 2 * pad;
  doc.font(sheetFonts.bold).fontSize(10.5);
  const hHeading = heading ? doc.heightOfString(heading, { width: inner }) + 2 : 0;
  doc.font(sheetFonts.regular).fontSize(9);
  const hBody = doc.heightOfString(body, { width: inner });
  const height = pad - 1 + hHeading + hBody + pad - 2;
  if (!draw) return y + height;
  doc.save().lineWidth(lineWidth).strokeColor(ink).rect(x, y, width, height).stroke().restore();
  let cy = y + pad - 1;
  if (heading) {
    doc
      .font(sheetFonts.bold)
      .fontSize(10.5)
      .fillColor(ink)
      .text(heading, x + pad, cy, { width: inner });
    cy += hHeading;
  }
  doc
    .font(sheetFonts.regular)
    .fontSize(9)
    .fillColor(ink)
    .text(body, x + pad, cy, { width: inner });
  return y + height;
}

/** The molecule's caution, whole, in a heavy frame on page 1; returns the y below it. */
export function drawReportCaution(doc: Doc, caution: string, x: number, y: number, width: number): number {
  return framedBox(doc, "⚠ HAZARD CAUTION", displayText(caution), x, y, width, 1.8, true) + 9;
}

/** Top of every later page: the caution reminder in a light frame; returns the y below it. */
export function drawReportReminder(doc: Doc, x: number, y: number, width: number): number {
  return framedBox(doc, "", continuationCaution([]), x, y, width, 1.1, true) + 9;
}

/** A section heading with a rule under it, kept on the page with `keep` points of what follows. */
export function drawSectionHeading(flow: CalibrationPageFlow, text: string, keep: number): void {
  const { doc, x, width } = flow;
  flow.ensure(17 + keep);
  doc.font(sheetFonts.bold).fontSize(10.5).fillColor(ink).text(text, x, flow.y, { width, lineBreak: false });
  doc
    .save()
    .lineWidth(0.5)
    .strokeColor(rule)
    .moveTo(x, flow.y + 14)
    .lineTo(x + width, flow.y + 14)
    .stroke()
    .restore();
  flow.y += 18;
}

const factLabelWidth = 78;

/** Labelled facts, one a row, the label in a narrow bold column; values from files shown as text only. */
export function drawFacts(flow: CalibrationPageFlow, facts: readonly CalibrationFact[]): void {
  const { doc, x, width } = flow;
  const valueWidth = width - factLabelWidth;
  for (const fact of facts) {
    const value = displayText(fact.value);
    doc.font(fact.mono ? reportMonoFont : sheetFonts.regular).fontSize(fact.mono ? 8.5 : 9);
    const h = doc.heightOfString(value, { width: valueWidth }) + 2;
    flow.ensure(h);
    doc.fillColor(ink).text(value, x + factLabelWidth, flow.y, { width: valueWidth });
    doc
      .font(sheetFonts.bold)
      .fontSize(9)
      .text(fact.label, x, flow.y, { width: factLabelWidth - 6, lineBreak: false });
    flow.y += h;
  }
  flow.y += 5;
}

/** The correction, the report's answer, in a heavy frame: one term a line, then what the model means. */
export function drawCorrectionBox(flow: CalibrationPageFlow, lines: readonly string[], meaning: string, heading = "Correction found"): void {
  const { doc, x, width } = flow;
  const pad = 9;
  const inner = width - 2 * pad;
  doc.font(sheetFonts.bold).fontSize(12);
  const hLines = lines.map((l) => doc.heightOfString(l, { width: inner }) + 2);
  const meaningText = meaning;
  doc.font(sheetFonts.regular).fontSize(9);
  const hMeaning = doc.heightOfString(meaningText, { width: inner });
  const height = pad + 14 + hLines.reduce((a, b) => a + b, 0) + 3 + hMeaning + pad - 2;
  flow.ensure(height + 8);
  const top = flow.y;
  doc.save().rect(x, top, width, height).fillColor("#f2f2f2").fill().restore();
  doc.save().lineWidth(2.2).strokeColor(ink).rect(x, top, width, height).stroke().restore();
  let cy = top + pad - 1;
  doc
    .font(sheetFonts.bold)
    .fontSize(10)
    .fillColor(ink)
    .text(heading, x + pad, cy, { width: inner, lineBreak: false });
  cy += 15;
  doc.font(sheetFonts.bold).fontSize(12);
  lines.forEach((line, i) => {
    doc.text(line, x + pad, cy, { width: inner });
    cy += hLines[i];
  });
  cy += 3;
  doc
    .font(sheetFonts.regular)
    .fontSize(9)
    .fillColor(softInk)
    .text(meaningText, x + pad, cy, { width: inner });
  flow.y = top + height + 10;
}

/** A paragraph kept whole on one page (each note is a few lines): measured, then moved on if it does not fit. */
export function drawParagraph(flow: CalibrationPageFlow, text: string, size = 8.5, gap = 3): void {
  const { doc, x, width } = flow;
  const words = displayText(text);
  doc.font(sheetFonts.regular).fontSize(size).fillColor(ink);
  const h = doc.heightOfString(words, { width });
  flow.ensure(h);
  doc.text(words, x, flow.y, { width });
  flow.y += h + gap;
}

/** Footer of every page: the build and the file left, "page i of n" right. */
export function drawReportFooter(doc: Doc, left: string, x: number, bottom: number, width: number, page: number, pages: number): void {
  const y = bottom - 10;
  doc
    .save()
    .lineWidth(0.6)
    .strokeColor(rule)
    .moveTo(x, y - 4)
    .lineTo(x + width, y - 4)
    .stroke()
    .restore();
  const pageText = `page ${page} of ${pages}`;
  doc.font(sheetFonts.bold).fontSize(8.5).fillColor(ink);
  const pageWidth = doc.widthOfString(pageText);
  doc.text(pageText, x + width - pageWidth, y - 0.5, { lineBreak: false });
  doc.font(sheetFonts.regular).fontSize(7.5).fillColor(softInk);
  doc.text(displayText(left), x, y, { width: width - pageWidth - 12, lineBreak: false, ellipsis: true, height: 10 });
}

/** Height the footer takes above the page's bottom. */
export const reportFooterHeightPt = 18;

/** The verdict in a frame as heavy as the correction's: the verdict bold, each check and the rule below. */
export function drawVerdictBox(flow: CalibrationPageFlow, verdict: string, checks: readonly string[], rule: string): void {
  const { doc, x, width } = flow;
  const pad = 8;
  const inner = width - 2 * pad;
  doc.font(sheetFonts.bold).fontSize(11);
  const hVerdict = doc.heightOfString(verdict, { width: inner }) + 3;
  doc.font(sheetFonts.regular).fontSize(8.5);
  const body = [...checks, rule].join("\n");
  const hBody = doc.heightOfString(body, { width: inner });
  const height = pad + hVerdict + hBody + pad - 2;
  flow.ensure(height + 8);
  const top = flow.y;
  doc.save().lineWidth(2.2).strokeColor(ink).rect(x, top, width, height).stroke().restore();
  doc
    .font(sheetFonts.bold)
    .fontSize(11)
    .fillColor(ink)
    .text(verdict, x + pad, top + pad - 1, { width: inner });
  doc
    .font(sheetFonts.regular)
    .fontSize(8.5)
    .fillColor(ink)
    .text(body, x + pad, top + pad - 1 + hVerdict, { width: inner });
  flow.y = top + height + 10;
}

/** Blank lines to fill in by hand: reviewed by, approved by, each with a date and a signature. */
export function drawReviewLines(flow: CalibrationPageFlow): void {
  const { doc, x, width } = flow;
  const rowPt = 26;
  flow.ensure(2 * rowPt + 8);
  const columns = [
    { label: "name", share: 0.42 },
    { label: "date", share: 0.2 },
    { label: "signature", share: 0.38 },
  ];
  const labelWidth = 70;
  for (const role of ["Reviewed by", "Approved by"]) {
    const base = flow.y + rowPt - 8;
    doc
      .font(sheetFonts.bold)
      .fontSize(9)
      .fillColor(ink)
      .text(role, x, base - 10, { lineBreak: false });
    let left = x + labelWidth;
    for (const column of columns) {
      const w = (width - labelWidth) * column.share - 10;
      doc
        .save()
        .lineWidth(0.6)
        .strokeColor(ink)
        .moveTo(left, base)
        .lineTo(left + w, base)
        .stroke()
        .restore();
      doc
        .font(sheetFonts.regular)
        .fontSize(7)
        .fillColor(softInk)
        .text(column.label, left, base + 2, { lineBreak: false });
      left += w + 10;
    }
    flow.y += rowPt;
  }
  flow.y += 8;
}
