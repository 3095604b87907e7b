import { bandLabel } from "../positions/band.ts";
import { CoreInputError } from "../coreInputError.ts";
import { dopplerHwhmCm, molecularMassU } from "./dopplerWidth.ts";
import { lorentzHwhmCm, runningM, type GasBroadening } from "./pressureBroadening.ts";
import type { LineCentreShift } from "./pressureShift.ts";
import type { BandLines, Line, SpeciesModel, TemperatureK, WavenumberCm } from "../types.ts";

/** The state of the gas in the cell. */
export interface CellConditions {
  temperatureK: TemperatureK;
  /** Total pressure in the cell, Pa. */
  pressurePa: number;
  /** Mole fraction of the molecule (all its species together); the rest is taken to be air. */
  moleFraction: number;
  pathCm: number;
}

/** One line ready for a spectrum: strength and both widths at the cell's conditions. */
export interface AbsorbingLine {
  species: string;
  band: string;
  label: string;
  /** The line centre in the cell: the zero-pressure position plus the pressure shift. */
  wavenumber: WavenumberCm;
  /** The centre's standard uncertainty: the position's (see Line) and the shift's, combined. */
  wavenumberUncertainty: WavenumberCm;
  /** The pressure shift included in `wavenumber` (0 where none is cited). */
  pressureShiftCm: WavenumberCm;
  positionStatus: Line["positionStatus"];
  /** cm/molecule of the molecule at its isotopic mix (or relative units, see the spectrum's scale). */
  intensity: number;
  dopplerHwhmCm: WavenumberCm;
  lorentzHwhmCm: WavenumberCm;
}

export function checkCellConditions(c: CellConditions): void {
  if (!(Number.isFinite(c.temperatureK) && c.temperatureK > 0))
    throw new CoreInputError(`temperature ${c.temperatureK} K is not possible: it must be above 0 K`);
  if (!(Number.isFinite(c.pressurePa) && c.pressurePa > 0)) throw new CoreInputError(`pressure ${c.pressurePa} Pa is not possible: it must be above 0`);
  if (!(Number.isFinite(c.moleFraction) && c.moleFraction > 0 && c.moleFraction <= 1)) {
    throw new CoreInputError(`mole fraction ${c.moleFraction} is not possible: it must be above 0 and at most 1`);
  }
  if (!(Number.isFinite(c.pathCm) && c.pathCm > 0)) throw new CoreInputError(`path length ${c.pathCm} cm is not possible: it must be above 0`);
}

/**
 * The lines of one band of one species with their Doppler and Lorentz HWHM in the cell, their
 * centres moved by the cell's pressure shift (one shift for the gas, see pressureShift.ts).
 * `intensityOf` picks the strength (absolute lineIntensity, or a relative stand-in chosen by the
 * caller); a line for which it returns null is left out.
 */
export function absorbingLines(
  species: SpeciesModel,
  lines: BandLines,
  conditions: CellConditions,
  broadening: GasBroadening,
  shift: LineCentreShift,
  intensityOf: (line: BandLines["lines"][number]) => number | null,
): AbsorbingLine[] {
  checkCellConditions(conditions);
  const mass = molecularMassU(species.atomMassesU);
  const band = bandLabel(lines.band);
  const out: AbsorbingLine[] = [];
  for (const line of lines.lines) {
    const intensity = intensityOf(line);
    if (intensity === null) continue;
    out.push({
      species: species.label,
      band,
      label: line.label,
      wavenumber: line.wavenumber + shift.shiftCm,
      wavenumberUncertainty: Math.hypot(line.wavenumberUncertainty, shift.uncertaintyCm),
      pressureShiftCm: shift.shiftCm,
      positionStatus: line.positionStatus,
      intensity,
      dopplerHwhmCm: dopplerHwhmCm(line.wavenumber, conditions.temperatureK, mass),
      lorentzHwhmCm: lorentzHwhmCm(
        broadening,
        Math.abs(runningM(line.branch, line.jLower)),
        conditions.pressurePa,
        conditions.moleFraction,
        conditions.temperatureK,
      ),
    });
  }
  return out;
}
