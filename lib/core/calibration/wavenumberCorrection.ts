import { CoreInputError } from "../coreInputError.ts";
import type { WavenumberCm } from "../types.ts";
import { weightedLeastSquares } from "../fitting/weightedLeastSquares.ts";

/**
 * The correction true = measured·(1 + k) + c [+ q·(measured − centre)²]:
 * "scale" fits k alone (the usual error of an FTIR: its reference-laser wavenumber or the
 * beam's angle in the interferometer), "offset" c alone, "linear" both, "quadratic" all three.
 */
export const correctionModels = ["scale", "offset", "linear", "quadratic"] as const;
export type CorrectionModel = (typeof correctionModels)[number];

/** Fewest lines for each model: one more than its terms plus one, so the scatter can be judged. */
export const minimumLines: Record<CorrectionModel, number> = { scale: 3, offset: 3, linear: 4, quadratic: 5 };

export interface CorrectionPoint {
  measuredCm: WavenumberCm;
  referenceCm: WavenumberCm;
  /** Measured and reference ± in quadrature, cm⁻¹. */
  sigmaCm: WavenumberCm;
}

export interface WavenumberCorrection {
  model: CorrectionModel;
  scale: number;
  scaleUncertainty: number;
  offsetCm: WavenumberCm;
  offsetUncertaintyCm: WavenumberCm;
  /** Quadratic model only: q (cm⁻¹ per cm⁻²) about centreCm. */
  quadraticPerCm: number;
  quadraticUncertaintyPerCm: number;
  centreCm: WavenumberCm;
  /** Correlation of scale and offset (linear and quadratic models), else 0. */
  scaleOffsetCorrelation: number;
  reducedChiSquared: number;
  degreesOfFreedom: number;
  /**
   * The largest |correlation| between two fitted terms as the fit takes them (the measured
   * wavenumber about the lines' weighted centre): near 1, the lines cannot tell the terms apart.
   */
  maxTermCorrelation: number;
}

export function correctedWavenumber(c: WavenumberCorrection, measuredCm: WavenumberCm): WavenumberCm {
  const d = measuredCm - c.centreCm;
  return measuredCm * (1 + c.scale) + c.offsetCm + c.quadraticPerCm * d * d;
}

/** One line's row of the fit's design matrix: the model's terms at the measured wavenumber, about the centre. */
export function correctionDesignRow(model: CorrectionModel, measuredCm: WavenumberCm, centreCm: WavenumberCm): number[] {
  const d = measuredCm - centreCm;
  switch (model) {
    case "scale":
      return [measuredCm];
    case "offset":
      return [1];
    case "linear":
      return [d, 1];
    case "quadratic":
      return [d, 1, d * d];
  }
}

/**
 * Weighted least squares of reference − measured on the model's terms. Internally the measured
 * wavenumber is taken about the lines' weighted centre, which keeps scale and offset apart in the
 * solution; the offset is then carried back to measured = 0 with its covariance
 * (c = b − k·centre, var c = var b + centre²·var k − 2·centre·cov(k, b)).
 */
export function fitWavenumberCorrection(model: CorrectionModel, points: readonly CorrectionPoint[]): WavenumberCorrection {
  if (points.length < minimumLines[model]) {
    throw new CoreInputError(`the ${model} model needs at least ${minimumLines[model]} lines, only ${points.length} could be used`);
  }
  let wSum = 0;
  let xSum = 0;
  for (const p of points) {
    const w = 1 / (p.sigmaCm * p.sigmaCm);
    wSum += w;
    xSum += w * p.measuredCm;
  }
  const centre = xSum / wSum;
  const design = points.map((p) => correctionDesignRow(model, p.measuredCm, centre));
  const fit = weightedLeastSquares(
    design,
    points.map((p) => p.referenceCm - p.measuredCm),
    points.map((p) => p.sigmaCm),
  );
  const base = {
    model,
    quadraticPerCm: 0,
    quadraticUncertaintyPerCm: 0,
    centreCm: centre,
    scaleOffsetCorrelation: 0,
    reducedChiSquared: fit.reducedChiSquared,
    degreesOfFreedom: fit.degreesOfFreedom,
    maxTermCorrelation: fit.correlation.reduce((m, row, a) => row.reduce((n, r, b) => (a === b || !Number.isFinite(r) ? n : Math.max(n, Math.abs(r))), m), 0),
  };
  if (model === "scale") return { ...base, scale: fit.parameters[0], scaleUncertainty: fit.uncertainties[0], offsetCm: 0, offsetUncertaintyCm: 0 };
  if (model === "offset") return { ...base, scale: 0, scaleUncertainty: 0, offsetCm: fit.parameters[0], offsetUncertaintyCm: fit.uncertainties[0] };
  const [k, b] = fit.parameters;
  const v = fit.covariance;
  const offset = b - k * centre;
  const offsetVariance = v[1][1] + centre * centre * v[0][0] - 2 * centre * v[0][1];
  const offsetSigma = Math.sqrt(Math.max(offsetVariance, 0));
  const covKc = v[0][1] - centre * v[0][0];
  return {
    ...base,
    scale: k,
    scaleUncertainty: fit.uncertainties[0],
    offsetCm: offset,
    offsetUncertaintyCm: offsetSigma,
    quadraticPerCm: model === "quadratic" ? fit.parameters[2] : 0,
    quadraticUncertaintyPerCm: model === "quadratic" ? fit.uncertainties[2] : 0,
    scaleOffsetCorrelation: covKc / (fit.uncertainties[0] * offsetSigma),
  };
}

export interface RobustCorrection {
  correction: WavenumberCorrection;
  /** Indices into the points, in the order they were rejected. */
  rejected: number[];
}

/**
 * The outlier rule, stated on every output: take the line with the largest normalized residual
 * |r|/σ, refit without it, and reject it when it lies more than 3 × max(1, √(χ²/ν of that refit))
 * of its σ from the refitted correction (a deleted residual: the line cannot hide by pulling the
 * fit towards itself, and the others' scatter sets the scale). Refit and repeat while the model
 * keeps more than its minimum number of lines. One line at a time, worst first, so one bad line
 * cannot drag good ones out with it.
 */
export function robustWavenumberCorrection(model: CorrectionModel, points: readonly CorrectionPoint[]): RobustCorrection {
  let kept = points.map((_, i) => i);
  const rejected: number[] = [];
  let correction = fitWavenumberCorrection(
    model,
    kept.map((i) => points[i]),
  );
  while (kept.length > minimumLines[model]) {
    const z = kept.map((i) => Math.abs(points[i].referenceCm - correctedWavenumber(correction, points[i].measuredCm)) / points[i].sigmaCm);
    let worst = 0;
    for (let j = 1; j < z.length; j++) if (z[j] > z[worst]) worst = j;
    const others = kept.filter((_, j) => j !== worst);
    const refit = fitWavenumberCorrection(
      model,
      others.map((i) => points[i]),
    );
    const candidate = points[kept[worst]];
    const deleted = Math.abs(candidate.referenceCm - correctedWavenumber(refit, candidate.measuredCm)) / candidate.sigmaCm;
    const spread = refit.degreesOfFreedom > 0 ? Math.max(1, Math.sqrt(refit.reducedChiSquared)) : 1;
    if (deleted <= 3 * spread) break;
    rejected.push(kept[worst]);
    kept = others;
    correction = refit;
  }
  return { correction, rejected };
}
