import type { AtlasBand, AtlasEntry, CalibrationMarks } from "../atlas/index.ts";
import { calibrationResolutionsCm, defaultCellConditions, defaultFindMinRelative, defaultFindWindowCm, defaultTemperatureK, lengthUnitsCm, pressureUnitsPa, standardTemperaturesK } from "../atlas/index.ts";
import { accuracyText, intensityOriginWords, calibrationByLine, calibrationCellText, positionStatusWords, calibrationConditionsText, calibrationCriteriaText, calibrationLineKey, fixed, resolutionsText, significant, type LineCalibration } from "../format/index.ts";
import { lineShapeNames, type BenchSettings } from "../format/benchSettings.ts";
import { bandLabel, standardAtmospherePa } from "../core/index.ts";
import type { Molecule, SpeciesInfo } from "../molecules/index.ts";
import { describeBuild, type BuildIdentity } from "../shared/buildIdentity.ts";
import { pageLineCells, signedSignificant, speciesDisplay } from "./formatCells.ts";
import { ghsPictogramName } from "../shared/ghsPictograms.ts";
import { nearInfraredLimitNm, nearInfraredRows } from "./nearInfraredIndex.ts";
import { benchModelPath, benchPagePath, downloadPath, lineRowId, moleculePagePath, sheetPath, speciesPagePath, temperatureToken } from "../shared/sitePaths.ts";

/** Plots of one entry, rendered beforehand (lib/plot) and inlined by the template. */
export interface EntryPlots {
  linearSvg: string;
  logSvg: string;
  description: string;
}

export interface HazardView {
  pictograms: Array<{ code: string; name: string }>;
  sentences: string[];
  /** Known limitations of the constants, shown with the caution on every page of the molecule. */
  limitations: string[];
}

function hazardView(molecule: Molecule): HazardView {
  return {
    pictograms: molecule.hazard.ghsPictograms.map((code) => ({ code, name: ghsPictogramName(code) })),
    sentences: molecule.hazard.sentences,
    limitations: molecule.limitations,
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


const bandTitles: Record<AtlasBand["kind"], string> = { fundamental: "fundamental", hot: "hot band", overtone: "overtone", combination: "combination band" };

function intensityNote(band: AtlasBand): string {
  const origin = band.lines.intensityOrigin;
  if (origin === null) return "No absolute intensities: the molecule file cites no band strength or transition dipole for this band.";
  return `Absolute intensities ${intensityOriginWords[origin]}, per molecule of the gas at natural isotopic abundance.`;
}

function truncationNote(band: AtlasBand): string {
  const why = { intensity: "weaker lines fall below 10⁻⁴ of the strongest", "constants-turn-over": "the constants stop being valid (the rotational levels turn over)", "j-limit": "the program's J limit is reached" }[band.lines.truncatedBy];
  return `Lines up to J'' = ${band.lines.jLowerMax}; the list stops there because ${why}.`;
}

export function bandView(entry: AtlasEntry, band: AtlasBand, calibration?: Map<string, LineCalibration[]>) {
  const residualByLabel = new Map<string, number>();
  for (const r of entry.residuals) {
    if (r.predictedMinusMeasured === null) continue;
    if (bandLabel(r.reference.band) !== band.label) continue;
    residualByLabel.set(r.reference.label, r.predictedMinusMeasured);
  }
  const calibrationOf = (label: string) => {
    const list = calibration?.get(calibrationLineKey(entry.species, band.label, label));
    return list ? calibrationCellText(list) : null;
  };
  const rows = band.lines.lines.map((line) => {
    const residual = residualByLabel.get(line.label);
    return {
      id: lineRowId(band.label, line.label),
      label: line.label,
      branch: line.branch,
      ...pageLineCells(line),
      position: positionStatusWords[line.positionStatus],
      // The table shows measured − predicted (the atlas stores predicted − measured).
      measuredMinusPredicted: residual === undefined ? null : signedSignificant(-residual, 2),
      calibration: calibrationOf(line.label),
    };
  });
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
    accuracy: accuracyText(band.lines.accuracy),
    accuracyStatus: band.lines.accuracy.status,
    truncationNote: truncationNote(band),
    hasResiduals: residualByLabel.size > 0,
    downloads: {
      csv: downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "csv"),
      json: downloadPath(entry.moleculeId, entry.species, entry.temperatureK, band.label, "json"),
    },
    hasCalibration: rows.some((r) => r.calibration !== null),
    rows,
  };
}

/** What the build computed once per molecule for the bench page and the calibration marks. */
export interface BenchInput {
  marks: CalibrationMarks;
  defaultRangeCm: { fromCm: number; toCm: number };
}

/** The legend of the calibration column: on pages at the marks' temperature, a pointer elsewhere. */
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
export function benchPageView(molecule: Molecule, bench: BenchInput) {
  const c = defaultCellConditions;
  const defaults: BenchSettings = {
    temperatureK: c.temperatureK,
    pressure: Number(((c.pressurePa * 760) / standardAtmospherePa).toPrecision(6)),
    pressureUnit: "Torr",
    path: c.pathCm,
    pathUnit: "cm",
    moleFraction: c.moleFraction,
    resolutionCm: 0.5,
    lineShape: "triangular",
    fromCm: bench.defaultRangeCm.fromCm,
    toCm: bench.defaultRangeCm.toCm,
    at: null,
  };
  return {
    moleculeId: molecule.id,
    moleculeName: molecule.name,
    formula: molecule.formula,
    path: benchPagePath(molecule.id),
    moleculePath: moleculePagePath(molecule.id),
    modelPath: benchModelPath(molecule.id),
    speciesPath: speciesPagePath(molecule.id, molecule.species[0].model.label, defaultTemperatureK),
    hazard: hazardView(molecule),
    absolute: bench.marks.intensityScale === "absolute",
    defaults,
    defaultsJson: JSON.stringify(defaults),
    pressureUnits: Object.keys(pressureUnitsPa),
    lengthUnits: Object.keys(lengthUnitsCm),
    lineShapes: Object.entries(lineShapeNames).map(([value, name]) => ({ value, name })),
    resolutions: [...calibrationResolutionsCm, 8],
    criteria: calibrationCriteriaText(bench.marks),
  };
}

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
          status: positionStatusWords[accuracy.status === "validated" ? "validated" : accuracy.status],
          lines: c ? `${c.lineCount}${c.heldOutCount ? ` (${c.heldOutCount} held out)` : ""}` : "—",
          range: c ? (c.absMMin === c.absMMax ? String(c.absMMin) : `${c.absMMin}–${c.absMMax}`) : "—",
          largest: c ? significant(c.maxAbsResidualCm, 2) : "—",
          rms: c ? significant(c.rmsResidualCm, 2) : "—",
          sources: c ? c.sourceKeys.map((key) => citationOf(molecule, key)) : [],
        };
      };
      for (const band of entry.bands) rows.push(row(band.label, band.lines.accuracy, `band-${band.label}`, band.lines.lines.map((l) => l.wavenumberUncertainty)));
      for (const check of species.model.validation?.checks ?? []) {
        if (check.band.vUpper !== check.band.vLower) continue;
        rows.push(row(`${bandLabel(check.band)} (pure rotation)`, { status: "validated", check, floor: check.envelope }, null, []));
      }
    }
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
  /** Per molecule id: calibration marks and bench-page defaults, computed once by the build. */
  bench?: Map<string, BenchInput>;
}

/** Everything the templates read, as one global data object. */
export function siteData(input: SiteDataInput) {
  const byId = new Map(input.molecules.map((m) => [m.id, m]));
  return {
    build: { ...input.build, text: describeBuild(input.build) },
    molecules: input.molecules.map((m) => moleculeView(m, input.bench?.has(m.id) ?? false)),
    // Species pages are the bulk of the site: their views are made per batch of pages as
    // runEleventy renders them (it sets `speciesPages`), so a large atlas never holds all at once.
    speciesPageViews: {
      count: input.entries.length,
      views: (from: number, to: number) =>
        input.entries.slice(from, to).map((e) => speciesPageView(byId.get(e.moleculeId)!, e, input.plots.get(e)!, input.sheetsAvailable, input.entries, input.bench?.get(e.moleculeId))),
    },
    benchPages: input.molecules.filter((m) => input.bench?.has(m.id)).map((m) => benchPageView(m, input.bench!.get(m.id)!)),
    accuracy: accuracyRows(input.molecules, input.entries),
    nearInfrared: { rows: nearInfraredRows(input.molecules, input.entries), limitNm: nearInfraredLimitNm, temperatureK: defaultTemperatureK },
    temperatures: standardTemperaturesK.map((t) => ({ value: t, token: temperatureToken(t), isDefault: t === defaultTemperatureK })),
    find: { windowCm: defaultFindWindowCm, minRelative: defaultFindMinRelative, temperatureK: defaultTemperatureK },
    search: { nameIndex: input.nameIndexPath, lineIndexes: input.lineIndexPaths.map((x) => ({ token: temperatureToken(x.temperatureK), path: x.path })) },
    developersMarkdownPath: input.developersMarkdownPath,
  };
}

export type SiteData = ReturnType<typeof siteData>;
