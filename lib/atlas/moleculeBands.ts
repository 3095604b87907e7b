import { bandLabel, parseBand, CoreInputError, type Band } from "../core/index.ts";
import type { Molecule, SpeciesInfo } from "../molecules/index.ts";
import { atlasBands, type BandKind } from "./atlasConfig.ts";

export interface SpeciesBand {
  band: Band;
  kind: BandKind;
  /** The band's usual name where it has one (ν3, 2ν3, ν1+ν3); the v'-v'' label for a diatomic. */
  name: string;
}

/**
 * The bands built for a species: a diatomic gets the atlas's standard set (fundamental, hot bands,
 * overtones); a linear molecule gets the Σ–Σ bands its file lists, in file order, the first being
 * the one the others are compared with.
 */
export function speciesBands(species: SpeciesInfo): SpeciesBand[] {
  const model = species.model;
  if (model.structure === "linear") return model.linear.bands.map((b) => ({ band: b.band, kind: b.kind, name: b.name }));
  return atlasBands.map(({ band, kind }) => ({ band, kind, name: bandLabel(band) }));
}

/**
 * A band named on the command line: v'-v'' for a diatomic (any band, not only the standard set),
 * for a linear molecule the upper-lower state ids or the band's name as its file gives them.
 * Without a name: the first band (the fundamental of a diatomic).
 */
export function resolveBand(molecule: Molecule, species: SpeciesInfo, text: string | undefined): Band {
  if (species.model.structure !== "linear") return parseBand(text ?? "1-0");
  const linear = species.model.linear;
  if (text === undefined) return linear.bands[0].band;
  const wanted = text.trim().toLowerCase();
  const found = linear.bands.find(
    (b) => b.band.label.toLowerCase() === wanted || b.name.toLowerCase() === wanted || b.name.replace(/ν/g, "nu").toLowerCase() === wanted,
  );
  if (!found) {
    throw new CoreInputError(
      `${molecule.name} (${species.model.label}) has no band "${text}"; its bands are: ${linear.bands.map((b) => `${b.band.label} (${b.name})`).join(", ")}`,
    );
  }
  return found.band;
}
