/** Fixed decimals, for positions whose precision is a number of decimal places. */
export function fixed(value: number, decimals: number): string {
  return Number.isFinite(value) ? value.toFixed(decimals) : "";
}

/** Significant figures in plain or exponent form, for intensities and populations. */
export function significant(value: number | null, digits: number): string {
  if (value === null || !Number.isFinite(value)) return "";
  if (value === 0) return "0";
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e5) return Number(value.toPrecision(digits)).toString();
  return value.toExponential(digits - 1);
}

/** A signed number for residual columns: "+0.0012", "−0.00034" (true minus sign). */
export function signedSignificant(value: number, digits: number): string {
  const text = significant(Math.abs(value), digits);
  return (value < 0 ? "−" : "+") + text;
}

/**
 * Decimal places of a ± printed with two significant digits (negative: tens, hundreds), taken
 * from the ± as rounded, so 0.0996 gives "0.10" and not "0.100". Two digits: a ± of 0.14 is
 * worth keeping apart from 0.10 on a bench sheet, and more than two claim what no ± knows
 * (common practice, no source).
 */
export function uncertaintyDecimals(sigma: number): number {
  if (!(sigma > 0) || !Number.isFinite(sigma)) return 4;
  const first = 1 - Math.floor(Math.log10(sigma));
  const rounded = roundTo(sigma, first);
  return 1 - Math.floor(Math.log10(rounded));
}

/** value rounded to `decimals` places; negative decimals round to tens, hundreds, … */
function roundTo(value: number, decimals: number): number {
  if (decimals >= 0) return Number(value.toFixed(decimals));
  const step = 10 ** -decimals;
  return Math.round(value / step) * step;
}

/** Text of a value at `decimals` places (negative: rounded to tens, … and printed without decimals). */
export function atDecimals(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return "";
  return decimals >= 0 ? value.toFixed(decimals) : roundTo(value, decimals).toFixed(0);
}

/**
 * A position and its ±, rounded together: the ± to two significant digits, the position to the
 * same decimal place ("3072.3 ± 2.4", "11336 ± 90", "2143.27139 ± 0.00010"). Every printed
 * position of the atlas goes through here (tables, pages, sheets, find, CSV).
 */
export function positionWithUncertainty(value: number, sigma: number): { value: string; sigma: string; decimals: number } {
  const decimals = uncertaintyDecimals(sigma);
  return { value: atDecimals(value, decimals), sigma: sigma > 0 && Number.isFinite(sigma) ? atDecimals(sigma, decimals) : "", decimals };
}

/** The same rounding as a number, for the JSON documents: the digits the ± supports and no more. */
export function roundedToUncertainty(value: number, sigma: number): number {
  return roundTo(value, uncertaintyDecimals(sigma));
}

/** The ± of a wavelength in µm from the ± of its wavenumber: |dλ| = 10⁴ σ / ν̃². */
export function wavelengthSigmaUm(wavenumberCm: number, sigmaCm: number): number {
  return (1e4 * sigmaCm) / (wavenumberCm * wavenumberCm);
}
