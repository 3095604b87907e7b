import { createRequire } from "node:module";
import { recordFacts, type RefusedRun } from "../format/index.ts";
import { describeBuild } from "../shared/buildIdentity.ts";
import { CalibrationPageFlow } from "./calibrationPageFlow.ts";
import {
  drawCorrectionBox,
  drawFacts,
  drawReportCaution,
  drawReportFooter,
  drawReportHeader,
  drawReportReminder,
  drawReviewLines,
  drawSectionHeading,
  reportFooterHeightPt,
  reportMonoFont,
  reportMonoFontFile,
} from "./calibrationReportParts.ts";
import { displayText } from "./displayText.ts";
import { paperSizes, type PaperName } from "./paper.ts";
import { newPdfDocument, pdfBytes } from "./pdfDocument.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";
import { marginPt } from "./sheetStyle.ts";
import { conditionsText } from "../format/index.ts";

const require = createRequire(import.meta.url);

export interface RefusalReportRequest {
  refused: RefusedRun;
  build: SheetBuildIdentity;
  paper?: PaperName;
}

/**
 * The short report of a run that was refused: the record, the file, and why no correction was
 * given, with the review lines, so a refused check is filed like a passed one.
 */
export async function renderRefusalReport(request: RefusalReportRequest): Promise<Uint8Array> {
  const { refused, build } = request;
  const paper = request.paper ?? "a4";
  const doc = newPdfDocument(paper, build, {
    title: `Wavenumber calibration refused: ${displayText(refused.fileName)}`,
    subject: `Why a spectrum could not be checked against predicted lines of ${refused.gasName}; not a certificate`,
  });
  doc.registerFont(reportMonoFont, require.resolve(reportMonoFontFile));
  return new Uint8Array(
    await pdfBytes(doc, () => {
      const { widthPt, heightPt } = paperSizes[paper];
      const x = marginPt;
      const width = widthPt - 2 * marginPt;
      const top = marginPt * 0.75;
      const pageBottom = heightPt - marginPt * 0.75;
      const buildText = describeBuild(build);
      const flow = new CalibrationPageFlow(doc, x, width, top, pageBottom - reportFooterHeightPt - 4, drawReportReminder);
      doc.addPage();
      flow.y = drawReportHeader(doc, buildText, `${displayText(refused.fileName)} against ${refused.gasName}: refused`, x, top, width);
      flow.y = drawReportCaution(doc, refused.caution, x, flow.y, width);
      drawSectionHeading(flow, "Record", 40);
      drawFacts(flow, recordFacts(refused.record));
      drawSectionHeading(flow, "Spectrum file and cell", 40);
      drawFacts(flow, [
        { label: "file", value: refused.fileName },
        { label: "SHA-256", value: refused.sha256, mono: true },
        { label: "gas", value: `${refused.gasName} (${refused.gas})` },
        { label: "cell", value: conditionsText(refused.conditions, refused.record.assumedConditions) },
      ]);
      drawCorrectionBox(
        flow,
        [displayText(refused.reason)],
        "No correction and no verdict: the data do not support one. Fix what the sentence names and record the spectrum again.",
        "Calibration refused",
      );
      drawReviewLines(flow);
      const range = doc.bufferedPageRange();
      for (let i = 0; i < range.count; i++) {
        doc.switchToPage(range.start + i);
        drawReportFooter(doc, `${buildText} · calibration of ${refused.fileName} refused · predicted, not certified`, x, pageBottom, width, i + 1, range.count);
      }
    }),
  );
}
