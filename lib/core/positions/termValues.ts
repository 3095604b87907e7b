import type { DunhamCoefficient, EnergyCm } from "../types.ts";

/** The highest rotational and vibrational quantum numbers the model computes (lines, level sums). */
export const jLimit = 400;
export const vLimit = 60;

/**
 * Rotational expansion of one vibrational level: E(v,J) = Σ_l c_l(v) [J(J+1)]^l with
 * c_l(v) = Σ_k Y_kl (v+½)^k (Dunham 1932). c_0 is the vibrational term G(v) (without Y00),
 * c_1 is Bv, −c_2 is Dv.
 */
export function levelExpansion(dunham: DunhamCoefficient[], v: number): Float64Array {
  let lMax = 0;
  for (const c of dunham) lMax = Math.max(lMax, c.l);
  const coefficients = new Float64Array(lMax + 1);
  const vHalf = v + 0.5;
  for (const c of dunham) coefficients[c.l] += c.valueCm * Math.pow(vHalf, c.k);
  return coefficients;
}

/** Term value of the expanded level at J, cm⁻¹ (Horner in x = J(J+1)). */
export function termFromExpansion(coefficients: Float64Array, j: number): EnergyCm {
  const x = j * (j + 1);
  let energy = 0;
  for (let l = coefficients.length - 1; l >= 0; l--) energy = energy * x + coefficients[l];
  return energy;
}

/** E(v,J) in cm⁻¹ from a Dunham table, measured from the minimum of the potential less Y00. */
export function termValue(dunham: DunhamCoefficient[], v: number, j: number): EnergyCm {
  return termFromExpansion(levelExpansion(dunham, v), j);
}

/**
 * Highest J for which the expansion still rises with J: beyond it a truncated Dunham series
 * turns over (e.g. Bv·x − Dv·x² peaks at x = Bv/2Dv) and the levels are not physical.
 */
export function highestRisingJ(coefficients: Float64Array, jLimit: number): number {
  let previous = termFromExpansion(coefficients, 0);
  for (let j = 1; j <= jLimit; j++) {
    const energy = termFromExpansion(coefficients, j);
    if (!(energy > previous)) return j - 1;
    previous = energy;
  }
  return jLimit;
}

/** Highest v for which G(v) still rises: the anharmonic series turns over near dissociation. */
export function highestRisingV(dunham: DunhamCoefficient[], vLimit: number): number {
  let previous = termValue(dunham, 0, 0);
  for (let v = 1; v <= vLimit; v++) {
    const energy = termValue(dunham, v, 0);
    if (!(energy > previous)) return v - 1;
    previous = energy;
  }
  return vLimit;
}
