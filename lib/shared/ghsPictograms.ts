/**
 * The GHS hazard pictograms: the symbol each shows and the hazard it stands for, so a code is never
 * shown bare and a printed code can be matched to the label on the cylinder (UN GHS, chapter 1.4
 * and Annex 1, pictogram symbols and hazard classes; fact of the trade, from memory).
 */
export const ghsPictograms: Readonly<Record<string, { symbol: string; hazard: string }>> = {
  GHS01: { symbol: "exploding bomb", hazard: "explosive" },
  GHS02: { symbol: "flame", hazard: "flammable" },
  GHS03: { symbol: "flame over circle", hazard: "oxidizing" },
  GHS04: { symbol: "gas cylinder", hazard: "gas under pressure" },
  GHS05: { symbol: "corrosion", hazard: "corrosive" },
  GHS06: { symbol: "skull and crossbones", hazard: "acutely toxic" },
  GHS07: { symbol: "exclamation mark", hazard: "harmful, irritant" },
  GHS08: { symbol: "health hazard", hazard: "serious long-term health effects" },
  GHS09: { symbol: "environment", hazard: "hazardous to aquatic life" },
};

/** The pages' wording: "gas cylinder (gas under pressure)"; an unknown code reads "pictogram". */
export function ghsPictogramName(code: string): string {
  const pictogram = ghsPictograms[code];
  return pictogram ? `${pictogram.symbol} (${pictogram.hazard})` : "pictogram";
}

/** The sheets' wording, code first since the sheet has no picture: "GHS04 (gas cylinder)". */
export function ghsPictogramText(code: string): string {
  const pictogram = ghsPictograms[code];
  return pictogram ? `${code} (${pictogram.symbol})` : code;
}
