// The calibration of a measured spectrum: peaks, the assignment vote, the correction fit, its uncertainty budget, the verdict.
export * from "./calibrationReferences.ts";
export * from "./scaleSearch.ts";
export * from "./wavenumberCorrection.ts";
export * from "./correctionBudget.ts";
export * from "./absorptionPeaks.ts";
export * from "./spectrumCalibrationRules.ts";
export * from "./calibratedLines.ts";
export * from "./spectrumCalibration.ts";
export * from "./spectrumNoise.ts";
export * from "./peakVertex.ts";
export * from "./toleranceVerdict.ts";
export * from "./controlLimits.ts";
