import type { OrdinateKind } from "./measuredSpectrum.ts";
import { rangeText, shortNumber } from "./numberText.ts";

function median(values: ArrayLike<number>): number {
  const sorted = Float64Array.from(values).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/**
 * What unlabelled y values are. A percent transmittance sits mostly well above 1 and never far
 * past 100 (noise and a baseline slightly above 100 % are common); a transmittance stays in 0–1
 * with small excursions and is mostly near 1 outside the lines. Everything else is taken as
 * absorbance, which is what most gas-cell exports hold.
 */
export function detectOrdinate(y: ArrayLike<number>): { kind: OrdinateKind; note: string } {
  const values = Array.from(y);
  const mid = median(values);
  const max = values.reduce((m, v) => Math.max(m, v), -Infinity);
  const min = values.reduce((m, v) => Math.min(m, v), Infinity);
  const aboveOneAndHalf = values.filter((v) => v > 1.5).length / values.length;
  const described = `The y values (${rangeText(values)}, median ${shortNumber(mid)}) carry no unit`;
  const override = "(give --y absorbance, --y transmittance or --y percent-transmittance to say otherwise)";
  if (aboveOneAndHalf > 0.5 && max <= 110 && min >= -10) {
    return {
      kind: "percent-transmittance",
      note: `${described}; they were read as percent transmittance because most lie above 1.5 and none above 110 ${override}.`,
    };
  }
  if (min >= -0.05 && max <= 1.05 && mid > 0.5) {
    return { kind: "transmittance", note: `${described}; they were read as transmittance because they lie within 0–1 with a median above 0.5 ${override}.` };
  }
  return {
    kind: "absorbance",
    note: `${described}; they were read as absorbance because they are neither a 0–1 transmittance nor a percent transmittance ${override}.`,
  };
}
