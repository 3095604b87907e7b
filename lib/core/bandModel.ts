import { airRefractiveIndexEdlen } from "./airWavelength.ts";
import { checkTemperature } from "./band.ts";
import { CoreInputError } from "./coreInputError.ts";
import { hermanWallisFactor } from "./hermanWallis.ts";
import { hoenlLondon, runningIndex } from "./hoenlLondon.ts";
import { absoluteLineIntensity, intensityShape } from "./lineIntensity.ts";
import { jLimit } from "./partitionFunction.ts";
import { secondRadiationConstantCmK, speedOfLightMs } from "./physicalConstants.ts";
import { highestRisingJ, termFromExpansion } from "./termValues.ts";
import type { Band, BandIntensityData, BandLines, Branch, Line, TemperatureK } from "./types.ts";

export const defaultMinRelativeIntensity = 1e-4;

/**
 * One term of the position variance σ²(ν) = Σ [u·x'^l − w·x''^l]² σ²: a constant of standard
 * uncertainty σ that enters the upper level's c_l with weight u and the lower level's with w.
 */
export interface PositionUncertaintyTerm {
  l: number;
  upperWeight: number;
  lowerWeight: number;
  variance: number;
}

/**
 * Everything one Σ–Σ band needs, whatever kind of molecule it comes from: both levels'
 * rotational series E(J) = Σ c_l [J(J+1)]^l, the zero of lower-state energy, the constants'
 * uncertainties, Q(T), the nuclear-spin weight of each lower level and the intensity data.
 * The diatomic path builds it from a Dunham table, the linear-molecule path from per-state
 * G, B, D, H; `bandLinesFromModel` then computes the lines one way for both.
 */
export interface BandModel {
  species: string;
  band: Band;
  lower: Float64Array;
  upper: Float64Array;
  /** Energy of the lowest level of the molecule, the zero of `lowerStateEnergy`, cm⁻¹. */
  zeroEnergy: number;
  uncertaintyTerms: PositionUncertaintyTerm[];
  partitionFunction: number;
  /** Statistical weight of lower level J'' (0: the level does not exist and has no lines). */
  lowerWeight: (jLower: number) => number;
  intensity: BandIntensityData | null;
  abundance: number;
}

export interface ModelLineOptions {
  temperatureK: TemperatureK;
  /** Lines weaker than this fraction of the band's strongest line are left out (default 1e-4). */
  minRelative?: number;
}

function uncertaintyFunction(terms: readonly PositionUncertaintyTerm[]) {
  const used = terms.filter((t) => t.variance > 0);
  return (xUpper: number, xLower: number): number => {
    let variance = 0;
    for (const t of used) {
      const d = t.upperWeight * xUpper ** t.l - t.lowerWeight * xLower ** t.l;
      variance += d * d * t.variance;
    }
    return Math.sqrt(variance);
  };
}

/**
 * Every P and R line of one Σ–Σ band (ΔJ = ±1, no Q branch), from J'' = 0 until the lines fall
 * well below `minRelative` of the strongest, with Boltzmann populations, nuclear-spin weights,
 * Hönl–London, Herman–Wallis and stimulated-emission factors. The branches are not assumed to be
 * monotonic in J: lines are sorted by wavenumber at the end, so band heads come out right.
 */
export function bandLinesFromModel(model: BandModel, options: ModelLineOptions): BandLines {
  const { temperatureK } = options;
  checkTemperature(temperatureK);
  const minRelative = options.minRelative ?? defaultMinRelativeIntensity;
  if (!(minRelative >= 0 && minRelative < 1)) {
    throw new CoreInputError(`minimum relative intensity ${minRelative} must be at least 0 and below 1`);
  }
  const q = model.partitionFunction;
  const c2OverT = secondRadiationConstantCmK / temperatureK;
  const { lower, upper } = model;
  const jTopLower = highestRisingJ(lower, jLimit);
  const jTopUpper = highestRisingJ(upper, jLimit);
  const hw = model.intensity?.hermanWallis ?? null;
  const uncertaintyOf = uncertaintyFunction(model.uncertaintyTerms);

  const all: Array<Line & { shape: number }> = [];
  let strongestShape = 0;
  let truncatedBy: BandLines["truncatedBy"] = "j-limit";
  let jLowerMax = 0;

  const push = (branch: Branch, jLower: number, jUpper: number, lowerEnergy: number, population: number, weight: number) => {
    const wavenumber = termFromExpansion(upper, jUpper) - termFromExpansion(lower, jLower);
    const hermanWallis = hermanWallisFactor(hw, runningIndex(branch, jLower));
    const shape = weight * intensityShape(wavenumber, lowerEnergy, temperatureK, q, hoenlLondon(branch, jLower), hermanWallis);
    if (shape > strongestShape) strongestShape = shape;
    all.push({
      label: `${branch}(${jLower})`,
      branch,
      jLower,
      jUpper,
      wavenumber,
      wavenumberUncertainty: uncertaintyOf(jUpper * (jUpper + 1), jLower * (jLower + 1)),
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
    const weight = model.lowerWeight(jLower);
    // A level of weight 0 does not exist (e.g. odd J in the ground state of 12C16O2): no lines.
    if (weight === 0) continue;
    const lowerEnergy = termFromExpansion(lower, jLower) - model.zeroEnergy;
    const population = (weight * (2 * jLower + 1) * Math.exp(-c2OverT * lowerEnergy)) / q;
    const shapeR = push("R", jLower, jLower + 1, lowerEnergy, population, weight);
    const shapeP = jLower >= 1 ? push("P", jLower, jLower - 1, lowerEnergy, population, weight) : 0;
    // Past the population maximum every further J'' is weaker still; stop two decades below the
    // threshold so that a line near the threshold is never cut by the stopping rule itself.
    const cutoff = Math.max(minRelative, 1e-12) * 1e-2 * strongestShape;
    if (jLower > 2 && shapeR < cutoff && shapeP < cutoff) {
      truncatedBy = "intensity";
      break;
    }
  }

  const lines: Line[] = [];
  const dipole = model.intensity?.transitionDipoleDebye ?? null;
  for (const { shape, ...line } of all) {
    const relativeIntensity = strongestShape > 0 ? shape / strongestShape : 0;
    if (relativeIntensity < minRelative) continue;
    line.relativeIntensity = relativeIntensity;
    line.lineIntensity = dipole === null ? null : absoluteLineIntensity(shape, dipole, model.abundance);
    lines.push(line);
  }
  lines.sort((a, b) => a.wavenumber - b.wavenumber);

  return {
    species: model.species,
    band: model.band,
    temperatureK,
    bandOrigin: upper[0] - lower[0],
    partitionFunction: q,
    jLowerMax,
    truncatedBy,
    lines,
    strongestLineIntensity: dipole === null ? null : absoluteLineIntensity(strongestShape, dipole, model.abundance),
    strongestLinePerDebyeSquared: absoluteLineIntensity(strongestShape, 1, model.abundance),
    intensityOrigin: model.intensity?.origin ?? null,
  };
}
