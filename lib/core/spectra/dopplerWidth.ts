import { CoreInputError } from "../coreInputError.ts";
import { atomicMassUnitKg, boltzmannJK, speedOfLightMs } from "../physicalConstants.ts";
import type { MassU, TemperatureK, WavenumberCm } from "../types.ts";

/**
 * Doppler (Gaussian) HWHM of a line at ν̃0 for molecules of mass m at temperature T:
 * γ_D = (ν̃0/c) √(2 ln2 k T / m) (W. Demtröder, Laser Spectroscopy, vol. 1, §3.2; from memory),
 * with CODATA 2018 k, c and m_u.
 */
export function dopplerHwhmCm(wavenumber: WavenumberCm, temperatureK: TemperatureK, molecularMassU: MassU): WavenumberCm {
  if (!(temperatureK > 0) || !(molecularMassU > 0)) {
    throw new CoreInputError(`Doppler width needs a temperature above 0 K and a positive mass (got ${temperatureK} K, ${molecularMassU} u)`);
  }
  return (wavenumber / speedOfLightMs) * Math.sqrt((2 * Math.LN2 * boltzmannJK * temperatureK) / (molecularMassU * atomicMassUnitKg));
}

/** Molecular mass in u as the sum of the atoms' masses (binding energy, ~1e-9 relative, neglected). */
export function molecularMassU(atomMassesU: readonly MassU[]): MassU {
  return atomMassesU.reduce((sum, m) => sum + m, 0);
}
