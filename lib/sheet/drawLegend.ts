import { strongMark } from "./drawLineTable.ts";
import { sheetStatusLegend, strongLineFraction } from "./sheetContent.ts";
import { ink, sheetFonts } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

/** The key to the table's marks and columns; returns the y below it. */
export function drawLegendLine(doc: Doc, x: number, y: number, width: number): number {
  const text =
    `${strongMark} bold: strong line, relative intensity ≥ ${strongLineFraction} (the band's strongest line = 1). ` +
    "ν̃: vacuum wavenumber; λ vac: vacuum wavelength; J″: rotational quantum number of the lower level; — : no such line. " +
    sheetStatusLegend.replace("Status:", "st. (status):");
  doc.font(sheetFonts.regular).fontSize(8).fillColor(ink);
  const h = doc.heightOfString(text, { width });
  doc.text(text, x, y, { width });
  return y + h + 4;
}
