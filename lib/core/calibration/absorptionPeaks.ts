import { CoreInputError } from "../coreInputError.ts";
import { peakVertex } from "./peakVertex.ts";
import { absorbanceNoise } from "./spectrumNoise.ts";
import type { WavenumberCm } from "../types.ts";

/** One absorption peak of a measured spectrum. */
export interface AbsorptionPeak {
  wavenumberCm: WavenumberCm;
  /** Standard uncertainty of the position from the noise alone, cm⁻¹. */
  wavenumberUncertaintyCm: WavenumberCm;
  /** Height above the local baseline (its prominence), absorbance units. */
  heightAbsorbance: number;
  /** Full width at half height, cm⁻¹; null when a neighbour hides one side. */
  fwhmCm: WavenumberCm | null;
  /** Three or more equal samples at the top: the detector saw no light there. */
  flatTop: boolean;
  signalToNoise: number;
}

export interface PeakSearch {
  peaks: AbsorptionPeak[];
  noiseAbsorbance: number;
}

/** Longest walk (samples) from a top to its bases: far beyond any line, short of a whole survey spectrum. */
const maxWalk = 4000;

/**
 * Peaks of an absorbance spectrum sampled on ascending wavenumbers: every local maximum whose
 * prominence (height above the higher of the two lowest points reached before a higher sample,
 * the usual topographic definition) is at least minSignalToNoise times the noise. The top is
 * located by `peakVertex` on the points above half height, measured from a straight baseline
 * through the two bases, so a tilted baseline does not pull the top.
 */
export function absorptionPeaks(wavenumberCm: ArrayLike<number>, absorbance: ArrayLike<number>, minSignalToNoise = 5): PeakSearch {
  const n = absorbance.length;
  if (n !== wavenumberCm.length) throw new CoreInputError(`a spectrum needs as many wavenumbers as values (${wavenumberCm.length} and ${n})`);
  if (!(minSignalToNoise > 0)) throw new CoreInputError(`the signal-to-noise threshold ${minSignalToNoise} must be above 0`);
  const noise = absorbanceNoise(absorbance);
  const peaks: AbsorptionPeak[] = [];
  if (!(noise > 0)) return { peaks, noiseAbsorbance: noise };
  const x = wavenumberCm;
  const y = absorbance;
  let i = 1;
  while (i < n - 1) {
    if (!(y[i] > y[i - 1])) {
      i++;
      continue;
    }
    let plateauEnd = i;
    while (plateauEnd + 1 < n && y[plateauEnd + 1] === y[i]) plateauEnd++;
    if (plateauEnd + 1 >= n || !(y[plateauEnd + 1] < y[i])) {
      i = plateauEnd + 1;
      continue;
    }
    const top = (i + plateauEnd) >> 1;
    const flatTop = plateauEnd - i >= 2;
    const peakValue = y[i];
    let left = i;
    let leftMin = i;
    while (left > 0 && i - left < maxWalk && y[left - 1] <= peakValue) {
      left--;
      if (y[left] < y[leftMin]) leftMin = left;
    }
    let right = plateauEnd;
    let rightMin = plateauEnd;
    while (right < n - 1 && right - plateauEnd < maxWalk && y[right + 1] <= peakValue) {
      right++;
      if (y[right] < y[rightMin]) rightMin = right;
    }
    const base = Math.max(y[leftMin], y[rightMin]);
    const prominence = peakValue - base;
    i = plateauEnd + 1;
    if (prominence < minSignalToNoise * noise) continue;
    const slope = rightMin > leftMin ? (y[rightMin] - y[leftMin]) / (x[rightMin] - x[leftMin]) : 0;
    const baselineAt = (k: number) => y[leftMin] + slope * (x[k] - x[leftMin]);
    const height = (k: number) => y[k] - baselineAt(k);
    const topHeight = height(top);
    const half = topHeight / 2;
    let first = top;
    while (first - 1 > leftMin && height(first - 1) >= half) first--;
    let last = top;
    while (last + 1 < rightMin && height(last + 1) >= half) last++;
    const heights = new Float64Array(last - first + 3);
    const from = Math.max(first - 1, 0);
    for (let k = from; k <= Math.min(last + 1, n - 1); k++) heights[k - from] = height(k);
    const xs = Array.from({ length: heights.length }, (_, k) => x[Math.min(from + k, n - 1)]);
    const vertex = peakVertex(xs, heights, top - from, first - from, last - from, noise);
    peaks.push({
      wavenumberCm: vertex.wavenumberCm,
      wavenumberUncertaintyCm: vertex.wavenumberUncertaintyCm,
      heightAbsorbance: prominence,
      fwhmCm: halfWidth(x, height, first, last, leftMin, rightMin, half),
      flatTop,
      signalToNoise: prominence / noise,
    });
  }
  return { peaks, noiseAbsorbance: noise };
}

/** Width at half height by linear interpolation on each side; null when a side never falls to half before its base. */
function halfWidth(
  x: ArrayLike<number>,
  height: (k: number) => number,
  first: number,
  last: number,
  leftMin: number,
  rightMin: number,
  half: number,
): number | null {
  if (first - 1 < leftMin || last + 1 > rightMin) return null;
  const l0 = height(first - 1);
  const l1 = height(first);
  const r0 = height(last);
  const r1 = height(last + 1);
  if (!(l0 < half && r1 < half)) return null;
  const xl = x[first - 1] + ((half - l0) / (l1 - l0)) * (x[first] - x[first - 1]);
  const xr = x[last] + ((r0 - half) / (r0 - r1)) * (x[last + 1] - x[last]);
  return xr - xl;
}
