import type { StateBand, WavenumberCm } from "../types.ts";

// Plain data for a linear polyatomic molecule's parallel (Σ–Σ) bands. Each vibrational state is
// its own rotational series E = G + B·x − D·x² + H·x³ (x = J(J+1)), the same per-level expansion
// the diatomic core builds from a Dunham table, so both go through one band computation.

/** Symmetry of a vibrational state: Σ+ for a molecule without a centre of symmetry, Σg+/Σu+ with one. */
export type LinearStateSymmetry = "Σ+" | "Σg+" | "Σu+";

/** A constant with its one-standard uncertainty (cm⁻¹; 0 where the source gives none). */
export interface ConstantWithUncertainty {
  valueCm: number;
  uncertaintyCm: number;
}

export interface LinearState {
  /** The state's vibrational label as the file gives it, e.g. "00011" or "0000000". */
  id: string;
  symmetry: LinearStateSymmetry;
  termEnergy: ConstantWithUncertainty;
  b: ConstantWithUncertainty;
  d: ConstantWithUncertainty;
  h: ConstantWithUncertainty;
  sourceKey: string;
}

/** One normal mode for the vibrational partition function; bending modes have degeneracy 2. */
export interface VibrationalMode {
  wavenumberCm: WavenumberCm;
  degeneracy: number;
}

/**
 * Nuclear-spin statistical weights of the even-J and odd-J levels of a Σg+ state (for Σu+ they
 * swap). 12C2H2: even 1, odd 3; 12C16O2: even 1, odd 0 (the odd levels do not exist).
 */
export interface NuclearSpinWeights {
  evenJ: number;
  oddJ: number;
}

export interface LinearBand {
  band: StateBand;
  upperStateIndex: number;
  lowerStateIndex: number;
  /** The name practitioners use, e.g. "ν3", "2ν3", "ν1+ν3". */
  name: string;
  kind: "fundamental" | "overtone" | "combination" | "hot";
  sourceKey: string;
}

export interface LinearSpeciesData {
  states: LinearState[];
  bands: LinearBand[];
  /** Index of the vibrational ground state (zero of energy) in `states`. */
  groundStateIndex: number;
  modes: VibrationalMode[];
  /** null: no alternation (no centre of symmetry). */
  nuclearSpinWeights: NuclearSpinWeights | null;
  /**
   * Independent position-error components over the states' coefficients c_l (a fit's covariance,
   * omitted terms); absent: each constant's own uncertainty, uncorrelated.
   */
  positionErrors?: Array<{ deltas: Array<{ stateIndex: number; l: number; valueCm: number }> }>;
}
