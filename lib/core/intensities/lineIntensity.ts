import { debyeEsuCm, planckErgS, speedOfLightCmS } from "../physicalConstants.ts";
import type { DipoleDebye, WavenumberCm } from "../types.ts";

// Line intensity of an electric-dipole transition in cm/molecule (P. F. Bernath, Spectra of Atoms
// and Molecules, Oxford University Press, ch. 5; Herzberg 1950, ch. IV):
//   S = (8π³ / 3hc) · ν̃ · x_iso · exp(−c2 E''/T) / Q(T) · [1 − exp(−c2 ν̃/T)] · |μ_v'v''|² · S_HL · F_HW
// in cgs units (μ in esu cm), with S_HL the Hönl–London factor and F_HW the Herman–Wallis factor.
// The lower level's degeneracy 2J''+1 cancels against the Hönl–London normalisation.
export const intensityPrefactorCgs = (8 * Math.PI ** 3) / (3 * planckErgS * speedOfLightCmS);

/** The part of the intensity that does not depend on the dipole, ν̃·e^(−c2E''/T)·(1−e^(−c2ν̃/T))·S_HL·F/Q, with the
 * Boltzmann factor e^(−c2E''/T) already computed (it is shared by P(J'') and R(J'')). */
export function intensityShapeFromBoltzmann(
  wavenumber: WavenumberCm,
  boltzmannFactor: number,
  c2OverT: number,
  partitionFunction: number,
  hoenlLondonFactor: number,
  hermanWallisFactor: number,
): number {
  return (wavenumber * boltzmannFactor * -Math.expm1(-c2OverT * wavenumber) * hoenlLondonFactor * hermanWallisFactor) / partitionFunction;
}

/** Converts the dipole-free shape to cm/molecule for a species of isotopic abundance `abundance`. */
export function absoluteLineIntensity(shape: number, transitionDipoleDebye: DipoleDebye, abundance: number): number {
  const dipoleEsuCm = transitionDipoleDebye * debyeEsuCm;
  return intensityPrefactorCgs * dipoleEsuCm * dipoleEsuCm * abundance * shape;
}
