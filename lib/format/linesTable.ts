import { bandLabel, type BandLines } from "../core/index.ts";
import { bandOriginBound } from "../atlas/index.ts";
import { accuracyText, bandOriginBoundNote, bandOriginText } from "./accuracyText.ts";
import { lineColumns } from "./lineColumns.ts";
import { positionsAre } from "./lineRecords.ts";
import { significant } from "./numbers.ts";

/** How a band's transition dipole was obtained, in words for the table header. */
export const intensityOriginWords: Record<NonNullable<BandLines["intensityOrigin"]>, string> = {
  cited: "from the cited transition dipole",
  "from-band-strength": "from the cited band strength",
  "harmonic-hot-band": "hot band scaled from the cited fundamental by the harmonic rule |μ(v+1←v)|² = (v+1)|μ(1←0)|²",
  "isotope-scaled": "scaled from the reference species' cited data by the isotope relation |μ|² ∝ μ_red^(−Δv/2)",
};

export function textTable(headings: string[], rows: string[][], rightAligned: boolean[]): string {
  const widths = headings.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const pad = (cells: string[]) =>
    cells
      .map((c, i) => (rightAligned[i] ? c.padStart(widths[i]) : c.padEnd(widths[i])))
      .join("  ")
      .trimEnd();
  return [pad(headings), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(pad)].join("\n");
}

export interface LinesTableContext {
  moleculeName: string;
  formula: string;
  constantsNote: string;
  /** Known limitations of the constants (from the molecule file), printed above the table. */
  limitations?: string[];
}

/** The human-readable table of `bandatlas lines`: units in every heading. */
export function linesTable(result: BandLines, context: LinesTableContext): string {
  const intensity =
    result.intensityOrigin === null
      ? "absolute intensities: none (the molecule file cites no band strength or transition dipole for this band)"
      : `absolute intensities: ${intensityOriginWords[result.intensityOrigin]}; per molecule of the gas at natural isotopic abundance`;
  const header = [
    `${context.moleculeName} (${context.formula}), species ${result.species}, band ${bandLabel(result.band)}, T = ${result.temperatureK} K`,
    `band origin ${bandOriginText(bandOriginBound(result))}; partition function Q = ${significant(result.partitionFunction, 6)}; ${result.lines.length} lines, J'' up to ${result.jLowerMax}`,
    context.constantsNote,
    `positions: ${positionsAre}`,
    intensity,
    `accuracy: ${accuracyText(result.accuracy)}`,
    `${bandOriginBoundNote}; positions are rounded to their ± (two significant digits of it)`,
    ...(context.limitations ?? []).map((l) => `KNOWN LIMITATION: ${l}`),
    "",
  ];
  // The columns and their digits come from lineColumns; a missing absolute intensity prints as a dash.
  const columns = lineColumns.filter((c) => c.table !== null);
  const rows = result.lines.map((l) => columns.map((c) => c.cell(l) || "—"));
  const headings = columns.map((c) => c.table!);
  return (
    header.join("\n") +
    textTable(
      headings,
      rows,
      columns.map((c) => c.numeric),
    ) +
    "\n"
  );
}
