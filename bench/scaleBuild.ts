import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BuildTimings } from "../lib/build/index.ts";
import { loadNote, mb, runBuildChild, seconds } from "./childProcess.ts";
import { writeSyntheticMolecules } from "./syntheticMolecules.ts";

/** Full builds (site and sheets) of N invented molecules, each in a fresh process. */
export async function benchScale(sizes: number[]): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-bench-scale-"));
  const out: string[] = [`machine: ${await loadNote()} at the start`];
  try {
    const runs: Array<{ n: number; wallMs: number; maxRssMb: number }> = [];
    for (const n of sizes) {
      const moleculesDir = writeSyntheticMolecules(join(work, `molecules-${n}`), n);
      const r = await runBuildChild<{ timings: BuildTimings; pages: number; sheets: number }>({
        moleculesDir,
        outDir: join(work, `site-${n}`),
        sheets: true,
      });
      rmSync(join(work, `site-${n}`), { recursive: true, force: true });
      runs.push({ n, wallMs: r.wallMs, maxRssMb: r.maxRssMb });
      const t = r.value.timings;
      out.push(
        `N = ${n}: ${seconds(r.wallMs)} wall, peak memory ${mb(r.maxRssMb)} (${r.value.pages} pages, ${r.value.sheets} sheets; plots ${seconds(t.plotsMs)}, pages ${seconds(t.pagesMs)}, sheets ${seconds(t.sheetsMs)})` +
          (n === 500 ? "; target ≤ 3 min, peak < 1 GB" : n === 2000 ? "; target: peak < 1 GB, as at 500" : ""),
      );
    }
    const first = runs[0];
    const last = runs[runs.length - 1];
    if (runs.length > 1) {
      const growth = last.wallMs / first.wallMs;
      const factor = last.n / first.n;
      out.push(
        `growth ${first.n} → ${last.n}: ${growth.toFixed(2)}× the time for ${factor}× the molecules; target ≤ ${(factor * 1.2).toFixed(0)}× (500 ≤ 12× of 50)`,
      );
    }
    if (runs.length > 1) {
      const peaks = runs.map((r) => r.maxRssMb);
      const spread = Math.max(...peaks) / Math.min(...peaks);
      out.push(
        `peak memory from N = ${first.n} to ${last.n}: ${peaks.map((m) => mb(m)).join(" → ")}, largest/smallest ${spread.toFixed(2)}; target ≤ 1.25 (memory bounded by the work in flight, not the atlas)`,
      );
    }
    out.push(`machine: ${await loadNote()} at the end`);
    return out;
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
