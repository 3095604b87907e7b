// `npm run bench [-- [--quick] [section-prefix]]`: prints figures with their targets. Never part
// of the tests: machines are noisy. The full run takes many minutes (the 500- and 2000-molecule builds);
// --quick uses smaller atlases (scale 10 and 20, browser 50) and finishes in one to two minutes.
import { benchBrowserCalibrate } from "./browserCalibrate.ts";
import { benchBrowserSearch } from "./browserSearch.ts";
import { benchCalibrateSpectrum } from "./calibrateSpectrum.ts";
import { benchCliStart } from "./cliStart.ts";
import { benchCellTransmittance } from "./cellTransmittance.ts";
import { benchCoreLines } from "./coreLines.ts";
import { benchIncremental } from "./incrementalBuild.ts";
import { benchScale } from "./scaleBuild.ts";
import { benchSheetRender } from "./sheetRender.ts";
import { benchShippedBuild } from "./shippedBuild.ts";

const args = process.argv.slice(2);
const known = ["--quick", "--help", "-h"];
if (args.includes("--help") || args.includes("-h") || args.some((a) => a.startsWith("-") && !known.includes(a))) {
  console.log(`npm run bench [-- [--quick] [section-prefix]]

Prints every speed figure with its target. Sections: core, cell, calibrate, cli, sheets, build, scale, incremental,
browser (a prefix picks them). The full run builds atlases of 50, 500 and 2000 invented molecules
and takes many minutes; --quick uses 10 and 20 (and 50 for the browser) instead.`);
  process.exit(args.includes("--help") || args.includes("-h") ? 0 : 2);
}
const quick = args.includes("--quick");
const only = args.find((a) => !a.startsWith("--"));

const sections: Array<{ name: string; run: () => Promise<string[]> | string[] }> = [
  {
    name: "core: full bands (positions, uncertainties, populations, intensities), one core",
    run: () => {
      const r = benchCoreLines();
      return [`${(r.linesPerSecond / 1e6).toFixed(2)} million lines/s (${r.lines} lines in ${r.seconds.toFixed(2)} s); target ≥ 2 million lines/s`];
    },
  },
  { name: "cell: CO transmittance, 300 cm⁻¹ at 0.002 cm⁻¹, all species, FT 0.5 cm⁻¹, Node", run: benchCellTransmittance },
  { name: "calibrate: a 65 536-point CO spectrum from CSV text to the correction, Node", run: benchCalibrateSpectrum },
  { name: "cli: whole commands beside a bare node start", run: benchCliStart },
  { name: "sheets: one bench sheet, one core", run: benchSheetRender },
  { name: "build: shipped atlas, cold, beside a bare Eleventy baseline", run: benchShippedBuild },
  { name: "scale: invented molecules, full builds", run: () => benchScale(quick ? [10, 20] : [50, 500, 2000]) },
  { name: "incremental: bandatlas serve, one molecule file saved", run: () => benchIncremental(quick ? 2 : 5) },
  { name: "browser: wavenumber search in Chromium", run: () => benchBrowserSearch(quick ? 50 : 500, 21) },
  { name: "browser: calibrate page in Chromium, a 65 536-point CO spectrum", run: () => benchBrowserCalibrate(quick ? 3 : 7) },
];

const started = performance.now();
for (const section of sections) {
  if (only && !section.name.startsWith(only)) continue;
  console.log(`\n## ${section.name}`);
  for (const line of await section.run()) console.log(`  ${line}`);
}
console.log(`\n(bench ran ${((performance.now() - started) / 1000).toFixed(0)} s${quick ? ", quick mode" : ""})`);
