import {
  allGasesCaution,
  predictionNotice,
  historyChartScene,
  historySeries,
  historyTable,
  textTable,
  trendRule,
  type LogLineProblem,
  type ParsedLog,
} from "../format/index.ts";
import { drawParagraph, drawReportCaution, drawSectionHeading, reportMonoFont } from "./calibrationReportParts.ts";
import { drawChartScene } from "./drawChartScene.ts";
import { displayText } from "./displayText.ts";
import type { PaperName } from "./paper.ts";
import { renderReport } from "./reportDocument.ts";
import type { SheetBuildIdentity } from "./sheetInput.ts";
import { ink, sheetFonts } from "./sheetStyle.ts";

export interface HistoryReportRequest {
  log: ParsedLog;
  /** The log's file name, as the report names it. */
  fileName: string;
  /** The instruments charted, one chart each. */
  instruments: string[];
  build: SheetBuildIdentity;
  paper?: PaperName;
}

/** The history of a calibration log as a PDF: the chart of each instrument, the rule, every run, every line not read. */
export function renderHistoryReport(request: HistoryReportRequest): Promise<Uint8Array> {
  const { log, build } = request;
  return renderReport(
    request.paper ?? "a4",
    build,
    {
      title: `Calibration history: ${displayText(request.fileName)}`,
      subject: "Wavenumber-scale corrections of instruments over time, from a bandatlas calibration log; not a certificate",
    },
    `history of ${request.fileName} · predicted references, not certified`,
    ({ doc, flow, x, width, top }) => {
      // The log may hold runs of any gas: the caution for all of them, in full, on page 1.
      flow.y = drawReportCaution(doc, `${allGasesCaution} ${predictionNotice}`, x, top, width);
      doc.font(sheetFonts.bold).fontSize(17).fillColor(ink).text("Calibration history", x, flow.y, { width, lineBreak: false });
      flow.y += 24;
      drawParagraph(
        flow,
        `${displayText(request.fileName)}: ${log.entries.length} runs read${log.problems.length ? `, ${log.problems.length} lines not read (listed below)` : ""}.`,
        9,
      );
      if (log.problems.length > 0) {
        drawSectionHeading(flow, "Lines not read", 20);
        for (const p of log.problems) drawParagraph(flow, `• line ${p.line}: ${p.message}`, 8.5, 1);
        flow.y += 6;
      }
      for (const instrument of request.instruments) {
        const scene = historyChartScene(historySeries(log, instrument));
        flow.ensure((scene.height * width) / scene.width + 8);
        flow.y += drawChartScene(doc, scene, x, flow.y, width) + 8;
      }
      drawParagraph(flow, trendRule, 8);
      flow.y += 6;
      drawSectionHeading(flow, "Runs", 30);
      const table = historyTable(log);
      // Cells come from the user's file: made safe one by one, so the columns stay aligned.
      const rows = table.rows.map((row) => row.map(displayText));
      const lines = textTable(table.headings, rows, table.rightAligned).split("\n");
      const longest = Math.max(...lines.map((l) => l.length));
      // Monospace, sized so the widest row fits the page (a DejaVu Sans Mono glyph is 0.602 em wide).
      const size = Math.min(7.5, width / (longest * 0.602));
      for (const line of lines) {
        flow.ensure(size * 1.3);
        doc.font(reportMonoFont).fontSize(size).fillColor(ink).text(line, x, flow.y, { lineBreak: false });
        flow.y += size * 1.3;
      }
    },
  );
}
