import { airRefractiveIndexEdlen } from "./airWavelength.ts";
import { CoreInputError } from "../coreInputError.ts";
import type { WavenumberCm } from "../types.ts";

export type PositionUnit = "cm-1" | "nm" | "um";
export type Medium = "vacuum" | "air";

export interface SpectralPosition {
  value: number;
  unit: PositionUnit;
  medium: Medium;
}

const unitWords: Record<string, PositionUnit> = {
  "cm-1": "cm-1",
  "cm^-1": "cm-1",
  "cm⁻¹": "cm-1",
  "1/cm": "cm-1",
  nm: "nm",
  um: "um",
  µm: "um",
  μm: "um",
  micron: "um",
  microns: "um",
};

/**
 * A decimal comma, as many locales write numbers ("2143,3"), read as a point when that is the only
 * reading: one comma, no point, and not exactly three digits after it, which could as well be a
 * thousands separator ("2,143") — that, and any other comma, is refused with the number to write.
 */
function withDecimalPoint(text: string): string {
  if (!text.includes(",")) return text;
  const decimal = /^(\s*[+]?\d+),(\d+)(?![\d.,])(.*)$/.exec(text);
  if (decimal && decimal[2].length !== 3) return `${decimal[1]}.${decimal[2]}${decimal[3]}`;
  const hint = decimal
    ? `is the comma a decimal comma (${decimal[1].trim()}.${decimal[2]}) or a thousands separator (${decimal[1].trim()}${decimal[2]})? Write the number with a decimal point and no separator`
    : "write the number with a decimal point and no separators, e.g. 2143.3";
  throw new CoreInputError(`"${text.trim()}": ${hint}`);
}

/**
 * "2143.3", "2143.3 cm-1", "1532.83 nm", "1.53283um": the number and its unit (a unit word after
 * the number wins over `defaultUnit`). Wavelengths are vacuum unless `medium` says air.
 */
export function parseSpectralPosition(text: string, defaultUnit: PositionUnit = "cm-1", medium: Medium = "vacuum"): SpectralPosition {
  const match = /^\s*([+]?\d+(?:\.\d*)?(?:[eE][+-]?\d+)?|[+]?\.\d+(?:[eE][+-]?\d+)?)\s*([^\s\d].*?)?\s*$/.exec(withDecimalPoint(text));
  if (!match) throw new CoreInputError(`"${text}" is not a position: give a number with an optional unit, e.g. 2143.3, 2143.3 cm-1, 1532.83 nm or 1.5328 um`);
  const unitText = match[2]?.toLowerCase();
  const unit = unitText === undefined ? defaultUnit : unitWords[unitText];
  if (unit === undefined) throw new CoreInputError(`unknown unit "${match[2]}" in "${text}": use cm-1, nm or um`);
  const value = Number(match[1]);
  if (!(value > 0 && Number.isFinite(value))) throw new CoreInputError(`"${text}": a position must be a number above 0`);
  if (unit === "cm-1" && medium === "air") throw new CoreInputError("an air position is a wavelength: give it in nm or um");
  return { value, unit, medium };
}

/**
 * Vacuum wavenumber of a position. An air wavelength λ_air becomes λ_vac = n·λ_air with n from
 * Edlén's standard-air formula, which depends on the vacuum wavenumber itself: a few fixed-point
 * steps converge to far below a part in 10¹² (n − 1 ≈ 2.7·10⁻⁴ varies slowly with σ).
 */
export function positionToWavenumber(p: SpectralPosition): WavenumberCm {
  if (p.unit === "cm-1") return p.value;
  const nm = p.unit === "nm" ? p.value : p.value * 1e3;
  if (p.medium === "vacuum") return 1e7 / nm;
  let wavenumber = 1e7 / nm;
  for (let i = 0; i < 5; i++) wavenumber = 1e7 / (nm * airRefractiveIndexEdlen(wavenumber));
  return wavenumber;
}

/** A half-width given in the position's unit, in cm⁻¹ at that position (|dν̃| = |dλ|·10⁷/λ² for λ in nm). */
export function windowToWavenumber(p: SpectralPosition, halfWidth: number): WavenumberCm {
  if (p.unit === "cm-1") return halfWidth;
  const wavenumber = positionToWavenumber(p);
  const nmWidth = p.unit === "nm" ? halfWidth : halfWidth * 1e3;
  return (nmWidth * wavenumber * wavenumber) / 1e7;
}

export const unitLabels: Record<PositionUnit, string> = { "cm-1": "cm⁻¹", nm: "nm", um: "µm" };
