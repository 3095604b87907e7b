import { checkCellConditions, type AbsorbingLine, type CellConditions } from "./absorbingLines.ts";
import { convolveWithInstrument } from "./convolution.ts";
import { CoreInputError } from "../coreInputError.ts";
import { checkInstrument, instrumentReachCm, type Instrument } from "./instrumentLineShape.ts";
import { numberDensityPerCm3 } from "../intensities/numberDensity.ts";
import { opticalDepth, type OpticalDepthOptions } from "./opticalDepth.ts";
import { spectralGrid, type SpectralGrid } from "./spectralGrid.ts";
import type { WavenumberCm } from "../types.ts";

/** The finest default step is 0.002 cm⁻¹, finer where the narrowest line asks for it. */
export const defaultMaxGridStepCm = 0.002;

/**
 * "absolute": line intensities in cm/molecule, so τ and T are the cell's.
 * "relative-thin": intensities in arbitrary units (no cited band strength); only the shape of the
 * optically thin absorbance means anything, and no transmittance is given.
 */
export type IntensityScale = "absolute" | "relative-thin";

export interface CellSpectrumRequest {
  lines: readonly AbsorbingLine[];
  conditions: CellConditions;
  intensityScale: IntensityScale;
  fromCm: WavenumberCm;
  toCm: WavenumberCm;
  instrument: Instrument;
  /** Computation grid step; default min(0.002, narrowest Doppler HWHM) cm⁻¹. */
  stepCm?: WavenumberCm;
  wing?: OpticalDepthOptions;
}

export interface CellSpectrum {
  intensityScale: IntensityScale;
  /** The computation grid: the window plus a margin for the instrument's reach. */
  grid: SpectralGrid;
  /** Indices of the first and last grid points inside [fromCm, toCm]. */
  windowFirst: number;
  windowLast: number;
  columnDensityPerCm2: number;
  /** Monochromatic optical depth (relative units in "relative-thin"). */
  opticalDepth: Float64Array;
  /** Monochromatic transmittance e^−τ ("absolute" only). */
  transmittance: Float64Array | null;
  /** What the instrument shows: ILS ⊗ T ("absolute" only). */
  observedTransmittance: Float64Array | null;
  /** ILS ⊗ τ: the optically thin apparent absorbance (computed in "relative-thin" only). */
  observedThinOpticalDepth: Float64Array | null;
}

export function defaultGridStepCm(lines: readonly AbsorbingLine[]): WavenumberCm {
  let narrowest = Infinity;
  for (const line of lines) if (line.dopplerHwhmCm < narrowest) narrowest = line.dopplerHwhmCm;
  // A step of one Doppler HWHM integrates a Gaussian to ~1e-6 (trapezoid error ~exp(−2π²σ²/h²)).
  return Math.min(defaultMaxGridStepCm, narrowest);
}

/** Column density of the absorbing molecule, N = x p L/(kT), molecules/cm². */
export function columnDensityPerCm2(conditions: CellConditions): number {
  return numberDensityPerCm3(conditions.pressurePa, conditions.temperatureK) * conditions.moleFraction * conditions.pathCm;
}

/** Monochromatic and instrument-convolved spectrum of a gas cell over a window. */
export function cellSpectrum(request: CellSpectrumRequest): CellSpectrum {
  checkCellConditions(request.conditions);
  checkInstrument(request.instrument);
  const { fromCm, toCm, instrument } = request;
  if (!(Number.isFinite(fromCm) && Number.isFinite(toCm) && toCm > fromCm)) {
    throw new CoreInputError(`the range ${fromCm} to ${toCm} cm⁻¹ is empty: "to" must be above "from"`);
  }
  if (!(fromCm > 0)) throw new CoreInputError(`the range must start above 0 cm⁻¹ (got ${fromCm})`);
  const step = request.stepCm ?? defaultGridStepCm(request.lines);
  if (instrument.kind !== "monochromatic" && instrument.resolutionCm < 4 * step) {
    throw new CoreInputError(
      `resolution ${instrument.resolutionCm} cm⁻¹ is finer than the computation can show at a ${step} cm⁻¹ step; use a resolution of at least ${4 * step} cm⁻¹`,
    );
  }
  const margin = instrumentReachCm(instrument);
  const start = Math.max(step, fromCm - margin);
  const grid = spectralGrid(start, toCm + margin, step);
  const windowFirst = Math.ceil((fromCm - start) / step - 1e-9);
  const windowLast = Math.min(grid.count - 1, Math.floor((toCm - start) / step + 1e-9));
  const column = columnDensityPerCm2(request.conditions);
  const tau = opticalDepth(request.lines, grid, column, request.wing);

  if (request.intensityScale === "relative-thin") {
    return {
      intensityScale: "relative-thin",
      grid,
      windowFirst,
      windowLast,
      columnDensityPerCm2: column,
      opticalDepth: tau,
      transmittance: null,
      observedTransmittance: null,
      observedThinOpticalDepth: convolveWithInstrument(tau, step, instrument),
    };
  }
  const transmittance = new Float64Array(grid.count);
  const absorptance = new Float64Array(grid.count);
  for (let i = 0; i < grid.count; i++) {
    transmittance[i] = Math.exp(-tau[i]);
    absorptance[i] = -Math.expm1(-tau[i]);
  }
  const observedAbsorptance = convolveWithInstrument(absorptance, step, instrument);
  const observedTransmittance = new Float64Array(grid.count);
  for (let i = 0; i < grid.count; i++) observedTransmittance[i] = 1 - observedAbsorptance[i];
  return {
    intensityScale: "absolute",
    grid,
    windowFirst,
    windowLast,
    columnDensityPerCm2: column,
    opticalDepth: tau,
    transmittance,
    observedTransmittance,
    observedThinOpticalDepth: null,
  };
}

/** The "absorption-like" signal whose peaks are the apparent line positions (1 − T_obs, or ILS ⊗ τ). */
export function observedSignal(spectrum: CellSpectrum): Float64Array {
  if (spectrum.observedThinOpticalDepth) return spectrum.observedThinOpticalDepth;
  const t = spectrum.observedTransmittance!;
  const out = new Float64Array(t.length);
  for (let i = 0; i < t.length; i++) out[i] = 1 - t[i];
  return out;
}

/**
 * For a gas without a cited band intensity: the instrument-convolved optically thin absorbance
 * scaled so that its largest value inside the window is 1 (the shape is all that can be given).
 */
export function relativeThinAbsorbance(spectrum: CellSpectrum): Float64Array {
  const thin = spectrum.observedThinOpticalDepth;
  if (!thin) throw new CoreInputError("a relative absorbance is only made for a spectrum without absolute intensities");
  let peak = 0;
  for (let i = spectrum.windowFirst; i <= spectrum.windowLast; i++) if (thin[i] > peak) peak = thin[i];
  const out = new Float64Array(thin.length);
  for (let i = 0; i < thin.length; i++) out[i] = peak > 0 ? thin[i] / peak : 0;
  return out;
}
