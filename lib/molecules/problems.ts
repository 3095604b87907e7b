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
