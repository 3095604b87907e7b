export * from "./atlasConfig.ts";
export * from "./selectSpecies.ts";
export * from "./atlasEntry.ts";
export * from "./atlasLines.ts";
export * from "./moleculeBands.ts";
export * from "./cellSpectrum.ts";
export * from "./cellUnits.ts";
export * from "./calibrationMarks.ts";
