import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import { serveFolder } from "../lib/build/staticServer.ts";
import { launchChromium } from "./benchBrowser.ts";
import { standardTemperaturesK } from "../lib/atlas/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { lineIndex } from "../lib/site/searchIndexes.ts";
import { temperatureToken } from "../lib/shared/sitePaths.ts";
import { loadNote, runBuildChild, seconds } from "./childProcess.ts";
import { writeSyntheticMolecules } from "./syntheticMolecules.ts";

/**
 * The home page's wavenumber search over an atlas of N invented molecules, in Chromium: the
 * index's compressed size per line (gzip, as a web server sends it) and the time of a query
 * from submitting the form to the result table shown. Only the search indexes depend on the
 * number of molecules, so the shipped site is built and its line indexes are replaced by the
 * indexes of the N-molecule atlas, made by the build's own function (pages, plots and sheets of
 * 500 molecules would take many minutes and change nothing here).
 */
export async function benchBrowserSearch(n: number, queries: number): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-bench-browser-"));
  const site = join(work, "site");
  const server = await serveFolder(site);
  const base = server.base;
  try {
    const built = await runBuildChild<{ lines: Array<{ temperatureK: number; lines: number }> }>({
      moleculesDir: shippedMoleculesDir,
      outDir: site,
      sheets: false,
    });
    const molecules = loadMoleculesOrThrow(writeSyntheticMolecules(join(work, "molecules"), n));
    const searchDir = join(work, "site/assets/search");
    const indexed = [];
    const started = performance.now();
    for (const temperatureK of standardTemperaturesK) {
      const file = lineIndex(molecules, temperatureK);
      writeFileSync(join(searchDir, `lines-${temperatureToken(temperatureK)}K.json`), JSON.stringify(file));
      indexed.push({ temperatureK, lines: file.count });
    }
    const out = [
      `machine: ${await loadNote()}`,
      `shipped site built in ${seconds(built.wallMs)} (no sheets); line indexes of ${n} invented molecules made in ${seconds(performance.now() - started)} and put in its place`,
    ];
    let totalLines = 0;
    let totalGzip = 0;
    let totalRaw = 0;
    for (const { temperatureK, lines } of indexed) {
      const files = readdirSync(searchDir).filter((f) => f.startsWith(`lines-${temperatureK}K.`));
      const raw = files.reduce((s, f) => s + statSync(join(searchDir, f)).size, 0);
      const gz = files.reduce((s, f) => s + gzipSync(readFileSync(join(searchDir, f))).length, 0);
      totalLines += lines;
      totalGzip += gz;
      totalRaw += raw;
      if (temperatureK === 296)
        out.push(
          `index at 296 K: ${lines} lines, ${raw} bytes, ${gz} gzip = ${(gz / lines).toFixed(2)} bytes/line compressed (${(raw / lines).toFixed(2)} uncompressed)`,
        );
    }
    out.push(
      `index, all temperatures: ${totalLines} lines, ${(totalGzip / totalLines).toFixed(2)} bytes/line compressed (${(totalRaw / totalLines).toFixed(2)} uncompressed); target ≤ 16 bytes/line`,
    );

    const browser = await launchChromium();
    try {
      const page = await browser.newPage();
      await page.goto(base);
      const times: number[] = await page.evaluate(async (count) => {
        const form = document.querySelector<HTMLFormElement>("form[data-search=wavenumber]")!;
        const output = document.getElementById("find-results")!;
        (form.elements.namedItem("temperature") as HTMLSelectElement).value = "296";
        const field = form.elements.namedItem("wavenumber") as HTMLInputElement;
        const result: number[] = [];
        for (let i = 0; i < count; i++) {
          field.value = (1300 + ((i * 977) % 2900) + 0.37).toFixed(2);
          const shown = new Promise<void>((resolve) => {
            const observer = new MutationObserver(() => {
              observer.disconnect();
              resolve();
            });
            observer.observe(output, { childList: true });
          });
          const started = performance.now();
          form.requestSubmit();
          await shown;
          result.push(performance.now() - started);
        }
        return result;
      }, queries);
      const [first, ...rest] = times;
      rest.sort((a, b) => a - b);
      out.push(`first query (fetching and decoding the 296 K index): ${first.toFixed(1)} ms`);
      out.push(
        `query in Chromium over ${n} molecules: median ${rest[Math.floor(rest.length / 2)].toFixed(2)} ms, slowest ${rest[rest.length - 1].toFixed(2)} ms of ${rest.length}; target ≤ 20 ms`,
      );
    } finally {
      await browser.close();
    }
    return out;
  } finally {
    await server.close();
    rmSync(work, { recursive: true, force: true });
  }
}
