// `npm run bench`: prints figures with their targets. Never part of the tests: machines are noisy.
import { benchCoreLines } from "./coreLines.ts";

const sections: Array<{ name: string; run: () => Promise<string[]> | string[] }> = [
  {
    name: "core: full bands (positions, uncertainties, populations, intensities), one core",
    run: () => {
      const r = benchCoreLines();
      return [`${(r.linesPerSecond / 1e6).toFixed(2)} million lines/s (${r.lines} lines in ${r.seconds.toFixed(2)} s); target ≥ 2 million lines/s`];
    },
  },
];

const only = process.argv[2];
for (const section of sections) {
  if (only && !section.name.startsWith(only)) continue;
  console.log(`\n## ${section.name}`);
  for (const line of await section.run()) console.log(`  ${line}`);
}
