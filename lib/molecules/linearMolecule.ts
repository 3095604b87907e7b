import { moleculeValidation, transitionDipoleFromBandStrength, type LinearSpeciesData, type LinearState, type LinearSpeciesModel } from "../core/index.ts";
import { certifiedAllowanceCm, moleculeIdentity, referenceLineOf, type Molecule, type SpeciesInfo } from "./moleculeIdentity.ts";
import { linearFitErrors, type LinearFileFit } from "./linearFit.ts";
import type { GivenConstant } from "./givenConstants.ts";
import { isotope } from "./isotopes.ts";
import type { LinearMoleculeFile, LinearSpeciesEntry } from "./linearSchema.ts";
import { parseSymmetry, withUncertainty, type StateConstant } from "./linearChecks.ts";
import { speciesLabel, speciesSpellings } from "./speciesNames.ts";

function stateOf(entry: LinearSpeciesEntry["states"][number]): { state: LinearState; given: GivenConstant[] } {
  const given: GivenConstant[] = [];
  const constant = (name: string, m: StateConstant) => {
    const c = withUncertainty(m);
    if (m !== undefined) given.push({ name: `${name}(${entry.id})`, valueCm: c.valueCm, uncertaintyCm: c.uncertaintyCm, uncertaintyImplied: c.implied });
    return { valueCm: c.valueCm, uncertaintyCm: c.uncertaintyCm };
  };
  const state: LinearState = {
    id: entry.id,
    symmetry: parseSymmetry(entry.symmetry)!,
    termEnergy: constant("G", entry.termEnergy),
    b: constant("B", entry.b),
    d: constant("D", entry.d),
    h: constant("H", entry.h),
    sourceKey: entry.source,
  };
  return { state, given };
}

/** The typed molecule of a linear-molecule file that has passed every check. */
export function buildLinearMolecule(file: LinearMoleculeFile, fileName: string, fits: readonly LinearFileFit[] = []): Molecule {
  const referenceIndex = file.species.findIndex((s) => s.reference === true);
  const ordered = [file.species[referenceIndex], ...file.species.filter((_, i) => i !== referenceIndex)];
  const species: SpeciesInfo[] = ordered.map((entry, index) => {
    const built = entry.states.map(stateOf);
    const states = built.map((b) => b.state);
    const indexOf = new Map(states.map((s, i) => [s.id, i]));
    const linear: LinearSpeciesData = {
      states,
      groundStateIndex: states.findIndex((s) => s.termEnergy.valueCm === 0),
      modes: (entry.vibrationalModes?.modes ?? []).map((m) => ({ wavenumberCm: m.wavenumber, degeneracy: m.degeneracy })),
      nuclearSpinWeights: entry.nuclearSpinWeights ? { evenJ: entry.nuclearSpinWeights.evenJ, oddJ: entry.nuclearSpinWeights.oddJ } : null,
      bands: entry.bands.map((b) => {
        const upperStateIndex = indexOf.get(b.upper)!;
        const lowerStateIndex = indexOf.get(b.lower)!;
        return {
          band: { label: `${b.upper}-${b.lower}`, upperStateIndex, lowerStateIndex },
          upperStateIndex,
          lowerStateIndex,
          name: b.name,
          kind: b.kind,
          sourceKey: b.source,
        };
      }),
    };
    const atoms = entry.massNumbers.map((a, i) => isotope(file.atoms[i], a)!);
    const label = entry.label ?? speciesLabel(file.atoms, entry.massNumbers);
    const model: LinearSpeciesModel = {
      structure: "linear",
      label,
      massNumbers: entry.massNumbers,
      atomMassesU: atoms.map((a) => a.massU),
      abundance: atoms.reduce((p, a) => p * (a.abundance ?? 0), 1),
      constantsOrigin: "cited",
      constantsSourceKey: entry.states[0].source,
      intensities: [],
      referenceLines: [],
      linear,
      ...(entry.ownCells ? { ownCells: true } : {}),
    };
    for (const b of entry.bands) {
      if (!b.bandStrength) continue;
      const band = linear.bands.find((x) => x.band.label === `${b.upper}-${b.lower}`)!.band;
      const s = withUncertainty(b.bandStrength.cmPerMolecule);
      const dipole = transitionDipoleFromBandStrength(model, band, s.valueCm, b.bandStrength.temperatureK, null);
      const relative = s.implied ? 0 : s.uncertaintyCm / s.valueCm / 2;
      model.intensities.push({
        band,
        transitionDipoleDebye: dipole,
        transitionDipoleUncertaintyDebye: dipole * relative,
        hermanWallis: null,
        origin: "from-band-strength",
        sourceKey: b.bandStrength.source,
      });
    }
    for (const group of entry.referenceLines ?? []) {
      const band = linear.bands.find((x) => x.band.label === group.band)!.band;
      const allowance = certifiedAllowanceCm(file, group.source);
      for (const line of group.lines) model.referenceLines.push(referenceLineOf(line, band, group.source, allowance));
    }
    const spellings = new Set([...speciesSpellings(file.atoms, entry.massNumbers), label.toLowerCase()]);
    return {
      model,
      spellings: [...spellings],
      isReference: index === 0,
      given: { sourceKey: entry.states[0].source, form: "states", values: built.flatMap((b) => b.given) },
    };
  });
  // A fitted species: the fit's covariance and omitted terms make its ±, and its constants count as fitted.
  for (const fit of fits) {
    const massNumbers = file.species[fit.speciesIndex].massNumbers.join(",");
    const model = species.find((s) => s.model.massNumbers.join(",") === massNumbers)!.model;
    if (model.structure !== "linear") continue;
    model.linear.positionErrors = linearFitErrors(fit, model.linear);
    model.constantsOrigin = "fitted";
  }
  const validations = moleculeValidation(
    species.map((s) => s.model),
    fits.length > 0,
  );
  species.forEach((s, i) => (s.model.validation = validations[i]));
  return {
    ...moleculeIdentity(file, fileName),
    species,
    structure: "linear",
  };
}
