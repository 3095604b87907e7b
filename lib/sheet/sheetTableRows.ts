// The bench sheet's line table: one row per line, position rounded to its ±, a status letter.
import { type Line } from "../core/index.ts";
import { lineCells, positionStatusWords } from "../format/index.ts";

/** Lines at least this fraction of the band's strongest are marked strong in the table. */
export const strongLineFraction = 0.5;

export interface SheetLineCell {
  label: string;
  /** Rounded to its ±, with the ± beside it and the status as one letter (sheetStatusLetters). */
  wavenumber: string;
  uncertainty: string;
  status: string;
  wavelengthVacuumUm: string;
  relativeIntensity: string;
  strong: boolean;
}

/** One row of the table: P(J'') and R(J'') of the same lower level side by side. */
export interface SheetTableRow {
  jLower: number;
  p: SheetLineCell | null;
  r: SheetLineCell | null;
}

export const sheetStatusLetters: Record<Line["positionStatus"], string> = {
  certified: "s",
  validated: "v",
  contradicted: "c",
  extrapolated: "e",
  "not-validated": "n",
};
export const sheetStatusLegend =
  "± is the line's standard uncertainty; positions are rounded to it. Status: " +
  (Object.keys(sheetStatusLetters) as Array<Line["positionStatus"]>).map((s) => `${sheetStatusLetters[s]} ${positionStatusWords[s]}`).join(", ") +
  ".";

function cellOf(line: Line): SheetLineCell {
  const c = lineCells(line);
  return {
    label: line.label,
    wavenumber: c.wavenumber,
    uncertainty: c.wavenumberUncertainty,
    status: sheetStatusLetters[line.positionStatus],
    wavelengthVacuumUm: c.wavelengthVacuumUm,
    relativeIntensity: c.relativeIntensity,
    strong: line.relativeIntensity >= strongLineFraction,
  };
}

export function tableRows(lines: Line[]): SheetTableRow[] {
  const byJ = new Map<number, SheetTableRow>();
  for (const line of lines) {
    let row = byJ.get(line.jLower);
    if (!row) byJ.set(line.jLower, (row = { jLower: line.jLower, p: null, r: null }));
    if (line.branch === "P") row.p = cellOf(line);
    else row.r = cellOf(line);
  }
  return [...byJ.values()].sort((a, b) => a.jLower - b.jLower);
}
