// The lines of a band: positions, their error components and intensities brought together (one band model for diatomic and linear molecules).
export * from "./bandLines.ts";
export * from "./bandModel.ts";
export * from "./linearBandModel.ts";
export * from "./lineErrorShares.ts";
export * from "./transitionDipoleFromBandStrength.ts";
