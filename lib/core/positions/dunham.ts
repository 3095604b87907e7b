import type { DunhamCoefficient, EquilibriumConstants, EquilibriumUncertainties } from "../types.ts";

// Relations between handbook equilibrium constants and Dunham coefficients:
// J. L. Dunham, Phys. Rev. 41, 721 (1932); sign conventions as in K. P. Huber and G. Herzberg,
// Constants of Diatomic Molecules (1979), introduction:
// G(v) = ωe(v+½) − ωexe(v+½)² + ωeye(v+½)³ + ωeze(v+½)⁴,
// Bv = Be − αe(v+½) + γe(v+½)², Dv = De + βe(v+½), Hv = He, F(J) = Bv x − Dv x² + Hv x³.
const equilibriumToDunhamMap: Array<[keyof EquilibriumConstants, number, number, 1 | -1]> = [
  ["omegaE", 1, 0, 1],
  ["omegaExe", 2, 0, -1],
  ["omegaEye", 3, 0, 1],
  ["omegaEze", 4, 0, 1],
  ["bE", 0, 1, 1],
  ["alphaE", 1, 1, -1],
  ["gammaE", 2, 1, 1],
  ["dE", 0, 2, -1],
  ["betaE", 1, 2, -1],
  ["hE", 0, 3, 1],
];

export function equilibriumToDunham(constants: EquilibriumConstants, uncertainties: EquilibriumUncertainties = {}): DunhamCoefficient[] {
  const table: DunhamCoefficient[] = [];
  for (const [name, k, l, sign] of equilibriumToDunhamMap) {
    const value = constants[name];
    if (value === undefined) continue;
    table.push({ k, l, valueCm: sign * value, uncertaintyCm: uncertainties[name] ?? 0 });
  }
  return table;
}
