import { spawn } from "node:child_process";
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadNote, repoDir, seconds } from "./childProcess.ts";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function pageHas(path: string, marker: string): boolean {
  try {
    return readFileSync(path, "utf8").includes(marker);
  } catch {
    return false; // between the two renames of the swap
  }
}

/**
 * `bandatlas serve` on a copy of the shipped molecules: the time from saving one molecule file
 * (its name edited) to its molecule page and one of its species pages carrying the edit on disk.
 */
export async function benchIncremental(saves: number): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-bench-serve-"));
  const molecules = join(work, "molecules");
  const site = join(work, "site");
  cpSync(shippedMoleculesDir, molecules, { recursive: true });
  const port = 20000 + Math.floor(Math.random() * 20000);
  const child = spawn(
    process.execPath,
    [fileURLToPath(new URL("../bin/bandatlas.js", import.meta.url)), "serve", "--port", String(port), "--molecules", molecules, "--out", site],
    { cwd: repoDir, stdio: ["ignore", "pipe", "pipe"] },
  );
  let output = "";
  child.stdout.on("data", (d) => (output += d));
  child.stderr.on("data", (d) => (output += d));
  try {
    const firstStarted = performance.now();
    while (!/built site\/ in/.test(output)) {
      if (child.exitCode !== null) throw new Error(`bandatlas serve stopped:\n${output}`);
      await sleep(20);
    }
    const firstMs = performance.now() - firstStarted;
    const file = join(molecules, "hf.yaml");
    const original = readFileSync(file, "utf8");
    const moleculePage = join(site, "molecules/hf/index.html");
    const times: number[] = [];
    for (let k = 1; k <= saves; k++) {
      await sleep(500);
      const marker = `edit-${k}-${Date.now()}`;
      const builtBefore = (output.match(/built site\/ in/g) ?? []).length;
      const started = performance.now();
      writeFileSync(file, original.replace(/^name: (.*)$/m, `name: $1 ${marker}`));
      const deadline = started + 60_000;
      for (;;) {
        if (performance.now() > deadline) throw new Error(`no rebuilt page after 60 s:\n${output.slice(-2000)}`);
        const speciesDir = existsSync(join(site, "molecules/hf")) ? readdirSync(join(site, "molecules/hf")).find((d) => d.endsWith("-296K")) : undefined;
        if (speciesDir && pageHas(moleculePage, marker) && pageHas(join(site, "molecules/hf", speciesDir, "index.html"), marker)) break;
        await sleep(5);
      }
      times.push(performance.now() - started);
      while ((output.match(/built site\/ in/g) ?? []).length <= builtBefore) await sleep(10);
    }
    times.sort((a, b) => a - b);
    return [
      `machine: ${await loadNote()}`,
      `first build while serving: ${seconds(firstMs)} (Node start included)`,
      `saved molecule file → its pages rebuilt on disk: median ${seconds(times[Math.floor(times.length / 2)])} of ${saves} saves (fastest ${seconds(times[0])}, slowest ${seconds(times[times.length - 1])}); target ≤ 1 s`,
    ];
  } finally {
    child.kill("SIGINT");
    await new Promise((r) => child.once("exit", r));
    rmSync(work, { recursive: true, force: true });
  }
}
