import { calibrationPlotWords, type CalibrationRun } from "../format/index.ts";
import { axisTicks } from "../shared/axisTicks.ts";
import { drawCalibrationMark, markColour, type CalibrationMark } from "./calibrationMarkers.ts";
import { ink, sheetFonts, softInk } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

interface PlotPoint {
  x: number;
  y: number;
  sigma: number;
  mark: CalibrationMark;
}

/** Height of the frame itself; the axis labels, key and caption come below it. */
const frameHeightPt = 168;
const leftAxisPt = 46;
const bottomAxisPt = 27;
const markerSize = 2.7;
const legendRowPt = 12;
const captionSize = 7.5;

function points(run: CalibrationRun): PlotPoint[] {
  return run.calibration.result.lines.flatMap((l) =>
    l.peak && l.residualCm !== null
      ? [{ x: l.peak.wavenumberCm, y: l.residualCm, sigma: l.sigmaCm ?? 0, mark: l.used ? "used" : (l.reason ?? "residual") }]
      : [],
  );
}

const minus = (text: string) => text.replace("-", "−");

interface LegendItem {
  mark: CalibrationMark;
  words: string;
  x: number;
  y: number;
}

/** The key's entries placed in rows across the width; returns them and the rows' total height. */
function legendLayout(doc: Doc, run: CalibrationRun, x: number, width: number): { items: LegendItem[]; height: number } {
  const words = calibrationPlotWords(run);
  const entries: { mark: CalibrationMark; words: string }[] = [
    { mark: "used", words: words.used },
    ...words.rejected.map((r) => ({ mark: r.reason as CalibrationMark, words: `${r.words} (${r.count})` })),
  ];
  doc.font(sheetFonts.regular).fontSize(8);
  const items: LegendItem[] = [];
  let cx = x;
  let row = 0;
  for (const entry of entries) {
    const w = 12 + doc.widthOfString(entry.words) + 16;
    if (cx > x && cx + w > x + width) {
      cx = x;
      row++;
    }
    items.push({ ...entry, x: cx, y: row * legendRowPt });
    cx += w;
  }
  return { items, height: (row + 1) * legendRowPt };
}

/** Total height of the plot block: frame, axes, key and caption. */
export function residualPlotHeight(doc: Doc, run: CalibrationRun, width: number): number {
  const legend = legendLayout(doc, run, 0, width);
  doc.font(sheetFonts.regular).fontSize(captionSize);
  return frameHeightPt + bottomAxisPt + 4 + legend.height + 2 + doc.heightOfString(calibrationPlotWords(run).caption, { width });
}

/**
 * Residual of every line with a peak against its measured position, with ± σ bars. The y range
 * covers every residual and the used lines' bars; a longer bar (a rejected line's reference ± can
 * be a hundred times the used lines') is cut at the frame and ends in an arrow, so the fit stays legible.
 */
export function drawResidualPlot(doc: Doc, run: CalibrationRun, x: number, y: number, width: number): number {
  const data = points(run);
  const words = calibrationPlotWords(run);
  const frame = { left: x + leftAxisPt, top: y, right: x + width - 4, bottom: y + frameHeightPt };
  const xs = data.map((p) => p.x);
  const ys = [0, ...data.map((p) => p.y), ...data.filter((p) => p.mark === "used").flatMap((p) => [p.y - p.sigma, p.y + p.sigma])];
  let [xLow, xHigh] = [Math.min(...xs), Math.max(...xs)];
  if (!(xHigh > xLow)) [xLow, xHigh] = [xLow - 1, xHigh + 1];
  const xPad = 0.03 * (xHigh - xLow);
  xLow -= xPad;
  xHigh += xPad;
  let [yLow, yHigh] = [Math.min(...ys), Math.max(...ys)];
  if (!(yHigh > yLow)) [yLow, yHigh] = [yLow - 0.01, yHigh + 0.01];
  const yPad = 0.08 * (yHigh - yLow);
  yLow -= yPad;
  yHigh += yPad;
  const px = (v: number) => frame.left + ((v - xLow) / (xHigh - xLow)) * (frame.right - frame.left);
  const py = (v: number) => frame.bottom - ((v - yLow) / (yHigh - yLow)) * (frame.bottom - frame.top);

  // Grid and ticks first, so the data are drawn over them.
  const yTicks = axisTicks(yLow, yHigh, 6);
  const xTicks = axisTicks(xLow, xHigh, 8);
  doc.font(sheetFonts.regular).fontSize(7.5).fillColor(ink);
  for (const v of yTicks.values) {
    const ty = py(v);
    doc.save().lineWidth(0.4).strokeColor("#dddddd").moveTo(frame.left, ty).lineTo(frame.right, ty).stroke().restore();
    doc
      .save()
      .lineWidth(0.6)
      .strokeColor(ink)
      .moveTo(frame.left - 3, ty)
      .lineTo(frame.left, ty)
      .stroke()
      .restore();
    const label = minus(v.toFixed(yTicks.decimals));
    doc.text(label, frame.left - 5 - doc.widthOfString(label), ty - 3.5, { lineBreak: false });
  }
  for (const v of xTicks.values) {
    const tx = px(v);
    doc
      .save()
      .lineWidth(0.6)
      .strokeColor(ink)
      .moveTo(tx, frame.bottom)
      .lineTo(tx, frame.bottom + 3)
      .stroke()
      .restore();
    const label = v.toFixed(xTicks.decimals);
    doc.text(label, tx - doc.widthOfString(label) / 2, frame.bottom + 5, { lineBreak: false });
  }
  doc.save().lineWidth(0.9).strokeColor(softInk).moveTo(frame.left, py(0)).lineTo(frame.right, py(0)).stroke().restore();
  doc
    .save()
    .lineWidth(0.8)
    .strokeColor(ink)
    .rect(frame.left, frame.top, frame.right - frame.left, frame.bottom - frame.top)
    .stroke()
    .restore();

  doc.font(sheetFonts.regular).fontSize(8).fillColor(ink);
  doc.text(words.xTitle, (frame.left + frame.right) / 2 - doc.widthOfString(words.xTitle) / 2, frame.bottom + 16, { lineBreak: false });
  const titleX = x + 2;
  const titleY = (frame.top + frame.bottom) / 2 + doc.widthOfString(words.yTitle) / 2;
  doc.save().rotate(-90, { origin: [titleX, titleY] });
  doc.text(words.yTitle, titleX, titleY, { lineBreak: false });
  doc.restore();

  // Rejected lines under the used ones: the fit is what the eye should find first.
  const ordered = [...data.filter((p) => p.mark !== "used"), ...data.filter((p) => p.mark === "used")];
  for (const p of ordered) drawErrorBar(doc, p, px(p.x), py, yLow, yHigh);
  for (const p of ordered) drawCalibrationMark(doc, p.mark, px(p.x), py(p.y), markerSize);

  let below = frame.bottom + bottomAxisPt + 4;
  const legend = legendLayout(doc, run, frame.left, frame.right - frame.left);
  for (const item of legend.items) {
    drawCalibrationMark(doc, item.mark, item.x + 4, below + item.y + 4.5, markerSize);
    doc
      .font(sheetFonts.regular)
      .fontSize(8)
      .fillColor(ink)
      .text(item.words, item.x + 12, below + item.y, { lineBreak: false });
  }
  below += legend.height + 2;
  doc.font(sheetFonts.regular).fontSize(captionSize).fillColor(softInk);
  const hCaption = doc.heightOfString(words.caption, { width });
  doc.text(words.caption, x, below, { width });
  return below + hCaption;
}

function drawErrorBar(doc: Doc, p: PlotPoint, cx: number, py: (v: number) => number, yLow: number, yHigh: number): void {
  if (!(p.sigma > 0)) return;
  const cutLow = p.y - p.sigma < yLow;
  const cutHigh = p.y + p.sigma > yHigh;
  const top = py(Math.min(p.y + p.sigma, yHigh));
  const bottom = py(Math.max(p.y - p.sigma, yLow));
  // A left-out line's bar is drawn pale: it can span the frame and would hide the used lines.
  const colour = p.mark === "used" ? markColour(p.mark) : "#dcc0a8";
  doc
    .save()
    .lineWidth(p.mark === "used" ? 0.8 : 0.6)
    .strokeColor(colour)
    .fillColor(colour);
  doc.moveTo(cx, top).lineTo(cx, bottom).stroke();
  const cap = 2;
  if (cutHigh) doc.polygon([cx - 2, top + 4], [cx + 2, top + 4], [cx, top]).fill();
  else
    doc
      .moveTo(cx - cap, top)
      .lineTo(cx + cap, top)
      .stroke();
  if (cutLow) doc.polygon([cx - 2, bottom - 4], [cx + 2, bottom - 4], [cx, bottom]).fill();
  else
    doc
      .moveTo(cx - cap, bottom)
      .lineTo(cx + cap, bottom)
      .stroke();
  doc.restore();
}
