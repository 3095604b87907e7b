import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const entry = fileURLToPath(new URL("../browser/siteSearch.ts", import.meta.url));

/** The site's one script, bundled from lib/browser (which imports lib/core's nearbyLines). */
export async function bundleBrowserScript(outFile: string): Promise<void> {
  await build({
    entryPoints: [entry],
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
