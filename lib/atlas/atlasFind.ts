import { nearbyLines, type Line, type NearbyLine } from "../core/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { atlasEntry, type AtlasEntry } from "./atlasEntry.ts";
import { entryLines, gasStrengthFactors } from "./atlasLines.ts";
import { speciesBands } from "./moleculeBands.ts";
import { bandOriginBound } from "./bandOrigin.ts";

/** A line next to an empty search window, with its ± so a near miss can be judged. */
export interface NeighbourLine {
  molecule: string;
  species: string;
  band: string;
  label: string;
  wavenumber: number;
  wavenumberUncertainty: number;
  positionStatus: Line["positionStatus"];
  /** Line minus query, cm⁻¹. */
  offset: number;
}

/** A band whose origin lies inside an empty search window. */
export interface OriginInWindow {
  molecule: string;
  species: string;
  band: string;
  wavenumber: number;
  /** The band's own lines either side of its origin (P(1) and R(0) of a diatomic's band). */
  lineBelow: NeighbourLine | null;
  lineAbove: NeighbourLine | null;
  /**
   * The larger ± of the band's two lines next to its origin (P(1), R(0) of a diatomic): ν̃0 is
   * their mean less the small (B′ − B″) term, so its error is bounded by theirs; null without them.
   */
  wavenumberUncertainty: number | null;
  /** Origin minus query, cm⁻¹. */
  offset: number;
}

/** A region where a common absorber the atlas does not hold has lines. */
export interface InterfererRegion {
  band: string;
  fromCm: number;
  toCm: number;
}

export interface UncoveredInterferer {
  gas: string;
  formula: string;
  regions: InterfererRegion[];
}

/** What an empty search says instead of nothing: neighbours, a band origin, what is not searched. */
export interface EmptyFindHints {
  nearestBelow: NeighbourLine | null;
  nearestAbove: NeighbourLine | null;
  originsInWindow: OriginInWindow[];
  interferersNotInAtlas: UncoveredInterferer[];
}

export interface AtlasFindResult {
  matches: NearbyLine[];
  /** null when something was found. */
  whenNone: EmptyFindHints | null;
}

/**
 * Common absorbers of a laboratory or atmospheric path, where their strong bands lie (fact of the
 * trade, band centres from memory: H₂O ν2 1595, ν1 3657, ν3 3756 cm⁻¹; CH₄ ν4 1306, ν3 3019,
 * 2ν3 near 6005 cm⁻¹; CO₂ ν2 667, ν1+ν3 Fermi dyad 3612/3714 cm⁻¹). The ranges are rounded wide:
 * they say where to suspect the gas, not where its last line ends. A region counts as covered when
 * a molecule of the atlas with this formula builds a band of that name.
 */
const commonInterferers: ReadonlyArray<UncoveredInterferer> = [
  {
    gas: "water vapour",
    formula: "H2O",
    regions: [
      { band: "pure rotation", fromCm: 10, toCm: 1000 },
      { band: "ν2", fromCm: 1300, toCm: 2000 },
      { band: "ν1/ν3", fromCm: 3400, toCm: 4000 },
      { band: "ν2+ν3", fromCm: 5000, toCm: 5600 },
      { band: "ν1+ν3", fromCm: 6800, toCm: 7500 },
    ],
  },
  {
    gas: "methane",
    formula: "CH4",
    regions: [
      { band: "ν4", fromCm: 1200, toCm: 1400 },
      { band: "ν3", fromCm: 2900, toCm: 3150 },
      { band: "2ν3", fromCm: 5900, toCm: 6150 },
    ],
  },
  {
    gas: "carbon dioxide",
    formula: "CO2",
    regions: [
      { band: "ν2", fromCm: 580, toCm: 760 },
      { band: "ν1+ν3", fromCm: 3550, toCm: 3750 },
    ],
  },
];

/** The common interferers' regions that no molecule of the atlas builds. */
export function interferersNotInAtlas(molecules: readonly Molecule[]): UncoveredInterferer[] {
  const bandNamesOf = (formula: string) =>
    new Set(molecules.filter((m) => m.formula === formula).flatMap((m) => m.species.flatMap((s) => speciesBands(s).map((b) => b.name))));
  return commonInterferers
    .map((gas) => {
      const built = bandNamesOf(gas.formula);
      return { ...gas, regions: gas.regions.filter((r) => !built.has(r.band)) };
    })
    .filter((gas) => gas.regions.length > 0);
}

/**
 * `bandatlas find`: the lines near a wavenumber, and when there are none, what lies around the
 * window (each side's nearest line with its ±, a band origin inside it, the common absorbers the
 * atlas does not hold), so that silence is not read as evidence that nothing absorbs there.
 */
export function findNear(molecules: Molecule[], wavenumber: number, windowCm: number, temperatureK: number, minRelative: number): AtlasFindResult {
  const entries = molecules.flatMap((molecule) => molecule.species.map((species) => atlasEntry(molecule, species, temperatureK, minRelative)));
  const matches = nearbyLines(entryLines(entries, temperatureK, minRelative, minRelative), wavenumber, windowCm, minRelative);
  if (matches.length) return { matches, whenNone: null };
  return { matches, whenNone: { ...neighbours(entries, wavenumber, windowCm, minRelative), interferersNotInAtlas: interferersNotInAtlas(molecules) } };
}

/** Nearest lines either side and band origins in the window, judged by the same strength rule as the matches. */
function neighbours(entries: AtlasEntry[], wavenumber: number, windowCm: number, minRelative: number) {
  const factors = gasStrengthFactors(entries);
  let nearestBelow: NeighbourLine | null = null;
  let nearestAbove: NeighbourLine | null = null;
  const originsInWindow: OriginInWindow[] = [];
  for (const entry of entries) {
    entry.bands.forEach((band, b) => {
      const factor = factors.get(entry)![b];
      // Judged as the matches are (core lineStrength): relative to the gas where known, else to the band.
      const strong = (line: Line) => (factor === null ? line.relativeIntensity : line.relativeIntensity * factor) >= minRelative;
      const neighbour = (line: Line): NeighbourLine => ({
        molecule: entry.moleculeId,
        species: entry.species,
        band: band.label,
        label: line.label,
        wavenumber: line.wavenumber,
        wavenumberUncertainty: line.wavenumberUncertainty,
        positionStatus: line.positionStatus,
        offset: line.wavenumber - wavenumber,
      });
      for (const line of band.lines.lines) {
        if (!strong(line)) continue;
        if (line.wavenumber < wavenumber && (nearestBelow === null || line.wavenumber > nearestBelow.wavenumber)) nearestBelow = neighbour(line);
        if (line.wavenumber > wavenumber && (nearestAbove === null || line.wavenumber < nearestAbove.wavenumber)) nearestAbove = neighbour(line);
      }
      const origin = band.lines.bandOrigin;
      // A band too weak to show a line at minRelative is not worth naming by its origin either.
      if (Math.abs(origin - wavenumber) > windowCm || !((factor ?? 1) >= minRelative)) return;
      const below = band.lines.lines.filter((l) => l.wavenumber < origin).at(-1);
      const above = band.lines.lines.find((l) => l.wavenumber > origin);
      const lineBelow = below ? neighbour(below) : null;
      const lineAbove = above ? neighbour(above) : null;
      originsInWindow.push({
        molecule: entry.moleculeId,
        species: entry.species,
        band: band.label,
        wavenumber: origin,
        lineBelow,
        lineAbove,
        wavenumberUncertainty: bandOriginBound(band.lines).uncertainty,
        offset: origin - wavenumber,
      });
    });
  }
  originsInWindow.sort((a, b) => Math.abs(a.offset) - Math.abs(b.offset));
  return { nearestBelow: nearestBelow as NeighbourLine | null, nearestAbove: nearestAbove as NeighbourLine | null, originsInWindow };
}
