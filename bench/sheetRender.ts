import { atlasEntry, standardTemperaturesK } from "../lib/atlas/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { renderBenchSheet } from "../lib/sheet/renderBenchSheet.ts";
import { paperNames } from "../lib/sheet/paper.ts";

/**
 * CPU time of one bench sheet on one core: every shipped entry on both papers, rendered on this
 * thread (after one warm-up pass, so module loading and font parsing are not counted).
 */
export async function benchSheetRender(): Promise<string[]> {
  const molecules = loadMoleculesOrThrow(shippedMoleculesDir);
  const requests = molecules.flatMap((molecule) =>
    molecule.species.flatMap((species) =>
      standardTemperaturesK.flatMap((temperatureK) => {
        const entry = atlasEntry(molecule, species, temperatureK);
        return paperNames.map((paper) => ({ molecule, entry, paper, build: { version: "0.0.0-bench", commit: "bench", dateIso: "2026-01-01T00:00:00Z" } }));
      }),
    ),
  );
  await renderBenchSheet(requests[0]);
  const cpu = process.cpuUsage();
  const started = performance.now();
  let bytes = 0;
  for (const request of requests) bytes += (await renderBenchSheet(request)).length;
  const used = process.cpuUsage(cpu);
  const cpuMs = (used.user + used.system) / 1000 / requests.length;
  const wallMs = (performance.now() - started) / requests.length;
  return [
    `${requests.length} sheets on one thread: ${cpuMs.toFixed(1)} ms CPU each (${wallMs.toFixed(1)} ms wall), ${(bytes / requests.length / 1024).toFixed(0)} KiB each; target ≤ 50 ms of one core`,
  ];
}
