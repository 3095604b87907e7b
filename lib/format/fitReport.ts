import { fitDecimals } from "../molecules/fileFit.ts";
import { textTable } from "./linesTable.ts";
import { signedSignificant, significant } from "./numbers.ts";
import { residualSignText } from "./accuracyText.ts";

/** What `bandatlas fit` reports, for any kind of fit (Dunham terms or per-state constants). */
export interface FitReport {
  molecule: string;
  file: string;
  parameters: Array<{ name: string; value: number; uncertainty: number; significance: number; supported: boolean }>;
  correlation: number[][];
  lines: Array<{
    species: string;
    band: string;
    label: string;
    measured: number;
    uncertainty: number;
    calculated: number;
    /** Calculated − measured, cm⁻¹ (residualSignText). */
    residual: number;
    normalized: number;
    heldOut: boolean;
    source: string;
  }>;
  fittedCount: number;
  heldOutCount: number;
  degreesOfFreedom: number;
  rmsCm: number;
  reducedChiSquared: number;
  heldOutRmsCm: number | null;
  nextTerms: Array<{ name: string; significance: number; supported: boolean }>;
  rule: string;
  /** The sign of every residual of the report, in words (residualSignText). */
  residualSign: string;
}

/** The report's line rows from a fit's residuals (Dunham or per-state fits alike). */
export function fitReportLines(
  residuals: ReadonlyArray<{
    observation: { species: string; band: string; label: string; wavenumberCm: number; uncertaintyCm: number; heldOut: boolean; sourceKey: string };
    calculatedCm: number;
    residualCm: number;
    normalized: number;
  }>,
): FitReport["lines"] {
  return residuals.map((r) => ({
    species: r.observation.species,
    band: r.observation.band,
    label: r.observation.label,
    measured: r.observation.wavenumberCm,
    uncertainty: r.observation.uncertaintyCm,
    calculated: r.calculatedCm,
    // The fit's own residual is measured − calculated; every printed residual of the atlas is
    // atlas − measured (residualSignText), so the report turns it round once, here.
    residual: -r.residualCm,
    normalized: -r.normalized,
    heldOut: r.observation.heldOut,
    source: r.observation.sourceKey,
  }));
}

export const termSupportRule =
  "a term is supported when |value| ≥ 3 standard uncertainties in the fit that holds it; each next candidate term is tried alone. Uncertainties are scaled by √(χ²/ν) when χ²/ν > 1.";

export function fitReportText(r: FitReport): string {
  const header = [
    `${r.molecule}: fit to ${r.fittedCount} cited measured lines${r.heldOutCount ? ` (${r.heldOutCount} more held out to test it)` : ""} — ${r.file}`,
    `RMS residual ${significant(r.rmsCm, 3)} cm⁻¹; χ²/ν = ${significant(r.reducedChiSquared, 3)} with ν = ${r.degreesOfFreedom}${r.heldOutRmsCm === null ? "" : `; held-out RMS ${significant(r.heldOutRmsCm, 3)} cm⁻¹`}`,
    `rule: ${r.rule}`,
    "",
  ];
  const params = textTable(
    ["parameter", "value / cm⁻¹", "± / cm⁻¹", "|value|/σ", "supported"],
    r.parameters.map((p) => [
      p.name,
      p.value.toFixed(fitDecimals(p.uncertainty)),
      significant(p.uncertainty, 3),
      significant(p.significance, 3),
      p.supported ? "yes" : "NO",
    ]),
    [false, true, true, true, false],
  );
  const next = r.nextTerms.length
    ? `\nnext terms tried alone: ${r.nextTerms.map((t) => `${t.name} ${significant(t.significance, 2)}σ (${t.supported ? "supported: consider adding it" : "not supported"})`).join("; ")}\n`
    : "";
  const names = r.parameters.map((p) => p.name);
  const correlation = textTable(
    ["correlation", ...names],
    r.correlation.map((row, i) => [names[i], ...row.map((c) => c.toFixed(3))]),
    [false, ...names.map(() => true)],
  );
  const lines = textTable(
    ["species", "band", "line", "measured / cm⁻¹", "± / cm⁻¹", "calculated / cm⁻¹", "calc − meas / cm⁻¹", "(calc − meas)/σ", "use", "source"],
    r.lines.map((l) => [
      l.species,
      l.band,
      l.label,
      String(l.measured),
      significant(l.uncertainty, 2),
      l.calculated.toFixed(7),
      signedSignificant(l.residual, 2),
      signedSignificant(l.normalized, 2),
      l.heldOut ? "held out" : "fitted",
      l.source,
    ]),
    [false, false, false, true, true, true, true, true, false, false],
  );
  const sign = `residuals: calculated − measured (${residualSignText}, as on the method page and in calibrate)`;
  return `${header.join("\n")}${params}\n${next}\n${correlation}\n\n${sign}\n${lines}\n`;
}
