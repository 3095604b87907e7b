import {
  bandLabel,
  calibrationCandidates,
  calibrationLines,
  calibrationLinesOf,
  defaultCalibrationCriteria,
  type AbsorbingLine,
  type CalibrationCriteria,
  type CalibrationLine,
  type CellConditions,
  type IntensityScale,
} from "../core/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { speciesBands } from "./moleculeBands.ts";
import { maxSpectrumRangeCm } from "./cellUnits.ts";
import {
  calibrationApodization,
  calibrationResolutionsCm,
  cellLineSet,
  defaultCellConditions,
  moleculeCellSpectrum,
  type CellLineSet,
  type CellSpectrumSettings,
  type MoleculeCellSpectrum,
} from "./cellSpectrum.ts";

/**
 * From the lowest to the highest of the lines at least \`fraction\` of the strongest among them,
 * plus a margin (5 resolutions, at least 2 cm⁻¹, so the outermost lines' instrument wings are in).
 */
function strongLinesRange(lines: readonly AbsorbingLine[], fraction: number, resolutionCm: number): { fromCm: number; toCm: number } {
  let strongest = 0;
  for (const l of lines) if (l.intensity > strongest) strongest = l.intensity;
  const strong = lines.filter((l) => l.intensity >= fraction * strongest).map((l) => l.wavenumber);
  const margin = Math.max(5 * resolutionCm, 2);
  return { fromCm: Math.max(1, Math.min(...strong) - margin), toCm: Math.max(...strong) + margin };
}

/** The range worth computing for calibration lines: the strong lines of the gas, plus a margin. */
export function calibrationRange(
  set: CellLineSet,
  resolutionCm: number,
  criteria: CalibrationCriteria = defaultCalibrationCriteria,
): { fromCm: number; toCm: number } {
  return strongLinesRange(set.lines, criteria.strongFraction, resolutionCm);
}

/**
 * Lines at least this fraction of their band's strongest bound \`spectrum\`'s default range: the
 * band with its visible wings (a 1 % line is a clear dip in a cell whose strongest lines are deep).
 */
export const spectrumRangeFraction = 0.01;

/**
 * \`bandatlas spectrum\`'s range when none is given: the principal band (the reference species'
 * first band: a diatomic's fundamental), every species' lines of it down to spectrumRangeFraction
 * of its strongest, plus the margin. Overtones and other bands are asked for with --from/--to.
 */
export function spectrumRange(molecule: Molecule, set: CellLineSet, resolutionCm: number): { fromCm: number; toCm: number } {
  const principal = bandLabel(speciesBands(molecule.species[0])[0].band);
  const lines = set.lines.filter((l) => l.band === principal);
  return strongLinesRange(lines.length ? lines : set.lines, spectrumRangeFraction, resolutionCm);
}

/**
 * The bench page's default range: \`bandatlas spectrum\`'s (the principal band), rounded out to
 * 10 cm⁻¹ for a readable form, so the page opens on what the CLI shows and within the one limit
 * (maxSpectrumRangeCm; a band wider than that is shown around its middle).
 */
export function benchDefaultRange(molecule: Molecule, set: CellLineSet, resolutionCm: number): { fromCm: number; toCm: number } {
  const band = spectrumRange(molecule, set, resolutionCm);
  let fromCm = Math.max(10, Math.floor(band.fromCm / 10) * 10);
  let toCm = Math.ceil(band.toCm / 10) * 10;
  if (toCm - fromCm > maxSpectrumRangeCm) {
    const middle = Math.round((fromCm + toCm) / 20) * 10;
    [fromCm, toCm] = [middle - maxSpectrumRangeCm / 2, middle + maxSpectrumRangeCm / 2];
  }
  return { fromCm, toCm };
}

export interface MoleculeCalibrationLines extends MoleculeCellSpectrum {
  resolutionCm: number;
  criteria: CalibrationCriteria;
  lines: CalibrationLine[];
}

export function moleculeCalibrationLines(
  molecule: Molecule,
  settings: Omit<CellSpectrumSettings, "fromCm" | "toCm"> & { fromCm?: number; toCm?: number },
  criteria: CalibrationCriteria = defaultCalibrationCriteria,
  set: CellLineSet = cellLineSet(molecule, settings.conditions),
): MoleculeCalibrationLines {
  if (settings.instrument.kind === "monochromatic") throw new Error("calibration lines need an instrument resolution");
  const resolutionCm = settings.instrument.resolutionCm;
  const range = calibrationRange(set, resolutionCm, criteria);
  const full = { ...settings, fromCm: settings.fromCm ?? range.fromCm, toCm: settings.toCm ?? range.toCm };
  const { spectrum } = moleculeCellSpectrum(molecule, full, set);
  return { set, spectrum, resolutionCm, criteria, lines: calibrationLines(set.lines, spectrum, resolutionCm, criteria) };
}

/** Plain data for species pages and sheets: calibration-grade lines at the default resolutions. */
export interface CalibrationMarks {
  moleculeId: string;
  conditions: CellConditions;
  apodization: typeof calibrationApodization;
  criteria: CalibrationCriteria;
  intensityScale: IntensityScale;
  broadeningTypical: boolean;
  /** The cited pressure shift in the marked lines' centres at these conditions (0 where none is cited). */
  pressureShift: { shiftCm: number; uncertaintyCm: number; sourceKeys: string[] };
  notes: string[];
  byResolution: Array<{
    resolutionCm: number;
    lines: Array<{ species: string; band: string; label: string; wavenumber: number; relativeToStrongest: number; peakShiftCm: number | null }>;
  }>;
}

export function calibrationMarks(molecule: Molecule, conditions: CellConditions = defaultCellConditions): CalibrationMarks {
  const byResolution: CalibrationMarks["byResolution"] = [];
  // The cell's lines depend on the conditions only: made once for all resolutions.
  const set = cellLineSet(molecule, conditions);
  for (const resolutionCm of calibrationResolutionsCm) {
    const instrument = { kind: "fourier-transform" as const, resolutionCm, apodization: calibrationApodization };
    const range = calibrationRange(set, resolutionCm);
    const candidates = calibrationCandidates(set.lines, range.fromCm, range.toCm, resolutionCm, defaultCalibrationCriteria);
    let lines: CalibrationLine[] = [];
    if (candidates.length) {
      // Only a gas with calibration-grade candidates needs its spectrum (most have none: their
      // positions are not validated). It is computed over the whole range: a narrower window
      // drops the far sidelobes of lines outside it, which moves apparent peaks by up to
      // 3·10⁻⁵ cm⁻¹ at 1–2 cm⁻¹ resolution, enough to change a printed digit.
      const { spectrum } = moleculeCellSpectrum(molecule, { conditions, instrument, ...range }, set);
      lines = calibrationLinesOf(candidates, spectrum, resolutionCm);
    }
    byResolution.push({
      resolutionCm,
      lines: lines.map((l) => ({
        species: l.species,
        band: l.band,
        label: l.label,
        wavenumber: l.wavenumber,
        relativeToStrongest: l.relativeToStrongest,
        peakShiftCm: l.peakShiftCm,
      })),
    });
  }
  return {
    moleculeId: molecule.id,
    conditions,
    apodization: calibrationApodization,
    criteria: defaultCalibrationCriteria,
    intensityScale: set.intensityScale,
    broadeningTypical: set.broadeningTypical,
    pressureShift: { shiftCm: set.pressureShift.shiftCm, uncertaintyCm: set.pressureShift.uncertaintyCm, sourceKeys: set.pressureShift.sourceKeys },
    notes: set.notes,
    byResolution,
  };
}
