// The error classes from their own files, not the folders' indexes: `bandatlas --help` and every
// command start here, and the indexes would load the whole atlas first.
import { AtlasLookupError } from "../atlas/selectSpecies.ts";
import { CoreInputError } from "../core/coreInputError.ts";
import { formatProblem, MoleculeFileError } from "../molecules/problems.ts";
import { commands } from "./commands/index.ts";
import { UsageError } from "./usageError.ts";

function mainHelp(): string {
  const width = Math.max(...Object.keys(commands).map((c) => c.length));
  return `bandatlas — predicted vibration–rotation lines of calibration gases, as tables, a website and bench sheets

usage: bandatlas <command> [options]     (bandatlas <command> --help for its options)

${Object.entries(commands)
  .map(([name, c]) => `  ${name.padEnd(width)}  ${c.summary}`)
  .join("\n")}

Predictions, not certificates: check critical calibrations against certified reference data.
`;
}

/** Runs one command line; returns what to print and the exit status. Never throws for bad input. */
export async function runCli(argv: string[]): Promise<{ stdout: string; stderr: string; exitCode: number }> {
  const [name, ...rest] = argv;
  if (name === undefined || name === "--help" || name === "-h" || name === "help") {
    return { stdout: mainHelp(), stderr: "", exitCode: name === undefined ? 2 : 0 };
  }
  if (name === "--version") return { stdout: `${process.env.npm_package_version ?? ""}\n`, stderr: "", exitCode: 0 };
  const command = Object.prototype.hasOwnProperty.call(commands, name) ? commands[name] : undefined;
  if (!command) {
    return { stdout: "", stderr: `bandatlas: unknown command "${name}"; commands: ${Object.keys(commands).join(", ")} (see bandatlas --help)\n`, exitCode: 2 };
  }
  try {
    const result = await (await command.load()).run(rest);
    return typeof result === "string"
      ? { stdout: result, stderr: "", exitCode: 0 }
      : { stdout: result.exitCode === 0 ? result.output : "", stderr: result.exitCode === 0 ? "" : result.output, exitCode: result.exitCode };
  } catch (error) {
    if (error instanceof MoleculeFileError) return { stdout: "", stderr: error.problems.map(formatProblem).join("\n") + "\n", exitCode: 1 };
    if (error instanceof UsageError || error instanceof CoreInputError || error instanceof AtlasLookupError) {
      return { stdout: "", stderr: `bandatlas ${name}: ${error.message}\n`, exitCode: 2 };
    }
    const message = error instanceof Error ? error.message : String(error);
    const detail = process.env.BANDATLAS_DEBUG && error instanceof Error ? `\n${error.stack}` : "";
    return {
      stdout: "",
      stderr: `bandatlas ${name}: internal error: ${message}${detail}\n(this is a bug; please report it with the command you ran)\n`,
      exitCode: 3,
    };
  }
}
