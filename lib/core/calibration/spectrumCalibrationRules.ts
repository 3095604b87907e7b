import { CoreInputError } from "../coreInputError.ts";
import { defaultScaleSearchBounds, type ScaleSearchBounds } from "./scaleSearch.ts";

/** A calibration the data do not support: the message is one sentence for the user. */
export class CalibrationRefused extends CoreInputError {
  constructor(message: string) {
    super(message);
    this.name = "CalibrationRefused";
  }
}

/** Our own thresholds (common practice, no source); every output states them. */
export interface SpectrumCalibrationRules {
  /** A peak this many times the noise or more counts as measured well enough to use. */
  minSignalToNoise: number;
  /**
   * Saturated: a peak at least this high above its baseline (transmittance ≤ 10 % at the
   * apparent peak), or a flat top. There the detector's nonlinearity and the unresolved line
   * core distort the shape the position is read from.
   */
  saturationAbsorbance: number;
  /**
   * Blended by a strong neighbour: a measured peak within this many resolutions, at least twice
   * as high and at least half the saturation level, widens in absorbance beyond what an optically
   * thin prediction gives and pulls the line's apparent peak (seen in real HCl cells: the H³⁷Cl
   * lines beside strong H³⁵Cl lines).
   */
  strongNeighbourResolutions: number;
  /** At least this fraction of the strong references (≥ 10 % of the strongest) must find a peak. */
  minMatchedFraction: number;
  /** Refuse when a different assignment gathers at least this fraction of the best one's votes. */
  ambiguityRatio: number;
  /**
   * No peak position is taken as more precise than this fraction of the resolution: what a peak
   * fit cannot see (line-shape asymmetry, residual phase error, baseline, unresolved neighbours)
   * leaves each line's position uncertain by about a hundredth of R on good FTIR spectra (our own
   * floor, common practice, no source; its coverage is tested on distorted synthetic spectra).
   */
  peakFloorFraction: number;
  /** Refuse a model two of whose fitted terms correlate beyond this (our own rule, common practice, no source). */
  maxTermCorrelation: number;
  /**
   * Refuse a best assignment within this fraction of the search's edge: the instrument's error
   * may lie beyond what was searched, and a vote cut off at the edge is not a maximum.
   */
  edgeFraction: number;
  /** Use only references validated against measured lines (a traceable correction or none). */
  requireValidated: boolean;
  bounds: ScaleSearchBounds;
}

export const defaultSpectrumCalibrationRules: SpectrumCalibrationRules = {
  minSignalToNoise: 10,
  saturationAbsorbance: 1,
  strongNeighbourResolutions: 3,
  minMatchedFraction: 0.5,
  ambiguityRatio: 0.8,
  peakFloorFraction: 0.01,
  maxTermCorrelation: 0.99,
  edgeFraction: 0.98,
  requireValidated: false,
  bounds: defaultScaleSearchBounds,
};
