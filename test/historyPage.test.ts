// The history page in a real Chromium: a calibration log chosen in the file input is read in the
// browser (nothing uploaded) by the bundled lib/format and drawn as the same chart `bandatlas
// history --out chart.svg` writes; a line that is no record is listed by its number. The log's
// instrument, operator and dates are INVENTED; the spectrum is the real teaching-laboratory HCl
// file in test/fixtures/spectra (MIT). Chromium must be installed; no skipping.
import { appendFileSync, readFileSync } from "node:fs";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { repoDir } from "../lib/build/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { openBuiltSite, type BuiltSiteSession } from "./helpers/chromium.ts";

const spectrumFile = join(repoDir, "test/fixtures/spectra/hcl-dcl-hunter/HCl_spectrum.csv");

let session: BuiltSiteSession;
let page: Page;
let log: string;
const problems: string[] = [];

beforeAll(async () => {
  session = await openBuiltSite("history", problems, { viewport: { width: 1200, height: 900 } });
  page = session.page;
  log = join(session.work, "calibrations.jsonl");
  for (const [date, operator] of [
    ["2025-01-06", "R. Example (invented)"],
    ["2025-02-03", "S. Example (invented)"],
  ]) {
    const r = await runCli([
      "calibrate",
      spectrumFile,
      "--gas",
      "hcl",
      "--instrument",
      "FTIR-7 (invented)",
      "--operator",
      operator,
      "--measured-on",
      date,
      "--tolerance",
      "200 ppm",
      "--log",
      log,
    ]);
    expect(r.exitCode, r.stderr).toBe(0);
  }
  appendFileSync(log, "this line is no record\n");
}, 120_000);

afterAll(async () => {
  await session?.close();
});

/** The words of an SVG's text elements, in order: the chart as a reader sees it. */
const svgWords = (svg: string) =>
  [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1].replace(/&amp;/g, "&").replace(/&lt;/g, "<").replace(/&gt;/g, ">"));

describe("the history page", () => {
  it("is linked from the navigation and draws the CLI's chart from a log chosen in the browser", async () => {
    await page.goto(`${session.base}index.html`);
    await page.click("nav >> text=Calibration history");
    expect(page.url()).toMatch(/\/history\/index\.html$/);
    await page.setInputFiles("#history-file", log);
    await page.waitForFunction(() => document.getElementById("history")!.dataset.state === "shown", undefined, { timeout: 30_000 });
    expect(await page.locator("#history-problems").textContent()).toBe("calibrations.jsonl line 3 not read: not JSON: this line is no record");
    const svgPath = join(session.work, "chart.svg");
    const cli = await runCli(["history", log, "--out", svgPath]);
    expect(cli.exitCode, cli.stderr).toBe(0);
    const fromCli = svgWords(readFileSync(svgPath, "utf8"));
    const onPage = await page.locator("#history-charts svg text").allTextContents();
    expect(onPage).toEqual(fromCli);
    expect(onPage).toContain("Wavenumber-scale history of FTIR-7 (invented)");
    expect(await page.locator("#history-table tbody tr").count()).toBe(2);
    expect(problems.filter((p) => !/favicon/.test(p))).toEqual([]);
  }, 60_000);
});
