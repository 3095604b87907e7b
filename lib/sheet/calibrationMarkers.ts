import type { RejectionReason } from "../core/index.ts";

type Doc = PDFKit.PDFDocument;

/** A line in the report's plot and table: used in the fit, or the reason it was left out. */
export type CalibrationMark = "used" | RejectionReason;

// Used lines are filled and blue, left-out lines open and brown, and each reason has its own
// shape, so the plot still reads on a black-and-white printout.
export const usedColour = "#1f4e9a";
export const rejectedColour = "#9a4a12";

const shapes: Record<CalibrationMark, "disc" | "square" | "diamond" | "triangle-up" | "triangle-down" | "circle"> = {
  used: "disc",
  "uncertain-reference": "square",
  residual: "diamond",
  saturated: "triangle-up",
  blended: "triangle-down",
  weak: "circle",
};

export function markColour(mark: CalibrationMark): string {
  return mark === "used" ? usedColour : rejectedColour;
}

/** The mark's marker centred at (x, y), `size` its half width. */
export function drawCalibrationMark(doc: Doc, mark: CalibrationMark, x: number, y: number, size: number): void {
  const colour = markColour(mark);
  doc.save().undash().lineWidth(0.9).strokeColor(colour).fillColor(colour);
  switch (shapes[mark]) {
    case "disc":
      doc.circle(x, y, size).fill();
      break;
    case "circle":
      doc.circle(x, y, size).stroke();
      break;
    case "square":
      doc.rect(x - size * 0.85, y - size * 0.85, size * 1.7, size * 1.7).stroke();
      break;
    case "diamond":
      doc.polygon([x, y - size * 1.15], [x + size * 1.15, y], [x, y + size * 1.15], [x - size * 1.15, y]).stroke();
      break;
    case "triangle-up":
      doc.polygon([x - size, y + size * 0.8], [x + size, y + size * 0.8], [x, y - size * 1.05]).stroke();
      break;
    case "triangle-down":
      doc.polygon([x - size, y - size * 0.8], [x + size, y - size * 0.8], [x, y + size * 1.05]).stroke();
      break;
  }
  doc.restore();
}
