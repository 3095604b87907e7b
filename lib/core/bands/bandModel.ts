import { airRefractiveIndexEdlen } from "../positions/airWavelength.ts";
import { cachedFloor, cachedUncertaintyFunction, type PositionUncertainty } from "../positions/positionUncertainty.ts";
import { checkTemperature } from "../positions/band.ts";
import type { CertifiedPositions } from "../positions/certifiedPositions.ts";
import { CoreInputError } from "../coreInputError.ts";
import { hermanWallisFactor } from "../intensities/hermanWallis.ts";
import { hoenlLondon } from "../intensities/hoenlLondon.ts";
import { runningIndex } from "../positions/band.ts";
import { absoluteLineIntensity, intensityShapeFromBoltzmann } from "../intensities/lineIntensity.ts";
import { jLimit } from "../positions/termValues.ts";
import { secondRadiationConstantCmK, speedOfLightMs } from "../physicalConstants.ts";
import { termFromExpansion } from "../positions/termValues.ts";
import type { Band, BandAccuracy, BandIntensityData, BandLines, Branch, Line, TemperatureK } from "../types.ts";

export const defaultMinRelativeIntensity = 1e-4;

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
  uncertainty: PositionUncertainty;
  accuracy: BandAccuracy;
  partitionFunction: number;
  /** Statistical weight of lower level J'' (0: the level does not exist and has no lines). */
  lowerWeight: (jLower: number) => number;
  intensity: BandIntensityData | null;
  abundance: number;
  /** Lines whose position and ± a cited standard certifies (by label): they replace the model's. */
  certified: CertifiedPositions;
}

export interface ModelLineOptions {
  temperatureK: TemperatureK;
  /** Lines weaker than this fraction of the band's strongest line are left out (default 1e-4). */
  minRelative?: number;
}

const scratchCapacity = 2 * (jLimit + 2);
// Line labels are the same strings for every band: made once instead of once per line.
const labelsR = Array.from({ length: jLimit + 2 }, (_, j) => `R(${j})`);
const labelsP = Array.from({ length: jLimit + 2 }, (_, j) => `P(${j})`);
const scratch = {
  wavenumbers: new Float64Array(scratchCapacity),
  shapes: new Float64Array(scratchCapacity),
  lowerEnergies: new Float64Array(scratchCapacity),
  populations: new Float64Array(scratchCapacity),
  jLowers: new Int32Array(scratchCapacity),
  isR: new Uint8Array(scratchCapacity),
};

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
  const hw = model.intensity?.hermanWallis ?? null;
  const propagated = cachedUncertaintyFunction(model.uncertainty);
  const { accuracy } = model;
  const floorByAbsM = cachedFloor(accuracy);
  const uncertaintyOf = (xUpper: number, xLower: number, absM: number) => Math.max(propagated(xUpper, xLower), floorByAbsM[absM]);
  const check = accuracy.check;
  const statusOf = (branch: Branch, jLower: number): Exclude<Line["positionStatus"], "certified"> => {
    if (accuracy.status !== "validated" && accuracy.status !== "contradicted") return accuracy.status;
    const absM = Math.abs(runningIndex(branch, jLower));
    return absM >= check!.absMMin && absM <= check!.absMMax ? accuracy.status : "extrapolated";
  };

  // The scan stores plain numbers in scratch arrays; Line objects are made once, only for the
  // lines kept. The arrays are reused between calls (nothing here is re-entrant or asynchronous).
  const { wavenumbers, shapes, lowerEnergies, populations, jLowers, isR } = scratch;
  let count = 0;
  let strongestShape = 0;
  let truncatedBy: BandLines["truncatedBy"] = "j-limit";
  let jLowerMax = 0;

  const push = (branch: Branch, jLower: number, wavenumber: number, lowerEnergy: number, boltzmann: number, population: number, weight: number) => {
    const hermanWallis = hermanWallisFactor(hw, runningIndex(branch, jLower));
    const shape = weight * intensityShapeFromBoltzmann(wavenumber, boltzmann, c2OverT, q, hoenlLondon(branch, jLower), hermanWallis);
    if (shape > strongestShape) strongestShape = shape;
    wavenumbers[count] = wavenumber;
    shapes[count] = shape;
    lowerEnergies[count] = lowerEnergy;
    populations[count] = population;
    jLowers[count] = jLower;
    isR[count] = branch === "R" ? 1 : 0;
    count++;
    return shape;
  };

  // Term values roll along J: E''(J''), E'(J''−1), E'(J''), E'(J''+1). A level whose energy stops
  // rising with J is where the truncated expansion turns over; the list ends there.
  let lowerPrevious = -Infinity;
  let upperPrevious = NaN;
  let upperCurrent = termFromExpansion(upper, 0);
  for (let jLower = 0; jLower <= jLimit; jLower++) {
    const lowerTerm = termFromExpansion(lower, jLower);
    const upperNext = termFromExpansion(upper, jLower + 1);
    if (!(lowerTerm > lowerPrevious) || !(upperNext > upperCurrent)) {
      truncatedBy = "constants-turn-over";
      break;
    }
    lowerPrevious = lowerTerm;
    jLowerMax = jLower;
    const weight = model.lowerWeight(jLower);
    // A level of weight 0 does not exist (e.g. odd J in the ground state of 12C16O2): no lines.
    if (weight !== 0) {
      const lowerEnergy = lowerTerm - model.zeroEnergy;
      const boltzmann = Math.exp(-c2OverT * lowerEnergy);
      const population = (weight * (2 * jLower + 1) * boltzmann) / q;
      const shapeR = push("R", jLower, upperNext - lowerTerm, lowerEnergy, boltzmann, population, weight);
      const shapeP = jLower >= 1 ? push("P", jLower, upperPrevious - lowerTerm, lowerEnergy, boltzmann, population, weight) : 0;
      // Past the population maximum every further J'' is weaker still; stop two decades below the
      // threshold so that a line near the threshold is never cut by the stopping rule itself.
      const cutoff = Math.max(minRelative, 1e-12) * 1e-2 * strongestShape;
      if (jLower > 2 && shapeR < cutoff && shapeP < cutoff) {
        truncatedBy = "intensity";
        break;
      }
    }
    upperPrevious = upperCurrent;
    upperCurrent = upperNext;
  }

  // Order by wavenumber. Usually P descending then R ascending is already in order; a band head
  // breaks that, and then the indices are sorted (never assume the branches are monotonic).
  const order: number[] = [];
  for (let i = count - 1; i >= 0; i--) if (!isR[i]) order.push(i);
  for (let i = 0; i < count; i++) if (isR[i]) order.push(i);
  for (let i = 1; i < order.length; i++) {
    if (wavenumbers[order[i]] < wavenumbers[order[i - 1]]) {
      order.sort((a, b) => wavenumbers[a] - wavenumbers[b]);
      break;
    }
  }

  const lines: Line[] = [];
  const dipole = model.intensity?.transitionDipoleDebye ?? null;
  const toAbsolute = dipole === null ? 0 : absoluteLineIntensity(1, dipole, model.abundance);
  const keepAbove = minRelative * strongestShape;
  for (const i of order) {
    const shape = shapes[i];
    if (shape < keepAbove || !(strongestShape > 0)) continue;
    const modelWavenumber = wavenumbers[i];
    const jLower = jLowers[i];
    const branch: Branch = isR[i] ? "R" : "P";
    const label = isR[i] ? labelsR[jLower] : labelsP[jLower];
    // A certified line keeps the model's intensity but takes the standard's position and ±.
    const certified = model.certified.get(label);
    const wavenumber = certified?.wavenumber ?? modelWavenumber;
    const modelUncertainty = isR[i]
      ? uncertaintyOf((jLower + 1) * (jLower + 2), jLower * (jLower + 1), jLower + 1)
      : uncertaintyOf((jLower - 1) * jLower, jLower * (jLower + 1), jLower);
    const modelStatus = statusOf(branch, jLower);
    lines.push({
      label,
      branch,
      jLower,
      jUpper: isR[i] ? jLower + 1 : jLower - 1,
      wavenumber,
      wavenumberUncertainty: certified ? certified.uncertaintyCm : modelUncertainty,
      wavelengthVacuumUm: 1e4 / wavenumber,
      wavelengthAirNm: 1e7 / wavenumber / airRefractiveIndexEdlen(wavenumber),
      frequencyThz: wavenumber * speedOfLightMs * 1e-10,
      lowerStateEnergy: lowerEnergies[i],
      relativeIntensity: shape / strongestShape,
      lineIntensity: dipole === null ? null : toAbsolute * shape,
      populationFraction: populations[i],
      positionStatus: certified ? "certified" : modelStatus,
      ...(certified ? { model: { wavenumber: modelWavenumber, wavenumberUncertainty: modelUncertainty, positionStatus: modelStatus } } : {}),
    });
  }

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
    accuracy,
  };
}

export type { PositionUncertainty };
