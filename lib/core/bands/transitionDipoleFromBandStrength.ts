import { bandLines } from "./bandLines.ts";
import { debyeEsuCm } from "../physicalConstants.ts";
import { intensityPrefactorCgs } from "../intensities/lineIntensity.ts";
import type { Band, SpeciesModel, TemperatureK } from "../types.ts";

/**
 * The band's |μ_v'v''| in debye from a cited integrated band intensity (cm/molecule, per molecule
 * of that species) at the temperature the source states: the band strength is the sum of the
 * line intensities, S_band = (8π³/3hc)|μ|² Σ shape, so |μ| follows from the same line model
 * that later predicts the lines (Herman–Wallis factor included when given).
 */
export function transitionDipoleFromBandStrength(
  species: SpeciesModel,
  band: Band,
  bandStrengthCmPerMolecule: number,
  temperatureK: TemperatureK,
  hermanWallis: SpeciesModel["intensities"][number]["hermanWallis"],
): number {
  const probe: SpeciesModel = {
    ...species,
    abundance: 1,
    intensities: [{ band, transitionDipoleDebye: 1, transitionDipoleUncertaintyDebye: 0, hermanWallis, origin: "cited", sourceKey: "" }],
  };
  const result = bandLines(probe, band, { temperatureK, minRelative: 0 });
  let sumPerDebyeSquared = 0;
  for (const line of result.lines) sumPerDebyeSquared += line.lineIntensity ?? 0;
  const perEsuSquared = sumPerDebyeSquared / (debyeEsuCm * debyeEsuCm) / intensityPrefactorCgs;
  return Math.sqrt(bandStrengthCmPerMolecule / (intensityPrefactorCgs * perEsuSquared)) / debyeEsuCm;
}
