import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const entry = fileURLToPath(new URL("../browser/siteSearch.ts", import.meta.url));
const benchEntry = fileURLToPath(new URL("../browser/benchPage.ts", import.meta.url));
const calibrateEntry = fileURLToPath(new URL("../browser/calibratePage.ts", import.meta.url));

/** The site's search script, bundled from lib/browser (which imports lib/core's nearbyLines). */
export async function bundleBrowserScript(outFile: string): Promise<void> {
  await bundle(entry, outFile);
}

/** The bench pages' script: lib/atlas's cellLinesOfModel and lib/core's cell spectrum, in the browser. */
export async function bundleBenchScript(outFile: string): Promise<void> {
  await bundle(benchEntry, outFile);
}

/** The calibrate page's script: lib/spectrumFile's readers and lib/atlas's calibrateMeasuredSpectrum, in the browser. */
export async function bundleCalibrateScript(outFile: string): Promise<void> {
  await bundle(calibrateEntry, outFile);
}

async function bundle(entryPoint: string, outFile: string): Promise<void> {
  await build({
    entryPoints: [entryPoint],
    outfile: outFile,
    bundle: true,
    format: "iife",
    target: ["es2020"],
    minify: true,
    legalComments: "none",
    logLevel: "silent",
    // No source paths or timestamps end up in the bundle, so it is byte-identical between builds.
    sourcemap: false,
  });
}
