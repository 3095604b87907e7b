// Plain data shared by the core, the atlas and every renderer. Units live in the type aliases.
import type { LinearSpeciesData } from "./positions/linearTypes.ts";

/** Wavenumber in cm⁻¹ (vacuum). */
export type WavenumberCm = number;
/** Energy expressed as a term value in cm⁻¹. */
export type EnergyCm = number;
/** Absolute temperature in K. */
export type TemperatureK = number;
/** Atomic or molecular mass in unified atomic mass units (u = Da). */
export type MassU = number;
/** Line intensity in cm/molecule (cm⁻¹ / (molecule cm⁻²)). */
export type LineIntensityCmPerMolecule = number;
/** Electric dipole moment in debye. */
export type DipoleDebye = number;

/** One Dunham coefficient Y_kl in E(v,J) = Σ Y_kl (v+½)^k [J(J+1)]^l. */
export interface DunhamCoefficient {
  k: number;
  l: number;
  valueCm: EnergyCm;
  /** One standard uncertainty in cm⁻¹; 0 where the source gives none. */
  uncertaintyCm: EnergyCm;
}

/** Handbook equilibrium constants (all cm⁻¹), each with an optional uncertainty. */
export interface EquilibriumConstants {
  omegaE: number;
  omegaExe?: number;
  omegaEye?: number;
  omegaEze?: number;
  bE: number;
  alphaE?: number;
  gammaE?: number;
  dE?: number;
  betaE?: number;
  hE?: number;
}
export type EquilibriumUncertainties = Partial<Record<keyof EquilibriumConstants, number>>;

/** A diatomic's band v'←v'' (v' = v'' only for pure-rotation measured lines). */
export interface VibrationalBand {
  vUpper: number;
  vLower: number;
  label?: undefined;
}

/** A linear molecule's band between two of its listed states, named "upper-lower" by their ids. */
export interface StateBand {
  label: string;
  upperStateIndex: number;
  lowerStateIndex: number;
  vUpper?: undefined;
  vLower?: undefined;
}

export type Band = VibrationalBand | StateBand;

export interface HermanWallisCoefficients {
  /** F(m) = 1 + a1·m + a2·m², m = J''+1 in R, −J'' in P. */
  a1: number;
  a2: number;
}

/** What the core needs to give a band absolute intensities. */
export interface BandIntensityData {
  band: Band;
  /** |⟨v'|μ|v''⟩| in debye for this species and band. */
  transitionDipoleDebye: DipoleDebye;
  transitionDipoleUncertaintyDebye: DipoleDebye;
  hermanWallis: HermanWallisCoefficients | null;
  /** How the dipole was obtained, shown beside every absolute intensity. */
  origin: "cited" | "from-band-strength" | "harmonic-hot-band" | "isotope-scaled";
  sourceKey: string;
}

export interface ReferenceLine {
  /** v' = v'' for a pure-rotation line (label R(J'') for J''+1 ← J''). */
  band: Band;
  label: string;
  wavenumber: WavenumberCm;
  uncertainty: WavenumberCm | null;
  sourceKey: string;
  /** Kept out of the fit of this molecule's constants and used only to test it. */
  heldOut: boolean;
  /**
   * Set when the file marks the line's source as a certified standard (`certifiedPositions`): the
   * line is then the reference position of its band's line, with this ± (the source's, widened by
   * what the source's cell pressure may move it); null for a line that only checks the model.
   */
  certifiedUncertainty: WavenumberCm | null;
}

/**
 * One independent source of line-position error, written as a change δY_kl of the Dunham
 * coefficients: it moves a line by Σ δY_kl [(v'+½)^k x'^l − (v''+½)^k x''^l], and independent
 * components add in quadrature. Correlated fit parameters become components through the
 * eigenvectors of their covariance; an omitted term is one component.
 */
export interface DunhamErrorComponent {
  kind: "constants" | "omitted-term" | "isotope-scaling";
  /**
   * Names the error source so that the same source is recognised in every species and band it
   * moves (an omitted term of the reference species moves its isotopologues' lines too): a
   * calibration against many lines keeps such a source shared instead of averaging it down.
   */
  id: string;
  deltas: Array<{ k: number; l: number; valueCm: number }>;
}

/** How well one band of one species is known, from its cited measured lines. */
export interface BandCheck {
  band: Band;
  lineCount: number;
  heldOutCount: number;
  /** Smallest and largest |m| measured (m = J''+1 in R, −J'' in P; J''+1 for pure rotation). */
  absMMin: number;
  absMMax: number;
  rmsResidualCm: number;
  maxAbsResidualCm: number;
  sourceKeys: string[];
  /** Running maximum of |residual| with |m|: at each measured |m|, the largest residual at or below it. */
  envelope: ResidualEnvelope;
}

/** Points (|m|, largest |residual| at that |m| or below), in increasing |m|. */
export type ResidualEnvelope = Array<{ absM: number; residualCm: number }>;

/** What a species' predictions were tested against: the basis of every band's accuracy status. */
export interface SpeciesValidation {
  checks: BandCheck[];
  /** True when the constants were fitted to, or compared with, measured lines of this molecule. */
  constantsTested: boolean;
  /** The residual envelope over every measured line of the molecule (any band, any species). */
  moleculeEnvelope: ResidualEnvelope;
}

/** A band's accuracy status, carried by every computed band. */
export interface BandAccuracy {
  status: "validated" | "contradicted" | "extrapolated" | "not-validated";
  check: BandCheck | null;
  /**
   * No line is given a smaller ± than the residuals measured lines show at its |m| or below (the
   * band's own lines when validated, else the molecule's): empty when nothing was measured.
   */
  floor: ResidualEnvelope;
  /** The measured line that misses furthest, when measured lines contradict the band; else null. */
  contradiction: { label: string; predictedMinusMeasuredCm: number } | null;
  /** Measured lines beyond 3× the model's own ± (before the floor): how many, and the furthest. */
  beyondModelSigma: { count: number; label: string; ratio: number } | null;
}

/** What every species carries, whatever its structure. */
interface SpeciesModelBase {
  /** Every atom's mass number, e.g. "12C16O", "1H35Cl". */
  label: string;
  massNumbers: number[];
  atomMassesU: MassU[];
  /** Product of the atoms' natural isotopic abundances (0–1). */
  abundance: number;
  constantsOrigin: "cited" | "isotope-scaled" | "fitted";
  constantsSourceKey: string;
  /** A second published set compared with the constants (its difference is part of every ±). */
  crossCheckSourceKey?: string;
  intensities: BandIntensityData[];
  referenceLines: ReferenceLine[];
  /** Residual checks against measured lines; absent: not validated. */
  validation?: SpeciesValidation;
  /** A reference-cell gas of its own (enriched): its strength is not tied to the natural gas's. */
  ownCells?: boolean;
}

/** One isotopologue of a ¹Σ⁺ diatomic: masses resolved, constants as one Y_kl table. */
export interface DiatomicSpeciesModel extends SpeciesModelBase {
  structure: "diatomic";
  reducedMassU: MassU;
  dunham: DunhamCoefficient[];
  /** Position error components; absent: each Dunham coefficient's own uncertainty, uncorrelated. */
  positionErrors?: DunhamErrorComponent[];
}

/** One isotopologue of a linear polyatomic molecule: its states and the Σ–Σ bands between them. */
export interface LinearSpeciesModel extends SpeciesModelBase {
  structure: "linear";
  linear: LinearSpeciesData;
}

/** One isotopologue, ready for the physics. */
export type SpeciesModel = DiatomicSpeciesModel | LinearSpeciesModel;

export type Branch = "P" | "R";

/** One predicted line. Field names follow the JSON contract of `bandatlas lines`. */
export interface Line {
  label: string;
  branch: Branch;
  jLower: number;
  jUpper: number;
  wavenumber: WavenumberCm;
  wavenumberUncertainty: WavenumberCm;
  wavelengthVacuumUm: number;
  wavelengthAirNm: number;
  frequencyThz: number;
  lowerStateEnergy: EnergyCm;
  relativeIntensity: number;
  lineIntensity: LineIntensityCmPerMolecule | null;
  populationFraction: number;
  /**
   * certified: the position and ± of a line a cited standard lists (the file marks its source
   * `certifiedPositions`), not the model's; validated: inside the measured |m| range of a validated band; contradicted: inside the measured
   * range of a band its measured lines contradict; extrapolated: outside it, or a band without
   * measured lines of its own.
   */
  positionStatus: "certified" | "validated" | "contradicted" | "extrapolated" | "not-validated";
  /** A certified line only: the model's own position, ± and status, the check of the standard's value. */
  model?: { wavenumber: WavenumberCm; wavenumberUncertainty: WavenumberCm; positionStatus: Exclude<Line["positionStatus"], "certified"> };
}

export interface BandLines {
  species: string;
  band: Band;
  temperatureK: TemperatureK;
  /** Band origin ν0 = E(v',0) − E(v'',0), cm⁻¹. */
  bandOrigin: WavenumberCm;
  partitionFunction: number;
  /** Highest J'' reached, and why the list stops there. */
  jLowerMax: number;
  truncatedBy: "intensity" | "constants-turn-over" | "j-limit";
  /** Lines above the relative-intensity threshold, sorted by wavenumber. */
  lines: Line[];
  /** Strongest line intensity of the band in cm/molecule, or null without dipole data. */
  strongestLineIntensity: LineIntensityCmPerMolecule | null;
  /** Strongest line intensity for a transition dipole of 1 D, cm/molecule/D², always known. */
  strongestLinePerDebyeSquared: number;
  intensityOrigin: BandIntensityData["origin"] | null;
  accuracy: BandAccuracy;
}
