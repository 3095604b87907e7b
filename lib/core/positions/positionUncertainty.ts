import { envelopeAt } from "./bandAccuracy.ts";
import { jLimit } from "./termValues.ts";
import type { BandAccuracy } from "../types.ts";

/**
 * Position uncertainty of every line of a band. Each term is a coefficient of the level
 * expansions, entering the upper level's c_l with weight u and the lower level's with w, so that a
 * line moves by g = u·x'^l − w·x''^l per unit of it. Each row is one independent error component
 * (a vector over the terms); σ²(ν) = Σ_rows (Σ_i row_i·g_i)². Uncorrelated constants give one row
 * per constant, correlated ones (a fit's covariance) the rows of its eigen-decomposition.
 */
export interface PositionUncertainty {
  terms: Array<{ l: number; upperWeight: number; lowerWeight: number }>;
  rows: number[][];
  /** The error source of each row (DunhamErrorComponent.id), so shared sources can be recognised. */
  ids: string[];
}

function uncertaintyFunction({ terms, rows }: PositionUncertainty) {
  // Each row moves a line by Σ_l a_l x'^l − Σ_l b_l x''^l: with v = (x'^0…x'^L, x''^0…x''^L) the
  // variance is vᵀMv, M = Σ_rows c cᵀ. M is made once per band, so a line costs (2L+2)² operations
  // however many error components there are (a fit's covariance, omitted terms, cross-checks).
  const lMax = terms.reduce((m, t) => Math.max(m, t.l), 0);
  const size = 2 * (lMax + 1);
  const m = new Float64Array(size * size);
  const c = new Float64Array(size);
  for (const row of rows) {
    c.fill(0);
    terms.forEach((t, i) => {
      c[t.l] += row[i] * t.upperWeight;
      c[lMax + 1 + t.l] -= row[i] * t.lowerWeight;
    });
    for (let a = 0; a < size; a++) {
      if (c[a] === 0) continue;
      for (let b = 0; b < size; b++) m[a * size + b] += c[a] * c[b];
    }
  }
  const v = new Float64Array(size);
  return (xUpper: number, xLower: number): number => {
    let powUpper = 1;
    let powLower = 1;
    for (let l = 0; l <= lMax; l++) {
      v[l] = powUpper;
      v[lMax + 1 + l] = powLower;
      powUpper *= xUpper;
      powLower *= xLower;
    }
    // M is symmetric: the upper triangle, off-diagonal terms twice.
    let variance = 0;
    for (let a = 0; a < size; a++) {
      const row = a * size;
      let sum = 0.5 * m[row + a] * v[a];
      for (let b = a + 1; b < size; b++) sum += m[row + b] * v[b];
      variance += 2 * v[a] * sum;
    }
    return Math.sqrt(Math.max(variance, 0));
  };
}

// Both depend only on the species and band, not on the temperature: made once per band (the
// atlas computes every band at several temperatures, and the CLI and benchmarks many times).
const uncertaintyFunctions = new WeakMap<PositionUncertainty, ReturnType<typeof uncertaintyFunction>>();
export function cachedUncertaintyFunction(u: PositionUncertainty) {
  let f = uncertaintyFunctions.get(u);
  if (!f) uncertaintyFunctions.set(u, (f = uncertaintyFunction(u)));
  return f;
}
const floors = new WeakMap<BandAccuracy, Float64Array>();
export function cachedFloor(accuracy: BandAccuracy): Float64Array {
  let floor = floors.get(accuracy);
  if (!floor) floors.set(accuracy, (floor = Float64Array.from({ length: jLimit + 3 }, (_, m) => envelopeAt(accuracy.floor, m))));
  return floor;
}

/** A band's position uncertainty and accuracy status: they depend on the species and band, not on T. */
export interface BandErrors {
  uncertainty: PositionUncertainty;
  accuracy: BandAccuracy;
}

const bandErrors = new WeakMap<object, Map<string, BandErrors>>();

/**
 * Made once per species and band and kept (the atlas computes every band at several temperatures,
 * and the CLI and benchmarks many times), for diatomic and linear species alike.
 */
/**
 * Drops a species' cached band errors: a build that is done with a molecule's pages releases
 * them, so its memory does not grow with the atlas (they are made again if asked for).
 */
export function forgetBandErrors(species: object): void {
  bandErrors.delete(species);
}

export function cachedBandErrors(species: object, bandKey: string, make: () => BandErrors): BandErrors {
  let byBand = bandErrors.get(species);
  if (!byBand) bandErrors.set(species, (byBand = new Map()));
  let errors = byBand.get(bandKey);
  if (!errors) byBand.set(bandKey, (errors = make()));
  return errors;
}
