import { bandLabel, contradictionRuleText, modelSigmaMultiple, type BandAccuracy, type Line } from "../core/index.ts";
import type { BandOriginBound } from "../atlas/index.ts";
import { positionWithUncertainty, signedSignificant, significant } from "./numbers.ts";

// The words of a band's accuracy status, written once for the CLI table, the CSV comment, the
// JSON, the species pages, the bench sheets and the method page.

export const positionStatusWords: Record<Line["positionStatus"], string> = {
  certified: "certified",
  validated: "validated",
  contradicted: "contradicted by measured lines",
  extrapolated: "extrapolated",
  "not-validated": "not validated",
};

/**
 * The one sign convention of every residual the atlas prints (accuracy tables, `fit`, calibrate):
 * the atlas's value minus the measured one — the prediction minus the measured line, the reference
 * position minus the corrected measured peak. A positive residual: the atlas lies higher.
 */
export const residualSignText = "residual = atlas − measured";

/** "|m| 1–5" */
function rangeText(min: number, max: number): string {
  return min === max ? `|m| = ${min}` : `|m| ${min}–${max}`;
}

/** Measured lines beyond 3× the model's own ±: said, since the floor (not the model) makes the printed ± cover them. */
function beyondSigmaText(accuracy: BandAccuracy): string {
  const b = accuracy.beyondModelSigma;
  if (!b) return "";
  return `; ${b.count} of the measured lines miss by more than ${modelSigmaMultiple}× the model's own ± (${b.label} by ${significant(b.ratio, 2)}×), so there the printed ± is the measured residual, not the model's`;
}

/** One sentence: how the band's positions were checked against cited measured lines. */
export function accuracyText(accuracy: BandAccuracy): string {
  const c = accuracy.check;
  if (accuracy.status === "validated" && c) {
    const heldOut = c.heldOutCount ? ` (${c.heldOutCount} of them held out of the fit)` : "";
    return (
      `validated against ${c.lineCount} cited measured lines${heldOut} of band ${bandLabel(c.band)}, ${rangeText(c.absMMin, c.absMMax)} [${c.sourceKeys.join(", ")}]: ` +
      `largest |predicted − measured| ${significant(c.maxAbsResidualCm, 2)} cm⁻¹, RMS ${significant(c.rmsResidualCm, 2)} cm⁻¹; lines outside that |m| range are extrapolations` +
      beyondSigmaText(accuracy)
    );
  }
  if (accuracy.status === "contradicted" && c && accuracy.contradiction) {
    const w = accuracy.contradiction;
    return (
      `contradicted by measured lines: ${c.lineCount} cited measured lines of band ${bandLabel(c.band)}, ${rangeText(c.absMMin, c.absMMax)} [${c.sourceKeys.join(", ")}], ` +
      `miss the prediction by up to ${significant(c.maxAbsResidualCm, 2)} cm⁻¹ (RMS ${significant(c.rmsResidualCm, 2)} cm⁻¹; ${w.label}: ${signedSignificant(w.predictedMinusMeasuredCm, 2)} cm⁻¹, ${residualSignText}). ` +
      `Rule: ${contradictionRuleText}. The printed ± is raised to the residuals; do not calibrate against this band` +
      beyondSigmaText(accuracy)
    );
  }
  if (accuracy.status === "extrapolated") {
    const largest = accuracy.floor.length ? accuracy.floor[accuracy.floor.length - 1].residualCm : 0;
    return `extrapolated: no cited measured line of this band and species; the constants were checked against measured lines of other bands or species (largest |predicted − measured| ${significant(largest, 2)} cm⁻¹)`;
  }
  return "not validated: no cited measured line stands behind these constants; the ± is the propagated uncertainty and the size of the terms the constants leave out";
}

/** Plain data for the JSON outputs. */
export function accuracyRecord(accuracy: BandAccuracy) {
  const c = accuracy.check;
  return {
    status: accuracy.status,
    text: accuracyText(accuracy),
    measuredLines: c ? c.lineCount : 0,
    heldOutLines: c ? c.heldOutCount : 0,
    absMMin: c ? c.absMMin : null,
    absMMax: c ? c.absMMax : null,
    maxAbsResidualCm: c ? c.maxAbsResidualCm : null,
    rmsResidualCm: c ? c.rmsResidualCm : null,
    sources: c ? c.sourceKeys : [],
    /** The measured line that misses furthest when the band is contradicted (contradictionRuleText). */
    contradiction: accuracy.contradiction,
    beyondModelSigma: accuracy.beyondModelSigma,
    residualSign: residualSignText,
  };
}

/** Where a species' constants come from, in a few words (pages, sheets, the CLI header). */
export function constantsOriginText(model: { label: string; constantsOrigin: "cited" | "isotope-scaled" | "fitted" }, referenceLabel: string): string {
  if (model.constantsOrigin === "fitted") return `constants fitted by bandatlas fit to cited measured lines`;
  if (model.constantsOrigin === "cited") return `constants cited for ${model.label}`;
  return `constants scaled from ${referenceLabel} by Dunham's isotope relations`;
}

/** Said once beside every printed band origin: where its ± comes from. */
export const bandOriginBoundNote = "a band origin is no line: its ± is the larger ± of the band's first P and R lines (no closer bound is computed)";

/** "11340 ± 390 cm⁻¹ (extrapolated)", or the bare origin at 0.1 cm⁻¹ when the band has no line on one side. */
export function bandOriginText(bound: BandOriginBound): string {
  if (bound.uncertainty === null || bound.status === null) return `${bound.wavenumber.toFixed(1)} cm⁻¹ (no ± : the band lists no line on one side of it)`;
  const w = positionWithUncertainty(bound.wavenumber, bound.uncertainty);
  return `${w.value} ± ${w.sigma} cm⁻¹ (${positionStatusWords[bound.status]})`;
}
