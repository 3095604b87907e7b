import { nearbyLines, type NearbyLine } from "../core/spectra/nearbyLines.ts";
import type { DecodedLineIndex, IndexedLine } from "../shared/lineIndexCodec.ts";

/** First index whose wavenumber is ≥ value (the index is sorted by wavenumber). */
function lowerBound(values: Float64Array, value: number): number {
  let lo = 0;
  let hi = values.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (values[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The lines near a wavenumber, nearest first: a binary search picks a slightly wider slice and the
 * core's nearbyLines (the function behind `bandatlas find`) makes the decision and the order.
 */
export function searchWavenumber(index: DecodedLineIndex, wavenumber: number, windowCm: number, minRelative: number): Array<NearbyLine & { page: string }> {
  if (minRelative < index.minRelative)
    throw new RangeError(`the index holds lines down to ${index.minRelative} of their band's strongest; choose at least that`);
  const margin = windowCm * 1e-9 + 1e-9;
  const start = lowerBound(index.wavenumbers, wavenumber - windowCm - margin);
  const candidates: IndexedLine[] = [];
  for (let i = start; i < index.wavenumbers.length && index.wavenumbers[i] <= wavenumber + windowCm + margin; i++) candidates.push(index.line(i));
  return nearbyLines(candidates, wavenumber, windowCm, minRelative) as Array<NearbyLine & { page: string }>;
}
