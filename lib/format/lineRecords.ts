import { bandLabel, type BandLines, type Line } from "../core/index.ts";
import { accuracyRecord, accuracyText } from "./accuracyText.ts";
import { csvRow, numeric } from "./csv.ts";
import { fixed, significant } from "./numbers.ts";

/** The JSON contract of `bandatlas lines --format json`, shared by the CLI and the site's downloads. */
export interface LinesDocument {
  molecule: string;
  species: string;
  band: string;
  temperatureK: number;
  bandOrigin: number;
  partitionFunction: number;
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
    bandOrigin: result.bandOrigin,
    partitionFunction: result.partitionFunction,
    accuracy: accuracyRecord(result.accuracy),
    limitations: [...limitations],
    lines: result.lines.map((l) => ({
      label: l.label,
      branch: l.branch,
      jLower: l.jLower,
      jUpper: l.jUpper,
      wavenumber: l.wavenumber,
      wavenumberUncertainty: l.wavenumberUncertainty,
      wavelengthVacuumUm: l.wavelengthVacuumUm,
      wavelengthAirNm: l.wavelengthAirNm,
      lowerStateEnergy: l.lowerStateEnergy,
      relativeIntensity: l.relativeIntensity,
      lineIntensity: l.lineIntensity,
      populationFraction: l.populationFraction,
      positionStatus: l.positionStatus,
    })),
  };
}

/** Column headings with their units, ASCII so every spreadsheet reads them. */
export const linesCsvHeader = [
  "label",
  "branch",
  "jLower",
  "jUpper",
  "wavenumber (cm-1)",
  "wavenumberUncertainty (cm-1)",
  "wavelengthVacuum (um)",
  "wavelengthAir (nm)",
  "lowerStateEnergy (cm-1)",
  "relativeIntensity",
  "lineIntensity (cm/molecule)",
  "populationFraction",
  "positionStatus",
];

/** The printed digits of each line, the same in CSV, table, page and sheet. */
export function lineCells(l: Line) {
  return {
    wavenumber: fixed(l.wavenumber, 4),
    wavenumberUncertainty: significant(l.wavenumberUncertainty, 2),
    wavelengthVacuumUm: fixed(l.wavelengthVacuumUm, 6),
    wavelengthAirNm: fixed(l.wavelengthAirNm, 3),
    lowerStateEnergy: fixed(l.lowerStateEnergy, 3),
    relativeIntensity: significant(l.relativeIntensity, 4),
    lineIntensity: significant(l.lineIntensity, 4),
    populationFraction: significant(l.populationFraction, 4),
  };
}

/**
 * CSV of one band: comment lines (starting "#", which common readers skip) with the band's accuracy
 * status and the molecule's known limitations, then the header and one row per line. A comment is
 * kept to one cell: commas become semicolons and quotes and line breaks are dropped, so no text of
 * a molecule file can start a second cell that a spreadsheet would read as a formula.
 */
export function linesCsv(result: BandLines, limitations: readonly string[] = []): string {
  const comments = [`# accuracy: ${accuracyText(result.accuracy)}`, ...limitations.map((l) => `# known limitation: ${l}`)];
  const rows = [...comments.map((c) => c.replace(/,/g, ";").replace(/["\r\n]+/g, " ")), csvRow(linesCsvHeader)];
  for (const l of result.lines) {
    const c = lineCells(l);
    rows.push(
      csvRow([
        l.label,
        l.branch,
        l.jLower,
        l.jUpper,
        numeric(c.wavenumber),
        numeric(c.wavenumberUncertainty),
        numeric(c.wavelengthVacuumUm),
        numeric(c.wavelengthAirNm),
        numeric(c.lowerStateEnergy),
        numeric(c.relativeIntensity),
        numeric(c.lineIntensity),
        numeric(c.populationFraction),
        l.positionStatus,
      ]),
    );
  }
  return rows.join("\n") + "\n";
}
