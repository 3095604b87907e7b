import { cellLineSet, maxSpectrumRangeCm, moleculeCellSpectrum, spectrumRange, spectrumRangeFraction } from "../../atlas/index.ts";
import { relativeThinAbsorbance } from "../../core/index.ts";
import {
  allGasesCaution,
  csvRow,
  moleculeCaution,
  numeric,
  opticalDepthDigits,
  predictionNotice,
  pressureShiftRecord,
  spectrumWavenumberDigits,
  transmittanceDigits,
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

export const spectrumHelp = `bandatlas spectrum <molecule> [--from <cm⁻¹> --to <cm⁻¹>] [options]

Predicted transmittance of a gas cell as an instrument of the given resolution shows it:
all species at natural abundance, every band with intensity data, Voigt line shapes.

${cellOptionsHelp}
                          (default: the principal band, e.g. CO 1-0: its lines of every
                          species down to ${spectrumRangeFraction} of its strongest, plus 5 resolutions,
                          at least 2 cm⁻¹, on each side; JSON says so under rangeCm)
  --step <cm⁻¹>           spacing of the printed samples (default: resolution/10)
  --relative              for a molecule without a cited band intensity: print the relative,
                          optically thin apparent absorbance instead of refusing
  --format csv|json       CSV with units in the header (default), or JSON with the settings

${predictionNotice}
${allGasesCaution}`;

export function runSpectrum(args: string[]): string {
  const { values, positionals } = parseCommandLine(
    "spectrum",
    joinUnitWords(args),
    { ...cellOptionSpec, step: { type: "string" }, relative: { type: "boolean" } },
    1,
  );
  if (values.help) return spectrumHelp + "\n";
  if (positionals.length === 0)
    throw new UsageError("which molecule? e.g. `bandatlas spectrum co` or `bandatlas spectrum co --from 2000 --to 2250` (see bandatlas spectrum --help)");
  const format = formatOption(values.format as string | undefined, ["csv", "json"]);
  const conditions = cellConditionsFromOptions(values);
  const instrument = instrumentFromOptions(values, 0.5);
  const given = rangeFromOptions(values);
  const molecule = loadOneMolecule(moleculesDir(values.molecules as string | undefined), positionals[0]);
  const lineSet = cellLineSet(molecule, conditions);
  // Without --from/--to the band itself is shown: the first question is what the cell looks like.
  const band = spectrumRange(molecule, lineSet, instrument.kind === "monochromatic" ? 0 : instrument.resolutionCm);
  const fromCm = given.fromCm ?? band.fromCm;
  const toCm = given.toCm ?? band.toCm;
  if (!(toCm > fromCm))
    throw new UsageError(
      `--${given.fromCm === undefined ? "to" : "from"} ${given.fromCm ?? given.toCm}: the range would be ${fromCm.toFixed(1)} to ${toCm.toFixed(1)} cm⁻¹ (the other end is the band's); give both --from and --to`,
    );
  if (toCm - fromCm > maxSpectrumRangeCm)
    throw new UsageError(`--from ${fromCm} --to ${toCm}: at most ${maxSpectrumRangeCm} cm⁻¹ at a time (the bench page's limit too)`);
  // Which ends came from the principal band because no --from/--to gave them.
  const rangeCm = { from: fromCm, to: toCm, endsFromBand: [...(given.fromCm === undefined ? ["from"] : []), ...(given.toCm === undefined ? ["to"] : [])] };
  const { set, spectrum } = moleculeCellSpectrum(molecule, { conditions, fromCm, toCm, instrument }, lineSet);
  if (set.intensityScale === "relative-thin" && !values.relative) {
    throw new UsageError(
      `${molecule.name} has no cited band intensity, so its transmittance cannot be predicted; add a cited intensity block to ${molecule.id}.yaml, or use --relative for the relative optically thin absorbance`,
    );
  }
  const gridStep = spectrum.grid.stepCm;
  const step = numberOption("step", values.step as string | undefined, instrument.kind === "monochromatic" ? gridStep : instrument.resolutionCm / 10, "cm-1");
  if (!(step > 0)) throw new UsageError(`--step ${values.step}: must be above 0`);
  const stride = Math.max(1, Math.round(step / gridStep));
  const indices: number[] = [];
  for (let i = spectrum.windowFirst; i <= spectrum.windowLast; i += stride) indices.push(i);
  const nu = (i: number) => spectrum.grid.startCm + i * gridStep;

  if (set.intensityScale === "relative-thin") {
    const relative = relativeThinAbsorbance(spectrum);
    const rel = (i: number) => relative[i];
    if (format === "json") {
      return (
        JSON.stringify(
          {
            molecule: molecule.id,
            intensityScale: set.intensityScale,
            settings: describeConditions(conditions, instrument),
            rangeCm,
            notes: set.notes,
            caution: moleculeCaution(molecule),
            samples: indices.map((i) => ({ wavenumber: Number(spectrumWavenumberDigits(nu(i))), relativeAbsorbance: Number(transmittanceDigits(rel(i))) })),
          },
          null,
          2,
        ) + "\n"
      );
    }
    return (
      [
        csvRow(["wavenumber_cm-1", "relative_absorbance_optically_thin_NOT_transmittance"]),
        ...indices.map((i) => csvRow([numeric(spectrumWavenumberDigits(nu(i))), numeric(transmittanceDigits(rel(i)))])),
      ].join("\n") + "\n"
    );
  }
  const observed = spectrum.observedTransmittance!;
  const mono = spectrum.transmittance!;
  const tau = spectrum.opticalDepth;
  if (format === "json") {
    return (
      JSON.stringify(
        {
          molecule: molecule.id,
          intensityScale: set.intensityScale,
          conditions: { ...conditions },
          instrument,
          rangeCm,
          settings: describeConditions(conditions, instrument),
          bandsUsed: set.bandsUsed,
          bandsLeftOut: set.bandsLeftOut,
          broadeningTypical: set.broadeningTypical,
          pressureShift: pressureShiftRecord(set.pressureShift),
          notes: set.notes,
          caution: moleculeCaution(molecule),
          samples: indices.map((i) => ({
            wavenumber: Number(spectrumWavenumberDigits(nu(i))),
            transmittance: Number(transmittanceDigits(observed[i])),
            monochromaticTransmittance: Number(transmittanceDigits(mono[i])),
            opticalDepth: Number(opticalDepthDigits(tau[i])),
          })),
        },
        null,
        2,
      ) + "\n"
    );
  }
  const rows = [csvRow(["wavenumber_cm-1", "transmittance_instrument", "transmittance_monochromatic", "optical_depth"])];
  for (const i of indices)
    rows.push(
      csvRow([
        numeric(spectrumWavenumberDigits(nu(i))),
        numeric(transmittanceDigits(observed[i])),
        numeric(transmittanceDigits(mono[i])),
        numeric(opticalDepthDigits(tau[i])),
      ]),
    );
  return rows.join("\n") + "\n";
}
