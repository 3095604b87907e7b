import { CoreInputError } from "../coreInputError.ts";
import type { WavenumberCm } from "../types.ts";
import type { WavenumberCorrection } from "./wavenumberCorrection.ts";

/** A tolerance on the wavenumber scale: an absolute one in cm⁻¹, or a relative one in ppm of the wavenumber. */
export type ScaleTolerance = { unit: "cm-1"; valueCm: number } | { unit: "ppm"; valuePpm: number };

export type Verdict = "pass" | "fail" | "undecided";

/** The coverage factor of the expanded uncertainty the verdict uses (about 95 % for a normal distribution). */
export const verdictCoverageFactor = 2;

/** What the correction says at one wavenumber: the shift it adds and that shift's standard uncertainty. */
export interface ShiftAtWavenumber {
  wavenumberCm: WavenumberCm;
  /** true − measured = k·ν + c (+ q·(ν − centre)²): the instrument's error there, with the sign to correct it. */
  shiftCm: WavenumberCm;
  /** Standard uncertainty of the shift, with the k–c correlation. */
  sigmaCm: WavenumberCm;
}

/**
 * The shift at ν and its σ by the law of propagation with correlated inputs (JCGM 100:2008, GUM,
 * §5.2.2): var = ν²·σk² + σc² + 2ν·ρ·σk·σc. The k–c correlation matters: with c taken at ν = 0 it
 * is near −1 for a band far from 0, and leaving it out would overstate the ± many times. The
 * quadratic term's covariance with k and c is not kept by the fit's summary, so it is added in
 * quadrature (an approximation, stated here; it is small where the lines are).
 */
export function shiftAtWavenumber(c: WavenumberCorrection, wavenumberCm: WavenumberCm): ShiftAtWavenumber {
  const d = wavenumberCm - c.centreCm;
  const shiftCm = c.scale * wavenumberCm + c.offsetCm + c.quadraticPerCm * d * d;
  const sk = c.scaleUncertainty;
  const sc = c.offsetUncertaintyCm;
  const variance =
    wavenumberCm * wavenumberCm * sk * sk + sc * sc + 2 * wavenumberCm * c.scaleOffsetCorrelation * sk * sc + (c.quadraticUncertaintyPerCm * d * d) ** 2;
  return { wavenumberCm, shiftCm, sigmaCm: Math.sqrt(Math.max(variance, 0)) };
}

/** The tolerance at one wavenumber, in cm⁻¹. */
export function toleranceAtCm(tolerance: ScaleTolerance, wavenumberCm: WavenumberCm): WavenumberCm {
  return tolerance.unit === "cm-1" ? tolerance.valueCm : tolerance.valuePpm * 1e-6 * wavenumberCm;
}

export interface CheckVerdict extends ShiftAtWavenumber {
  toleranceCm: WavenumberCm;
  /** Expanded uncertainty U = 2σ. */
  expandedCm: WavenumberCm;
  verdict: Verdict;
}

/**
 * The decision rule, non-binary with a guard band w = U (ILAC-G8:09/2019, Guidelines on Decision
 * Rules and Statements of Conformity, §4.2.3; its "conditional pass" and "conditional fail" are
 * our "undecided"): pass when |error| + U ≤ T, fail when |error| − U > T, undecided between.
 */
export function checkVerdict(shift: ShiftAtWavenumber, tolerance: ScaleTolerance): CheckVerdict {
  const toleranceCm = toleranceAtCm(tolerance, shift.wavenumberCm);
  if (!(toleranceCm > 0) || !Number.isFinite(toleranceCm)) throw new CoreInputError(`a tolerance must be above 0, got ${toleranceCm} cm⁻¹`);
  const expandedCm = verdictCoverageFactor * shift.sigmaCm;
  const error = Math.abs(shift.shiftCm);
  const verdict: Verdict = error + expandedCm <= toleranceCm ? "pass" : error - expandedCm > toleranceCm ? "fail" : "undecided";
  return { ...shift, toleranceCm, expandedCm, verdict };
}

/** Several checks: fail when any fails, pass when all pass, else undecided. */
export function overallVerdict(checks: readonly CheckVerdict[]): Verdict {
  if (checks.length === 0) throw new CoreInputError("a verdict needs at least one check wavenumber");
  if (checks.some((c) => c.verdict === "fail")) return "fail";
  return checks.every((c) => c.verdict === "pass") ? "pass" : "undecided";
}
