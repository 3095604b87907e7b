import { conditionsText, recordFacts, type RefusedRun } from "../format/index.ts";
import { drawCorrectionBox, drawFacts, drawReportCaution, drawReportHeader, drawReviewLines, drawSectionHeading } from "./calibrationReportParts.ts";
import { displayText } from "./displayText.ts";
import type { PaperName } from "./paper.ts";
import { renderReport } from "./reportDocument.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";

export interface RefusalReportRequest {
  refused: RefusedRun;
  build: SheetBuildIdentity;
  paper?: PaperName;
}

/**
 * The short report of a run that was refused: the record, the file, and why no correction was
 * given, with the review lines, so a refused check is filed like a passed one.
 */
export function renderRefusalReport(request: RefusalReportRequest): Promise<Uint8Array> {
  const { refused, build } = request;
  return renderReport(
    request.paper ?? "a4",
    build,
    {
      title: `Wavenumber calibration refused: ${displayText(refused.fileName)}`,
      subject: `Why a spectrum could not be checked against predicted lines of ${refused.gasName}; not a certificate`,
    },
    `calibration of ${refused.fileName} refused · predicted, not certified`,
    ({ doc, flow, x, width, top, buildText }) => {
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
    },
  );
}
