// The bench page's settings and their URL query (so a setting can be shared): parsing with one
// plain message per bad field, and the instrument they describe.
import { lengthUnitsCm, maxSpectrumRangeCm, pressureUnitsPa } from "../atlas/cellUnits.ts";
import { apodizations, type Apodization, type Instrument } from "../core/spectra/instrumentLineShape.ts";

/** The bench's line-shape choices: the FT apodizations, and a grating's Gaussian slit. */
export const gratingLineShape = "grating-gaussian-slit";
export const lineShapeNames: Readonly<Record<string, string>> = {
  boxcar: "FT, boxcar (no apodization)",
  triangular: "FT, triangular",
  "happ-genzel": "FT, Happ–Genzel",
  "norton-beer-weak": "FT, Norton–Beer weak",
  "norton-beer-medium": "FT, Norton–Beer medium",
  "norton-beer-strong": "FT, Norton–Beer strong",
  [gratingLineShape]: "grating, Gaussian slit",
};

/** Field names are the query's keys and the form's input names. */
export interface BenchSettings {
  temperatureK: number;
  pressure: number;
  pressureUnit: string;
  path: number;
  pathUnit: string;
  moleFraction: number;
  resolutionCm: number;
  lineShape: string;
  fromCm: number;
  toCm: number;
  /** Wavenumber at which to read a value off the spectrum (cm⁻¹), or null. */
  at: number | null;
}

/** What one browser computation may ask for (a range wider than this would take many seconds). */
export const benchLimits = { maxRangeCm: maxSpectrumRangeCm, maxResolutionCm: 100 };

export function instrumentOf(s: BenchSettings): Instrument {
  return s.lineShape === gratingLineShape
    ? { kind: "grating", resolutionCm: s.resolutionCm }
    : { kind: "fourier-transform", resolutionCm: s.resolutionCm, apodization: s.lineShape as Apodization };
}

export function benchQuery(s: BenchSettings): URLSearchParams {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(s)) if (v !== null) q.set(k, String(v));
  return q;
}

/** Settings from a query (missing keys take the defaults) and a message for each bad value. */
export function readBenchSettings(query: URLSearchParams, defaults: BenchSettings): { settings: BenchSettings; problems: string[] } {
  const problems: string[] = [];
  const number = (key: keyof BenchSettings, what: string, ok: (v: number) => boolean, rule: string): number => {
    const text = query.get(key);
    const fallback = defaults[key] as number;
    if (text === null || text.trim() === "") return fallback;
    const v = Number(text);
    if (!Number.isFinite(v) || !ok(v)) {
      problems.push(`${what} “${text}”: ${rule}.`);
      return fallback;
    }
    return v;
  };
  const choice = (key: keyof BenchSettings, what: string, allowed: readonly string[]): string => {
    const text = query.get(key);
    if (text === null || text === "") return defaults[key] as string;
    if (!allowed.includes(text)) {
      problems.push(`${what} “${text}”: use one of ${allowed.join(", ")}.`);
      return defaults[key] as string;
    }
    return text;
  };
  const settings: BenchSettings = {
    temperatureK: number("temperatureK", "Temperature", (v) => v > 0 && v <= 5000, "give kelvin above 0 (at most 5000 K)"),
    pressure: number("pressure", "Pressure", (v) => v > 0, "must be above 0"),
    pressureUnit: choice("pressureUnit", "Pressure unit", Object.keys(pressureUnitsPa)),
    path: number("path", "Path length", (v) => v > 0, "must be above 0"),
    pathUnit: choice("pathUnit", "Path unit", Object.keys(lengthUnitsCm)),
    moleFraction: number("moleFraction", "Mole fraction", (v) => v > 0 && v <= 1, "must be above 0 and at most 1"),
    resolutionCm: number(
      "resolutionCm",
      "Resolution",
      (v) => v > 0 && v <= benchLimits.maxResolutionCm,
      `must be above 0 and at most ${benchLimits.maxResolutionCm} cm⁻¹`,
    ),
    lineShape: choice("lineShape", "Line shape", [...apodizations, gratingLineShape]),
    fromCm: number("fromCm", "From", (v) => v > 0, "must be above 0 cm⁻¹"),
    toCm: number("toCm", "To", (v) => v > 0, "must be above 0 cm⁻¹"),
    at: query.get("at")?.trim() ? number("at", "Read-off wavenumber", (v) => v > 0, "must be above 0 cm⁻¹") : null,
  };
  if (!(settings.toCm > settings.fromCm)) problems.push(`The range ${settings.fromCm} to ${settings.toCm} cm⁻¹ is empty: “to” must be above “from”.`);
  else if (settings.toCm - settings.fromCm > benchLimits.maxRangeCm)
    problems.push(
      `The range ${settings.fromCm} to ${settings.toCm} cm⁻¹ is wider than ${benchLimits.maxRangeCm} cm⁻¹, the limit of this page and of bandatlas spectrum: narrow it.`,
    );
  return { settings, problems };
}

/** The same computation as `bandatlas` commands, so a result can be reproduced or scripted. */
export function benchCommands(moleculeId: string, s: BenchSettings): { spectrum: string; calibration: string } {
  const shape = s.lineShape === gratingLineShape ? "--instrument grating" : `--apodization ${s.lineShape}`;
  const cell = `--temperature ${s.temperatureK} --pressure "${s.pressure} ${s.pressureUnit}" --path "${s.path} ${s.pathUnit}" --mole-fraction ${s.moleFraction} --resolution ${s.resolutionCm} ${shape}`;
  return {
    spectrum: `bandatlas spectrum ${moleculeId} ${cell} --from ${s.fromCm} --to ${s.toCm}`,
    calibration: `bandatlas calibration-lines ${moleculeId} ${cell} --from ${s.fromCm} --to ${s.toCm}`,
  };
}
