import type { WavenumberCm } from "./types.ts";

export interface LocatedLine {
  molecule: string;
  species: string;
  band: string;
  label: string;
  wavenumber: WavenumberCm;
  relativeIntensity: number;
}

export interface NearbyLine extends LocatedLine {
  /** Line minus query, cm⁻¹. */
  offset: WavenumberCm;
}

/** Lines within ±window of a wavenumber and at least minRelative strong, nearest first. */
export function nearbyLines(candidates: Iterable<LocatedLine>, queryWavenumber: WavenumberCm, windowCm: WavenumberCm, minRelative: number): NearbyLine[] {
  const matches: NearbyLine[] = [];
  for (const line of candidates) {
    const offset = line.wavenumber - queryWavenumber;
    if (Math.abs(offset) <= windowCm && line.relativeIntensity >= minRelative) matches.push({ ...line, offset });
  }
  // Ties (same |offset|) fall back to the stronger line, then to names, so the order is stable.
  matches.sort(
    (a, b) =>
      Math.abs(a.offset) - Math.abs(b.offset) ||
      b.relativeIntensity - a.relativeIntensity ||
      a.molecule.localeCompare(b.molecule) ||
      a.species.localeCompare(b.species) ||
      a.label.localeCompare(b.label),
  );
  return matches;
}
