import { createRequire } from "node:module";
import { drawCalibrationBudget } from "./calibrationBudgetTable.ts";
import {
  applyCorrectionSentence,
  calibrationNotes,
  calibrationReportFacts,
  calibrationRulesText,
  correctionLines,
  correctionModelWords,
  noRecordFields,
  recordFacts,
  residualLines,
  runVerdict,
  verdictWords,
  checkLine,
  verdictRule,
  type CalibrationRun,
} from "../format/index.ts";
import { describeBuild } from "../shared/buildIdentity.ts";
import { drawCalibrationLineTable } from "./calibrationLineTable.ts";
import { CalibrationPageFlow } from "./calibrationPageFlow.ts";
import {
  drawCorrectionBox,
  drawFacts,
  drawParagraph,
  drawReportCaution,
  drawReportFooter,
  drawReportHeader,
  drawReportReminder,
  drawReviewLines,
  drawSectionHeading,
  drawVerdictBox,
  reportFooterHeightPt,
  reportMonoFont,
  reportMonoFontFile,
} from "./calibrationReportParts.ts";
import { drawResidualPlot, residualPlotHeight } from "./calibrationResidualPlot.ts";
import { displayText } from "./displayText.ts";
import { paperSizes, type PaperName } from "./paper.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";
import { newPdfDocument, pdfBytes } from "./pdfDocument.ts";
import { marginPt } from "./sheetStyle.ts";

const require = createRequire(import.meta.url);

export interface CalibrationReportRequest {
  run: CalibrationRun;
  build: SheetBuildIdentity;
  paper?: PaperName;
}

function newDocument(run: CalibrationRun, build: SheetBuildIdentity, paper: PaperName): PDFKit.PDFDocument {
  const doc = newPdfDocument(paper, build, {
    title: `Wavenumber calibration report: ${displayText(run.fileName)}`,
    subject: `Wavenumber scale of a spectrum checked against predicted lines of ${run.gasName}; not a certificate`,
  });
  doc.registerFont(reportMonoFont, require.resolve(reportMonoFontFile));
  return doc;
}

function lay(doc: PDFKit.PDFDocument, run: CalibrationRun, build: SheetBuildIdentity, paper: PaperName): void {
  const { widthPt, heightPt } = paperSizes[paper];
  const x = marginPt;
  const width = widthPt - 2 * marginPt;
  const top = marginPt * 0.75;
  const pageBottom = heightPt - marginPt * 0.75;
  const buildText = describeBuild(build);
  const flow = new CalibrationPageFlow(doc, x, width, top, pageBottom - reportFooterHeightPt - 4, drawReportReminder);

  doc.addPage();
  flow.y = drawReportHeader(doc, buildText, `${displayText(run.fileName)} against ${run.gasName}`, x, top, width);
  flow.y = drawReportCaution(doc, run.caution, x, flow.y, width);

  const facts = calibrationReportFacts(run);
  // Page 1 is the record a reviewer signs: who, what, when, the answer, the verdict, the budget.
  drawSectionHeading(flow, "Record", 40);
  drawFacts(flow, [...recordFacts(run.record ?? noRecordFields), ...facts.spectrum.slice(0, 2)]);
  drawSectionHeading(flow, "Cell and instrument", 40);
  drawFacts(flow, facts.cell);

  drawCorrectionBox(flow, correctionLines(run), `model: ${correctionModelWords[run.calibration.result.correction.model]}`);
  const verdict = runVerdict(run);
  if (verdict)
    drawVerdictBox(flow, `Verdict: ${verdict.verdict.toUpperCase()}`, [verdictWords[verdict.verdict], ...verdict.checks.map(checkLine)], verdictRule);
  drawCalibrationBudget(flow, run);
  drawParagraph(flow, applyCorrectionSentence(run));
  for (const line of residualLines(run)) drawParagraph(flow, line, 8.5, 1);
  flow.y += 6;
  drawReviewLines(flow);

  drawSectionHeading(flow, "Spectrum file", 40);
  drawFacts(flow, facts.spectrum);

  drawSectionHeading(flow, "Residuals of the lines found", residualPlotHeight(doc, run, width));
  flow.y = drawResidualPlot(doc, run, x, flow.y, width) + 10;

  drawSectionHeading(flow, "Lines", 60);
  drawCalibrationLineTable(flow, run);

  drawSectionHeading(flow, "Notes", 30);
  for (const note of calibrationNotes(run)) drawParagraph(flow, `• ${note}`);
  flow.y += 4;
  drawSectionHeading(flow, "The model and its limits", 40);
  drawParagraph(flow, calibrationRulesText(run));
  flow.y += 4;
  drawSectionHeading(flow, "Provenance", 40);
  drawParagraph(flow, `Made by ${buildText} (commit ${build.commit}).`);
  drawParagraph(flow, `Predicted lines from the molecule file of ${run.gasName}, which cites:`);
  for (const source of run.sources) drawParagraph(flow, `• ${source}`, 8);

  const range = doc.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    doc.switchToPage(range.start + i);
    drawReportFooter(doc, `${buildText} · calibration of ${run.fileName} · predicted, not certified`, x, pageBottom, width, i + 1, range.count);
  }
}

/** The PDF calibration report of one run, as bytes (A4 unless asked for letter). */
export async function renderCalibrationReport(request: CalibrationReportRequest): Promise<Uint8Array> {
  const paper = request.paper ?? "a4";
  const doc = newDocument(request.run, request.build, paper);
  return new Uint8Array(await pdfBytes(doc, () => lay(doc, request.run, request.build, paper)));
}
