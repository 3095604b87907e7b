// Options of the name/formula/alias/CAS index, shared by the build (which makes the index) and
// the browser (which loads it): MiniSearch needs the same options on both sides.

export interface NameDocument {
  id: string;
  name: string;
  formula: string;
  casNumber: string;
  aliases: string;
  species: string;
  path: string;
}

/** Split on spaces, commas and slashes only, so a CAS number like 7647-01-0 stays one term. */
export function tokenizeName(text: string): string[] {
  return text.split(/[\s,;/()]+/).filter(Boolean);
}

export const nameIndexOptions = {
  fields: ["name", "formula", "casNumber", "aliases", "species"],
  storeFields: ["name", "formula", "casNumber", "path"],
  tokenize: tokenizeName,
  processTerm: (term: string) => term.toLowerCase(),
};

export const nameSearchOptions = {
  prefix: true,
  // Typos are forgiven in words, never in numbers: a CAS number must match exactly (or as a prefix).
  fuzzy: (term: string) => (/^[a-z]{5,}$/.test(term) ? 0.2 : false),
  combineWith: "AND" as const,
  boost: { formula: 3, casNumber: 3, name: 2 },
};
