import { formatProblem, loadMoleculeFiles, missingAbundantSpecies, moleculeFilesIn, type Molecule } from "../../molecules/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { parseCommandLine } from "../options.ts";

export const checkHelp = `bandatlas check [files...] [options]

Validates molecule files: every problem on its own line as file:line:column: \`field\`: what is
wrong. Exit status 0 when every file is valid, 1 otherwise. A valid file that leaves out a species
of natural abundance ≥ 1 % gets a warning (the exit status stays 0).

  [files...]              molecule files to check (default: every molecules/*.yaml)
  --molecules <dir>       the folder checked when no files are named`;

export function runCheck(args: string[]): { output: string; exitCode: number } {
  const { values, positionals } = parseCommandLine("check", args, { molecules: { type: "string" } }, Infinity);
  if (values.help) return { output: checkHelp + "\n", exitCode: 0 };
  const files = positionals.length ? positionals : moleculeFilesIn(moleculesDir(values.molecules as string | undefined));
  const { molecules, problems } = loadMoleculeFiles(files);
  if (problems.length) {
    return {
      output:
        problems.map(formatProblem).join("\n") +
        `\n${problems.length} problem${problems.length === 1 ? "" : "s"} in ${new Set(problems.map((p) => p.file)).size} of ${files.length} file${files.length === 1 ? "" : "s"}\n`,
      exitCode: 1,
    };
  }
  return {
    output:
      `${molecules.length} molecule file${molecules.length === 1 ? "" : "s"} valid: ${molecules.map((m) => m.id).join(", ")}\n` + abundanceWarnings(molecules),
    exitCode: 0,
  };
}

/**
 * Warnings, not problems (the file is valid): an abundant species the file leaves out has lines
 * in every natural cell, which the atlas would then not assign.
 */
function abundanceWarnings(molecules: Molecule[]): string {
  const lines = molecules.flatMap((m) =>
    missingAbundantSpecies(m).map(
      (s) =>
        `warning: ${m.file}: species ${s.label} (natural abundance ${(100 * s.abundance).toPrecision(2)} %) is not listed: a natural cell shows its lines; ` +
        (m.structure === "linear"
          ? `add it under \`species\` with its own states from a cited source (a linear molecule's species are not isotope-scaled)`
          : `add \`- massNumbers: [${s.massNumbers.join(", ")}]\` under \`species\` (its constants are then isotope-scaled)`),
    ),
  );
  return lines.length ? lines.join("\n") + "\n" : "";
}
