import { buildLinearMolecule, linearSemanticProblems } from "./linearMolecule.ts";
import { linearMoleculeFileSchema } from "./linearSchema.ts";
import { semanticProblems, type ParseResult } from "./parseMoleculeText.ts";
import type { Problem } from "./problems.ts";
import type { MoleculeFile } from "./schema.ts";

type Path = ReadonlyArray<string | number>;
type Locate = (path: Path, message: string) => Problem;

// The diatomic checks that concern a molecule's whole-file shape; the linear form has its own.
const diatomicOnly = new Set(["electronicState", "atoms", "species"]);

/** Validates and builds a `structure: linear` file; problems are located like the diatomic form's. */
export function parseLinearMolecule(raw: unknown, file: string, expectedId: string | null, located: Locate): ParseResult {
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
    const data = parsed.data;
    // Identity fields (id, CAS number, element symbols, hazard, sources) are checked as in the first form.
    const { structure: _structure, species: _species, ...identity } = data;
    const shared = semanticProblems({ ...identity, species: [] } as unknown as MoleculeFile, expectedId).filter(
      (p) => !(p.path.length === 1 && diatomicOnly.has(String(p.path[0]))),
    );
    for (const { path, message } of [...shared, ...linearSemanticProblems(data)]) problems.push(located(path, message));
    if (!problems.length) return { ok: true, molecule: buildLinearMolecule(data, file), data };
  }
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
  return { ok: false, problems };
}
