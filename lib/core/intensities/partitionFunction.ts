import { secondRadiationConstantCmK } from "../physicalConstants.ts";
import { highestRisingJ, highestRisingV, jLimit, levelExpansion, termFromExpansion, termValue, vLimit } from "../positions/termValues.ts";

import type { DunhamCoefficient, TemperatureK } from "../types.ts";

const negligibleTerm = 1e-14;

/**
 * Internal partition function Q(T) = Σ_v Σ_J (2J+1) exp(−c2 [E(v,J) − E(0,0)] / T), summed over
 * the levels the constants actually give (the same levels the line list uses), with the zero of
 * energy at the lowest level. Nuclear-spin degeneracy is a constant factor for a heteronuclear
 * diatomic and cancels in every ratio used here, so it is left out.
 */
export function partitionFunction(dunham: DunhamCoefficient[], temperatureK: TemperatureK): number {
  const c2OverT = secondRadiationConstantCmK / temperatureK;
  const groundEnergy = termValue(dunham, 0, 0);
  const vTop = highestRisingV(dunham, vLimit);
  let total = 0;
  for (let v = 0; v <= vTop; v++) {
    const expansion = levelExpansion(dunham, v);
    const jTop = highestRisingJ(expansion, jLimit);
    let levelSum = 0;
    let largest = 0;
    for (let j = 0; j <= jTop; j++) {
      const term = (2 * j + 1) * Math.exp(-c2OverT * (termFromExpansion(expansion, j) - groundEnergy));
      levelSum += term;
      if (term > largest) largest = term;
      else if (term < negligibleTerm * largest) break;
    }
    total += levelSum;
    if (levelSum < negligibleTerm * total) break;
  }
  return total;
}

// Mulholland's high-temperature expansion of the rigid-rotor sum:
// H. P. Mulholland, Proc. Cambridge Philos. Soc. 24, 280 (1928):
// Q_rot ≈ kT/hcB + 1/3 + (1/15)(hcB/kT) + (4/315)(hcB/kT)².
export function rigidRotorPartitionFunctionExpansion(bCm: number, temperatureK: TemperatureK): number {
  const y = (bCm * secondRadiationConstantCmK) / temperatureK;
  return 1 / y + 1 / 3 + y / 15 + (4 * y * y) / 315;
}
