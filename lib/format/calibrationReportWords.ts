// The words of the PDF report's header facts and residual plot (also the calibrate page's plot).
import type { RejectionReason } from "../core/index.ts";
import { conditionsText, recordOf, rejectionWords, type CalibrationRun } from "./spectrumCalibrationText.ts";

/** One labelled fact of the report's header sections; `mono` for values read character by character (hashes). */
export interface CalibrationFact {
  label: string;
  value: string;
  mono?: boolean;
}

/** What was measured and how, as the PDF report lists it: the spectrum file, then the cell and the instrument. */
export function calibrationReportFacts(run: CalibrationRun): { spectrum: CalibrationFact[]; cell: CalibrationFact[] } {
  const { calibration, spectrum } = run;
  const x = spectrum.wavenumberCm;
  const record = recordOf(run);
  const facts: CalibrationFact[] = [
    { label: "file", value: run.fileName },
    { label: "SHA-256", value: run.sha256, mono: true },
    { label: "format", value: spectrum.format === "jcamp-dx" ? "JCAMP-DX" : "CSV" },
    { label: "points", value: String(x.length) },
    { label: "range", value: `${x[0].toFixed(2)}–${x[x.length - 1].toFixed(2)} cm⁻¹` },
  ];
  if (spectrum.title) facts.push({ label: "title", value: spectrum.title });
  if (spectrum.instrument) facts.push({ label: "instrument", value: spectrum.instrument });
  return {
    spectrum: facts,
    cell: [
      { label: "gas", value: `${run.gasName} (${run.gas})` },
      { label: "cell", value: conditionsText(run.conditions, record.assumedConditions) },
      { label: "FT resolution", value: `${calibration.resolutionCm} cm⁻¹ (${calibration.resolutionFrom})` },
      { label: "apodization", value: calibration.apodization },
    ],
  };
}

/** The words of the report's residual plot: axis titles, the key to its markers and what it leaves out. */
export function calibrationPlotWords(run: CalibrationRun): {
  xTitle: string;
  yTitle: string;
  used: string;
  rejected: { reason: RejectionReason; words: string; count: number }[];
  caption: string;
} {
  const lines = run.calibration.result.lines;
  const plotted = lines.filter((l) => l.peak !== null && l.residualCm !== null);
  const reasons = Object.keys(rejectionWords) as RejectionReason[];
  const rejected = reasons
    .map((reason) => ({ reason, words: `not used: ${rejectionWords[reason]}`, count: plotted.filter((l) => !l.used && l.reason === reason).length }))
    .filter((r) => r.count > 0);
  const missing = lines.length - plotted.length;
  return {
    xTitle: "measured peak wavenumber / cm⁻¹",
    yTitle: "residual / cm⁻¹",
    used: `used in the fit (${plotted.filter((l) => l.used).length})`,
    rejected,
    caption:
      "Residual = reference − corrected measured position; bars ± σ (measured and reference ± in quadrature); an arrow marks a bar cut at the frame." +
      (missing > 0 ? ` ${missing} line${missing === 1 ? "" : "s"} without a peak ${missing === 1 ? "is" : "are"} not plotted.` : ""),
  };
}
