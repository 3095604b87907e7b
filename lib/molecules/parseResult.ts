import type { Molecule } from "./moleculeIdentity.ts";
import type { FileFit } from "./fileFit.ts";
import type { LinearFileFit } from "./linearFit.ts";
import type { MoleculeFile } from "./linearSchema.ts";
import type { Problem } from "./problems.ts";

export interface ParseOptions {
  /** false: run the file's fit but do not compare it with the written result (for `bandatlas fit`). */
  checkFitResult?: boolean;
}

export type ParseResult =
  { ok: true; molecule: Molecule; data: MoleculeFile; fileFit?: FileFit | null; linearFits?: LinearFileFit[] } | { ok: false; problems: Problem[] };
