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

interface GlyphPosition {
  xAdvance: number;
  yAdvance: number;
  xOffset: number;
  yOffset: number;
}
interface FontkitFont {
  layout(text: string, ...rest: unknown[]): { glyphs: unknown[]; positions: GlyphPosition[] };
}

/** Shaped texts kept per font: the shared headings and one entry's A4 and Letter pair fit; a build of any size stays within a few MB. */
const maxShapedTexts = 4_000;

/**
 * The font with its text shaping remembered across documents. PDFKit remembers shaped words only
 * within one document, and OpenType shaping (fontkit's layout) was the largest part of a sheet's
 * time, while the A4 and Letter sheets of an entry, and all sheets' headings, print the same
 * texts. Shaping is a pure function of the text; PDFKit scales the positions it gets in place,
 * so every call hands out fresh position objects.
 */
function withSharedShaping(font: FontkitFont): unknown {
  const shaped = new Map<string, { glyphs: unknown[]; positions: GlyphPosition[] }>();
  const layout = (text: string, ...rest: unknown[]) => {
    if (rest.some((r) => r !== undefined)) return font.layout(text, ...rest);
    let run = shaped.get(text);
    if (!run) {
      const fresh = font.layout(text);
      run = {
        glyphs: fresh.glyphs,
        positions: fresh.positions.map((p) => ({ xAdvance: p.xAdvance, yAdvance: p.yAdvance, xOffset: p.xOffset, yOffset: p.yOffset })),
      };
      if (shaped.size >= maxShapedTexts) shaped.clear();
      shaped.set(text, run);
    }
    const positions = run.positions.map((p) => ({ ...p }));
    return {
      glyphs: run.glyphs,
      positions,
      get advanceWidth() {
        let width = 0;
        for (const p of positions) width += p.xAdvance;
        return width;
      },
    };
  };
  return new Proxy(font, {
    get(target, property) {
      if (property === "layout") return layout;
      const value = Reflect.get(target, property, target);
      return typeof value === "function" ? value.bind(target) : value;
    },
  });
}

/**
 * The parsed font, once per process: parsing DejaVu's tables took most of a sheet's render time.
 * PDFKit takes a fontkit font as a font source and makes a fresh subset of it for each document.
 */
export function sheetFont(name: SheetFontName): unknown {
  let font = cache.get(name);
  if (!font) {
    font = withSharedShaping(fontkit.create(readFileSync(require.resolve(sheetFontFiles[name]))) as FontkitFont);
    cache.set(name, font);
  }
  return font;
}
