import { bandLabel, type BandLines, type Line } from "../core/index.ts";
import { bandOriginBound } from "../atlas/index.ts";
import { accuracyRecord, accuracyText } from "./accuracyText.ts";
import { csvRow, numeric } from "./csv.ts";
import { csvLineColumns, lineColumns } from "./lineColumns.ts";
import { roundedToUncertainty, wavelengthSigmaUm } from "./numbers.ts";

/**
 * What every line table says of its positions: the pressure shift of a filled cell is left out
 * here and applied by the cell outputs (spectrum, calibration lines), where it is cited.
 */
export const positionsAre =
  "zero-pressure line centres in vacuum wavenumbers; a filled cell moves them by its pressure shift, which the cell spectrum and calibration lines apply where one is cited";

/** The JSON contract of `bandatlas lines --format json`, shared by the CLI and the site's downloads. */
export interface LinesDocument {
  molecule: string;
  species: string;
  band: string;
  temperatureK: number;
  /** Rounded to its ±, as every position (bandOriginBoundNote). */
  bandOrigin: number;
  /** The larger ± of the band's first P and R lines; null when it lists none on one side. */
  bandOriginUncertainty: number | null;
  bandOriginStatus: Line["positionStatus"] | null;
  partitionFunction: number;
  /** What the positions are (positionsAre): zero-pressure line centres. */
  positions: string;
  /** How the band's positions were validated against cited measured lines. */
  accuracy: ReturnType<typeof accuracyRecord>;
  /** Known limitations of the molecule's constants, from its file. */
  limitations: string[];
  lines: Array<
    Pick<
      Line,
      | "label"
      | "branch"
      | "jLower"
      | "jUpper"
      | "wavenumber"
      | "wavenumberUncertainty"
      | "wavelengthVacuumUm"
      | "wavelengthAirNm"
      | "lowerStateEnergy"
      | "relativeIntensity"
      | "lineIntensity"
      | "populationFraction"
      | "positionStatus"
    >
  >;
}

export function linesDocument(moleculeId: string, result: BandLines, limitations: readonly string[] = []): LinesDocument {
  return {
    molecule: moleculeId,
    species: result.species,
    band: bandLabel(result.band),
    temperatureK: result.temperatureK,
    ...bandOriginRecord(result),
    partitionFunction: result.partitionFunction,
    positions: positionsAre,
    accuracy: accuracyRecord(result.accuracy),
    limitations: [...limitations],
    lines: result.lines.map((l) => ({
      ...(Object.fromEntries(csvLineColumns.map((c) => [c.key, l[c.key]])) as LinesDocument["lines"][number]),
      ...roundedPositions(l),
    })),
  };
}

/**
 * The positions of a JSON line rounded to their ± (two significant digits of it), as every printed
 * position is: the digits beyond carry no information, and a reader who copies them would claim it.
 */
export function roundedPositions(l: Line): Pick<Line, "wavenumber" | "wavenumberUncertainty" | "wavelengthVacuumUm" | "wavelengthAirNm"> {
  const sigmaUm = wavelengthSigmaUm(l.wavenumber, l.wavenumberUncertainty);
  return {
    wavenumber: roundedToUncertainty(l.wavenumber, l.wavenumberUncertainty),
    wavenumberUncertainty: roundedToUncertainty(l.wavenumberUncertainty, l.wavenumberUncertainty),
    wavelengthVacuumUm: roundedToUncertainty(l.wavelengthVacuumUm, sigmaUm),
    wavelengthAirNm: roundedToUncertainty(l.wavelengthAirNm, sigmaUm * 1000),
  };
}

function bandOriginRecord(result: BandLines) {
  const bound = bandOriginBound(result);
  const sigma = bound.uncertainty;
  return {
    bandOrigin: sigma === null ? result.bandOrigin : roundedToUncertainty(result.bandOrigin, sigma),
    bandOriginUncertainty: sigma === null ? null : roundedToUncertainty(sigma, sigma),
    bandOriginStatus: bound.status,
  };
}

/** Column headings with their units, ASCII so every spreadsheet reads them. */
export const linesCsvHeader = csvLineColumns.map((c) => c.csv);

/** The printed digits of each line, the same in CSV, table, page and sheet (from lineColumns). */
export function lineCells(l: Line): Record<keyof Line & string, string> {
  return Object.fromEntries(lineColumns.map((c) => [c.key, c.cell(l)])) as Record<keyof Line & string, string>;
}

/**
 * CSV of one band: comment lines (starting "#", which common readers skip) with the band's accuracy
 * status and the molecule's known limitations, then the header and one row per line. A comment is
 * kept to one cell: commas become semicolons and quotes and line breaks are dropped, so no text of
 * a molecule file can start a second cell that a spreadsheet would read as a formula.
 */
export function linesCsv(result: BandLines, limitations: readonly string[] = []): string {
  const comments = [`# accuracy: ${accuracyText(result.accuracy)}`, `# positions: ${positionsAre}`, ...limitations.map((l) => `# known limitation: ${l}`)];
  const rows = [...comments.map((c) => c.replace(/,/g, ";").replace(/["\r\n]+/g, " ")), csvRow(linesCsvHeader)];
  for (const l of result.lines)
    rows.push(
      csvRow(
        csvLineColumns.map((c) => {
          const text = (c.csvCell ?? c.cell)(l);
          return c.numeric ? numeric(text) : text;
        }),
      ),
    );
  return rows.join("\n") + "\n";
}
