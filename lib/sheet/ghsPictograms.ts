/**
 * What each GHS hazard pictogram shows, so a printed code can be matched to the label on the
 * cylinder (UN GHS, Annex 1 pictogram names; fact of the trade).
 */
export const ghsPictogramNames: Record<string, string> = {
  GHS01: "exploding bomb",
  GHS02: "flame",
  GHS03: "flame over circle",
  GHS04: "gas cylinder",
  GHS05: "corrosion",
  GHS06: "skull and crossbones",
  GHS07: "exclamation mark",
  GHS08: "health hazard",
  GHS09: "environment",
};

export function ghsPictogramText(code: string): string {
  const name = ghsPictogramNames[code];
  return name ? `${code} (${name})` : code;
}
