export * from "./bandOverviewSpec.ts";
export * from "./renderSvg.ts";
export * from "./bandOverviewSvg.ts";
