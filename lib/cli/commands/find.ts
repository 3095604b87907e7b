import { defaultFindMinRelative, defaultFindWindowCm, defaultTemperatureK, findInAtlas } from "../../atlas/index.ts";
import { fixed, significant, textTable } from "../../format/index.ts";
import { loadMoleculesOrThrow } from "../../molecules/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { formatOption, numberOption, parseCommandLine, temperatureOption } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const findHelp = `bandatlas find <wavenumber> [options]

Which lines of the whole atlas lie near a wavenumber (an unexpected peak, a calibration line):
every shipped molecule, species and band, nearest first.

  <wavenumber>            vacuum wavenumber in cm⁻¹
  --window <cm-1>         half-width of the search window (default ${defaultFindWindowCm})
  --temperature <K>       gas temperature in kelvin (default ${defaultTemperatureK})
  --min-relative <x>      only lines at least x times the strongest of their band (default ${defaultFindMinRelative})
  --format table|json     table (default) or JSON
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones`;

export function runFind(args: string[]): string {
  const { values, positionals } = parseCommandLine(
    "find",
    args,
    { window: { type: "string" }, temperature: { type: "string" }, "min-relative": { type: "string" }, format: { type: "string" }, molecules: { type: "string" } },
    1,
  );
  if (values.help) return findHelp + "\n";
  if (positionals.length === 0) throw new UsageError("which wavenumber? e.g. `bandatlas find 2143.3` (see bandatlas find --help)");
  const wavenumber = numberOption("wavenumber", positionals[0], NaN, "cm-1");
  if (!(wavenumber > 0)) throw new UsageError(`the wavenumber must be a number of cm⁻¹ above 0, got "${positionals[0]}"`);
  const windowCm = numberOption("window", values.window as string | undefined, defaultFindWindowCm, "cm-1");
  if (!(windowCm > 0) || windowCm > 500) throw new UsageError(`--window ${windowCm}: the half-width must be above 0 and at most 500 cm⁻¹`);
  const temperatureK = temperatureOption(values.temperature as string | undefined, defaultTemperatureK);
  const minRelative = numberOption("min-relative", values["min-relative"] as string | undefined, defaultFindMinRelative);
  if (!(minRelative >= 0 && minRelative < 1)) throw new UsageError(`--min-relative ${minRelative} must be at least 0 and below 1`);
  const format = formatOption(values.format as string | undefined, ["table", "json"]);
  const matches = findInAtlas(loadMoleculesOrThrow(moleculesDir(values.molecules as string | undefined)), wavenumber, windowCm, temperatureK, minRelative);
  if (format === "json") {
    return JSON.stringify({ query: { wavenumber, window: windowCm, temperatureK, minRelative }, matches }, null, 2) + "\n";
  }
  const head = `Lines within ±${windowCm} cm⁻¹ of ${wavenumber} cm⁻¹ at ${temperatureK} K, at least ${minRelative} of their band's strongest line: ${matches.length}\n`;
  if (!matches.length) return head;
  const rows = matches.map((m) => [m.molecule, m.species, m.band, m.label, fixed(m.wavenumber, 4), (m.offset >= 0 ? "+" : "") + fixed(m.offset, 4), significant(m.relativeIntensity, 3)]);
  return head + "\n" + textTable(["molecule", "species", "band", "line", "ν̃ / cm⁻¹", "offset / cm⁻¹", "rel. int."], rows, [false, false, false, false, true, true, true]) + "\n";
}
