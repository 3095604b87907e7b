// Child process of the build benchmarks: one cold build, timings and peak memory back to the parent.
import { buildSite } from "../lib/build/index.ts";
import { reportToParent } from "./childProcess.ts";

const { moleculesDir, outDir, sheets } = JSON.parse(process.argv[2]) as { moleculesDir: string; outDir: string; sheets: boolean };
const report = await buildSite({ moleculesDir, outDir, sheets, build: { version: "0.0.0-bench", commit: "bench", dateIso: "2026-01-01T00:00:00Z" } });
reportToParent({
  timings: report.timings,
  pages: report.pages,
  entries: report.entries,
  sheets: report.sheets,
  molecules: report.molecules,
  lines: report.lineIndex,
});
