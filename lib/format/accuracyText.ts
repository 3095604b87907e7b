import { bandLabel, type BandAccuracy, type Line } from "../core/index.ts";
import { significant } from "./numbers.ts";

// The words of a band's accuracy status, written once for the CLI table, the CSV comment, the
// JSON, the species pages, the bench sheets and the method page.

export const positionStatusWords: Record<Line["positionStatus"], string> = {
  validated: "validated",
  extrapolated: "extrapolated",
  "not-validated": "not validated",
};

/** "|m| 1–5" */
function rangeText(min: number, max: number): string {
  return min === max ? `|m| = ${min}` : `|m| ${min}–${max}`;
}

/** One sentence: how the band's positions were checked against cited measured lines. */
export function accuracyText(accuracy: BandAccuracy): string {
  const c = accuracy.check;
  if (accuracy.status === "validated" && c) {
    const heldOut = c.heldOutCount ? ` (${c.heldOutCount} of them held out of the fit)` : "";
    return (
      `validated against ${c.lineCount} cited measured lines${heldOut} of band ${bandLabel(c.band)}, ${rangeText(c.absMMin, c.absMMax)} [${c.sourceKeys.join(", ")}]: ` +
      `largest |predicted − measured| ${significant(c.maxAbsResidualCm, 2)} cm⁻¹, RMS ${significant(c.rmsResidualCm, 2)} cm⁻¹; lines outside that |m| range are extrapolations`
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
  };
}

/** Where a species' constants come from, in a few words (pages, sheets, the CLI header). */
export function constantsOriginText(model: { label: string; constantsOrigin: "cited" | "isotope-scaled" | "fitted" }, referenceLabel: string): string {
  if (model.constantsOrigin === "fitted") return `constants fitted by bandatlas fit to cited measured lines`;
  if (model.constantsOrigin === "cited") return `constants cited for ${model.label}`;
  return `constants scaled from ${referenceLabel} by Dunham's isotope relations`;
}
