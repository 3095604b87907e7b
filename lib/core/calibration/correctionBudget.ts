import { Matrix, inverse } from "ml-matrix";
import type { ErrorShare, ErrorShareKind } from "../bands/lineErrorShares.ts";
import type { WavenumberCm } from "../types.ts";
import { correctionDesignRow, type CorrectionModel, type WavenumberCorrection } from "./wavenumberCorrection.ts";

/** One line of a fitted correction, with what its residual is made of. */
export interface BudgetPoint {
  measuredCm: WavenumberCm;
  /** The σ the fit weighted the line with (measurement and reference, in quadrature), cm⁻¹. */
  fitSigmaCm: WavenumberCm;
  /** The peak's own σ, already raised to the per-line floor, cm⁻¹. */
  measurementSigmaCm: WavenumberCm;
  /** reference − corrected measured, cm⁻¹. */
  residualCm: WavenumberCm;
  shares: readonly ErrorShare[];
}

export type BudgetPart = "measurement" | ErrorShareKind;

/** The parts in the order every output lists them. */
export const budgetParts: readonly BudgetPart[] = [
  "measurement",
  "certified",
  "constants",
  "omitted-term",
  "isotope-scaling",
  "residual-floor",
  "pressure-shift",
  "line-shape",
];

export interface BudgetRow {
  part: BudgetPart;
  /** This part's standard uncertainty of k (dimensionless) and of c (cm⁻¹). */
  scaleSigma: number;
  offsetSigmaCm: WavenumberCm;
  /** Number of distinct sources in this part (lines for the measurement). */
  sources: number;
}

export interface CorrectionBudget {
  rows: BudgetRow[];
  /** The quadrature sum of the parts (they are independent): the printed ± of k and c. */
  scaleSigma: number;
  offsetSigmaCm: WavenumberCm;
  /** Quadratic model only: the ± of q. */
  quadraticSigmaPerCm: number;
  /** Correlation of k and c in the total covariance (0 for one-term models). */
  scaleOffsetCorrelation: number;
  /**
   * Factor (≥ 1) applied to every line's measurement σ so that the residuals' χ²/ν, with the
   * reference parts of the fit's weights, is at most 1: the observed scatter when it exceeds the
   * stated precision.
   */
  measurementInflation: number;
}

/** Rows: k, c, q as functions of the fitted parameters (c carried from the centre back to 0). */
function toCorrectionTerms(model: CorrectionModel, centreCm: number): number[][] {
  switch (model) {
    case "scale":
      return [[1], [0], [0]];
    case "offset":
      return [[0], [1], [0]];
    case "linear":
      return [
        [1, 0],
        [-centreCm, 1],
        [0, 0],
      ];
    case "quadratic":
      return [
        [1, 0, 0],
        [-centreCm, 1, 0],
        [0, 0, 1],
      ];
  }
}

/**
 * Factor f ≥ 1 for the measurement σ so that the weighted residuals are no larger than the error
 * model expects: E[rᵀWr] = tr(W R V Rᵀ) with R = I − AM (the residual-maker), V the measurement
 * part (× f²) plus every reference source. A shared source mostly moves the correction, not the
 * residuals, and R accounts for that; scatter beyond what the model expects is the measurement's.
 */
function inflationFor(points: readonly BudgetPoint[], a: Matrix, m: Matrix, sharedShifts: readonly Float64Array[], degreesOfFreedom: number): number {
  if (degreesOfFreedom <= 0) return 1;
  const n = points.length;
  const w = points.map((p) => 1 / (p.fitSigmaCm * p.fitSigmaCm));
  const hat = a.mmul(m);
  const r = (i: number, j: number) => (i === j ? 1 : 0) - hat.get(i, j);
  let observed = 0;
  for (let i = 0; i < n; i++) observed += w[i] * points[i].residualCm * points[i].residualCm;
  let fromMeasurement = 0;
  for (let j = 0; j < n; j++) {
    let column = 0;
    for (let i = 0; i < n; i++) column += w[i] * r(i, j) * r(i, j);
    fromMeasurement += column * points[j].measurementSigmaCm * points[j].measurementSigmaCm;
  }
  let fromReferences = 0;
  for (const d of sharedShifts) {
    for (let i = 0; i < n; i++) {
      let moved = 0;
      for (let j = 0; j < n; j++) moved += r(i, j) * d[j];
      fromReferences += w[i] * moved * moved;
    }
  }
  const squared = (observed - fromReferences) / fromMeasurement;
  return fromMeasurement > 0 && squared > 1 ? Math.sqrt(squared) : 1;
}

/**
 * The uncertainty budget of a fitted correction. The fit is weighted least squares with the
 * diagonal weights 1/σ²; its estimator θ = (AᵀWA)⁻¹AᵀW y is linear in the references, so every
 * error source propagates exactly: Cov θ = Σ_sources (M d)(M d)ᵀ, M = (AᵀWA)⁻¹AᵀW, d the shifts
 * that source gives the lines (the sandwich form; JCGM 100:2008, GUM, §5.2, law of propagation with
 * correlated inputs). A source shared by many lines (an omitted Dunham term, a constant set's
 * covariance, isotope scaling, the pressure shift, the line-shape model) thus enters with its full
 * correlation and is not averaged down as if each line had its own; the measurement enters
 * line by line, independent. Each part is reported on its own and the total is their quadrature sum.
 */
export function correctionBudget(correction: WavenumberCorrection, points: readonly BudgetPoint[]): CorrectionBudget {
  const { model, centreCm } = correction;
  const a = new Matrix(points.map((p) => correctionDesignRow(model, p.measuredCm, centreCm)));
  const w = points.map((p) => 1 / (p.fitSigmaCm * p.fitSigmaCm));
  const aw = a.transpose().clone();
  for (let j = 0; j < points.length; j++) for (let i = 0; i < aw.rows; i++) aw.set(i, j, aw.get(i, j) * w[j]);
  const m = inverse(aw.mmul(a)).mmul(aw);
  const t = new Matrix(toCorrectionTerms(model, centreCm)).mmul(m); // 3 × n: k, c, q per unit shift of each line

  const zero = () => [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  const parts = new Map<BudgetPart, { cov: number[][]; sources: Set<string> }>();
  const add = (part: BudgetPart, source: string, effect: number[]) => {
    let entry = parts.get(part);
    if (!entry) parts.set(part, (entry = { cov: zero(), sources: new Set() }));
    entry.sources.add(source);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) entry.cov[i][j] += effect[i] * effect[j];
  };
  // Reference sources: each one's shifts of every line move the correction together.
  const bySource = new Map<string, { kind: ErrorShareKind; shifts: Float64Array }>();
  points.forEach((p, j) => {
    for (const share of p.shares) {
      let s = bySource.get(share.source);
      if (!s) bySource.set(share.source, (s = { kind: share.kind, shifts: new Float64Array(points.length) }));
      s.shifts[j] += share.shiftCm;
    }
  });
  const inflation = inflationFor(
    points,
    a,
    m,
    [...bySource.values()].map((s) => s.shifts),
    correction.degreesOfFreedom,
  );
  // Measurement: independent line by line.
  points.forEach((p, j) => {
    const sigma = inflation * p.measurementSigmaCm;
    add(
      "measurement",
      `line ${j}`,
      [0, 1, 2].map((i) => t.get(i, j) * sigma),
    );
  });
  for (const [source, { kind, shifts }] of bySource) {
    const effect = [0, 1, 2].map((i) => {
      let sum = 0;
      for (let j = 0; j < points.length; j++) sum += t.get(i, j) * shifts[j];
      return sum;
    });
    add(kind, source, effect);
  }

  const total = zero();
  const rows: BudgetRow[] = [];
  for (const part of budgetParts) {
    const entry = parts.get(part);
    if (!entry) continue;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) total[i][j] += entry.cov[i][j];
    rows.push({ part, scaleSigma: Math.sqrt(entry.cov[0][0]), offsetSigmaCm: Math.sqrt(entry.cov[1][1]), sources: entry.sources.size });
  }
  const scaleSigma = Math.sqrt(total[0][0]);
  const offsetSigmaCm = Math.sqrt(total[1][1]);
  return {
    rows,
    scaleSigma,
    offsetSigmaCm,
    quadraticSigmaPerCm: Math.sqrt(total[2][2]),
    scaleOffsetCorrelation: scaleSigma > 0 && offsetSigmaCm > 0 ? total[0][1] / (scaleSigma * offsetSigmaCm) : 0,
    measurementInflation: inflation,
  };
}
