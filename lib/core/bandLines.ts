import { bandLabel } from "./band.ts";
import { bandLinesFromModel, type BandModel, type PositionUncertaintyTerm } from "./bandModel.ts";
import { CoreInputError } from "./coreInputError.ts";
import { linearBandModel } from "./linearBandModel.ts";
import { partitionFunction as computePartitionFunction } from "./partitionFunction.ts";
import { highestRisingV, levelExpansion, termFromExpansion } from "./termValues.ts";
import { bandIntensityDataFor } from "./transitionDipole.ts";
import type { Band, BandLines, DunhamCoefficient, SpeciesModel, TemperatureK } from "./types.ts";

export interface BandLineOptions {
  temperatureK: TemperatureK;
  /** Lines weaker than this fraction of the band's strongest line are left out (default 1e-4). */
  minRelative?: number;
  /** Q(T) when the caller already has it for this species and temperature. */
  partitionFunction?: number;
}

/**
 * Position uncertainty of ν = E(v',J') − E(v'',J'') from the constants' standard uncertainties,
 * σ²(ν) = Σ_kl [(v'+½)^k x'^l − (v''+½)^k x''^l]² σ²(Y_kl) (first-order propagation; the sources
 * give no correlations, so none are assumed).
 */
function dunhamUncertaintyTerms(dunham: DunhamCoefficient[], band: Band): PositionUncertaintyTerm[] {
  return dunham
    .filter((c) => c.uncertaintyCm > 0)
    .map((c) => ({
      l: c.l,
      upperWeight: Math.pow(band.vUpper + 0.5, c.k),
      lowerWeight: Math.pow(band.vLower + 0.5, c.k),
      variance: c.uncertaintyCm * c.uncertaintyCm,
    }));
}

/** The band model of a ¹Σ⁺ diatomic's band v'←v'': both levels expanded from the Dunham table. */
export function diatomicBandModel(species: SpeciesModel, band: Band, options: BandLineOptions): BandModel {
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
    uncertaintyTerms: dunhamUncertaintyTerms(species.dunham, band),
    partitionFunction: options.partitionFunction ?? computePartitionFunction(species.dunham, options.temperatureK),
    // Nuclear-spin degeneracy of a heteronuclear diatomic is the same for every level and cancels.
    lowerWeight: () => 1,
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
  const model = species.linear ? linearBandModel(species, band, options) : diatomicBandModel(species, band, options);
  return bandLinesFromModel(model, options);
}
