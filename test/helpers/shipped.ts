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
