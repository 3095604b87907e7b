/**
 * Instruments sample on an even grid but some exports print x with too few decimals
 * (2650.125 written as 2650.12): the printed values then jitter by up to half the last digit,
 * which moves a fitted peak top by a sizeable part of that. When every printed x lies within its
 * own rounding of the even grid from the first to the last value, that grid is what the
 * instrument measured, and it is used (with a note saying so).
 */
export function regularizedAbscissa(x: Float64Array, decimals: number): { x: Float64Array; note: string } | null {
  const n = x.length;
  if (n < 3) return null;
  const step = (x[n - 1] - x[0]) / (n - 1);
  const rounding = 0.5 * 10 ** -decimals;
  let largest = 0;
  for (let i = 0; i < n; i++) largest = Math.max(largest, Math.abs(x[i] - (x[0] + i * step)));
  const tiny = 1e-9 * Math.max(Math.abs(x[0]), Math.abs(x[n - 1]));
  if (largest <= tiny || largest > rounding + tiny) return null;
  const even = Float64Array.from({ length: n }, (_, i) => x[0] + i * step);
  return {
    x: even,
    note: `The x values are printed to ${decimals} decimal${decimals === 1 ? "" : "s"} and differ from an even grid of step ${Math.abs(step).toPrecision(6)} by at most ${largest.toPrecision(2)} (within their rounding): the even grid is used.`,
  };
}
