import { measuredGrade, type BudgetPart, type SpectrumCalibrationResult } from "../core/index.ts";

/** What each part of a correction's uncertainty budget is, in the words every output uses. */
export const budgetPartWords: Record<BudgetPart, string> = {
  measurement: "measurement (peak fit, per-line floor, observed scatter)",
  certified: "reference: certified line positions (each line's own ±)",
  constants: "reference: constants (covariance, second set)",
  "omitted-term": "reference: Dunham terms the constants leave out",
  "isotope-scaling": "reference: isotope scaling",
  "residual-floor": "reference: misses of measured lines",
  "pressure-shift": "reference: pressure shift",
  "line-shape": "resolution and line shape (predicted peak shifts)",
};

/** Digits for a budget entry: two significant figures, plain decimals. */
function twoFigures(x: number): string {
  if (x === 0) return "0";
  if (!Number.isFinite(x)) return "—";
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(Math.abs(x))));
  return x.toFixed(decimals);
}

/**
 * The budget as a small table (part, σ of k in ppm, σ of c in cm⁻¹, sources) with the total last:
 * the CLI, the page and the PDF report print these rows. A term the model does not fit shows "—".
 */
export function budgetTable(result: SpectrumCalibrationResult): { headings: string[]; rows: string[][]; rightAligned: boolean[] } {
  const { model } = result.correction;
  const k = (sigma: number) => (model === "offset" ? "—" : twoFigures(sigma * 1e6));
  const c = (sigma: number) => (model === "scale" ? "—" : twoFigures(sigma));
  const rows = result.budget.rows.map((r) => [budgetPartWords[r.part], k(r.scaleSigma), c(r.offsetSigmaCm), String(r.sources)]);
  rows.push(["total (quadrature sum)", k(result.budget.scaleSigma), c(result.budget.offsetSigmaCm), ""]);
  return { headings: ["uncertainty budget", "σ(k) / ppm", "σ(c) / cm⁻¹", "sources"], rows, rightAligned: [false, true, true, true] };
}

/** The budget as the JSON document carries it (`correction.budget`). */
export function budgetDocument(result: SpectrumCalibrationResult) {
  const { model } = result.correction;
  const b = result.budget;
  const ppm = (sigma: number) => (model === "offset" ? 0 : Number((sigma * 1e6).toPrecision(2)));
  const cm = (sigma: number) => (model === "scale" ? 0 : Number(sigma.toPrecision(2)));
  return {
    parts: b.rows.map((r) => ({
      part: r.part,
      meaning: budgetPartWords[r.part],
      scalePpm: ppm(r.scaleSigma),
      offsetCm: cm(r.offsetSigmaCm),
      sources: r.sources,
    })),
    totalScalePpm: ppm(b.scaleSigma),
    totalOffsetCm: cm(b.offsetSigmaCm),
    measurementWidening: Number(b.measurementInflation.toFixed(2)),
    peakFloorCm: Number((result.rules.peakFloorFraction * result.resolutionCm).toPrecision(2)),
  };
}

/** How the references used stand against measured lines. */
export type ReferenceStanding = "validated" | "partly-validated" | "not-validated";

export function referenceStanding(result: SpectrumCalibrationResult): { standing: ReferenceStanding; unvalidated: number; used: number } {
  const used = result.lines.filter((l) => l.used);
  const unvalidated = used.filter((l) => !measuredGrade(l.reference.positionStatus)).length;
  const standing = unvalidated === 0 ? "validated" : unvalidated === used.length ? "not-validated" : "partly-validated";
  return { standing, unvalidated, used: used.length };
}

/**
 * The one line the headline of every output carries when a reference used is not validated
 * against measured lines; null when all are.
 */
export function referenceStandingLine(result: SpectrumCalibrationResult): string | null {
  const { standing, unvalidated, used } = referenceStanding(result);
  if (standing === "validated") return null;
  return `references not validated against measured lines (${unvalidated} of ${used} used): this correction is not traceable`;
}
