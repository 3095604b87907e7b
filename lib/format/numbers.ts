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
