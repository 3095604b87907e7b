// The calibrate page's script: a spectrum file the visitor chooses or drops is read, hashed and
// calibrated here in the browser by the same functions as `bandatlas calibrate` (readSpectrumText,
// calibrateMeasuredSpectrum, the lib/format words), against the gas's bench cell model; nothing
// is uploaded. Any change of a control recalculates. A refusal or an unreadable file is shown as
// its one sentence in the alert area, never a stack.
import { calibrateMeasuredSpectrum, type CellModel } from "../atlas/index.ts";
import { CoreInputError } from "../core/index.ts";
import type { CalibrationRun } from "../format/spectrumCalibrationText.ts";
import { noRecordFields } from "../format/calibrationRecord.ts";
import type { CellConditions } from "../core/index.ts";
import { readSpectrumText, SpectrumFileError, type MeasuredSpectrum } from "../spectrumFile/index.ts";
import { loadSpectrumFile, type LoadedFile } from "./calibrateFile.ts";
import { drawResidualPlot } from "./calibrateResidualPlot.ts";
import { showCalibrationRun } from "./calibrateResult.ts";
import { readCalibrateSettings } from "./calibrateSettings.ts";
import { drawCalibrationSpectra } from "./calibrateSpectraPlot.ts";

const root = document.documentElement.dataset.root ?? "";

/** What the page data says of each gas: what a run takes from the Molecule, which the browser does not load. */
interface GasInfo {
  id: string;
  modelPath: string;
  gasName: string;
  caution: string;
  sources: string[];
}

/** A sentence as shown in the alert: capital first letter, a full stop. */
function sentence(text: string): string {
  const t = text.trim();
  return t.charAt(0).toUpperCase() + t.slice(1) + (/[.!?]$/.test(t) ? "" : ".");
}

function setup(page: HTMLElement) {
  const gases = new Map((JSON.parse(page.dataset.gases!) as GasInfo[]).map((g) => [g.id, g]));
  const form = document.getElementById("calibrate-form") as HTMLFormElement;
  const fileInput = document.getElementById("calibrate-file") as HTMLInputElement;
  const drop = document.getElementById("calibrate-drop")!;
  const fileName = document.getElementById("calibrate-file-name")!;
  const status = document.getElementById("calibrate-status")!;
  const alert = document.getElementById("calibrate-alert")!;
  const result = document.getElementById("calibrate-result")!;
  const models = new Map<string, Promise<CellModel>>();
  let file: LoadedFile | null = null;
  /** The last file read with the last x/y choices: recalculating with another cell or model does not read it again. */
  let spectrum: { key: string; spectrum: MeasuredSpectrum } | null = null;
  let runs = 0;
  /** The cell fields the visitor changed; the others keep their defaults and are marked "assumed", as on the command line. */
  const given = new Set<keyof CellConditions>();
  const conditionOfField: Record<string, keyof CellConditions> = {
    temperatureK: "temperatureK",
    pressure: "pressurePa",
    pressureUnit: "pressurePa",
    path: "pathCm",
    pathUnit: "pathCm",
    moleFraction: "moleFraction",
  };
  const allConditions: Array<keyof CellConditions> = ["pathCm", "temperatureK", "pressurePa", "moleFraction"];

  const modelOf = (gas: GasInfo) => {
    let model = models.get(gas.id);
    if (!model) {
      model = fetch(root + gas.modelPath).then((r) => {
        if (!r.ok) throw new Error(`could not load the line data of ${gas.gasName} (${r.status})`);
        return r.json() as Promise<CellModel>;
      });
      // A failed load is tried again next time.
      model.catch(() => models.delete(gas.id));
      models.set(gas.id, model);
    }
    return model;
  };

  const finish = (state: "ready" | "error" | "waiting", message: string, problem = "") => {
    page.dataset.state = state;
    status.textContent = message;
    alert.textContent = problem;
    if (state !== "ready") result.hidden = true;
  };

  const showCaution = (gasId: string) => {
    for (const aside of document.querySelectorAll<HTMLElement>("#calibrate-cautions [data-gas]")) aside.hidden = aside.dataset.gas !== gasId;
  };

  const calibrate = async () => {
    const run = ++runs;
    page.dataset.run = String(run);
    const { settings, problems } = readCalibrateSettings(new FormData(form));
    showCaution(settings.gas);
    if (problems.length) return finish("error", "Not calibrated: a field needs another value.", problems.join(" "));
    const gas = gases.get(settings.gas);
    if (!gas || !file)
      return finish("waiting", gas ? "Choose or drop a spectrum file." : file ? "Choose the gas in the cell." : "Choose the gas and a spectrum file.");
    page.dataset.state = "computing";
    status.textContent = `Calibrating ${file.name} against ${gas.gasName}…`;
    try {
      const cell = await modelOf(gas);
      // Two frames: the status is painted before the (synchronous) calculation starts.
      await new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve)));
      if (run !== runs) return;
      const started = performance.now();
      const key = JSON.stringify([file.sha256, file.name, settings.read]);
      if (spectrum?.key !== key) spectrum = { key, spectrum: readSpectrumText(file.text, file.name, settings.read) };
      const measured = spectrum.spectrum;
      const calibration = calibrateMeasuredSpectrum(
        cell,
        { wavenumberCm: measured.wavenumberCm, absorbance: measured.absorbance, resolutionCm: measured.resolutionCm },
        settings.calibration,
      );
      // As `bandatlas calibrate` builds its run (lib/cli/commands/calibrate.ts).
      const calibrationRun: CalibrationRun = {
        gas: gas.id,
        gasName: gas.gasName,
        fileName: file.name,
        sha256: file.sha256,
        spectrum: measured,
        conditions: settings.calibration.conditions,
        calibration,
        caution: gas.caution,
        sources: gas.sources,
        record: { ...noRecordFields, assumedConditions: allConditions.filter((c) => !given.has(c)) },
      };
      showCalibrationRun(calibrationRun);
      result.hidden = false;
      const x = calibration.measured.wavenumberCm;
      const range = { fromCm: x[0], toCm: x[x.length - 1] };
      drawCalibrationSpectra(
        document.getElementById("calibrate-spectra")!,
        document.getElementById("calibrate-spectra-caption")!,
        calibration,
        gas.gasName,
        (nu) => {
          status.textContent = `ν̃ = ${nu.toFixed(3)} cm⁻¹ on the corrected scale.`;
        },
      );
      drawResidualPlot(document.getElementById("calibrate-residuals")!, document.getElementById("calibrate-residuals-caption")!, calibrationRun, range);
      finish("ready", `Calibrated in ${Math.round(performance.now() - started)} ms in this browser; the file was not uploaded.`);
    } catch (error) {
      if (run !== runs) return;
      const known = error instanceof SpectrumFileError || error instanceof CoreInputError;
      finish("error", "Not calibrated.", known ? sentence((error as Error).message) : sentence(`Could not calibrate: ${(error as Error).message}`));
    }
  };

  const take = async (chosen: File | undefined) => {
    if (!chosen) return;
    const run = ++runs;
    page.dataset.run = String(run);
    page.dataset.state = "computing";
    fileName.textContent = `Reading ${chosen.name}…`;
    try {
      file = await loadSpectrumFile(chosen);
      spectrum = null;
      fileName.textContent = `${file.name}, ${chosen.size} bytes, SHA-256 ${file.sha256}`;
    } catch (error) {
      file = null;
      fileName.textContent = "";
      const known = error instanceof SpectrumFileError;
      return finish("error", "Not calibrated.", sentence(known ? (error as Error).message : `Could not read ${chosen.name}: ${(error as Error).message}`));
    }
    await calibrate();
  };

  fileInput.addEventListener("change", () => void take(fileInput.files?.[0]));
  form.addEventListener("input", (event) => {
    const name = (event.target as HTMLInputElement | null)?.name;
    if (name && name in conditionOfField) given.add(conditionOfField[name]);
  });
  form.addEventListener("change", (event) => {
    if (event.target !== fileInput) void calibrate();
  });
  form.addEventListener("submit", (event) => {
    event.preventDefault();
    void calibrate();
  });
  drop.addEventListener("dragover", (event) => {
    event.preventDefault();
    drop.classList.add("dragging");
  });
  drop.addEventListener("dragleave", () => drop.classList.remove("dragging"));
  drop.addEventListener("drop", (event) => {
    event.preventDefault();
    drop.classList.remove("dragging");
    void take(event.dataTransfer?.files[0]);
  });
  // A browser that kept the form's values on reload (not the file) shows the right caution.
  void calibrate();
}

function start() {
  const page = document.getElementById("calibrate");
  if (page) setup(page);
}

if (document.readyState === "loading") document.addEventListener("DOMContentLoaded", start);
else start();
