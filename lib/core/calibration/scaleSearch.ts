import type { WavenumberCm } from "../types.ts";

/** How far off an instrument's wavenumber scale may be before the search gives up (issue-stated bounds). */
export interface ScaleSearchBounds {
  maxScalePpm: number;
  maxOffsetCm: WavenumberCm;
}

export const defaultScaleSearchBounds: ScaleSearchBounds = { maxScalePpm: 500, maxOffsetCm: 1 };

/** A trial correction true ≈ measured + k·(measured − pivot) + c, with the votes it gathered. */
export interface ScaleHypothesis {
  scale: number;
  offsetAtPivotCm: WavenumberCm;
  pivotCm: WavenumberCm;
  score: number;
}

export interface SearchPeak {
  wavenumberCm: WavenumberCm;
  weight: number;
}

export interface SearchReference {
  referenceCm: WavenumberCm;
  weight: number;
}

export interface ScaleSearchResult {
  best: ScaleHypothesis | null;
  /** The best hypothesis made only of peak–line pairs that `best` does not hold (its score counts those alone). */
  runnerUp: ScaleHypothesis | null;
}

/** The trial correction applied to a measured wavenumber. */
export function hypothesisWavenumber(h: ScaleHypothesis, measuredCm: WavenumberCm): WavenumberCm {
  return measuredCm + h.scale * (measuredCm - h.pivotCm) + h.offsetAtPivotCm;
}

/**
 * An exhaustive vote over the whole allowed (scale, offset) region, so the answer does not depend
 * on a first guess: every pair of a measured peak and a reference within reach defines, for each
 * trial scale k on a grid fine enough that k moves no peak by more than half a tolerance, one
 * offset c; the offset window of width `toleranceCm` holding the largest summed weight wins.
 * A pair's weight is the smaller of the peak's and the reference's (each relative to its own
 * strongest), so a strong peak on a weak reference — the other isotopologue, say — counts for
 * little (a generalized Hough transform; P. V. C. Hough, US patent 3,069,654 (1962); D. H.
 * Ballard, Pattern Recognition 13, 111 (1981)).
 */
export function searchScale(
  peaks: readonly SearchPeak[],
  references: readonly SearchReference[],
  toleranceCm: WavenumberCm,
  bounds: ScaleSearchBounds = defaultScaleSearchBounds,
): ScaleSearchResult {
  if (!peaks.length || !references.length) return { best: null, runnerUp: null };
  const maxScale = bounds.maxScalePpm * 1e-6;
  const refs = [...references].sort((a, b) => a.referenceCm - b.referenceCm);
  const pairsPeak: number[] = [];
  const pairsRef: number[] = [];
  const pairsWeight: number[] = [];
  for (const peak of peaks) {
    const reach = maxScale * peak.wavenumberCm + bounds.maxOffsetCm + toleranceCm;
    for (const ref of refs) {
      if (ref.referenceCm < peak.wavenumberCm - reach) continue;
      if (ref.referenceCm > peak.wavenumberCm + reach) break;
      pairsPeak.push(peak.wavenumberCm);
      pairsRef.push(ref.referenceCm);
      pairsWeight.push(Math.min(peak.weight, ref.weight));
    }
  }
  if (!pairsPeak.length) return { best: null, runnerUp: null };
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of pairsPeak) {
    if (p < lo) lo = p;
    if (p > hi) hi = p;
  }
  const pivot = (lo + hi) / 2;
  const halfSpan = Math.max((hi - lo) / 2, toleranceCm);
  const kStep = toleranceCm / (2 * halfSpan);
  const kCount = Math.ceil(maxScale / kStep);
  const offsetLimit = bounds.maxOffsetCm + maxScale * pivot;
  const scan = (weights: readonly number[]): ScaleHypothesis | null => {
    let best: ScaleHypothesis | null = null;
    const offsets = new Float64Array(pairsPeak.length);
    const order = new Uint32Array(pairsPeak.length);
    for (let s = -kCount; s <= kCount; s++) {
      const k = Math.max(-maxScale, Math.min(maxScale, s * kStep));
      for (let i = 0; i < offsets.length; i++) {
        offsets[i] = pairsRef[i] - pairsPeak[i] - k * (pairsPeak[i] - pivot);
        order[i] = i;
      }
      order.sort((a, b) => offsets[a] - offsets[b]);
      let start = 0;
      let sum = 0;
      for (let end = 0; end < order.length; end++) {
        sum += weights[order[end]];
        while (offsets[order[end]] - offsets[order[start]] > toleranceCm) sum -= weights[order[start++]];
        const c = (offsets[order[start]] + offsets[order[end]]) / 2;
        if (Math.abs(c) > offsetLimit + toleranceCm / 2) continue;
        if (best === null || sum > best.score + 1e-12) best = { scale: k, offsetAtPivotCm: c, pivotCm: pivot, score: sum };
      }
    }
    return best;
  };
  const best = scan(pairsWeight);
  if (!best) return { best: null, runnerUp: null };
  // The rival: the best hypothesis built only from pairs the winner does not hold. A hypothesis
  // that differs from the winner only where no line matched (or by a hair) holds the same
  // pairs and gathers nothing here; one that assigns the peaks to other lines gathers its own.
  const rivalWeights = pairsWeight.map((w, i) => {
    const offset = pairsRef[i] - pairsPeak[i] - best.scale * (pairsPeak[i] - pivot);
    return Math.abs(offset - best.offsetAtPivotCm) <= toleranceCm / 2 ? 0 : w;
  });
  const runnerUp = scan(rivalWeights);
  return { best, runnerUp };
}
