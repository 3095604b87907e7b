import type { ChartScene } from "../format/index.ts";
import { sheetFonts } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

/** SVG places text by its baseline, PDFKit by its top: the ascent of the sheet fonts, as a share of the size. */
const ascentShare = 0.76;

/**
 * Draws a chart scene (lib/format/chartScene) with PDFKit at (x, y), scaled to `width`: the same
 * primitives the SVG is made of, so the PDF and the page show the same chart. Returns its height.
 */
export function drawChartScene(doc: Doc, scene: ChartScene, x: number, y: number, width: number): number {
  const s = width / scene.width;
  const X = (v: number) => x + v * s;
  const Y = (v: number) => y + v * s;
  for (const item of scene.items) {
    doc.save();
    switch (item.kind) {
      case "line":
        doc.lineWidth(item.width * s).strokeColor(item.stroke);
        if (item.dash) doc.dash(item.dash[0] * s, { space: (item.dash[1] ?? item.dash[0]) * s });
        doc.moveTo(X(item.x1), Y(item.y1)).lineTo(X(item.x2), Y(item.y2)).stroke();
        break;
      case "rect":
        doc.rect(X(item.x), Y(item.y), item.w * s, item.h * s);
        if (item.fill && item.stroke) doc.lineWidth((item.width ?? 1) * s).fillAndStroke(item.fill, item.stroke);
        else if (item.fill) doc.fill(item.fill);
        else if (item.stroke) doc.lineWidth((item.width ?? 1) * s).stroke(item.stroke);
        break;
      case "circle":
        doc
          .lineWidth(0.8 * s)
          .circle(X(item.cx), Y(item.cy), item.r * s)
          .fillAndStroke(item.fill, item.stroke);
        break;
      case "polygon":
        doc
          .lineWidth(0.8 * s)
          .polygon(...item.points.map(([px, py]): [number, number] => [X(px), Y(py)]))
          .fillAndStroke(item.fill, item.stroke);
        break;
      case "text": {
        const size = item.size * s;
        doc
          .font(item.bold ? sheetFonts.bold : sheetFonts.regular)
          .fontSize(size)
          .fillColor(item.colour);
        const w = doc.widthOfString(item.text);
        const shift = item.anchor === "middle" ? w / 2 : item.anchor === "end" ? w : 0;
        if (item.rotate) {
          doc.rotate(-90, { origin: [X(item.x), Y(item.y)] });
          doc.text(item.text, X(item.x) - shift, Y(item.y) - ascentShare * size, { lineBreak: false });
        } else doc.text(item.text, X(item.x) - shift, Y(item.y) - ascentShare * size, { lineBreak: false });
        break;
      }
    }
    doc.restore();
  }
  return scene.height * s;
}
