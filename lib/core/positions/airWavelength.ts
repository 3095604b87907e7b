import { speedOfLightMs } from "../physicalConstants.ts";
import type { WavenumberCm } from "../types.ts";

// Refractive index of standard air (15 °C, 101 325 Pa, dry, 0.03 % CO2) by B. Edlén,
// "The refractive index of air", Metrologia 2, 71 (1966), eq. 1:
//   (n − 1)·10⁸ = 8342.13 + 2 406 030 / (130 − σ²) + 15 997 / (38.9 − σ²),  σ = vacuum wavenumber in µm⁻¹.
// Edlén fitted visible and near-UV data; in the infrared (σ < 1 µm⁻¹) the dispersion terms are
// nearly constant and the formula is used by extrapolation, good to a few parts in 10⁸ of n.
export function airRefractiveIndexEdlen(wavenumber: WavenumberCm): number {
  const sigmaPerUm = wavenumber * 1e-4;
  const s2 = sigmaPerUm * sigmaPerUm;
  return 1 + (8342.13 + 2406030 / (130 - s2) + 15997 / (38.9 - s2)) * 1e-8;
}

/** Vacuum wavelength in µm of a vacuum wavenumber in cm⁻¹. */
export function vacuumWavelengthUm(wavenumber: WavenumberCm): number {
  return 1e4 / wavenumber;
}

/** Wavelength in standard air, nm (λ_air = λ_vac / n). */
export function airWavelengthNm(wavenumber: WavenumberCm): number {
  return 1e7 / wavenumber / airRefractiveIndexEdlen(wavenumber);
}

/** Frequency in THz of a vacuum wavenumber in cm⁻¹ (ν = c·ν̃, c exact). */
export function frequencyThz(wavenumber: WavenumberCm): number {
  return wavenumber * speedOfLightMs * 100 * 1e-12;
}
