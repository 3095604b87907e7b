import type { AtlasBand, AtlasEntry } from "../atlas/index.ts";
import { defaultTemperatureK } from "../atlas/index.ts";
import { bandLabel, checkedBandAccuracy, isStateBand, sameBand } from "../core/index.ts";
import { positionStatusWords, significant } from "../format/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { speciesPagePath } from "../shared/sitePaths.ts";
import { speciesDisplay } from "./formatCells.ts";

/** A source of a molecule file by key, as pages show it. */
export function citationOf(molecule: Molecule, key: string) {
  const source = molecule.sources.find((s) => s.key === key);
  return { key, citation: source?.citation ?? key, url: source?.url ?? null, doi: source?.doi ?? null };
}

/**
 * The method page's accuracy table: every band the atlas builds, of every species, with its status
 * and the residuals against cited measured lines; pure-rotation checks get rows of their own.
 */
export function accuracyRows(molecules: Molecule[], entries: AtlasEntry[]) {
  const rows = [];
  for (const molecule of molecules) {
    // Positions and their checks do not depend on temperature: the default-temperature entry is enough.
    for (const entry of entries.filter((e) => e.moleculeId === molecule.id && e.temperatureK === defaultTemperatureK)) {
      const species = molecule.species.find((s) => s.model.label === entry.species)!;
      const path = speciesPagePath(molecule.id, entry.species, defaultTemperatureK);
      const row = (band: string, accuracy: AtlasBand["lines"]["accuracy"], anchor: string | null, printed: number[]) => {
        const c = accuracy.check;
        return {
          printedUncertainty: printed.length ? `${significant(Math.min(...printed), 2)} – ${significant(Math.max(...printed), 2)}` : "—",
          moleculeName: molecule.name,
          formula: molecule.formula,
          species: entry.species,
          speciesText: speciesDisplay(entry.species),
          band,
          path,
          anchor,
          status: positionStatusWords[accuracy.status],
          lines: c ? `${c.lineCount}${c.heldOutCount ? ` (${c.heldOutCount} held out)` : ""}` : "—",
          range: c ? (c.absMMin === c.absMMax ? String(c.absMMin) : `${c.absMMin}–${c.absMMax}`) : "—",
          largest: c ? significant(c.maxAbsResidualCm, 2) : "—",
          rms: c ? significant(c.rmsResidualCm, 2) : "—",
          sources: c ? c.sourceKeys.map((key) => citationOf(molecule, key)) : [],
        };
      };
      for (const band of entry.bands) rows.push(row(band.label, band.lines.accuracy, `band-${band.label}`, band.lines.lines.map((l) => l.wavenumberUncertainty)));
      // Checks of bands the atlas does not build (pure rotation) get rows of their own; a built
      // band's check is its row above (a linear band has no vUpper/vLower to compare: it was listed twice).
      for (const check of species.model.validation?.checks ?? []) {
        if (entry.bands.some((b) => sameBand(b.lines.band, check.band))) continue;
        const pureRotation = !isStateBand(check.band) && check.band.vUpper === check.band.vLower;
        rows.push(row(`${bandLabel(check.band)}${pureRotation ? " (pure rotation)" : ""}`, checkedBandAccuracy(species.model, check.band), null, []));
      }
    }
  }
  return rows;
}

