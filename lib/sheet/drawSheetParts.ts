import { continuationCaution } from "../format/index.ts";
import { ghsPictogramText } from "../shared/ghsPictograms.ts";
import type { SheetContent } from "./sheetContent.ts";
import { ink, rule, sheetFonts, softInk } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

/** Header of the first page; returns the y below it. */
export function drawSheetHeader(doc: Doc, content: SheetContent, x: number, y: number, width: number): number {
  doc.font(sheetFonts.regular).fontSize(7.5).fillColor(softInk);
  const tag = `${content.buildText} · predicted bench reference sheet`;
  doc.text(tag, x + width - doc.widthOfString(tag), y, { lineBreak: false });
  y += 11;
  const title = `${content.title} (${content.formula})`;
  doc.font(sheetFonts.bold).fontSize(19).fillColor(ink);
  const titleHeight = doc.heightOfString(title, { width });
  doc.text(title, x, y, { width });
  y += titleHeight + 1;
  const subtitle = `${content.species} · ${content.bandText} · ${content.temperatureText}`;
  doc.font(sheetFonts.bold).fontSize(13);
  const subtitleHeight = doc.heightOfString(subtitle, { width });
  doc.text(subtitle, x, y, { width });
  y += subtitleHeight + 1;
  const detail = `band origin ν₀ = ${content.bandOriginText} · ${content.summaryText}`;
  doc.font(sheetFonts.regular).fontSize(8.5).fillColor(ink);
  const detailHeight = doc.heightOfString(detail, { width });
  doc.text(detail, x, y, { width });
  return y + detailHeight + 6;
}

function pictogramLine(content: SheetContent): string {
  return content.caution.pictograms.length
    ? `GHS pictograms: ${content.caution.pictograms.map(ghsPictogramText).join(" · ")}`
    : "GHS pictograms: none listed in the molecule file";
}

/** The hazard caution box near the top of the first page; returns the y below it. */
export function drawCautionBox(doc: Doc, content: SheetContent, x: number, y: number, width: number): number {
  const pad = 7;
  const inner = width - 2 * pad;
  const heading = "⚠ HAZARD CAUTION";
  const pictograms = pictogramLine(content);
  const sentences = content.caution.sentences.join(" ");
  doc.font(sheetFonts.bold).fontSize(10.5);
  const hHeading = doc.heightOfString(heading, { width: inner });
  doc.font(sheetFonts.bold).fontSize(9);
  const hPictograms = doc.heightOfString(pictograms, { width: inner });
  doc.font(sheetFonts.regular).fontSize(9.5);
  const hSentences = doc.heightOfString(sentences, { width: inner });
  doc.font(sheetFonts.bold).fontSize(8.5);
  const hDeferral = doc.heightOfString(content.caution.deferral, { width: inner });
  const height = pad + hHeading + 2 + hPictograms + 2 + hSentences + 3 + hDeferral + pad - 2;
  doc.save().lineWidth(1.8).strokeColor(ink).rect(x, y, width, height).stroke().restore();
  let cy = y + pad - 1;
  doc
    .font(sheetFonts.bold)
    .fontSize(10.5)
    .fillColor(ink)
    .text(heading, x + pad, cy, { width: inner });
  cy += hHeading + 2;
  doc
    .font(sheetFonts.bold)
    .fontSize(9)
    .text(pictograms, x + pad, cy, { width: inner });
  cy += hPictograms + 2;
  doc
    .font(sheetFonts.regular)
    .fontSize(9.5)
    .text(sentences, x + pad, cy, { width: inner });
  cy += hSentences + 3;
  doc
    .font(sheetFonts.bold)
    .fontSize(8.5)
    .text(content.caution.deferral, x + pad, cy, { width: inner });
  return y + height + 8;
}

/** Top of a continuation page: what the sheet is, and the caution in one framed line. */
export function drawContinuationHeader(doc: Doc, content: SheetContent, x: number, y: number, width: number): number {
  const line = `${content.title} (${content.formula}) · ${content.species} · ${content.bandText} · ${content.temperatureText} — line table, continued`;
  doc.font(sheetFonts.bold).fontSize(11).fillColor(ink);
  const h = doc.heightOfString(line, { width });
  doc.text(line, x, y, { width });
  y += h + 4;
  const caution = continuationCaution(content.caution.pictograms);
  doc.font(sheetFonts.bold).fontSize(8.5);
  const hc = doc.heightOfString(caution, { width: width - 10 });
  doc
    .save()
    .lineWidth(1.4)
    .strokeColor(ink)
    .rect(x, y, width, hc + 8)
    .stroke()
    .restore();
  doc.text(caution, x + 5, y + 4, { width: width - 10 });
  return y + hc + 8 + 8;
}

interface FooterBlock {
  label: string;
  text: string;
  address?: string | null;
  link?: string | null;
}

function footerBlocks(content: SheetContent): FooterBlock[] {
  const capital = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);
  return [
    ...content.sources.map((s) => ({ label: capital(s.roles.join("; ")), text: s.citation, link: s.link, address: s.address })),
    { label: "Model", text: content.modelText },
    { label: "Accuracy", text: content.accuracyText },
  ];
}

const footerSize = 7;
const labelWidth = 70;

// Each block is measured as drawn (label column, text, address on its own line), so the footer's
// height is known before the table is laid out and nothing overlaps.
function blockHeight(doc: Doc, block: FooterBlock, width: number): number {
  doc.font(sheetFonts.bold).fontSize(footerSize);
  const hLabel = doc.heightOfString(block.label, { width: labelWidth - 4 });
  doc.font(sheetFonts.regular);
  let hText = doc.heightOfString(block.text, { width: width - labelWidth });
  if (block.address) hText += doc.heightOfString(block.address, { width: width - labelWidth });
  return Math.max(hLabel, hText) + 2;
}

export function footerHeight(doc: Doc, content: SheetContent, width: number): number {
  return 6 + footerBlocks(content).reduce((h, b) => h + blockHeight(doc, b, width), 0) + 13;
}

/** Footer of every page: sources, model, accuracy, build and "page n of m". */
export function drawSheetFooter(doc: Doc, content: SheetContent, x: number, bottom: number, width: number, page: number, pages: number): void {
  let y = bottom - footerHeight(doc, content, width);
  doc
    .save()
    .lineWidth(0.6)
    .strokeColor(rule)
    .moveTo(x, y)
    .lineTo(x + width, y)
    .stroke()
    .restore();
  y += 5;
  const textX = x + labelWidth;
  const textWidth = width - labelWidth;
  for (const block of footerBlocks(content)) {
    doc
      .font(sheetFonts.bold)
      .fontSize(footerSize)
      .fillColor(ink)
      .text(block.label, x, y, { width: labelWidth - 4 });
    doc.font(sheetFonts.regular);
    const hText = doc.heightOfString(block.text, { width: textWidth });
    doc.text(block.text, textX, y, { width: textWidth });
    if (block.address) doc.fillColor(softInk).text(block.address, textX, y + hText, { width: textWidth, ...(block.link ? { link: block.link } : {}) });
    y += blockHeight(doc, block, width);
  }
  y += 2;
  doc.font(sheetFonts.regular).fontSize(7.5).fillColor(softInk);
  doc.text(`${content.buildText} · predicted, not certified`, x, y, { lineBreak: false });
  const pageText = `page ${page} of ${pages}`;
  doc.font(sheetFonts.bold).fontSize(8.5).fillColor(ink);
  doc.text(pageText, x + width - doc.widthOfString(pageText), y - 0.5, { lineBreak: false });
}
