// The bench page in a real Chromium: the visitor's cell computed in the browser by the bundled
// lib/atlas + lib/core, against the CLI's numbers (bandatlas spectrum / calibration-lines,
// in-process). Also: the cell model JSON gives the CLI's lines, the species pages carry the
// calibration marks. Chromium must be installed (scripts/ensure-test-tools.sh); no skipping.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { calibrationMarks, cellLineSet, cellLinesOfModel, cellModel, defaultCellConditions } from "../lib/atlas/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { runCli } from "../lib/cli/main.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { peakShiftDigits } from "../lib/format/index.ts";
import { openBuiltSite, type BuiltSiteSession } from "./helpers/chromium.ts";

async function cli(...args: string[]): Promise<string> {
  const { stdout, stderr, exitCode } = await runCli(args);
  if (exitCode !== 0) throw new Error(`bandatlas ${args.join(" ")}: ${stderr}`);
  return stdout;
}

const molecules = loadMoleculesOrThrow(shippedMoleculesDir);

describe("the cell model the build writes for the bench page", () => {
  it("gives, after a JSON round trip, exactly the lines the CLI computes (every molecule, two temperatures)", () => {
    for (const molecule of molecules) {
      const model = JSON.parse(JSON.stringify(cellModel(molecule)));
      for (const temperatureK of [296, 700]) {
        const conditions = { ...defaultCellConditions, temperatureK, moleFraction: 0.3 };
        const browser = cellLinesOfModel(model, conditions);
        const direct = cellLineSet(molecule, conditions);
        expect(browser.lines.length, molecule.id).toBeGreaterThan(0);
        expect(browser).toEqual(direct);
      }
    }
  });
});

let session: BuiltSiteSession;
let base: string;
let work: string;
let site: string;
let page: Page;
const problems: string[] = [];

beforeAll(async () => {
  session = await openBuiltSite("bench", problems);
  ({ work, site, page, base } = session);
}, 120_000);

afterAll(async () => {
  await session?.close();
});

const ready = (resolution: string) =>
  page.waitForFunction(
    (r) => {
      const b = document.getElementById("bench")!;
      return b.dataset.state === "ready" && b.dataset.resolution === r;
    },
    resolution,
    { timeout: 60_000 },
  );

describe("the CO bench page in Chromium", () => {
  it("shows the hazard caution, the defaults of a 10 cm cell, and a plot with the calibration-grade list", async () => {
    await page.goto(base + "molecules/co/bench/index.html?fromCm=2100&toCm=2200");
    await ready("0.5");
    await expect(page.locator(".caution h2").textContent()).resolves.toContain("Carbon monoxide");
    await expect(page.locator("#temperatureK").inputValue()).resolves.toBe("296");
    await expect(page.locator("#pressure").inputValue()).resolves.toBe("20");
    await expect(page.locator("select[name=pressureUnit]").inputValue()).resolves.toBe("Torr");
    await expect(page.locator("#path").inputValue()).resolves.toBe("10");
    await expect(page.locator("#lineShape").inputValue()).resolves.toBe("triangular");
    await expect(page.locator(".spectrum-plot .axis-label").first().textContent()).resolves.toContain("cm⁻¹");
    expect(await page.locator("#bench-lines tbody tr").count()).toBeGreaterThan(5);
    expect(problems).toEqual([]);
  });

  it("changes plot and list with the resolution, keeps it in the URL, and reads off the CLI's transmittance", async () => {
    const pathAt05 = await page.locator(".spectrum-plot path.signal").getAttribute("d");
    const listAt05 = await page.locator("#bench-lines tbody").innerText();
    await page.fill("#resolutionCm", "2");
    await page.press("#resolutionCm", "Enter");
    await ready("2");
    expect(await page.locator(".spectrum-plot path.signal").getAttribute("d")).not.toBe(pathAt05);
    expect(await page.locator("#bench-lines tbody").innerText()).not.toBe(listAt05);
    expect(new URL(page.url()).searchParams.get("resolutionCm")).toBe("2");

    // The same cell on the command line; the page rounds with the CLI's digit formatters.
    const settings = [
      "--temperature",
      "296",
      "--pressure",
      "20",
      "Torr",
      "--path",
      "10",
      "cm",
      "--mole-fraction",
      "1",
      "--resolution",
      "2",
      "--apodization",
      "triangular",
      "--from",
      "2100",
      "--to",
      "2200",
    ];
    const spectrum = JSON.parse(await cli("spectrum", "co", ...settings, "--format", "json")) as {
      samples: Array<{ wavenumber: number; transmittance: number }>;
    };
    // The deepest sample (a line centre) and one in a wing: both must agree to the printed digits.
    const deepest = spectrum.samples.reduce((a, b) => (b.transmittance < a.transmittance ? b : a));
    const wing = spectrum.samples[Math.floor(spectrum.samples.length / 3)];
    for (const sample of [deepest, wing]) {
      await page.fill("#at", String(sample.wavenumber));
      await page.dispatchEvent("#at", "change");
      await expect(page.locator("#bench-probe-wavenumber").textContent()).resolves.toBe(sample.wavenumber.toFixed(4));
      expect(Number(await page.locator("#bench-probe-value").textContent())).toBe(sample.transmittance);
    }
    expect(deepest.transmittance).toBeLessThan(0.95);

    const calibration = JSON.parse(await cli("calibration-lines", "co", ...settings, "--format", "json")) as {
      lines: Array<{ label: string; species: string; peakShiftCm: number | null }>;
    };
    const rows = await page.locator("#bench-lines tbody tr").evaluateAll((trs) => trs.map((tr) => [...tr.children].map((c) => c.textContent!)));
    expect(rows.map((r) => `${r[1]} ${r[0]} ${r[7]}`)).toEqual(
      calibration.lines.map((l) => `${l.species} ${l.label} ${l.peakShiftCm === null ? "no peak" : peakShiftDigits(l.peakShiftCm)}`),
    );
    expect(problems).toEqual([]);
  });

  it("refuses an impossible setting with a plain message", async () => {
    await page.goto(base + "molecules/co/bench/index.html?moleFraction=1.5");
    await page.waitForFunction(() => document.getElementById("bench")!.dataset.state === "error");
    await expect(page.locator("#bench-status").textContent()).resolves.toContain("Mole fraction “1.5”: must be above 0 and at most 1.");
  });
});

describe("a molecule without cited intensities", () => {
  it("says no transmittance can be given and shows the relative absorbance, labelled", async () => {
    // Hydrogen iodide: no band intensity could be cited for it (molecules/SOURCES-NOTES.md).
    await page.goto(base + "molecules/hi/bench/index.html");
    await ready("0.5");
    await expect(page.locator("#bench-relative").textContent()).resolves.toContain("No transmittance for Hydrogen iodide.");
    await expect(page.locator(".spectrum-plot .axis-label").nth(1).textContent()).resolves.toBe("relative absorbance (peak = 1)");
    // No cited measured line validates the HI constants: no line is calibration grade, and the page says why.
    expect(await page.locator("#bench-lines tbody tr").count()).toBe(0);
    await expect(page.locator("#bench-lines caption").textContent()).resolves.toMatch(/^0 calibration-grade lines .*validated against cited measured lines/);
    expect(problems).toEqual([]);
  });
});

describe("calibration marks on the species pages", () => {
  it("marks the 296 K lines with the resolutions and peak shifts of calibrationMarks, and states conditions and flags", () => {
    const co = molecules.find((m) => m.id === "co")!;
    const marks = calibrationMarks(co);
    const html = readFileSync(join(site, "molecules/co/12C16O-296K/index.html"), "utf8");
    expect(html).toContain("calibration grade at");
    expect(html).toContain("a 10 cm cell of the pure gas at 296 K and 20 Torr");
    expect(html).toContain("Typical broadening:");
    // R(7) of 12C16O, the strongest line: calibration grade at every default resolution.
    const row = html.match(/<tr id="line-1-0-R7"[\s\S]*?<\/tr>/)![0];
    for (const r of marks.byResolution) {
      const line = r.lines.find((l) => l.species === "12C16O" && l.label === "R(7)");
      if (line) expect(row).toContain(`${r.resolutionCm} (${peakShiftDigits(line.peakShiftCm)})`);
    }
    const other = readFileSync(join(site, "molecules/co/12C16O-1000K/index.html"), "utf8");
    expect(other).toContain("Calibration-grade lines are marked on the");
    expect(other).not.toContain("calibration grade at");
    expect(readFileSync(join(site, "molecules/co/index.html"), "utf8")).toContain('href="bench/index.html"');
  });
});

describe("calibration marks on the bench sheets", () => {
  it("names the 296 K sheet's calibration-grade lines per default resolution, with the cell and the flags", async () => {
    const { renderBenchSheet } = await import("../lib/sheet/index.ts");
    const { atlasEntry } = await import("../lib/atlas/index.ts");
    const { execFileSync } = await import("node:child_process");
    const { writeFileSync } = await import("node:fs");
    const co = molecules.find((m) => m.id === "co")!;
    const marks = calibrationMarks(co);
    const build = { version: "0.0.0", commit: "test", dateIso: "2026-01-01T00:00:00Z" };
    const file = join(work, "co-296.pdf");
    writeFileSync(file, await renderBenchSheet({ molecule: co, entry: atlasEntry(co, co.species[0], 296), paper: "a4", build, calibration: marks }));
    // pdftotext (poppler-utils) reads the sheet back as a reader would.
    const text = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("Recommended for calibration");
    expect(text).toContain("a 10 cm cell of the pure gas at 296 K and 20 Torr");
    // Only the validated low-J lines qualify; at 1 cm⁻¹ some are isolated, at 4 cm⁻¹ none is
    // (12C16O 1-0 lines are 3.5–4 cm⁻¹ apart near the origin, fact of the trade).
    const at1 = marks.byResolution
      .find((r) => r.resolutionCm === 1)!
      .lines.filter((l) => l.species === "12C16O" && l.band === "1-0")
      .map((l) => l.label);
    expect(at1.length).toBeGreaterThan(0);
    expect(text).toContain(`at 1 cm⁻¹`);
    for (const label of at1) expect(text).toContain(label);
    expect(text).toContain("at 4 cm⁻¹: none");
    expect(text).toMatch(/typical \(not measured\) pressure-\s?broadening/);
  });
});
