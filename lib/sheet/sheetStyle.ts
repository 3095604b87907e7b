import type { Branch } from "../core/index.ts";

// The sheet's look in one place. The branch colours are a blue/orange pair, told apart with
// every common colour-vision deficiency (blue–orange is the pair colour-blind-safe palettes
// build on, e.g. Okabe & Ito, "Color Universal Design", 2008); the stroke and the marker tell P
// from R again on a black-and-white printout.
export const sheetFonts = { regular: "sheet-regular", bold: "sheet-bold" } as const;

export const branchStyle: Record<Branch, { colour: string; dash: [number, number] | null; marker: "disc" | "diamond"; name: string; rule: string }> = {
  P: { colour: "#1f5fa8", dash: null, marker: "disc", name: "P branch", rule: "J′ = J″ − 1" },
  R: { colour: "#c9650c", dash: [2.4, 1.6], marker: "diamond", name: "R branch", rule: "J′ = J″ + 1" },
};

export const ink = "#000000";
export const softInk = "#444444";
export const rule = "#888888";
export const zebra = "#ececec";
export const marginPt = 36;
