import type { CellConditions, ScaleTolerance } from "../core/index.ts";

/** The tolerance a run is judged against and where: at stated wavenumbers, or at both ends of the band's lines used. */
export interface ToleranceSetting {
  tolerance: ScaleTolerance;
  /** Check wavenumbers in cm⁻¹, or "band": the lowest and highest line used in the fit. */
  at: number[] | "band";
}

/** Where the date of measurement came from: typed by the user, or the spectrum file's own. */
export type MeasuredOnSource = "option" | "file";

/**
 * What a laboratory records with a calibration beside the numbers: which instrument and cell, who,
 * when, against which tolerance, and which cell conditions were not given but assumed.
 */
export interface CalibrationRecordFields {
  instrument: string | null;
  operator: string | null;
  cellId: string | null;
  /** The date the cell was filled, YYYY-MM-DD. */
  cellFilledOn: string | null;
  /** YYYY-MM-DD. */
  measuredOn: string | null;
  measuredOnFrom: MeasuredOnSource | null;
  tolerance: ToleranceSetting | null;
  /** Cell conditions the user did not give: their defaults were used and are marked "assumed". */
  assumedConditions: Array<keyof CellConditions>;
}

export const noRecordFields: CalibrationRecordFields = {
  instrument: null,
  operator: null,
  cellId: null,
  cellFilledOn: null,
  measuredOn: null,
  measuredOnFrom: null,
  tolerance: null,
  assumedConditions: [],
};

/** The word beside every assumed cell condition, on every output. */
export const assumedWord = "assumed";

const conditionWords: Record<keyof CellConditions, string> = {
  pathCm: "path length",
  temperatureK: "temperature",
  pressurePa: "pressure",
  moleFraction: "mole fraction",
};

/** The sentence every output carries when a cell condition was assumed; null when all were given. */
export function assumedConditionsNote(record: CalibrationRecordFields): string | null {
  const assumed = record.assumedConditions;
  if (assumed.length === 0) return null;
  const names = assumed.map((k) => conditionWords[k]);
  const list = names.length === 1 ? names[0] : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
  return `The cell's ${list} ${assumed.length === 1 ? "was" : "were"} not given and ${assumed.length === 1 ? "is" : "are"} ${assumedWord} (the defaults, marked "${assumedWord}"): the references' pressure shift and widths depend on them; give them with --temperature, --pressure, --path and --mole-fraction.`;
}

/** A tolerance in words: "0.02 cm⁻¹ at 2886, 2960 cm⁻¹" or "5 ppm over the band". */
export function toleranceWords(setting: ToleranceSetting): string {
  const value = setting.tolerance.unit === "cm-1" ? `${setting.tolerance.valueCm} cm⁻¹` : `${setting.tolerance.valuePpm} ppm`;
  return setting.at === "band" ? `±${value} over the band (checked at its lowest and highest line used)` : `±${value} at ${setting.at.join(", ")} cm⁻¹`;
}

/** The record's fields as labelled facts (the text report, the PDF's first page, the page); "not given" where empty. */
export function recordFacts(record: CalibrationRecordFields): Array<{ label: string; value: string }> {
  const given = (v: string | null) => v ?? "not given";
  const cell = record.cellId === null ? "not given" : record.cellId + (record.cellFilledOn ? `, filled ${record.cellFilledOn}` : ", fill date not given");
  const measured =
    record.measuredOn === null ? "not given (and not in the file)" : `${record.measuredOn}${record.measuredOnFrom === "file" ? " (the file's own date)" : ""}`;
  return [
    { label: "instrument", value: given(record.instrument) },
    { label: "operator", value: given(record.operator) },
    { label: "cell", value: cell },
    { label: "measured on", value: measured },
    { label: "tolerance", value: record.tolerance ? toleranceWords(record.tolerance) : "not given: no verdict" },
  ];
}
