import { isotope, stableMassNumbers } from "./isotopes.ts";
import type { Molecule } from "./moleculeIdentity.ts";
import { speciesLabel } from "./speciesNames.ts";

/**
 * A species this abundant is in every natural sample: a cell of the gas shows its lines, and a
 * file without it leaves them unassigned (our own threshold, common practice, no source: 1 % is
 * where a species' strongest lines reach the strength of the main species' weaker ones).
 */
export const abundantSpeciesFraction = 0.01;

export interface MissingSpecies {
  label: string;
  massNumbers: number[];
  /** Natural abundance, summed over arrangements that are the same species (H¹²C¹³CH = H¹³C¹²CH). */
  abundance: number;
}

/**
 * The species of a molecule's atoms with natural abundance ≥ abundantSpeciesFraction that its
 * file does not list; abundances from chemical-elements (lib/molecules/isotopes.ts). A molecule
 * whose atom list reads the same backwards (HCCH, OCO) counts an arrangement and its mirror once.
 */
export function missingAbundantSpecies(molecule: Molecule): MissingSpecies[] {
  const atoms = molecule.atoms;
  const symmetric = atoms.every((a, i) => a === atoms[atoms.length - 1 - i]);
  const canonical = (m: number[]) => {
    if (!symmetric) return m.join(",");
    const reversed = [...m].reverse();
    return reversed.join(",") < m.join(",") ? reversed.join(",") : m.join(",");
  };
  const found = new Map<string, MissingSpecies>();
  const walk = (i: number, chosen: number[], abundance: number) => {
    if (abundance < abundantSpeciesFraction / 100) return; // far below the threshold whatever follows
    if (i === atoms.length) {
      const key = canonical(chosen);
      const entry = found.get(key);
      if (entry) entry.abundance += abundance;
      else found.set(key, { label: speciesLabel(atoms, key.split(",").map(Number)), massNumbers: key.split(",").map(Number), abundance });
      return;
    }
    for (const massNumber of stableMassNumbers(atoms[i])) walk(i + 1, [...chosen, massNumber], abundance * (isotope(atoms[i], massNumber)?.abundance ?? 0));
  };
  walk(0, [], 1);
  const listed = new Set(molecule.species.map((s) => canonical(s.model.massNumbers)));
  return [...found.entries()]
    .filter(([key, s]) => s.abundance >= abundantSpeciesFraction && !listed.has(key))
    .map(([, s]) => s)
    .sort((a, b) => b.abundance - a.abundance);
}
