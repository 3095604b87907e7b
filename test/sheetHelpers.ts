import { execFileSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

// Poppler's tools read the sheets back as a reader would. They must be installed (npm test runs
// scripts/ensure-test-tools.sh); a missing tool fails the tests instead of skipping them.
export function requireTool(name: string): void {
  try {
    execFileSync("sh", ["-c", `command -v ${name}`], { stdio: "pipe" });
  } catch {
    throw new Error(`${name} (Debian poppler-utils) is not installed; run scripts/ensure-test-tools.sh`);
  }
}

export function scratchDir(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `bandatlas-${prefix}-`));
}

export function writePdf(dir: string, name: string, bytes: Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, bytes);
  return path;
}

export function pdfText(path: string, layout = false): string {
  return execFileSync("pdftotext", [...(layout ? ["-layout"] : []), "-enc", "UTF-8", path, "-"], { encoding: "utf8" });
}

export function pdfInfo(path: string): Record<string, string> {
  const out = execFileSync("pdfinfo", ["-isodates", path], { encoding: "utf8" });
  return Object.fromEntries(
    out
      .split("\n")
      .filter((l) => l.includes(":"))
      .map((l) => [l.slice(0, l.indexOf(":")).trim(), l.slice(l.indexOf(":") + 1).trim()]),
  );
}

export function pdfFonts(path: string): string {
  return execFileSync("pdffonts", [path], { encoding: "utf8" });
}

export interface Raster {
  width: number;
  height: number;
  /** RGB triplets, row by row. */
  rgb: Uint8Array;
}

/** Binary PPM (P6) as pdftoppm writes it: "P6\n<w> <h>\n255\n" then the samples. */
export function parsePpm(bytes: Buffer): Raster {
  const header = /^P6\s+(\d+)\s+(\d+)\s+255\s/.exec(bytes.subarray(0, 40).toString("latin1"));
  if (!header) throw new Error("not a binary PPM with 8-bit samples");
  const width = Number(header[1]);
  const height = Number(header[2]);
  return { width, height, rgb: new Uint8Array(bytes.subarray(header[0].length, header[0].length + width * height * 3)) };
}

/** Every page at a resolution in dpi, as rasters, via pdftoppm. */
export function rasterPages(path: string, dpi: number): Raster[] {
  const dir = scratchDir("raster");
  execFileSync("pdftoppm", ["-r", String(dpi), path, join(dir, "page")]);
  return readdirSync(dir)
    .filter((f) => f.endsWith(".ppm"))
    .sort()
    .map((f) => parsePpm(readFileSync(join(dir, f))));
}

export function inkFraction(r: Raster): number {
  let dark = 0;
  for (let i = 0; i < r.rgb.length; i += 3) if (r.rgb[i] + r.rgb[i + 1] + r.rgb[i + 2] < 3 * 128) dark++;
  return dark / (r.width * r.height);
}

/** Pixels close to a colour (each channel within `tolerance`), for finding the branch colours. */
export function pixelsNear(r: Raster, hex: string, tolerance: number): number {
  const target = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
  let n = 0;
  for (let i = 0; i < r.rgb.length; i += 3) {
    if (Math.abs(r.rgb[i] - target[0]) <= tolerance && Math.abs(r.rgb[i + 1] - target[1]) <= tolerance && Math.abs(r.rgb[i + 2] - target[2]) <= tolerance) n++;
  }
  return n;
}
