import { checkVerdict, overallVerdict, shiftAtWavenumber, verdictCoverageFactor, type CheckVerdict, type Verdict } from "../core/index.ts";
import type { ToleranceSetting } from "./calibrationRecord.ts";
import type { CalibrationRun } from "./spectrumCalibrationText.ts";

/** The decision rule in one sentence, printed with every verdict. */
export const verdictRule =
  `Rule: pass only when |error| + U ≤ tolerance, fail when |error| − U > tolerance, else undecided; error = the correction's shift k·ν + c at the check wavenumber, ` +
  `U = ${verdictCoverageFactor}σ its expanded uncertainty (k = ${verdictCoverageFactor}) from the budget with the k–c correlation ` +
  `(ILAC-G8:09/2019 §4.2.3, non-binary statement with a guard band w = U; its conditional pass and conditional fail are "undecided" here).`;

export const verdictWords: Record<Verdict, string> = {
  pass: "the error plus its expanded uncertainty lies within the tolerance at every check wavenumber",
  fail: "the error exceeds the tolerance by more than its expanded uncertainty",
  undecided:
    "the tolerance lies within the error's expanded uncertainty; the data can neither pass nor fail the instrument (more lines, more scans or validated references narrow U)",
};

/** The wavenumbers a run is checked at: the tolerance's own, else the lowest and highest reference used. */
export function checkWavenumbersCm(run: CalibrationRun, setting: ToleranceSetting | null): number[] {
  if (setting && setting.at !== "band") return setting.at;
  const used = run.calibration.result.lines.filter((l) => l.used).map((l) => l.reference.referenceCm ?? l.reference.wavenumber);
  const low = Math.min(...used);
  const high = Math.max(...used);
  return low === high ? [low] : [low, high];
}

export interface RunVerdict {
  verdict: Verdict;
  setting: ToleranceSetting;
  checks: CheckVerdict[];
}

/** The verdict of a run against its tolerance; null when no tolerance was given. */
export function runVerdict(run: CalibrationRun): RunVerdict | null {
  const setting = run.record?.tolerance ?? null;
  if (setting === null) return null;
  const correction = run.calibration.result.correction;
  const checks = checkWavenumbersCm(run, setting).map((nu) => checkVerdict(shiftAtWavenumber(correction, nu), setting.tolerance));
  return { verdict: overallVerdict(checks), setting, checks };
}

const cm4 = (x: number) => x.toFixed(4);

/** One check in words: where, how far the scale reads off, U, the tolerance, the outcome. */
export function checkLine(check: CheckVerdict): string {
  // The instrument's error is measured − true, the opposite of the shift that corrects it.
  const error = -check.shiftCm;
  const way = error > 0 ? "high" : "low";
  return `at ${check.wavenumberCm.toFixed(2)} cm⁻¹: reads ${cm4(Math.abs(error))} cm⁻¹ ${way}, U (k = ${verdictCoverageFactor}) ${cm4(check.expandedCm)} cm⁻¹, tolerance ±${cm4(check.toleranceCm)} cm⁻¹: ${check.verdict}`;
}

/** The verdict's lines for the text report and the PDF: the verdict, each check, the rule. */
export function verdictLines(v: RunVerdict): string[] {
  return [`verdict: ${v.verdict.toUpperCase()}: ${verdictWords[v.verdict]}`, ...v.checks.map(checkLine)];
}

/** The JSON `verdict` and its checks. */
export function verdictDocument(v: RunVerdict | null) {
  if (v === null) return { verdict: null, verdictChecks: [], verdictRule: "no tolerance given (--tolerance): no verdict" };
  return {
    verdict: v.verdict,
    verdictChecks: v.checks.map((c) => ({
      wavenumberCm: Number(c.wavenumberCm.toFixed(4)),
      errorCm: Number((-c.shiftCm).toPrecision(3)),
      expandedUncertaintyCm: Number(c.expandedCm.toPrecision(2)),
      coverageFactor: verdictCoverageFactor,
      toleranceCm: Number(c.toleranceCm.toPrecision(6)),
      verdict: c.verdict,
    })),
    verdictRule,
  };
}
