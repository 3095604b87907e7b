// The hazard caution of a molecule as every page shows it: GHS pictograms, sentences, limitations.
import type { Molecule } from "../molecules/index.ts";
import { ghsPictogramName } from "../shared/ghsPictograms.ts";

export interface HazardView {
  pictograms: Array<{ code: string; name: string }>;
  sentences: string[];
  /** Known limitations of the constants, shown with the caution on every page of the molecule. */
  limitations: string[];
}

export function hazardView(molecule: Molecule): HazardView {
  return {
    pictograms: molecule.hazard.ghsPictograms.map((code) => ({ code, name: ghsPictogramName(code) })),
    sentences: molecule.hazard.sentences,
    limitations: molecule.limitations,
  };
}

