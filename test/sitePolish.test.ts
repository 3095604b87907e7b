// Issue 21, "First steps": what a new user meets on the home page, the find form, the bench,
// method, molecule and species pages, and the command line's first runs. The site is the shipped
// atlas the global setup built once (test/helpers/globalSetup.ts), served and opened in Chromium.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { benchDefaultRange, cellLineSet, defaultCellConditions, maxSpectrumRangeCm } from "../lib/atlas/index.ts";
import { benchDefaultResolutionCm } from "../lib/build/benchData.ts";
import { runCli } from "../lib/cli/main.ts";
import { benchLimits, readBenchSettings } from "../lib/format/benchSettings.ts";
import { validationSummary } from "../lib/format/index.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { openBuiltSite, type BuiltSiteSession } from "./helpers/chromium.ts";

const molecules = loadMoleculesOrThrow();
const summary = validationSummary(molecules).text;

describe("the promise of calibration says what stands behind it", () => {
  it("README's opening names only validated gases for calibration, and quotes the summary computed from the molecule files", () => {
    const readme = readFileSync(join(import.meta.dirname, "..", "README.md"), "utf8");
    expect(readme).toContain(`> ${summary}`);
    const first = readme.split("\n\n")[1];
    // The gases a cell check is offered for are those with a validated band (from the files).
    for (const name of ["carbon monoxide", "acetylene"]) expect(summary).toMatch(new RegExp(`Validated against cited measured lines: .*${name}`));
    expect(first).toContain("carbon monoxide or acetylene");
    expect(first).not.toContain("CO, HCl, HF, HI or acetylene");
  });
});

describe("one spectrum range limit, and a bench default the page accepts", () => {
  it("opens every molecule's bench page on the CLI's default band, within the one limit", () => {
    expect(benchLimits.maxRangeCm).toBe(maxSpectrumRangeCm);
    for (const molecule of molecules) {
      const range = benchDefaultRange(molecule, cellLineSet(molecule, defaultCellConditions), benchDefaultResolutionCm);
      expect(range.toCm - range.fromCm, molecule.id).toBeLessThanOrEqual(maxSpectrumRangeCm);
      const defaults = {
        temperatureK: 296,
        pressure: 20,
        pressureUnit: "Torr",
        path: 10,
        pathUnit: "cm",
        moleFraction: 1,
        resolutionCm: 0.5,
        lineShape: "triangular",
        at: null,
        ...range,
      };
      expect(readBenchSettings(new URLSearchParams(), defaults).problems, molecule.id).toEqual([]);
    }
  });
  it("refuses the same width on the command line, naming the limit", async () => {
    const r = await runCli(["spectrum", "co", "--from", "2000", "--to", `${2000 + maxSpectrumRangeCm + 1}`, "--relative"]);
    expect(r.exitCode).not.toBe(0);
    expect(r.stderr).toContain(`at most ${maxSpectrumRangeCm} cm⁻¹`);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
  });
  it("says 'the pure gas', not 'mole fraction 1 in air'", async () => {
    const { stdout } = await runCli(["calibration-lines", "co", "--resolution", "1"]);
    expect(stdout).toContain("the pure gas");
    expect(stdout).not.toContain("mole fraction 1 in air");
  });
});

describe("DCl", () => {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-dcl-"));
  afterAll(() => rmSync(work, { recursive: true, force: true }));
  it("holds D37Cl beside D35Cl, isotope-scaled", () => {
    const hcl = molecules.find((m) => m.id === "hcl")!;
    const d37 = hcl.species.find((s) => s.model.label === "2H37Cl")!;
    expect(d37.model.constantsOrigin).toBe("isotope-scaled");
  });
  it("names D35Cl and D37Cl, and --species, when an HCl calibration meets a DCl-only spectrum", async () => {
    // The DCl region (1950–2150 cm⁻¹) of the measured HCl/DCl teaching-laboratory spectrum in
    // test/fixtures/spectra/hcl-dcl-pitt (MIT licence): only DCl absorbs there.
    const rows = readFileSync(join(import.meta.dirname, "fixtures/spectra/hcl-dcl-pitt/Freeman.csv"), "utf8").split(/\r?\n/);
    const cut = rows.filter((r) => {
      const x = Number(r.split(",")[0]);
      return x >= 1950 && x <= 2150;
    });
    const file = join(work, "DCl_region.csv");
    writeFileSync(file, ["cm-1,A", ...cut].join("\n"));
    const r = await runCli(["calibrate", file, "--gas", "hcl"]);
    expect(r.exitCode).not.toBe(0);
    expect(r.stderr).toMatch(/has no lines at natural abundance .*the lines of 2H35Cl and 2H37Cl do lie there.*--species 2H35Cl,2H37Cl/);
  });
});

let session: BuiltSiteSession;
let base: string;
let site: string;
let page: Page;
const problems: string[] = [];

describe("the site at 1280 px", () => {
  beforeAll(async () => {
    session = await openBuiltSite("polish", problems, { viewport: { width: 1280, height: 900 } });
    ({ base, site, page } = session);
  }, 120_000);
  afterAll(async () => {
    await session?.close();
  });

  it("says on the home page which gases, bands and J ranges are validated (computed at build time)", async () => {
    await page.goto(base);
    await expect(page.locator(".validation-summary").textContent()).resolves.toContain(summary);
  });

  it("shows the whole position placeholder and keeps the air box beside its words", async () => {
    await page.goto(base);
    const room = await page.locator("#wavenumber").evaluate((input: HTMLInputElement) => {
      const style = getComputedStyle(input);
      const context = document.createElement("canvas").getContext("2d")!;
      context.font = `${style.fontSize} ${style.fontFamily}`;
      const inner = input.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
      return inner - context.measureText(input.placeholder).width;
    });
    expect(room).toBeGreaterThan(0);
    const gap = await page.evaluate(() => {
      const box = document.getElementById("air")!.getBoundingClientRect();
      const label = document.querySelector("label[for=air]")!;
      const range = document.createRange();
      range.selectNodeContents(label);
      const words = [...range.getClientRects()].filter((r) => r.left >= box.right - 1);
      return Math.min(...words.map((r) => r.left)) - box.right;
    });
    expect(gap).toBeLessThan(12);
  });

  it("finds '1532.83 nm' typed with the menu at cm⁻¹ in the CLI's ±1 cm⁻¹ window, with ± and status", async () => {
    await page.goto(base);
    await page.fill("#wavenumber", "1532.83 nm");
    await page.click("form[data-search=wavenumber] button");
    await page.locator("#find-results tbody tr").first().waitFor();
    const head = await page.locator("#find-results p").first().textContent();
    // As `bandatlas find 1532.83 nm` with no --window: ±1 cm⁻¹, not ±1 nm (≈ ±4 cm⁻¹ there).
    expect(head).toMatch(/^Lines within ±1 cm⁻¹ of 6523\.\d+ cm⁻¹ \(1532\.83 nm, vacuum\)/);
    const cli = await runCli(["find", "1532.83", "nm"]);
    expect(cli.stdout.split("\n")[0]).toBe(head);
    const headings = await page.locator("#find-results thead tr").first().locator("th").allTextContents();
    expect(headings).toEqual(expect.arrayContaining(["± / cm⁻¹", "position"]));
  });

  it("fits the species page's line table and the bands-by-wavelength table in the page at 1280 px", async () => {
    for (const path of ["molecules/co/12C16O-296K/index.html", "molecules/c2h2/12C2H2-296K/index.html", "near-infrared/index.html"]) {
      await page.goto(base + path);
      // The table's right edge against its container's content box (a table-wrap, or main and its padding).
      const overflow = await page.evaluate(() =>
        Math.max(
          ...[...document.querySelectorAll("table.lines")].map((t) => {
            const box = t.parentElement!;
            return t.getBoundingClientRect().right - (box.getBoundingClientRect().right - parseFloat(getComputedStyle(box).paddingRight));
          }),
        ),
      );
      expect(overflow, path).toBeLessThanOrEqual(0);
      expect(await page.evaluate(() => document.documentElement.scrollWidth), path).toBeLessThanOrEqual(1280);
    }
  });

  it("prints the method page's commands as plain text and lists acetylene's band once", async () => {
    await page.goto(`${base}method/index.html`);
    expect(await page.locator("#reproduce ~ pre .token, section[aria-labelledby=reproduce] .token").count()).toBe(0);
    await expect(page.locator("section[aria-labelledby=reproduce] pre.commands").textContent()).resolves.toContain("npx bandatlas lines co");
    // The first two cells (species, band): a source's title may name other species.
    const rows = (
      await page.locator("#accuracy ~ .table-wrap tbody tr").evaluateAll((trs) => trs.map((tr) => [...tr.children].map((c) => c.textContent!.trim())))
    ).map((r) => ({ what: `${r[0]} ${r[1]}`, status: r[2] }));
    expect(rows.filter((r) => r.what === "C2H2 ¹²C₂H₂ 10100-00000")).toHaveLength(1);
    expect(rows.find((r) => r.what.startsWith("HF ¹H¹⁹F 0-0"))!.status).toBe("contradicted by measured lines");
    await expect(page.locator("#accuracy ~ .table-wrap caption").textContent()).resolves.toContain("predicted − measured");
  });

  it("lists CO's mass-independent U_kl once each, in cm⁻¹·u^(k/2+l)", async () => {
    await page.goto(`${base}molecules/co/index.html`);
    const rows = await page
      .locator("table.constants")
      .first()
      .locator("tbody tr")
      .evaluateAll((trs) => trs.map((tr) => [...tr.children].map((c) => c.textContent!.trim())));
    const u10 = rows.find((r) => r[0] === "U₁₀")!;
    // Dunham's isotope relation Y_kl = U_kl μ^−(k/2+l): U10 carries u^(1/2), U01 u, U11 u^(3/2) (fact of the trade).
    expect(u10[3]).toBe("cm⁻¹·u^(1/2)");
    expect(rows.find((r) => r[0] === "U₀₁")![3]).toBe("cm⁻¹·u");
    expect(rows.find((r) => r[0] === "U₁₁")![3]).toBe("cm⁻¹·u^(3/2)");
    expect(rows.every((r) => !r[0].includes("U10") && !/U\d\d/.test(r[0]))).toBe(true);
  });

  it("opens the HCl bench page on its default range without an error", async () => {
    await page.goto(`${base}molecules/hcl/bench/index.html`);
    await page.waitForFunction(() => ["ready", "error"].includes(document.getElementById("bench")!.dataset.state ?? ""), undefined, { timeout: 60_000 });
    await expect(page.locator("#bench").getAttribute("data-state")).resolves.toBe("ready");
    const from = Number(await page.locator("[name=fromCm]").inputValue());
    const to = Number(await page.locator("[name=toCm]").inputValue());
    expect(to - from).toBeLessThanOrEqual(maxSpectrumRangeCm);
    // H35Cl 1-0 lies near 2886 cm⁻¹ (Huber & Herzberg 1979, as in hcl.yaml): the page opens on it.
    expect(from).toBeLessThan(2886);
    expect(to).toBeGreaterThan(2886);
    expect(readFileSync(join(site, "molecules/hcl/bench/index.html"), "utf8")).toContain("bench");
    expect(problems).toEqual([]);
  });
});
