import { CoreInputError } from "../core/index.ts";
import { linearFitProblems, linearFitResultProblems, runLinearFit, withFittedConstants, type LinearFileFit } from "./linearFit.ts";
import { buildMolecule } from "./buildMolecule.ts";
import { linearSemanticProblems } from "./linearChecks.ts";
import { linearMoleculeFileSchema, type LinearMoleculeFile } from "./linearSchema.ts";
import type { Found } from "./identityChecks.ts";
import type { ParseOptions, ParseResult } from "./parseResult.ts";
import { sortProblems, withFileChecks, type Problem } from "./problems.ts";

type Path = ReadonlyArray<string | number>;
type Locate = (path: Path, message: string) => Problem;

/**
 * Validates and builds a \`structure: linear\` file; problems are located like the diatomic form's.
 * \`fileChecks\` are the placeholder and identity problems found on the raw file: reported with
 * the schema's, the fit's or the semantic checks' problems, so one run lists them all.
 */
export function parseLinearMolecule(
  raw: unknown,
  file: string,
  expectedId: string | null,
  located: Locate,
  options: ParseOptions = {},
  fileChecks: Found[] = [],
): ParseResult {
  const problems: Problem[] = [];
  const parsed = linearMoleculeFileSchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path as Path;
      if (issue.code === "unrecognized_keys") {
        const messages = issue.message.split("; unknown field ");
        issue.keys.forEach((key, i) => problems.push(located([...path, key], i === 0 ? messages[0] : `unknown field ${messages[i]}`)));
      } else problems.push(located(path, issue.message));
    }
    return { ok: false, problems: withFileChecks(problems, fileChecks, located) };
  }
  const fitted = fitLinearFile(parsed.data, options);
  if ("problems" in fitted) {
    for (const { path, message } of [...fileChecks, ...fitted.problems]) problems.push(located(path, message));
    return { ok: false, problems: sortProblems(problems) };
  }
  const { data, fits } = fitted;
  for (const { path, message } of [...fileChecks, ...linearSemanticProblems(data)]) problems.push(located(path, message));
  if (!problems.length) return { ok: true, molecule: buildMolecule(data, file, { linearFits: fits }), data: parsed.data, linearFits: fits };
  return { ok: false, problems: sortProblems(problems) };
}

/**
 * Runs every species' fit (the build and the check re-run them, so the constants cannot drift from
 * their lines), compares it with the written result, and gives the data with the fitted values in.
 */
function fitLinearFile(
  data: LinearMoleculeFile,
  options: ParseOptions,
): { data: LinearMoleculeFile; fits: LinearFileFit[] } | { problems: Array<{ path: Array<string | number>; message: string }> } {
  const problems = linearFitProblems(data);
  if (problems.length) return { problems };
  const fits: LinearFileFit[] = [];
  for (let i = 0; i < data.species.length; i++) {
    try {
      const fit = runLinearFit(data, i);
      if (fit) fits.push(fit);
    } catch (error) {
      if (!(error instanceof CoreInputError)) throw error;
      problems.push({ path: ["species", i, "fit"], message: `the fit cannot be made: ${error.message}` });
    }
  }
  if (options.checkFitResult !== false) for (const fit of fits) problems.push(...linearFitResultProblems(data, fit));
  return problems.length ? { problems } : { data: withFittedConstants(data, fits), fits };
}
