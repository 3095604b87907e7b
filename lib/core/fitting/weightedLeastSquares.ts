import { Matrix, SingularValueDecomposition } from "ml-matrix";
import { CoreInputError } from "../coreInputError.ts";

export interface LeastSquaresResult {
  parameters: number[];
  /** Covariance of the parameters, scaled by max(1, χ²/ν) (see below). */
  covariance: number[][];
  uncertainties: number[];
  correlation: number[][];
  /** Observed minus calculated for each observation, in the observations' unit. */
  residuals: number[];
  chiSquared: number;
  degreesOfFreedom: number;
  reducedChiSquared: number;
  /** Ratio of the largest to the smallest singular value of the column-scaled weighted design. */
  conditionNumber: number;
}

/**
 * Weighted linear least squares, y ≈ A·p with weights 1/σ², solved by a singular value
 * decomposition (ml-matrix) of the weighted design with its columns scaled to unit length, which
 * keeps parameters of very different size (ωe ~ 10³ cm⁻¹, He ~ 10⁻⁹ cm⁻¹) well conditioned.
 * The covariance (AᵀWA)⁻¹ is multiplied by χ²/ν when that exceeds 1: when the residuals are
 * larger than the stated uncertainties explain, the parameters are less certain than the stated
 * uncertainties alone say (P. R. Bevington and D. K. Robinson, Data Reduction and Error Analysis
 * for the Physical Sciences, 3rd ed., 2003, ch. 7; common practice in spectroscopic fits).
 */
export function weightedLeastSquares(design: number[][], observed: number[], sigmas: number[]): LeastSquaresResult {
  const n = observed.length;
  const p = design[0]?.length ?? 0;
  if (p === 0) throw new CoreInputError("a fit needs at least one parameter");
  if (n < p) throw new CoreInputError(`a fit of ${p} parameters needs at least ${p} observations, got ${n}`);
  for (const s of sigmas) if (!(s > 0 && Number.isFinite(s))) throw new CoreInputError(`every observation needs an uncertainty above 0 (got ${s})`);
  const weighted = new Matrix(n, p);
  const rhs = new Matrix(n, 1);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) weighted.set(i, j, design[i][j] / sigmas[i]);
    rhs.set(i, 0, observed[i] / sigmas[i]);
  }
  const columnNorms = Array.from({ length: p }, (_, j) => {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += weighted.get(i, j) ** 2;
    return Math.sqrt(sum);
  });
  columnNorms.forEach((norm, j) => {
    if (!(norm > 0)) throw new CoreInputError(`parameter ${j + 1} does not affect any observation: the data cannot determine it`);
    for (let i = 0; i < n; i++) weighted.set(i, j, weighted.get(i, j) / norm);
  });
  const svd = new SingularValueDecomposition(weighted, { autoTranspose: true });
  const singular = svd.diagonal;
  const largest = Math.max(...singular);
  const smallest = Math.min(...singular);
  // Relative to double precision and the problem size: below this the columns are dependent.
  if (!(smallest > largest * 1e-13 * Math.max(n, p))) {
    throw new CoreInputError(
      "the parameters are not independent for these observations (the design matrix is singular): drop a term or add lines that separate them",
    );
  }
  const scaled = svd.solve(rhs).to1DArray();
  const parameters = scaled.map((v, j) => v / columnNorms[j]);
  const v = svd.rightSingularVectors;
  const residuals = observed.map((y, i) => y - design[i].reduce((sum, a, j) => sum + a * parameters[j], 0));
  const chiSquared = residuals.reduce((sum, r, i) => sum + (r / sigmas[i]) ** 2, 0);
  const degreesOfFreedom = n - p;
  const reducedChiSquared = degreesOfFreedom > 0 ? chiSquared / degreesOfFreedom : NaN;
  const inflate = degreesOfFreedom > 0 && reducedChiSquared > 1 ? reducedChiSquared : 1;
  const covariance: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let a = 0; a < p; a++) {
    for (let b = 0; b < p; b++) {
      let sum = 0;
      for (let k = 0; k < p; k++) sum += (v.get(a, k) * v.get(b, k)) / (singular[k] * singular[k]);
      covariance[a][b] = (sum * inflate) / (columnNorms[a] * columnNorms[b]);
    }
  }
  const uncertainties = covariance.map((row, j) => Math.sqrt(row[j]));
  const correlation = covariance.map((row, a) => row.map((c, b) => c / (uncertainties[a] * uncertainties[b])));
  return {
    parameters,
    covariance,
    uncertainties,
    correlation,
    residuals,
    chiSquared,
    degreesOfFreedom,
    reducedChiSquared,
    conditionNumber: largest / smallest,
  };
}
