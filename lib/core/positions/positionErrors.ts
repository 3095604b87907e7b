import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { electronMassU } from "../physicalConstants.ts";
import type { DunhamCoefficient, DunhamErrorComponent } from "../types.ts";
import { weightedLeastSquares } from "../fitting/weightedLeastSquares.ts";

type Key = { k: number; l: number };

/** Each coefficient's own standard uncertainty, uncorrelated (what a handbook table gives). */
export function componentsFromUncertainties(dunham: readonly DunhamCoefficient[]): DunhamErrorComponent[] {
  return dunham
    .filter((c) => c.uncertaintyCm > 0)
    .map((c) => ({ kind: "constants", id: `constant Y${c.k}${c.l}`, deltas: [{ k: c.k, l: c.l, valueCm: c.uncertaintyCm }] }));
}

/**
 * Correlated coefficients as independent components: C = Σ λ v vᵀ, each component √λ·v. The
 * variance of any line position, gᵀCg, is then the sum of the components' squared shifts.
 */
export function componentsFromCovariance(keys: readonly Key[], covariance: number[][]): DunhamErrorComponent[] {
  const eigen = new EigenvalueDecomposition(new Matrix(covariance), { assumeSymmetric: true });
  const vectors = eigen.eigenvectorMatrix;
  return eigen.realEigenvalues.flatMap((lambda, r) => {
    if (!(lambda > 0)) return [];
    const root = Math.sqrt(lambda);
    return [{ kind: "constants" as const, id: `fit covariance ${r}`, deltas: keys.map(({ k, l }, i) => ({ k, l, valueCm: root * vectors.get(i, r) })) }];
  });
}

/**
 * Estimated size of the first Dunham terms a table leaves out: for each power l of J(J+1) the
 * next vibrational term Y_{K+1,l} and, at k = 0, the next rotational term Y_{0,L+1}, each taken as
 * the ratio of the last two terms it continues (|Y_{K+1,l}| ≈ Y_Kl²/|Y_{K−1,l}|). The Dunham
 * series of a diatomic falls off roughly geometrically in both indices: Y_kl ∝ μ^−(k/2+l) (Dunham
 * 1932), so in size Y_kl ~ ωe·(Be/ωe)^(k+2l−1), a step of Be/ωe per k and (Be/ωe)² per l. This is
 * an order-of-magnitude bound of our own on what the truncation misses, not a value.
 *
 * For the vibrational energies (l = 0) the ratio alone is not enough: a handbook table is often
 * the first terms of a longer fit, whose next term is not small by the ratio of the two before it.
 * In Dunham's ordering Y_k0 ≈ C_k·ωe·(Be/ωe)^(k−1) with C_k of order one for the first terms, but
 * the next coefficient is larger: C_4 ≈ 45 for 12C16O (Farrenq et al. 1991) and ≈ 92 for H35Cl
 * (ωeze, from memory) where C_3 ≈ 6 for both; the ratio rule misses these Y40 by 8× (CO) and 13×
 * (HCl). There the estimate is at least vibrationalStepFactor·(Be/ωe)·|Y_K0|, a factor of our own
 * set from these two molecules (1.3× their true Y40 for HCl, 2.7× for CO) and tested on them
 * (test/omittedTerms.test.ts, test/correctionCoverage.test.ts); other molecules inherit it untested.
 */
const vibrationalStepFactor = 20;

export function omittedTermEstimates(dunham: readonly DunhamCoefficient[]): Array<Key & { sizeCm: number }> {
  const value = (k: number, l: number) => dunham.find((c) => c.k === k && c.l === l)?.valueCm;
  const out: Array<Key & { sizeCm: number }> = [];
  const ls = [...new Set(dunham.map((c) => c.l))].sort((a, b) => a - b);
  const y01 = value(0, 1);
  const y10Value = value(1, 0);
  const vibrationalStep = y01 && y10Value ? vibrationalStepFactor * Math.abs(y01 / y10Value) : 0;

  for (const l of ls) {
    const ks = dunham.filter((c) => c.l === l).map((c) => c.k);
    const top = Math.max(...ks);
    const last = value(top, l);
    const before = value(top - 1, l);
    if (last !== undefined && before !== undefined && before !== 0) {
      const ratio = (last * last) / Math.abs(before);
      out.push({ k: top + 1, l, sizeCm: l === 0 ? Math.max(ratio, Math.abs(last) * vibrationalStep) : ratio });
    } else if (top === 0 && l >= 2 && last !== undefined) {
      // A series with only its k = 0 term (e.g. De without βe): its k = 1 term taken with the
      // relative vibrational dependence of the series below it (βe/De ≈ αe/Be in size).
      const lower0 = value(0, l - 1);
      const lower1 = value(1, l - 1);
      if (lower0 && lower1 !== undefined) out.push({ k: 1, l, sizeCm: Math.abs((last * lower1) / lower0) });
    }
  }
  const lTop = Math.max(...ls);
  const last = value(0, lTop);
  const before = value(0, lTop - 1);
  const y10 = value(1, 0);
  if (lTop === 1 && last !== undefined && y10) {
    // No centrifugal term at all: its size from Kratzer's relation De = 4Be³/ωe² (Herzberg 1950, ch. III).
    out.push({ k: 0, l: 2, sizeCm: (4 * last ** 3) / (y10 * y10) });
  } else if (last !== undefined && before !== undefined && before !== 0) out.push({ k: 0, l: lTop + 1, sizeCm: (last * last) / Math.abs(before) });
  return out;
}

/** An omitted term of the reference species and the part of it a fit absorbed: δY_j = −absorbed_j·size. */
export interface OmittedTerm {
  k: number;
  l: number;
  sizeCm: number;
  absorbed: Array<{ k: number; l: number; fraction: number }>;
}

/**
 * The omitted terms of a reference species' table. Where the constants came from a fit, the fit
 * has already absorbed the part of an omitted term that its own terms can mimic over the fitted
 * lines: that part is found by fitting the omitted term's column with the fitted ones, weighted
 * like the lines (β), and the error left is the omitted term minus β times the fitted terms. It is
 * small where lines were measured and grows outside them. Without a fit the whole term counts.
 */
export function omittedTerms(
  dunham: readonly DunhamCoefficient[],
  projection: { keys: readonly Key[]; column: (key: Key) => number[]; sigmasCm: number[] } | null,
): OmittedTerm[] {
  return omittedTermEstimates(dunham).map(({ k, l, sizeCm }) => {
    if (!projection) return { k, l, sizeCm, absorbed: [] };
    const target = projection.column({ k, l });
    const columns = projection.keys.map((key) => projection.column(key));
    const design = target.map((_, i) => columns.map((c) => c[i]));
    const beta = weightedLeastSquares(design, target, projection.sigmasCm).parameters;
    return { k, l, sizeCm, absorbed: projection.keys.map((key, j) => ({ k: key.k, l: key.l, fraction: beta[j] })) };
  });
}

/** Omitted terms as error components of a species whose Y_kl are the reference's × (μ_ref/μ)^(k/2+l). */
export function omittedTermComponents(terms: readonly OmittedTerm[], massRatio = 1): DunhamErrorComponent[] {
  const scale = (k: number, l: number) => Math.pow(massRatio, k / 2 + l);
  return terms.map((t) => ({
    kind: "omitted-term",
    id: `omitted Y${t.k}${t.l}`,
    deltas: [
      { k: t.k, l: t.l, valueCm: t.sizeCm * scale(t.k, t.l) },
      ...t.absorbed.map((a) => ({ k: a.k, l: a.l, valueCm: -a.fraction * t.sizeCm * scale(a.k, a.l) })),
    ],
  }));
}

/** A second published set of constants for the same species: their difference is one error component. */
export function crossCheckComponent(dunham: readonly DunhamCoefficient[], other: readonly DunhamCoefficient[]): DunhamErrorComponent {
  const keys: Key[] = [];
  for (const c of [...dunham, ...other]) if (!keys.some((key) => key.k === c.k && key.l === c.l)) keys.push({ k: c.k, l: c.l });
  const value = (table: readonly DunhamCoefficient[], key: Key) => table.find((c) => c.k === key.k && c.l === key.l)?.valueCm ?? 0;
  return { kind: "constants", id: "cross-check", deltas: keys.map((key) => ({ ...key, valueCm: value(dunham, key) - value(other, key) })) };
}

/**
 * What Dunham's isotope relation leaves out when a species is scaled from another without fitted
 * mass corrections: Born–Oppenheimer breakdown terms Y_kl·(m_e/M)·Δ_kl for each atom whose mass
 * changed (Watson 1980; Bunker 1977). We take |Δ_kl| ≤ 2 for every coefficient, a bound of our
 * own choosing (it makes the 13C16O 1-0 origin uncertain by about 0.015 cm⁻¹), and one component
 * per atom with every Y_kl moving together, the worst case for a line position.
 */
export function isotopeScalingComponents(dunham: readonly DunhamCoefficient[], inverseMassShifts: readonly number[]): DunhamErrorComponent[] {
  const bound = 2;
  return inverseMassShifts
    .map((shift, atom) => ({ shift, atom }))
    .filter(({ shift }) => shift !== 0)
    .map(({ shift, atom }) => ({
      kind: "isotope-scaling" as const,
      id: `isotope scaling atom ${atom + 1}`,
      deltas: dunham.map((c) => ({ k: c.k, l: c.l, valueCm: c.valueCm * bound * electronMassU * Math.abs(shift) })),
    }));
}
