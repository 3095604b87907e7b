import type { CellConditions, RejectionReason } from "../core/index.ts";
import { standardAtmospherePa } from "../core/index.ts";
import type { MeasuredCalibration } from "../atlas/index.ts";
import type { MeasuredSpectrum } from "../spectrumFile/index.ts";
import { budgetDocument, budgetTable, referenceStanding, referenceStandingLine } from "./correctionBudgetText.ts";
import { applyCorrectionSentence, residualLines, residualsAfterCorrection } from "./applyCorrectionText.ts";
import { assumedConditionsNote, assumedWord, noRecordFields, recordFacts, type CalibrationRecordFields } from "./calibrationRecord.ts";
import { runVerdict, verdictDocument, verdictLines, verdictRule } from "./calibrationVerdict.ts";
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

const signed = (text: string) => (text.startsWith("-") ? text.replace("-", "−") : `+${text}`);
/** Wavenumbers of peaks and references: 0.0001 cm⁻¹, below any measured ± here. */
export const calibrationPositionDigits = 4;
const position = (x: number | null) => (x === null ? null : Number(x.toFixed(calibrationPositionDigits)));

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

const recordOf = (run: CalibrationRun) => run.record ?? noRecordFields;

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

/** The `--format json` document: the shape the issue fixed, with fields added after it. */
export function calibrationDocument(run: CalibrationRun) {
  const { calibration } = run;
  const { result } = calibration;
  const c = result.correction;
  const k = withUncertainty(c.scale * 1e6, c.scaleUncertainty * 1e6);
  const o = withUncertainty(c.offsetCm, c.offsetUncertaintyCm);
  const q = withUncertainty(c.quadraticPerCm, c.quadraticUncertaintyPerCm);
  const x = run.spectrum.wavenumberCm;
  const record = recordOf(run);
  return {
    record: {
      instrument: record.instrument,
      operator: record.operator,
      cell: { id: record.cellId, filledOn: record.cellFilledOn },
      measuredOn: record.measuredOn,
      measuredOnFrom: record.measuredOnFrom,
      tolerance: record.tolerance,
    },
    ...verdictDocument(runVerdict(run)),
    gas: run.gas,
    file: run.fileName,
    sha256: run.sha256,
    model: c.model,
    resolutionCm: calibration.resolutionCm,
    correction: {
      scalePpm: c.model === "offset" ? 0 : Number(k.value),
      scalePpmUncertainty: c.model === "offset" ? 0 : Number(k.sigma),
      offsetCm: c.model === "scale" ? 0 : Number(o.value),
      offsetCmUncertainty: c.model === "scale" ? 0 : Number(o.sigma),
      ...(c.model === "quadratic"
        ? { quadraticPerCm: Number(q.value), quadraticPerCmUncertainty: Number(q.sigma), quadraticCentreCm: position(c.centreCm) }
        : {}),
      scaleOffsetCorrelation: c.model === "linear" || c.model === "quadratic" ? Number(c.scaleOffsetCorrelation.toFixed(3)) : null,
      reducedChiSquared: Number.isFinite(c.reducedChiSquared) ? Number(c.reducedChiSquared.toFixed(3)) : null,
      meaning: correctionModelWords[c.model],
      budget: budgetDocument(result),
      referenceStanding: referenceStanding(result).standing,
      referenceStandingNote: referenceStandingLine(result),
    },
    apply: applyCorrectionSentence(run),
    residualsAfterCorrection: residualsAfterCorrection(run).map((r) => ({
      wavenumberCm: Number(r.wavenumberCm.toFixed(4)),
      expandedUncertaintyCm: Number(r.expandedCm.toPrecision(2)),
      afterLaserOnlyCm: r.afterLaserOnlyCm === null ? null : Number(r.afterLaserOnlyCm.toPrecision(3)),
    })),
    rmsResidualCm: Number(result.rmsResidualCm.toPrecision(2)),
    linesUsed: result.usedCount,
    lines: result.lines.map((l) => ({
      label: l.reference.label,
      species: l.reference.species,
      band: l.reference.band,
      reference: position(l.reference.referenceCm ?? l.reference.wavenumber),
      measured: position(l.peak?.wavenumberCm ?? null),
      residual: position(l.residualCm),
      used: l.used,
      reason: l.reason,
      detail: l.detail,
      referenceUncertainty: Number(l.reference.referenceUncertaintyCm.toPrecision(2)),
      measuredUncertainty: l.measurementSigmaCm === null ? null : Number(l.measurementSigmaCm.toPrecision(2)),
      positionStatus: l.reference.positionStatus,
      wavenumber: position(l.reference.wavenumber),
      relativeStrength: Number(l.reference.relativeToStrongest.toPrecision(3)),
    })),
    resolution: { cm: calibration.resolutionCm, from: calibration.resolutionFrom, note: calibration.resolutionNote },
    apodization: calibration.apodization,
    conditions: run.conditions,
    conditionsAssumed: record.assumedConditions,
    spectrum: {
      format: run.spectrum.format,
      points: x.length,
      fromCm: position(x[0]),
      toCm: position(x[x.length - 1]),
      ordinate: run.spectrum.ordinate,
      ordinateFrom: run.spectrum.ordinateFrom,
      abscissaUnit: run.spectrum.abscissaUnit,
      abscissaFrom: run.spectrum.abscissaFrom,
      title: run.spectrum.title,
      instrument: run.spectrum.instrument,
      noiseAbsorbance: Number(calibration.noiseAbsorbance.toPrecision(2)),
    },
    rules: calibrationRulesText(run),
    notes: calibrationNotes(run),
    caution: `${run.caution}`,
  };
}

/** Said under every calibrate line table: the sign, the same as every residual of the atlas. */
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
