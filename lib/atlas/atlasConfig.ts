import type { Band } from "../core/index.ts";
import { windowToWavenumber, type SpectralPosition } from "../core/positions/spectralPosition.ts";

/** The standard temperatures of the atlas, set here and nowhere else. */
export const standardTemperaturesK: readonly number[] = [273.15, 296, 298.15, 1000];
export const defaultTemperatureK = 296;

/** "combination" occurs only for linear molecules (e.g. ν1+ν3 of 12C2H2), whose files list their bands. */
export type BandKind = "fundamental" | "hot" | "overtone" | "combination";

/** The bands every species is built with: the fundamental, two hot bands, two overtones. */
export const atlasBands: ReadonlyArray<{ band: Band; kind: BandKind }> = [
  { band: { vUpper: 1, vLower: 0 }, kind: "fundamental" },
  { band: { vUpper: 2, vLower: 1 }, kind: "hot" },
  { band: { vUpper: 3, vLower: 2 }, kind: "hot" },
  { band: { vUpper: 2, vLower: 0 }, kind: "overtone" },
  { band: { vUpper: 3, vLower: 0 }, kind: "overtone" },
];

/** Hot bands are shown with the fundamental when their strongest line reaches this fraction of its strongest. */
export const hotBandDisplayFraction = 1e-3;
/** Default half-width of the `find` window (CLI and the website's wavenumber search), cm⁻¹. */
export const defaultFindWindowCm = 1.0;
/**
 * The one window rule of `find` and the website's search: a half-width given is in the position's
 * own unit (typed or chosen: "1532.83 nm" with the menu at cm⁻¹ is nm); none given is
 * defaultFindWindowCm in cm⁻¹, whatever the unit (±1 nm would be ±4 cm⁻¹ at 1.5 µm).
 */
export function findWindowCm(position: SpectralPosition, halfWidthGiven: number | null): number {
  return halfWidthGiven === null ? defaultFindWindowCm : windowToWavenumber(position, halfWidthGiven);
}

/** Default threshold of `find`, relative to the strongest line of each band. */
export const defaultFindMinRelative = 1e-3;
