import { readFileSync } from "node:fs";
import { createRequire } from "node:module";

// The sheet's fonts come from the dejavu-fonts-ttf package, never from the system, so every
// machine embeds the same glyphs (DejaVu covers ν̃, cm⁻¹, µ, °, ±, ≥, ★ and ⚠).
const require = createRequire(import.meta.url);

export const sheetFontFiles = {
  regular: "dejavu-fonts-ttf/ttf/DejaVuSans.ttf",
  bold: "dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf",
} as const;

export type SheetFontName = keyof typeof sheetFontFiles;

/** The fontkit PDFKit itself depends on, resolved from PDFKit's folder so it is the same copy. */
const fontkit = createRequire(require.resolve("pdfkit"))("fontkit") as { create(bytes: Buffer): unknown };

const cache = new Map<SheetFontName, unknown>();

/**
 * The parsed font, once per process: parsing DejaVu's tables took most of a sheet's render time.
 * PDFKit takes a fontkit font as a font source and makes a fresh subset of it for each document.
 */
export function sheetFont(name: SheetFontName): unknown {
  let font = cache.get(name);
  if (!font) {
    font = fontkit.create(readFileSync(require.resolve(sheetFontFiles[name])));
    cache.set(name, font);
  }
  return font;
}
