export * from "./numbers.ts";
export * from "./csv.ts";
export * from "./lineRecords.ts";
export * from "./linesTable.ts";
export * from "./spectrumCells.ts";
export * from "./calibrationText.ts";
export * from "./accuracyText.ts";
export * from "./fitReport.ts";
