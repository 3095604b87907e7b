import {
  bandLabel,
  bandLines,
  harmonicHotBandDipoleSquaredRatio,
  isStateBand,
  lineResiduals,
  scaleTransitionDipoleToIsotopologue,
  speciesPartitionFunction,
  type Band,
  type BandLines,
  type LineResidual,
} from "../core/index.ts";
import type { Molecule, SpeciesInfo } from "../molecules/index.ts";
import { hotBandDisplayFraction, type BandKind } from "./atlasConfig.ts";
import { speciesBands } from "./moleculeBands.ts";

export interface AtlasBand {
  kind: BandKind;
  label: string;
  /** The band's usual name (ν3, 2ν3 …) for a linear molecule; the same as `label` for a diatomic. */
  name: string;
  lines: BandLines;
  /** Strongest line of this band over the strongest of the fundamental (null without intensity data). */
  strengthRelativeToFundamental: number | null;
  /** Whether the band is strong enough to be drawn with the fundamental. */
  shownWithFundamental: boolean;
}

/** One species of one molecule at one temperature: everything a page, a sheet or the CLI shows. */
export interface AtlasEntry {
  moleculeId: string;
  species: string;
  temperatureK: number;
  partitionFunction: number;
  bands: AtlasBand[];
  residuals: LineResidual[];
  /**
   * The strongest line of this species' principal band on a scale shared by every species of the
   * molecule: its absolute intensity (cm/molecule) where dipole data are cited, else the intensity
   * for a 1 D principal-band dipole scaled between isotopologues by the reduced-mass rule (as the
   * cell model does). Natural abundance and the partition function are in both.
   */
  principalStrength: number;
  /** A reference-cell gas of its own: find judges it against its own bands, not the natural gas. */
  ownCells: boolean;
}

/**
 * Computes one entry. Bands are compared with the fundamental through their absolute
 * intensities; without dipole data a hot band is compared by the harmonic rule (the core labels it).
 */
export function atlasEntry(molecule: Molecule, species: SpeciesInfo, temperatureK: number, minRelative?: number): AtlasEntry {
  const q = speciesPartitionFunction(species.model, temperatureK);
  // The first band (a diatomic's fundamental, a linear molecule's first listed band) is the reference.
  const computed = speciesBands(species).map(({ band, kind, name }) => ({
    kind,
    band,
    name,
    lines: bandLines(species.model, band, { temperatureK, partitionFunction: q, minRelative }),
  }));
  const fundamental = computed[0].lines;
  const bands: AtlasBand[] = computed.map(({ kind, band, name, lines }, index) => {
    let ratio: number | null = null;
    if (fundamental.strongestLineIntensity && lines.strongestLineIntensity !== null) ratio = lines.strongestLineIntensity / fundamental.strongestLineIntensity;
    else if (kind === "hot" && !isStateBand(band) && fundamental.strongestLinePerDebyeSquared > 0) {
      // Harmonic rule |μ(v+1←v)|² = (v+1)|μ(1←0)|² (Bernath, ch. 7) when no dipole is cited.
      ratio = (harmonicHotBandDipoleSquaredRatio(band) * lines.strongestLinePerDebyeSquared) / fundamental.strongestLinePerDebyeSquared;
    }
    return {
      kind,
      label: bandLabel(band),
      name,
      lines,
      strengthRelativeToFundamental: index === 0 ? 1 : ratio,
      shownWithFundamental: index === 0 || (kind === "hot" && ratio !== null && ratio >= hotBandDisplayFraction),
    };
  });
  return {
    moleculeId: molecule.id,
    species: species.model.label,
    temperatureK,
    partitionFunction: q,
    bands,
    residuals: lineResiduals(species.model),
    ownCells: species.model.ownCells === true,
    principalStrength: fundamental.strongestLineIntensity ?? fundamental.strongestLinePerDebyeSquared * unitDipoleSquared(molecule, species, computed[0].band),
  };
}

/** |μ|² of a 1 D principal-band dipole carried to this species by the isotope relation (1 for the reference or a linear molecule). */
function unitDipoleSquared(molecule: Molecule, species: SpeciesInfo, band: Band): number {
  const reference = molecule.species[0].model;
  const model = species.model;
  if (model === reference || model.structure !== "diatomic" || reference.structure !== "diatomic" || isStateBand(band)) return 1;
  const unit = { band, transitionDipoleDebye: 1, transitionDipoleUncertaintyDebye: 0, hermanWallis: null, origin: "cited" as const, sourceKey: "unit-dipole" };
  return scaleTransitionDipoleToIsotopologue(unit, reference.reducedMassU, model.reducedMassU).transitionDipoleDebye ** 2;
}

/** Lines of one band on request (any v'←v'', not only the atlas's standard set). */
export function bandOf(species: SpeciesInfo, band: Band, temperatureK: number, minRelative?: number): BandLines {
  return bandLines(species.model, band, { temperatureK, minRelative });
}
