import { CoreInputError } from "../coreInputError.ts";
import { standardAtmospherePa } from "../physicalConstants.ts";
import type { WavenumberCm } from "../types.ts";

/**
 * One cited pressure-shift coefficient: the move of a line centre per atmosphere of one
 * perturber, negative towards lower wavenumber, near room temperature. No temperature dependence
 * is modelled (none of the shipped sources gives one), and one value serves every line of the
 * gas, its ± covering the spread over J that the source reports.
 */
export interface PressureShiftCoefficient {
  cmPerAtm: number;
  uncertaintyCmPerAtm: number;
  sourceKey: string;
}

/** A gas's cited shifts by itself and by air; null where none is cited (then none is applied). */
export interface GasPressureShift {
  self: PressureShiftCoefficient | null;
  air: PressureShiftCoefficient | null;
}

export const noPressureShift: GasPressureShift = { self: null, air: null };

export interface LineCentreShift {
  shiftCm: WavenumberCm;
  /** Taken as fully correlated between the perturbers (the larger, safe sum). */
  uncertaintyCm: WavenumberCm;
  /** Perturbers present in the cell whose shift is not cited, so not in shiftCm. */
  uncited: Array<"self" | "air">;
  /** Source keys of the shifts applied. */
  sourceKeys: string[];
}

/**
 * δ = p (x δ_self + (1 − x) δ_air), p in atm: the shift is linear in the partial pressure of each
 * perturber, as in the impact approximation of collision broadening (e.g. Swann & Gilbert,
 * J. Opt. Soc. Am. B 17, 1263 (2000), who report it per kPa of acetylene). The buffer is air.
 */
export function lineCentreShift(shift: GasPressureShift, totalPressurePa: number, moleFraction: number): LineCentreShift {
  if (!(moleFraction >= 0 && moleFraction <= 1)) throw new CoreInputError(`mole fraction ${moleFraction} must be between 0 and 1`);
  if (!(totalPressurePa >= 0)) throw new CoreInputError(`pressure ${totalPressurePa} Pa must be ≥ 0`);
  const pAtm = totalPressurePa / standardAtmospherePa;
  let shiftCm = 0;
  let uncertaintyCm = 0;
  const uncited: LineCentreShift["uncited"] = [];
  const sourceKeys: string[] = [];
  for (const [which, fraction] of [
    ["self", moleFraction],
    ["air", 1 - moleFraction],
  ] as const) {
    if (fraction === 0) continue;
    const c = shift[which];
    if (!c) {
      uncited.push(which);
      continue;
    }
    shiftCm += pAtm * fraction * c.cmPerAtm;
    uncertaintyCm += pAtm * fraction * c.uncertaintyCmPerAtm;
    if (!sourceKeys.includes(c.sourceKey)) sourceKeys.push(c.sourceKey);
  }
  return { shiftCm, uncertaintyCm, uncited, sourceKeys };
}
