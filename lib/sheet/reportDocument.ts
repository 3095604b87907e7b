import { createRequire } from "node:module";
import { describeBuild } from "../shared/buildIdentity.ts";
import { CalibrationPageFlow } from "./calibrationPageFlow.ts";
import { drawReportFooter, drawReportReminder, reportFooterHeightPt, reportMonoFont, reportMonoFontFile } from "./calibrationReportParts.ts";
import { paperSizes, type PaperName } from "./paper.ts";
import { newPdfDocument, pdfBytes } from "./pdfDocument.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";
import { marginPt } from "./sheetStyle.ts";

const require = createRequire(import.meta.url);

/** What a report's content is laid out with: the document, the page flow and the text column. */
export interface ReportPages {
  doc: PDFKit.PDFDocument;
  flow: CalibrationPageFlow;
  x: number;
  width: number;
  /** Top of the first page's content. */
  top: number;
  /** "bandatlas 0.1.0 · abc1234 · 2025-03-14". */
  buildText: string;
}

/**
 * A report of the calibration family (a calibration, a refusal, a history): the fonts with the
 * monospace one, the margins, a flow whose later pages open with the caution reminder, and the
 * footer with "page i of n" on every page once the content is laid out. Returns the bytes.
 */
export async function renderReport(
  paper: PaperName,
  build: SheetBuildIdentity,
  info: { title: string; subject: string },
  footer: string,
  lay: (pages: ReportPages) => void,
): Promise<Uint8Array> {
  const doc = newPdfDocument(paper, build, info);
  doc.registerFont(reportMonoFont, require.resolve(reportMonoFontFile));
  const bytes = await pdfBytes(doc, () => {
    const { widthPt, heightPt } = paperSizes[paper];
    const x = marginPt;
    const width = widthPt - 2 * marginPt;
    const top = marginPt * 0.75;
    const pageBottom = heightPt - marginPt * 0.75;
    const buildText = describeBuild(build);
    const flow = new CalibrationPageFlow(doc, x, width, top, pageBottom - reportFooterHeightPt - 4, drawReportReminder);
    doc.addPage();
    flow.y = top;
    lay({ doc, flow, x, width, top, buildText });
    const range = doc.bufferedPageRange();
    for (let i = 0; i < range.count; i++) {
      doc.switchToPage(range.start + i);
      drawReportFooter(doc, `${buildText} · ${footer}`, x, pageBottom, width, i + 1, range.count);
    }
  });
  return new Uint8Array(bytes);
}
