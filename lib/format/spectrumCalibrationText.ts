import type { CellConditions, RejectionReason } from "../core/index.ts";
import { standardAtmospherePa } from "../core/index.ts";
import type { MeasuredCalibration } from "../atlas/index.ts";
import type { MeasuredSpectrum } from "../spectrumFile/index.ts";
import { budgetTable, referenceStandingLine } from "./correctionBudgetText.ts";
import { applyCorrectionSentence, residualLines } from "./applyCorrectionText.ts";
import { assumedConditionsNote, assumedWord, noRecordFields, recordFacts, type CalibrationRecordFields } from "./calibrationRecord.ts";
import { runVerdict, verdictLines, verdictRule } from "./calibrationVerdict.ts";
import { textTable } from "./linesTable.ts";
import { positionWithUncertainty } from "./numbers.ts";
import { residualSignText } from "./accuracyText.ts";

/** Everything one calibration run produced, as the table, the JSON, the page and the report show it. */
export interface CalibrationRun {
  gas: string;
  gasName: string;
  fileName: string;
  sha256: string;
  spectrum: MeasuredSpectrum;
  conditions: CellConditions;
  calibration: MeasuredCalibration;
  /** The molecule's hazard caution, one paragraph (it ends with the prediction notice). */
  caution: string;
  /** The molecule file's sources, one citation each. */
  sources: string[];
  /** Instrument, operator, cell, date, tolerance and the assumed cell conditions (none given: all empty). */
  record?: CalibrationRecordFields;
}

/** A value and its standard uncertainty at the uncertainty's second significant digit. */
export function withUncertainty(value: number, sigma: number): { value: string; sigma: string } {
  if (!(sigma > 0) || !Number.isFinite(sigma)) return { value: value.toPrecision(6), sigma: "0" };
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(sigma)));
  return { value: value.toFixed(decimals), sigma: sigma.toFixed(decimals) };
}

export const signed = (text: string) => (text.startsWith("-") ? text.replace("-", "−") : `+${text}`);
/** Wavenumbers of peaks and references: 0.0001 cm⁻¹, below any measured ± here. */
export const calibrationPositionDigits = 4;
export const calibrationPosition = (x: number | null) => (x === null ? null : Number(x.toFixed(calibrationPositionDigits)));

export const rejectionWords: Record<RejectionReason, string> = {
  weak: "weak",
  saturated: "saturated",
  blended: "blended",
  "uncertain-reference": "reference too uncertain",
  residual: "residual (outlier)",
};

export const correctionModelWords = {
  scale: "scale: true = measured × (1 + k)",
  offset: "offset: true = measured + c",
  linear: "linear: true = measured × (1 + k) + c",
  quadratic: "quadratic: true = measured × (1 + k) + c + q·(measured − centre)²",
} as const;

/** The cell's conditions, each one the user did not give marked "assumed". */
export function conditionsText(c: CellConditions, assumed: ReadonlyArray<keyof CellConditions> = []): string {
  const mark = (key: keyof CellConditions, text: string) => (assumed.includes(key) ? `${text} (${assumedWord})` : text);
  return [
    mark("pathCm", `${c.pathCm} cm cell`),
    mark("temperatureK", `${c.temperatureK} K`),
    mark("pressurePa", `${((c.pressurePa * 760) / standardAtmospherePa).toPrecision(4)} Torr`),
    mark("moleFraction", `mole fraction ${c.moleFraction}`),
  ].join(", ");
}

export const recordOf = (run: CalibrationRun) => run.record ?? noRecordFields;

/** The correction in words, one line per term, for the table, the page and the report's box. */
export function correctionLines(run: CalibrationRun): string[] {
  const { result } = run.calibration;
  const c = result.correction;
  const lines: string[] = [];
  if (c.model !== "offset") {
    const k = withUncertainty(c.scale * 1e6, c.scaleUncertainty * 1e6);
    lines.push(`scale k = ${signed(k.value)} ± ${k.sigma} ppm`);
  }
  if (c.model !== "scale") {
    const o = withUncertainty(c.offsetCm, c.offsetUncertaintyCm);
    lines.push(`offset c = ${signed(o.value)} ± ${o.sigma} cm⁻¹`);
  }
  if (c.model === "quadratic") {
    const q = withUncertainty(c.quadraticPerCm, c.quadraticUncertaintyPerCm);
    lines.push(`quadratic q = ${signed(q.value)} ± ${q.sigma} cm⁻¹ per cm⁻², about ${c.centreCm.toFixed(2)} cm⁻¹`);
  }
  if (c.model === "linear" || c.model === "quadratic") lines.push(`correlation of k and c: ${c.scaleOffsetCorrelation.toFixed(3).replace("-", "−")}`);
  lines.push(
    `RMS residual ${result.rmsResidualCm.toPrecision(2)} cm⁻¹ over ${result.usedCount} lines; χ²/ν = ${Number.isFinite(c.reducedChiSquared) ? c.reducedChiSquared.toFixed(2) : "—"}`,
  );
  const standing = referenceStandingLine(result);
  if (standing) lines.push(standing);
  return lines;
}

/** The stated rules, in one paragraph. */
export function calibrationRulesText(run: CalibrationRun): string {
  const r = run.calibration.result.rules;
  const k = run.calibration.referenceCriteria;
  return (
    `Rules (our own, common practice, no source): peaks are assigned by an exhaustive vote over scale errors within ±${r.bounds.maxScalePpm} ppm and offsets within ±${r.bounds.maxOffsetCm} cm⁻¹; ` +
    `a line is used when its reference ± is at most ${k.maxUncertaintyFraction} × resolution, no line ≥ ${100 * k.blendFraction} % as strong lies within one resolution, ` +
    `its peak is ≥ ${r.minSignalToNoise} × the noise, below absorbance ${r.saturationAbsorbance} without a flat top, and no peak twice as high (and ≥ ${r.saturationAbsorbance / 2}) lies within ${r.strongNeighbourResolutions} resolutions; ` +
    `the worst line is rejected while, refitted without it, it lies more than 3 × max(1, √(χ²/ν)) of its σ from the fit. ` +
    `No peak position is taken as better than ${r.peakFloorFraction} × resolution; a correction at the edge of the search, or whose fitted terms correlate beyond ${r.maxTermCorrelation}, is refused. ` +
    `The ± of k and c is the budget's total: each error source carried through the fit with its correlation over the lines (shared sources are not averaged down). ` +
    `References are the apparent peaks predicted for this cell and resolution (${Math.round(100 * k.peakShiftUncertaintyFraction)} % of the predicted peak shift is added to their ±), their centres moved by the cited pressure shift where there is one (see the notes).`
  );
}

/** Sentences every output of a calibration carries: what was detected, assumed and left out. */
export function calibrationNotes(run: CalibrationRun): string[] {
  const { calibration } = run;
  const { result } = calibration;
  const notes = [...run.spectrum.notes, `${calibration.resolutionNote}.`, ...calibration.set.notes];
  const assumed = assumedConditionsNote(recordOf(run));
  if (assumed) notes.unshift(assumed);
  if (run.spectrum.abscissaUnit !== "cm-1") {
    // Optical spectrum analysers and wavemeters often report wavelengths in standard air, whose
    // refractive index would read as a scale error: 1/n − 1 ≈ −2.73·10⁻⁴ from 2000 to 6500 cm⁻¹ (Edlén, core airRefractiveIndexEdlen).
    notes.push(
      "The file's wavelengths were taken as vacuum wavelengths; an axis in standard air shows here as a scale error of about −273 ppm (1/n − 1 for standard air, Edlén), not as an instrument fault.",
    );
  }
  const used = result.lines.filter((l) => l.used);
  const unvalidated = used.filter((l) => l.reference.positionStatus === "not-validated").length;
  if (unvalidated > 0) {
    notes.push(
      `${unvalidated} of the ${used.length} lines used have predicted positions not validated against measured lines (their ± is the constants' own estimate): the correction is only as good as that ±.`,
    );
  }
  if (result.missingTerm) {
    const m = result.missingTerm;
    const size =
      m.term === "offset"
        ? `an offset of ${signed(withUncertainty(m.value, m.uncertainty).value)} ± ${withUncertainty(m.value, m.uncertainty).sigma} cm⁻¹`
        : `a scale of ${signed(withUncertainty(m.value * 1e6, m.uncertainty * 1e6).value)} ± ${withUncertainty(m.value * 1e6, m.uncertainty * 1e6).sigma} ppm`;
    notes.push(
      `The same lines fitted with scale and offset together show ${size}, more than 3σ from zero: this instrument's error is not a pure ${result.correction.model}; the linear model (--model linear) describes it better.`,
    );
  }
  if (result.budget.measurementInflation > 1) {
    notes.push(
      `The residuals scatter more than the stated ± explain: every line's measurement ± is widened ${result.budget.measurementInflation.toFixed(2)}× (the budget's measurement row).`,
    );
  }
  if (result.unassignedPeakCount > 0) {
    notes.push(
      `${result.unassignedPeakCount} peak${result.unassignedPeakCount === 1 ? "" : "s"} of the spectrum near the band match no listed line of ${run.gasName} (noise, other gases, or lines weaker than ${100 * calibration.referenceCriteria.minRelativeStrength} % of the strongest).`,
    );
  }
  return notes;
}

export const calibrationResidualSign = `residual = reference − corrected measured position (${residualSignText}: the sign of every residual the atlas prints)`;

/** The line table's rows, as the CLI and the report print them. */
export function calibrationLineRows(run: CalibrationRun): { headings: string[]; rows: string[][]; rightAligned: boolean[] } {
  const headings = ["species", "band", "line", "reference/cm⁻¹", "± ref", "measured/cm⁻¹", "± meas", "residual/cm⁻¹", "used", "why not"];
  const rows = run.calibration.result.lines.map((l) => [
    l.reference.species,
    l.reference.band,
    l.reference.label,
    // The reference is a printed position: rounded to its ± like every other (positionWithUncertainty).
    positionWithUncertainty(l.reference.referenceCm ?? l.reference.wavenumber, l.reference.referenceUncertaintyCm).value,
    positionWithUncertainty(l.reference.referenceCm ?? l.reference.wavenumber, l.reference.referenceUncertaintyCm).sigma,
    l.peak ? l.peak.wavenumberCm.toFixed(calibrationPositionDigits) : "—",
    l.measurementSigmaCm === null ? "—" : l.measurementSigmaCm.toPrecision(2),
    l.residualCm === null ? "—" : signed(l.residualCm.toFixed(calibrationPositionDigits)),
    l.used ? "yes" : "no",
    l.reason ? `${rejectionWords[l.reason]}: ${l.detail}` : "",
  ]);
  return { headings, rows, rightAligned: [false, false, false, true, true, true, true, true, false, false] };
}

/** The readable report of `bandatlas calibrate`. */
export function calibrationText(run: CalibrationRun): string {
  const { calibration } = run;
  const x = run.spectrum.wavenumberCm;
  const table = calibrationLineRows(run);
  const box = correctionLines(run);
  const width = Math.max(...box.map((l) => l.length)) + 2;
  const budget = budgetTable(calibration.result);
  const record = recordOf(run);
  const verdict = runVerdict(run);
  return [
    `Wavenumber calibration of ${run.fileName} against ${run.gasName}`,
    ...recordFacts(record).map((f) => `${f.label}: ${f.value}`),
    `file SHA-256 ${run.sha256}`,
    `spectrum: ${run.spectrum.format === "jcamp-dx" ? "JCAMP-DX" : "CSV"}, ${x.length} points, ${x[0].toFixed(2)}–${x[x.length - 1].toFixed(2)} cm⁻¹` +
      (run.spectrum.title ? `, "${run.spectrum.title}"` : "") +
      (run.spectrum.instrument ? `, instrument ${run.spectrum.instrument}` : ""),
    `cell: ${conditionsText(run.conditions, record.assumedConditions)}; FT resolution ${calibration.resolutionCm} cm⁻¹ (${calibration.resolutionFrom}), ${calibration.apodization} apodization`,
    `model: ${correctionModelWords[calibration.result.correction.model]}`,
    "",
    `┌${"─".repeat(width)}┐`,
    ...box.map((l) => `│ ${l.padEnd(width - 1)}│`),
    `└${"─".repeat(width)}┘`,
    ...(verdict ? ["", ...verdictLines(verdict), verdictRule] : []),
    "",
    applyCorrectionSentence(run),
    ...residualLines(run),
    "",
    textTable(budget.headings, budget.rows, budget.rightAligned),
    "",
    textTable(table.headings, table.rows, table.rightAligned),
    calibrationResidualSign,
    "",
    ...calibrationNotes(run).map((n) => `note: ${n}`),
    calibrationRulesText(run),
    "",
    run.caution,
    "",
  ].join("\n");
}
