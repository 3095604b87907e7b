// Line positions and their uncertainty: Dunham and state term values, bands, isotope scaling, error components, validation, units.
export * from "./band.ts";
export * from "./dunham.ts";
export * from "./isotopeScaling.ts";
export * from "./termValues.ts";
export * from "./airWavelength.ts";
export * from "./linearTypes.ts";
export * from "./linearStateTerms.ts";
export * from "./bandAccuracy.ts";
export * from "./positionErrors.ts";
export { forgetBandErrors } from "./positionUncertainty.ts";
export * from "./spectralPosition.ts";
export * from "./certifiedPositions.ts";
