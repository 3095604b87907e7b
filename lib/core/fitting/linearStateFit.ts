import { CoreInputError } from "../coreInputError.ts";
import type { MeasuredLineObservation } from "./dunhamFit.ts";
import { weightedLeastSquares, type LeastSquaresResult } from "./weightedLeastSquares.ts";

/** A coefficient c_l of one state's series E(J) = Σ c_l [J(J+1)]^l (c0 = G, c1 = B, c2 = −D, c3 = H). */
export interface StateCoefficientKey {
  stateIndex: number;
  l: number;
}

/** One cited measured line as the per-state fit sees it. */
export interface LinearFitObservation extends MeasuredLineObservation {
  upperStateIndex: number;
  lowerStateIndex: number;
}

export interface LinearFitResidual {
  observation: LinearFitObservation;
  calculatedCm: number;
  residualCm: number;
  normalized: number;
}

export interface LinearStateFitResult {
  parameters: StateCoefficientKey[];
  solution: LeastSquaresResult;
  residuals: LinearFitResidual[];
  fittedCount: number;
  heldOutCount: number;
  rmsCm: number;
}

/** ∂ν/∂c_l of one state: x'^l where it is the upper state, −x''^l where it is the lower. */
export function stateCoefficientPartial(
  key: StateCoefficientKey,
  o: Pick<LinearFitObservation, "upperStateIndex" | "lowerStateIndex" | "jUpper" | "jLower">,
): number {
  let d = 0;
  if (key.stateIndex === o.upperStateIndex) d += Math.pow(o.jUpper * (o.jUpper + 1), key.l);
  if (key.stateIndex === o.lowerStateIndex) d -= Math.pow(o.jLower * (o.jLower + 1), key.l);
  return d;
}

/**
 * Fits per-state constants of a linear molecule to cited measured lines: ν = E'(J') − E''(J'') is
 * linear in every c_l, so the constants not fitted (`known`) are subtracted and the rest found by
 * weighted least squares (lines weighted 1/σ²; `heldOut` lines only predicted).
 */
export function fitLinearStates(
  observations: readonly LinearFitObservation[],
  parameters: readonly StateCoefficientKey[],
  known: (key: StateCoefficientKey) => number,
  stateCount: number,
): LinearStateFitResult {
  if (parameters.length === 0) throw new CoreInputError("a fit needs at least one constant marked `fit`");
  const fixedPart = (o: LinearFitObservation) => {
    let sum = 0;
    for (let stateIndex = 0; stateIndex < stateCount; stateIndex++) {
      for (let l = 0; l <= 3; l++) {
        const key = { stateIndex, l };
        if (parameters.some((p) => p.stateIndex === stateIndex && p.l === l)) continue;
        const value = known(key);
        if (value !== 0) sum += value * stateCoefficientPartial(key, o);
      }
    }
    return sum;
  };
  const fitted = observations.filter((o) => !o.heldOut);
  const solution = weightedLeastSquares(
    fitted.map((o) => parameters.map((p) => stateCoefficientPartial(p, o))),
    fitted.map((o) => o.wavenumberCm - fixedPart(o)),
    fitted.map((o) => o.uncertaintyCm),
  );
  const residuals = observations.map((o) => {
    const calculatedCm = fixedPart(o) + parameters.reduce((s, p, i) => s + stateCoefficientPartial(p, o) * solution.parameters[i], 0);
    const residualCm = o.wavenumberCm - calculatedCm;
    return { observation: o, calculatedCm, residualCm, normalized: residualCm / o.uncertaintyCm };
  });
  const fittedResiduals = residuals.filter((r) => !r.observation.heldOut);
  const rmsCm = Math.sqrt(fittedResiduals.reduce((s, r) => s + r.residualCm ** 2, 0) / fittedResiduals.length);
  return { parameters: [...parameters], solution, residuals, fittedCount: fitted.length, heldOutCount: observations.length - fitted.length, rmsCm };
}
