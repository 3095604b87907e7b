import { fixed } from "./numbers.ts";

// The printed digits of cell spectra and calibration lines, shared by the CLI, the site and the
// sheets so that all three show the same numbers.

/** Wavenumber of a spectrum sample, cm⁻¹ (the grid is 0.002 cm⁻¹ or finer: 4 decimals). */
export const spectrumWavenumberDigits = (v: number): string => fixed(v, 4);
/** Transmittance 0–1, five decimals (1e-5, below any cell measurement's noise). */
export const transmittanceDigits = (v: number): string => fixed(v, 5);
/** Optical depth, four significant figures. */
export const opticalDepthDigits = (v: number): string => (v === 0 ? "0" : v.toPrecision(4));
/** A calibration line's position, cm⁻¹, four decimals as in the line tables. */
export const calibrationWavenumberDigits = (v: number): string => fixed(v, 4);
/** Expected apparent-peak shift, cm⁻¹, four decimals (signed). */
export const peakShiftDigits = (v: number | null): string => (v === null ? "" : fixed(v, 4) === "-0.0000" ? "0.0000" : fixed(v, 4));

/** The pressure shift in a cell's line centres, as the JSON outputs give it (two significant figures). */
export function pressureShiftRecord(shift: { shiftCm: number; uncertaintyCm: number; uncited: string[]; sourceKeys: string[] }) {
  return {
    shiftCm: Number(shift.shiftCm.toPrecision(2)),
    uncertaintyCm: Number(shift.uncertaintyCm.toPrecision(2)),
    /** Perturbers in the cell with no cited shift (none applied for them). */
    notCitedFor: [...shift.uncited],
    /** Molecule-file source keys of the shifts applied. */
    sources: [...shift.sourceKeys],
  };
}
