import type { Molecule } from "../molecules/index.ts";

// Every safety and prediction caution of the project, written once: the pages, the sheets and the
// command line take their words from here (the cautions page explains them at length).

/** Who decides how a gas is handled. */
export const safetyDeferral = "Before handling the gas, follow the supplier's safety data sheet, local codes and your lab's safety officer.";

/** What the numbers are and are not. */
export const predictionNotice =
  "These are predictions, not certified reference data: the atlas does not certify an instrument; check critical calibrations against certified values.";

/** Under a molecule's hazard summary on a page. */
export const hazardSummaryDeferral = `This summary is not a safety assessment. ${safetyDeferral}`;

/** Under the hazard box of a bench sheet. */
export const sheetCautionDeferral = `This sheet predicts a spectrum; it is not a safety document. ${safetyDeferral}`;

/** For pages and outputs that concern every gas of the atlas. */
export const allGasesCaution = `These gases are toxic, corrosive, flammable or asphyxiant, and each molecule page carries its hazard note. ${safetyDeferral}`;

/** A molecule's caution in one paragraph, for the command line and JSON outputs. */
export function moleculeCaution(molecule: Pick<Molecule, "name" | "hazard">): string {
  return `${molecule.name}: ${molecule.hazard.sentences.join(" ")} ${safetyDeferral} ${predictionNotice}`;
}

/** The reminder on a continuation page of a sheet, beside the pictogram codes. */
export function continuationCaution(pictogramCodes: readonly string[]): string {
  return `⚠ ${pictogramCodes.join(" ") || "hazard"}: see the hazard caution on page 1. ${safetyDeferral}`;
}
