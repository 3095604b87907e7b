import {
  absorbingLines,
  bandLabel,
  bandLines,
  broadeningIsTypical,
  cellSpectrum,
  lineCentreShift,
  noPressureShift,
  scaleTransitionDipoleToIsotopologue,
  speciesPartitionFunction,
  typicalBroadening,
  type AbsorbingLine,
  type Band,
  type CellConditions,
  type CellSpectrum,
  type GasBroadening,
  type GasPressureShift,
  type Instrument,
  type IntensityScale,
  type SpeciesModel,
} from "../core/index.ts";
import type { Molecule, SpeciesInfo } from "../molecules/index.ts";
import { speciesBands } from "./moleculeBands.ts";

/** Resolutions (cm⁻¹) at which pages and sheets mark calibration-grade lines. */
export const calibrationResolutionsCm: readonly number[] = [0.125, 0.5, 1, 2, 4];
/** The apodization those marks assume (common practice for FT survey work, no source). */
export const calibrationApodization = "triangular" as const;
/** The default cell: 10 cm of the pure gas at 296 K and 20 Torr (2666.45 Pa). */
export const defaultCellConditions: CellConditions = { temperatureK: 296, pressurePa: (20 * 101325) / 760, moleFraction: 1, pathCm: 10 };
/** Lines weaker than this fraction of the gas's strongest line are left out of spectra (they change no printed digit). */
export const negligibleLineFraction = 1e-7;

export interface CellBand {
  species: string;
  band: string;
  /** How its intensities were obtained: a core intensity origin, or "unit-dipole" in relative mode. */
  intensityOrigin: string;
}

/** Every line of the gas that a cell spectrum uses, and what it had to assume. */
export interface CellLineSet {
  moleculeId: string;
  intensityScale: IntensityScale;
  lines: AbsorbingLine[];
  bandsUsed: CellBand[];
  bandsLeftOut: Array<{ species: string; band: string; reason: string }>;
  /** True when a typical (not cited) broadening coefficient was used: every output must say so. */
  broadeningTypical: boolean;
  broadening: GasBroadening;
  /** The pressure shift in every line's centre, its ±, and the perturbers with no cited shift. */
  pressureShift: ReturnType<typeof lineCentreShift>;
  /** Plain sentences every output that shows these lines must carry. */
  notes: string[];
}

function hasAbsoluteData(molecule: Molecule): boolean {
  return molecule.species.some((s) => s.model.intensities.length > 0);
}

/**
 * Without any cited intensity the spectrum can only be relative: each species gets a 1 D dipole
 * for its first band (isotope-scaled from the reference species as the core does for real data),
 * diatomic hot bands follow by the harmonic rule, overtones are left out.
 */
function unitDipoleModel(species: SpeciesInfo, reference: SpeciesInfo): SpeciesModel {
  const first = speciesBands(species)[0].band;
  const unit = {
    band: first,
    transitionDipoleDebye: 1,
    transitionDipoleUncertaintyDebye: 0,
    hermanWallis: null,
    origin: "cited" as const,
    sourceKey: "unit-dipole",
  };
  // Only a diatomic's isotopologues are scaled by the reduced-mass rule; a linear species keeps the unit dipole.
  const data =
    species === reference || species.model.structure !== "diatomic" || reference.model.structure !== "diatomic"
      ? unit
      : scaleTransitionDipoleToIsotopologue(unit, reference.model.reducedMassU, species.model.reducedMassU);
  return { ...species.model, intensities: [data] };
}

/**
 * The atlas's decisions for a gas cell as plain, JSON-able data: which species, which bands,
 * which intensity data (cited, or the unit-dipole stand-in), which broadening. The build writes
 * it for the bench page, whose browser turns it into lines with the same cellLinesOfModel the
 * CLI uses, so both compute the same lines at any temperature.
 */
export interface CellModel {
  moleculeId: string;
  moleculeName: string;
  intensityScale: IntensityScale;
  broadening: GasBroadening;
  pressureShift: GasPressureShift;
  species: Array<{ model: SpeciesModel; bands: Band[] }>;
}

export function cellModel(molecule: Molecule): CellModel {
  const scale: IntensityScale = hasAbsoluteData(molecule) ? "absolute" : "relative-thin";
  return {
    moleculeId: molecule.id,
    moleculeName: molecule.name,
    intensityScale: scale,
    broadening: molecule.broadening ?? typicalBroadening,
    pressureShift: molecule.pressureShift ?? noPressureShift,
    species: molecule.species.map((species) => ({
      model: scale === "absolute" ? species.model : unitDipoleModel(species, molecule.species[0]),
      bands: speciesBands(species).map((b) => b.band),
    })),
  };
}

/** All species at natural abundance, every band the atlas builds that has intensity data. */
export function cellLineSet(molecule: Molecule, conditions: CellConditions): CellLineSet {
  return cellLinesOfModel(cellModel(molecule), conditions);
}

/** The lines of a cell model at the cell's conditions (pure: runs in the browser too). */
export function cellLinesOfModel(cell: CellModel, conditions: CellConditions): CellLineSet {
  const scale = cell.intensityScale;
  const broadening = cell.broadening;
  const shift = lineCentreShift(cell.pressureShift, conditions.pressurePa, conditions.moleFraction);
  const used: CellBand[] = [];
  const leftOut: CellLineSet["bandsLeftOut"] = [];
  let lines: AbsorbingLine[] = [];
  for (const { model, bands } of cell.species) {
    const q = speciesPartitionFunction(model, conditions.temperatureK);
    for (const band of bands) {
      const result = bandLines(model, band, { temperatureK: conditions.temperatureK, partitionFunction: q });
      const label = bandLabel(band);
      if (result.strongestLineIntensity === null) {
        leftOut.push({ species: model.label, band: label, reason: "no intensity data for this band" });
        continue;
      }
      used.push({
        species: model.label,
        band: label,
        intensityOrigin:
          scale === "absolute"
            ? (result.intensityOrigin ?? "cited")
            : result.intensityOrigin === "harmonic-hot-band"
              ? "unit-dipole, harmonic hot band"
              : "unit-dipole",
      });
      lines = lines.concat(absorbingLines(model, result, conditions, broadening, shift, (l) => l.lineIntensity));
    }
  }
  let strongest = 0;
  for (const l of lines) if (l.intensity > strongest) strongest = l.intensity;
  lines = lines.filter((l) => l.intensity >= negligibleLineFraction * strongest);
  const typical = broadeningIsTypical(broadening, conditions.moleFraction);
  const notes: string[] = [];
  if (scale === "relative-thin") {
    notes.push(
      `${cell.moleculeName} has no cited band intensity: no transmittance can be given. Shapes are relative, optically thin, with a 1 D stand-in dipole; peak shifts assume a weak absorber.`,
    );
  }
  if (typical) notes.push("Line widths use a typical pressure-broadening coefficient (0.07 cm⁻¹/atm, n = 0.75), not a measured one for this gas.");
  notes.push(pressureShiftNote(shift));
  if (leftOut.length) notes.push(`Left out for want of intensity data: ${leftOut.map((b) => `${b.species} ${b.band}`).join(", ")}.`);
  return {
    moleculeId: cell.moleculeId,
    intensityScale: scale,
    lines,
    bandsUsed: used,
    bandsLeftOut: leftOut,
    broadeningTypical: typical,
    broadening,
    pressureShift: shift,
    notes,
  };
}

/** What every output of cell lines says about their centres: the cited shift in them, or none. */
export function pressureShiftNote(shift: ReturnType<typeof lineCentreShift>): string {
  const uncited = shift.uncited.length
    ? `no shift is cited for ${shift.uncited.map((w) => (w === "self" ? "the gas itself" : "air")).join(" or ")}, so none is applied for it`
    : "";
  if (shift.shiftCm === 0 && shift.uncertaintyCm === 0)
    return `Line centres are zero-pressure positions: no pressure shift is cited for ${shift.uncited.map((w) => (w === "self" ? "the gas itself" : "air")).join(" or ")}, so none is applied.`;
  return (
    `Line centres include the pressure shift cited in ${shift.sourceKeys.map((k) => `[${k}]`).join(", ")} at this pressure, ${formatShift(shift.shiftCm)} ± ${formatShift(shift.uncertaintyCm, false)} cm⁻¹, its ± added to every position's` +
    (uncited ? `; ${uncited}.` : ".")
  );
}

function formatShift(valueCm: number, signed = true): string {
  const text = valueCm.toExponential(1).replace(/^-/, "−");
  return signed && valueCm > 0 ? `+${text}` : text;
}

export interface CellSpectrumSettings {
  conditions: CellConditions;
  fromCm: number;
  toCm: number;
  instrument: Instrument;
  stepCm?: number;
}

export interface MoleculeCellSpectrum {
  set: CellLineSet;
  spectrum: CellSpectrum;
}

export function moleculeCellSpectrum(
  molecule: Molecule,
  settings: CellSpectrumSettings,
  set = cellLineSet(molecule, settings.conditions),
): MoleculeCellSpectrum {
  const spectrum = cellSpectrum({
    lines: set.lines,
    conditions: settings.conditions,
    intensityScale: set.intensityScale,
    fromCm: settings.fromCm,
    toCm: settings.toCm,
    instrument: settings.instrument,
    stepCm: settings.stepCm,
  });
  return { set, spectrum };
}
