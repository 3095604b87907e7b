import type { NearbyLine } from "../core/index.ts";
import { fixed, significant } from "./numbers.ts";

// The words and cells of a position search, the same in `bandatlas find` and the website.

/** The sentence above the matches. */
export function findHeadText(o: { windowCm: number; wavenumber: number; given: string; temperatureK: number; minRelative: number; count: number }): string {
  return (
    `Lines within ±${significant(o.windowCm, 4)} cm⁻¹ of ${o.given ? fixed(o.wavenumber, 4) : o.wavenumber} cm⁻¹${o.given} at ${o.temperatureK} K, ` +
    `at least ${o.minRelative} of the strongest line of their gas: ${o.count}`
  );
}

/** Column headings and cells of the matches table. */
export const findColumns: ReadonlyArray<{ heading: string; numeric: boolean; cell: (m: NearbyLine) => string }> = [
  { heading: "molecule", numeric: false, cell: (m) => m.molecule },
  { heading: "species", numeric: false, cell: (m) => m.species },
  { heading: "band", numeric: false, cell: (m) => m.band },
  { heading: "line", numeric: false, cell: (m) => m.label },
  { heading: "ν̃ / cm⁻¹", numeric: true, cell: (m) => fixed(m.wavenumber, 4) },
  { heading: "offset / cm⁻¹", numeric: true, cell: (m) => (m.offset >= 0 ? "+" : "") + fixed(m.offset, 4) },
  { heading: "rel. to gas", numeric: true, cell: (m) => (m.gasRelativeIntensity === null ? "n/a" : significant(m.gasRelativeIntensity, 3)) },
  { heading: "rel. in band", numeric: true, cell: (m) => significant(m.relativeIntensity, 3) },
];

/** Said under the table when a match's band strength relative to its gas could not be sourced. */
export function findUnsourcedNote(matches: readonly NearbyLine[]): string | null {
  return matches.some((m) => m.gasRelativeIntensity === null)
    ? "n/a: no cited intensity ties this band's strength to the rest of its gas; it is kept and judged by its own band's strongest line."
    : null;
}
