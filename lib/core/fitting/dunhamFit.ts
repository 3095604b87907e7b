import { CoreInputError } from "../coreInputError.ts";
import type { DunhamCoefficient, WavenumberCm } from "../types.ts";
import { weightedLeastSquares, type LeastSquaresResult } from "./weightedLeastSquares.ts";

/** What every fit knows of one cited measured line, whatever the model it fits. */
export interface MeasuredLineObservation {
  species: string;
  jUpper: number;
  jLower: number;
  label: string;
  band: string;
  wavenumberCm: WavenumberCm;
  uncertaintyCm: WavenumberCm;
  sourceKey: string;
  /** Kept out of the fit and used only to test it. */
  heldOut: boolean;
}

/** One cited measured line as the Dunham fit sees it. */
export interface FitObservation extends MeasuredLineObservation {
  /** μ_reference / μ_species: Dunham's isotope relation scales Y_kl by (μ_ref/μ)^(k/2+l). */
  massRatio: number;
  /** Per atom, 1/M(atom in this species) − 1/M(atom in the reference species), in 1/u. */
  inverseMassShifts: number[];
  vUpper: number;
  vLower: number;
}

/**
 * A fitted parameter: the reference species' Y_kl, or (with `atom`) a first-order mass
 * correction d_kl of that atom, so that for any species
 * Y_kl = (μ_ref/μ)^(k/2+l) · [Y_kl,ref + Σ_atoms d_kl,atom · (1/M_atom − 1/M_atom,ref)]
 * (the Born–Oppenheimer breakdown terms in the form of J. K. G. Watson, J. Mol. Spectrosc. 80,
 * 411 (1980) and P. R. Bunker, J. Mol. Spectrosc. 68, 367 (1977), linearised in 1/M).
 */
export interface DunhamFitTerm {
  k: number;
  l: number;
  atom?: number;
}

export interface FitResidual {
  observation: FitObservation;
  calculatedCm: WavenumberCm;
  /** Observed minus calculated, cm⁻¹. */
  residualCm: WavenumberCm;
  /** Residual over the line's stated uncertainty. */
  normalized: number;
}

export interface DunhamFitResult {
  terms: DunhamFitTerm[];
  solution: LeastSquaresResult;
  residuals: FitResidual[];
  fittedCount: number;
  heldOutCount: number;
  /** Root mean square of the fitted lines' residuals, cm⁻¹ (unweighted). */
  rmsCm: number;
}

/** Derivative of a line position with respect to one parameter: it is linear in every one. */
function partial(term: DunhamFitTerm, o: FitObservation): number {
  const xUpper = o.jUpper * (o.jUpper + 1);
  const xLower = o.jLower * (o.jLower + 1);
  const level = Math.pow(o.vUpper + 0.5, term.k) * Math.pow(xUpper, term.l) - Math.pow(o.vLower + 0.5, term.k) * Math.pow(xLower, term.l);
  const scale = Math.pow(o.massRatio, term.k / 2 + term.l);
  return term.atom === undefined ? scale * level : scale * o.inverseMassShifts[term.atom] * level;
}

export function dunhamTermName(term: DunhamFitTerm, atomSymbols: readonly string[] = []): string {
  return term.atom === undefined ? `Y${term.k}${term.l}` : `Y${term.k}${term.l}_${atomSymbols[term.atom] ?? term.atom}`;
}

/**
 * Fits Dunham coefficients (and optional mass-correction terms) to cited measured lines of one
 * or several isotopologues at once, weighting each line by 1/σ². Lines marked `heldOut` are
 * predicted, not fitted. Term values E(v,J) = Σ Y_kl (v+½)^k [J(J+1)]^l (J. L. Dunham, Phys. Rev.
 * 41, 721 (1932)); pure-rotation lines (v' = v'') enter the same way and fix the l ≥ 1 terms.
 */
export function fitDunham(observations: readonly FitObservation[], terms: readonly DunhamFitTerm[]): DunhamFitResult {
  const fitted = observations.filter((o) => !o.heldOut);
  if (terms.length === 0) throw new CoreInputError("a Dunham fit needs at least one term");
  const seen = new Set<string>();
  for (const t of terms) {
    const key = dunhamTermName(t);
    if (seen.has(key)) throw new CoreInputError(`term ${key} is listed twice`);
    seen.add(key);
    if (t.k === 0 && t.l === 0) throw new CoreInputError("Y00 shifts every level alike and cannot be fitted to line positions");
  }
  const solution = weightedLeastSquares(
    fitted.map((o) => terms.map((t) => partial(t, o))),
    fitted.map((o) => o.wavenumberCm),
    fitted.map((o) => o.uncertaintyCm),
  );
  const residuals = observations.map((o) => {
    const calculatedCm = terms.reduce((sum, t, i) => sum + partial(t, o) * solution.parameters[i], 0);
    const residualCm = o.wavenumberCm - calculatedCm;
    return { observation: o, calculatedCm, residualCm, normalized: residualCm / o.uncertaintyCm };
  });
  const fittedResiduals = residuals.filter((r) => !r.observation.heldOut);
  const rmsCm = Math.sqrt(fittedResiduals.reduce((s, r) => s + r.residualCm ** 2, 0) / fittedResiduals.length);
  return { terms: [...terms], solution, residuals, fittedCount: fitted.length, heldOutCount: observations.length - fitted.length, rmsCm };
}

/** A species' Dunham table and its covariance, from a fit: Y_kl of the species is linear in the fitted parameters. */
export function speciesDunhamFromFit(
  fit: DunhamFitResult,
  massRatio: number,
  inverseMassShifts: readonly number[],
): { dunham: DunhamCoefficient[]; covariance: number[][] } {
  const keys: Array<{ k: number; l: number }> = [];
  for (const t of fit.terms) if (!keys.some((c) => c.k === t.k && c.l === t.l)) keys.push({ k: t.k, l: t.l });
  // Jacobian: d Y_kl(species) / d parameter.
  const jacobian = keys.map(({ k, l }) =>
    fit.terms.map((t) => {
      if (t.k !== k || t.l !== l) return 0;
      const scale = Math.pow(massRatio, k / 2 + l);
      return t.atom === undefined ? scale : scale * inverseMassShifts[t.atom];
    }),
  );
  const p = fit.solution.parameters;
  const c = fit.solution.covariance;
  const dunhamValues = jacobian.map((row) => row.reduce((sum, d, i) => sum + d * p[i], 0));
  const covariance = jacobian.map((ra) => jacobian.map((rb) => ra.reduce((sa, da, i) => sa + da * rb.reduce((sb, db, j) => sb + db * c[i][j], 0), 0)));
  const dunham = keys.map(({ k, l }, i) => ({ k, l, valueCm: dunhamValues[i], uncertaintyCm: Math.sqrt(covariance[i][i]) }));
  return { dunham, covariance };
}

/** The order in which Dunham terms usually become significant (by size for a light hydride or CO). */
export const dunhamTermOrder: ReadonlyArray<{ k: number; l: number }> = [
  { k: 1, l: 0 },
  { k: 0, l: 1 },
  { k: 2, l: 0 },
  { k: 1, l: 1 },
  { k: 0, l: 2 },
  { k: 3, l: 0 },
  { k: 2, l: 1 },
  { k: 1, l: 2 },
  { k: 0, l: 3 },
  { k: 4, l: 0 },
  { k: 3, l: 1 },
  { k: 2, l: 2 },
  { k: 1, l: 3 },
  { k: 0, l: 4 },
  { k: 5, l: 0 },
  { k: 4, l: 1 },
  { k: 3, l: 2 },
  { k: 2, l: 3 },
  { k: 1, l: 4 },
  { k: 0, l: 5 },
];

export interface TermSupport {
  term: DunhamFitTerm;
  /** |value| / standard uncertainty. */
  significance: number;
  supported: boolean;
}

/**
 * The rule for how many terms the data support: a term is supported when its value is at least
 * three standard uncertainties from zero in the fit that contains it (a t-test at about 99.7 %
 * for a Gaussian; common practice in spectroscopic fits). Each fitted term is judged in the fit,
 * and each of the next few candidate terms (in `dunhamTermOrder`) by adding it alone.
 */
export function termSupport(observations: readonly FitObservation[], fit: DunhamFitResult, candidates = 3): { fitted: TermSupport[]; next: TermSupport[] } {
  const judge = (term: DunhamFitTerm, value: number, sigma: number): TermSupport => {
    const significance = Math.abs(value) / sigma;
    return { term, significance, supported: significance >= 3 };
  };
  const fitted = fit.terms.map((t, i) => judge(t, fit.solution.parameters[i], fit.solution.uncertainties[i]));
  const next: TermSupport[] = [];
  for (const c of dunhamTermOrder) {
    if (next.length >= candidates) break;
    if (fit.terms.some((t) => t.atom === undefined && t.k === c.k && t.l === c.l)) continue;
    const term = { k: c.k, l: c.l };
    try {
      const trial = fitDunham(observations, [...fit.terms, term]);
      const i = trial.terms.length - 1;
      next.push(judge(term, trial.solution.parameters[i], trial.solution.uncertainties[i]));
    } catch (error) {
      if (!(error instanceof CoreInputError)) throw error;
      // A term the lines cannot determine at all (e.g. Y30 from one band) is not supported.
      next.push({ term, significance: 0, supported: false });
    }
  }
  return { fitted, next };
}
