import { readFileSync } from "node:fs";
import { join } from "node:path";
import { isMap, parseDocument } from "yaml";
import { dunhamTermName, termSupport } from "../../core/index.ts";
import { fitReportLines, fitReportText, residualSignText, termSupportRule, type FitReport } from "../../format/index.ts";
import {
  fitDecimals,
  MoleculeFileError,
  parseMoleculeBytes,
  type FileFit,
  type LinearFileFit,
  type LinearMoleculeFile,
  type DiatomicMoleculeFile,
} from "../../molecules/index.ts";
import { SheetInputError, writeFileAtomic } from "../../sheet/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { formatOption, parseCommandLine } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const fitHelp = `bandatlas fit <molecule | file.yaml> [options]

Fits the constants a molecule file's \`fit\` block names to the cited measured lines it names
(weighted least squares by singular value decomposition, each line weighted by 1/σ²) and reports
the constants with their standard uncertainties, the correlation matrix, every line's residual
(held-out lines included), the RMS and χ²/ν, and which terms the data support.

  --write                 write the fitted values into the file's \`result\` (comments are kept)
  --format table|json     table (default) or JSON
  --molecules <dir>       read <molecule>.yaml from <dir> instead of the shipped folder

The build and \`bandatlas check\` fit every such file again and refuse one whose written result
differs from the fit.`;

function filePath(dir: string, name: string): string {
  return name.endsWith(".yaml") ? name : join(dir, `${name.toLowerCase()}.yaml`);
}

export function dunhamFitReport(file: DiatomicMoleculeFile, fileName: string, fileFit: FileFit): FitReport {
  const { fit, observations, names } = fileFit;
  const support = termSupport(observations, fit);
  const heldOut = fit.residuals.filter((r) => r.observation.heldOut);
  return {
    molecule: file.id,
    file: fileName,
    parameters: names.map((name, i) => ({
      name,
      value: fit.solution.parameters[i],
      uncertainty: fit.solution.uncertainties[i],
      significance: support.fitted[i].significance,
      supported: support.fitted[i].supported,
    })),
    correlation: fit.solution.correlation,
    lines: fitReportLines(fit.residuals),
    fittedCount: fit.fittedCount,
    heldOutCount: fit.heldOutCount,
    degreesOfFreedom: fit.solution.degreesOfFreedom,
    rmsCm: fit.rmsCm,
    reducedChiSquared: fit.solution.reducedChiSquared,
    heldOutRmsCm: heldOut.length ? Math.sqrt(heldOut.reduce((s, r) => s + r.residualCm ** 2, 0) / heldOut.length) : null,
    nextTerms: support.next.map((t) => ({ name: dunhamTermName(t.term), significance: t.significance, supported: t.supported })),
    rule: termSupportRule,
    residualSign: residualSignText,
  };
}

export function linearFitReport(file: LinearMoleculeFile, fileName: string, fit: LinearFileFit): FitReport {
  const { solution, residuals } = fit.fit;
  const signs = fit.fit.parameters.map((p) => (p.l === 2 ? -1 : 1));
  const heldOut = residuals.filter((r) => r.observation.heldOut);
  return {
    molecule: `${file.id} (${file.species[fit.speciesIndex].label ?? file.species[fit.speciesIndex].massNumbers.join("/")})`,
    file: fileName,
    parameters: fit.names.map((name, i) => {
      const significance = Math.abs(fit.values[i]) / fit.uncertainties[i];
      return { name, value: fit.values[i], uncertainty: fit.uncertainties[i], significance, supported: significance >= 3 };
    }),
    correlation: solution.correlation.map((row, i) => row.map((c, j) => c * signs[i] * signs[j])),
    lines: fitReportLines(residuals),
    fittedCount: fit.fit.fittedCount,
    heldOutCount: fit.fit.heldOutCount,
    degreesOfFreedom: solution.degreesOfFreedom,
    rmsCm: fit.fit.rmsCm,
    reducedChiSquared: solution.reducedChiSquared,
    heldOutRmsCm: heldOut.length ? Math.sqrt(heldOut.reduce((sum, r) => sum + r.residualCm ** 2, 0) / heldOut.length) : null,
    nextTerms: [],
    rule: termSupportRule,
    residualSign: residualSignText,
  };
}

/** The file's text with the fit's result written in, everything else (comments included) kept. */
export function withFitResult(text: string, path: Array<string | number>, report: FitReport): string {
  const doc = parseDocument(text, { version: "1.2" });
  const result = doc.createNode(
    Object.fromEntries(
      report.parameters.map((p) => [p.name, { value: Number(p.value.toFixed(fitDecimals(p.uncertainty))), uncertainty: Number(p.uncertainty.toPrecision(3)) }]),
    ),
  );
  if (isMap(result)) for (const item of result.items) if (isMap(item.value)) item.value.flow = true;
  doc.setIn([...path, "result"], result);
  return doc.toString({ lineWidth: 0, flowCollectionPadding: false });
}

export function runFit(args: string[]): { output: string; exitCode: number } {
  const { values, positionals } = parseCommandLine("fit", args, { write: { type: "boolean" }, format: { type: "string" }, molecules: { type: "string" } }, 1);
  if (values.help) return { output: fitHelp + "\n", exitCode: 0 };
  if (positionals.length === 0) throw new UsageError("which molecule? e.g. `bandatlas fit c2h2` (see bandatlas fit --help)");
  const format = formatOption(values.format as string | undefined, ["table", "json"]);
  const path = filePath(moleculesDir(values.molecules as string | undefined), positionals[0]);
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(path);
  } catch {
    throw new UsageError(`no molecule file ${path}`);
  }
  const expectedId = path.replace(/^.*[\\/]/, "").replace(/\.yaml$/, "");
  const parsed = parseMoleculeBytes(bytes, path, expectedId, { checkFitResult: false });
  if (!parsed.ok) throw new MoleculeFileError(parsed.problems);
  const reports: Array<{ report: FitReport; resultPath: Array<string | number> }> = [];
  if (parsed.fileFit)
    reports.push({
      report: dunhamFitReport(parsed.data as DiatomicMoleculeFile, path, parsed.fileFit),
      resultPath: ["species", parsed.fileFit.referenceIndex, "constants", "fit"],
    });
  for (const fit of parsed.linearFits ?? [])
    reports.push({ report: linearFitReport(parsed.data as LinearMoleculeFile, path, fit), resultPath: ["species", fit.speciesIndex, "fit"] });
  if (!reports.length)
    throw new UsageError(`${path} has no \`fit\` block: its constants are cited, not fitted (see DEVELOPERS.md, "Fitting constants to measured lines")`);
  let note = "";
  if (values.write) {
    let text = new TextDecoder().decode(bytes);
    for (const { report, resultPath } of reports) text = withFitResult(text, resultPath, report);
    try {
      writeFileAtomic(path, new TextEncoder().encode(text));
    } catch (error) {
      if (error instanceof SheetInputError) throw new UsageError(error.message);
      throw error;
    }
    note = `\nwrote the result into ${path}\n`;
  }
  if (format === "json")
    return { output: JSON.stringify(reports.length === 1 ? reports[0].report : reports.map((r) => r.report), null, 2) + "\n", exitCode: 0 };
  return { output: reports.map((r) => fitReportText(r.report)).join("\n") + note, exitCode: 0 };
}
