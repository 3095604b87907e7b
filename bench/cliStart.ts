// The command line as a technician runs it: wall time of whole `node bin/bandatlas.js …`
// processes beside a bare `node -e 0`, measured side by side in one run. The compiled lib/ must
// be fresh (npm run compile); otherwise the command falls back to tsx and the figures say so.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { compiledIsFresh } from "../bin/compiled.js";
import { calibrateBenchCsv, calibrateBenchPoints } from "./calibrateSpectrum.ts";
import { repoDir } from "./childProcess.ts";
import { timedRuns } from "./timedRuns.ts";

function medianMs(args: string[], repeats: number): number {
  const run = () => {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, args, { cwd: repoDir, encoding: "utf8" });
    if (r.status !== 0) throw new Error(`${args.join(" ")} exited ${r.status}: ${r.stderr}`);
    return performance.now() - t0;
  };
  const times = Array.from({ length: repeats }, run).sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

export function benchCliStart(): string[] {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-bench-cli-"));
  try {
    const file = join(work, "co-65536.csv");
    writeFileSync(file, calibrateBenchCsv());
    const bin = join(repoDir, "bin", "bandatlas.js");
    timedRuns(() => medianMs(["-e", "0"], 1), 1, 1); // warm the file cache
    const bare = medianMs(["-e", "0"], 9);
    const help = medianMs([bin, "--help"], 9);
    const lines = medianMs([bin, "lines", "co", "--format", "json"], 5);
    const calibrate = medianMs([bin, "calibrate", file, "--gas", "co", "--format", "json"], 3);
    const fresh = compiledIsFresh();
    return [
      `compiled lib/ ${fresh ? "fresh: the command runs it" : "stale or absent: the command fell back to tsx (run npm run compile)"}`,
      `node -e 0: ${bare.toFixed(0)} ms median`,
      `bandatlas --help: ${help.toFixed(0)} ms median, ${(help / bare).toFixed(1)}× node -e 0; target ≤ 4×`,
      `bandatlas lines co --format json: ${lines.toFixed(0)} ms median, ${(lines / bare).toFixed(1)}× node -e 0; target ≤ 10×`,
      `bandatlas calibrate of a ${calibrateBenchPoints}-point CSV: ${calibrate.toFixed(0)} ms median wall, start-up included; target ≤ 1000 ms`,
    ];
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
