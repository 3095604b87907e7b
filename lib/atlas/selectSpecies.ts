import type { Molecule, SpeciesInfo } from "../molecules/index.ts";

/** A request the atlas cannot answer (unknown molecule or species); the message is for people. */
export class AtlasLookupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "AtlasLookupError";
  }
}

export function selectMolecule(molecules: Molecule[], name: string): Molecule {
  const wanted = name.trim().toLowerCase();
  const found =
    molecules.find((m) => m.id === wanted) ??
    molecules.find(
      (m) =>
        m.formula.toLowerCase() === wanted || m.casNumber === wanted || m.aliases.some((a) => a.toLowerCase() === wanted) || m.name.toLowerCase() === wanted,
    );
  if (!found) {
    throw new AtlasLookupError(`unknown molecule "${name}"; the atlas has: ${molecules.map((m) => m.id).join(", ")}`);
  }
  return found;
}

/** The species by any common spelling (12C16O, 13CO, H37Cl, D35Cl, DCl …); default: the reference species. */
export function selectSpecies(molecule: Molecule, name: string | undefined): SpeciesInfo {
  if (name === undefined) return molecule.species[0];
  const wanted = name.trim().toLowerCase();
  const found = molecule.species.find((s) => s.spellings.includes(wanted));
  if (!found) {
    throw new AtlasLookupError(`${molecule.name} has no species "${name}"; it has: ${molecule.species.map((s) => s.model.label).join(", ")}`);
  }
  return found;
}
