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
import { drawCalibrationLineTable } from "./calibrationLineTable.ts";
import {
  drawCorrectionBox,
  drawFacts,
  drawParagraph,
  drawReportCaution,
  drawReportHeader,
  drawReviewLines,
  drawSectionHeading,
  drawVerdictBox,
} from "./calibrationReportParts.ts";
import { drawResidualPlot, residualPlotHeight } from "./calibrationResidualPlot.ts";
import { displayText } from "./displayText.ts";
import type { PaperName } from "./paper.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";
import { renderReport, type ReportPages } from "./reportDocument.ts";

export interface CalibrationReportRequest {
  run: CalibrationRun;
  build: SheetBuildIdentity;
  paper?: PaperName;
}

function lay({ doc, flow, x, width, top, buildText }: ReportPages, run: CalibrationRun, build: SheetBuildIdentity): void {
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
}

/** The PDF calibration report of one run, as bytes (A4 unless asked for letter). */
export async function renderCalibrationReport(request: CalibrationReportRequest): Promise<Uint8Array> {
  const { run, build } = request;
  return renderReport(
    request.paper ?? "a4",
    build,
    {
      title: `Wavenumber calibration report: ${displayText(run.fileName)}`,
      subject: `Wavenumber scale of a spectrum checked against predicted lines of ${run.gasName}; not a certificate`,
    },
    `calibration of ${run.fileName} · predicted, not certified`,
    (pages) => lay(pages, run, build),
  );
}
