import { instrumentLineShape, type Apodization, type Instrument } from "./instrumentLineShape.ts";
import type { WavenumberCm } from "../types.ts";

const fwhmPerResolution = new Map<Apodization, number>();

/**
 * FWHM of a Fourier-transform instrument line shape in units of its resolution R = 1/L, found
 * by bisection on the computed ILS (boxcar ≈ 1.207, triangular ≈ 1.772 in units of 1/(2L);
 * the ratio does not depend on R, so it is computed once per apodization).
 */
export function fourierFwhmPerResolution(apodization: Apodization): number {
  const cached = fwhmPerResolution.get(apodization);
  if (cached !== undefined) return cached;
  const instrument: Instrument = { kind: "fourier-transform", resolutionCm: 1, apodization };
  const half = instrumentLineShape(instrument, 0) / 2;
  let lo = 0;
  let hi = 2;
  for (let k = 0; k < 60; k++) {
    const mid = (lo + hi) / 2;
    if (instrumentLineShape(instrument, mid) > half) lo = mid;
    else hi = mid;
  }
  const ratio = lo + hi;
  fwhmPerResolution.set(apodization, ratio);
  return ratio;
}

/** FWHM of the instrument line shape, cm⁻¹ (a grating's slit function is given by its FWHM). */
export function instrumentFwhmCm(instrument: Exclude<Instrument, { kind: "monochromatic" }>): WavenumberCm {
  return instrument.kind === "grating" ? instrument.resolutionCm : fourierFwhmPerResolution(instrument.apodization) * instrument.resolutionCm;
}
