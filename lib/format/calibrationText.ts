import type { CalibrationMarks } from "../atlas/index.ts";
import type { CalibrationCriteria } from "../core/index.ts";
import { standardAtmospherePa } from "../core/physicalConstants.ts";
import { peakShiftDigits } from "./spectrumCells.ts";

// The words of the calibration-grade marks (conditions, criteria, per-line cells), shared by the
// species pages and the bench sheets so both say the same thing.

/** "0.125, 0.5, 1, 2 and 4 cm⁻¹" */
export function resolutionsText(resolutionsCm: readonly number[]): string {
  const parts = resolutionsCm.map(String);
  return `${parts.length > 1 ? `${parts.slice(0, -1).join(", ")} and ${parts[parts.length - 1]}` : parts[0]} cm⁻¹`;
}

/** The cell and instrument the marks assume, in words. */
export function calibrationConditionsText(marks: CalibrationMarks): string {
  const c = marks.conditions;
  const torr = Number(((c.pressurePa * 760) / standardAtmospherePa).toPrecision(4));
  const gas = c.moleFraction === 1 ? "the pure gas" : `the gas at mole fraction ${c.moleFraction} in air`;
  return `a ${Number(c.pathCm.toPrecision(4))} cm cell of ${gas} at ${c.temperatureK} K and ${torr} Torr (${Number((c.pressurePa / 100).toPrecision(4))} mbar), seen by a Fourier-transform instrument with ${marks.apodization} apodization`;
}

/** The three criteria in a short phrase, for headers and sheets; `r` names the resolution. */
export function criteriaPhrase(k: CalibrationCriteria, r = "R"): string {
  return (
    `strong: ≥ ${k.strongFraction} of the gas's strongest line; isolated: no line ≥ ${k.neighbourFraction} of it within ±${k.isolationMultiple} × ${r}; ` +
    `accurate: position ± ≤ ${k.maxUncertaintyFraction} × ${r}, inside the measured J range of a band validated against cited lines`
  );
}

/** What "calibration grade at resolution R" means, in words. */
export function calibrationCriteriaText(marks: CalibrationMarks): string {
  const k = marks.criteria;
  return (
    `A line is calibration grade at a resolution R when it is at least ${k.strongFraction} of the strongest line of the gas, no other line of any species or band (hot bands included) ` +
    `at least ${k.neighbourFraction} as strong as it lies within ±${k.isolationMultiple} × R, and its predicted position is known to ${k.maxUncertaintyFraction} × R or better (one standard uncertainty) ` +
    `inside the J range of a band checked against cited measured lines. The expected peak shift is where the instrument shows the peak minus the line position, from the convolved spectrum.`
  );
}

export interface LineCalibration {
  resolutionCm: number;
  peakShiftCm: number | null;
}

/** For each line (by species, band and label), the default resolutions at which it is calibration grade. */
export function calibrationByLine(marks: CalibrationMarks): Map<string, LineCalibration[]> {
  const out = new Map<string, LineCalibration[]>();
  for (const r of marks.byResolution) {
    for (const l of r.lines) {
      const key = calibrationLineKey(l.species, l.band, l.label);
      const list = out.get(key) ?? [];
      list.push({ resolutionCm: r.resolutionCm, peakShiftCm: l.peakShiftCm });
      out.set(key, list);
    }
  }
  return out;
}

export function calibrationLineKey(species: string, band: string, label: string): string {
  return `${species}|${band}|${label}`;
}

/** A line-table cell, "0.125 (0.0001) · 0.5 (-0.0030)": resolution in cm⁻¹, expected peak shift in brackets. */
export function calibrationCellText(list: readonly LineCalibration[]): string {
  return list.map((c) => `${c.resolutionCm} (${c.peakShiftCm === null ? "no peak" : peakShiftDigits(c.peakShiftCm)})`).join(" · ");
}
