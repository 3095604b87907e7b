import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const source = (file: string) => fileURLToPath(new URL(`../browser/${file}`, import.meta.url));

/**
 * The site's scripts, each bundled from one lib/browser entry with what it imports:
 * search.js (lib/core's nearbyLines), bench.js (lib/atlas's cellLinesOfModel and lib/core's cell
 * spectrum), calibrate.js (lib/spectrumFile's readers and lib/atlas's calibrateMeasuredSpectrum).
 */
export const browserScripts: ReadonlyArray<{ path: string; entry: string }> = [
  { path: "assets/search.js", entry: source("siteSearch.ts") },
  { path: "assets/bench.js", entry: source("benchPage.ts") },
  { path: "assets/calibrate.js", entry: source("calibratePage.ts") },
];

/** One script's bundle, minified, as bytes to write. */
export async function bundleBrowserScript(entryPoint: string): Promise<Uint8Array> {
  const result = await build({
    entryPoints: [entryPoint],
    write: false,
    bundle: true,
    format: "iife",
    target: ["es2020"],
    minify: true,
    legalComments: "none",
    logLevel: "silent",
    // No source paths or timestamps end up in the bundle, so it is byte-identical between builds.
    sourcemap: false,
  });
  return result.outputFiles[0].contents;
}
