export * from "./problems.ts";
export * from "./schema.ts";
export * from "./isotopes.ts";
export * from "./speciesNames.ts";
export * from "./buildMolecule.ts";
export * from "./parseMoleculeText.ts";
export * from "./loadMolecules.ts";
