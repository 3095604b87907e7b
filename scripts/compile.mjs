// Compiles lib/ once (tsc, types not checked here: `npm run typecheck` does that), writing each
// .js beside its .ts so paths relative to a module (molecules/, content/, templates/) stay true,
// then stamps the time; bin/compiled.js runs the output only while it is newer than every source.
import { spawnSync } from "node:child_process";
import { readdirSync, rmSync, utimesSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { createRequire } from "node:module";
import { eleventyConfigSource, libDir, stampPath } from "../bin/compiled.js";

/** Every .js under lib/ is compiled output (no JavaScript source lives there): removed first, so a deleted module leaves nothing behind. */
function removeCompiled(dir) {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) removeCompiled(path);
    else if (entry.name.endsWith(".js")) rmSync(path);
  }
}

const require = createRequire(import.meta.url);
rmSync(stampPath, { force: true });
removeCompiled(libDir);
rmSync(eleventyConfigSource.replace(/\.ts$/, ".js"), { force: true });
const started = Date.now();
const tsc = require.resolve("typescript/bin/tsc");
const result = spawnSync(process.execPath, [tsc, "-p", new URL("../tsconfig.build.json", import.meta.url).pathname], { stdio: "inherit" });
if (result.status !== 0) {
  console.error("bandatlas: compiling lib/ failed (see above); the command will run the TypeScript through tsx instead");
  process.exit(result.status ?? 1);
}
// The stamp is dated from the start, so a source saved while tsc ran counts as newer.
writeFileSync(stampPath, `${new Date(started).toISOString()}\n`);
utimesSync(stampPath, new Date(started), new Date(started));
console.log(`compiled lib/ in ${((Date.now() - started) / 1000).toFixed(1)} s`);
