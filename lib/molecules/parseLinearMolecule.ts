import { CoreInputError, moleculeValidation } from "../core/index.ts";
import { linearFitErrors, linearFitProblems, linearFitResultProblems, runLinearFit, withFittedConstants, type LinearFileFit } from "./linearFit.ts";
import { buildLinearMolecule, linearSemanticProblems } from "./linearMolecule.ts";
import { linearMoleculeFileSchema, type LinearMoleculeFile } from "./linearSchema.ts";
import { semanticProblems, type ParseOptions, type ParseResult } from "./parseMoleculeText.ts";
import type { Problem } from "./problems.ts";
import type { MoleculeFile } from "./schema.ts";

type Path = ReadonlyArray<string | number>;
type Locate = (path: Path, message: string) => Problem;

// The diatomic checks that concern a molecule's whole-file shape; the linear form has its own.
const diatomicOnly = new Set(["electronicState", "atoms", "species"]);

/** Validates and builds a `structure: linear` file; problems are located like the diatomic form's. */
export function parseLinearMolecule(raw: unknown, file: string, expectedId: string | null, located: Locate, options: ParseOptions = {}): ParseResult {
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
  } else {
    const fitted = fitLinearFile(parsed.data, options);
    if ("problems" in fitted) {
      for (const { path, message } of fitted.problems) problems.push(located(path, message));
      problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
      return { ok: false, problems };
    }
    const { data, fits } = fitted;
    // Identity fields (id, CAS number, element symbols, hazard, sources) are checked as in the first form.
    const { structure: _structure, species: _species, ...identity } = data;
    const shared = semanticProblems({ ...identity, species: [] } as unknown as MoleculeFile, expectedId).filter(
      (p) => !(p.path.length === 1 && diatomicOnly.has(String(p.path[0]))),
    );
    for (const { path, message } of [...shared, ...linearSemanticProblems(data)]) problems.push(located(path, message));
    if (!problems.length) {
      const molecule = buildLinearMolecule(data, file);
      for (const fit of fits) {
        const massNumbers = data.species[fit.speciesIndex].massNumbers.join(",");
        const model = molecule.species.find((s) => s.model.massNumbers.join(",") === massNumbers)!.model;
        model.linear!.positionErrors = linearFitErrors(fit, model.linear!);
        model.constantsOrigin = "fitted";
      }
      if (fits.length) {
        const validations = moleculeValidation(
          molecule.species.map((s) => s.model),
          true,
        );
        molecule.species.forEach((s, i) => (s.model.validation = validations[i]));
      }
      return { ok: true, molecule, data: parsed.data, linearFits: fits };
    }
  }
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
  return { ok: false, problems };
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
