import { bandOf, defaultTemperatureK, resolveBand, selectSpecies } from "../../atlas/index.ts";
import { constantsOriginText, linesCsv, linesDocument, linesTable } from "../../format/index.ts";
import type { Molecule, SpeciesInfo } from "../../molecules/index.ts";
import { loadOneMolecule, moleculesDir } from "../moleculeSource.ts";
import { formatOption, numberOption, parseCommandLine, temperatureOption } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const linesHelp = `bandatlas lines <molecule> [options]

Predicted P- and R-branch lines of one band of one species.

  <molecule>              id, formula, CAS number or alias (co, HCl, 7647-01-0)
  --species <name>        isotopologue, every atom's mass number (12C16O, 1H37Cl) or a
                          common short form (H37Cl, D35Cl, 13CO); default: the most abundant
  --band <v'-v''>         vibrational band, e.g. 1-0 (default), 2-1 (hot band), 2-0 (overtone);
                          for a linear molecule upper-lower state ids or the band's name
                          (co2: 00011-00001 or ν3/nu3; default: the first band its file lists)
  --temperature <K>       gas temperature in kelvin (default ${defaultTemperatureK})
  --min-relative <x>      leave out lines weaker than x times the strongest (default 1e-4)
  --format table|csv|json table (default), CSV with units in the header, or JSON
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones

Wavenumbers are vacuum cm⁻¹; air wavelengths are for standard air (Edlén 1966).`;

export function describeConstants(molecule: Molecule, species: SpeciesInfo): string {
  const source = molecule.sources.find((s) => s.key === species.model.constantsSourceKey);
  const cite = source ? source.citation : species.model.constantsSourceKey;
  return `${constantsOriginText(species.model, molecule.species[0].model.label)}: ${cite}`;
}

export function runLines(args: string[]): string {
  const { values, positionals } = parseCommandLine(
    "lines",
    args,
    {
      species: { type: "string" },
      band: { type: "string" },
      temperature: { type: "string" },
      "min-relative": { type: "string" },
      format: { type: "string" },
      molecules: { type: "string" },
    },
    1,
  );
  if (values.help) return linesHelp + "\n";
  if (positionals.length === 0) throw new UsageError("which molecule? e.g. `bandatlas lines co` (see bandatlas lines --help)");
  const format = formatOption(values.format as string | undefined, ["table", "csv", "json"]);
  const temperatureK = temperatureOption(values.temperature as string | undefined, defaultTemperatureK);
  const minRelative = numberOption("min-relative", values["min-relative"] as string | undefined, 1e-4);
  if (!(minRelative >= 0 && minRelative < 1)) throw new UsageError(`--min-relative ${minRelative} must be at least 0 and below 1`);
  const molecule = loadOneMolecule(moleculesDir(values.molecules as string | undefined), positionals[0]);
  const species = selectSpecies(molecule, values.species as string | undefined);
  const band = resolveBand(molecule, species, values.band as string | undefined);
  const result = bandOf(species, band, temperatureK, minRelative);
  if (format === "json") return JSON.stringify(linesDocument(molecule.id, result, molecule.limitations), null, 2) + "\n";
  if (format === "csv") return linesCsv(result, molecule.limitations);
  return linesTable(result, {
    moleculeName: molecule.name,
    formula: molecule.formula,
    constantsNote: describeConstants(molecule, species),
    limitations: molecule.limitations,
  });
}
