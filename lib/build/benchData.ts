import { benchDefaultRange, calibrationMarks, cellLineSet, cellModel, defaultCellConditions, type CalibrationMarks, type CellModel } from "../atlas/index.ts";
import type { Molecule } from "../molecules/index.ts";

/** The bench page's default resolution, at which its default range (benchDefaultRange) takes its margin. */
export const benchDefaultResolutionCm = 0.5;

/** What the build computes once per molecule for its bench page, species pages and sheets. */
export interface MoleculeBenchData {
  moleculeId: string;
  /** Calibration-grade lines at the default resolutions in the default cell (0.5–7 s a molecule). */
  marks: CalibrationMarks;
  /** Written as JSON for the bench page's browser computation. */
  model: CellModel;
  defaultRangeCm: { fromCm: number; toCm: number };
}

export function moleculeBenchData(molecule: Molecule): MoleculeBenchData {
  const model = cellModel(molecule);
  // The CLI's default range (the principal band), so the page opens where \`spectrum\` does and
  // inside the one range limit; it used to span every band (HCl 2640–5790 cm⁻¹, refused by the page).
  const range = benchDefaultRange(molecule, cellLineSet(molecule, defaultCellConditions), benchDefaultResolutionCm);
  return {
    moleculeId: molecule.id,
    marks: calibrationMarks(molecule),
    model,
    defaultRangeCm: range,
  };
}
