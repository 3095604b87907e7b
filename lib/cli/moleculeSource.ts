import { existsSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { selectMolecule } from "../atlas/index.ts";
import { idPattern, loadMoleculeFiles, loadMoleculesOrThrow, MoleculeFileError, type Molecule } from "../molecules/index.ts";

/** The shipped molecules folder, wherever the command is run from; --molecules overrides it. */
export const shippedMoleculesDir = fileURLToPath(new URL("../../molecules", import.meta.url));

export function moleculesDir(option: string | undefined): string {
  return option ?? shippedMoleculesDir;
}

/**
 * One molecule by id, formula, CAS number or alias. A file named after the id is read on its own,
 * so a contributor's new file works at once even while another file is broken.
 */
export function loadOneMolecule(dir: string, name: string): Molecule {
  const direct = join(dir, `${name.toLowerCase()}.yaml`);
  if (idPattern.test(name.toLowerCase()) && existsSync(direct)) {
    const { molecules, problems } = loadMoleculeFiles([direct]);
    if (problems.length) throw new MoleculeFileError(problems);
    return molecules[0];
  }
  return selectMolecule(loadMoleculesOrThrow(dir), name);
}
