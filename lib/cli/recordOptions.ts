import { calendarDate } from "../spectrumFile/index.ts";
import type { CellConditions, ScaleTolerance } from "../core/index.ts";
import type { CalibrationRecordFields, ToleranceSetting } from "../format/index.ts";
import type { OptionSpec } from "./options.ts";
import { UsageError } from "./usageError.ts";

/** What a calibration record says beside the numbers (`calibrate`). */
export const recordOptionSpec: OptionSpec = {
  instrument: { type: "string" },
  operator: { type: "string" },
  cell: { type: "string" },
  "measured-on": { type: "string" },
  tolerance: { type: "string" },
  log: { type: "string" },
};

export const recordOptionsHelp = `  --instrument <name>     the instrument checked (its own name or asset number)
  --operator <name>       who recorded the spectrum
  --cell <id>[:<date>]    the gas cell's identifier and the date it was filled, e.g. HC-3:2025-01-14
  --measured-on <date>    date of measurement, YYYY-MM-DD (default: the JCAMP-DX file's own date)
  --tolerance <t>         the instrument's tolerance: "0.01 cm-1" or "5 ppm", over the band (checked
                          at its lowest and highest line used) or "at" stated wavenumbers, e.g.
                          "0.01 cm-1 at 2886,2960"; gives a verdict: pass, fail or undecided
  --log <file.jsonl>      append this run to a calibration log (JSON lines; bandatlas history reads it)`;

const text = (values: Record<string, string | boolean | undefined>, name: string): string | null => {
  const v = values[name] as string | undefined;
  if (v === undefined) return null;
  const t = v.trim();
  if (t === "") throw new UsageError(`--${name} is empty; give a name or leave the option out`);
  if (/[\u0000-\u001f]/.test(t)) throw new UsageError(`--${name}: control characters are not allowed`);
  return t;
};

/** A YYYY-MM-DD calendar date, or a message naming the option. */
export function dateOption(name: string, written: string): string {
  const m = /^\s*(\d{4})-(\d{2})-(\d{2})\s*$/.exec(written);
  const date = m ? calendarDate(Number(m[1]), Number(m[2]), Number(m[3])) : null;
  if (date === null) throw new UsageError(`--${name} ${written}: give a calendar date as YYYY-MM-DD, e.g. 2025-03-14`);
  return date;
}

/** "0.01 cm-1", "5 ppm", "0.01 cm-1 at 2886,2960" (also "over the band"). */
export function toleranceOption(written: string): ToleranceSetting {
  const m = /^\s*([+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(cm-1|cm⁻¹|\/cm|ppm)\s*(?:(over the band|band)|at\s+([\d.,\s]+))?\s*$/i.exec(written);
  if (!m)
    throw new UsageError(
      `--tolerance "${written}": give a value and a unit, cm-1 or ppm, optionally "at" check wavenumbers, e.g. "0.01 cm-1 at 2886,2960" or "5 ppm"`,
    );
  const value = Number(m[1]);
  if (!(value > 0)) throw new UsageError(`--tolerance "${written}": a tolerance must be above 0`);
  const tolerance: ScaleTolerance = /ppm/i.test(m[2]) ? { unit: "ppm", valuePpm: value } : { unit: "cm-1", valueCm: value };
  if (m[4] === undefined) return { tolerance, at: "band" };
  const at = m[4]
    .split(/[,\s]+/)
    .filter((w) => w !== "")
    .map(Number);
  if (at.length === 0 || at.some((nu) => !(nu > 0) || !Number.isFinite(nu)))
    throw new UsageError(`--tolerance "${written}": the check wavenumbers after "at" must be numbers above 0, in cm⁻¹, separated by commas`);
  return { tolerance, at };
}

/** --cell "HC-3:2025-01-14": the identifier, and the fill date after the last colon when it is a date. */
function cellOption(written: string): { id: string; filledOn: string | null } {
  const m = /^(.*):(\d{4}-\d{2}-\d{2})\s*$/.exec(written);
  const id = (m ? m[1] : written).trim();
  if (id === "") throw new UsageError(`--cell ${written}: give the cell's identifier before the fill date, e.g. HC-3:2025-01-14`);
  return { id, filledOn: m ? dateOption("cell", m[2]) : null };
}

const conditionOptions: Record<keyof CellConditions, string> = {
  pathCm: "path",
  temperatureK: "temperature",
  pressurePa: "pressure",
  moleFraction: "mole-fraction",
};

/** The record's fields from the options; the date of measurement falls back to the spectrum file's own. */
export function recordFromOptions(values: Record<string, string | boolean | undefined>, fileMeasuredOn: string | null): CalibrationRecordFields {
  const cellText = text(values, "cell");
  const cell = cellText === null ? null : cellOption(cellText);
  const measuredText = text(values, "measured-on");
  const measuredOn = measuredText !== null ? dateOption("measured-on", measuredText) : fileMeasuredOn;
  const toleranceText = text(values, "tolerance");
  return {
    instrument: text(values, "instrument"),
    operator: text(values, "operator"),
    cellId: cell?.id ?? null,
    cellFilledOn: cell?.filledOn ?? null,
    measuredOn,
    measuredOnFrom: measuredText !== null ? "option" : fileMeasuredOn !== null ? "file" : null,
    tolerance: toleranceText === null ? null : toleranceOption(toleranceText),
    assumedConditions: (Object.keys(conditionOptions) as Array<keyof CellConditions>).filter((k) => values[conditionOptions[k]] === undefined),
  };
}
