import type { AtlasEntry } from "../atlas/index.ts";
import { defaultFindMinRelative, defaultFindWindowCm, defaultTemperatureK, standardTemperaturesK } from "../atlas/index.ts";
import { bandOriginBoundNote, residualSignText, validationSummary, constantsOriginText, allGasesCaution, hazardSummaryDeferral, predictionNotice, calibrationByLine, calibrationConditionsText, calibrationCriteriaText, fixed, resolutionsText, significant } from "../format/index.ts";
import { constantSymbol, constantUnit, fieldNameDiffers } from "./constantSymbols.ts";
import { contradictionRuleText } from "../core/index.ts";
import type { Molecule, SpeciesInfo } from "../molecules/index.ts";
import { describeBuild, type BuildIdentity } from "../shared/buildIdentity.ts";
import { accuracyRows, citationOf } from "./accuracyRows.ts";
import { bandView } from "./bandView.ts";
import { speciesDisplay } from "./formatCells.ts";
import { nearInfraredLimitNm, sortedNearInfraredRows, type NearInfraredRow } from "./nearInfraredIndex.ts";
import { benchPagePath, calibratePagePath, moleculePagePath, sheetPath, speciesPagePath, temperatureToken } from "../shared/sitePaths.ts";

import { hazardView } from "./hazardView.ts";
import { benchPageView, calibratePageView, type BenchInput } from "./toolPageViews.ts";

export type { BenchInput };

/** Plots of one entry, rendered beforehand (lib/plot) and inlined by the template. */
export interface EntryPlots {
  linearSvg: string;
  logSvg: string;
  description: string;
}

function constantsNote(molecule: Molecule, species: SpeciesInfo): string {
  return constantsOriginText(species.model, molecule.species[0].model.label);
}

/** Only http(s) links from a molecule file become hrefs; anything else is shown as text. */
function safeUrl(url: string | null): string | null {
  return url !== null && /^https?:\/\//i.test(url) ? url : null;
}

export function moleculeView(molecule: Molecule, hasBench = false) {
  return {
    id: molecule.id,
    benchPath: hasBench ? benchPagePath(molecule.id) : null,
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
      reducedMassU: species.model.structure === "diatomic" ? fixed(species.model.reducedMassU, 6) : "—",
      constantsNote: constantsNote(molecule, species),
      constantsSource: citationOf(molecule, species.model.constantsSourceKey),
      given: species.given
        ? {
            form: species.given.form,
            source: citationOf(molecule, species.given.sourceKey),
            values: species.given.values.map((v) => ({
              name: v.name,
              symbol: constantSymbol(v.name),
              showName: fieldNameDiffers(v.name),
              unit: constantUnit(v.name),
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


/** What the build computed once per molecule for the bench page and the calibration marks. */
function calibrationView(molecule: Molecule, entry: AtlasEntry, bench: BenchInput | undefined) {
  if (!bench) return null;
  const marks = bench.marks;
  const benchPath = benchPagePath(molecule.id);
  if (entry.temperatureK !== marks.conditions.temperatureK) {
    return { applies: false as const, benchPath, markedPagePath: speciesPagePath(molecule.id, entry.species, marks.conditions.temperatureK), temperatureK: marks.conditions.temperatureK };
  }
  const count = marks.byResolution.reduce((n, r) => n + r.lines.filter((l) => l.species === entry.species).length, 0);
  return {
    applies: true as const,
    benchPath,
    resolutions: resolutionsText(marks.byResolution.map((r) => r.resolutionCm)),
    conditions: calibrationConditionsText(marks),
    criteria: calibrationCriteriaText(marks),
    broadeningTypical: marks.broadeningTypical,
    relative: marks.intensityScale !== "absolute",
    notes: marks.notes,
    count,
  };
}

/** The bench page of one molecule: form defaults, choices, and where its cell model is. */
export function speciesPageView(molecule: Molecule, entry: AtlasEntry, plots: EntryPlots, sheetsAvailable: boolean, allEntries: AtlasEntry[], bench?: BenchInput) {
  const path = speciesPagePath(entry.moleculeId, entry.species, entry.temperatureK);
  const sameSpecies = allEntries.filter((e) => e.moleculeId === entry.moleculeId && e.species === entry.species);
  const calibration = calibrationView(molecule, entry, bench);
  const byLine = calibration?.applies ? calibrationByLine(bench!.marks) : undefined;
  const bands = entry.bands.map((b) => bandView(entry, b, byLine));
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
    calibration,
    // The first band is the principal one (a diatomic's fundamental, a linear molecule's first listed band).
    fundamental: bands.slice(0, 1),
    hot: bands.slice(1).filter((b) => b.kind === "hot"),
    overtones: bands.slice(1).filter((b) => b.kind === "overtone" || b.kind === "combination" || b.kind === "fundamental"),
    temperatures: sameSpecies.map((e) => ({ token: temperatureToken(e.temperatureK), path: speciesPagePath(e.moleculeId, e.species, e.temperatureK), current: e === entry })),
    otherSpecies: molecule.species
      .filter((s) => s.model.label !== entry.species)
      .map((s) => ({ label: s.model.label, path: speciesPagePath(molecule.id, s.model.label, entry.temperatureK) })),
    sheets: sheetsAvailable ? { a4: sheetPath(molecule.id, entry.species, entry.temperatureK, "a4"), letter: sheetPath(molecule.id, entry.species, entry.temperatureK, "letter") } : null,
  };
}

export type SpeciesPageView = ReturnType<typeof speciesPageView>;

/** What the whole atlas contributes to the pages: every molecule, and the small cross-molecule tables. */
export interface SiteDataInput {
  molecules: Molecule[];
  build: BuildIdentity;
  sheetsAvailable: boolean;
  developersMarkdownPath: string;
  nameIndexPath: string;
  lineIndexPaths: Array<{ temperatureK: number; path: string }>;
  /** Per molecule id: calibration marks and bench-page defaults, computed once by the build. */
  bench?: Map<string, BenchInput>;
  /** The method page's accuracy table and the near-infrared index, gathered molecule by molecule. */
  accuracy: ReturnType<typeof accuracyRows>;
  nearInfraredRows: NearInfraredRow[];
}

/** One batch of molecules whose own pages (molecule, species, bench) are rendered together. */
export interface MoleculeBatch {
  molecules: Molecule[];
  /** The batch's atlas entries, every species at every temperature. */
  entries: AtlasEntry[];
  plots: Map<AtlasEntry, EntryPlots>;
}

/**
 * Everything the templates read, as one global data object. With a batch, the per-molecule lists
 * (molecule pages, species pages, bench pages) hold that batch only, so a build renders the
 * molecules' own pages batch by batch and never holds the whole atlas; without one, the lists
 * describe every molecule for the pages about the whole atlas (home, cautions, method, indexes).
 */
export function siteData(input: SiteDataInput, batch: MoleculeBatch | null) {
  const molecules = batch ? batch.molecules : input.molecules;
  const entries = batch?.entries ?? [];
  const byId = new Map(molecules.map((m) => [m.id, m]));
  return {
    cautions: { hazardSummaryDeferral, allGasesCaution, predictionNotice },
    build: { ...input.build, text: describeBuild(input.build) },
    molecules: molecules.map((m) => moleculeView(m, input.bench?.has(m.id) ?? false)),
    // Species pages are the bulk of the site: their views are made per batch of pages as
    // runEleventy renders them (it sets `speciesPages`), so even one batch is not held at once.
    speciesPageViews: {
      count: entries.length,
      views: (from: number, to: number) =>
        entries.slice(from, to).map((e) => speciesPageView(byId.get(e.moleculeId)!, e, batch!.plots.get(e)!, input.sheetsAvailable, entries, input.bench?.get(e.moleculeId))),
    },
    calibratePath: calibratePagePath(),
    // The pages about the whole atlas are rendered once, after the batches: their tables are made for that run only.
    calibratePage: batch ? null : calibratePageView(input.molecules, input.bench),
    benchPages: molecules.filter((m) => input.bench?.has(m.id)).map((m) => benchPageView(m, input.bench!.get(m.id)!)),
    accuracy: batch ? [] : input.accuracy,
    // Which gases, bands and J ranges measured lines stand behind, where the home page promises calibration.
    validation: batch ? "" : validationSummary(input.molecules).text,
    accuracyRule: contradictionRuleText.replace(/^contradicted: /, ""),
    residualSign: residualSignText,
    nearInfrared: {
      rows: batch ? [] : sortedNearInfraredRows(input.nearInfraredRows),
      limitNm: nearInfraredLimitNm,
      temperatureK: defaultTemperatureK,
      originNote: `Positions are rounded to their ±; ${bandOriginBoundNote}`,
    },
    temperatures: standardTemperaturesK.map((t) => ({ value: t, token: temperatureToken(t), isDefault: t === defaultTemperatureK })),
    find: { windowCm: defaultFindWindowCm, minRelative: defaultFindMinRelative, temperatureK: defaultTemperatureK },
    search: { nameIndex: input.nameIndexPath, lineIndexes: input.lineIndexPaths.map((x) => ({ token: temperatureToken(x.temperatureK), path: x.path })) },
    developersMarkdownPath: input.developersMarkdownPath,
  };
}

export type SiteData = ReturnType<typeof siteData>;

export { accuracyRows };
export { bandView };
