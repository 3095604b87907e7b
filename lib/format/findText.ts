import type { NearbyLine } from "../core/index.ts";
import type { EmptyFindHints, InterfererRegion, NeighbourLine } from "../atlas/index.ts";
import { atDecimals, fixed, positionWithUncertainty, significant } from "./numbers.ts";
import { positionStatusWords } from "./accuracyText.ts";

const withUncertainty = (value: number, sigma: number) => positionWithUncertainty(value, sigma);

// The words and cells of a position search, the same in `bandatlas find` and the website.

/** The sentence above the matches. */
export function findHeadText(o: { windowCm: number; wavenumber: number; given: string; temperatureK: number; minRelative: number; count: number }): string {
  return (
    `Lines within ±${significant(o.windowCm, 4)} cm⁻¹ of ${o.given ? fixed(o.wavenumber, 4) : o.wavenumber} cm⁻¹${o.given} at ${o.temperatureK} K, ` +
    `at least ${o.minRelative} of the strongest line of their gas: ${o.count}`
  );
}

/**
 * Column headings and cells of the matches table. The position and the offset are rounded to the
 * line's ± (the offset is as uncertain as the line), with the ± and the status beside them: an
 * offset of "+0.0006" next to a ± of 0.5 is no match, and the table must say so.
 */
export const findColumns: ReadonlyArray<{ heading: string; numeric: boolean; cell: (m: NearbyLine) => string }> = [
  { heading: "molecule", numeric: false, cell: (m) => m.molecule },
  { heading: "species", numeric: false, cell: (m) => m.species },
  { heading: "band", numeric: false, cell: (m) => m.band },
  { heading: "line", numeric: false, cell: (m) => m.label },
  { heading: "ν̃ / cm⁻¹", numeric: true, cell: (m) => withUncertainty(m.wavenumber, m.wavenumberUncertainty).value },
  { heading: "± / cm⁻¹", numeric: true, cell: (m) => withUncertainty(m.wavenumber, m.wavenumberUncertainty).sigma },
  { heading: "position", numeric: false, cell: (m) => positionStatusWords[m.positionStatus] },
  {
    heading: "offset / cm⁻¹",
    numeric: true,
    cell: (m) => (m.offset >= 0 ? "+" : "") + atDecimals(m.offset, withUncertainty(m.wavenumber, m.wavenumberUncertainty).decimals),
  },
  { heading: "rel. to gas", numeric: true, cell: (m) => (m.gasRelativeIntensity === null ? "unknown" : significant(m.gasRelativeIntensity, 3)) },
  { heading: "rel. in band", numeric: true, cell: (m) => significant(m.relativeIntensity, 3) },
];

/**
 * The matches in two lists: lines whose strength relative to their gas is known, nearest first,
 * and after them, never ranked among them, lines whose band strength no cited intensity ties to
 * the gas (a weak overtone may then look as strong as the fundamental).
 */
export function findGroups<M extends NearbyLine>(matches: readonly M[]): { known: M[]; unknown: M[] } {
  return { known: matches.filter((m) => m.gasRelativeIntensity !== null), unknown: matches.filter((m) => m.gasRelativeIntensity === null) };
}

/** The heading of the second list: why its lines are apart. */
export const findUnknownStrengthHeading =
  "Strength unknown: no cited intensity ties these bands to the rest of their gas, so they are listed apart and judged only against their own band's strongest line. They may be far weaker than the lines above.";

/** Said under the table when a match's band strength relative to its gas could not be sourced. */
export function findUnsourcedNote(matches: readonly NearbyLine[]): string | null {
  return matches.some((m) => m.gasRelativeIntensity === null) ? `rel. to gas "unknown": ${findUnknownStrengthHeading}` : null;
}

/** Said under every matches table. */
export const findPositionsNote =
  "Positions and offsets are rounded to each line's ± (two significant digits of it); a match closer than its ± is no closer than that.";

const range = (r: InterfererRegion) => `${r.band} ${r.fromCm}–${r.toCm}`;
const at = (value: number, sigma: number | null) => {
  if (sigma === null) return `${fixed(value, 2)} cm⁻¹`;
  const w = withUncertainty(value, sigma);
  return `${w.value} ± ${w.sigma} cm⁻¹`;
};
const away = (offset: number) => `${significant(Math.abs(offset), 3)} cm⁻¹ ${offset < 0 ? "below" : "above"}`;

/**
 * The sentences an empty search prints instead of silence: a band origin in the window, the
 * nearest line each side with its ± and status, and the common absorbers the atlas does not hold.
 */
export function emptyFindText(hints: EmptyFindHints, wavenumber: number): string[] {
  const out: string[] = [];
  const line = (n: NeighbourLine, withName: boolean) =>
    `${withName ? `${n.species} ${n.band} ` : ""}${n.label} at ${at(n.wavenumber, n.wavenumberUncertainty)} (${n.positionStatus}, ${away(n.offset)})`;
  for (const o of hints.originsInWindow) {
    const beside = [o.lineBelow, o.lineAbove].filter((n) => n !== null).map((n) => line(n, false));
    out.push(
      `This is the band origin of ${o.species} ${o.band} (${at(o.wavenumber, o.wavenumberUncertainty)}, ${away(o.offset)}): ` +
        `no line lies at a band origin (a Σ–Σ band has no Q branch)${beside.length ? `; its lines start at ${beside.join(" and ")}` : ""}.`,
    );
  }
  const side = (word: string, n: NeighbourLine | null) => `${word}, ${n ? line(n, true) : "none"}`;
  out.push(`Nearest lines of the atlas: ${side("below", hints.nearestBelow)}; ${side("above", hints.nearestAbove)}.`);
  const inside = hints.interferersNotInAtlas.flatMap((g) =>
    g.regions.filter((r) => wavenumber >= r.fromCm && wavenumber <= r.toCm).map((r) => `${g.gas}'s ${r.band} band (${r.fromCm}–${r.toCm} cm⁻¹)`),
  );
  if (inside.length) out.push(`${significant(wavenumber, 7)} cm⁻¹ lies in ${inside.join(" and in ")}, which the atlas does not hold.`);
  if (hints.interferersNotInAtlas.length) {
    out.push(
      "Finding no line is no evidence that nothing absorbs here: the atlas does not hold " +
        hints.interferersNotInAtlas.map((g) => `${g.gas} (${g.regions.map(range).join(", ")} cm⁻¹)`).join(", ") +
        ", nor any gas it does not list.",
    );
  }
  return out;
}
