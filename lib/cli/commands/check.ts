import { formatProblem, loadMoleculeFiles, moleculeFilesIn } from "../../molecules/index.ts";
import { moleculesDir } from "../moleculeSource.ts";
import { parseCommandLine } from "../options.ts";

export const checkHelp = `bandatlas check [files...] [options]

Validates molecule files: every problem on its own line as file:line:column: \`field\`: what is
wrong. Exit status 0 when every file is valid, 1 otherwise.

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
  return { output: `${molecules.length} molecule file${molecules.length === 1 ? "" : "s"} valid: ${molecules.map((m) => m.id).join(", ")}\n`, exitCode: 0 };
}
