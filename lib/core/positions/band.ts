import { CoreInputError } from "../coreInputError.ts";
import type { Branch, Band, StateBand, VibrationalBand } from "../types.ts";

/** A linear molecule's band between two listed states (a diatomic's is v'←v''). */
export function isStateBand(band: Band): band is StateBand {
  return band.label !== undefined;
}

/** The band as a diatomic's v'←v'', or a clear error for a linear molecule's state band. */
export function vibrationalBand(band: Band): VibrationalBand {
  if (isStateBand(band)) throw new CoreInputError(`band ${band.label} is a band between a linear molecule's states, not a diatomic's v'-v''`);
  return band;
}

export function bandLabel(band: Band): string {
  if (band.label !== undefined) return band.label;
  return `${band.vUpper}-${band.vLower}`;
}

/** Parses "v'-v''" (absorption: v' > v'' ≥ 0), e.g. "1-0", "2-0", "2-1". */
export function parseBand(text: string): VibrationalBand {
  const match = /^\s*(\d{1,2})\s*-\s*(\d{1,2})\s*$/.exec(text);
  if (!match) throw new CoreInputError(`band "${text}" is not of the form v'-v'' (for example 1-0, 2-0 or 2-1)`);
  const band = { vUpper: Number(match[1]), vLower: Number(match[2]) };
  if (band.vUpper <= band.vLower) {
    throw new CoreInputError(`band "${text}": the upper level v' must be above the lower level v'' (absorption from v'' to v'), for example 1-0`);
  }
  return band;
}

export function sameBand(a: Band, b: Band): boolean {
  if (a.label !== undefined || b.label !== undefined) return a.label === b.label;
  return a.vUpper === b.vUpper && a.vLower === b.vLower;
}

export function checkTemperature(temperatureK: number): void {
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new CoreInputError(`temperature ${temperatureK} K is not possible: it must be a finite number above 0 K`);
  }
}

/** Running index m: J''+1 in the R branch, −J'' in the P branch. */
export function runningIndex(branch: Branch, jLower: number): number {
  return branch === "R" ? jLower + 1 : -jLower;
}
