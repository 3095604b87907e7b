// What the calibration reads off the measured spectrum itself before it compares it with the
// gas: the resolution from the peak widths, how much of a band is black, and whether the
// spectrum, read as absorbance, points the wrong way.
import { CalibrationRefused, fourierFwhmPerResolution, type AbsorptionPeak, type Apodization, type SpectrumCalibrationRules } from "../core/index.ts";
import type { MeasuredAbsorbance, MeasuredCalibrationSettings, ResolutionOrigin } from "./measuredCalibration.ts";

/** Peaks whose widths show the instrument: strong, not saturated, both sides free. */
const widthSignalToNoise = 20;
/** … and optically thin enough that absorption does not widen them (height ≤ half the saturation level). */
const widthHeightFraction = 0.5;

/**
 * The resolution from the measured widths: the median FWHM of the clean strong peaks divided
 * by the FWHM the instrument line shape has per unit resolution (fourierFwhmPerResolution).
 * Only peaks well below saturation count: strong absorption widens a line. The gases' own widths at cell pressures (Doppler ≈ 0.006 cm⁻¹ FWHM for HCl at 296 K) are
 * neglected against the instrument's.
 */
export function estimateResolutionCm(peaks: readonly AbsorptionPeak[], apodization: Apodization, saturationAbsorbance: number): number | null {
  const widths = peaks
    .filter((p) => p.signalToNoise >= widthSignalToNoise && !p.flatTop && p.heightAbsorbance <= widthHeightFraction * saturationAbsorbance && p.fwhmCm !== null)
    .map((p) => p.fwhmCm!)
    .sort((a, b) => a - b);
  if (widths.length < 3) return null;
  return widths[widths.length >> 1] / fourierFwhmPerResolution(apodization);
}

export function resolutionOf(
  measured: MeasuredAbsorbance,
  settings: MeasuredCalibrationSettings,
  peaks: readonly AbsorptionPeak[],
  rules: SpectrumCalibrationRules,
): { resolutionCm: number; from: ResolutionOrigin; note: string } {
  if (settings.resolutionCm !== undefined)
    return { resolutionCm: settings.resolutionCm, from: "option", note: `resolution ${settings.resolutionCm} cm⁻¹ as given` };
  if (measured.resolutionCm !== null)
    return { resolutionCm: measured.resolutionCm, from: "file", note: `resolution ${measured.resolutionCm} cm⁻¹ as the file states` };
  const estimate = estimateResolutionCm(peaks, settings.apodization, rules.saturationAbsorbance);
  if (estimate === null) {
    throw new CalibrationRefused("the file does not state its resolution and too few clean strong peaks show it: give the resolution (--resolution)");
  }
  const rounded = Number(estimate.toPrecision(2));
  return {
    resolutionCm: rounded,
    from: "estimated",
    note: `resolution ${rounded} cm⁻¹ estimated from the median width of the strong peaks, assuming ${settings.apodization} apodization`,
  };
}

/** Fraction of the points in [fromCm, toCm] more than `level` above the baseline (the 5th percentile there). */
export function saturatedFraction(measured: MeasuredAbsorbance, fromCm: number, toCm: number, level: number): number {
  const values: number[] = [];
  for (let i = 0; i < measured.wavenumberCm.length; i++) {
    const x = measured.wavenumberCm[i];
    if (x >= fromCm && x <= toCm) values.push(measured.absorbance[i]);
  }
  if (!values.length) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  const baseline = sorted[Math.floor(0.05 * (sorted.length - 1))];
  return values.filter((v) => v - baseline > level).length / values.length;
}

/**
 * A spectrum whose lines point the wrong way once converted to absorbance (a transmittance read as
 * absorbance, or the reverse): in [fromCm, toCm] the values reach much further below their median
 * than above it, or most of them are negative. Null when it looks like absorbance; else why not.
 */
export function invertedSpectrumReason(measured: MeasuredAbsorbance, fromCm: number, toCm: number): string | null {
  const values: number[] = [];
  for (let i = 0; i < measured.wavenumberCm.length; i++) {
    const x = measured.wavenumberCm[i];
    if (x >= fromCm && x <= toCm) values.push(measured.absorbance[i]);
  }
  if (values.length < 16) return null;
  const sorted = values.sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.round(q * (sorted.length - 1))];
  const median = at(0.5);
  const down = median - at(0.005);
  const up = at(0.995) - median;
  const negative = sorted.filter((v) => v < -0.05).length / sorted.length;
  if (negative > 0.5) return `${(100 * negative).toFixed(0)} % of its absorbance values are below −0.05`;
  if (down > 2 * up && down > 0.02) return `its peaks point downward (down to ${down.toFixed(2)} below the median, up to only ${up.toFixed(2)} above)`;
  return null;
}
