import { fileURLToPath } from "node:url";
import { atlasEntry, calibrationMarks, defaultCellConditions, defaultTemperatureK, selectSpecies } from "../../atlas/index.ts";
import { buildIdentity } from "../../shared/buildIdentity.ts";
import { parsePaper, renderBenchSheet, SheetInputError, sheetFileName, writeFileAtomic } from "../../sheet/index.ts";
import { loadOneMolecule, moleculesDir } from "../moleculeSource.ts";
import { parseCommandLine, temperatureOption } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const sheetHelp = `bandatlas sheet <molecule> [options]

A printable PDF bench reference sheet of one species' fundamental band at one temperature:
hazard caution, stick plot, P(J) and R(J) line table, sources and the build that made it.

  <molecule>              id, formula, CAS number or alias (co, HCl, 7647-01-0)
  --species <name>        isotopologue (12C16O, H37Cl, D35Cl, 13CO …); default: the most abundant
  --temperature <K>       gas temperature in kelvin (default ${defaultTemperatureK})
  --paper a4|letter       paper size (default a4)
  --out <file.pdf>        where to write it (default <molecule>-<species>-<T>K-<paper>.pdf here)
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones

The file is written whole or not at all. The numbers are predictions, not a certificate.`;

const repoDir = fileURLToPath(new URL("../../..", import.meta.url));

export async function runSheet(args: string[]): Promise<string> {
  const { values, positionals } = parseCommandLine(
    "sheet",
    args,
    { species: { type: "string" }, temperature: { type: "string" }, paper: { type: "string" }, out: { type: "string" }, molecules: { type: "string" } },
    1,
  );
  if (values.help) return sheetHelp + "\n";
  if (positionals.length === 0) throw new UsageError("which molecule? e.g. `bandatlas sheet co` (see bandatlas sheet --help)");
  try {
    const paper = parsePaper((values.paper as string | undefined) ?? "a4");
    const temperatureK = temperatureOption(values.temperature as string | undefined, defaultTemperatureK);
    const out = values.out as string | undefined;
    if (out !== undefined && out.trim() === "") throw new UsageError("--out needs a file name, e.g. --out co-296K.pdf");
    const molecule = loadOneMolecule(moleculesDir(values.molecules as string | undefined), positionals[0]);
    const species = selectSpecies(molecule, values.species as string | undefined);
    const entry = atlasEntry(molecule, species, temperatureK);
    const path = out ?? `${molecule.id}-${sheetFileName(species.model.label, temperatureK, paper)}`;
    // Calibration-grade lines are computed for the default cell only, as the build's sheets do.
    const calibration = temperatureK === defaultCellConditions.temperatureK ? calibrationMarks(molecule) : undefined;
    const bytes = await renderBenchSheet({ molecule, entry, paper, build: buildIdentity(repoDir), ...(calibration ? { calibration } : {}) });
    writeFileAtomic(path, bytes);
    return `wrote ${path} (${molecule.name}, ${species.model.label}, ${temperatureK} K, ${paper}, ${Math.round(bytes.length / 1024)} kB)\n`;
  } catch (error) {
    if (error instanceof SheetInputError) throw new UsageError(error.message);
    throw error;
  }
}
