// The numeric core: pure functions over plain data, no I/O, safe to bundle for the browser.
export * from "./types.ts";
export * from "./physicalConstants.ts";
export * from "./coreInputError.ts";
export * from "./band.ts";
export * from "./dunham.ts";
export * from "./isotopeScaling.ts";
export * from "./termValues.ts";
export * from "./partitionFunction.ts";
export * from "./hoenlLondon.ts";
export * from "./hermanWallis.ts";
export * from "./lineIntensity.ts";
export * from "./airWavelength.ts";
export * from "./transitionDipole.ts";
export * from "./transitionDipoleFromBandStrength.ts";
export * from "./bandLines.ts";
export * from "./residuals.ts";
export * from "./nearbyLines.ts";
