import { calibrationMarks, calibrationRange, cellLineSet, cellModel, defaultCellConditions, type CalibrationMarks, type CellModel } from "../atlas/index.ts";
import { defaultCalibrationCriteria } from "../core/index.ts";
import type { Molecule } from "../molecules/index.ts";

/** The bench page's default window: lines down to 0.01 of the strongest, a margin for this resolution, rounded out to 10 cm⁻¹. */
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
  const range = calibrationRange(cellLineSet(molecule, defaultCellConditions), benchDefaultResolutionCm, {
    ...defaultCalibrationCriteria,
    strongFraction: 0.01,
  });
  return {
    moleculeId: molecule.id,
    marks: calibrationMarks(molecule),
    model,
    defaultRangeCm: { fromCm: Math.max(10, Math.floor(range.fromCm / 10) * 10), toCm: Math.ceil(range.toCm / 10) * 10 },
  };
}
