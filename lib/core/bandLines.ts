import { airRefractiveIndexEdlen } from "./airWavelength.ts";
import { bandLabel, checkTemperature } from "./band.ts";
import { CoreInputError } from "./coreInputError.ts";
import { hermanWallisFactor } from "./hermanWallis.ts";
import { hoenlLondon, runningIndex } from "./hoenlLondon.ts";
import { absoluteLineIntensity, intensityShape } from "./lineIntensity.ts";
import { jLimit, partitionFunction as computePartitionFunction } from "./partitionFunction.ts";
import { secondRadiationConstantCmK, speedOfLightMs } from "./physicalConstants.ts";
import { highestRisingJ, highestRisingV, levelExpansion, termFromExpansion } from "./termValues.ts";
import { bandIntensityDataFor } from "./transitionDipole.ts";
import type { Band, BandLines, Branch, DunhamCoefficient, Line, SpeciesModel, TemperatureK } from "./types.ts";

export const defaultMinRelativeIntensity = 1e-4;

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
function makeUncertaintyFunction(dunham: DunhamCoefficient[], band: Band) {
  const terms = dunham
    .filter((c) => c.uncertaintyCm > 0)
    .map((c) => ({
      l: c.l,
      upper: Math.pow(band.vUpper + 0.5, c.k),
      lower: Math.pow(band.vLower + 0.5, c.k),
      variance: c.uncertaintyCm * c.uncertaintyCm,
    }));
  return (xUpper: number, xLower: number): number => {
    let variance = 0;
    for (const t of terms) {
      const d = t.upper * xUpper ** t.l - t.lower * xLower ** t.l;
      variance += d * d * t.variance;
    }
    return Math.sqrt(variance);
  };
}

/**
 * Every P and R line of one band v'←v'' of a ¹Σ⁺ diatomic (ΔJ = ±1, no Q branch), from J'' = 0
 * until the lines fall well below `minRelative` of the strongest, with Boltzmann populations,
 * Hönl–London, Herman–Wallis and stimulated-emission factors. The branches are not assumed to be
 * monotonic in J: lines are sorted by wavenumber at the end, so band heads come out right.
 */
export function bandLines(species: SpeciesModel, band: Band, options: BandLineOptions): BandLines {
  const { temperatureK } = options;
  checkTemperature(temperatureK);
  const minRelative = options.minRelative ?? defaultMinRelativeIntensity;
  if (!(minRelative >= 0 && minRelative < 1)) {
    throw new CoreInputError(`minimum relative intensity ${minRelative} must be at least 0 and below 1`);
  }
  const vTop = highestRisingV(species.dunham, band.vUpper + 1);
  if (vTop < band.vUpper) {
    throw new CoreInputError(
      `band ${bandLabel(band)} of ${species.label}: the constants give no bound level v = ${band.vUpper} (the vibrational series turns over at v = ${vTop})`,
    );
  }
  const q = options.partitionFunction ?? computePartitionFunction(species.dunham, temperatureK);
  const c2OverT = secondRadiationConstantCmK / temperatureK;
  const lowerLevel = levelExpansion(species.dunham, band.vLower);
  const upperLevel = levelExpansion(species.dunham, band.vUpper);
  const groundEnergy = termFromExpansion(levelExpansion(species.dunham, 0), 0);
  const jTopLower = highestRisingJ(lowerLevel, jLimit);
  const jTopUpper = highestRisingJ(upperLevel, jLimit);
  const intensityData = bandIntensityDataFor(species.intensities, band);
  const hw = intensityData?.hermanWallis ?? null;
  const uncertaintyOf = makeUncertaintyFunction(species.dunham, band);

  const all: Array<Line & { shape: number }> = [];
  let strongestShape = 0;
  let truncatedBy: BandLines["truncatedBy"] = "j-limit";
  let jLowerMax = 0;

  const push = (branch: Branch, jLower: number, jUpper: number, lowerEnergy: number, population: number) => {
    const xLower = jLower * (jLower + 1);
    const xUpper = jUpper * (jUpper + 1);
    const wavenumber = termFromExpansion(upperLevel, jUpper) - termFromExpansion(lowerLevel, jLower);
    const hermanWallis = hermanWallisFactor(hw, runningIndex(branch, jLower));
    const shape = intensityShape(wavenumber, lowerEnergy, temperatureK, q, hoenlLondon(branch, jLower), hermanWallis);
    if (shape > strongestShape) strongestShape = shape;
    all.push({
      label: `${branch}(${jLower})`,
      branch,
      jLower,
      jUpper,
      wavenumber,
      wavenumberUncertainty: uncertaintyOf(xUpper, xLower),
      wavelengthVacuumUm: 1e4 / wavenumber,
      wavelengthAirNm: 1e7 / wavenumber / airRefractiveIndexEdlen(wavenumber),
      frequencyThz: wavenumber * speedOfLightMs * 1e-10,
      lowerStateEnergy: lowerEnergy,
      relativeIntensity: 0,
      lineIntensity: null,
      populationFraction: population,
      shape,
    });
    return shape;
  };

  for (let jLower = 0; jLower <= jLimit; jLower++) {
    if (jLower > jTopLower || jLower + 1 > jTopUpper) {
      truncatedBy = "constants-turn-over";
      break;
    }
    jLowerMax = jLower;
    const lowerEnergy = termFromExpansion(lowerLevel, jLower) - groundEnergy;
    const population = ((2 * jLower + 1) * Math.exp(-c2OverT * lowerEnergy)) / q;
    const shapeR = push("R", jLower, jLower + 1, lowerEnergy, population);
    const shapeP = jLower >= 1 ? push("P", jLower, jLower - 1, lowerEnergy, population) : 0;
    // Past the population maximum every further J'' is weaker still; stop two decades below the
    // threshold so that a line near the threshold is never cut by the stopping rule itself.
    const cutoff = Math.max(minRelative, 1e-12) * 1e-2 * strongestShape;
    if (jLower > 2 && shapeR < cutoff && shapeP < cutoff) {
      truncatedBy = "intensity";
      break;
    }
  }

  const lines: Line[] = [];
  const dipole = intensityData?.transitionDipoleDebye ?? null;
  for (const { shape, ...line } of all) {
    const relativeIntensity = strongestShape > 0 ? shape / strongestShape : 0;
    if (relativeIntensity < minRelative) continue;
    line.relativeIntensity = relativeIntensity;
    line.lineIntensity = dipole === null ? null : absoluteLineIntensity(shape, dipole, species.abundance);
    lines.push(line);
  }
  lines.sort((a, b) => a.wavenumber - b.wavenumber);

  return {
    species: species.label,
    band,
    temperatureK,
    bandOrigin: upperLevel[0] - lowerLevel[0],
    partitionFunction: q,
    jLowerMax,
    truncatedBy,
    lines,
    strongestLineIntensity: dipole === null ? null : absoluteLineIntensity(strongestShape, dipole, species.abundance),
    strongestLinePerDebyeSquared: absoluteLineIntensity(strongestShape, 1, species.abundance),
    intensityOrigin: intensityData?.origin ?? null,
  };
}
