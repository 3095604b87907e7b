import { sameBand } from "./band.ts";
import type { Band, Line, SpeciesModel, WavenumberCm } from "../types.ts";

/** A line position a cited standard certifies: it replaces the model's position and ± for that line. */
export interface CertifiedPosition {
  wavenumber: WavenumberCm;
  uncertaintyCm: WavenumberCm;
  sourceKey: string;
}

/** Certified positions of one band by line label (empty when the file certifies none). */
export type CertifiedPositions = ReadonlyMap<string, CertifiedPosition>;

const none: CertifiedPositions = new Map();

/**
 * The band's lines that a cited standard lists with a ± and the file marks as certified: where a
 * standard gives measured positions, those are the reference (DESIGN.md, "Where a cited standard
 * lists measured (certified) line positions"); the model gives the other lines and checks these.
 */
export function certifiedPositions(species: SpeciesModel, band: Band): CertifiedPositions {
  let out: Map<string, CertifiedPosition> | null = null;
  for (const r of species.referenceLines) {
    if (r.certifiedUncertainty === null || !sameBand(r.band, band)) continue;
    out ??= new Map();
    out.set(r.label, { wavenumber: r.wavenumber, uncertaintyCm: r.certifiedUncertainty, sourceKey: r.sourceKey });
  }
  return out ?? none;
}

/** The source of a certified line's error in a calibration budget: its own measurement, shared with no other line. */
export function certifiedShareSource(species: string, band: string, label: string): string {
  return `certified ${species} ${band} ${label}`;
}

/**
 * A position known from measurement: listed by a certified standard, or inside the measured range
 * of a band its cited lines validate. Only these may be calibration grade or count as traceable.
 */
export function measuredGrade(status: Line["positionStatus"]): boolean {
  return status === "certified" || status === "validated";
}
