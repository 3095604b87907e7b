import {
  equilibriumToDunham,
  reducedMassU,
  scaleDunhamToIsotopologue,
  scaleTransitionDipoleToIsotopologue,
  transitionDipoleFromBandStrength,
  parseBand,
  sameBand,
  type BandIntensityData,
  type DunhamCoefficient,
  type EquilibriumConstants,
  type EquilibriumUncertainties,
  type GasBroadening,
  type SpeciesModel,
} from "../core/index.ts";
import { isotope } from "./isotopes.ts";
import type { Measured, MoleculeFile } from "./schema.ts";
import { speciesLabel, speciesSpellings } from "./speciesNames.ts";

export interface Source {
  key: string;
  citation: string;
  url: string | null;
  doi: string | null;
}

/** A constant as the file gave it, for the pages that show "the constants used". */
export interface GivenConstant {
  name: string;
  valueCm: number;
  /** The cited uncertainty, or half a unit of the last quoted digit where the source gives none. */
  uncertaintyCm: number;
  uncertaintyImplied: boolean;
}

/**
 * Half a unit in the last digit of a number as written (2169.81358 → 5e-6): the uncertainty a
 * quoted value carries at least when its source states none. Trailing zeros lost by the YAML
 * parser only make this larger, never smaller.
 */
export function impliedUncertainty(value: number): number {
  const [mantissa, exponent] = Math.abs(value).toExponential().split("e");
  const decimals = (mantissa.split(".")[1] ?? "").length - Number(exponent);
  return 0.5 * Math.pow(10, -decimals);
}

export interface SpeciesInfo {
  model: SpeciesModel;
  spellings: string[];
  isReference: boolean;
  given: { sourceKey: string; form: "equilibrium" | "dunham" | "states"; values: GivenConstant[] } | null;
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
}

type IdentityFields = "id" | "file" | "name" | "formula" | "casNumber" | "aliases" | "limitations" | "electronicState" | "atoms" | "hazard" | "sources";

/** The fields every form of molecule file shares: identity, hazard note and sources. */
export function moleculeIdentity(
  file: Pick<MoleculeFile, "id" | "name" | "formula" | "casNumber" | "aliases" | "limitations" | "electronicState" | "atoms" | "hazard" | "sources">,
  fileName: string,
): Pick<Molecule, IdentityFields> {
  return {
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

function split(m: Measured): { value: number; uncertainty: number | null } {
  return typeof m === "number" ? { value: m, uncertainty: null } : { value: m.value, uncertainty: m.uncertainty };
}

function constantOf(name: string, raw: Measured): GivenConstant {
  const { value, uncertainty } = split(raw);
  return { name, valueCm: value, uncertaintyCm: uncertainty ?? impliedUncertainty(value), uncertaintyImplied: uncertainty === null };
}

type ConstantsBlock = NonNullable<MoleculeFile["species"][number]["constants"]>;

export function dunhamFromBlock(block: ConstantsBlock): { table: DunhamCoefficient[]; given: GivenConstant[]; form: "equilibrium" | "dunham" } {
  if (block.equilibrium) {
    const values: Record<string, number> = {};
    const uncertainties: EquilibriumUncertainties = {};
    const given: GivenConstant[] = [];
    for (const [name, raw] of Object.entries(block.equilibrium)) {
      if (raw === undefined) continue;
      const constant = constantOf(name, raw);
      values[name] = constant.valueCm;
      uncertainties[name as keyof EquilibriumConstants] = constant.uncertaintyCm;
      given.push(constant);
    }
    return { table: equilibriumToDunham(values as unknown as EquilibriumConstants, uncertainties), given, form: "equilibrium" };
  }
  const given: GivenConstant[] = [];
  const table: DunhamCoefficient[] = [];
  for (const [name, raw] of Object.entries(block.dunham ?? {})) {
    const constant = constantOf(name, raw);
    given.push(constant);
    table.push({ k: Number(name[1]), l: Number(name[2]), valueCm: constant.valueCm, uncertaintyCm: constant.uncertaintyCm });
  }
  return { table, given, form: "dunham" };
}

/**
 * Turns a file that has passed every check into the typed molecule: masses and abundances from
 * the isotope library, one Dunham table per species (cited, or scaled from the reference),
 * intensity data per species and band (cited, from a band strength, or isotope-scaled).
 */
export function buildMolecule(file: MoleculeFile, fileName: string): Molecule {
  const referenceIndex = file.species.findIndex((s) => s.reference === true);
  const ordered = [file.species[referenceIndex], ...file.species.filter((_, i) => i !== referenceIndex)];
  const referenceBlock = dunhamFromBlock(ordered[0].constants!);
  const masses = (numbers: number[]) => numbers.map((a, i) => isotope(file.atoms[i], a)!);
  const referenceMasses = masses(ordered[0].massNumbers);
  const referenceMu = reducedMassU(referenceMasses[0].massU, referenceMasses[1].massU);
  const sameSpecies = (a: number[], b: number[]) => a.length === b.length && a.every((x, i) => x === b[i]);

  const models: SpeciesInfo[] = ordered.map((entry, index) => {
    const atomData = masses(entry.massNumbers);
    const mu = reducedMassU(atomData[0].massU, atomData[1].massU);
    const own = entry.constants ? dunhamFromBlock(entry.constants) : null;
    const dunham = own ? own.table : scaleDunhamToIsotopologue(referenceBlock.table, referenceMu, mu);
    const model: SpeciesModel = {
      label: speciesLabel(file.atoms, entry.massNumbers),
      massNumbers: entry.massNumbers,
      atomMassesU: atomData.map((a) => a.massU),
      abundance: atomData.reduce((p, a) => p * (a.abundance ?? 0), 1),
      reducedMassU: mu,
      dunham,
      constantsOrigin: own ? "cited" : "isotope-scaled",
      constantsSourceKey: (entry.constants ?? ordered[0].constants!).source,
      intensities: [],
      referenceLines: [],
    };
    return {
      model,
      spellings: speciesSpellings(file.atoms, entry.massNumbers),
      isReference: index === 0,
      given: own ? { sourceKey: entry.constants!.source, form: own.form, values: own.given } : null,
    };
  });

  const citedIntensity = (info: SpeciesInfo, entry: NonNullable<MoleculeFile["intensity"]>[number]): BandIntensityData => {
    const band = parseBand(entry.band);
    const hermanWallis = entry.hermanWallis ?? null;
    if (entry.transitionDipoleDebye !== undefined) {
      const { value, uncertainty } = split(entry.transitionDipoleDebye);
      return { band, transitionDipoleDebye: value, transitionDipoleUncertaintyDebye: uncertainty ?? 0, hermanWallis, origin: "cited", sourceKey: entry.source };
    }
    const strength = split(entry.bandStrength!.cmPerMolecule);
    const perSpecies = entry.bandStrength!.includesAbundance ? strength.value / info.model.abundance : strength.value;
    const dipole = transitionDipoleFromBandStrength(info.model, band, perSpecies, entry.bandStrength!.temperatureK, hermanWallis);
    // |μ| ∝ √S, so the relative uncertainty halves.
    const relative = strength.uncertainty === null ? 0 : strength.uncertainty / strength.value / 2;
    return { band, transitionDipoleDebye: dipole, transitionDipoleUncertaintyDebye: dipole * relative, hermanWallis, origin: "from-band-strength", sourceKey: entry.source };
  };

  const referenceInfo = models[0];
  for (const info of models) {
    for (const entry of file.intensity ?? []) {
      if (sameSpecies(entry.massNumbers, info.model.massNumbers)) info.model.intensities.push(citedIntensity(info, entry));
    }
  }
  for (const info of models.slice(1)) {
    for (const data of referenceInfo.model.intensities) {
      if (info.model.intensities.some((d) => sameBand(d.band, data.band))) continue;
      info.model.intensities.push(scaleTransitionDipoleToIsotopologue(data, referenceInfo.model.reducedMassU, info.model.reducedMassU));
    }
  }
  for (const group of file.referenceLines ?? []) {
    const info = models.find((m) => sameSpecies(m.model.massNumbers, group.massNumbers))!;
    const band = parseBand(group.band);
    for (const line of group.lines) {
      info.model.referenceLines.push({ band, label: line.label, wavenumber: line.wavenumber, uncertainty: line.uncertainty ?? null, sourceKey: group.source });
    }
  }

  return {
    ...moleculeIdentity(file, fileName),
    species: models,
    structure: "diatomic",
    broadening: file.broadening ? { self: broadeningOf(file.broadening.self), air: broadeningOf(file.broadening.air) } : null,
  };
}

function broadeningOf(block: NonNullable<MoleculeFile["broadening"]>["self"]): GasBroadening["self"] {
  const table = block.byAbsM ? [...block.byAbsM].sort((a, b) => a.absM - b.absM) : null;
  return { hwhmCmPerAtm: block.hwhmCmPerAtm, byAbsM: table, temperatureExponent: block.temperatureExponent, sourceKey: block.source, origin: "cited" };
}
