// The command runs the JavaScript that `npm run compile` (and `npm ci`, through `prepare`) writes
// beside each TypeScript source in lib/, when that output is at least as new as every source; else
// it falls back to compiling on the fly through tsx (correct, slower: about 1–3 s per command), so
// an edited source is never run stale.
import { readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

export const libDir = fileURLToPath(new URL("../lib", import.meta.url));
export const stampPath = join(libDir, ".compiled-at");
/** The Eleventy configuration, compiled with lib/ (lib/site imports it). */
export const eleventyConfigSource = fileURLToPath(new URL("../eleventy.config.ts", import.meta.url));

function newestSourceMs(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSourceMs(path));
    else if (entry.name.endsWith(".ts") || entry.name.endsWith(".mjs")) newest = Math.max(newest, statSync(path).mtimeMs);
  }
  return newest;
}

/** True when lib/'s compiled JavaScript is present and no source is newer than it. */
export function compiledIsFresh() {
  let stampMs;
  try {
    stampMs = statSync(stampPath).mtimeMs;
  } catch {
    return false;
  }
  return Math.max(newestSourceMs(libDir), statSync(eleventyConfigSource).mtimeMs) <= stampMs;
}
