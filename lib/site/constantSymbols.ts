/** Handbook symbols of the equilibrium constants a molecule file may give (Huber & Herzberg's notation). */
const symbols: Record<string, string> = {
  omegaE: "ωₑ",
  omegaExe: "ωₑxₑ",
  omegaEye: "ωₑyₑ",
  omegaEze: "ωₑzₑ",
  bE: "Bₑ",
  alphaE: "αₑ",
  gammaE: "γₑ",
  dE: "Dₑ",
  betaE: "βₑ",
  hE: "Hₑ",
};

/** "omegaExe" → "ωₑxₑ"; Dunham names "Y10" → "Y₁₀", mass-independent "U10" → "U₁₀"; anything else unchanged. */
export function constantSymbol(name: string): string {
  if (symbols[name]) return symbols[name];
  const dunham = /^([YU])(\d)(\d)$/.exec(name);
  return dunham ? `${dunham[1]}${String.fromCharCode(0x2080 + Number(dunham[2]))}${String.fromCharCode(0x2080 + Number(dunham[3]))}` : name;
}

/**
 * The unit of a constant as the file gives it: cm⁻¹, except a mass-independent U_kl, which is
 * Y_kl·μ^(k/2+l) and so carries cm⁻¹·u^(k/2+l) (Dunham's isotope relation, DEVELOPERS.md).
 */
export function constantUnit(name: string): string {
  const u = /^U(\d)(\d)$/.exec(name);
  if (!u) return "cm⁻¹";
  const k = Number(u[1]);
  const l = Number(u[2]);
  const power = k % 2 === 0 ? String(k / 2 + l) : `${k + 2 * l}/2`;
  return power === "1" ? "cm⁻¹·u" : `cm⁻¹·u^(${power})`;
}

/** The file's field name is worth showing beside the symbol only where it is not the symbol itself (ωₑ vs omegaE; not Y₁₀ vs Y10). */
export function fieldNameDiffers(name: string): boolean {
  return !/^[YU]\d\d$/.test(name) && constantSymbol(name) !== name;
}
