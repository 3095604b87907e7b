import type { BandLines, Line } from "../core/index.ts";

/** A band origin with the ± and status it can honestly be given. */
export interface BandOriginBound {
  wavenumber: number;
  /** The larger ± of the band's two lines next to its origin; null when the band lists no line on one side. */
  uncertainty: number | null;
  /** The weaker status of those two lines (contradicted, then not validated, then extrapolated). */
  status: Line["positionStatus"] | null;
}

const weakestFirst: ReadonlyArray<Line["positionStatus"]> = ["contradicted", "not-validated", "extrapolated", "validated"];

/**
 * ν̃0 = E(v′,0) − E(v″,0) is no line: its error is bounded by the lines either side of it (P(1) and
 * R(0) of a diatomic band), whose mean it is but for the small (B′ − B″) term. No closer bound is
 * computed, so the larger of their two ± is the origin's (said beside it wherever it is printed).
 */
export function bandOriginBound(band: BandLines): BandOriginBound {
  const origin = band.bandOrigin;
  const below = band.lines.filter((l) => l.wavenumber < origin).at(-1);
  const above = band.lines.find((l) => l.wavenumber > origin);
  if (!below || !above) return { wavenumber: origin, uncertainty: null, status: null };
  // The origin is the model's: a certified neighbour bounds it by the model's own ± and status there.
  const [b, a] = [below.model ?? below, above.model ?? above];
  const status = weakestFirst.find((s) => s === b.positionStatus || s === a.positionStatus)!;
  return { wavenumber: origin, uncertainty: Math.max(b.wavenumberUncertainty, a.wavenumberUncertainty), status };
}
