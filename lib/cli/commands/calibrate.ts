import { createHash } from "node:crypto";
import { readFileSync, statSync } from "node:fs";
import { basename } from "node:path";
import { calibrateMeasuredSpectrum, cellModel, gasNameInSentence, maxCalibrationResolutionCm, selectSpecies, type CellModel } from "../../atlas/index.ts";
import { apodizations, correctionModels, type CorrectionModel } from "../../core/index.ts";
import { calibrationDocument, calibrationText, moleculeCaution, type CalibrationRun, type RefusedRun } from "../../format/index.ts";
import { CoreInputError } from "../../core/index.ts";
import { checkSpectrumFileSize, readSpectrumText, SpectrumFileError, type AbscissaUnit, type OrdinateKind } from "../../spectrumFile/index.ts";
import { apodizationOption, cellConditionOptionSpec, cellConditionsFromOptions, cellConditionsHelp, joinUnitWords } from "../cellOptions.ts";
import { loadOneMolecule, moleculesDir } from "../moleculeSource.ts";
import { formatOption, numberOption, parseCommandLine } from "../options.ts";
import { UsageError } from "../usageError.ts";
import { recordFromOptions, recordOptionSpec, recordOptionsHelp } from "../recordOptions.ts";
import type { CommandResult } from "../../shared/commandResult.ts";

export const calibrateHelp = `bandatlas calibrate <spectrum file> --gas <molecule> [options]

How wrong an instrument's wavenumber scale is, from a spectrum of a gas cell it recorded: finds
the absorption peaks, assigns them to the gas's predicted lines (all species at natural
abundance, apparent peaks at the instrument's resolution), and fits the correction by weighted
least squares. Refuses when the data do not support a correction.

  <spectrum file>         JCAMP-DX (.jdx, .dx) or CSV/TSV of two columns, at most 50 MB
  --gas <molecule>        the gas in the cell: id, formula, CAS number or alias (hcl, CO)
  --species <list>        an enriched cell: only these species, e.g. D35Cl or 13CO (comma-separated);
                          default: every species at natural abundance
  --model <name>          ${correctionModels.join(", ")} (default scale):
                            scale      true = measured × (1 + k)
                            offset     true = measured + c
                            linear     true = measured × (1 + k) + c
                            quadratic  true = measured × (1 + k) + c + q·(measured − centre)²
${cellConditionsHelp}
  --resolution <cm⁻¹>     FT resolution (1/max. OPD); default: the file's, else estimated from the peak widths
  --apodization <name>    ${apodizations.join(", ")} (default triangular)
  --x cm-1|um|nm          unit of the file's x values when it does not say (a file's own
                          label wins: an --x or --y that contradicts it is refused)
  --y transmittance|percent|absorbance   what the file's y values are when it does not say
  --format table|json     readable table (default) or JSON
  --report <file.pdf>     also write a PDF calibration report (a refused run: a short one saying why)
${recordOptionsHelp}
  --require-validated     use only references validated against measured lines, and refuse
                          (saying why) when too few are left: a traceable correction or none
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones

Cell conditions not given are the defaults and are marked "assumed" on every output. The true
wavenumber is measured × (1 + scalePpm·10⁻⁶) + offsetCm. The atlas predicts spectra;
it does not certify an instrument.`;

const ordinates: Record<string, OrdinateKind> = { transmittance: "transmittance", percent: "percent-transmittance", absorbance: "absorbance" };
const abscissas: Record<string, AbscissaUnit> = { "cm-1": "cm-1", um: "um", µm: "um", nm: "nm" };

/** Reads the spectrum file whole (size checked first) and its SHA-256; a plain message for any failure. */
function readSpectrumFile(path: string): { text: string; sha256: string } {
  let size: number;
  try {
    const stat = statSync(path);
    if (stat.isDirectory()) throw new UsageError(`${path} is a folder; give a spectrum file`);
    size = stat.size;
  } catch (error) {
    if (error instanceof UsageError) throw error;
    throw new UsageError(`cannot read ${path}: no such file`);
  }
  checkSpectrumFileSize(basename(path), size);
  const bytes = readFileSync(path);
  return { text: bytes.toString("utf8"), sha256: createHash("sha256").update(bytes).digest("hex") };
}

export interface CalibrateRequest {
  /** The run, or, when the data were refused, what a refusal still records. */
  run: CalibrationRun | null;
  refused: RefusedRun | null;
  format: "table" | "json";
  reportPath: string | undefined;
  logPath: string | undefined;
}

/** The command line turned into one calibration run (exported for the report writer and tests). */
export function calibrateRun(args: string[]): CalibrateRequest | string {
  const { values, positionals } = parseCommandLine(
    "calibrate",
    joinUnitWords(args),
    {
      gas: { type: "string" },
      species: { type: "string" },
      model: { type: "string" },
      ...cellConditionOptionSpec,
      resolution: { type: "string" },
      apodization: { type: "string" },
      x: { type: "string" },
      y: { type: "string" },
      format: { type: "string" },
      report: { type: "string" },
      molecules: { type: "string" },
      "require-validated": { type: "boolean" },
      ...recordOptionSpec,
    },
    1,
  );
  if (values.help) return calibrateHelp + "\n";
  if (positionals.length === 0) throw new UsageError("which spectrum file? e.g. `bandatlas calibrate scan.csv --gas hcl` (see bandatlas calibrate --help)");
  if (values.gas === undefined) throw new UsageError("which gas is in the cell? give --gas, e.g. --gas hcl");
  const format = formatOption(values.format as string | undefined, ["table", "json"]) as "table" | "json";
  const model = ((values.model as string | undefined) ?? "scale").toLowerCase();
  if (!(correctionModels as readonly string[]).includes(model)) throw new UsageError(`--model ${values.model}: use one of ${correctionModels.join(", ")}`);
  const apodization = apodizationOption(values);
  const ordinateText = values.y as string | undefined;
  if (ordinateText !== undefined && !(ordinateText.toLowerCase() in ordinates))
    throw new UsageError(`--y ${ordinateText}: use transmittance, percent or absorbance`);
  const abscissaText = values.x as string | undefined;
  if (abscissaText !== undefined && !(abscissaText.toLowerCase() in abscissas)) throw new UsageError(`--x ${abscissaText}: use cm-1, um or nm`);
  const resolutionCm = values.resolution === undefined ? undefined : numberOption("resolution", values.resolution as string, 0, "cm-1");
  if (resolutionCm !== undefined && !(resolutionCm > 0 && resolutionCm <= maxCalibrationResolutionCm))
    throw new UsageError(`--resolution ${values.resolution}: give a resolution above 0 and at most ${maxCalibrationResolutionCm} cm⁻¹`);
  const reportPath = values.report as string | undefined;
  if (reportPath !== undefined && !/\.pdf$/i.test(reportPath)) throw new UsageError(`--report ${reportPath}: give a file name ending in .pdf`);
  const conditions = cellConditionsFromOptions(values);
  const logPath = values.log as string | undefined;
  // Checked before the file is read, so a mistyped date or tolerance costs nothing.
  const given = recordFromOptions(values, null);
  const molecule = loadOneMolecule(moleculesDir(values.molecules as string | undefined), values.gas as string);

  let cell: CellModel = cellModel(molecule);
  if (values.species !== undefined) {
    // An enriched sample: its species' lines keep their relative strengths; the others are absent.
    const labels = new Set((values.species as string).split(",").map((name) => selectSpecies(molecule, name).model.label));
    cell = { ...cell, species: cell.species.filter((s) => labels.has(s.model.label)) };
  }
  const path = positionals[0];
  const fileName = basename(path);
  let file: { text: string; sha256: string };
  try {
    file = readSpectrumFile(path);
  } catch (error) {
    if (error instanceof SpectrumFileError) throw new UsageError(error.message);
    throw error;
  }
  const { text, sha256 } = file;
  const gasName = gasNameInSentence(molecule.name);
  const caution = moleculeCaution(molecule);
  try {
    const spectrum = readSpectrumText(text, fileName, {
      ...(abscissaText ? { abscissa: abscissas[abscissaText.toLowerCase()] } : {}),
      ...(ordinateText ? { ordinate: ordinates[ordinateText.toLowerCase()] } : {}),
    });
    const calibration = calibrateMeasuredSpectrum(
      cell,
      { wavenumberCm: spectrum.wavenumberCm, absorbance: spectrum.absorbance, resolutionCm: spectrum.resolutionCm },
      {
        conditions,
        apodization,
        model: model as CorrectionModel,
        ...(resolutionCm !== undefined ? { resolutionCm } : {}),
        requireValidated: values["require-validated"] === true,
      },
    );
    const record =
      given.measuredOn === null && spectrum.measuredOn !== null ? { ...given, measuredOn: spectrum.measuredOn, measuredOnFrom: "file" as const } : given;
    const run: CalibrationRun = {
      gas: molecule.id,
      gasName,
      fileName,
      sha256,
      spectrum,
      conditions,
      calibration,
      caution,
      sources: molecule.sources.map((source) => source.citation),
      record,
    };
    return { run, refused: null, format, reportPath, logPath };
  } catch (error) {
    // The file was read but does not support a correction: a refusal, which the report and the log still record.
    if (!(error instanceof SpectrumFileError || error instanceof CoreInputError)) throw error;
    const refused: RefusedRun = { gas: molecule.id, gasName, caution, fileName, sha256, conditions, record: given, reason: error.message };
    return { run: null, refused, format, reportPath, logPath };
  }
}

export async function runCalibrate(args: string[]): Promise<CommandResult | string> {
  const request = calibrateRun(args);
  if (typeof request === "string") return request;
  const { run, refused, format, reportPath, logPath } = request;
  const { writeCalibrationReport, writeRefusalReport, logCalibration, logRefusal } = await import("./calibrationReport.ts");
  if (refused !== null) {
    // One sentence, as every refusal; what was still written is named at its end.
    const wrote: string[] = [];
    if (logPath !== undefined) wrote.push(`logged as refused in ${logRefusal(refused, logPath)}`);
    if (reportPath !== undefined) wrote.push(`a report saying why is in ${await writeRefusalReport(refused, reportPath)}`);
    throw new UsageError(wrote.length > 0 ? `${refused.reason.replace(/\.$/, "")} (${wrote.join("; ")})` : refused.reason);
  }
  const done = run!;
  const output = format === "json" ? JSON.stringify(calibrationDocument(done), null, 2) + "\n" : calibrationText(done);
  const wrote: string[] = [];
  if (reportPath !== undefined) wrote.push(`wrote ${await writeCalibrationReport(done, reportPath)}`);
  if (logPath !== undefined) wrote.push(`logged in ${logCalibration(done, logPath)}`);
  return format === "json" || wrote.length === 0 ? output : `${output}${wrote.join("\n")}\n`;
}
