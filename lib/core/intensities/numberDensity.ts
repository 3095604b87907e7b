import { CoreInputError } from "../coreInputError.ts";
import { boltzmannJK } from "../physicalConstants.ts";
import type { TemperatureK } from "../types.ts";

/** Molecules per cm³ of an ideal gas, n = p/(kT) (CODATA 2018 k, exact), times 1e-6 m³/cm³. */
export function numberDensityPerCm3(pressurePa: number, temperatureK: TemperatureK): number {
  if (!(pressurePa >= 0) || !Number.isFinite(pressurePa)) throw new CoreInputError(`pressure ${pressurePa} Pa is not possible: it must be a finite number ≥ 0`);
  if (!(temperatureK > 0)) throw new CoreInputError(`temperature ${temperatureK} K is not possible: it must be above 0 K`);
  return (pressurePa / (boltzmannJK * temperatureK)) * 1e-6;
}
