import { diatomicBandModel } from "./bandLines.ts";
import { bandLabel, vibrationalBand } from "../positions/band.ts";
import { linearBandModel } from "./linearBandModel.ts";
import { cachedFloor } from "../positions/positionUncertainty.ts";
import type { BandModel } from "./bandModel.ts";
import { certifiedShareSource } from "../positions/certifiedPositions.ts";
import type { Band, Branch, SpeciesModel, WavenumberCm } from "../types.ts";

/** What kind of error source moves a line: the groups of a calibration's uncertainty budget. */
/** certified: a line a cited standard lists, whose error is its own measurement (shared with no other line). */
export type ErrorShareKind = "certified" | "constants" | "omitted-term" | "isotope-scaling" | "residual-floor" | "pressure-shift" | "line-shape";

/**
 * One error source's share of a line's position error: the shift (one standard deviation, with
 * its sign) that the source gives this line. Two lines with the same `source` move together, so a
 * fit over many lines cannot average the source down; different sources are independent.
 */
export interface ErrorShare {
  source: string;
  kind: ErrorShareKind;
  shiftCm: WavenumberCm;
}

function kindOf(id: string): ErrorShareKind {
  if (id.startsWith("omitted")) return "omitted-term";
  if (id.startsWith("isotope scaling")) return "isotope-scaling";
  return "constants";
}

/**
 * The shares of one line of a band model: each error component's shift
 * Σ_i row_i (u_i x'^l − w_i x''^l) (the rows of positionUncertainty.ts, whose quadrature sum is the
 * printed ±), and, where the band's residual floor (the largest residual measured lines show at
 * this |m| or below) exceeds that sum, the excess as one more share. The excess is taken as shared
 * by every line of the band: residuals of a model against measured lines vary smoothly with J, so
 * neighbouring lines miss together (our own conservative choice).
 */
export function lineErrorSharesOfModel(
  model: Pick<BandModel, "uncertainty" | "accuracy" | "species" | "band"> & Partial<Pick<BandModel, "certified">>,
  branch: Branch,
  jLower: number,
): ErrorShare[] {
  // A certified line's position is the standard's measurement, not the model's: its error is that
  // measurement's ± alone, independent of every other line (each line was measured on its own).
  const label = `${branch}(${jLower})`;
  const certified = model.certified?.get(label);
  if (certified) return [{ source: certifiedShareSource(model.species, bandLabel(model.band), label), kind: "certified", shiftCm: certified.uncertaintyCm }];
  const jUpper = branch === "R" ? jLower + 1 : jLower - 1;
  const xUpper = jUpper * (jUpper + 1);
  const xLower = jLower * (jLower + 1);
  const absM = branch === "R" ? jLower + 1 : jLower;
  const { terms, rows, ids } = model.uncertainty;
  const shares: ErrorShare[] = [];
  let variance = 0;
  rows.forEach((row, r) => {
    let shift = 0;
    terms.forEach((t, i) => {
      shift += row[i] * (t.upperWeight * Math.pow(xUpper, t.l) - t.lowerWeight * Math.pow(xLower, t.l));
    });
    if (shift === 0) return;
    variance += shift * shift;
    shares.push({ source: ids[r], kind: kindOf(ids[r]), shiftCm: shift });
  });
  const floors = cachedFloor(model.accuracy);
  const floor = floors[Math.min(absM, floors.length - 1)];
  if (floor * floor > variance) {
    shares.push({ source: `residual floor ${model.species} ${bandLabel(model.band)}`, kind: "residual-floor", shiftCm: Math.sqrt(floor * floor - variance) });
  }
  return shares;
}

/** The error shares of one line (by branch and J'') of one band of a species. */
export function lineErrorShares(species: SpeciesModel, band: Band, branch: Branch, jLower: number): ErrorShare[] {
  // Q(T) is not needed for positions: any value keeps the model from computing it.
  const options = { temperatureK: 296, partitionFunction: 1 };
  const model = species.structure === "linear" ? linearBandModel(species, band, options) : diatomicBandModel(species, vibrationalBand(band), options);
  return lineErrorSharesOfModel(model, branch, jLower);
}
