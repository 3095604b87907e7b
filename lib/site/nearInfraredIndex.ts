import { bandOriginBound, defaultTemperatureK, type AtlasEntry } from "../atlas/index.ts";
import { fixed, positionStatusWords, positionWithUncertainty, wavelengthSigmaUm } from "../format/index.ts";
import type { Line } from "../core/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { speciesPagePath } from "../shared/sitePaths.ts";

/** The short-wavelength end of the near infrared as the telecom and NIR trade reads it, 2.5 µm (common practice, no source). */
export const nearInfraredLimitNm = 2500;

/**
 * One row per band of every species at the default temperature: its vacuum wavelength range in
 * nm over the lines the atlas lists, the band origin, and a link to the species page. Sorted by
 * the band origin's wavelength, shortest first, because near-infrared laboratories read bands by
 * wavelength. Diatomic overtones and linear-molecule bands appear alike: the rows come from the
 * atlas entries, whatever kind of molecule made them.
 */
/**
 * A wavelength in nm rounded to its ±, but never finer than 0.001 nm (1 pm), as the line tables
 * print wavelengths: a finer ± is shown as "< 0.001".
 */
function nmWithUncertainty(nm: number, sigmaNm: number): { value: string; sigma: string } {
  const w = positionWithUncertainty(nm, sigmaNm);
  return w.decimals > 3 ? { value: nm.toFixed(3), sigma: "< 0.001" } : w;
}
const lineNm = (l: Line) => nmWithUncertainty(l.wavelengthVacuumUm * 1000, wavelengthSigmaUm(l.wavenumber, l.wavenumberUncertainty) * 1000).value;

/** The rows of some molecules' entries, unsorted (a build adds them batch by batch). */
export function nearInfraredRowsOf(molecules: Molecule[], entries: AtlasEntry[]) {
  const byId = new Map(molecules.map((m) => [m.id, m]));
  const rows = [];
  for (const entry of entries) {
    if (entry.temperatureK !== defaultTemperatureK) continue;
    const molecule = byId.get(entry.moleculeId)!;
    for (const band of entry.bands) {
      const lines = band.lines.lines;
      if (!lines.length) continue;
      // Lines are sorted by wavenumber: the last has the shortest wavelength.
      const shortestNm = 1e7 / lines.at(-1)!.wavenumber;
      const longestNm = 1e7 / lines[0].wavenumber;
      const originNm = 1e7 / band.lines.bandOrigin;
      // The origin with its ± (bandOriginBound) and the same ± in nm, each rounded to it.
      const bound = bandOriginBound(band.lines);
      const sigmaCm = bound.uncertainty;
      const cm = sigmaCm === null ? null : positionWithUncertainty(band.lines.bandOrigin, sigmaCm);
      const nm = sigmaCm === null ? null : nmWithUncertainty(originNm, wavelengthSigmaUm(band.lines.bandOrigin, sigmaCm) * 1000);
      rows.push({
        originNmValue: originNm,
        nearInfrared: shortestNm < nearInfraredLimitNm,
        moleculeName: molecule.name,
        formula: molecule.formula,
        species: entry.species,
        band: band.label,
        bandName: band.name,
        kind: band.kind,
        originNm: nm ? `${nm.value} ± ${nm.sigma}` : fixed(originNm, 0),
        originCm: cm ? `${cm.value} ± ${cm.sigma}` : fixed(band.lines.bandOrigin, 1),
        originStatus: bound.status === null ? "—" : positionStatusWords[bound.status],
        shortestNm: lineNm(lines.at(-1)!),
        longestNm: lineNm(lines[0]),
        lineCount: lines.length,
        path: speciesPagePath(entry.moleculeId, entry.species, entry.temperatureK),
        anchor: `band-${band.label}`,
      });
    }
  }
  return rows;
}

export type NearInfraredRow = ReturnType<typeof nearInfraredRowsOf>[number];

/** Shortest wavelength first (a stable sort: ties keep the molecules' order). */
export function sortedNearInfraredRows(rows: NearInfraredRow[]) {
  return [...rows].sort((a, b) => a.originNmValue - b.originNmValue || a.species.localeCompare(b.species)).map(({ originNmValue: _omit, ...row }) => row);
}

export function nearInfraredRows(molecules: Molecule[], entries: AtlasEntry[]) {
  return sortedNearInfraredRows(nearInfraredRowsOf(molecules, entries));
}
