import { CoreInputError } from "../coreInputError.ts";

/** Mean and sample standard deviation of a series, with the ±3 SD limits drawn around the mean. */
export interface ControlLimits {
  mean: number;
  standardDeviation: number;
  lower: number;
  upper: number;
  count: number;
}

/** Fewest other runs a run is judged against: below this a standard deviation says little. */
export const minimumRunsForLimits = 4;

/** How many standard deviations from the mean a run may lie before it is flagged. */
export const controlLimitSigmas = 3;

export function controlLimits(values: readonly number[]): ControlLimits {
  const n = values.length;
  if (n < 2) throw new CoreInputError(`control limits need at least 2 values, got ${n}`);
  const mean = values.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (n - 1));
  return { mean, standardDeviation: sd, lower: mean - controlLimitSigmas * sd, upper: mean + controlLimitSigmas * sd, count: n };
}

/**
 * Which values break the trend: a value is flagged when it lies outside mean ± 3 SD of the
 * *other* values of the series (at least `minimumRunsForLimits` of them), so a wild run cannot
 * widen its own limits (a Shewhart-style individuals chart; common practice, no source). Returns
 * one flag per value, in order; with too few values nothing is flagged.
 */
export function trendBreaks(values: readonly number[]): boolean[] {
  return values.map((v, i) => {
    const others = values.filter((_, j) => j !== i);
    if (others.length < minimumRunsForLimits) return false;
    const limits = controlLimits(others);
    return v < limits.lower || v > limits.upper;
  });
}

/** The limits drawn on a chart: from the values not flagged (null when too few remain). */
export function drawnLimits(values: readonly number[], flags: readonly boolean[]): ControlLimits | null {
  const kept = values.filter((_, i) => !flags[i]);
  return kept.length >= minimumRunsForLimits ? controlLimits(kept) : null;
}
