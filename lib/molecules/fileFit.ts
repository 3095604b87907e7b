import { fitDunham, reducedMassU, type DunhamFitResult, type DunhamFitTerm, type FitObservation } from "../core/index.ts";
import { isotope } from "./isotopes.ts";
import type { DiatomicMoleculeFile } from "./schema.ts";
import { observationOf } from "./moleculeIdentity.ts";
import { speciesLabel } from "./speciesNames.ts";

/** Masses of one species and its relation to the reference species. */
export interface SpeciesMasses {
  massNumbers: number[];
  atomMassesU: number[];
  reducedMassU: number;
  /** μ_reference / μ_species. */
  massRatio: number;
  /** Per atom, 1/M(atom here) − 1/M(atom in the reference species), 1/u. */
  inverseMassShifts: number[];
}

export function speciesMasses(atoms: readonly string[], massNumbers: number[], reference: number[]): SpeciesMasses {
  const masses = (numbers: number[]) => numbers.map((a, i) => isotope(atoms[i], a)!.massU);
  const atomMassesU = masses(massNumbers);
  const referenceMasses = masses(reference);
  const mu = reducedMassU(atomMassesU[0], atomMassesU[1]);
  return {
    massNumbers,
    atomMassesU,
    reducedMassU: mu,
    massRatio: reducedMassU(referenceMasses[0], referenceMasses[1]) / mu,
    inverseMassShifts: atomMassesU.map((m, i) => 1 / m - 1 / referenceMasses[i]),
  };
}

export interface FileFit {
  fit: DunhamFitResult;
  observations: FitObservation[];
  /** Name of each fitted parameter as the file writes it (Y10, Y01_H). */
  names: string[];
  referenceIndex: number;
}

export function referenceSpeciesIndex(file: DiatomicMoleculeFile): number {
  return file.species.findIndex((s) => s.reference === true);
}

/**
 * Runs the fit a file's reference species asks for: every measured line of the named groups, of
 * every species, against the named Dunham terms and mass corrections. Null when the file has no fit.
 */
export function runFileFit(file: DiatomicMoleculeFile): FileFit | null {
  const referenceIndex = referenceSpeciesIndex(file);
  const spec = file.species[referenceIndex]?.constants?.fit;
  if (!spec) return null;
  const reference = file.species[referenceIndex].massNumbers;
  const observations: FitObservation[] = [];
  for (const group of file.referenceLines ?? []) {
    if (!spec.lines.includes(group.source)) continue;
    const masses = speciesMasses(file.atoms, group.massNumbers, reference);
    const [vUpper, vLower] = group.band.split("-").map(Number);
    const species = speciesLabel(file.atoms, group.massNumbers);
    for (const line of group.lines) {
      observations.push({
        ...observationOf(line, species, group.band, group.source),
        massRatio: masses.massRatio,
        inverseMassShifts: masses.inverseMassShifts,
        vUpper,
        vLower,
      });
    }
  }
  const terms: DunhamFitTerm[] = spec.terms.map((name) => ({ k: Number(name[1]), l: Number(name[2]) }));
  const names = [...spec.terms];
  for (const [atom, list] of Object.entries(spec.massCorrections ?? {})) {
    const atomIndex = file.atoms.indexOf(atom);
    for (const name of list) {
      terms.push({ k: Number(name[1]), l: Number(name[2]), atom: atomIndex });
      names.push(`${name}_${atom}`);
    }
  }
  return { fit: fitDunham(observations, terms), observations, names, referenceIndex };
}

/** The number of decimals that write a fitted value to a thousandth of its uncertainty. */
export function fitDecimals(uncertainty: number): number {
  return Math.max(0, 3 - Math.floor(Math.log10(uncertainty)));
}

/**
 * Where the file's written result and a fresh fit disagree: every value must lie within a hundredth
 * of its uncertainty, and every uncertainty within 1 %, of what the fit to the cited lines gives.
 */
export function fitResultProblems(file: DiatomicMoleculeFile, fileFit: FileFit): Array<{ path: Array<string | number>; message: string }> {
  const base = ["species", fileFit.referenceIndex, "constants", "fit"];
  const written = file.species[fileFit.referenceIndex].constants!.fit!.result;
  const rerun = "run `bandatlas fit " + file.id + " --write` to write the fit's result";
  if (!written) return [{ path: base, message: `the fit has no \`result\`; ${rerun}` }];
  const out: Array<{ path: Array<string | number>; message: string }> = [];
  const { parameters, uncertainties } = fileFit.fit.solution;
  fileFit.names.forEach((name, i) => {
    const given = written[name];
    if (given === undefined) {
      out.push({ path: [...base, "result"], message: `the result lacks ${name}; ${rerun}` });
      return;
    }
    const value = typeof given === "number" ? given : given.value;
    const sigma = typeof given === "number" ? null : given.uncertainty;
    const ok = Math.abs(value - parameters[i]) <= 0.01 * uncertainties[i] && sigma !== null && Math.abs(sigma - uncertainties[i]) <= 0.01 * uncertainties[i];
    if (!ok) {
      const d = fitDecimals(uncertainties[i]);
      out.push({
        path: [...base, "result", name],
        message: `the file says ${value}${sigma === null ? "" : ` ± ${sigma}`} but the fit to the cited lines gives ${parameters[i].toFixed(d)} ± ${uncertainties[i].toPrecision(2)}; ${rerun}`,
      });
    }
  });
  for (const name of Object.keys(written)) {
    if (!fileFit.names.includes(name)) out.push({ path: [...base, "result", name], message: `${name} is not a fitted parameter; ${rerun}` });
  }
  return out;
}
