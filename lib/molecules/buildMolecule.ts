import {
  moleculeValidation,
  scaleTransitionDipoleToIsotopologue,
  transitionDipoleFromBandStrength,
  parseBand,
  sameBand,
  type BandIntensityData,
  type DiatomicSpeciesModel,
} from "../core/index.ts";
import { runFileFit, speciesMasses, type FileFit } from "./fileFit.ts";
import { split } from "./givenConstants.ts";
import { buildLinearMolecule } from "./linearMolecule.ts";
import type { LinearFileFit } from "./linearFit.ts";
import type { MoleculeFile } from "./linearSchema.ts";
import { certifiedAllowanceCm, moleculeIdentity, referenceLineOf, type Molecule, type SpeciesInfo } from "./moleculeIdentity.ts";
import { isotope } from "./isotopes.ts";
import type { DiatomicMoleculeFile } from "./schema.ts";
import { speciesConstants } from "./speciesConstants.ts";
import { speciesLabel, speciesSpellings } from "./speciesNames.ts";

/**
 * Turns a file that has passed every check into the typed molecule: masses and abundances from
 * the isotope library, one Dunham table per species (cited, or scaled from the reference),
 * intensity data per species and band (cited, from a band strength, or isotope-scaled).
 */
export function buildDiatomicMolecule(file: DiatomicMoleculeFile, fileName: string, fileFit: FileFit | null = runFileFit(file)): Molecule {
  const referenceIndex = file.species.findIndex((s) => s.reference === true);
  const ordered = [file.species[referenceIndex], ...file.species.filter((_, i) => i !== referenceIndex)];
  const referenceBlock = ordered[0].constants!;
  const sameSpecies = (a: number[], b: number[]) => a.length === b.length && a.every((x, i) => x === b[i]);

  const models: Array<SpeciesInfo & { model: DiatomicSpeciesModel }> = ordered.map((entry, index) => {
    const masses = speciesMasses(file.atoms, entry.massNumbers, ordered[0].massNumbers);
    const constants = speciesConstants(file, entry, masses, referenceBlock, fileFit);
    const model: DiatomicSpeciesModel = {
      structure: "diatomic",
      label: speciesLabel(file.atoms, entry.massNumbers),
      massNumbers: entry.massNumbers,
      atomMassesU: masses.atomMassesU,
      abundance: entry.massNumbers.reduce((p, a, i) => p * (isotope(file.atoms[i], a)!.abundance ?? 0), 1),
      reducedMassU: masses.reducedMassU,
      dunham: constants.dunham,
      positionErrors: constants.positionErrors,
      constantsOrigin: constants.origin,
      constantsSourceKey: (entry.constants ?? referenceBlock).source,
      ...((entry.constants ?? referenceBlock).crossCheck ? { crossCheckSourceKey: (entry.constants ?? referenceBlock).crossCheck!.source } : {}),
      intensities: [],
      referenceLines: [],
    };
    return {
      model,
      spellings: speciesSpellings(file.atoms, entry.massNumbers),
      isReference: index === 0,
      given: constants.given ? { sourceKey: entry.constants!.source, form: constants.given.form, values: constants.given.values } : null,
    };
  });

  const citedIntensity = (info: SpeciesInfo, entry: NonNullable<DiatomicMoleculeFile["intensity"]>[number]): BandIntensityData => {
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
    return {
      band,
      transitionDipoleDebye: dipole,
      transitionDipoleUncertaintyDebye: dipole * relative,
      hermanWallis,
      origin: "from-band-strength",
      sourceKey: entry.source,
    };
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
    const [vUpper, vLower] = group.band.split("-").map(Number);
    const band = { vUpper, vLower };
    const allowance = certifiedAllowanceCm(file, group.source);
    for (const line of group.lines) info.model.referenceLines.push(referenceLineOf(line, band, group.source, allowance));
  }
  const validations = moleculeValidation(
    models.map((m) => m.model),
    fileFit !== null,
  );
  models.forEach((m, i) => (m.model.validation = validations[i]));

  return {
    ...moleculeIdentity(file, fileName),
    species: models,
    structure: "diatomic",
  };
}

/**
 * The one builder: a molecule file of either form (checked, with its fits run) becomes the typed
 * Molecule whose species carry a diatomic's Dunham table or a linear molecule's states.
 */
export function buildMolecule(file: MoleculeFile, fileName: string, fits: { fileFit?: FileFit | null; linearFits?: readonly LinearFileFit[] } = {}): Molecule {
  if (file.structure === "linear") return buildLinearMolecule(file, fileName, fits.linearFits ?? []);
  return buildDiatomicMolecule(file, fileName, fits.fileFit === undefined ? runFileFit(file) : fits.fileFit);
}
