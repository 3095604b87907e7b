import type { DiatomicSpeciesModel, LinearSpeciesModel, SpeciesModel } from "../../lib/core/index.ts";
import { loadMoleculesOrThrow, type Molecule } from "../../lib/molecules/index.ts";
import { shippedMoleculesDir } from "../../lib/cli/moleculeSource.ts";
import { selectMolecule, selectSpecies } from "../../lib/atlas/index.ts";

let cache: Molecule[] | null = null;
export function shippedMolecules(): Molecule[] {
  cache ??= loadMoleculesOrThrow(shippedMoleculesDir);
  return cache;
}

export function shippedSpecies(molecule: string, species?: string) {
  return selectSpecies(selectMolecule(shippedMolecules(), molecule), species).model;
}

/** A shipped diatomic species' model (the test fails plainly if the species is not a diatomic). */
export function shippedDiatomic(molecule: string, species?: string): DiatomicSpeciesModel {
  const model = shippedSpecies(molecule, species);
  if (model.structure !== "diatomic") throw new Error(`${molecule} ${species ?? ""} is not a diatomic`);
  return model;
}

/** A shipped linear species' model. */
export function linearModel(model: SpeciesModel): LinearSpeciesModel {
  if (model.structure !== "linear") throw new Error(`${model.label} is not a linear molecule`);
  return model;
}
