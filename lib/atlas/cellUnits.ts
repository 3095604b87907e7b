import { standardAtmospherePa } from "../core/index.ts";

// Exact by definition: 1 lb = 0.45359237 kg, standard gravity 9.80665 m/s², 1 in = 0.0254 m, so
// 1 psi (pound-force per square inch) = 0.45359237·9.80665 / 0.0254² Pa = 6894.757293168… Pa.
const psiPa = (0.45359237 * 9.80665) / 0.0254 ** 2;
// Exact by definition (the conventional millimetre of mercury): 13.5951 g/cm³ · 9.80665 m/s² ·
// 1 mm = 133.322387415 Pa; it differs from the Torr (101325/760 Pa) by 1.4·10⁻⁷ of its value.
const mmHgPa = 133.322387415;

/**
 * The units a cell's total pressure may be given in (CLI, bench and calibrate pages), as factors
 * to Pa, all exact by definition (1 bar = 10⁵ Pa, 1 atm = 101325 Pa, 1 Torr = 101325/760 Pa).
 * The gauges people read a cell's filling from show any of them.
 */
export const pressureUnitsPa: Readonly<Record<string, number>> = {
  Pa: 1,
  kPa: 1000,
  hPa: 100,
  mbar: 100,
  bar: 1e5,
  Torr: standardAtmospherePa / 760,
  mmHg: mmHgPa,
  atm: standardAtmospherePa,
  psi: psiPa,
};
/** The units of a cell's path length, as factors to cm. */
export const lengthUnitsCm: Readonly<Record<string, number>> = { m: 100, cm: 1, mm: 0.1 };
/** Above this total pressure the ideal-gas and Voigt models mean nothing (100 atm). */
export const maxCellPressurePa = 100 * standardAtmospherePa;

/**
 * The widest range one cell spectrum may span, the same for `bandatlas spectrum` and the bench
 * page (defined once here, where both already read their units): the page computes in the
 * browser, where a wider range takes many seconds, and every principal band of the atlas fits.
 */
export const maxSpectrumRangeCm = 1000;
