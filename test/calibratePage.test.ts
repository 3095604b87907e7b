// The calibrate page in a real Chromium: a measured HCl spectrum (test/fixtures/spectra, MIT)
// chosen in the file input is calibrated in the browser by the bundled lib/spectrumFile, lib/atlas
// and lib/format, and must give what `bandatlas calibrate` gives (in-process): the same correction
// box line, the same JSON and text downloads byte for byte. A file that is no spectrum and a wrong
// gas show their one sentence in the alert area. Chromium must be installed; no skipping.
import { readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { repoDir } from "../lib/build/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { openBuiltSite, type BuiltSiteSession } from "./helpers/chromium.ts";

const spectrumFile = join(repoDir, "test/fixtures/spectra/hcl-dcl-hunter/HCl_spectrum.csv");
const moleculeFile = join(repoDir, "molecules/hcl.yaml");

async function cli(...args: string[]): Promise<string> {
  const { stdout, stderr, exitCode } = await runCli(args);
  if (exitCode !== 0) throw new Error(`bandatlas ${args.join(" ")}: ${stderr}`);
  return stdout;
}

/** The CLI's one-sentence refusal, without its "bandatlas calibrate: " prefix. */
async function cliRefusal(...args: string[]): Promise<string> {
  const { stderr, exitCode } = await runCli(args);
  expect(exitCode, stderr).toBe(2);
  return stderr.replace(/^bandatlas calibrate: /, "").trim();
}

let session: BuiltSiteSession;
let base: string;
let work: string;
let page: Page;
const problems: string[] = [];

beforeAll(async () => {
  session = await openBuiltSite("calibrate", problems, { acceptDownloads: true, viewport: { width: 1200, height: 900 } });
  ({ work, page, base } = session);
}, 120_000);

afterAll(async () => {
  await session?.close();
});

/** Runs an action that recalculates and waits until that calculation has ended (ready or error). */
async function settled(action: () => Promise<unknown>): Promise<string> {
  const before = Number(await page.locator("#calibrate").getAttribute("data-run"));
  await action();
  await page.waitForFunction(
    (run) => {
      const c = document.getElementById("calibrate")!;
      return Number(c.dataset.run) > run && (c.dataset.state === "ready" || c.dataset.state === "error");
    },
    before,
    { timeout: 60_000 },
  );
  return (await page.locator("#calibrate").getAttribute("data-state"))!;
}

async function download(selector: string): Promise<string> {
  const [file] = await Promise.all([page.waitForEvent("download"), page.click(selector)]);
  return readFileSync((await file.path())!, "utf8");
}

describe("the calibrate page in Chromium", () => {
  it("is linked from the navigation and the home page, and shows the general caution before a gas is chosen", async () => {
    await page.goto(base);
    await page.click("nav >> text=Calibrate a spectrum");
    await page.waitForURL(/calibrate\//);
    await expect(page.locator("h1").textContent()).resolves.toContain("wavenumber scale");
    await page.goto(base);
    expect(await page.locator("main a[href='calibrate/index.html']").count()).toBe(1);
    await page.goto(base + "calibrate/");
    await expect(page.locator("#calibrate-cautions aside:visible").count()).resolves.toBe(1);
    await expect(page.locator("#calibrate-cautions aside:visible").textContent()).resolves.toContain("the atlas does not certify an instrument");
    for (const id of ["gas", "temperatureK", "pressure", "path", "moleFraction", "resolutionCm", "apodization", "model", "calibrate-file", "x", "y"])
      expect(await page.locator(`label[for=${id}]`).count(), id).toBe(1);
    await expect(page.locator("#temperatureK").inputValue()).resolves.toBe("296");
    await expect(page.locator("#pressure").inputValue()).resolves.toBe("20");
    await expect(page.locator("select[name=pressureUnit]").inputValue()).resolves.toBe("Torr");
    await expect(page.locator("#path").inputValue()).resolves.toBe("10");
    await expect(page.locator("#apodization").inputValue()).resolves.toBe("triangular");
    await expect(page.locator("#model").inputValue()).resolves.toBe("scale");
  });

  it("calibrates the measured HCl spectrum exactly as `bandatlas calibrate` does: box line, JSON and text downloads", async () => {
    const json = await cli("calibrate", spectrumFile, "--gas", "hcl", "--format", "json");
    const table = await cli("calibrate", spectrumFile, "--gas", "hcl");
    const boxLine = table
      .split("\n")
      .find((l) => l.startsWith("│ scale k ="))!
      .replace(/^│ /, "")
      .replace(/\s*│$/, "");
    expect(boxLine).toMatch(/^scale k = [+−]\d+(\.\d+)? ± \d+(\.\d+)? ppm$/);

    await page.selectOption("#gas", "hcl");
    await expect(page.locator("#calibrate-cautions aside:visible h2").textContent()).resolves.toContain("Hydrogen chloride");
    await expect(page.locator("#calibrate-cautions aside:visible").textContent()).resolves.toContain(JSON.parse(json).caution);
    const state = await settled(() => page.setInputFiles("#calibrate-file", spectrumFile));
    expect(state, (await page.locator("#calibrate-alert").textContent()) ?? "").toBe("ready");
    await expect(page.locator("#calibrate-correction p").first().textContent()).resolves.toBe(boxLine);
    await expect(page.locator("#calibrate-alert").textContent()).resolves.toBe("");

    // The downloads: the CLI's bytes, so also its numbers (parsed and compared as a second check).
    const pageJson = await download("#calibrate-json");
    expect(JSON.parse(pageJson)).toEqual(JSON.parse(json));
    expect(pageJson).toBe(json);
    expect(await download("#calibrate-txt")).toBe(table);

    // The table and the residual plot show every line of the document, the used ones marked.
    const doc = JSON.parse(json) as { linesUsed: number; lines: Array<{ measured: number | null; used: boolean }> };
    expect(await page.locator("#calibrate-line-table tbody tr").count()).toBe(doc.lines.length);
    expect(await page.locator("#calibrate-line-table tbody tr.used").count()).toBe(doc.linesUsed);
    await expect(page.locator("#calibrate-line-table caption").count()).resolves.toBe(1);
    expect(await page.locator(".residual-plot g.used circle").count()).toBe(doc.linesUsed);
    expect(await page.locator(".residual-plot circle").count()).toBe(doc.lines.filter((l) => l.measured !== null).length);
    // Measured and predicted spectra on the same axes.
    await expect(page.locator("#calibrate-spectra path.signal").count()).resolves.toBe(1);
    await expect(page.locator("#calibrate-spectra path.predicted").count()).resolves.toBe(1);
    await expect(page.locator("#calibrate-spectra-caption").textContent()).resolves.toContain("scaled by one factor to the measured peaks");

    await page.screenshot({ path: join(tmpdir(), "bandatlas-calibrate-page.png"), fullPage: true });
    expect(problems).toEqual([]);
  });

  it("recalculates when a control changes: the offset model gives the CLI's offset line", async () => {
    const table = await cli("calibrate", spectrumFile, "--gas", "hcl", "--model", "offset");
    const offsetLine = table
      .split("\n")
      .find((l) => l.startsWith("│ offset c ="))!
      .replace(/^│ /, "")
      .replace(/\s*│$/, "");
    expect(await settled(() => page.selectOption("#model", "offset"))).toBe("ready");
    await expect(page.locator("#calibrate-correction p").first().textContent()).resolves.toBe(offsetLine);
    expect(await settled(() => page.selectOption("#model", "scale"))).toBe("ready");
    await expect(page.locator("#calibrate-correction p").first().textContent()).resolves.toMatch(/^scale k = /);
  });

  it("refuses the HCl spectrum calibrated as carbon monoxide, with the CLI's sentence and no result", async () => {
    const refusal = await cliRefusal("calibrate", spectrumFile, "--gas", "co");
    expect(await settled(() => page.selectOption("#gas", "co"))).toBe("error");
    const alert = (await page.locator("#calibrate-alert").textContent())!;
    expect(alert.toLowerCase()).toContain(refusal.toLowerCase());
    expect(alert).toMatch(/^[A-Z].*\.$/s);
    expect(alert).not.toContain("\n");
    await expect(page.locator("#calibrate-result").isHidden()).resolves.toBe(true);
    await expect(page.locator("#calibrate-cautions aside:visible h2").textContent()).resolves.toContain("Carbon monoxide");
    expect(await settled(() => page.selectOption("#gas", "hcl"))).toBe("ready");
    await expect(page.locator("#calibrate-alert").textContent()).resolves.toBe("");
  });

  it("shows a file that is no spectrum as its one sentence: a molecule file, an invented one-column CSV", async () => {
    const oneColumn = join(work, "one-column.csv");
    writeFileSync(oneColumn, "# invented: one column only\n2650\n2651\n2652\n2653\n");
    for (const file of [moleculeFile, oneColumn]) {
      const refusal = await cliRefusal("calibrate", file, "--gas", "hcl");
      expect(await settled(() => page.setInputFiles("#calibrate-file", file))).toBe("error");
      const alert = (await page.locator("#calibrate-alert").textContent())!;
      expect(alert.toLowerCase()).toContain(refusal.toLowerCase());
      await expect(page.locator("#calibrate-result").isHidden()).resolves.toBe(true);
    }
    expect(problems).toEqual([]);
  });
});
