import { timedRuns } from "./timedRuns.ts";
import { calibrateMeasuredSpectrum, cellModel, defaultCellConditions } from "../lib/atlas/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { readSpectrumText } from "../lib/spectrumFile/index.ts";
import { measuredSpectrum, seededRandom, trueSpectrum } from "../lib/atlas/syntheticSpectrum.ts";

export const calibrateBenchPoints = 65_536;

/**
 * The invented 65 536-point spectrum of the calibrate figures: 10 cm of CO at 20 Torr seen by an
 * FTIR at 0.25 cm⁻¹ (triangular), 1000–5000 cm⁻¹ every 0.061 cm⁻¹, with a +80 ppm scale error,
 * noise and a tilted baseline, written as a two-column CSV (made by our own cell model).
 */
export function calibrateBenchCsv(): string {
  const co = loadMoleculesOrThrow(shippedMoleculesDir).find((m) => m.id === "co")!;
  const truth = trueSpectrum(cellModel(co), defaultCellConditions, 0.25, "triangular", 1990, 2290);
  const step = 4000 / (calibrateBenchPoints - 1);
  const m = measuredSpectrum(
    truth,
    1000,
    5000,
    step,
    { scale: 80e-6, offsetCm: 0, noiseAbsorbance: 0.001, tiltPerCm: 2e-6, baselineAbsorbance: 0.05 },
    seededRandom(5),
  );
  const rows = ["wavenumber (cm-1),absorbance"];
  for (let i = 0; i < m.wavenumberCm.length; i++) rows.push(`${m.wavenumberCm[i].toFixed(5)},${m.absorbance[i].toFixed(6)}`);
  return rows.join("\n");
}

/**
 * A whole calibration in Node, from the file's text to the fitted correction: reading the CSV,
 * peaks, resolution estimate, the predicted spectrum of the gas (a fresh cell model each run, so
 * nothing is reused), assignment and fit. Median of repeated runs after warm-up. Target ≤ 300 ms.
 */
export function benchCalibrateSpectrum(): string[] {
  const co = loadMoleculesOrThrow(shippedMoleculesDir).find((m) => m.id === "co")!;
  const text = calibrateBenchCsv();
  const run = () => {
    const spectrum = readSpectrumText(text, "bench.csv");
    return calibrateMeasuredSpectrum(
      cellModel(co),
      { wavenumberCm: spectrum.wavenumberCm, absorbance: spectrum.absorbance, resolutionCm: spectrum.resolutionCm },
      { conditions: defaultCellConditions, apodization: "triangular", model: "scale" },
    );
  };
  const { last, summary } = timedRuns(run, 2, 7);
  const k = last.result.correction;
  return [
    `${summary} for ${calibrateBenchPoints} points, ${last.result.usedCount} lines used, k = ${(k.scale * 1e6).toFixed(2)} ± ${(k.scaleUncertainty * 1e6).toFixed(2)} ppm (true +80); target ≤ 300 ms`,
  ];
}
