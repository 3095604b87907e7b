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

/** "omegaExe" → "ωₑxₑ"; Dunham names "Y10" → "Y₁₀"; anything else unchanged. */
export function constantSymbol(name: string): string {
  if (symbols[name]) return symbols[name];
  const dunham = /^Y(\d)(\d)$/.exec(name);
  return dunham ? `Y${String.fromCharCode(0x2080 + Number(dunham[1]))}${String.fromCharCode(0x2080 + Number(dunham[2]))}` : name;
}
