import {
  absorptionPeaks,
  calibrateSpectrum,
  calibrationReferences,
  CalibrationRefused,
  cellSpectrum,
  defaultReferenceCriteria,
  defaultSpectrumCalibrationRules,
  observedSignal,
  correctedWavenumber,
  bandLabel,
  lineErrorShares,
  independentShares,
  type AbsorbingLine,
  type ErrorShare,
  type Apodization,
  type CellConditions,
  type CellSpectrum,
  type CorrectionModel,
  type ReferenceCriteria,
  type SpectrumCalibrationResult,
  type SpectrumCalibrationRules,
} from "../core/index.ts";
import { cellLinesOfModel, type CellLineSet, type CellModel } from "./cellSpectrum.ts";
import { invertedSpectrumReason, resolutionOf, saturatedFraction } from "./measuredSpectrumChecks.ts";

/** A measured spectrum as the calibration needs it: ascending wavenumbers, decadic absorbance. */
export interface MeasuredAbsorbance {
  wavenumberCm: Float64Array;
  absorbance: Float64Array;
  /** Resolution the file states, cm⁻¹, or null. */
  resolutionCm: number | null;
}

export interface MeasuredCalibrationSettings {
  conditions: CellConditions;
  apodization: Apodization;
  /** Overrides the file's resolution and the estimate. */
  resolutionCm?: number;
  model: CorrectionModel;
  rules?: SpectrumCalibrationRules;
  referenceCriteria?: ReferenceCriteria;
  /** Refuse rather than use a reference not validated against measured lines. */
  requireValidated?: boolean;
}

export type ResolutionOrigin = "option" | "file" | "estimated";

export interface MeasuredCalibration {
  result: SpectrumCalibrationResult;
  resolutionCm: number;
  resolutionFrom: ResolutionOrigin;
  /** How the resolution was obtained, in words. */
  resolutionNote: string;
  apodization: Apodization;
  noiseAbsorbance: number;
  peakCount: number;
  set: CellLineSet;
  /** The range compared: the measured range where the gas has lines. */
  range: { fromCm: number; toCm: number };
  /** The predicted spectrum on the corrected measured grid, scaled to the measured peaks (for plots). */
  predicted: { wavenumberCm: Float64Array; absorbance: Float64Array };
  /** The measured spectrum on its corrected scale, baseline (median) removed, same points as `predicted`. */
  measured: { wavenumberCm: Float64Array; absorbance: Float64Array };
  referenceCriteria: ReferenceCriteria;
}

/**
 * The predicted spectrum is most of the work; the same gas, conditions, instrument and range give
 * the same one, so the last is kept per cell model (a page recalibrating with another model, a
 * series of scans of one cell).
 */
const lastSpectrum = new WeakMap<CellModel, { key: string; spectrum: CellSpectrum }>();

/** A gas as named inside a sentence ("Hydrogen chloride" → "hydrogen chloride"). */
export function gasNameInSentence(name: string): string {
  return name.charAt(0).toLowerCase() + name.slice(1);
}

const gasName = (cell: CellModel) => gasNameInSentence(cell.moleculeName);

/** The coarsest resolution a calibration accepts: beyond 16 cm⁻¹ no rotational line is resolved. */
export const maxCalibrationResolutionCm = 16;

/**
 * Each reference line's error, source by source: its position's shares from its band model (the
 * constants, omitted terms, isotope scaling, residual floor; sources named the same in every
 * species and band of the gas) and the cell's pressure shift, one source for every line.
 */
function shareFinder(cell: CellModel, pressureShiftUncertaintyCm: number): (line: AbsorbingLine) => ErrorShare[] {
  return (line) => {
    const match = /^([PR])\((\d+)\)$/.exec(line.label);
    const species = cell.species.find((s) => s.model.label === line.species);
    const band = species?.bands.find((b) => bandLabel(b) === line.band);
    const shares: ErrorShare[] =
      match && species && band ? lineErrorShares(species.model, band, match[1] as "P" | "R", Number(match[2])) : independentShares(line);
    if (pressureShiftUncertaintyCm > 0) shares.push({ source: "pressure shift", kind: "pressure-shift", shiftCm: pressureShiftUncertaintyCm });
    return shares;
  };
}

/** Calibrate a measured spectrum of one gas against the atlas's predicted spectrum (pure: runs in the browser too). */
export function calibrateMeasuredSpectrum(cell: CellModel, measured: MeasuredAbsorbance, settings: MeasuredCalibrationSettings): MeasuredCalibration {
  const rules = { ...(settings.rules ?? defaultSpectrumCalibrationRules), ...(settings.requireValidated ? { requireValidated: true } : {}) };
  const criteria = settings.referenceCriteria ?? defaultReferenceCriteria;
  const x = measured.wavenumberCm;
  const measuredFrom = x[0];
  const measuredTo = x[x.length - 1];
  const set = cellLinesOfModel(cell, settings.conditions);
  let strongest = 0;
  for (const l of set.lines) if (l.intensity > strongest) strongest = l.intensity;
  const listed = set.lines.filter((l) => l.intensity >= criteria.minRelativeStrength * strongest);
  const inRange = listed.filter((l) => l.wavenumber >= measuredFrom && l.wavenumber <= measuredTo);
  if (!inRange.length) {
    const lo = Math.min(...listed.map((l) => l.wavenumber));
    const hi = Math.max(...listed.map((l) => l.wavenumber));
    // A rare species may have its lines there (D35Cl in an HCl cell at natural abundance, 1.5·10⁻⁴):
    // an enriched cell of it is calibrated by selecting it, and the refusal says which and how.
    const strongestOf = new Map<string, number>();
    for (const l of set.lines) strongestOf.set(l.species, Math.max(strongestOf.get(l.species) ?? 0, l.intensity));
    const there = [
      ...new Set(
        set.lines
          .filter(
            (l) => l.wavenumber >= measuredFrom && l.wavenumber <= measuredTo && l.intensity >= criteria.minRelativeStrength * strongestOf.get(l.species)!,
          )
          .map((l) => l.species),
      ),
    ];
    const hint = there.length
      ? `; the lines of ${there.join(" and ")} do lie there: for a cell enriched in ${there.length > 1 ? "them" : "it"}, select ${there.length > 1 ? "them" : "it"} (--species ${there.join(",")})`
      : "";
    throw new CalibrationRefused(
      `the spectrum covers ${measuredFrom.toFixed(1)}–${measuredTo.toFixed(1)} cm⁻¹, where ${gasName(cell)} has no lines at natural abundance (its lines lie at ${lo.toFixed(0)}–${hi.toFixed(0)} cm⁻¹)${hint}`,
    );
  }
  const linesFrom = Math.min(...inRange.map((l) => l.wavenumber));
  const linesTo = Math.max(...inRange.map((l) => l.wavenumber));
  // Measured once: the saturation refusal (below) and the inverted-spectrum check both read it.
  const black = saturatedFraction(measured, linesFrom, linesTo, rules.saturationAbsorbance);
  const bandIsBlack = black > 0.05;
  // A black band also reaches far from its median: the saturation message comes first (below).
  const inverted = bandIsBlack ? null : invertedSpectrumReason(measured, linesFrom, linesTo);
  if (inverted) {
    throw new CalibrationRefused(
      `the spectrum, read as absorbance, does not look like absorption: ${inverted}; check what its y values are (--y transmittance, percent or absorbance)`,
    );
  }
  const { peaks: allPeaks, noiseAbsorbance } = absorptionPeaks(x, measured.absorbance, 5);
  // Widths only from peaks among the gas's lines: other gases and other bands in the file say nothing of it.
  const nearLines = allPeaks.filter((p) => p.wavenumberCm >= linesFrom - 2 && p.wavenumberCm <= linesTo + 2);
  const resolution = resolutionOf(measured, settings, nearLines, rules);
  const resolutionCm = resolution.resolutionCm;
  const margin = Math.max(5 * resolutionCm, 2);
  const fromCm = Math.max(measuredFrom, linesFrom - margin);
  const toCm = Math.min(measuredTo, linesTo + margin);
  const instrument = { kind: "fourier-transform" as const, resolutionCm, apodization: settings.apodization };
  const key = JSON.stringify([settings.conditions, instrument, fromCm, toCm]);
  let spectrum = lastSpectrum.get(cell)?.key === key ? lastSpectrum.get(cell)!.spectrum : null;
  if (!spectrum) {
    spectrum = cellSpectrum({ lines: set.lines, conditions: settings.conditions, intensityScale: set.intensityScale, fromCm, toCm, instrument });
    lastSpectrum.set(cell, { key, spectrum });
  }
  const references = calibrationReferences(set.lines, spectrum, resolutionCm, fromCm, toCm, criteria, shareFinder(cell, set.pressureShift.uncertaintyCm));
  // Peaks just outside the compared range may still be lines of the gas seen on a wrong scale.
  const reach = rules.bounds.maxScalePpm * 1e-6 * toCm + rules.bounds.maxOffsetCm + resolutionCm;
  const peaks = allPeaks.filter((p) => p.wavenumberCm >= fromCm - reach && p.wavenumberCm <= toCm + reach);
  let result: SpectrumCalibrationResult;
  try {
    result = calibrateSpectrum(gasName(cell), peaks, references, resolutionCm, { fromCm, toCm }, settings.model, rules);
  } catch (error) {
    // A black band has no peaks left to find: say that, not that the gas is wrong.
    if (error instanceof CalibrationRefused && bandIsBlack) {
      throw new CalibrationRefused(
        `the spectrum is saturated: ${(100 * black).toFixed(0)} % of the points between ${linesFrom.toFixed(0)} and ${linesTo.toFixed(0)} cm⁻¹ absorb more than ${rules.saturationAbsorbance} above the baseline; lower the pressure, dilute the gas or shorten the path, then record again`,
      );
    }
    throw error;
  }

  // For plots: both spectra on the corrected scale, the prediction scaled to the measured peaks.
  const signal = observedSignal(spectrum);
  const predictedShape = (nu: number) => {
    const position = (nu - spectrum.grid.startCm) / spectrum.grid.stepCm;
    const i = Math.floor(position);
    if (i < 0 || i + 1 >= signal.length) return 0;
    const f = position - i;
    return signal[i] * (1 - f) + signal[i + 1] * f;
  };
  const first = x.findIndex((v) => v >= fromCm);
  let last = x.length - 1;
  while (last > first && x[last] > toCm) last--;
  const count = Math.max(0, last - first + 1);
  const sortedA = Float64Array.from(measured.absorbance.subarray(first, last + 1)).sort();
  const baseline = sortedA[sortedA.length >> 1] ?? 0;
  const correctedX = new Float64Array(count);
  const measuredA = new Float64Array(count);
  const shape = new Float64Array(count);
  let cross = 0;
  let square = 0;
  for (let k = 0; k < count; k++) {
    correctedX[k] = correctedWavenumber(result.correction, x[first + k]);
    measuredA[k] = measured.absorbance[first + k] - baseline;
    shape[k] = predictedShape(correctedX[k]);
    cross += shape[k] * measuredA[k];
    square += shape[k] * shape[k];
  }
  const factor = square > 0 ? cross / square : 0;
  for (let k = 0; k < count; k++) shape[k] *= factor;
  return {
    result,
    resolutionCm,
    resolutionFrom: resolution.from,
    resolutionNote: resolution.note,
    apodization: settings.apodization,
    noiseAbsorbance,
    peakCount: peaks.length,
    set,
    range: { fromCm, toCm },
    predicted: { wavenumberCm: correctedX, absorbance: shape },
    measured: { wavenumberCm: correctedX, absorbance: measuredA },
    referenceCriteria: criteria,
  };
}
