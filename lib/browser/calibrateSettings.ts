// The calibrate page's form read into what `bandatlas calibrate` gets from its options: the same
// defaults, the same limits and the same unit factors, so a page result can be reproduced on the
// command line. Each bad field gives one sentence; nothing is computed until all are good.
import { lengthUnitsCm, maxCalibrationResolutionCm, maxCellPressurePa, pressureUnitsPa, type MeasuredCalibrationSettings } from "../atlas/index.ts";
import { apodizations, correctionModels, type Apodization, type CellConditions, type CorrectionModel } from "../core/index.ts";
import type { AbscissaUnit, OrdinateKind, SpectrumReadOptions } from "../spectrumFile/index.ts";

export interface CalibrateSettings {
  gas: string;
  read: SpectrumReadOptions;
  calibration: MeasuredCalibrationSettings;
}

const abscissas: readonly AbscissaUnit[] = ["cm-1", "um", "nm"];
const ordinates: readonly OrdinateKind[] = ["absorbance", "transmittance", "percent-transmittance"];

/** A field's number when `ok` accepts it; else a sentence naming the field and the rule. */
function numberField(form: FormData, name: string, what: string, ok: (v: number) => boolean, rule: string, problems: string[]): number {
  const text = String(form.get(name) ?? "").trim();
  const v = text === "" ? NaN : Number(text);
  if (!ok(v)) problems.push(`${what} “${text}”: ${rule}.`);
  return v;
}

function choiceField<T extends string>(form: FormData, name: string, what: string, allowed: readonly T[], problems: string[]): T {
  const text = String(form.get(name) ?? "");
  if (!(allowed as readonly string[]).includes(text)) problems.push(`${what} “${text}”: use one of ${allowed.join(", ")}.`);
  return text as T;
}

export function readCalibrateSettings(form: FormData): { settings: CalibrateSettings; problems: string[] } {
  const problems: string[] = [];
  const temperatureK = numberField(form, "temperatureK", "Temperature", (v) => v > 0 && v <= 10000, "give kelvin above 0 and at most 10 000", problems);
  const pressure = numberField(form, "pressure", "Pressure", (v) => v > 0, "must be above 0", problems);
  const pressureUnit = choiceField(form, "pressureUnit", "Pressure unit", Object.keys(pressureUnitsPa), problems);
  const path = numberField(form, "path", "Path length", (v) => v > 0, "must be above 0", problems);
  const pathUnit = choiceField(form, "pathUnit", "Path unit", Object.keys(lengthUnitsCm), problems);
  const moleFraction = numberField(form, "moleFraction", "Mole fraction", (v) => v > 0 && v <= 1, "must be above 0 and at most 1", problems);
  const resolutionText = String(form.get("resolutionCm") ?? "").trim();
  const resolutionCm =
    resolutionText === ""
      ? undefined
      : numberField(
          form,
          "resolutionCm",
          "Resolution",
          (v) => v > 0 && v <= maxCalibrationResolutionCm,
          `give a resolution above 0 and at most ${maxCalibrationResolutionCm} cm⁻¹, or leave it blank`,
          problems,
        );
  const apodization = choiceField<Apodization>(form, "apodization", "Apodization", apodizations, problems);
  const model = choiceField<CorrectionModel>(form, "model", "Correction model", correctionModels, problems);
  const x = String(form.get("x") ?? "");
  const y = String(form.get("y") ?? "");
  const read: SpectrumReadOptions = {
    ...(x ? { abscissa: choiceField(form, "x", "x unit", abscissas, problems) } : {}),
    ...(y ? { ordinate: choiceField(form, "y", "y values", ordinates, problems) } : {}),
  };
  // In the CLI's order and with its factors (cli/cellOptions.ts), so the JSON's conditions are the same numbers.
  const conditions: CellConditions = {
    temperatureK,
    pressurePa: pressure * pressureUnitsPa[pressureUnit],
    pathCm: path * lengthUnitsCm[pathUnit],
    moleFraction,
  };
  if (conditions.pressurePa > maxCellPressurePa) problems.push("Pressure: above 100 atm the ideal-gas and Voigt models mean nothing; lower the pressure.");
  return {
    settings: {
      gas: String(form.get("gas") ?? ""),
      read,
      calibration: { conditions, apodization, model, ...(resolutionCm !== undefined ? { resolutionCm } : {}) },
    },
    problems,
  };
}
