import { bandLines } from "./bandLines.ts";
import { sameBand } from "./band.ts";
import type { ReferenceLine, SpeciesModel } from "./types.ts";

export interface LineResidual {
  reference: ReferenceLine;
  predicted: number | null;
  /** Predicted minus measured, cm⁻¹; null when the model has no line with that label. */
  predictedMinusMeasured: number | null;
}

/** Predicted minus measured for every cited reference line of a species (positions do not depend on T). */
export function lineResiduals(species: SpeciesModel): LineResidual[] {
  const out: LineResidual[] = [];
  const byBand = new Map<string, ReturnType<typeof bandLines>>();
  for (const reference of species.referenceLines) {
    const key = `${reference.band.vUpper}-${reference.band.vLower}`;
    let computed = byBand.get(key);
    if (!computed) {
      computed = bandLines(species, reference.band, { temperatureK: 296, minRelative: 0 });
      byBand.set(key, computed);
    }
    const line = computed.lines.find((l) => l.label === reference.label && sameBand(computed!.band, reference.band));
    out.push({
      reference,
      predicted: line?.wavenumber ?? null,
      predictedMinusMeasured: line ? line.wavenumber - reference.wavenumber : null,
    });
  }
  return out;
}
