import { readdirSync, readFileSync, statSync } from "node:fs";
import { basename, join, relative } from "node:path";
import type { Molecule } from "./moleculeIdentity.ts";
import { parseMoleculeBytes, maxMoleculeFileBytes } from "./parseMoleculeText.ts";
import { MoleculeFileError, type Problem } from "./problems.ts";

export const defaultMoleculesDir = "molecules";

/** The molecule files of a folder: every *.yaml except the template, sorted by name. */
export function moleculeFilesIn(dir: string): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    throw new MoleculeFileError([{ file: dir, line: null, column: null, path: "", message: "cannot read this folder of molecule files" }]);
  }
  return names
    .filter((n) => n.endsWith(".yaml") && !n.startsWith("_"))
    .sort()
    .map((n) => join(dir, n));
}

function displayPath(path: string): string {
  const rel = relative(process.cwd(), path);
  return rel.startsWith("..") ? path : rel;
}

export interface LoadResult {
  molecules: Molecule[];
  problems: Problem[];
}

/** Reads and validates files; returns every problem found rather than stopping at the first. */
export function loadMoleculeFiles(paths: string[]): LoadResult {
  const molecules: Molecule[] = [];
  const problems: Problem[] = [];
  for (const path of paths) {
    const shown = displayPath(path);
    if (!path.endsWith(".yaml")) {
      problems.push({ file: shown, line: null, column: null, path: "", message: "a molecule file must be named <id>.yaml" });
      continue;
    }
    let bytes: Uint8Array;
    try {
      const size = statSync(path).size;
      if (size > maxMoleculeFileBytes) {
        problems.push({
          file: shown,
          line: null,
          column: null,
          path: "",
          message: `the file is ${size} bytes; molecule files are limited to ${maxMoleculeFileBytes} bytes`,
        });
        continue;
      }
      bytes = readFileSync(path);
    } catch {
      problems.push({ file: shown, line: null, column: null, path: "", message: "cannot read this file (does it exist?)" });
      continue;
    }
    const result = parseMoleculeBytes(bytes, shown, basename(path, ".yaml"));
    if (result.ok) molecules.push(result.molecule);
    else problems.push(...result.problems);
  }
  // Identity across files: ids and CAS numbers name one molecule each.
  const seen = new Map<string, string>();
  for (const m of molecules) {
    for (const [kind, value] of [
      ["id", m.id],
      ["casNumber", m.casNumber],
    ] as const) {
      const key = `${kind}:${value}`;
      const other = seen.get(key);
      if (other)
        problems.push({
          file: m.file,
          line: null,
          column: null,
          path: kind,
          message: `${kind === "id" ? "id" : "CAS number"} "${value}" is already used by ${other}`,
        });
      else seen.set(key, m.file);
    }
  }
  return { molecules, problems };
}

/** Loads a whole folder and refuses to go on if any file has a problem. */
export function loadMoleculesOrThrow(dir: string = defaultMoleculesDir): Molecule[] {
  const { molecules, problems } = loadMoleculeFiles(moleculeFilesIn(dir));
  if (problems.length) throw new MoleculeFileError(problems);
  return molecules;
}
