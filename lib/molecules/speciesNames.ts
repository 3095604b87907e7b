import { mostAbundantMassNumber } from "./isotopes.ts";

/** Full species label with every atom's mass number: 12C16O, 1H35Cl, 2H19F. */
export function speciesLabel(atoms: string[], massNumbers: number[]): string {
  return atoms.map((symbol, i) => `${massNumbers[i]}${symbol}`).join("");
}

/**
 * Every way people commonly write the species, lowercased: a mass number may be left out for the
 * most abundant isotope, and 2H may be written D (H35Cl, D35Cl, DCl, HCl, 13CO …).
 */
export function speciesSpellings(atoms: string[], massNumbers: number[]): string[] {
  let forms = [""];
  atoms.forEach((symbol, i) => {
    const a = massNumbers[i];
    const options = [`${a}${symbol}`];
    if (mostAbundantMassNumber(symbol) === a) options.push(symbol);
    if (symbol === "H" && a === 2) options.push("D");
    if (symbol === "H" && a === 3) options.push("T");
    forms = forms.flatMap((prefix) => options.map((o) => prefix + o));
  });
  return forms.map((f) => f.toLowerCase());
}
