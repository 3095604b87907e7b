import { readFileSync } from "node:fs";
import { createRequire } from "node:module";

// The sheet's fonts come from the dejavu-fonts-ttf package, never from the system, so every
// machine embeds the same glyphs (DejaVu covers ν̃, cm⁻¹, µ, °, ±, ≥ and the GHS codes' letters).
const require = createRequire(import.meta.url);

export const sheetFontFiles = {
  regular: "dejavu-fonts-ttf/ttf/DejaVuSans.ttf",
  bold: "dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf",
} as const;

export type SheetFontName = keyof typeof sheetFontFiles;

const cache = new Map<SheetFontName, Buffer>();

/** The font file's bytes, read once per process. */
export function sheetFont(name: SheetFontName): Buffer {
  let bytes = cache.get(name);
  if (!bytes) {
    bytes = readFileSync(require.resolve(sheetFontFiles[name]));
    cache.set(name, bytes);
  }
  return bytes;
}
