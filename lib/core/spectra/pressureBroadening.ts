import { CoreInputError } from "../coreInputError.ts";
import { standardAtmospherePa } from "../physicalConstants.ts";
import type { Branch, TemperatureK, WavenumberCm } from "../types.ts";

/** Reference temperature of the broadening coefficients (the usual convention of the field). */
export const broadeningReferenceTemperatureK = 296;

/** One pressure-broadening coefficient: HWHM per atm at 296 K and its temperature exponent. */
export interface BroadeningCoefficient {
  /** HWHM in cm⁻¹/atm at 296 K, used for every line not covered by `byAbsM`. */
  hwhmCmPerAtm: number;
  /** J-dependent values by |m| (m = J''+1 in R, −J'' in P), linearly interpolated, ends held. */
  byAbsM: ReadonlyArray<{ absM: number; hwhmCmPerAtm: number }> | null;
  /** n in γ(T) = γ(296 K) (296/T)^n. */
  temperatureExponent: number;
  sourceKey: string;
  /** "typical": not measured for this gas; every output that uses it says so. */
  origin: "cited" | "typical";
}

export interface GasBroadening {
  self: BroadeningCoefficient;
  air: BroadeningCoefficient;
}

/**
 * The stand-in used where a molecule file gives no broadening: 0.07 cm⁻¹/atm self and air at
 * 296 K, n = 0.75, an order of magnitude typical of small molecules near room temperature
 * (common practice, no source; from memory). Hydrogen halides self-broaden several times more
 * strongly, so this is flagged "typical" on every output that uses it.
 */
export const typicalBroadening: GasBroadening = {
  self: { hwhmCmPerAtm: 0.07, byAbsM: null, temperatureExponent: 0.75, sourceKey: "typical", origin: "typical" },
  air: { hwhmCmPerAtm: 0.07, byAbsM: null, temperatureExponent: 0.75, sourceKey: "typical", origin: "typical" },
};

export function runningM(branch: Branch, jLower: number): number {
  return branch === "R" ? jLower + 1 : -jLower;
}

/** γ(296 K) in cm⁻¹/atm for one line (|m| interpolated in the coefficient's table). */
export function coefficientAt(coefficient: BroadeningCoefficient, absM: number): number {
  const table = coefficient.byAbsM;
  if (!table || table.length === 0) return coefficient.hwhmCmPerAtm;
  if (absM <= table[0].absM) return table[0].hwhmCmPerAtm;
  for (let i = 1; i < table.length; i++) {
    if (absM <= table[i].absM) {
      const a = table[i - 1];
      const b = table[i];
      return a.hwhmCmPerAtm + ((b.hwhmCmPerAtm - a.hwhmCmPerAtm) * (absM - a.absM)) / (b.absM - a.absM);
    }
  }
  return table[table.length - 1].hwhmCmPerAtm;
}

/**
 * Lorentz HWHM of one line in a mixture of the gas (mole fraction x) with air at total pressure p:
 * γ_L = (296/T)^n_self γ_self x p + (296/T)^n_air γ_air (1 − x) p, p in atm — the usual
 * linear-in-pressure model with a power-law temperature dependence (e.g. L. S. Rothman et al.,
 * JQSRT 60, 665 (1998), eq. A12; from memory). The buffer is taken to be air.
 */
export function lorentzHwhmCm(
  broadening: GasBroadening,
  absM: number,
  totalPressurePa: number,
  moleFraction: number,
  temperatureK: TemperatureK,
): WavenumberCm {
  if (!(moleFraction >= 0 && moleFraction <= 1)) throw new CoreInputError(`mole fraction ${moleFraction} must be between 0 and 1`);
  if (!(totalPressurePa >= 0)) throw new CoreInputError(`pressure ${totalPressurePa} Pa must be ≥ 0`);
  const pAtm = totalPressurePa / standardAtmospherePa;
  const ratio = broadeningReferenceTemperatureK / temperatureK;
  const self = coefficientAt(broadening.self, absM) * Math.pow(ratio, broadening.self.temperatureExponent);
  const air = coefficientAt(broadening.air, absM) * Math.pow(ratio, broadening.air.temperatureExponent);
  return pAtm * (moleFraction * self + (1 - moleFraction) * air);
}

/** Whether any coefficient in use is the typical stand-in (for the flag every output carries). */
export function broadeningIsTypical(broadening: GasBroadening, moleFraction: number): boolean {
  return (moleFraction > 0 && broadening.self.origin === "typical") || (moleFraction < 1 && broadening.air.origin === "typical");
}
