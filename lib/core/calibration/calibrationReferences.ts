import type { AbsorbingLine } from "../spectra/absorbingLines.ts";
import { apparentPeak, nearestNeighbourCm } from "../spectra/calibrationGrade.ts";
import { observedSignal, type CellSpectrum } from "../spectra/cellTransmittance.ts";
import type { ErrorShare } from "../bands/lineErrorShares.ts";
import type { WavenumberCm } from "../types.ts";

/** Which predicted lines may serve as references when a measured spectrum is calibrated. */
export interface ReferenceCriteria {
  /** Lines weaker than this fraction of the gas's strongest line in the window are not listed. */
  minRelativeStrength: number;
  /** Blended: a line at least this fraction of the candidate's strength within one resolution. */
  blendFraction: number;
  /**
   * A reference is used only when its standard uncertainty is at most this fraction of R: then
   * it cannot be confused with a neighbour and cannot dominate the fit by a model error the ±
   * does not show. R/4 is our own rule (common practice, no source), stated on every output.
   */
  maxUncertaintyFraction: number;
  /**
   * The predicted peak shift (blends, ILS sidelobes of neighbours) rests on modelled
   * intensities, widths and apodization: this fraction of it enters the reference's ± (our bound).
   */
  peakShiftUncertaintyFraction: number;
}

export const defaultReferenceCriteria: ReferenceCriteria = {
  minRelativeStrength: 0.01,
  blendFraction: 0.1,
  maxUncertaintyFraction: 0.25,
  peakShiftUncertaintyFraction: 0.25,
};

/** A line of the gas (zero-pressure position, its ± and validation status) as a reference for a measured peak. */
export interface CalibrationReference extends Pick<AbsorbingLine, "species" | "band" | "label" | "wavenumber" | "wavenumberUncertainty" | "positionStatus"> {
  relativeToStrongest: number;
  /** Where the instrument should show the peak (the apparent peak), cm⁻¹; null when it shows none of its own. */
  referenceCm: WavenumberCm | null;
  /** ± of referenceCm: the position's and part of the peak shift, in quadrature. */
  referenceUncertaintyCm: WavenumberCm;
  peakShiftCm: WavenumberCm | null;
  /** Nearest line at least blendFraction as strong, cm⁻¹ (null if none). */
  nearestNeighbourCm: WavenumberCm | null;
  blended: boolean;
  /** True when the reference's ± is small enough against R to use it. */
  precise: boolean;
  /** What referenceUncertaintyCm is made of, source by source (see lineErrorShares.ts). */
  shares: ErrorShare[];
}

/**
 * A line's error shares without knowledge of their sources: its whole ± as a source of its own.
 * Callers that know the line's band model pass the real shares (atlas/measuredCalibration.ts).
 */
export const independentShares = (line: AbsorbingLine): ErrorShare[] => [
  { source: `line ${line.species} ${line.band} ${line.label}`, kind: "constants", shiftCm: line.wavenumberUncertainty },
];

/**
 * Every line of the gas in [fromCm, toCm] at least minRelativeStrength of its strongest line there,
 * with the apparent peak the predicted cell spectrum shows at resolution R (same conditions,
 * same instrument line shape as the measurement), which is the reference a measured peak is
 * compared with.
 */
export function calibrationReferences(
  lines: readonly AbsorbingLine[],
  spectrum: CellSpectrum,
  resolutionCm: WavenumberCm,
  fromCm: WavenumberCm,
  toCm: WavenumberCm,
  criteria: ReferenceCriteria = defaultReferenceCriteria,
  sharesOf: (line: AbsorbingLine) => ErrorShare[] = independentShares,
): CalibrationReference[] {
  const sorted = [...lines].sort((a, b) => a.wavenumber - b.wavenumber);
  let strongest = 0;
  for (const l of sorted) if (l.wavenumber >= fromCm && l.wavenumber <= toCm && l.intensity > strongest) strongest = l.intensity;
  if (strongest === 0) return [];
  const signal = observedSignal(spectrum);
  const out: CalibrationReference[] = [];
  for (let i = 0; i < sorted.length; i++) {
    const line = sorted[i];
    if (line.wavenumber < fromCm || line.wavenumber > toCm || line.intensity < criteria.minRelativeStrength * strongest) continue;
    const nearest = nearestNeighbourCm(sorted, i, criteria.blendFraction * line.intensity);
    const apparent = apparentPeak(signal, spectrum, line.wavenumber, resolutionCm / 2);
    const shift = apparent === null ? null : apparent - line.wavenumber;
    const lineShapeCm = criteria.peakShiftUncertaintyFraction * (shift ?? 0);
    const uncertainty = Math.hypot(line.wavenumberUncertainty, lineShapeCm);
    // The predicted peak shifts all rest on one line-shape model (widths, apodization): an error
    // in it moves every shift in proportion, so this share is one source for all lines.
    const shares = sharesOf(line);
    if (lineShapeCm !== 0) shares.push({ source: "line-shape model", kind: "line-shape", shiftCm: lineShapeCm });
    out.push({
      species: line.species,
      band: line.band,
      label: line.label,
      wavenumber: line.wavenumber,
      wavenumberUncertainty: line.wavenumberUncertainty,
      positionStatus: line.positionStatus,
      relativeToStrongest: line.intensity / strongest,
      referenceCm: apparent,
      referenceUncertaintyCm: uncertainty,
      peakShiftCm: shift,
      nearestNeighbourCm: nearest,
      blended: apparent === null || (nearest !== null && nearest <= resolutionCm),
      precise: uncertainty <= criteria.maxUncertaintyFraction * resolutionCm,
      shares,
    });
  }
  return out;
}
