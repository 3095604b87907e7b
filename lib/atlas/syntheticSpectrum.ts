// Synthetic measured spectra made by the project's own cell model, for the calibration's tests and
// benchmarks: an instrument whose wavenumber scale is off by a known scale and offset, with white
// noise and a tilted baseline. Invented measurements, not real ones; pure (no Node API).
import { cellSpectrum, observedSignal, type Apodization, type CellConditions, type CellSpectrum } from "../core/index.ts";
import { cellLinesOfModel, type CellModel } from "./cellSpectrum.ts";

/** A small seeded generator (mulberry32) so every trial is repeatable. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by Box–Muller. */
export function gaussian(random: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

export interface TrueSpectrum {
  spectrum: CellSpectrum;
  /** Decadic absorbance the instrument shows at a true wavenumber. */
  absorbanceAt: (wavenumberCm: number) => number;
  /** The tallest absorbance in the window. */
  peakAbsorbance: number;
}

/**
 * The absorbance an instrument of resolution R would record, on the true scale. With cited
 * intensities: −log10 of the convolved transmittance; without: the optically thin shape scaled to
 * a tallest peak of `thinPeakAbsorbance`.
 */
export function trueSpectrum(
  cell: CellModel,
  conditions: CellConditions,
  resolutionCm: number,
  apodization: Apodization,
  fromCm: number,
  toCm: number,
  thinPeakAbsorbance = 0.3,
): TrueSpectrum {
  const set = cellLinesOfModel(cell, conditions);
  const spectrum = cellSpectrum({
    lines: set.lines,
    conditions,
    intensityScale: set.intensityScale,
    fromCm,
    toCm,
    instrument: { kind: "fourier-transform", resolutionCm, apodization },
  });
  let values: Float64Array;
  if (spectrum.observedTransmittance) {
    values = spectrum.observedTransmittance.map((t) => -Math.log10(Math.max(t, 1e-6)));
  } else {
    const thin = observedSignal(spectrum);
    let peak = 0;
    for (const v of thin) if (v > peak) peak = v;
    values = thin.map((v) => (v / peak) * thinPeakAbsorbance);
  }
  const { startCm, stepCm } = spectrum.grid;
  const absorbanceAt = (nu: number) => {
    const position = (nu - startCm) / stepCm;
    const i = Math.floor(position);
    if (i < 0 || i + 1 >= values.length) return 0;
    const f = position - i;
    return values[i] * (1 - f) + values[i + 1] * f;
  };
  let peakAbsorbance = 0;
  for (let i = spectrum.windowFirst; i <= spectrum.windowLast; i++) peakAbsorbance = Math.max(peakAbsorbance, values[i]);
  return { spectrum, absorbanceAt, peakAbsorbance };
}

export interface Miscalibration {
  /** true = measured·(1 + scale) + offsetCm */
  scale: number;
  offsetCm: number;
  noiseAbsorbance: number;
  /** Baseline tilt, absorbance per cm⁻¹ about the centre of the range. */
  tiltPerCm: number;
  baselineAbsorbance: number;
}

/** Sample a true spectrum on a measured grid from fromCm to toCm (instrument scale) every stepCm. */
export function measuredSpectrum(
  truth: TrueSpectrum,
  fromCm: number,
  toCm: number,
  stepCm: number,
  error: Miscalibration,
  random: () => number,
): { wavenumberCm: Float64Array; absorbance: Float64Array } {
  const count = Math.floor((toCm - fromCm) / stepCm) + 1;
  const x = new Float64Array(count);
  const a = new Float64Array(count);
  const centre = (fromCm + toCm) / 2;
  for (let i = 0; i < count; i++) {
    x[i] = fromCm + i * stepCm;
    const nu = x[i] * (1 + error.scale) + error.offsetCm;
    a[i] = truth.absorbanceAt(nu) + error.baselineAbsorbance + error.tiltPerCm * (x[i] - centre) + error.noiseAbsorbance * gaussian(random);
  }
  return { wavenumberCm: x, absorbance: a };
}
