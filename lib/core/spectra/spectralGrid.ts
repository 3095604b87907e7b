import { CoreInputError } from "../coreInputError.ts";
import type { WavenumberCm } from "../types.ts";

/** An evenly spaced wavenumber grid: ν̃_i = startCm + i·stepCm, i = 0 … count−1. */
export interface SpectralGrid {
  startCm: WavenumberCm;
  stepCm: WavenumberCm;
  count: number;
}

/** Grids beyond this many points are refused (memory, and a browser tab's patience). */
export const maxGridPoints = 1 << 22;

export function spectralGrid(fromCm: WavenumberCm, toCm: WavenumberCm, stepCm: WavenumberCm): SpectralGrid {
  if (!(Number.isFinite(fromCm) && Number.isFinite(toCm) && toCm > fromCm)) {
    throw new CoreInputError(`the range ${fromCm} to ${toCm} cm⁻¹ is empty: "to" must be above "from"`);
  }
  if (!(stepCm > 0)) throw new CoreInputError(`grid step ${stepCm} cm⁻¹ must be above 0`);
  const count = Math.floor((toCm - fromCm) / stepCm + 1e-9) + 1;
  if (count > maxGridPoints) {
    throw new CoreInputError(`${fromCm} to ${toCm} cm⁻¹ at a ${stepCm} cm⁻¹ step is ${count} points, more than the ${maxGridPoints} allowed; narrow the range`);
  }
  return { startCm: fromCm, stepCm, count };
}

/** Index of the grid point nearest to ν̃ (clamped to the grid). */
export function nearestGridIndex(grid: SpectralGrid, wavenumber: WavenumberCm): number {
  const i = Math.round((wavenumber - grid.startCm) / grid.stepCm);
  return Math.min(grid.count - 1, Math.max(0, i));
}
