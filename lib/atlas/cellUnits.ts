import { standardAtmospherePa } from "../core/index.ts";

/** The units a cell's total pressure may be given in (CLI and bench page), as factors to Pa. */
export const pressureUnitsPa: Readonly<Record<string, number>> = {
  Pa: 1,
  kPa: 1000,
  hPa: 100,
  mbar: 100,
  Torr: standardAtmospherePa / 760,
  atm: standardAtmospherePa,
};
/** The units of a cell's path length, as factors to cm. */
export const lengthUnitsCm: Readonly<Record<string, number>> = { m: 100, cm: 1, mm: 0.1 };
/** Above this total pressure the ideal-gas and Voigt models mean nothing (100 atm). */
export const maxCellPressurePa = 100 * standardAtmospherePa;
