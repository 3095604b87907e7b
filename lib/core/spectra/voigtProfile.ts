import { voigtFunction } from "./faddeeva.ts";
import type { WavenumberCm } from "../types.ts";

const sqrtLn2 = Math.sqrt(Math.LN2);
const sqrtLn2OverPi = Math.sqrt(Math.LN2 / Math.PI);

/**
 * Area-normalised Voigt profile in cm (per cm⁻¹) at a distance `offsetCm` from line centre:
 * g(Δν) = √(ln2/π)/γ_D · K(x, y), x = √ln2 Δν/γ_D, y = √ln2 γ_L/γ_D, with γ_D and γ_L the
 * Doppler and Lorentz HWHM (e.g. Armstrong, JQSRT 7, 61 (1967), eq. 4). A zero Doppler width
 * falls back to the Lorentzian, a zero Lorentz width to the Gaussian.
 */
export function voigtProfile(offsetCm: WavenumberCm, dopplerHwhmCm: WavenumberCm, lorentzHwhmCm: WavenumberCm): number {
  if (dopplerHwhmCm <= 0) return lorentzHwhmCm / Math.PI / (offsetCm * offsetCm + lorentzHwhmCm * lorentzHwhmCm);
  const scale = sqrtLn2 / dopplerHwhmCm;
  return (sqrtLn2OverPi / dopplerHwhmCm) * voigtFunction(offsetCm * scale, lorentzHwhmCm * scale);
}

/**
 * Voigt HWHM from the Doppler and Lorentz HWHM by the approximation of J. J. Olivero and
 * R. L. Longbothum, JQSRT 17, 233–236 (1977): f_V ≈ 0.5346 f_L + √(0.2166 f_L² + f_G²),
 * good to about 0.02 %. Used for grid steps and wing cut-offs, never for the profile itself.
 */
export function voigtHwhm(dopplerHwhmCm: WavenumberCm, lorentzHwhmCm: WavenumberCm): WavenumberCm {
  return 0.5346 * lorentzHwhmCm + Math.sqrt(0.2166 * lorentzHwhmCm * lorentzHwhmCm + dopplerHwhmCm * dopplerHwhmCm);
}
