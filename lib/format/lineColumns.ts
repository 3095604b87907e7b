import type { Line } from "../core/index.ts";
import { atDecimals, fixed, positionWithUncertainty, significant, uncertaintyDecimals, wavelengthSigmaUm } from "./numbers.ts";
import { positionStatusWords } from "./accuracyText.ts";

/**
 * The one table of line columns: the JSON field (the key), its unit, its heading in each output
 * and its printed digits. The CLI table, the CSV, the JSON, the species pages and the bench sheets
 * all read their columns from here, so a new column is one row below (and the value in core).
 */
export interface LineColumn {
  key: keyof Line;
  /** The unit of the JSON value and the CSV column. */
  unit: string | null;
  /** ASCII heading of the CSV, with the unit in brackets. */
  csv: string;
  /** Heading of the CLI text table and the bench sheet (null: not in that output). */
  table: string | null;
  /** Heading of the species pages' table: name, then the unit line (null: not on the pages). */
  page: { name: string; unit: string } | null;
  /** Printed digits, the same in every output but the CSV where \`csvCell\` is given. */
  cell: (line: Line) => string;
  /**
   * The CSV's digits where its unit differs from the printed one: the CSV keeps the unit of the
   * JSON key (wavelengthAirNm), while tables and pages print both wavelengths in µm.
   */
  csvCell?: (line: Line) => string;
  /** Right-aligned in text tables; a number cell in the CSV. */
  numeric: boolean;
}

/**
 * Wavelengths are positions too: printed to the decimal of their own ±, carried over from the
 * wavenumber's (air and vacuum differ by 3·10⁻⁴, far below a change of printed place).
 */
function wavelengthDecimalsUm(l: Line): number {
  // Never finer than 10⁻⁶ µm (1 pm): a wavelength is read off a grating or a wavemeter, neither of
  // which resolves less, and a sheet column has no room for more; the wavenumber keeps every digit
  // its ± supports (our own choice).
  return Math.min(uncertaintyDecimals(wavelengthSigmaUm(l.wavenumber, l.wavenumberUncertainty)), 6);
}

export const lineColumns: readonly LineColumn[] = [
  { key: "label", unit: null, csv: "label", table: "line", page: null, cell: (l) => l.label, numeric: false },
  { key: "branch", unit: null, csv: "branch", table: null, page: null, cell: (l) => l.branch, numeric: false },
  { key: "jLower", unit: null, csv: "jLower", table: null, page: null, cell: (l) => String(l.jLower), numeric: true },
  { key: "jUpper", unit: null, csv: "jUpper", table: null, page: null, cell: (l) => String(l.jUpper), numeric: true },
  {
    key: "wavenumber",
    unit: "cm⁻¹",
    csv: "wavenumber (cm-1)",
    table: "ν̃ / cm⁻¹",
    page: { name: "wavenumber ν̃", unit: "/ cm⁻¹ (vacuum)" },
    cell: (l) => positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).value,
    numeric: true,
  },
  {
    key: "wavenumberUncertainty",
    unit: "cm⁻¹",
    csv: "wavenumberUncertainty (cm-1)",
    table: "± / cm⁻¹",
    page: { name: "± ν̃", unit: "/ cm⁻¹" },
    cell: (l) => positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).sigma,
    numeric: true,
  },
  {
    key: "positionStatus",
    unit: null,
    csv: "positionStatus",
    table: "position",
    page: { name: "position", unit: "" },
    cell: (l) => positionStatusWords[l.positionStatus],
    csvCell: (l) => l.positionStatus,
    numeric: false,
  },
  {
    key: "wavelengthVacuumUm",
    unit: "µm",
    csv: "wavelengthVacuum (um)",
    table: "λ vac / µm",
    page: { name: "λ vacuum", unit: "/ µm" },
    cell: (l) => atDecimals(l.wavelengthVacuumUm, wavelengthDecimalsUm(l)),
    numeric: true,
  },
  {
    key: "wavelengthAirNm",
    // nm is the unit of the JSON key and the CSV; the table and the pages print µm, as for the
    // vacuum wavelength beside it, so one table never mixes two wavelength units.
    unit: "nm",
    csv: "wavelengthAir (nm)",
    table: "λ air / µm",
    page: { name: "λ air", unit: "/ µm" },
    cell: (l) => atDecimals(l.wavelengthAirNm / 1000, wavelengthDecimalsUm(l)),
    csvCell: (l) => atDecimals(l.wavelengthAirNm, wavelengthDecimalsUm(l) - 3),
    numeric: true,
  },
  {
    key: "lowerStateEnergy",
    unit: "cm⁻¹",
    csv: "lowerStateEnergy (cm-1)",
    table: "E'' / cm⁻¹",
    page: { name: "E″ lower state", unit: "/ cm⁻¹" },
    cell: (l) => fixed(l.lowerStateEnergy, 3),
    numeric: true,
  },
  {
    key: "relativeIntensity",
    unit: null,
    csv: "relativeIntensity",
    table: "rel. int.",
    page: { name: "relative intensity", unit: "(strongest = 1)" },
    cell: (l) => significant(l.relativeIntensity, 4),
    numeric: true,
  },
  {
    key: "lineIntensity",
    unit: "cm/molecule",
    csv: "lineIntensity (cm/molecule)",
    table: "S / cm·molecule⁻¹",
    page: { name: "line intensity S", unit: "/ cm molecule⁻¹" },
    cell: (l) => significant(l.lineIntensity, 4),
    numeric: true,
  },
  {
    key: "populationFraction",
    unit: null,
    csv: "populationFraction",
    table: "pop. fraction",
    page: null,
    cell: (l) => significant(l.populationFraction, 4),
    numeric: true,
  },
];

export function lineColumn(key: keyof Line): LineColumn {
  const column = lineColumns.find((c) => c.key === key);
  if (!column) throw new Error(`no line column ${String(key)}`);
  return column;
}

/** The CSV's column order: every column, positionStatus last (it was added after the others). */
export const csvLineColumns: readonly LineColumn[] = [...lineColumns.filter((c) => c.key !== "positionStatus"), lineColumn("positionStatus")];
