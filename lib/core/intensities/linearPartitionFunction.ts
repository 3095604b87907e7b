import { jLimit } from "../positions/termValues.ts";
import { linearStateExpansion } from "../positions/linearStateTerms.ts";
import type { LinearSpeciesData } from "../positions/linearTypes.ts";
import { nuclearSpinWeight } from "./nuclearSpinWeights.ts";
import { secondRadiationConstantCmK } from "../physicalConstants.ts";
import { highestRisingJ, termFromExpansion } from "../positions/termValues.ts";
import type { TemperatureK } from "../types.ts";
import { vibrationalPartitionFunction } from "./vibrationalPartitionFunction.ts";

const negligibleTerm = 1e-14;

/**
 * Rotational sum of the ground state, Q_rot = Σ_J g_ns(J) (2J+1) exp(−c2 [E(J) − E(0)] / T), over
 * the levels its constants give, with the nuclear-spin weights that the line intensities use
 * (so the populations sum to 1). For 12C16O2 only even J count, which halves the sum: the
 * symmetry number σ = 2 of the textbook formula kT/(σ hcB).
 */
export function linearRotationalPartitionFunction(linear: LinearSpeciesData, temperatureK: TemperatureK): number {
  const c2OverT = secondRadiationConstantCmK / temperatureK;
  const ground = linear.states[linear.groundStateIndex];
  const expansion = linearStateExpansion(ground);
  const zero = termFromExpansion(expansion, 0);
  const jTop = highestRisingJ(expansion, jLimit);
  let total = 0;
  let largest = 0;
  for (let j = 0; j <= jTop; j++) {
    const term = nuclearSpinWeight(linear.nuclearSpinWeights, ground.symmetry, j) * (2 * j + 1) * Math.exp(-c2OverT * (termFromExpansion(expansion, j) - zero));
    total += term;
    if (term > largest) largest = term;
    else if (term > 0 && term < negligibleTerm * largest) break;
  }
  return total;
}

/**
 * Q(T) of a linear molecule as the product Q_vib · Q_rot: the vibrational sum over all modes
 * with their degeneracies (harmonic levels at the cited fundamentals) times the ground state's
 * rotational sum. Rotation–vibration coupling is neglected, a fraction of a percent at room
 * temperature (Herzberg 1945, ch. V).
 */
export function linearPartitionFunction(linear: LinearSpeciesData, temperatureK: TemperatureK): number {
  return vibrationalPartitionFunction(linear.modes, temperatureK) * linearRotationalPartitionFunction(linear, temperatureK);
}
