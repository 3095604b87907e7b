import { isStateBand, sameBand, vibrationalBand } from "../positions/band.ts";
import type { Band, BandIntensityData, MassU, VibrationalBand } from "../types.ts";

// For a harmonic oscillator with a linear dipole function, |⟨v+1|μ|v⟩|² = (v+1)·|⟨1|μ|0⟩|²
// (Bernath, Spectra of Atoms and Molecules, ch. 7). Used for hot bands when only the
// fundamental's dipole is cited; the result is labelled "harmonic-hot-band" wherever shown.
/** |μ(v'←v'−1)|² / |μ(1←0)|² by the harmonic rule: v'. */
export function harmonicHotBandDipoleSquaredRatio(band: VibrationalBand): number {
  return band.vUpper;
}

export function bandIntensityDataFor(intensities: BandIntensityData[], band: Band): BandIntensityData | null {
  const cited = intensities.find((d) => sameBand(d.band, band));
  if (cited) return cited;
  // The harmonic rule is for a diatomic's hot bands only; a linear molecule's band needs its own data.
  if (isStateBand(band) || band.vUpper - band.vLower !== 1) return null;
  const fundamental = intensities.find((d) => d.band.vUpper === 1 && d.band.vLower === 0);
  if (!fundamental) return null;
  const scale = Math.sqrt(harmonicHotBandDipoleSquaredRatio(band));
  return {
    ...fundamental,
    band,
    transitionDipoleDebye: fundamental.transitionDipoleDebye * scale,
    transitionDipoleUncertaintyDebye: fundamental.transitionDipoleUncertaintyDebye * scale,
    origin: "harmonic-hot-band",
  };
}

// Isotopologue transition dipole, first order in the dipole derivative: for a Δv = n band
// |μ|² ∝ (ħ/2μω)^n ∝ μ_red^(−n/2), since ω ∝ μ_red^(−1/2). Mechanical anharmonicity is neglected,
// so the result is labelled "isotope-scaled" and a species' own cited value wins.
export function scaleTransitionDipoleToIsotopologue(data: BandIntensityData, referenceReducedMassU: MassU, targetReducedMassU: MassU): BandIntensityData {
  const band = vibrationalBand(data.band);
  const deltaV = band.vUpper - band.vLower;
  const factor = Math.pow(referenceReducedMassU / targetReducedMassU, deltaV / 4);
  return {
    ...data,
    transitionDipoleDebye: data.transitionDipoleDebye * factor,
    transitionDipoleUncertaintyDebye: data.transitionDipoleUncertaintyDebye * factor,
    origin: "isotope-scaled",
  };
}
