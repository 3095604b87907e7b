import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BuildTimings } from "../lib/build/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadNote, mb, runBuildChild, runChild, seconds } from "./childProcess.ts";

interface BuildChildValue {
  timings: BuildTimings;
  pages: number;
  entries: number;
  sheets: number;
}

/**
 * The shipped atlas built cold (a fresh Node process each time): with sheets, without sheets,
 * and a bare Eleventy build of as many trivial pages in the same run, so the ratio is measured
 * under one and the same machine load.
 */
export async function benchShippedBuild(): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-bench-shipped-"));
  try {
    const before = await loadNote();
    const full = await runBuildChild<BuildChildValue>({ moleculesDir: shippedMoleculesDir, outDir: join(work, "full"), sheets: true });
    // Site and baseline twice, interleaved, the faster of each counted: the machine is shared.
    const sites = [];
    const bares = [];
    for (let round = 0; round < 2; round++) {
      sites.push(await runBuildChild<BuildChildValue>({ moleculesDir: shippedMoleculesDir, outDir: join(work, `site-${round}`), sheets: false }));
      bares.push(await runChild<{ inProcessMs: number }>("./bareEleventyChild.ts", { pages: sites[0].value.pages }));
    }
    const site = sites.reduce((a, b) => (b.wallMs < a.wallMs ? b : a));
    const bare = bares.reduce((a, b) => (b.wallMs < a.wallMs ? b : a));
    const s = site.value.timings;
    const t = full.value.timings;
    const perSheetMs = full.value.sheets ? t.sheetsMs / full.value.sheets : 0;
    const ratio = site.wallMs / bare.wallMs;
    return [
      `machine: ${before} before, ${await loadNote()} after`,
      `full cold build (site and sheets): ${seconds(full.wallMs)} wall, peak memory ${mb(full.maxRssMb)}; target ≤ 10 s`,
      `  ${full.value.pages} pages, ${full.value.entries} species pages, ${full.value.sheets} sheets`,
      `  stages: loading ${seconds(t.loadingMs)}, physics ${seconds(t.physicsMs)}, plots ${seconds(t.plotsMs)}, files ${seconds(t.filesMs)}, pages (Eleventy) ${seconds(t.pagesMs)}, sheets ${seconds(t.sheetsMs)}, link check+swap ${seconds(t.finishMs)}; Node start and imports ${seconds(full.wallMs - t.totalMs)}`,
      `  sheets: ${perSheetMs.toFixed(1)} ms wall each (${full.value.sheets} in ${seconds(t.sheetsMs)}); target ≤ 50 ms of one core each, on both cores`,
      `site build without sheets: ${seconds(site.wallMs)} wall (faster of ${sites.map((r) => seconds(r.wallMs)).join(", ")}), peak ${mb(site.maxRssMb)}`,
      `  stages: loading ${seconds(s.loadingMs)}, physics ${seconds(s.physicsMs)}, plots ${seconds(s.plotsMs)}, files ${seconds(s.filesMs)}, pages (Eleventy) ${seconds(s.pagesMs)}, link check+swap ${seconds(s.finishMs)}; Node start and imports ${seconds(site.wallMs - s.totalMs)}`,
      `bare Eleventy, ${site.value.pages} trivial pages: ${seconds(bare.wallMs)} wall (faster of ${bares.map((r) => seconds(r.wallMs)).join(", ")}) (${seconds(bare.value.inProcessMs)} after Node start), peak ${mb(bare.maxRssMb)}`,
      `ratio site / bare Eleventy: ${ratio.toFixed(2)}×; target ≤ 2×`,
    ];
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
