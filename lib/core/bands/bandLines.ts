import { bandLabel, sameBand, vibrationalBand } from "../positions/band.ts";
import { bandAccuracy } from "../positions/bandAccuracy.ts";
import { bandLinesFromModel, type BandModel, type PositionUncertainty } from "./bandModel.ts";
import { certifiedPositions } from "../positions/certifiedPositions.ts";
import { componentsFromUncertainties } from "../positions/positionErrors.ts";
import { cachedBandErrors, cachedUncertaintyFunction } from "../positions/positionUncertainty.ts";
import { CoreInputError } from "../coreInputError.ts";
import { linearBandModel } from "./linearBandModel.ts";
import { partitionFunction as computePartitionFunction } from "../intensities/partitionFunction.ts";
import { highestRisingV, levelExpansion, termFromExpansion } from "../positions/termValues.ts";
import { bandIntensityDataFor } from "../intensities/transitionDipole.ts";
import type { Band, BandAccuracy, BandLines, DiatomicSpeciesModel, SpeciesModel, TemperatureK, VibrationalBand } from "../types.ts";

export interface BandLineOptions {
  temperatureK: TemperatureK;
  /** Lines weaker than this fraction of the band's strongest line are left out (default 1e-4). */
  minRelative?: number;
  /** Q(T) when the caller already has it for this species and temperature. */
  partitionFunction?: number;
}

/**
 * Position uncertainty of ν = E(v',J') − E(v'',J'') from the species' error components (a fit's
 * covariance, cited uncertainties, omitted terms, isotope scaling): one term per Dunham
 * coefficient named by any component, weighted (v+½)^k in each level; one row per component.
 */
export function dunhamPositionUncertainty(species: DiatomicSpeciesModel, band: VibrationalBand): PositionUncertainty {
  const components = species.positionErrors ?? componentsFromUncertainties(species.dunham);
  const keys: Array<{ k: number; l: number }> = [];
  for (const c of components) for (const d of c.deltas) if (!keys.some((key) => key.k === d.k && key.l === d.l)) keys.push({ k: d.k, l: d.l });
  return {
    terms: keys.map(({ k, l }) => ({ l, upperWeight: Math.pow(band.vUpper + 0.5, k), lowerWeight: Math.pow(band.vLower + 0.5, k) })),
    rows: components.map((c) => keys.map(({ k, l }) => c.deltas.filter((d) => d.k === k && d.l === l).reduce((s, d) => s + d.valueCm, 0))),
    ids: components.map((c) => c.id),
  };
}

/** A band's own σ and its accuracy, judged against that σ (contradicted or validated). */
function diatomicBandErrors(species: DiatomicSpeciesModel, band: VibrationalBand) {
  const uncertainty = dunhamPositionUncertainty(species, band);
  return { uncertainty, accuracy: bandAccuracy(species, band, cachedUncertaintyFunction(uncertainty)) };
}

/**
 * The accuracy of any band of a species with measured lines, built or not (a pure-rotation check
 * has no band of the atlas): judged against the model's own σ wherever the core can make it.
 */
export function checkedBandAccuracy(species: SpeciesModel, band: Band): BandAccuracy {
  if (species.structure === "diatomic") return diatomicBandErrors(species, vibrationalBand(band)).accuracy;
  const built = species.linear.bands.some((b) => sameBand(b.band, band));
  return built ? linearBandModel(species, band, { temperatureK: 296, partitionFunction: 1 }).accuracy : bandAccuracy(species, band);
}

/** The band model of a ¹Σ⁺ diatomic's band v'←v'': both levels expanded from the Dunham table. */
export function diatomicBandModel(species: DiatomicSpeciesModel, band: VibrationalBand, options: BandLineOptions): BandModel {
  const vTop = highestRisingV(species.dunham, band.vUpper + 1);
  if (vTop < band.vUpper) {
    throw new CoreInputError(
      `band ${bandLabel(band)} of ${species.label}: the constants give no bound level v = ${band.vUpper} (the vibrational series turns over at v = ${vTop})`,
    );
  }
  return {
    species: species.label,
    band,
    lower: levelExpansion(species.dunham, band.vLower),
    upper: levelExpansion(species.dunham, band.vUpper),
    zeroEnergy: termFromExpansion(levelExpansion(species.dunham, 0), 0),
    ...cachedBandErrors(species, bandLabel(band), () => diatomicBandErrors(species, band)),
    partitionFunction: options.partitionFunction ?? computePartitionFunction(species.dunham, options.temperatureK),
    // Nuclear-spin degeneracy of a heteronuclear diatomic is the same for every level and cancels.
    lowerWeight: () => 1,
    certified: certifiedPositions(species, band),
    intensity: bandIntensityDataFor(species.intensities, band),
    abundance: species.abundance,
  };
}

/**
 * Every P and R line of one band of a species: a ¹Σ⁺ diatomic's v'←v'' band, or one of the Σ–Σ
 * bands a linear molecule's file lists. Both are turned into one band model and computed by
 * `bandLinesFromModel`, so lines are sorted by wavenumber and band heads come out right.
 */
export function bandLines(species: SpeciesModel, band: Band, options: BandLineOptions): BandLines {
  const model = species.structure === "linear" ? linearBandModel(species, band, options) : diatomicBandModel(species, vibrationalBand(band), options);
  return bandLinesFromModel(model, options);
}
