// Unit words as exporters write them in a CSV header or in JCAMP-DX ##XUNITS/##YUNITS.
import type { AbscissaUnit, OrdinateKind } from "./measuredSpectrum.ts";

function plain(text: string): string {
  return text.toLowerCase().replace(/⁻¹/g, "-1").replace(/μ/g, "µ").trim();
}

/** The x unit a header or XUNITS names, or undefined when it names none (e.g. a bare "Wavelength"). */
export function abscissaUnitFromWords(text: string): AbscissaUnit | undefined {
  const words = plain(text);
  if (/cm\s*-\s*1|cm\s*\^\s*\{?\s*-\s*1|1\s*\/\s*cm|wavenumber/.test(words)) return "cm-1";
  if (/µm|\bum\b|micron|micromet/.test(words)) return "um";
  if (/\bnm\b|nanomet/.test(words)) return "nm";
  return undefined;
}

/**
 * What a y header or YUNITS names, or undefined. A plain "T"/"transmittance" is returned as
 * transmittance; whether its values are fractions or percent is decided from the values.
 */
export function ordinateFromWords(text: string): OrdinateKind | undefined {
  const words = plain(text);
  if (/%\s*t\b|%\s*trans|percent\s*trans|^%$/.test(words)) return "percent-transmittance";
  if (/absorbance|^abs\b|^a$|^a\s*[([]/.test(words)) return "absorbance";
  if (/transmittance|transmission|^t$|^t\s*[([]/.test(words)) return "transmittance";
  return undefined;
}

/** How a unit is written in notes. */
export const abscissaUnitTexts: Record<AbscissaUnit, string> = { "cm-1": "cm⁻¹", um: "µm", nm: "nm" };
