import type { Branch } from "../core/index.ts";
import { branchStyle as plotBranchStyle } from "../shared/branchStyle.ts";

// The sheet's look in one place. The branch colours, stick patterns and marker shapes are the
// website plot's (lib/shared/branchStyle.ts), so a printed sheet and a page read the same way;
// the stroke and the marker tell P from R again on a black-and-white printout.
export const sheetFonts = { regular: "sheet-regular", bold: "sheet-bold" } as const;

const pattern = (dash: number[]): [number, number] | null => (dash[1] > 0 ? [dash[0] * 0.8, dash[1] * 0.8] : null);

export const branchStyle: Record<Branch, { colour: string; dash: [number, number] | null; marker: "triangle-down" | "disc"; name: string; rule: string }> = {
  P: { colour: plotBranchStyle.P.colour, dash: pattern(plotBranchStyle.P.dash), marker: "triangle-down", name: "P branch", rule: "J′ = J″ − 1" },
  R: { colour: plotBranchStyle.R.colour, dash: pattern(plotBranchStyle.R.dash), marker: "disc", name: "R branch", rule: "J′ = J″ + 1" },
};

export const ink = "#000000";
export const softInk = "#444444";
export const rule = "#888888";
export const zebra = "#ececec";
export const marginPt = 36;
