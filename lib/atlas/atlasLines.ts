import { defaultMinRelativeIntensity, nearbyLines, type LocatedLine, type NearbyLine } from "../core/index.ts";
import { atlasEntry, type AtlasEntry } from "./atlasEntry.ts";
import type { Molecule } from "../molecules/index.ts";

/** Every line of every molecule, species and atlas band at one temperature, flattened for searching. */
export function atlasLines(molecules: Molecule[], temperatureK: number, minRelative: number): LocatedLine[] {
  const entries = molecules.flatMap((molecule) => molecule.species.map((species) => atlasEntry(molecule, species, temperatureK, minRelative)));
  return entryLines(entries, temperatureK, minRelative, minRelative);
}

/**
 * Each band's strongest line relative to the strongest line of its whole gas (every species and
 * band of the molecule at that temperature): principal-band strength × the band's ratio to it,
 * over the largest such product of the molecule; null where the band's ratio is not sourced.
 */
export function gasStrengthFactors(entries: AtlasEntry[]): Map<AtlasEntry, Array<number | null>> {
  const strongestOf = new Map<string, number>();
  // A species in cells of its own is judged against its own bands only (no natural mixture holds it).
  const tied = (e: AtlasEntry) => !e.ownCells;
  for (const e of entries) {
    if (!tied(e)) continue;
    for (const b of e.bands) {
      if (b.strengthRelativeToFundamental === null) continue;
      const s = e.principalStrength * b.strengthRelativeToFundamental;
      if (s > (strongestOf.get(e.moleculeId) ?? 0)) strongestOf.set(e.moleculeId, s);
    }
  }
  const out = new Map<AtlasEntry, Array<number | null>>();
  for (const e of entries) {
    const strongest = strongestOf.get(e.moleculeId) ?? 0;
    out.set(
      e,
      e.bands.map((b) =>
        b.strengthRelativeToFundamental === null || !(strongest > 0) || !tied(e) ? null : (e.principalStrength * b.strengthRelativeToFundamental) / strongest,
      ),
    );
  }
  return out;
}

/**
 * The lines of entries the build already computed (at the default threshold, so every line at
 * least `minRelative` of its band's strongest is in them), each with its strength relative to the
 * band and to the whole gas: a band's relative intensities do not depend on where its list is cut.
 */
export function entryLines(entries: AtlasEntry[], temperatureK: number, minRelative: number, entriesMinRelative = defaultMinRelativeIntensity): LocatedLine[] {
  if (minRelative < entriesMinRelative)
    throw new RangeError(`entryLines: the entries hold lines down to ${entriesMinRelative} of their band's strongest, not ${minRelative}`);
  const atT = entries.filter((e) => e.temperatureK === temperatureK);
  const factors = gasStrengthFactors(atT);
  const out: LocatedLine[] = [];
  for (const entry of atT) {
    entry.bands.forEach((band, b) => {
      const factor = factors.get(entry)![b];
      for (const line of band.lines.lines) {
        if (line.relativeIntensity >= minRelative)
          out.push({
            molecule: entry.moleculeId,
            species: entry.species,
            band: band.label,
            label: line.label,
            wavenumber: line.wavenumber,
            wavenumberUncertainty: line.wavenumberUncertainty,
            positionStatus: line.positionStatus,
            relativeIntensity: line.relativeIntensity,
            gasRelativeIntensity: factor === null ? null : line.relativeIntensity * factor,
            bandToGas: factor,
          });
      }
    });
  }
  return out;
}

export function findInAtlas(molecules: Molecule[], wavenumber: number, windowCm: number, temperatureK: number, minRelative: number): NearbyLine[] {
  return nearbyLines(atlasLines(molecules, temperatureK, minRelative), wavenumber, windowCm, minRelative);
}
