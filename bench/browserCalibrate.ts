import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { serveFolder } from "../lib/build/staticServer.ts";
import { launchChromium } from "./benchBrowser.ts";
import { calibrateBenchCsv, calibrateBenchPoints } from "./calibrateSpectrum.ts";
import { runBuildChild, seconds } from "./childProcess.ts";

/**
 * The website's calibrate page in Chromium on the invented 65 536-point CO spectrum of the Node
 * figure: the time the page itself reports, from the file's text to the result drawn (reading,
 * peaks, the predicted spectrum, assignment, fit, table and both plots), on a fresh page each
 * time so nothing computed before is reused. Target ≤ 1 s.
 */
export async function benchBrowserCalibrate(runs: number): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-bench-calibrate-"));
  const site = join(work, "site");
  const server = await serveFolder(site);
  const base = server.base;
  try {
    const built = await runBuildChild<{ wallMs: number }>({ moleculesDir: shippedMoleculesDir, outDir: site, sheets: false });
    const file = join(work, "bench-co.csv");
    writeFileSync(file, calibrateBenchCsv());
    const browser = await launchChromium();
    const times: number[] = [];
    let summary = "";
    try {
      for (let i = 0; i < runs; i++) {
        const page = await browser.newPage();
        await page.goto(base + "calibrate/");
        await page.selectOption("#gas", "co");
        await page.setInputFiles("#calibrate-file", file);
        await page.waitForFunction(() => ["ready", "error"].includes(document.querySelector<HTMLElement>("[data-state]")?.dataset.state ?? ""), null, {
          timeout: 60_000,
        });
        const status = (await page.textContent("#calibrate-status")) ?? "";
        const ms = /Calibrated in (\d+) ms/.exec(status);
        if (!ms) throw new Error(`the page did not calibrate: ${status} ${(await page.textContent("#calibrate-alert")) ?? ""}`);
        times.push(Number(ms[1]));
        summary = await page.$eval("#calibrate-correction", (box) => Array.from(box.children, (c) => c.textContent?.trim()).join("; "));
        await page.close();
      }
    } finally {
      await browser.close();
    }
    const sorted = [...times].sort((a, b) => a - b);
    return [
      `site built in ${seconds(built.wallMs)} (no sheets)`,
      `${sorted[Math.floor(sorted.length / 2)]} ms median (min ${sorted[0]}, max ${sorted[sorted.length - 1]}) over ${runs} fresh pages for ${calibrateBenchPoints} points${summary ? `: ${summary}` : ""}; target ≤ 1000 ms`,
    ];
  } finally {
    await server.close();
    rmSync(work, { recursive: true, force: true });
  }
}
