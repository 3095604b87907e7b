import type { Branch } from "../core/index.ts";
import { axisTicks } from "../shared/axisTicks.ts";
import { drawStick } from "./drawMarker.ts";
import type { SheetContent } from "./sheetContent.ts";
import { branchStyle, ink, rule, sheetFonts, softInk } from "./sheetStyle.ts";

type Doc = PDFKit.PDFDocument;

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

const yTop = 1.18; // headroom above the strongest line for the branch names and the origin label

/**
 * The stick plot of the band: wavenumber rising to the right, relative intensity up, vector only.
 * Drawn with PDFKit rather than by placing the site's Vega SVG through svg-to-pdfkit: the sheet
 * needs its embedded DejaVu subset for every label (the SVG names a generic sans-serif), hairline
 * sticks at print resolution and one layout for A4 and Letter; it takes the same data (the atlas
 * entry) and the same branch colours, dashes and markers (shared/branchStyle) as the site's plot,
 * so both show the same picture. The unused svg-to-pdfkit dependency was removed.
 */
export function drawStickPlot(doc: Doc, box: Box, content: SheetContent): void {
  const left = box.x + 40;
  const right = box.x + box.width - 6;
  const top = box.y + 4;
  const bottom = box.y + box.height - 30;
  const wavenumbers = content.sticks.map((s) => s.wavenumber);
  const span = Math.max(...wavenumbers) - Math.min(...wavenumbers) || 1;
  const low = Math.min(...wavenumbers) - 0.03 * span;
  const high = Math.max(...wavenumbers) + 0.03 * span;
  const sx = (v: number) => left + ((v - low) / (high - low)) * (right - left);
  const sy = (r: number) => bottom - (r / yTop) * (bottom - top);

  doc.save().lineWidth(0.5).strokeColor(rule);
  for (const r of [0.25, 0.5, 0.75, 1]) doc.moveTo(left, sy(r)).lineTo(right, sy(r)).dash(0.5, { space: 2 }).stroke();
  doc.restore();

  // Band origin: where the missing Q branch would be, between R(0) and P(1).
  const origin = sx(content.bandOrigin);
  doc.save().lineWidth(0.8).strokeColor(ink).dash(1, { space: 1.5 }).moveTo(origin, bottom).lineTo(origin, sy(1.06)).stroke().restore();
  doc.font(sheetFonts.regular).fontSize(7.5).fillColor(ink);
  // The value and ± only: the status is in the header line above the caution box.
  const originLabel = `ν₀ = ${content.bandOriginText.replace(/ \(.*$/, "")}`;
  const originWidth = doc.widthOfString(originLabel);
  const originX = Math.min(Math.max(origin - originWidth / 2, left + 2), right - originWidth - 2);
  doc.text(originLabel, originX, sy(yTop) + 1, { lineBreak: false });

  const markerSize = Math.min(2.4, Math.max(1.2, ((right - left) / content.sticks.length) * 0.3));
  for (const stick of content.sticks) drawStick(doc, stick.branch, sx(stick.wavenumber), bottom, sy(stick.relativeIntensity), markerSize);

  // Branch names over each branch's centre of intensity, so the plot reads without the legend.
  doc.font(sheetFonts.bold).fontSize(9);
  for (const branch of ["P", "R"] as Branch[]) {
    const sticks = content.sticks.filter((s) => s.branch === branch);
    if (!sticks.length) continue;
    const weight = sticks.reduce((a, s) => a + s.relativeIntensity, 0);
    const centre = sticks.reduce((a, s) => a + s.wavenumber * s.relativeIntensity, 0) / weight;
    const name = `${branchStyle[branch].name} (${branch === "P" ? "ΔJ = −1" : "ΔJ = +1"})`;
    const width = doc.widthOfString(name);
    let x = sx(centre) - width / 2;
    // keep the name clear of the origin label
    if (branch === "P") x = Math.min(x, originX - width - 8);
    else x = Math.max(x, originX + originWidth + 8);
    x = Math.min(Math.max(x, left + 2), right - width - 2);
    doc.fillColor(ink).text(name, x, sy(1.09) - 9, { lineBreak: false });
  }

  // Axes.
  doc.save().lineWidth(0.9).strokeColor(ink).undash();
  doc.moveTo(left, top).lineTo(left, bottom).lineTo(right, bottom).stroke();
  doc.restore();
  doc.font(sheetFonts.regular).fontSize(8).fillColor(ink);
  const xTicks = axisTicks(low, high, 8);
  for (const v of xTicks.values) {
    if (v < low || v > high) continue;
    const x = sx(v);
    doc
      .save()
      .lineWidth(0.8)
      .strokeColor(ink)
      .moveTo(x, bottom)
      .lineTo(x, bottom + 3)
      .stroke()
      .restore();
    const label = v.toFixed(xTicks.decimals);
    doc.text(label, x - doc.widthOfString(label) / 2, bottom + 4.5, { lineBreak: false });
  }
  for (const r of [0, 0.25, 0.5, 0.75, 1]) {
    const y = sy(r);
    doc
      .save()
      .lineWidth(0.8)
      .strokeColor(ink)
      .moveTo(left - 3, y)
      .lineTo(left, y)
      .stroke()
      .restore();
    const label = r === 0 ? "0" : r.toFixed(2);
    doc.text(label, left - 5 - doc.widthOfString(label), y - 4, { lineBreak: false });
  }
  doc.fontSize(8.5);
  const xTitle = "wavenumber ν̃ / cm⁻¹ (vacuum)";
  doc.text(xTitle, (left + right) / 2 - doc.widthOfString(xTitle) / 2, bottom + 16, { lineBreak: false });
  const yTitle = "relative intensity";
  doc.save().rotate(-90, { origin: [box.x + 6, (top + bottom) / 2] });
  doc.text(yTitle, box.x + 6 - doc.widthOfString(yTitle) / 2, (top + bottom) / 2 - 5, { lineBreak: false });
  doc.restore();
  doc.fillColor(softInk);
}
