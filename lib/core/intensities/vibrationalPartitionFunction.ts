import { secondRadiationConstantCmK } from "../physicalConstants.ts";
import type { VibrationalMode } from "../positions/linearTypes.ts";
import type { TemperatureK } from "../types.ts";

const negligibleTerm = 1e-16;
const maxQuanta = 2000;

/**
 * Harmonic vibrational partition function, closed form:
 * Q_vib = Π_i (1 − exp(−c2 ω_i / T))^(−d_i), zero of energy at the vibrational ground state
 * (G. Herzberg, Infrared and Raman Spectra of Polyatomic Molecules, 1945, ch. V; D. A. McQuarrie,
 * Statistical Mechanics, 1976, ch. 8). A mode of degeneracy d contributes its factor d times.
 */
export function harmonicVibrationalPartitionFunction(modes: readonly VibrationalMode[], temperatureK: TemperatureK): number {
  const c2OverT = secondRadiationConstantCmK / temperatureK;
  let q = 1;
  for (const mode of modes) q *= Math.pow(-Math.expm1(-c2OverT * mode.wavenumberCm), -mode.degeneracy);
  return q;
}

/**
 * The same quantity as a direct sum over the levels: a d-fold degenerate mode has
 * C(v+d−1, v) states with v quanta at energy v·ω. Summed level by level until the terms are
 * negligible; the product over modes is the sum over all combination levels.
 */
export function vibrationalPartitionFunction(modes: readonly VibrationalMode[], temperatureK: TemperatureK): number {
  const c2OverT = secondRadiationConstantCmK / temperatureK;
  let q = 1;
  for (const mode of modes) {
    const ratio = Math.exp(-c2OverT * mode.wavenumberCm);
    let degeneracy = 1;
    let boltzmann = 1;
    let sum = 0;
    for (let v = 0; v <= maxQuanta; v++) {
      if (v > 0) {
        degeneracy = (degeneracy * (v + mode.degeneracy - 1)) / v;
        boltzmann *= ratio;
      }
      const term = degeneracy * boltzmann;
      sum += term;
      if (v > 0 && term < negligibleTerm * sum) break;
    }
    q *= sum;
  }
  return q;
}
