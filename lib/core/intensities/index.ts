// Line intensities: populations and partition functions, Hönl–London and Herman–Wallis factors, transition dipoles.
export * from "./partitionFunction.ts";
export * from "./hoenlLondon.ts";
export * from "./hermanWallis.ts";
export * from "./lineIntensity.ts";
export * from "./transitionDipole.ts";
export * from "./linearPartitionFunction.ts";
export * from "./nuclearSpinWeights.ts";
export * from "./vibrationalPartitionFunction.ts";
export * from "./speciesPartitionFunction.ts";
export * from "./numberDensity.ts";
