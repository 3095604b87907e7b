import {
  parseLineLabel,
  type Band,
  type GasBroadening,
  type GasPressureShift,
  type MeasuredLineObservation,
  type ReferenceLine,
  type SpeciesModel,
} from "../core/index.ts";
import type { GivenConstant } from "./givenConstants.ts";
import type { IdentityFields, referenceLineSchema } from "./schema.ts";
import type { z } from "zod";

export interface Source {
  key: string;
  citation: string;
  url: string | null;
  doi: string | null;
}

export interface SpeciesInfo {
  model: SpeciesModel;
  spellings: string[];
  isReference: boolean;
  given: { sourceKey: string; form: "equilibrium" | "dunham" | "mass-independent" | "fit" | "states"; values: GivenConstant[] } | null;
}

export interface Molecule {
  id: string;
  file: string;
  name: string;
  formula: string;
  casNumber: string;
  aliases: string[];
  /** Known shortcomings of the cited constants, shown beside every prediction of this molecule. */
  limitations: string[];
  electronicState: string;
  atoms: string[];
  hazard: { ghsPictograms: string[]; sentences: string[] };
  sources: Source[];
  /** Reference species first, then the others in file order. */
  species: SpeciesInfo[];
  /** "linear": a linear polyatomic molecule whose species carry states and bands (model.linear). */
  structure: "diatomic" | "linear";
  /** Cited self and air broadening from the file; absent or null: none given (spectra use a flagged typical value). */
  broadening?: GasBroadening | null;
  /** Cited pressure shifts from the file; absent or null: none given (centres are zero-pressure positions). */
  pressureShift?: GasPressureShift | null;
}

type IdentityKeys =
  | "id"
  | "file"
  | "name"
  | "formula"
  | "casNumber"
  | "aliases"
  | "limitations"
  | "electronicState"
  | "atoms"
  | "hazard"
  | "sources"
  | "broadening"
  | "pressureShift";

/**
 * The fields every form of molecule file shares, built here once for both forms: identity,
 * hazard note, sources, and the gas's cited broadening and pressure shift.
 */
export function moleculeIdentity(file: IdentityFields, fileName: string): Pick<Molecule, IdentityKeys> {
  return {
    broadening: file.broadening ? gasBroadening(file.broadening) : null,
    pressureShift: file.pressureShift ? gasPressureShift(file.pressureShift) : null,
    id: file.id,
    file: fileName,
    name: file.name,
    formula: file.formula,
    casNumber: file.casNumber,
    aliases: file.aliases,
    limitations: file.limitations,
    electronicState: file.electronicState,
    atoms: file.atoms,
    hazard: file.hazard,
    sources: Object.entries(file.sources).map(([key, s]) => ({ key, citation: s.citation, url: s.url ?? null, doi: s.doi ?? null })),
  };
}

/** Cited self and air broadening of a file, J-dependent tables in increasing |m|. */
export function gasBroadening(block: NonNullable<IdentityFields["broadening"]>): GasBroadening {
  return { self: broadeningOf(block.self), air: broadeningOf(block.air) };
}

function broadeningOf(block: NonNullable<IdentityFields["broadening"]>["self"]): GasBroadening["self"] {
  const table = block.byAbsM ? [...block.byAbsM].sort((a, b) => a.absM - b.absM) : null;
  return { hwhmCmPerAtm: block.hwhmCmPerAtm, byAbsM: table, temperatureExponent: block.temperatureExponent, sourceKey: block.source, origin: "cited" };
}

/** Cited pressure shifts of a file; a perturber left out has none. */
export function gasPressureShift(block: NonNullable<IdentityFields["pressureShift"]>): GasPressureShift {
  const of = (c: (typeof block)["self"]) => (c ? { cmPerAtm: c.cmPerAtm, uncertaintyCmPerAtm: c.uncertaintyCmPerAtm, sourceKey: c.source } : null);
  return { self: of(block.self), air: of(block.air) };
}

type FileLine = z.infer<typeof referenceLineSchema>;

const standardAtmospherePa = 101325; // Pa per atm, by definition

/**
 * How far a certified source's lines may lie from their zero-pressure centres, cm⁻¹: none when its
 * values are zero-pressure values, else the cell pressure times the file's self shift plus its ±
 * (a bound, not applied: the standard's value stays as printed); null when the source is not a
 * certified standard, or its cell pressure has no cited shift to bound it with.
 */
export function certifiedAllowanceCm(fields: Pick<IdentityFields, "sources" | "pressureShift">, sourceKey: string): number | null {
  const marked = fields.sources[sourceKey]?.certifiedPositions;
  if (marked === undefined) return null;
  const pressurePa = marked === true ? 0 : marked.cellPressurePa;
  if (pressurePa === 0) return 0;
  const self = fields.pressureShift?.self;
  return self ? (pressurePa / standardAtmospherePa) * (Math.abs(self.cmPerAtm) + self.uncertaintyCmPerAtm) : null;
}

/** A measured line of a file as the species model keeps it; `allowanceCm` from certifiedAllowanceCm. */
export function referenceLineOf(line: FileLine, band: Band, sourceKey: string, allowanceCm: number | null = null): ReferenceLine {
  const u = line.uncertainty ?? null;
  return {
    band,
    label: line.label,
    wavenumber: line.wavenumber,
    uncertainty: u,
    sourceKey,
    heldOut: line.heldOut === true,
    // Certified only with a stated ±: a listed value without one cannot be a reference position.
    certifiedUncertainty: allowanceCm === null || u === null ? null : Math.hypot(u, allowanceCm),
  };
}

/** A measured line of a file as a fit sees it (a line without an uncertainty is refused before any fit runs). */
export function observationOf(line: FileLine, species: string, band: string, sourceKey: string): MeasuredLineObservation {
  const { jLower, jUpper } = parseLineLabel(line.label);
  return {
    species,
    jUpper,
    jLower,
    label: line.label,
    band,
    wavenumberCm: line.wavenumber,
    uncertaintyCm: line.uncertainty ?? 0,
    sourceKey,
    heldOut: line.heldOut === true,
  };
}
