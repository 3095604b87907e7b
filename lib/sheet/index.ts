export * from "./buildIdentity.ts";
export * from "./paper.ts";
export * from "./sheetFileName.ts";
export * from "./sheetContent.ts";
export * from "./renderBenchSheet.ts";
