import { defaultFindMinRelative, defaultFindWindowCm, defaultTemperatureK, findInAtlas } from "../../atlas/index.ts";
import { findColumns, findHeadText, findUnsourcedNote, textTable } from "../../format/index.ts";
import { parseSpectralPosition, positionToWavenumber, unitLabels, windowToWavenumber, type PositionUnit } from "../../core/index.ts";
import { loadMoleculesOrThrow } from "../../molecules/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { formatOption, numberOption, parseCommandLine, temperatureOption } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const findHelp = `bandatlas find <position> [options]

Which lines of the whole atlas lie near a position (an unexpected peak, a calibration line):
every shipped molecule, species and band, nearest first.

  <position>              vacuum wavenumber in cm⁻¹ (2143.3), or a wavelength with its unit:
                          1532.83nm, 1.53283um (vacuum unless --air)
  --unit cm-1|nm|um       the position's unit when it carries none (default cm-1)
  --air                   the wavelength is in standard air (Edlén 1966), as grating
                          instruments and many optical spectrum analysers report it
  --window <x>            half-width of the search window, in the position's unit
                          (default ${defaultFindWindowCm} cm⁻¹, or the same width in nm or µm there)
  --temperature <K>       gas temperature in kelvin (default ${defaultTemperatureK})
  --min-relative <x>      only lines at least x times the strongest line of their gas at that
                          temperature (of their band where the band's strength relative to the
                          gas is not sourced) (default ${defaultFindMinRelative})
  --format table|json     table (default) or JSON
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones`;

export function runFind(args: string[]): string {
  const { values, positionals } = parseCommandLine(
    "find",
    args,
    {
      window: { type: "string" },
      unit: { type: "string" },
      air: { type: "boolean" },
      temperature: { type: "string" },
      "min-relative": { type: "string" },
      format: { type: "string" },
      molecules: { type: "string" },
    },
    2,
  );
  if (values.help) return findHelp + "\n";
  if (positionals.length === 0) throw new UsageError("which position? e.g. `bandatlas find 2143.3` or `bandatlas find 1532.83nm` (see bandatlas find --help)");
  const unitText = values.unit as string | undefined;
  if (unitText !== undefined && !["cm-1", "nm", "um"].includes(unitText)) throw new UsageError(`--unit ${unitText}: use cm-1, nm or um`);
  // "1532.41 nm" may arrive as two words.
  const position = parseSpectralPosition(positionals.join(" "), (unitText ?? "cm-1") as PositionUnit, values.air ? "air" : "vacuum");
  const wavenumber = positionToWavenumber(position);
  const windowGiven = values.window === undefined ? null : numberOption("window", values.window as string, NaN);
  if (windowGiven !== null && !(windowGiven > 0))
    throw new UsageError(`--window ${values.window}: the half-width must be above 0 (a number in the position's unit)`);
  const windowCm = windowGiven === null ? defaultFindWindowCm : windowToWavenumber(position, windowGiven);
  if (windowCm > 500) throw new UsageError(`--window ${values.window}: the half-width must be at most 500 cm⁻¹ (${windowCm.toPrecision(3)} cm⁻¹ given)`);
  const temperatureK = temperatureOption(values.temperature as string | undefined, defaultTemperatureK);
  const minRelative = numberOption("min-relative", values["min-relative"] as string | undefined, defaultFindMinRelative);
  if (!(minRelative >= 0 && minRelative < 1)) throw new UsageError(`--min-relative ${minRelative} must be at least 0 and below 1`);
  const format = formatOption(values.format as string | undefined, ["table", "json"]);
  const matches = findInAtlas(loadMoleculesOrThrow(moleculesDir(values.molecules as string | undefined)), wavenumber, windowCm, temperatureK, minRelative);
  if (format === "json") {
    return (
      JSON.stringify(
        {
          query: { wavenumber, window: windowCm, temperatureK, minRelative, position: position.value, unit: position.unit, medium: position.medium },
          // bandToGas is the index's packing of gasRelativeIntensity, not a quantity of its own.
          matches: matches.map(({ bandToGas: _factor, ...m }) => m),
        },
        null,
        2,
      ) + "\n"
    );
  }
  const given = position.unit === "cm-1" ? "" : ` (${position.value} ${unitLabels[position.unit]}, ${position.medium})`;
  const head = findHeadText({ windowCm, wavenumber, given, temperatureK, minRelative, count: matches.length }) + "\n";
  if (!matches.length) return head;
  const table = textTable(
    findColumns.map((c) => c.heading),
    matches.map((m) => findColumns.map((c) => c.cell(m))),
    findColumns.map((c) => c.numeric),
  );
  const note = findUnsourcedNote(matches);
  return head + "\n" + table + "\n" + (note ? note + "\n" : "");
}
