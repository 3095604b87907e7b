import { defaultFindMinRelative, defaultFindWindowCm, defaultTemperatureK, findNear, findWindowCm } from "../../atlas/index.ts";
import {
  emptyFindText,
  findColumns,
  findGroups,
  findPositionsNote,
  findUnknownStrengthHeading,
  fixed,
  findHeadText,
  roundedToUncertainty,
  textTable,
} from "../../format/index.ts";
import { parseSpectralPosition, positionToWavenumber, unitLabels, type PositionUnit } from "../../core/index.ts";
import { loadMoleculesOrThrow } from "../../molecules/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { formatOption, numberOption, parseCommandLine, temperatureOption } from "../options.ts";
import { UsageError } from "../usageError.ts";

/**
 * A bare number below this with nothing near it is more likely a wavelength in µm than a
 * wavenumber: the atlas's lines start near 1000 cm⁻¹, and mid-infrared wavelengths in µm run
 * from about 2 to 25 (common practice, no source).
 */
const micronGuessBelow = 50;

/**
 * A bare number read as µm, with the window its written digits allow: 4.66 means 4.655 to 4.665 µm
 * (half a unit of the last digit, common practice, no source), which is ±2.3 cm⁻¹ there.
 */
function micronReading(text: string, value: number) {
  const decimals = /\.(\d+)$/.exec(text)?.[1].length ?? 0;
  const windowUm = Number((0.5 * 10 ** -decimals).toPrecision(1));
  return { position: value, unit: "um", wavenumber: 1e4 / value, windowUm };
}

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
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones

When nothing is found it names the nearest line on each side (with its ±), a band origin inside
the window, and the common absorbers the atlas does not hold; a bare number below
${micronGuessBelow} with no line near it is asked about as a wavelength in µm.`;

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
  const windowCm = findWindowCm(position, windowGiven);
  if (windowCm > 500) throw new UsageError(`--window ${values.window}: the half-width must be at most 500 cm⁻¹ (${windowCm.toPrecision(3)} cm⁻¹ given)`);
  const temperatureK = temperatureOption(values.temperature as string | undefined, defaultTemperatureK);
  const minRelative = numberOption("min-relative", values["min-relative"] as string | undefined, defaultFindMinRelative);
  if (!(minRelative >= 0 && minRelative < 1)) throw new UsageError(`--min-relative ${minRelative} must be at least 0 and below 1`);
  const format = formatOption(values.format as string | undefined, ["table", "json"]);
  const molecules = loadMoleculesOrThrow(moleculesDir(values.molecules as string | undefined));
  const { matches, whenNone } = findNear(molecules, wavenumber, windowCm, temperatureK, minRelative);
  const groups = findGroups(matches);
  // "find 4.66" meant 4.66 µm: asked only of a bare number (no unit written, no --unit) that found nothing.
  const bare = unitText === undefined && /^[\d.,eE+\s]+$/.test(positionals.join(" "));
  const asMicrons = bare && !matches.length && position.value < micronGuessBelow ? micronReading(positionals.join("").trim(), position.value) : null;
  const micronQuestion = asMicrons
    ? `Did you mean ${asMicrons.position} µm (${fixed(asMicrons.wavenumber, 2)} cm⁻¹)? Then run: bandatlas find ${asMicrons.position} um --window ${asMicrons.windowUm}`
    : null;
  if (format === "json") {
    return (
      JSON.stringify(
        {
          query: { wavenumber, window: windowCm, temperatureK, minRelative, position: position.value, unit: position.unit, medium: position.medium },
          // bandToGas is the index's packing of gasRelativeIntensity, not a quantity of its own.
          // Lines of known strength first, then those whose strength is unknown (findGroups);
          // positions and offsets rounded to each line's ± as printed.
          matches: [...groups.known, ...groups.unknown].map(({ bandToGas: _factor, ...m }) => ({
            ...m,
            wavenumber: roundedToUncertainty(m.wavenumber, m.wavenumberUncertainty),
            wavenumberUncertainty: roundedToUncertainty(m.wavenumberUncertainty, m.wavenumberUncertainty),
            offset: roundedToUncertainty(m.offset, m.wavenumberUncertainty),
            strengthKnown: m.gasRelativeIntensity !== null,
          })),
          positions: findPositionsNote,
          ...(whenNone ? { whenNone: { ...whenNone, didYouMean: asMicrons ? { ...asMicrons, question: micronQuestion } : null } } : {}),
        },
        null,
        2,
      ) + "\n"
    );
  }
  const given = position.unit === "cm-1" ? "" : ` (${position.value} ${unitLabels[position.unit]}, ${position.medium})`;
  const head = findHeadText({ windowCm, wavenumber, given, temperatureK, minRelative, count: matches.length }) + "\n";
  if (whenNone) return head + [...(micronQuestion ? [micronQuestion] : []), ...emptyFindText(whenNone, wavenumber)].join("\n") + "\n";
  const table = (list: typeof matches) =>
    textTable(
      findColumns.map((c) => c.heading),
      list.map((m) => findColumns.map((c) => c.cell(m))),
      findColumns.map((c) => c.numeric),
    );
  const known = groups.known.length ? table(groups.known) + "\n" : "";
  const unknown = groups.unknown.length ? `\n${findUnknownStrengthHeading}\n\n${table(groups.unknown)}\n` : "";
  return head + "\n" + known + unknown + findPositionsNote + "\n";
}
