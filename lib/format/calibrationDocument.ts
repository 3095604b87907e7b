// The JSON document of one calibration run (`bandatlas calibrate --format json`, the calibrate
// page's download, the log's record): the same fields everywhere.
import { applyCorrectionSentence, residualsAfterCorrection } from "./applyCorrectionText.ts";
import { runVerdict, verdictDocument } from "./calibrationVerdict.ts";
import { budgetDocument, referenceStanding, referenceStandingLine } from "./correctionBudgetText.ts";
import {
  calibrationNotes,
  calibrationPosition,
  calibrationRulesText,
  correctionModelWords,
  recordOf,
  withUncertainty,
  type CalibrationRun,
} from "./spectrumCalibrationText.ts";

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
        ? { quadraticPerCm: Number(q.value), quadraticPerCmUncertainty: Number(q.sigma), quadraticCentreCm: calibrationPosition(c.centreCm) }
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
      reference: calibrationPosition(l.reference.referenceCm ?? l.reference.wavenumber),
      measured: calibrationPosition(l.peak?.wavenumberCm ?? null),
      residual: calibrationPosition(l.residualCm),
      used: l.used,
      reason: l.reason,
      detail: l.detail,
      referenceUncertainty: Number(l.reference.referenceUncertaintyCm.toPrecision(2)),
      measuredUncertainty: l.measurementSigmaCm === null ? null : Number(l.measurementSigmaCm.toPrecision(2)),
      positionStatus: l.reference.positionStatus,
      wavenumber: calibrationPosition(l.reference.wavenumber),
      relativeStrength: Number(l.reference.relativeToStrongest.toPrecision(3)),
    })),
    resolution: { cm: calibration.resolutionCm, from: calibration.resolutionFrom, note: calibration.resolutionNote },
    apodization: calibration.apodization,
    conditions: run.conditions,
    conditionsAssumed: record.assumedConditions,
    spectrum: {
      format: run.spectrum.format,
      points: x.length,
      fromCm: calibrationPosition(x[0]),
      toCm: calibrationPosition(x[x.length - 1]),
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
