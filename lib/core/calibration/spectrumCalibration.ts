import { measuredGrade } from "../positions/certifiedPositions.ts";
import type { AbsorptionPeak } from "./absorptionPeaks.ts";
import type { CalibrationReference } from "./calibrationReferences.ts";
import { correctionBudget, type CorrectionBudget } from "./correctionBudget.ts";
import { sortReferenceLines, type CalibratedLine } from "./calibratedLines.ts";
import { hypothesisWavenumber, searchScale, type ScaleHypothesis } from "./scaleSearch.ts";
import { CalibrationRefused, defaultSpectrumCalibrationRules, type SpectrumCalibrationRules } from "./spectrumCalibrationRules.ts";
import type { WavenumberCm } from "../types.ts";
import {
  correctedWavenumber,
  minimumLines,
  robustWavenumberCorrection,
  type CorrectionModel,
  type CorrectionPoint,
  type WavenumberCorrection,
} from "./wavenumberCorrection.ts";

export interface SpectrumCalibrationResult {
  gasName: string;
  resolutionCm: WavenumberCm;
  /** The correction; its ± are the totals of `budget`. */
  correction: WavenumberCorrection;
  budget: CorrectionBudget;
  /** The fit's ± from the weights alone, before the budget (for comparison). */
  weightedFitUncertainty: { scale: number; offsetCm: number };
  /** Root mean square of the used lines' residuals, cm⁻¹. */
  rmsResidualCm: WavenumberCm;
  usedCount: number;
  lines: CalibratedLine[];
  /** The assignment vote: the winner and how close the next distinct assignment came (0–1). */
  assignment: ScaleHypothesis;
  runnerUpRatio: number;
  /**
   * For the one-term models: the linear model fitted to the same lines, when its other term is
   * more than 3σ from zero (the chosen model then leaves a real error out); else null.
   */
  missingTerm: { term: "offset" | "scale"; value: number; uncertainty: number; linear: WavenumberCorrection } | null;
  /** Measured peaks at or above the usable signal-to-noise that no listed line of the gas explains. */
  unassignedPeakCount: number;
  rules: SpectrumCalibrationRules;
}

const fmt = (x: number, digits: number) => x.toFixed(digits);

/**
 * Calibrate a measured spectrum's wavenumber scale against predicted references: assign peaks
 * by an exhaustive vote (searchScale), sort out lines that cannot be trusted (saturated, blended,
 * weak, reference too uncertain), fit the correction by weighted least squares with the outlier
 * rule of robustWavenumberCorrection, and refuse — CalibrationRefused — whenever the data do not
 * support an answer.
 */
export function calibrateSpectrum(
  gasName: string,
  peaks: readonly AbsorptionPeak[],
  references: readonly CalibrationReference[],
  resolutionCm: WavenumberCm,
  range: { fromCm: WavenumberCm; toCm: WavenumberCm },
  model: CorrectionModel,
  rules: SpectrumCalibrationRules = defaultSpectrumCalibrationRules,
): SpectrumCalibrationResult {
  const span = `${fmt(range.fromCm, 1)}–${fmt(range.toCm, 1)} cm⁻¹`;
  const voters = references.filter((r) => r.referenceCm !== null && r.precise && !r.blended);
  if (!voters.length) {
    throw new CalibrationRefused(`no line of ${gasName} in ${span} is precise and isolated enough to serve as a reference at ${resolutionCm} cm⁻¹ resolution`);
  }
  if (!peaks.length) throw new CalibrationRefused(`no absorption peak stands out of the noise in ${span}: this does not look like a spectrum of ${gasName}`);
  const tolerance = resolutionCm / 4;
  let tallest = 0;
  for (const p of peaks) if (p.heightAbsorbance > tallest) tallest = p.heightAbsorbance;
  let strongestVoter = 0;
  for (const r of voters) if (r.relativeToStrongest > strongestVoter) strongestVoter = r.relativeToStrongest;
  const search = searchScale(
    peaks.map((p) => ({ wavenumberCm: p.wavenumberCm, weight: p.heightAbsorbance / tallest })),
    voters.map((r) => ({ referenceCm: r.referenceCm!, weight: r.relativeToStrongest / strongestVoter })),
    tolerance,
    rules.bounds,
  );
  const reach = `±${rules.bounds.maxScalePpm} ppm and ±${rules.bounds.maxOffsetCm} cm⁻¹`;
  if (!search.best) throw new CalibrationRefused(`no peak of the spectrum lies within ${reach} of a line of ${gasName}: this does not look like ${gasName}`);
  const best = search.best;

  // Assign each listed line, strongest first, to the nearest free peak under the winning hypothesis.
  const corrected = peaks.map((p) => hypothesisWavenumber(best, p.wavenumberCm));
  const claimed = new Set<number>();
  const peakOf = new Map<CalibrationReference, number>();
  for (const ref of [...references].sort((a, b) => b.relativeToStrongest - a.relativeToStrongest)) {
    const target = ref.referenceCm ?? ref.wavenumber;
    const window = tolerance + 2 * ref.referenceUncertaintyCm;
    let bestPeak = -1;
    for (let i = 0; i < peaks.length; i++) {
      if (claimed.has(i)) continue;
      const d = Math.abs(corrected[i] - target);
      if (d <= window && (bestPeak < 0 || d < Math.abs(corrected[bestPeak] - target))) bestPeak = i;
    }
    if (bestPeak >= 0) {
      claimed.add(bestPeak);
      peakOf.set(ref, bestPeak);
    }
  }
  const strongVoters = voters.filter((r) => r.relativeToStrongest >= 0.1 * strongestVoter);
  const found = strongVoters.filter((r) => peakOf.has(r)).length;
  if (found < rules.minMatchedFraction * strongVoters.length) {
    throw new CalibrationRefused(
      `only ${found} of the ${strongVoters.length} strong lines of ${gasName} expected in ${span} were found within ${reach}: the spectrum does not look like ${gasName}`,
    );
  }
  const runnerUpRatio = search.runnerUp ? search.runnerUp.score / best.score : 0;
  if (runnerUpRatio >= rules.ambiguityRatio) {
    const other = search.runnerUp!;
    throw new CalibrationRefused(
      `two assignments fit the spectrum almost equally well (shifts of ${fmt(best.offsetAtPivotCm, 3)} and ${fmt(other.offsetAtPivotCm, 3)} cm⁻¹ at ${fmt(best.pivotCm, 1)} cm⁻¹): the lines of ${gasName} cannot be told apart here`,
    );
  }

  const lines = sortReferenceLines(references, peaks, peakOf, resolutionCm, rules);

  const candidates = lines.filter((l) => l.used);
  const needed = minimumLines[model];
  if (rules.requireValidated && candidates.length < needed) {
    const found = lines.filter((l) => l.peak).length;
    const validated = lines.filter((l) => l.peak && measuredGrade(l.reference.positionStatus)).length;
    throw new CalibrationRefused(
      `validated references were required: ${validated} of the ${found} lines of ${gasName} found in ${span} ${validated === 1 ? "is" : "are"} validated against measured lines and usable, the ${model} model needs at least ${needed}`,
    );
  }
  if (candidates.length < needed) {
    const saturated = lines.filter((l) => l.reason === "saturated").length;
    if (saturated > 0 && saturated >= lines.filter((l) => l.peak).length / 2) {
      throw new CalibrationRefused(
        `${saturated} of the lines found are saturated (absorbance ≥ ${rules.saturationAbsorbance} or flat-topped): lower the pressure, dilute the gas or shorten the path, then record again`,
      );
    }
    throw new CalibrationRefused(
      `too few lines to calibrate: ${candidates.length} usable line${candidates.length === 1 ? "" : "s"} of ${gasName} in ${span}, the ${model} model needs at least ${needed}`,
    );
  }
  const points: CorrectionPoint[] = candidates.map((l) => ({ measuredCm: l.peak!.wavenumberCm, referenceCm: l.reference.referenceCm!, sigmaCm: l.sigmaCm! }));
  const { correction, rejected } = robustWavenumberCorrection(model, points);
  // A correction at the edge of the searched region: the vote was cut off there, and the
  // instrument's error may lie beyond it (or the peaks are not of this gas). A one-term model is
  // judged by its term; any model by the shift it gives the lines it used, against the search's
  // reach there (maxOffset + maxScale·ν).
  const maxScale = rules.bounds.maxScalePpm * 1e-6;
  const atEdge =
    (model === "scale" && Math.abs(correction.scale) >= rules.edgeFraction * maxScale) ||
    (model === "offset" && Math.abs(correction.offsetCm) >= rules.edgeFraction * rules.bounds.maxOffsetCm) ||
    points.some(
      (p) =>
        Math.abs(correctedWavenumber(correction, p.measuredCm) - p.measuredCm) >= rules.edgeFraction * (rules.bounds.maxOffsetCm + maxScale * p.measuredCm),
    );
  if (atEdge) {
    throw new CalibrationRefused(
      `the correction found lies at the edge of the search (k = ${fmt(correction.scale * 1e6, 0)} ppm, c = ${fmt(correction.offsetCm, 3)} cm⁻¹; the search covers ${reach}): the instrument's error may be larger than that, or the spectrum is not of ${gasName}`,
    );
  }
  if (correction.maxTermCorrelation > rules.maxTermCorrelation) {
    throw new CalibrationRefused(
      `the ${model} model's terms cannot be told apart by these lines (correlation ${correction.maxTermCorrelation.toFixed(3)} > ${rules.maxTermCorrelation}): use a simpler model (--model ${model === "quadratic" ? "linear" : "scale"}), a wider range, or a spectrum with a second band`,
    );
  }
  for (const i of rejected) {
    const line = candidates[i];
    const residual = points[i].referenceCm - correctedWavenumber(correction, points[i].measuredCm);
    line.used = false;
    line.reason = "residual";
    line.detail = `residual ${residual.toPrecision(2)} cm⁻¹ is ${fmt(Math.abs(residual) / points[i].sigmaCm, 1)} σ`;
  }
  let missingTerm: SpectrumCalibrationResult["missingTerm"] = null;
  // All usable lines, before rejection: a missing term is exactly what makes good lines look like outliers.
  if ((model === "scale" || model === "offset") && points.length >= minimumLines.linear) {
    const { correction: linear } = robustWavenumberCorrection("linear", points);
    const term = model === "scale" ? "offset" : "scale";
    const value = term === "offset" ? linear.offsetCm : linear.scale;
    const uncertainty = term === "offset" ? linear.offsetUncertaintyCm : linear.scaleUncertainty;
    if (Math.abs(value) > 3 * uncertainty) missingTerm = { term, value, uncertainty, linear };
  }
  let sumSquares = 0;
  let used = 0;
  for (const line of lines) {
    if (!line.peak) continue;
    line.residualCm = (line.reference.referenceCm ?? line.reference.wavenumber) - correctedWavenumber(correction, line.peak.wavenumberCm);
    if (line.used) {
      sumSquares += line.residualCm * line.residualCm;
      used++;
    }
  }
  const usedLines = lines.filter((l) => l.used);
  const budget = correctionBudget(
    correction,
    usedLines.map((l) => ({
      measuredCm: l.peak!.wavenumberCm,
      fitSigmaCm: l.sigmaCm!,
      measurementSigmaCm: l.measurementSigmaCm!,
      residualCm: l.residualCm!,
      shares: l.reference.shares,
    })),
  );
  const weightedFitUncertainty = { scale: correction.scaleUncertainty, offsetCm: correction.offsetUncertaintyCm };
  const budgeted: WavenumberCorrection = {
    ...correction,
    scaleUncertainty: model === "offset" ? 0 : budget.scaleSigma,
    offsetUncertaintyCm: model === "scale" ? 0 : budget.offsetSigmaCm,
    quadraticUncertaintyPerCm: model === "quadratic" ? budget.quadraticSigmaPerCm : 0,
    scaleOffsetCorrelation: model === "linear" || model === "quadratic" ? budget.scaleOffsetCorrelation : 0,
  };
  return {
    gasName,
    resolutionCm,
    correction: budgeted,
    budget,
    weightedFitUncertainty,
    rmsResidualCm: Math.sqrt(sumSquares / used),
    usedCount: used,
    lines,
    assignment: best,
    runnerUpRatio,
    missingTerm,
    unassignedPeakCount: peaks.filter((p, i) => !claimed.has(i) && p.signalToNoise >= rules.minSignalToNoise).length,
    rules,
  };
}
