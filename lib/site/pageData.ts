import type { AtlasBand, AtlasEntry } from "../atlas/index.ts";
import { defaultFindMinRelative, defaultFindWindowCm, defaultTemperatureK, standardTemperaturesK } from "../atlas/index.ts";
import { fixed, significant } from "../format/index.ts";
import { bandLabel } from "../core/index.ts";
import type { Molecule, SpeciesInfo } from "../molecules/index.ts";
import { describeBuild, type BuildIdentity } from "../build/buildIdentity.ts";
import { pageLineCells, signedSignificant, speciesDisplay } from "./formatCells.ts";
import { ghsPictogramNames } from "./ghsPictograms.ts";
import { nearInfraredLimitNm, nearInfraredRows } from "./nearInfraredIndex.ts";
import { downloadPath, lineRowId, moleculePagePath, sheetPath, speciesPagePath, temperatureToken } from "./sitePaths.ts";

/** Plots of one entry, rendered beforehand (lib/plot) and inlined by the template. */
export interface EntryPlots {
  linearSvg: string;
  logSvg: string;
  description: string;
}

export interface HazardView {
  pictograms: Array<{ code: string; name: string }>;
  sentences: string[];
}

function hazardView(molecule: Molecule): HazardView {
  return {
    pictograms: molecule.hazard.ghsPictograms.map((code) => ({ code, name: ghsPictogramNames[code] ?? "pictogram" })),
    sentences: molecule.hazard.sentences,
  };
}

function citationOf(molecule: Molecule, key: string) {
  const source = molecule.sources.find((s) => s.key === key);
  return { key, citation: source?.citation ?? key, url: source?.url ?? null, doi: source?.doi ?? null };
}

function constantsNote(molecule: Molecule, species: SpeciesInfo): string {
  return species.model.constantsOrigin === "cited"
    ? `constants cited for ${species.model.label}`
    : `constants scaled from ${molecule.species[0].model.label} by Dunham's isotope relations`;
}

/** Only http(s) links from a molecule file become hrefs; anything else is shown as text. */
function safeUrl(url: string | null): string | null {
  return url !== null && /^https?:\/\//i.test(url) ? url : null;
}

export function moleculeView(molecule: Molecule) {
  return {
    id: molecule.id,
    name: molecule.name,
    formula: molecule.formula,
    casNumber: molecule.casNumber,
    aliases: molecule.aliases,
    electronicState: molecule.electronicState,
    path: moleculePagePath(molecule.id),
    hazard: hazardView(molecule),
    sources: molecule.sources.map((s) => ({ key: s.key, citation: s.citation, url: safeUrl(s.url), doi: s.doi })),
    species: molecule.species.map((species) => ({
      label: species.model.label,
      isReference: species.isReference,
      abundance: significant(species.model.abundance, 4),
      // A linear species has no reduced mass (it belongs to a diatomic): shown as a dash.
      reducedMassU: Number.isFinite(species.model.reducedMassU) ? fixed(species.model.reducedMassU, 6) : "—",
      constantsNote: constantsNote(molecule, species),
      constantsSource: citationOf(molecule, species.model.constantsSourceKey),
      given: species.given
        ? {
            form: species.given.form,
            source: citationOf(molecule, species.given.sourceKey),
            values: species.given.values.map((v) => ({
              name: v.name,
              value: String(v.valueCm),
              uncertainty: significant(v.uncertaintyCm, 2),
              uncertaintyImplied: v.uncertaintyImplied,
            })),
          }
        : null,
      pages: standardTemperaturesK.map((temperatureK) => ({
        temperatureK,
        token: temperatureToken(temperatureK),
        isDefault: temperatureK === defaultTemperatureK,
        path: speciesPagePath(molecule.id, species.model.label, temperatureK),
      })),
    })),
  };
}

export type MoleculeView = ReturnType<typeof moleculeView>;

const bandTitles: Record<AtlasBand["kind"], string> = { fundamental: "fundamental", hot: "hot band", overtone: "overtone", combination: "combination band" };

function intensityNote(band: AtlasBand): string {
  const origin = band.lines.intensityOrigin;
  if (origin === null) return "No absolute intensities: the molecule file cites no band strength or transition dipole for this band.";
  return `Absolute intensities from ${origin.replace(/-/g, " ")} dipole data, per molecule of the gas at natural isotopic abundance.`;
}

function truncationNote(band: AtlasBand): string {
  const why = { intensity: "weaker lines fall below 10⁻⁴ of the strongest", "constants-turn-over": "the constants stop being valid (the rotational levels turn over)", "j-limit": "the program's J limit is reached" }[band.lines.truncatedBy];
  return `Lines up to J'' = ${band.lines.jLowerMax}; the list stops there because ${why}.`;
}

export function bandView(entry: AtlasEntry, band: AtlasBand) {
  const residualByLabel = new Map<string, number>();
  for (const r of entry.residuals) {
    if (r.predictedMinusMeasured === null) continue;
    if (bandLabel(r.reference.band) !== band.label) continue;
    residualByLabel.set(r.reference.label, r.predictedMinusMeasured);
  }
  return {
    label: band.label,
    kind: band.kind,
    title: `${band.label}${band.name !== band.label ? ` (${band.name})` : ""} ${bandTitles[band.kind]}`,
    anchor: `band-${band.label}`,
    bandOrigin: fixed(band.lines.bandOrigin, 4),
    lineCount: band.lines.lines.length,
    strength: band.kind === "fundamental" || band.strengthRelativeToFundamental === null ? null : significant(band.strengthRelativeToFundamental, 2),
    shownWithFundamental: band.shownWithFundamental,
    intensityNote: intensityNote(band),
    truncationNote: truncationNote(band),
    hasResiduals: residualByLabel.size > 0,
    downloads: {
      csv: downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "csv"),
      json: downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "json"),
    },
    rows: band.lines.lines.map((line) => {
      const residual = residualByLabel.get(line.label);
      return {
        id: lineRowId(band.label, line.label),
        label: line.label,
        branch: line.branch,
        ...pageLineCells(line),
        // The table shows measured − predicted (the atlas stores predicted − measured).
        measuredMinusPredicted: residual === undefined ? null : signedSignificant(-residual, 2),
      };
    }),
  };
}

export function speciesPageView(molecule: Molecule, entry: AtlasEntry, plots: EntryPlots, sheetsAvailable: boolean, allEntries: AtlasEntry[]) {
  const path = speciesPagePath(entry.moleculeId, entry.species, entry.temperatureK);
  const sameSpecies = allEntries.filter((e) => e.moleculeId === entry.moleculeId && e.species === entry.species);
  const bands = entry.bands.map((b) => bandView(entry, b));
  return {
    path,
    moleculeId: molecule.id,
    moleculeName: molecule.name,
    formula: molecule.formula,
    moleculePath: moleculePagePath(molecule.id),
    species: entry.species,
    speciesDisplay: speciesDisplay(entry.species),
    temperatureK: entry.temperatureK,
    token: temperatureToken(entry.temperatureK),
    partitionFunction: significant(entry.partitionFunction, 6),
    hazard: hazardView(molecule),
    plots,
    fundamental: bands.filter((b) => b.kind === "fundamental"),
    hot: bands.filter((b) => b.kind === "hot"),
    overtones: bands.filter((b) => b.kind === "overtone" || b.kind === "combination"),
    temperatures: sameSpecies.map((e) => ({ token: temperatureToken(e.temperatureK), path: speciesPagePath(e.moleculeId, e.species, e.temperatureK), current: e === entry })),
    otherSpecies: molecule.species
      .filter((s) => s.model.label !== entry.species)
      .map((s) => ({ label: s.model.label, path: speciesPagePath(molecule.id, s.model.label, entry.temperatureK) })),
    sheets: sheetsAvailable ? { a4: sheetPath(molecule.id, entry.species, entry.temperatureK, "a4"), letter: sheetPath(molecule.id, entry.species, entry.temperatureK, "letter") } : null,
  };
}

export type SpeciesPageView = ReturnType<typeof speciesPageView>;

/** The method page's accuracy table: the largest |measured − predicted| of every molecule with reference lines. */
export function accuracyRows(molecules: Molecule[], entries: AtlasEntry[]) {
  const rows = [];
  for (const molecule of molecules) {
    // Residuals do not depend on temperature: one entry per species is enough.
    const perSpecies = entries.filter((e) => e.moleculeId === molecule.id && e.temperatureK === defaultTemperatureK);
    const residuals = perSpecies.flatMap((e) => e.residuals.map((r) => ({ species: e.species, r })));
    const compared = residuals.filter((x) => x.r.predictedMinusMeasured !== null);
    if (!residuals.length) continue;
    const worst = compared.reduce<(typeof compared)[number] | null>((w, x) => (w === null || Math.abs(x.r.predictedMinusMeasured!) > Math.abs(w.r.predictedMinusMeasured!) ? x : w), null);
    rows.push({
      moleculeId: molecule.id,
      moleculeName: molecule.name,
      formula: molecule.formula,
      path: moleculePagePath(molecule.id),
      referenceLineCount: residuals.length,
      unmatched: residuals.length - compared.length,
      worst: worst
        ? {
            species: worst.species,
            band: bandLabel(worst.r.reference.band),
            label: worst.r.reference.label,
            measured: String(worst.r.reference.wavenumber),
            measuredMinusPredicted: signedSignificant(-worst.r.predictedMinusMeasured!, 2),
            path: speciesPagePath(molecule.id, worst.species, defaultTemperatureK),
            rowId: lineRowId(bandLabel(worst.r.reference.band), worst.r.reference.label),
            source: citationOf(molecule, worst.r.reference.sourceKey),
          }
        : null,
    });
  }
  return rows;
}

export interface SiteDataInput {
  molecules: Molecule[];
  entries: AtlasEntry[];
  plots: Map<AtlasEntry, EntryPlots>;
  build: BuildIdentity;
  sheetsAvailable: boolean;
  developersMarkdownPath: string;
  nameIndexPath: string;
  lineIndexPaths: Array<{ temperatureK: number; path: string }>;
}

/** Everything the templates read, as one global data object. */
export function siteData(input: SiteDataInput) {
  const byId = new Map(input.molecules.map((m) => [m.id, m]));
  return {
    build: { ...input.build, text: describeBuild(input.build) },
    molecules: input.molecules.map(moleculeView),
    speciesPages: input.entries.map((e) => speciesPageView(byId.get(e.moleculeId)!, e, input.plots.get(e)!, input.sheetsAvailable, input.entries)),
    accuracy: accuracyRows(input.molecules, input.entries),
    nearInfrared: { rows: nearInfraredRows(input.molecules, input.entries), limitNm: nearInfraredLimitNm, temperatureK: defaultTemperatureK },
    temperatures: standardTemperaturesK.map((t) => ({ value: t, token: temperatureToken(t), isDefault: t === defaultTemperatureK })),
    find: { windowCm: defaultFindWindowCm, minRelative: defaultFindMinRelative, temperatureK: defaultTemperatureK },
    search: { nameIndex: input.nameIndexPath, lineIndexes: input.lineIndexPaths.map((x) => ({ token: temperatureToken(x.temperatureK), path: x.path })) },
    developersMarkdownPath: input.developersMarkdownPath,
  };
}

export type SiteData = ReturnType<typeof siteData>;
