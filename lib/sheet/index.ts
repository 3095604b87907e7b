export * from "./sheetInput.ts";
export * from "./paper.ts";
export * from "./sheetFileName.ts";
export * from "./sheetContent.ts";
export * from "./renderBenchSheet.ts";
export * from "./writeFileAtomic.ts";
export * from "./writeBenchSheets.ts";
export * from "./calibrationReport.ts";
