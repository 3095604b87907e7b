// The built site in a real Chromium: search by formula, CAS number and wavenumber, the plot, the
// CSV download. Chromium must be installed (scripts/ensure-test-tools.sh); without it this test
// fails, it does not skip.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { openBuiltSite, type BuiltSiteSession } from "./helpers/chromium.ts";

// The command line's own entry (what bin/bandatlas.js runs), in-process to keep the test fast.
async function cli(...args: string[]): Promise<string> {
  const { stdout, stderr, exitCode } = await runCli(args);
  if (exitCode !== 0) throw new Error(`bandatlas ${args.join(" ")}: ${stderr}`);
  return stdout;
}

/**
 * The rows of every table `bandatlas find` prints (the lines of known strength, then those of
 * unknown strength): columns are two or more spaces apart (a status may be two words).
 */
function cliTableRows(text: string): string[][] {
  const rows: string[][] = [];
  let inTable = false;
  for (const line of text.split("\n")) {
    if (/^-+\s/.test(line)) inTable = true;
    else if (inTable && line.trim().split(/\s{2,}/).length >= 9) rows.push(line.trim().split(/\s{2,}/));
    else inTable = false;
  }
  return rows;
}

let session: BuiltSiteSession;
let work: string;
let site: string;
let base: string;
let page: Page;
const problems: string[] = [];

beforeAll(async () => {
  session = await openBuiltSite("browser", problems, { acceptDownloads: true });
  ({ work, site, base, page } = session);
}, 120_000);

afterAll(async () => {
  await session?.close();
});

describe("the site in Chromium", () => {
  it("opens the home page with the molecule list and the search forms", async () => {
    await page.goto(base);
    await expect(page.title()).resolves.toContain("bandatlas");
    const rows = await page.locator("table.molecules tbody tr").count();
    expect(rows).toBe(Number(readFileSync(join(site, "assets/search/names.json"), "utf8").match(/"documentCount":(\d+)/)![1]));
    await expect(page.locator("label[for=q]").textContent()).resolves.toBe("Molecule");
  });

  it("finds a molecule by formula with the keyboard, and by CAS number", async () => {
    await page.goto(base);
    await page.locator("#q").focus();
    await page.keyboard.type("HCl");
    await page.keyboard.press("Enter");
    const first = page.locator("#name-results li a").first();
    await expect(first.textContent()).resolves.toBe("Hydrogen chloride (HCl)");
    // CAS number of hydrogen iodide, 10034-85-2 (CAS Registry, as in molecules/hi.yaml).
    await page.fill("#q", "10034-85-2");
    await page.click("form[data-search=name] button");
    await expect(page.locator("#name-results li a").allTextContents()).resolves.toEqual(["Hydrogen iodide (HI)"]);
    await page.locator("#name-results li a").first().click();
    await page.waitForURL(/molecules\/hi\//);
    await expect(page.locator("h1").textContent()).resolves.toContain("Hydrogen iodide");
    await expect(page.locator(".caution").count()).resolves.toBe(1);
  });

  it("finds lines near a wavenumber exactly as `bandatlas find` does and lands on the row", async () => {
    const wavenumber = "2150";
    const expected = JSON.parse(await cli("find", wavenumber, "--format", "json")).matches as Array<{
      molecule: string;
      species: string;
      band: string;
      label: string;
      wavenumber: number;
      offset: number;
      relativeIntensity: number;
    }>;
    expect(expected.length).toBeGreaterThan(1);
    const table = cliTableRows(await cli("find", wavenumber));
    await page.goto(base);
    await page.fill("#wavenumber", wavenumber);
    await page.click("form[data-search=wavenumber] button");
    await page.locator("#find-results tbody tr").first().waitFor();
    const rows = await page.locator("#find-results tbody tr").evaluateAll((trs) => trs.map((tr) => [...tr.children].map((td) => td.textContent!.trim())));
    // Same lines, same order, same printed digits as the CLI table.
    expect(rows).toEqual(table);
    expect(rows.map((r) => r.slice(0, 4))).toEqual(expected.map((m) => [m.molecule, m.species, m.band, m.label]));
    await page.locator("#find-results tbody tr").first().locator("a").click();
    await page.waitForURL(/#line-/);
    const target = page.locator("tr:target");
    await expect(target.locator("th").textContent()).resolves.toBe(expected[0].label);
    // The page prints the position rounded to its ± as the CLI does (the JSON holds the same rounding).
    await expect(target.locator("td").first().textContent()).resolves.toBe(table[0][4]);
    expect(Number(table[0][4])).toBe(expected[0].wavenumber);
    expect(page.url()).toContain(`molecules/${expected[0].molecule}/${expected[0].species}-296K/index.html#line-${expected[0].band}-`);
  });

  it("finds lines near an air wavelength in nm as `bandatlas find --air` does", async () => {
    // 12C2H2 P(13) lies at 1532.830 nm in vacuum (BIPM recommended frequency, c2h2.yaml), about
    // 0.42 nm shorter in standard air; the search is by the air value with a ±0.05 nm window.
    const table = cliTableRows(await cli("find", "1532.41", "nm", "--air", "--window", "0.05"));
    expect(table.map((r) => r.slice(0, 4))).toContainEqual(["c2h2", "12C2H2", "10100-00000", "P(13)"]);
    await page.goto(base);
    await page.fill("#wavenumber", "1532.41");
    await page.selectOption("#unit", "nm");
    await page.check("#air");
    await page.fill("#window", "0.05");
    await page.click("form[data-search=wavenumber] button");
    await page.locator("#find-results tbody tr").first().waitFor();
    const rows = await page.locator("#find-results tbody tr").evaluateAll((trs) => trs.map((tr) => [...tr.children].map((td) => td.textContent!.trim())));
    expect(rows).toEqual(table);
    await expect(page.locator("#find-results p").first().textContent()).resolves.toContain("(1532.41 nm, air)");
  });

  it("shows the band overview as an SVG with axes, and switches to a log scale", async () => {
    await page.goto(`${base}molecules/co/12C16O-296K/index.html`);
    const linear = page.locator("figure.plot-linear svg[role=img]");
    await expect(linear.isVisible()).resolves.toBe(true);
    await expect(linear.getAttribute("aria-label")).resolves.toMatch(/^Stick spectrum of the 1-0 band of 12C16O at 296 K/);
    const texts = await linear.locator("text").allTextContents();
    expect(texts).toContain("wavenumber / cm⁻¹");
    expect(texts).toContain("relative intensity");
    expect(texts).toContain("2140"); // an x tick label near the CO band origin (2143.27 cm⁻¹)
    await page.click("label[for=scale-log]");
    await expect(page.locator("figure.plot-log svg").isVisible()).resolves.toBe(true);
    await expect(linear.isVisible()).resolves.toBe(false);
    await expect(page.locator("figure.plot-log svg text").allTextContents()).resolves.toContain("relative intensity (log scale)");
  });

  it("downloads the CSV byte-identical to `bandatlas lines --format csv`", async () => {
    await page.goto(`${base}molecules/co/12C16O-296K/index.html`);
    const [download] = await Promise.all([page.waitForEvent("download"), page.locator("#band-1-0 .downloads a", { hasText: "CSV" }).click()]);
    const saved = join(work, "download.csv");
    await download.saveAs(saved);
    const expected = await cli("lines", "co", "--species", "12C16O", "--band", "1-0", "--temperature", "296", "--format", "csv");
    expect(readFileSync(saved).equals(Buffer.from(expected, "utf8"))).toBe(true);
    // And one at a non-default temperature, overtone band, other species, fetched by URL.
    const other = await (await fetch(`${base}molecules/hcl/1H37Cl-273.15K/hcl-1H37Cl-273.15K-2-0.csv`)).text();
    expect(other).toBe(await cli("lines", "hcl", "--species", "1H37Cl", "--band", "2-0", "--temperature", "273.15", "--format", "csv"));
  });

  it("ran without script errors or Content-Security-Policy violations", () => {
    expect(problems).toEqual([]);
  });
});
