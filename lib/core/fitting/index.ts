// Fitting: weighted least squares and the fits of Dunham and state constants to measured lines.
export * from "./weightedLeastSquares.ts";
export * from "./dunhamFit.ts";
export * from "./linearStateFit.ts";
