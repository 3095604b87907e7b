import type { AbsorbingLine } from "./absorbingLines.ts";
import { observedSignal, type CellSpectrum } from "./cellTransmittance.ts";
import { CoreInputError } from "../coreInputError.ts";
import type { WavenumberCm } from "../types.ts";
import { measuredGrade } from "../positions/certifiedPositions.ts";

/** What makes a line calibration-grade at a resolution R. */
export interface CalibrationCriteria {
  /** Strong: intensity at least this fraction of the strongest line of the gas. */
  strongFraction: number;
  /** Isolated: no other line of any species or band within ± isolationMultiple × R … */
  isolationMultiple: number;
  /** … counting only lines at least this fraction of the candidate's own intensity. */
  neighbourFraction: number;
  /**
   * Accurate: the predicted position's standard uncertainty at most this fraction of R, and the
   * line inside the measured J range of a band validated against cited lines. R/50 keeps the
   * position error well below the few-hundredths-of-R reading precision of a good FTIR peak fit
   * (our own bound; a line that fails it would move the scale more than the fit can resolve).
   */
  maxUncertaintyFraction: number;
}

/** Defaults of our own choosing (common practice, no source), stated on every output. */
export const defaultCalibrationCriteria: CalibrationCriteria = {
  strongFraction: 0.1,
  isolationMultiple: 1,
  neighbourFraction: 0.01,
  maxUncertaintyFraction: 0.02,
};

export interface CalibrationLine {
  species: string;
  band: string;
  label: string;
  wavenumber: WavenumberCm;
  wavenumberUncertainty: WavenumberCm;
  intensity: number;
  relativeToStrongest: number;
  /** Distance to the nearest line that counts as a neighbour (any distance), cm⁻¹; null if none. */
  nearestNeighbourCm: WavenumberCm | null;
  /** Where the instrument shows the peak (from the convolved spectrum), cm⁻¹; null if no peak within ±R/2. */
  apparentWavenumber: WavenumberCm | null;
  /** apparentWavenumber − wavenumber, cm⁻¹. */
  peakShiftCm: WavenumberCm | null;
}

export function checkCalibrationCriteria(c: CalibrationCriteria): void {
  if (!(c.strongFraction > 0 && c.strongFraction <= 1)) throw new CoreInputError(`strong fraction ${c.strongFraction} must be above 0 and at most 1`);
  if (!(c.isolationMultiple >= 0 && Number.isFinite(c.isolationMultiple)))
    throw new CoreInputError(`isolation multiple ${c.isolationMultiple} must be a number ≥ 0`);
  if (!(c.neighbourFraction >= 0 && c.neighbourFraction <= 1)) throw new CoreInputError(`neighbour fraction ${c.neighbourFraction} must be between 0 and 1`);
  if (!(c.maxUncertaintyFraction > 0 && Number.isFinite(c.maxUncertaintyFraction)))
    throw new CoreInputError(`uncertainty fraction ${c.maxUncertaintyFraction} must be a number above 0`);
}

/**
 * The apparent peak near ν̃0: the largest value of the signal within ±halfWidth, refined by the
 * parabola through it and its two neighbours; null when the largest value sits on the search
 * edge (the line shows no peak of its own there).
 */
export function apparentPeak(signal: Float64Array, spectrum: CellSpectrum, centreCm: WavenumberCm, halfWidthCm: WavenumberCm): WavenumberCm | null {
  const { startCm, stepCm } = spectrum.grid;
  const lo = Math.max(1, Math.ceil((centreCm - halfWidthCm - startCm) / stepCm));
  const hi = Math.min(signal.length - 2, Math.floor((centreCm + halfWidthCm - startCm) / stepCm));
  if (hi <= lo) return null;
  let best = lo;
  for (let i = lo + 1; i <= hi; i++) if (signal[i] > signal[best]) best = i;
  if (best === lo || best === hi) return null;
  const a = signal[best - 1];
  const b = signal[best];
  const c = signal[best + 1];
  const curvature = a - 2 * b + c;
  const offset = curvature < 0 ? (0.5 * (a - c)) / curvature : 0;
  return startCm + (best + offset) * stepCm;
}

/**
 * Distance from line i of lines sorted by wavenumber to the nearest other line at least `floor`
 * strong, either side, cm⁻¹; null when there is none.
 */
export function nearestNeighbourCm(sorted: readonly AbsorbingLine[], i: number, floor: number): WavenumberCm | null {
  const line = sorted[i];
  let nearest: number | null = null;
  for (let j = i - 1; j >= 0; j--) {
    if (sorted[j].intensity >= floor) {
      nearest = line.wavenumber - sorted[j].wavenumber;
      break;
    }
  }
  for (let j = i + 1; j < sorted.length; j++) {
    if (sorted[j].intensity >= floor) {
      const d = sorted[j].wavenumber - line.wavenumber;
      if (nearest === null || d < nearest) nearest = d;
      break;
    }
  }
  return nearest;
}

/** A line that passes the strong, isolated and accurate criteria, before its apparent peak is known. */
export interface CalibrationCandidate {
  line: AbsorbingLine;
  strongest: number;
  nearestNeighbourCm: WavenumberCm | null;
}

/**
 * The lines in [fromCm, toCm] that are strong, isolated and accurate by the criteria at
 * resolution R. None of this needs a spectrum, so a caller can skip computing one when no line
 * qualifies, or compute it only around the lines that do.
 */
export function calibrationCandidates(
  lines: readonly AbsorbingLine[],
  fromCm: WavenumberCm,
  toCm: WavenumberCm,
  resolutionCm: WavenumberCm,
  criteria: CalibrationCriteria = defaultCalibrationCriteria,
): CalibrationCandidate[] {
  checkCalibrationCriteria(criteria);
  if (!(resolutionCm > 0)) throw new CoreInputError(`resolution ${resolutionCm} cm⁻¹ must be above 0`);
  let strongest = 0;
  for (const l of lines) if (l.intensity > strongest) strongest = l.intensity;
  if (strongest === 0) return [];
  const sorted = [...lines].sort((a, b) => a.wavenumber - b.wavenumber);
  const out: CalibrationCandidate[] = [];
  for (let i = 0; i < sorted.length; i++) {
    const line = sorted[i];
    if (line.wavenumber < fromCm || line.wavenumber > toCm) continue;
    if (line.intensity < criteria.strongFraction * strongest) continue;
    if (!measuredGrade(line.positionStatus) || line.wavenumberUncertainty > criteria.maxUncertaintyFraction * resolutionCm) continue;
    const nearest = nearestNeighbourCm(sorted, i, criteria.neighbourFraction * line.intensity);
    if (nearest !== null && nearest <= criteria.isolationMultiple * resolutionCm) continue;
    out.push({ line, strongest, nearestNeighbourCm: nearest });
  }
  return out;
}

/**
 * Calibration candidates with the shift of their apparent peak in the convolved spectrum
 * (blends, ILS sidelobes of neighbours and saturation all show up in it); the spectrum must
 * cover each candidate ± R/2.
 */
export function calibrationLinesOf(candidates: readonly CalibrationCandidate[], spectrum: CellSpectrum, resolutionCm: WavenumberCm): CalibrationLine[] {
  const signal = observedSignal(spectrum);
  return candidates.map(({ line, strongest, nearestNeighbourCm }) => {
    const apparent = apparentPeak(signal, spectrum, line.wavenumber, resolutionCm / 2);
    return {
      species: line.species,
      band: line.band,
      label: line.label,
      wavenumber: line.wavenumber,
      wavenumberUncertainty: line.wavenumberUncertainty,
      intensity: line.intensity,
      relativeToStrongest: line.intensity / strongest,
      nearestNeighbourCm,
      apparentWavenumber: apparent,
      peakShiftCm: apparent === null ? null : apparent - line.wavenumber,
    };
  });
}

/**
 * Lines usable for a wavenumber calibration at resolution R: strong, isolated and accurate by the
 * criteria, inside the spectrum's window, with their apparent peaks (calibrationLinesOf).
 */
export function calibrationLines(
  lines: readonly AbsorbingLine[],
  spectrum: CellSpectrum,
  resolutionCm: WavenumberCm,
  criteria: CalibrationCriteria = defaultCalibrationCriteria,
): CalibrationLine[] {
  const from = spectrum.grid.startCm + spectrum.windowFirst * spectrum.grid.stepCm;
  const to = spectrum.grid.startCm + spectrum.windowLast * spectrum.grid.stepCm;
  return calibrationLinesOf(calibrationCandidates(lines, from, to, resolutionCm, criteria), spectrum, resolutionCm);
}
