import { defaultCalibrationCriteria, type CalibrationCriteria } from "../../core/index.ts";
import { moleculeCalibrationLines } from "../../atlas/index.ts";
import {
  calibrationWavenumberDigits,
  criteriaPhrase,
  csvRow,
  moleculeCaution,
  numeric,
  peakShiftDigits,
  pressureShiftRecord,
  positionWithUncertainty,
  roundedToUncertainty,
  significant,
  textTable,
} from "../../format/index.ts";
import {
  cellConditionsFromOptions,
  cellOptionSpec,
  cellOptionsHelp,
  describeConditions,
  instrumentFromOptions,
  joinUnitWords,
  rangeFromOptions,
} from "../cellOptions.ts";
import { loadOneMolecule, moleculesDir } from "../moleculeSource.ts";
import { formatOption, numberOption, parseCommandLine } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const calibrationLinesHelp = `bandatlas calibration-lines <molecule> --resolution <cm⁻¹> [options]

Lines strong and isolated enough to calibrate a wavenumber scale against at a resolution, with
the shift of the apparent peak from the true line position in the predicted spectrum.

${cellOptionsHelp}
                          (default: the whole range of the strong lines)
  --strong <f>            strong: at least f times the strongest line of the gas (default ${defaultCalibrationCriteria.strongFraction})
  --isolation <k>         isolated: no line within ±k × resolution (default ${defaultCalibrationCriteria.isolationMultiple}) …
  --neighbour <f>         … counting lines of at least f times the candidate's intensity (default ${defaultCalibrationCriteria.neighbourFraction})
  --accuracy <f>          accurate: position uncertainty at most f × resolution, in a validated
                          band's measured J range (default ${defaultCalibrationCriteria.maxUncertaintyFraction})
  --format table|csv|json table (default), CSV, or JSON with the settings

Predictions, not certified values: check critical calibrations against certified reference data.`;

export function runCalibrationLines(args: string[]): string {
  const { values, positionals } = parseCommandLine(
    "calibration-lines",
    joinUnitWords(args),
    { ...cellOptionSpec, strong: { type: "string" }, isolation: { type: "string" }, neighbour: { type: "string" }, accuracy: { type: "string" } },
    1,
  );
  if (values.help) return calibrationLinesHelp + "\n";
  if (positionals.length === 0)
    throw new UsageError("which molecule? e.g. `bandatlas calibration-lines co --resolution 1` (see bandatlas calibration-lines --help)");
  const format = formatOption(values.format as string | undefined, ["table", "csv", "json"]);
  const conditions = cellConditionsFromOptions(values);
  const instrument = instrumentFromOptions(values, 1);
  const range = rangeFromOptions(values);
  const criteria: CalibrationCriteria = {
    strongFraction: numberOption("strong", values.strong as string | undefined, defaultCalibrationCriteria.strongFraction),
    isolationMultiple: numberOption("isolation", values.isolation as string | undefined, defaultCalibrationCriteria.isolationMultiple),
    neighbourFraction: numberOption("neighbour", values.neighbour as string | undefined, defaultCalibrationCriteria.neighbourFraction),
    maxUncertaintyFraction: numberOption("accuracy", values.accuracy as string | undefined, defaultCalibrationCriteria.maxUncertaintyFraction),
  };
  const molecule = loadOneMolecule(moleculesDir(values.molecules as string | undefined), positionals[0]);
  const result = moleculeCalibrationLines(molecule, { conditions, instrument, ...range }, criteria);
  const resolution = result.resolutionCm;
  const criteriaText = criteriaPhrase(criteria, `${resolution} cm⁻¹`);
  const basis =
    result.set.intensityScale === "absolute"
      ? "peak shifts from the predicted transmittance at these cell conditions"
      : "peak shifts from the relative optically thin spectrum (no cited band intensity)";
  if (format === "json") {
    return (
      JSON.stringify(
        {
          molecule: molecule.id,
          resolutionCm: resolution,
          instrument,
          conditions,
          criteria,
          intensityScale: result.set.intensityScale,
          broadeningTypical: result.set.broadeningTypical,
          pressureShift: pressureShiftRecord(result.set.pressureShift),
          notes: result.set.notes,
          caution: moleculeCaution(molecule),
          lines: result.lines.map((l) => ({
            species: l.species,
            band: l.band,
            label: l.label,
            // Rounded to its ± like every printed position (the ± beside it, two significant digits).
            wavenumber: roundedToUncertainty(l.wavenumber, l.wavenumberUncertainty),
            wavenumberUncertainty: Number(significant(l.wavenumberUncertainty, 2)),
            relativeToStrongest: Number(significant(l.relativeToStrongest, 3)),
            nearestNeighbourCm: l.nearestNeighbourCm === null ? null : Number(calibrationWavenumberDigits(l.nearestNeighbourCm)),
            peakShiftCm: l.peakShiftCm === null ? null : Number(peakShiftDigits(l.peakShiftCm)),
          })),
        },
        null,
        2,
      ) + "\n"
    );
  }
  if (format === "csv") {
    const rows = [
      csvRow([
        "species",
        "band",
        "line",
        "wavenumber_cm-1",
        "wavenumber_uncertainty_cm-1",
        "relative_to_strongest",
        "nearest_neighbour_cm-1",
        "peak_shift_cm-1",
      ]),
    ];
    for (const l of result.lines) {
      rows.push(
        csvRow([
          l.species,
          l.band,
          l.label,
          numeric(positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).value),
          numeric(positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).sigma),
          numeric(significant(l.relativeToStrongest, 3)),
          l.nearestNeighbourCm === null ? null : numeric(calibrationWavenumberDigits(l.nearestNeighbourCm)),
          numeric(peakShiftDigits(l.peakShiftCm)),
        ]),
      );
    }
    return rows.join("\n") + "\n";
  }
  const header = [
    `${molecule.name} (${molecule.formula}): calibration-grade lines at ${resolution} cm⁻¹`,
    describeConditions(conditions, instrument),
    criteriaText,
    basis,
    ...result.set.notes,
    `CAUTION — ${moleculeCaution(molecule)}`,
    "",
  ];
  if (result.lines.length === 0) return header.join("\n") + "no line meets all three criteria at this resolution.\n";
  const table = textTable(
    ["species", "band", "line", "ν̃ / cm⁻¹", "± / cm⁻¹", "rel. to strongest", "nearest / cm⁻¹", "peak shift / cm⁻¹"],
    result.lines.map((l) => [
      l.species,
      l.band,
      l.label,
      positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).value,
      positionWithUncertainty(l.wavenumber, l.wavenumberUncertainty).sigma,
      significant(l.relativeToStrongest, 3),
      l.nearestNeighbourCm === null ? "none" : calibrationWavenumberDigits(l.nearestNeighbourCm),
      peakShiftDigits(l.peakShiftCm) || "no peak",
    ]),
    [false, false, false, true, true, true, true, true],
  );
  return header.join("\n") + table + "\n";
}
