import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join, relative } from "node:path";
import { idPattern } from "../../molecules/index.ts";
import { moleculesDir, shippedMoleculesDir } from "../moleculeSource.ts";
import { parseCommandLine } from "../options.ts";
import { UsageError } from "../usageError.ts";

export const newHelp = `bandatlas new <id> [options]

Writes molecules/<id>.yaml from the commented template: every field explained, units stated,
placeholders marked REPLACE. Refuses to overwrite an existing file. The model builds ¹Σ⁺
diatomics and linear molecules' Σ–Σ bands; a bent molecule (H2O, SO2) cannot be built.

  <id>                    lowercase letters, digits and dashes, e.g. hbr or co-overtone
  --linear                a linear polyatomic molecule (CO2, N2O, C2H2): states and bands
                          (molecules/_template-linear.yaml) instead of a diatomic's constants
  --molecules <dir>       write into <dir> instead of the shipped molecules folder`;

export function runNew(args: string[]): string {
  const { values, positionals } = parseCommandLine("new", args, { molecules: { type: "string" }, linear: { type: "boolean" } }, 1);
  if (values.help) return newHelp + "\n";
  const id = positionals[0];
  if (id === undefined) throw new UsageError("which id? e.g. `bandatlas new hbr`, or `bandatlas new ocs --linear` (see bandatlas new --help)");
  if (!idPattern.test(id)) throw new UsageError(`id "${id}" must be lowercase letters, digits and single dashes (no spaces, dots or slashes)`);
  const dir = moleculesDir(values.molecules as string | undefined);
  if (!existsSync(dir)) throw new UsageError(`folder ${dir} does not exist`);
  const target = join(dir, `${id}.yaml`);
  const template = readFileSync(join(shippedMoleculesDir, values.linear ? "_template-linear.yaml" : "_template.yaml"), "utf8").replace("__ID__", id);
  try {
    // "wx" fails if the file exists, so two contributors can never overwrite each other's file.
    writeFileSync(target, template, { flag: "wx" });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "EEXIST")
      throw new UsageError(`${relative(process.cwd(), target) || target} already exists; edit it, or choose another id`);
    throw new UsageError(`cannot write ${target}: ${(error as Error).message}`);
  }
  const shown = relative(process.cwd(), target) || target;
  return `wrote ${shown}\nnext: replace every REPLACE, then run: npx bandatlas check ${shown}\n`;
}
