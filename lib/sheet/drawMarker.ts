import type { Branch } from "../core/index.ts";
import { branchStyle } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

/** The branch's marker at (x, y), as on the website plot: a downward triangle for P, a disc for R. */
export function drawMarker(doc: Doc, branch: Branch, x: number, y: number, size: number): void {
  const style = branchStyle[branch];
  doc
    .save()
    .undash()
    .lineWidth(Math.max(0.6, size * 0.35));
  if (style.marker === "disc") {
    doc
      .circle(x, y, size * 0.8)
      .fillColor(style.colour)
      .fill();
  } else {
    doc
      .polygon([x - size, y - size * 0.6], [x + size, y - size * 0.6], [x, y + size * 0.9])
      .fillColor(style.colour)
      .fill();
  }
  doc.restore();
}

/** One line as drawn in the plot: a stick from (x, yBase) up to (x, yTop) capped by the branch's marker. */
export function drawStick(doc: Doc, branch: Branch, x: number, yBase: number, yTop: number, markerSize: number): void {
  const style = branchStyle[branch];
  doc.save().lineWidth(1).strokeColor(style.colour);
  if (style.dash) doc.dash(style.dash[0], { space: style.dash[1] });
  doc.moveTo(x, yBase).lineTo(x, yTop).stroke();
  doc.restore();
  drawMarker(doc, branch, x, yTop, markerSize);
}
