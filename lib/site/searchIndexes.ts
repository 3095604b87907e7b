import MiniSearch from "minisearch";
import { atlasLines, defaultFindMinRelative, entryLines, type AtlasEntry } from "../atlas/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { encodeLineIndex, type LineIndexFile } from "../shared/lineIndexCodec.ts";
import { nameIndexOptions, type NameDocument } from "../shared/nameSearchOptions.ts";
import { moleculePagePath, speciesPagePath } from "../shared/sitePaths.ts";

/** The name/formula/alias/CAS index as MiniSearch's JSON, molecules in id order. */
export function nameIndexJson(molecules: Molecule[]): string {
  const search = new MiniSearch<NameDocument>(nameIndexOptions);
  search.addAll(
    molecules.map((m) => ({
      id: m.id,
      name: m.name,
      formula: m.formula,
      casNumber: m.casNumber,
      aliases: m.aliases.join(", "),
      species: m.species.flatMap((s) => s.spellings).join(" "),
      path: moleculePagePath(m.id),
    })),
  );
  return JSON.stringify(search);
}

/**
 * The wavenumber index at one temperature: exactly the lines `bandatlas find` searches (the
 * atlas's atlasLines at find's default threshold), each pointing at its species page. Given the
 * build's entries, the lines are taken from them rather than computed a second time.
 */
export function lineIndex(molecules: Molecule[], temperatureK: number, entries?: AtlasEntry[]): LineIndexFile {
  const lines = entries ? entryLines(entries, temperatureK, defaultFindMinRelative) : atlasLines(molecules, temperatureK, defaultFindMinRelative);
  return encodeLineIndex(lines, (l) => speciesPagePath(l.molecule, l.species, temperatureK), temperatureK, defaultFindMinRelative);
}
