import { bandLabel, bandLines, nearbyLines, speciesPartitionFunction, type LocatedLine, type NearbyLine } from "../core/index.ts";
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
          out.push({ molecule: molecule.id, species: species.model.label, band: label, label: line.label, wavenumber: line.wavenumber, relativeIntensity: line.relativeIntensity });
        }
      }
    }
  }
  return out;
}

export function findInAtlas(molecules: Molecule[], wavenumber: number, windowCm: number, temperatureK: number, minRelative: number): NearbyLine[] {
  return nearbyLines(atlasLines(molecules, temperatureK, minRelative), wavenumber, windowCm, minRelative);
}
