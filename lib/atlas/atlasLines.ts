import { bandLabel, bandLines, defaultMinRelativeIntensity, nearbyLines, speciesPartitionFunction, type LocatedLine, type NearbyLine } from "../core/index.ts";
import type { AtlasEntry } from "./atlasEntry.ts";
import type { Molecule } from "../molecules/index.ts";
import { speciesBands } from "./moleculeBands.ts";

/** Every line of every molecule, species and atlas band at one temperature, flattened for searching. */
export function atlasLines(molecules: Molecule[], temperatureK: number, minRelative: number): LocatedLine[] {
  const out: LocatedLine[] = [];
  for (const molecule of molecules) {
    for (const species of molecule.species) {
      const q = speciesPartitionFunction(species.model, temperatureK);
      for (const { band } of speciesBands(species)) {
        const result = bandLines(species.model, band, { temperatureK, partitionFunction: q, minRelative });
        const label = bandLabel(band);
        for (const line of result.lines) {
          out.push({
            molecule: molecule.id,
            species: species.model.label,
            band: label,
            label: line.label,
            wavenumber: line.wavenumber,
            relativeIntensity: line.relativeIntensity,
          });
        }
      }
    }
  }
  return out;
}

/**
 * The same lines as atlasLines, taken from entries the build already computed (at the default
 * threshold, so every line at least `minRelative` strong is in them) instead of computing the
 * bands again: a band's relative intensities do not depend on where its list is cut.
 */
export function entryLines(entries: AtlasEntry[], temperatureK: number, minRelative: number): LocatedLine[] {
  if (minRelative < defaultMinRelativeIntensity)
    throw new RangeError(`entryLines: the entries hold lines down to ${defaultMinRelativeIntensity} of their band's strongest, not ${minRelative}`);
  const out: LocatedLine[] = [];
  for (const entry of entries) {
    if (entry.temperatureK !== temperatureK) continue;
    for (const band of entry.bands) {
      for (const line of band.lines.lines) {
        if (line.relativeIntensity >= minRelative)
          out.push({
            molecule: entry.moleculeId,
            species: entry.species,
            band: band.label,
            label: line.label,
            wavenumber: line.wavenumber,
            relativeIntensity: line.relativeIntensity,
          });
      }
    }
  }
  return out;
}

export function findInAtlas(molecules: Molecule[], wavenumber: number, windowCm: number, temperatureK: number, minRelative: number): NearbyLine[] {
  return nearbyLines(atlasLines(molecules, temperatureK, minRelative), wavenumber, windowCm, minRelative);
}
