/**
 * The standard deviation of the noise in a sampled absorbance, robustly: white noise of σ gives
 * second differences of variance 6σ², and the median absolute deviation times 1.4826 estimates σ
 * of a normal distribution (F. R. Hampel, J. Am. Stat. Assoc. 69, 383 (1974)). Only the quieter
 * half of the points (absorbance below the median) is used, so absorption lines do not count as
 * noise. Correlated noise (apodized or zero-filled spectra) is underestimated by this; the
 * calibration fit scales its uncertainties by χ²/ν when the scatter shows it.
 */
export function absorbanceNoise(absorbance: ArrayLike<number>): number {
  const n = absorbance.length;
  if (n < 5) return 0;
  const sorted = Float64Array.from(absorbance).sort();
  const median = sorted[n >> 1];
  const diffs: number[] = [];
  let smallestStep = Infinity;
  for (let i = 1; i < n - 1; i++) {
    const step = Math.abs(absorbance[i] - absorbance[i - 1]);
    if (step > 0 && step < smallestStep) smallestStep = step;
    if (absorbance[i] <= median) diffs.push(Math.abs(absorbance[i - 1] - 2 * absorbance[i] + absorbance[i + 1]));
  }
  diffs.sort((a, b) => a - b);
  const mad = diffs.length ? diffs[diffs.length >> 1] : 0;
  const sigma = (1.4826 * mad) / Math.sqrt(6);
  // A file printed with few digits can show no noise at all: its rounding, step/√12, is the floor.
  const quantization = Number.isFinite(smallestStep) ? smallestStep / Math.sqrt(12) : 0;
  return Math.max(sigma, quantization);
}
