// ##RESOLUTION in cm⁻¹. An FTIR's resolution is a constant width in wavenumber, whatever unit the
// file's x axis is written in; a width in µm or nm varies across the spectrum, so it is converted
// at the middle of the spectrum.
import type { AbscissaUnit } from "./measuredSpectrum.ts";
import { shortNumber } from "./numberText.ts";
import { abscissaUnitFromWords, abscissaUnitTexts } from "./unitWords.ts";

const unitLengthNm: Record<Exclude<AbscissaUnit, "cm-1">, number> = { um: 1e3, nm: 1 };
/** A "width" above this fraction of the wavelength cannot be a wavelength resolution of a gas spectrum. */
const implausibleWavelengthFraction = 0.05;
/** The coarsest resolution FTIRs offer, in cm⁻¹. */
const coarsestResolutionCm = 64;

export function resolutionInCm(
  written: string | undefined,
  abscissaUnit: AbscissaUnit,
  wavenumberCm: Float64Array,
): { resolutionCm: number | null; note?: string } {
  if (written === undefined || written.trim() === "") return { resolutionCm: null };
  const match = /^\s*\+?(\d+\.?\d*|\.\d+)(?:[eE]([+-]?\d+))?\s*(.*)$/.exec(written);
  const value = match ? Number(`${match[1]}e${match[2] ?? 0}`) : NaN;
  if (!match || !(value > 0)) return { resolutionCm: null, note: `##RESOLUTION=${written} is not a positive number; the resolution was not used.` };
  const statedUnit = abscissaUnitFromWords(match[3]);
  const unit = statedUnit ?? abscissaUnit;
  if (unit === "cm-1") return { resolutionCm: value };

  const middleCm = (wavenumberCm[0] + wavenumberCm[wavenumberCm.length - 1]) / 2;
  const middleWavelength = 1e7 / middleCm / unitLengthNm[unit];
  if (!statedUnit) {
    // A bare number in a wavelength file: the standard means the x unit, but exporters write the
    // instrument's setting in cm⁻¹. Take it as cm⁻¹ only when it cannot be a wavelength width.
    if (value / middleWavelength > implausibleWavelengthFraction && value <= coarsestResolutionCm) {
      return {
        resolutionCm: value,
        note: `##RESOLUTION=${written} was taken as ${shortNumber(value)} cm⁻¹: as a width in ${abscissaUnitTexts[unit]} it would be ${shortNumber((100 * value) / middleWavelength)} % of the wavelength, no instrument's resolution.`,
      };
    }
    return {
      resolutionCm: null,
      note: `##RESOLUTION=${written} does not say whether it is in cm⁻¹ or ${abscissaUnitTexts[unit]}; the resolution was not used.`,
    };
  }
  const resolutionCm = (value * unitLengthNm[unit] * middleCm ** 2) / 1e7;
  return {
    resolutionCm,
    note: `##RESOLUTION=${written} is a wavelength width; at the middle of the spectrum (${shortNumber(middleCm)} cm⁻¹) it is ${shortNumber(resolutionCm)} cm⁻¹.`,
  };
}
