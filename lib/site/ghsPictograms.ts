/** Names of the GHS hazard pictograms (UN GHS, Annex 3), so a code is never shown bare. */
export const ghsPictogramNames: Record<string, string> = {
  GHS01: "exploding bomb (explosive)",
  GHS02: "flame (flammable)",
  GHS03: "flame over circle (oxidizing)",
  GHS04: "gas cylinder (gas under pressure)",
  GHS05: "corrosion (corrosive)",
  GHS06: "skull and crossbones (acutely toxic)",
  GHS07: "exclamation mark (harmful, irritant)",
  GHS08: "health hazard (serious long-term health effects)",
  GHS09: "environment (hazardous to aquatic life)",
};
