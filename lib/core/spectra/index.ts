// Line shapes and spectra: Doppler, pressure broadening and shift, Voigt, instrument line shapes, cell transmittance, reference lines.
export * from "./nearbyLines.ts";
export * from "./faddeeva.ts";
export * from "./voigtProfile.ts";
export * from "./dopplerWidth.ts";
export * from "./pressureBroadening.ts";
export * from "./pressureShift.ts";
export * from "./spectralGrid.ts";
export * from "./absorbingLines.ts";
export * from "./opticalDepth.ts";
export * from "./fft.ts";
export * from "./instrumentLineShape.ts";
export * from "./convolution.ts";
export * from "./cellTransmittance.ts";
export * from "./calibrationGrade.ts";
export * from "./instrumentFwhm.ts";
