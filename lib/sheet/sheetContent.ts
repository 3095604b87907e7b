import { bandOriginBound, type AtlasBand, type AtlasEntry, type CalibrationMarks } from "../atlas/index.ts";
import { sameBand, type Band, type BandLines, type Branch, type SpeciesModel } from "../core/index.ts";
import {
  accuracyText,
  bandOriginText,
  constantsOriginText,
  sheetCautionDeferral,
  calibrationConditionsText,
  intensityOriginWords,
  criteriaPhrase,
  fixed,
  peakShiftDigits,
  significant,
} from "../format/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { SheetInputError, type SheetBuildIdentity } from "./sheetInput.ts";
import { describeBuild } from "../shared/buildIdentity.ts";
import { displayText, safeLink } from "./displayText.ts";

import { tableRows, type SheetTableRow } from "./sheetTableRows.ts";

export { sheetStatusLegend, sheetStatusLetters, strongLineFraction, tableRows, type SheetLineCell, type SheetTableRow } from "./sheetTableRows.ts";

export interface SheetStick {
  wavenumber: number;
  relativeIntensity: number;
  branch: Branch;
}

export interface SheetSource {
  key: string;
  roles: string[];
  citation: string;
  link: string | null;
  /** The address as printed (links only for http(s); other addresses are printed as text). */
  address: string | null;
}

/** Everything drawn on a sheet, already formatted: the drawing code adds no digits of its own. */
export interface SheetContent {
  title: string;
  formula: string;
  species: string;
  bandText: string;
  temperatureText: string;
  bandOriginText: string;
  summaryText: string;
  buildText: string;
  caution: { pictograms: string[]; sentences: string[]; deferral: string };
  sticks: SheetStick[];
  bandOrigin: number;
  rows: SheetTableRow[];
  otherBandsNote: string | null;
  calibrationNote: string | null;
  /** The molecule file's known limitations of its constants, or null. */
  limitationsNote: string | null;
  sources: SheetSource[];
  modelText: string;
  accuracyText: string;
  documentTitle: string;
}

export interface SheetContentInput {
  molecule: Molecule;
  entry: AtlasEntry;
  build: SheetBuildIdentity;
  /**
   * Labels ("R(3)", "P(5)") of the fundamental's lines flagged calibration-grade. Left out until
   * the molecule files carry those flags; when given, the sheet names them under the table.
   */
  calibrationLineLabels?: readonly string[];
  /** Calibration-grade lines at the default resolutions (lib/atlas calibrationMarks); named under the plot. */
  calibration?: CalibrationMarks;
}

/** The marks of this species' band, per resolution, with the range of expected peak shifts. */
function calibrationMarksNote(marks: CalibrationMarks, entry: AtlasEntry, band: AtlasBand): string {
  if (entry.temperatureK !== marks.conditions.temperatureK) {
    return `Calibration-grade lines are named on the ${marks.conditions.temperatureK} K sheet of this species (default cell); for another cell see the atlas's cell and instrument page or bandatlas calibration-lines.`;
  }
  const parts = marks.byResolution.map((r) => {
    const lines = r.lines.filter((l) => l.species === entry.species && l.band === band.label);
    if (!lines.length) return `at ${r.resolutionCm} cm⁻¹: none`;
    const shifts = lines.map((l) => l.peakShiftCm).filter((v): v is number => v !== null);
    const range = shifts.length ? ` (peak shifts ${peakShiftDigits(Math.min(...shifts))} to ${peakShiftDigits(Math.max(...shifts))} cm⁻¹)` : "";
    return `at ${r.resolutionCm} cm⁻¹${range}: ${lines.map((l) => displayText(l.label)).join(", ")}`;
  });
  const k = marks.criteria;
  const flags = [
    marks.broadeningTypical ? " Line widths use a typical (not measured) pressure-broadening coefficient." : "",
    marks.intensityScale !== "absolute" ? " No cited band intensity: an optically thin cell is assumed." : "",
    marks.pressureShift.uncertaintyCm > 0
      ? ` In this cell the pressure shift cited in ${marks.pressureShift.sourceKeys.map((k) => `[${k}]`).join(", ")} moves every centre by ${significant(marks.pressureShift.shiftCm, 2)} ± ${significant(marks.pressureShift.uncertaintyCm, 2)} cm⁻¹; the table gives zero-pressure positions.`
      : "",
  ].join("");
  return (
    `Recommended for calibration (${criteriaPhrase(k)}) for ${calibrationConditionsText(marks)}; ` +
    `${parts.join("; ")}.${flags} Each line's shift: bandatlas calibration-lines.`
  );
}

export const cautionDeferral = sheetCautionDeferral;

/**
 * One letter per line in the narrow sheet table (two branches side by side leave no room for the
 * words); the legend under the table spells them out (sheetStatusLegend).
 */
// s: a standard's listed line (c is taken by contradicted).
function sourcesOf(molecule: Molecule, entry: AtlasEntry, speciesIndex: number, band: Band): SheetSource[] {
  const model = molecule.species[speciesIndex].model;
  const roles = new Map<string, string[]>();
  const add = (key: string, role: string) => {
    const list = roles.get(key) ?? [];
    if (!list.includes(role)) list.push(role);
    roles.set(key, list);
  };
  add(model.constantsSourceKey, model.constantsOrigin === "cited" ? "constants" : `constants of ${molecule.species[0].model.label}`);
  if (model.crossCheckSourceKey) add(model.crossCheckSourceKey, "cross-check of the constants");
  for (const i of model.intensities) if (sameBand(i.band, band)) add(i.sourceKey, "intensities");
  for (const r of entry.residuals) add(r.reference.sourceKey, "measured lines");
  for (const c of [molecule.broadening?.self, molecule.broadening?.air]) if (c?.origin === "cited") add(c.sourceKey, "pressure broadening");
  for (const c of [molecule.pressureShift?.self, molecule.pressureShift?.air]) if (c) add(c.sourceKey, "pressure shift");
  return [...roles.entries()].map(([key, list]) => {
    const source = molecule.sources.find((s) => s.key === key);
    const link = safeLink(source?.url);
    const address = source?.doi ? `doi:${displayText(source.doi)}` : source?.url ? displayText(source.url) : null;
    return {
      key: displayText(key),
      roles: list,
      citation: source ? displayText(source.citation) : `(source "${displayText(key)}" is not listed in the molecule file)`,
      link: source?.doi ? (safeLink(`https://doi.org/${source.doi.trim()}`) ?? link) : link,
      address,
    };
  });
}

function accuracyOf(result: BandLines): string {
  const sigmas = result.lines.map((l) => l.wavenumberUncertainty);
  const range = sigmas.length
    ? ` Position ± in this table: ${significant(Math.min(...sigmas), 2)} to ${significant(Math.max(...sigmas), 2)} cm⁻¹ (constants' uncertainties, the terms they leave out, never below the measured residuals).`
    : "";
  return `Accuracy: ${displayText(accuracyText(result.accuracy))}.${range}`;
}

function otherBandsNoteOf(entry: AtlasEntry): string | null {
  const shown = entry.bands.filter((b: AtlasBand, i) => i > 0 && b.shownWithFundamental);
  if (!shown.length) return null;
  const parts = shown.map(
    (b) =>
      `${b.label}${b.strengthRelativeToFundamental !== null ? ` (strongest line ${significant(b.strengthRelativeToFundamental, 2)} of the fundamental's)` : ""}`,
  );
  return `At ${entry.temperatureK} K the hot band${shown.length === 1 ? "" : "s"} ${parts.join(", ")} also show${shown.length === 1 ? "s" : ""} in a spectrum; only the fundamental is drawn and listed here.`;
}

/** The model in words, as the core computes it for this kind of species. */
function termModel(model: SpeciesModel): string {
  if (model.structure !== "linear") return "Dunham expansion of the term values E(v, J) in (v + ½) and J(J + 1); ¹Σ⁺–¹Σ⁺ selection rule ΔJ\u00a0=\u00a0±1";
  const linear = model.linear;
  const spin = linear.nuclearSpinWeights
    ? `; nuclear-spin weights even J : odd J = ${linear.nuclearSpinWeights.evenJ} : ${linear.nuclearSpinWeights.oddJ} in Σg⁺ states (swapped in Σu⁺)`
    : "";
  return `Each vibrational state's levels G + B·J(J + 1) − D·[J(J + 1)]² + H·[J(J + 1)]³ from the file's state constants; parallel (Σ–Σ) band, ΔJ\u00a0=\u00a0±1${spin}`;
}

export function sheetContent(input: SheetContentInput): SheetContent {
  const { molecule, entry, build } = input;
  const speciesIndex = molecule.species.findIndex((s) => s.model.label === entry.species);
  if (speciesIndex < 0) throw new SheetInputError(`${displayText(molecule.name)} has no species "${entry.species}"`);
  // The principal band: a diatomic's fundamental, a linear molecule's first listed band.
  const fundamental = entry.bands[0];
  if (!fundamental || fundamental.lines.lines.length === 0)
    throw new SheetInputError(`${displayText(molecule.name)} ${entry.species}: the atlas entry has no lines in its principal band`);
  const bandLines = fundamental.lines;
  const model = molecule.species[speciesIndex].model;
  const constants = constantsOriginText(model, molecule.species[0].model.label);
  const intensity =
    bandLines.intensityOrigin === null
      ? "relative intensities only (no cited band strength or dipole)"
      : `absolute intensities ${intensityOriginWords[bandLines.intensityOrigin]}`;
  const title = displayText(molecule.name);
  const temperatureText = `T = ${entry.temperatureK} K (${fixed(entry.temperatureK - 273.15, 2).replace(/\.?0+$/, "")} °C)`;
  const calibration = input.calibration
    ? calibrationMarksNote(input.calibration, entry, fundamental)
    : input.calibrationLineLabels?.length
      ? `Recommended for calibration (calibration-grade flags of the molecule file): ${input.calibrationLineLabels.map(displayText).join(", ")}.`
      : null;
  return {
    title,
    formula: displayText(molecule.formula),
    species: entry.species,
    bandText:
      fundamental.name && fundamental.name !== fundamental.label
        ? `band ${displayText(fundamental.name)} (${displayText(fundamental.label)})`
        : `band ${fundamental.label} (fundamental)`,
    temperatureText,
    bandOriginText: bandOriginText(bandOriginBound(bandLines)),
    summaryText: `${bandLines.lines.length} lines down to ${significant(Math.min(...bandLines.lines.map((l) => l.relativeIntensity)), 1)} of the strongest; partition function Q = ${significant(entry.partitionFunction, 5)}`,
    buildText: describeBuild(build),
    caution: { pictograms: molecule.hazard.ghsPictograms.map(displayText), sentences: molecule.hazard.sentences.map(displayText), deferral: cautionDeferral },
    sticks: bandLines.lines.map((l) => ({ wavenumber: l.wavenumber, relativeIntensity: l.relativeIntensity, branch: l.branch })),
    bandOrigin: bandLines.bandOrigin,
    rows: tableRows(bandLines.lines),
    otherBandsNote: otherBandsNoteOf(entry),
    calibrationNote: calibration,
    limitationsNote: molecule.limitations.length ? `Known limitation of these constants: ${molecule.limitations.map(displayText).join(" ")}` : null,
    sources: sourcesOf(molecule, entry, speciesIndex, bandLines.band),
    modelText: `${termModel(model)}; Boltzmann populations with (2J + 1) degeneracy and Q summed over the computed levels; Hönl–London factors; ${constants}; ${intensity}.`,
    accuracyText: accuracyOf(bandLines),
    documentTitle: `${title} ${entry.species} ${fundamental.label} band at ${entry.temperatureK} K — bench sheet`,
  };
}
