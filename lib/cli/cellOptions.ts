import { apodizations, standardAtmospherePa, type Apodization, type CellConditions, type Instrument } from "../core/index.ts";
import { defaultCellConditions, lengthUnitsCm, maxCellPressurePa, pressureUnitsPa } from "../atlas/index.ts";
import { numberOption, temperatureOption, type OptionSpec } from "./options.ts";
import { UsageError } from "./usageError.ts";

/** The gas in the cell (cellConditionsFromOptions reads them): `spectrum`, `calibration-lines`, `calibrate`. */
export const cellConditionOptionSpec: OptionSpec = {
  temperature: { type: "string" },
  pressure: { type: "string" },
  path: { type: "string" },
  "mole-fraction": { type: "string" },
};

/** Options shared by `spectrum` and `calibration-lines`. */
export const cellOptionSpec: OptionSpec = {
  ...cellConditionOptionSpec,
  resolution: { type: "string" },
  apodization: { type: "string" },
  instrument: { type: "string" },
  from: { type: "string" },
  to: { type: "string" },
  format: { type: "string" },
  molecules: { type: "string" },
};

const unitList = (units: Readonly<Record<string, number>>) => {
  const names = Object.keys(units);
  return `${names.slice(0, -1).join(", ")} or ${names.at(-1)}`;
};

export const cellConditionsHelp = `  --temperature <K>       gas temperature (default 296 K)
  --pressure <p unit>     total pressure, e.g. "20 Torr" (default 20 Torr), in
                          ${unitList(pressureUnitsPa)}
  --path <l unit>         cell path length: m, cm or mm, e.g. "10 cm" (default 10 cm)
  --mole-fraction <x>     fraction of the gas in the cell, the rest air (default 1)`;

export const cellOptionsHelp = `${cellConditionsHelp}
  --instrument ft|grating Fourier-transform (default) or grating with a Gaussian slit
  --resolution <cm⁻¹>     FT: maximum optical path difference is 1/resolution;
                          grating: slit-function FWHM
  --apodization <name>    FT only: ${apodizations.join(", ")} (default triangular)
  --from <cm⁻¹> --to <cm⁻¹>  wavenumber range
  --molecules <dir>       read molecule files from <dir> instead of the shipped ones`;

/** "--pressure 20 Torr" arrives as two words: join a unit word to the number before it. */
export function joinUnitWords(args: string[]): string[] {
  const out: string[] = [];
  // Any word of letters: a unit we do not know then gets its own clear message.
  const unitWord = /^[a-zA-Z]+$/;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    // calibrate's --tolerance 5 ppm / 0.01 cm-1 (a check list after "at" still needs quotes).
    if (a === "--tolerance" && /^[+\d.]/.test(args[i + 1] ?? "") && /^(ppm|cm-1|cm⁻¹)$/i.test(args[i + 2] ?? "")) {
      out.push(a, `${args[i + 1]} ${args[i + 2]}`);
      i += 2;
    } else if (
      ["--pressure", "--path", "--temperature"].includes(a) &&
      i + 2 < args.length + 1 &&
      args[i + 2] !== undefined &&
      unitWord.test(args[i + 2]) &&
      /^[-+\d.]/.test(args[i + 1])
    ) {
      out.push(a, `${args[i + 1]} ${args[i + 2]}`);
      i += 2;
    } else out.push(a);
  }
  return out;
}

function quantity(name: string, text: string, units: Readonly<Record<string, number>>, example: string): number {
  const match = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*([a-zA-Z]+)\s*$/i.exec(text);
  if (!match) throw new UsageError(`--${name} "${text}": give a number and a unit, e.g. ${example} (units: ${Object.keys(units).join(", ")})`);
  // Any case is accepted ("torr", "MBAR"); messages name the units as they are written.
  const unit = Object.keys(units).find((u) => u.toLowerCase() === match[2].toLowerCase());
  if (unit === undefined) throw new UsageError(`--${name} "${text}": unknown unit "${match[2]}"; use one of: ${Object.keys(units).join(", ")}`);
  const value = Number(match[1]) * units[unit];
  if (!(value > 0) || !Number.isFinite(value)) throw new UsageError(`--${name} "${text}": must be above 0`);
  return value;
}

export function pressureOptionPa(text: string | undefined): number {
  if (text === undefined) return defaultCellConditions.pressurePa;
  const pa = quantity("pressure", text, pressureUnitsPa, `"20 Torr" or "2.5 kPa"`);
  if (pa > maxCellPressurePa) throw new UsageError(`--pressure ${text}: above 100 atm the ideal-gas and Voigt models mean nothing`);
  return pa;
}

export function pathOptionCm(text: string | undefined): number {
  if (text === undefined) return defaultCellConditions.pathCm;
  return quantity("path", text, lengthUnitsCm, `"10 cm" or "1.5 m"`);
}

export function cellConditionsFromOptions(values: Record<string, string | boolean | undefined>): CellConditions {
  const moleFraction = numberOption("mole-fraction", values["mole-fraction"] as string | undefined, 1);
  if (!(moleFraction > 0 && moleFraction <= 1)) throw new UsageError(`--mole-fraction ${moleFraction}: must be above 0 and at most 1`);
  return {
    temperatureK: temperatureOption(values.temperature as string | undefined, defaultCellConditions.temperatureK),
    pressurePa: pressureOptionPa(values.pressure as string | undefined),
    pathCm: pathOptionCm(values.path as string | undefined),
    moleFraction,
  };
}

export function instrumentFromOptions(values: Record<string, string | boolean | undefined>, defaultResolution: number): Instrument {
  const kind = (values.instrument as string | undefined) ?? "ft";
  const resolutionCm = numberOption("resolution", values.resolution as string | undefined, defaultResolution, "cm-1");
  if (!(resolutionCm > 0)) throw new UsageError(`--resolution ${values.resolution}: must be above 0 cm⁻¹`);
  if (resolutionCm > 100) throw new UsageError(`--resolution ${values.resolution}: above 100 cm⁻¹ no band structure is left to show`);
  if (kind === "grating") {
    if (values.apodization !== undefined) throw new UsageError("--apodization applies to --instrument ft only (a grating's slit function is Gaussian)");
    return { kind: "grating", resolutionCm };
  }
  if (kind !== "ft") throw new UsageError(`--instrument ${kind}: use ft or grating`);
  return { kind: "fourier-transform", resolutionCm, apodization: apodizationOption(values) };
}

/** --apodization, triangular when not given. */
export function apodizationOption(values: Record<string, string | boolean | undefined>): Apodization {
  const apodization = ((values.apodization as string | undefined) ?? "triangular").toLowerCase();
  if (!(apodizations as readonly string[]).includes(apodization))
    throw new UsageError(`--apodization ${values.apodization}: use one of ${apodizations.join(", ")}`);
  return apodization as Apodization;
}

export function rangeFromOptions(values: Record<string, string | boolean | undefined>): { fromCm?: number; toCm?: number } {
  const from = values.from === undefined ? undefined : numberOption("from", values.from as string, 0, "cm-1");
  const to = values.to === undefined ? undefined : numberOption("to", values.to as string, 0, "cm-1");
  if (from !== undefined && !(from > 0)) throw new UsageError(`--from ${values.from}: must be above 0 cm⁻¹`);
  if (from !== undefined && to !== undefined && !(to > from)) throw new UsageError(`--to ${values.to} must be above --from ${values.from}`);
  return { fromCm: from, toCm: to };
}

export function describeConditions(c: CellConditions, instrument: Instrument): string {
  const inst =
    instrument.kind === "grating"
      ? `grating, Gaussian slit FWHM ${instrument.resolutionCm} cm⁻¹`
      : instrument.kind === "fourier-transform"
        ? `FT, resolution ${instrument.resolutionCm} cm⁻¹ (max. OPD ${(1 / instrument.resolutionCm).toPrecision(4)} cm), ${instrument.apodization} apodization`
        : "monochromatic";
  return `${c.pathCm} cm cell, ${c.temperatureK} K, ${(c.pressurePa / 100).toPrecision(5)} mbar (${((c.pressurePa * 760) / standardAtmospherePa).toPrecision(5)} Torr) total, ${c.moleFraction === 1 ? "the pure gas" : `mole fraction ${c.moleFraction} in air`}; ${inst}`;
}
