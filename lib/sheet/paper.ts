import { SheetInputError } from "./sheetInput.ts";

/** Page sizes in PostScript points (1/72 in): ISO 216 A4 is 210 × 297 mm, US Letter 8.5 × 11 in. */
export const paperSizes = {
  a4: { widthPt: (210 / 25.4) * 72, heightPt: (297 / 25.4) * 72 },
  letter: { widthPt: 8.5 * 72, heightPt: 11 * 72 },
} as const;

export type PaperName = keyof typeof paperSizes;
export const paperNames = Object.keys(paperSizes) as PaperName[];

export function parsePaper(text: string): PaperName {
  const wanted = text.trim().toLowerCase();
  if (!(paperNames as string[]).includes(wanted)) {
    throw new SheetInputError(`paper "${text}" is not one of: ${paperNames.join(", ")}`);
  }
  return wanted as PaperName;
}
