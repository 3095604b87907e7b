import { bandLabel, sameBand } from "../positions/band.ts";
import { bandAccuracy } from "../positions/bandAccuracy.ts";
import type { BandModel, PositionUncertainty } from "./bandModel.ts";
import { certifiedPositions } from "../positions/certifiedPositions.ts";
import { cachedBandErrors, cachedUncertaintyFunction } from "../positions/positionUncertainty.ts";
import { CoreInputError } from "../coreInputError.ts";
import { linearPartitionFunction } from "../intensities/linearPartitionFunction.ts";
import { linearStateExpansion } from "../positions/linearStateTerms.ts";
import type { LinearSpeciesData, LinearState } from "../positions/linearTypes.ts";
import { nuclearSpinWeight } from "../intensities/nuclearSpinWeights.ts";
import type { Band, LinearSpeciesModel, TemperatureK } from "../types.ts";

/** c_l of each state constant (G, B, −D, H): l and the uncertainty; the sign does not matter for σ². */
function stateUncertainties(state: LinearState): Array<{ l: number; sigma: number }> {
  return [
    { l: 0, sigma: state.termEnergy.uncertaintyCm },
    { l: 1, sigma: state.b.uncertaintyCm },
    { l: 2, sigma: state.d.uncertaintyCm },
    { l: 3, sigma: state.h.uncertaintyCm },
  ];
}

/**
 * Position uncertainty of ν = E'(J') − E''(J'') with every state constant independent (the sources
 * give no correlations): one term and one row per constant. When upper and lower are the same
 * state (never for a real band) each constant still appears once, with both weights.
 */
function linearPositionUncertainty(upper: LinearState, lower: LinearState, upperIndex: number, lowerIndex: number): PositionUncertainty {
  const entries: Array<{ l: number; upperWeight: number; lowerWeight: number; sigma: number; id: string }> = [];
  for (const { l, sigma } of stateUncertainties(upper))
    entries.push({ l, upperWeight: 1, lowerWeight: upper === lower ? 1 : 0, sigma, id: `state ${upperIndex} constant ${l}` });
  if (lower !== upper)
    for (const { l, sigma } of stateUncertainties(lower)) entries.push({ l, upperWeight: 0, lowerWeight: 1, sigma, id: `state ${lowerIndex} constant ${l}` });
  const used = entries.filter((e) => e.sigma > 0);
  return {
    terms: used.map(({ l, upperWeight, lowerWeight }) => ({ l, upperWeight, lowerWeight })),
    rows: used.map((e, r) => used.map((_, i) => (i === r ? e.sigma : 0))),
    ids: used.map((e) => e.id),
  };
}

/** Position uncertainty from correlated error components over the states' coefficients (a fit's). */
function componentPositionUncertainty(
  components: NonNullable<LinearSpeciesData["positionErrors"]>,
  upperIndex: number,
  lowerIndex: number,
): PositionUncertainty {
  const keys: Array<{ stateIndex: number; l: number }> = [];
  for (const c of components)
    for (const d of c.deltas) if (!keys.some((k) => k.stateIndex === d.stateIndex && k.l === d.l)) keys.push({ stateIndex: d.stateIndex, l: d.l });
  return {
    terms: keys.map((k) => ({ l: k.l, upperWeight: k.stateIndex === upperIndex ? 1 : 0, lowerWeight: k.stateIndex === lowerIndex ? 1 : 0 })),
    rows: components.map((c) => keys.map((k) => c.deltas.filter((d) => d.stateIndex === k.stateIndex && d.l === k.l).reduce((sum, d) => sum + d.valueCm, 0))),
    // The components of one species' fit: the same index is the same source in every band.
    ids: components.map((_, i) => `fit component ${i}`),
  };
}

/** The band model of one Σ–Σ band of a linear molecule, from the two states' own constants. */
export function linearBandModel(species: LinearSpeciesModel, band: Band, options: { temperatureK: TemperatureK; partitionFunction?: number }): BandModel {
  const linear = species.linear;
  const entry = linear.bands.find((b) => sameBand(b.band, band));
  if (!entry) {
    throw new CoreInputError(
      `${species.label} has no band ${bandLabel(band)}; its file lists: ${linear.bands.map((b) => `${bandLabel(b.band)} (${b.name})`).join(", ")}`,
    );
  }
  const upper = linear.states[entry.upperStateIndex];
  const lower = linear.states[entry.lowerStateIndex];
  const ground = linear.states[linear.groundStateIndex];
  return {
    species: species.label,
    band: entry.band,
    lower: linearStateExpansion(lower),
    upper: linearStateExpansion(upper),
    zeroEnergy: ground.termEnergy.valueCm,
    ...cachedBandErrors(species, entry.band.label, () => {
      const uncertainty = linear.positionErrors
        ? componentPositionUncertainty(linear.positionErrors, entry.upperStateIndex, entry.lowerStateIndex)
        : linearPositionUncertainty(upper, lower, entry.upperStateIndex, entry.lowerStateIndex);
      return { uncertainty, accuracy: bandAccuracy(species, entry.band, cachedUncertaintyFunction(uncertainty)) };
    }),
    partitionFunction: options.partitionFunction ?? linearPartitionFunction(linear, options.temperatureK),
    lowerWeight: (j) => nuclearSpinWeight(linear.nuclearSpinWeights, lower.symmetry, j),
    intensity: species.intensities.find((d) => sameBand(d.band, entry.band)) ?? null,
    abundance: species.abundance,
    certified: certifiedPositions(species, entry.band),
  };
}
