import { timedRuns } from "./timedRuns.ts";
import { cellLineSet, defaultCellConditions, moleculeCellSpectrum } from "../lib/atlas/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";

/**
 * A full band's transmittance: CO, 2000–2300 cm⁻¹ on a 0.002 cm⁻¹ grid (150 001 points in the
 * window, plus the instrument margin), every species and band with intensity data, 10 cm of
 * 20 Torr at 296 K, FT 0.5 cm⁻¹ triangular. Median of repeated runs after warm-up; the line set
 * (line positions, strengths and widths) is included in each run. Target ≤ 200 ms in Node.
 */
export function benchCellTransmittance(): string[] {
  const co = loadMoleculesOrThrow(shippedMoleculesDir).find((m) => m.id === "co")!;
  const settings = {
    conditions: defaultCellConditions,
    fromCm: 2000,
    toCm: 2300,
    instrument: { kind: "fourier-transform" as const, resolutionCm: 0.5, apodization: "triangular" as const },
    stepCm: 0.002,
  };
  const run = () => moleculeCellSpectrum(co, settings, cellLineSet(co, settings.conditions));
  const { last, summary } = timedRuns(run, 3, 9);
  return [`${summary} for ${last.spectrum.grid.count} grid points, ${last.set.lines.length} lines; target ≤ 200 ms`];
}
