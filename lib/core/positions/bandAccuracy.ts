import { runningIndex, sameBand, vibrationalBand } from "./band.ts";
import { CoreInputError } from "../coreInputError.ts";
import { linearStateExpansion } from "./linearStateTerms.ts";
import { termFromExpansion, termValue } from "./termValues.ts";
import type { Band, BandAccuracy, BandCheck, Branch, ReferenceLine, ResidualEnvelope, SpeciesModel, SpeciesValidation } from "../types.ts";

/** Branch and J'' of a label "R(3)" / "P(1)" (R: J' = J''+1, P: J' = J''−1). */
export function parseLineLabel(label: string): { branch: Branch; jLower: number; jUpper: number } {
  const match = /^([PR])\((\d{1,3})\)$/.exec(label);
  if (!match) throw new CoreInputError(`line label "${label}" is not of the form R(J'') or P(J'')`);
  const branch = match[1] as Branch;
  const jLower = Number(match[2]);
  return { branch, jLower, jUpper: branch === "R" ? jLower + 1 : jLower - 1 };
}

/** Predicted position of a measured line (any band, pure rotation included), cm⁻¹. */
export function referenceLinePosition(species: SpeciesModel, line: ReferenceLine): number {
  const { jLower, jUpper } = parseLineLabel(line.label);
  if (jUpper < 0) throw new CoreInputError(`line ${line.label} does not exist (J' would be below 0)`);
  if (species.structure === "linear") {
    const linear = species.linear;
    const entry = linear.bands.find((b) => sameBand(b.band, line.band));
    if (!entry) throw new CoreInputError(`${species.label} has no band ${line.band.label ?? ""} for line ${line.label}`);
    const upper = linearStateExpansion(linear.states[entry.upperStateIndex]);
    const lower = linearStateExpansion(linear.states[entry.lowerStateIndex]);
    return termFromExpansion(upper, jUpper) - termFromExpansion(lower, jLower);
  }
  const band = vibrationalBand(line.band);
  return termValue(species.dunham, band.vUpper, jUpper) - termValue(species.dunham, band.vLower, jLower);
}

export interface LineResidual {
  reference: ReferenceLine;
  predicted: number;
  /** Predicted minus measured, cm⁻¹. */
  predictedMinusMeasured: number;
}

/** Predicted minus measured for every cited measured line of a species (positions do not depend on T). */
export function lineResiduals(species: SpeciesModel): LineResidual[] {
  return species.referenceLines.map((reference) => {
    const predicted = referenceLinePosition(species, reference);
    return { reference, predicted, predictedMinusMeasured: predicted - reference.wavenumber };
  });
}

function absM(line: ReferenceLine): number {
  const { branch, jLower } = parseLineLabel(line.label);
  return Math.abs(runningIndex(branch, jLower));
}

/** Running maximum of |residual| over increasing |m|. */
export function residualEnvelope(points: ReadonlyArray<{ absM: number; residualCm: number }>): ResidualEnvelope {
  const sorted = [...points].sort((a, b) => a.absM - b.absM);
  const out: ResidualEnvelope = [];
  let running = 0;
  for (const p of sorted) {
    running = Math.max(running, Math.abs(p.residualCm));
    if (out.length && out[out.length - 1].absM === p.absM) out[out.length - 1].residualCm = running;
    else out.push({ absM: p.absM, residualCm: running });
  }
  return out;
}

/** The envelope's value at |m|: the last point at or below it (the first point below the range). */
export function envelopeAt(envelope: ResidualEnvelope, absMValue: number): number {
  if (envelope.length === 0) return 0;
  let value = envelope[0].residualCm;
  for (const p of envelope) {
    if (p.absM > absMValue) break;
    value = p.residualCm;
  }
  return value;
}

/** One check per band (pure-rotation lines, v' = v'', form a band of their own) of a species' measured lines. */
export function bandChecks(species: SpeciesModel): BandCheck[] {
  const groups: Array<{ band: Band; residuals: LineResidual[] }> = [];
  for (const r of lineResiduals(species)) {
    let group = groups.find((g) => sameBand(g.band, r.reference.band));
    if (!group) groups.push((group = { band: r.reference.band, residuals: [] }));
    group.residuals.push(r);
  }
  return groups.map(({ band, residuals }) => {
    const ms = residuals.map((r) => absM(r.reference));
    const deltas = residuals.map((r) => r.predictedMinusMeasured);
    return {
      band,
      lineCount: residuals.length,
      heldOutCount: residuals.filter((r) => r.reference.heldOut).length,
      absMMin: Math.min(...ms),
      absMMax: Math.max(...ms),
      rmsResidualCm: Math.sqrt(deltas.reduce((s, d) => s + d * d, 0) / deltas.length),
      maxAbsResidualCm: Math.max(...deltas.map(Math.abs)),
      sourceKeys: [...new Set(residuals.map((r) => r.reference.sourceKey))],
      envelope: residualEnvelope(residuals.map((r, i) => ({ absM: ms[i], residualCm: r.predictedMinusMeasured }))),
    };
  });
}

/**
 * The validation of every species of one molecule: its band checks, whether the constants were
 * tested against measured lines at all, and the largest residual seen anywhere in the molecule.
 */
export function moleculeValidation(species: readonly SpeciesModel[], constantsFitted: boolean): SpeciesValidation[] {
  const checks = species.map(bandChecks);
  const all = checks.flat();
  const moleculeEnvelope = residualEnvelope(all.flatMap((c) => c.envelope));
  const constantsTested = constantsFitted || all.length > 0;
  return checks.map((c) => ({ checks: c, constantsTested, moleculeEnvelope }));
}

/** σ of a line from the model's own error components (before the residual floor), at x = J(J+1) of each level. */
export type ModelSigmaAt = (xUpper: number, xLower: number) => number;

/**
 * Measured lines contradict a band when one misses its prediction by more than this: R/50 at
 * R = 4 cm⁻¹, the largest ± a line may have to be calibration-grade at the coarsest resolution the
 * atlas marks (core `defaultCalibrationCriteria`, atlas `calibrationResolutionsCm`; a test holds
 * them together). A band whose measured lines miss by more cannot be called validated for
 * calibration, however wide its ± was drawn (HF's handbook row misses its pure-rotation lines by
 * 38 cm⁻¹, inside its own ± of 52: consistent, and useless as a reference).
 */
export const contradictionResidualLimitCm = 0.08;

/**
 * A miss beyond this many combined standard uncertainties (the model's own ± before the floor,
 * and the line's measured ±, in quadrature) is a 1-in-370 event for a normal error (common
 * practice, no source): it shows the model's own ± is too small there. The residual floor already
 * raises the printed ± to the residuals, so this alone is said, not made a contradiction.
 */
export const modelSigmaMultiple = 3;

/** The one rule, in words, for every output that prints the status. */
export const contradictionRuleText =
  `contradicted: a cited measured line of the band misses the prediction by more than ${contradictionResidualLimitCm} cm⁻¹, ` +
  `the largest ± of a calibration-grade line at 4 cm⁻¹ resolution (R/50)`;

/** How the band's measured lines compare with the model's own ± and with the contradiction limit. */
function judged(species: SpeciesModel, band: Band, modelSigmaAt: ModelSigmaAt | null): Pick<BandAccuracy, "contradiction" | "beyondModelSigma"> {
  let contradiction: BandAccuracy["contradiction"] = null;
  let beyond: BandAccuracy["beyondModelSigma"] = null;
  for (const r of lineResiduals(species)) {
    if (!sameBand(r.reference.band, band)) continue;
    const residual = Math.abs(r.predictedMinusMeasured);
    if (residual > contradictionResidualLimitCm && (!contradiction || residual > Math.abs(contradiction.predictedMinusMeasuredCm)))
      contradiction = { label: r.reference.label, predictedMinusMeasuredCm: r.predictedMinusMeasured };
    if (!modelSigmaAt) continue;
    const { jLower, jUpper } = parseLineLabel(r.reference.label);
    const combinedSigmaCm = Math.hypot(modelSigmaAt(jUpper * (jUpper + 1), jLower * (jLower + 1)), r.reference.uncertainty ?? 0);
    const ratio = residual / combinedSigmaCm;
    if (ratio <= modelSigmaMultiple) continue;
    if (!beyond) beyond = { count: 0, label: r.reference.label, ratio };
    beyond.count++;
    if (ratio > beyond.ratio) Object.assign(beyond, { label: r.reference.label, ratio });
  }
  return { contradiction, beyondModelSigma: beyond };
}

/**
 * A band's status: validated when measured lines of this species and band were compared with it
 * and agree; contradicted when one misses by more than contradictionResidualLimitCm (lines beyond
 * 3× the model's own σ, judged when the caller gives that σ, are counted and said); extrapolated when the constants were tested on other
 * bands or species only; not validated when no measured line stands behind them. The floor on a
 * line's ± is the largest residual of measured lines at its |m| or below (the band's own lines, or
 * for a band without its own the molecule's), and beyond the measured range the largest of all: a
 * printed ± never claims more than the measurements show.
 */
export function bandAccuracy(species: SpeciesModel, band: Band, modelSigmaAt?: ModelSigmaAt): BandAccuracy {
  const validation = species.validation;
  const none = { contradiction: null, beyondModelSigma: null };
  if (!validation) return { status: "not-validated", check: null, floor: [], ...none };
  const check = validation.checks.find((c) => sameBand(c.band, band)) ?? null;
  if (check) {
    const verdict = judged(species, band, modelSigmaAt ?? null);
    return { status: verdict.contradiction ? "contradicted" : "validated", check, floor: check.envelope, ...verdict };
  }
  return { status: validation.constantsTested ? "extrapolated" : "not-validated", check: null, floor: validation.moleculeEnvelope, ...none };
}
