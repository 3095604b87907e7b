import { fileURLToPath } from "node:url";
import { build } from "esbuild";

/**
 * The site's scripts, each bundled from one lib/browser entry with what it imports:
 * search.js (lib/core's nearbyLines), bench.js (lib/atlas's cellLinesOfModel and lib/core's cell
 * spectrum), calibrate.js (lib/spectrumFile's readers and lib/atlas's calibrateMeasuredSpectrum), history.js
 * (lib/format's calibration-log reader and history chart).
 */
export const browserScripts: ReadonlyArray<{ path: string; entry: string }> = [
  { path: "assets/search.js", entry: fileURLToPath(new URL("../browser/siteSearch.ts", import.meta.url)) },
  { path: "assets/bench.js", entry: fileURLToPath(new URL("../browser/benchPage.ts", import.meta.url)) },
  { path: "assets/calibrate.js", entry: fileURLToPath(new URL("../browser/calibratePage.ts", import.meta.url)) },
  { path: "assets/history.js", entry: fileURLToPath(new URL("../browser/historyPage.ts", import.meta.url)) },
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
