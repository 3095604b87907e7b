import type { Line, WavenumberCm } from "../types.ts";

export interface LocatedLine {
  molecule: string;
  species: string;
  band: string;
  label: string;
  wavenumber: WavenumberCm;
  /** The line's ± and status, printed beside every position a search shows. */
  wavenumberUncertainty: WavenumberCm;
  positionStatus: Line["positionStatus"];
  /** Relative to the strongest line of its own band. */
  relativeIntensity: number;
  /**
   * Relative to the strongest line of the whole gas (all its species and bands) at the same
   * temperature; null where the band's strength relative to the gas cannot be sourced.
   */
  gasRelativeIntensity: number | null;
  /** The band's factor from band-relative to gas-relative strength (gasRelativeIntensity = relativeIntensity × it). */
  bandToGas: number | null;
}

export interface NearbyLine extends LocatedLine {
  /** Line minus query, cm⁻¹. */
  offset: WavenumberCm;
}

/** The strength a line is judged by: relative to the gas where known, else to its own band. */
export function lineStrength(line: LocatedLine): number {
  return line.gasRelativeIntensity ?? line.relativeIntensity;
}

/**
 * Lines within ±window of a wavenumber and at least minRelative as strong as the strongest line of
 * the gas (of their band where the band's strength cannot be sourced), nearest first.
 */
export function nearbyLines(candidates: Iterable<LocatedLine>, queryWavenumber: WavenumberCm, windowCm: WavenumberCm, minRelative: number): NearbyLine[] {
  const matches: NearbyLine[] = [];
  for (const line of candidates) {
    const offset = line.wavenumber - queryWavenumber;
    if (Math.abs(offset) <= windowCm && lineStrength(line) >= minRelative) matches.push({ ...line, offset });
  }
  // Ties (same |offset|) fall back to the stronger line, then to names, so the order is stable.
  matches.sort(
    (a, b) =>
      Math.abs(a.offset) - Math.abs(b.offset) ||
      lineStrength(b) - lineStrength(a) ||
      a.molecule.localeCompare(b.molecule) ||
      a.species.localeCompare(b.species) ||
      a.label.localeCompare(b.label),
  );
  return matches;
}
