import { bandLines, partitionFunction, type DiatomicSpeciesModel } from "../lib/core/index.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";

/**
 * Lines per second for full bands (positions, uncertainties, populations, intensities), one core:
 * every shipped diatomic species, fundamental and first overtone, down to 1e-6 of the strongest line, at 296 K and 1000 K.
 */
export function benchCoreLines(): { linesPerSecond: number; lines: number; seconds: number } {
  const species = loadMoleculesOrThrow(shippedMoleculesDir)
    .flatMap((m) => m.species.map((s) => s.model))
    .filter((model): model is DiatomicSpeciesModel => model.structure === "diatomic");
  const work = species.flatMap((model) => [296, 1000].map((temperatureK) => ({ model, temperatureK, q: partitionFunction(model.dunham, temperatureK) })));
  const run = () => {
    let count = 0;
    for (const { model, temperatureK, q } of work) {
      count += bandLines(model, { vUpper: 1, vLower: 0 }, { temperatureK, minRelative: 1e-6, partitionFunction: q }).lines.length;
      count += bandLines(model, { vUpper: 2, vLower: 0 }, { temperatureK, minRelative: 1e-6, partitionFunction: q }).lines.length;
    }
    return count;
  };
  for (let i = 0; i < 200; i++) run();
  let lines = 0;
  const start = process.hrtime.bigint();
  let elapsed = 0;
  while (elapsed < 2) {
    lines += run();
    elapsed = Number(process.hrtime.bigint() - start) / 1e9;
  }
  return { linesPerSecond: lines / elapsed, lines, seconds: elapsed };
}
