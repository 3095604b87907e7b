import type { AtlasEntry, CalibrationMarks } from "../atlas/index.ts";
import type { Molecule } from "../molecules/index.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";
import { newPdfDocument, pdfBytes } from "./pdfDocument.ts";
import { drawLegendLine } from "./drawLegend.ts";
import { drawTableHead, drawTableRows, tableHeadHeightPt, tableRowHeightPt } from "./drawLineTable.ts";
import { drawCautionBox, drawContinuationHeader, drawSheetFooter, drawSheetHeader, footerHeight } from "./drawSheetParts.ts";
import { drawStickPlot } from "./drawStickPlot.ts";
import { paperSizes, type PaperName } from "./paper.ts";
import { sheetContent, type SheetContent } from "./sheetContent.ts";
import { ink, marginPt, sheetFonts } from "./sheetStyle.ts";

export interface BenchSheetRequest {
  molecule: Molecule;
  /** The atlas entry of one species at one temperature, as the build computed it. */
  entry: AtlasEntry;
  paper: PaperName;
  build: SheetBuildIdentity;
  /** Calibration-grade line labels of the fundamental, once the molecule files flag them; omit until then. */
  calibrationLineLabels?: readonly string[];
  /** Calibration-grade lines of the molecule at the default resolutions (lib/atlas calibrationMarks). */
  calibration?: CalibrationMarks;
}

const plotHeightPt = 178;

function lay(doc: PDFKit.PDFDocument, content: SheetContent, paper: PaperName): void {
  const { widthPt, heightPt } = paperSizes[paper];
  const x = marginPt;
  const width = widthPt - 2 * marginPt;
  const bottom = heightPt - marginPt * 0.75;
  doc.addPage();
  const footerTop = bottom - footerHeight(doc, content, width) - 6;

  let y = drawSheetHeader(doc, content, x, marginPt * 0.75, width);
  y = drawCautionBox(doc, content, x, y, width);
  drawStickPlot(doc, { x, y, width, height: plotHeightPt }, content);
  y += plotHeightPt + 4;
  for (const note of [content.limitationsNote, content.otherBandsNote, content.calibrationNote]) {
    if (!note) continue;
    doc.font(sheetFonts.regular).fontSize(8).fillColor(ink);
    const h = doc.heightOfString(note, { width });
    doc.text(note, x, y, { width });
    y += h + 2;
  }
  y = drawLegendLine(doc, x, y + 2, width);

  let index = 0;
  while (index < content.rows.length) {
    const fit = Math.max(1, Math.floor((footerTop - y - tableHeadHeightPt) / tableRowHeightPt));
    const rows = content.rows.slice(index, index + fit);
    drawTableHead(doc, x, y, width);
    drawTableRows(doc, rows, x, y + tableHeadHeightPt, width, index);
    index += rows.length;
    if (index < content.rows.length) {
      doc.addPage();
      y = drawContinuationHeader(doc, content, x, marginPt * 0.75, width);
    }
  }

  const range = doc.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    doc.switchToPage(range.start + i);
    drawSheetFooter(doc, content, x, bottom, width, i + 1, range.count);
  }
}

/** The PDF bench sheet of one molecule, species, temperature and paper size, as bytes. */
export function renderBenchSheet(request: BenchSheetRequest): Promise<Buffer> {
  const content = sheetContent(request);
  const doc = newPdfDocument(request.paper, request.build, { title: content.documentTitle, subject: "Predicted vibration–rotation lines; not a certificate" });
  return pdfBytes(doc, () => lay(doc, content, request.paper));
}
