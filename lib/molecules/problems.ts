/** One thing wrong with a molecule file, located for a person to fix. */
export interface Problem {
  file: string;
  line: number | null;
  column: number | null;
  /** Dotted field path, e.g. "species[0].constants.equilibrium.bE"; "" for the whole file. */
  path: string;
  message: string;
}

export function formatProblem(p: Problem): string {
  const where = p.line === null ? p.file : `${p.file}:${p.line}:${p.column ?? 1}`;
  return p.path ? `${where}: \`${p.path}\`: ${p.message}` : `${where}: ${p.message}`;
}

export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out;
}

/** Thrown when files cannot be used; carries every problem found, never a stack trace for users. */
export class MoleculeFileError extends Error {
  readonly problems: Problem[];
  constructor(problems: Problem[]) {
    super(problems.map(formatProblem).join("\n"));
    this.name = "MoleculeFileError";
    this.problems = problems;
  }
}

/** Problems in the order of the file, so a contributor fixes them from the top down. */
export function sortProblems(problems: Problem[]): Problem[] {
  return problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
}

/**
 * The schema's problems with the placeholder and identity problems added, less those at a place
 * the schema already reported, or inside it ("REPLACE" where a number belongs is said once, as a
 * wrong type).
 */
export function withFileChecks(
  schemaProblems: Problem[],
  fileChecks: ReadonlyArray<{ path: ReadonlyArray<string | number>; message: string }>,
  located: (path: ReadonlyArray<string | number>, message: string) => Problem,
): Problem[] {
  const reported = schemaProblems.map((p) => p.path);
  const within = (path: string) => reported.some((r) => path === r || r === "" || path.startsWith(`${r}.`) || path.startsWith(`${r}[`));
  const more = fileChecks.map(({ path, message }) => located(path, message)).filter((p) => !within(p.path));
  return sortProblems([...schemaProblems, ...more]);
}
