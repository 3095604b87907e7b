// The data of the two tool pages: the cell-and-instrument (bench) page and the calibrate page.
import type { CalibrationMarks } from "../atlas/index.ts";
import { calibrationResolutionsCm, defaultCellConditions, gasNameInSentence, defaultTemperatureK, lengthUnitsCm, pressureUnitsPa } from "../atlas/index.ts";
import { correctionModelWords, moleculeCaution, calibrationCriteriaText } from "../format/index.ts";
import { lineShapeNames, type BenchSettings } from "../format/benchSettings.ts";
import { apodizations, correctionModels, standardAtmospherePa } from "../core/index.ts";
import { maxSpectrumFileBytes } from "../spectrumFile/index.ts";
import type { Molecule } from "../molecules/index.ts";
import { benchModelPath, benchPagePath, calibratePagePath, moleculePagePath, speciesPagePath } from "../shared/sitePaths.ts";

import { hazardView } from "./hazardView.ts";

export interface BenchInput {
  marks: CalibrationMarks;
  defaultRangeCm: { fromCm: number; toCm: number };
}

/** The legend of the calibration column: on pages at the marks' temperature, a pointer elsewhere. */
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

/**
 * The calibrate page: every gas with a bench cell model (the browser calibrates against it), with
 * what a calibration run takes from the Molecule, which the browser does not have (its name in a
 * sentence, its caution, its sources: as `bandatlas calibrate` fills them), and the form's choices.
 * The cell fields start where the bench pages' do (the atlas's default cell, in the same units).
 */
export function calibratePageView(molecules: Molecule[], bench: Map<string, BenchInput> | undefined) {
  const views = molecules.filter((m) => bench?.has(m.id)).map((m) => ({ molecule: m, view: benchPageView(m, bench!.get(m.id)!) }));
  const gases = views.map(({ molecule, view }) => ({
    id: view.moleculeId,
    name: view.moleculeName,
    formula: view.formula,
    modelPath: view.modelPath,
    gasName: gasNameInSentence(molecule.name),
    caution: moleculeCaution(molecule),
    sources: molecule.sources.map((s) => s.citation),
  }));
  const first = views[0]?.view;
  return {
    path: calibratePagePath(),
    gases,
    gasesJson: JSON.stringify(gases.map(({ id, modelPath, gasName, caution, sources }) => ({ id, modelPath, gasName, caution, sources }))),
    cell: first ? { defaults: first.defaults, pressureUnits: first.pressureUnits, lengthUnits: first.lengthUnits } : null,
    // The CLI's default apodization and model.
    apodizations: apodizations.map((a) => ({ value: a, name: lineShapeNames[a], isDefault: a === "triangular" })),
    models: correctionModels.map((m) => ({ value: m, name: correctionModelWords[m], isDefault: m === "scale" })),
    maxFileMb: maxSpectrumFileBytes / (1024 * 1024),
  };
}

