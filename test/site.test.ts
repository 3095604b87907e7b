import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, cpSync, mkdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, relative } from "node:path";
import MiniSearch from "minisearch";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { atlasEntry, defaultFindMinRelative, findInAtlas, standardTemperaturesK } from "../lib/atlas/index.ts";
import { decodeLineIndex, lineIndexBytesPerLine } from "../lib/shared/lineIndexCodec.ts";
import { nameIndexOptions, nameSearchOptions } from "../lib/shared/nameSearchOptions.ts";
import { searchWavenumber } from "../lib/browser/wavenumberSearch.ts";
import { buildSite } from "../lib/build/index.ts";
import { shippedMoleculesDir } from "../lib/cli/moleculeSource.ts";
import { loadMoleculesOrThrow, MoleculeFileError } from "../lib/molecules/index.ts";
import { accuracyRows, bandView } from "../lib/site/pageData.ts";
import { lineIndex, nameIndexJson } from "../lib/site/searchIndexes.ts";
import { lineRowId, relativeUrl, speciesPagePath } from "../lib/shared/sitePaths.ts";
import { speciesDisplay } from "../lib/site/formatCells.ts";
import { constantSymbol } from "../lib/site/constantSymbols.ts";

const root = join(import.meta.dirname, "..");
const molecules = loadMoleculesOrThrow(shippedMoleculesDir);
const co = molecules.find((m) => m.id === "co")!;
const toNumber = (cell: string) => Number(cell.replace("−", "-"));

describe("page data", () => {
  const entry = atlasEntry(co, co.species[0], 296);
  const fundamental = bandView(entry, entry.bands[0]);

  it("gives every row a stable, unique anchor", () => {
    const ids = fundamental.rows.map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toContain("line-1-0-R0");
    expect(ids).toContain("line-1-0-P1");
    expect(lineRowId("2-0", "P(12)")).toBe("line-2-0-P12");
  });

  it("shows measured − predicted with that sign, against the cited reference lines", () => {
    // Maki, CRC Handbook table of CO 1-0 wavenumbers (cited in molecules/co.yaml): R(0) = 2147.081132, P(4) = 2127.682404 cm⁻¹.
    for (const [label, measured] of [
      ["R(0)", 2147.081132],
      ["P(4)", 2127.682404],
    ] as const) {
      const row = fundamental.rows.find((r) => r.label === label)!;
      expect(row.predictedMinusMeasured).not.toBeNull();
      // The cell is printed to 2 significant figures and the wavenumber to 4 decimals.
      // One sign convention (residualSignText): predicted − measured.
      expect(toNumber(row.predictedMinusMeasured!)).toBeCloseTo(Number(row.wavenumber) - measured, 4);
      expect(Math.abs(toNumber(row.predictedMinusMeasured!))).toBeLessThan(0.01);
    }
    expect(fundamental.hasResiduals).toBe(true);
    expect(fundamental.rows.filter((r) => r.predictedMinusMeasured !== null)).toHaveLength(9);
    expect(bandView(entry, entry.bands[3]).hasResiduals).toBe(false); // no cited 2-0 lines
  });

  it("gives every shipped band an accuracy row, with the largest residual of the validated ones", () => {
    const entries = molecules.flatMap((m) => m.species.map((s) => atlasEntry(m, s, 296)));
    const rows = accuracyRows(molecules, entries);
    for (const e of entries) for (const b of e.bands) expect(rows.some((r) => r.species === e.species && r.band === b.label)).toBe(true);
    const coRow = rows.find((r) => r.species === "12C16O" && r.band === "1-0")!;
    expect(coRow.status).toBe("validated");
    expect(coRow.lines).toBe("9");
    const all = fundamental.rows.filter((r) => r.predictedMinusMeasured !== null).map((r) => Math.abs(toNumber(r.predictedMinusMeasured!)));
    // The row is printed to 2 significant figures, the page cells too.
    expect(Number(coRow.largest)).toBeCloseTo(Math.max(...all), 6);
    expect(rows.find((r) => r.species === "12C16O" && r.band === "2-0")!.status).toBe("extrapolated");
    expect(rows.find((r) => r.species === "1H35Cl" && r.band === "1-0")!.status).toBe("not validated");
    expect(rows.find((r) => r.species === "1H19F" && r.band === "0-0 (pure rotation)")!.lines).toBe("27");
  });

  it("writes species as chemists do and links relatively", () => {
    expect(speciesDisplay("12C16O")).toBe("¹²C¹⁶O");
    expect(speciesDisplay("1H35Cl")).toBe("¹H³⁵Cl");
    expect(speciesDisplay("12C2H2")).toBe("¹²C₂H₂");
    expect(speciesDisplay("12C16O2")).toBe("¹²C¹⁶O₂");
    // Handbook notation of the constants (Huber & Herzberg 1979, fact of the trade).
    expect(constantSymbol("omegaExe")).toBe("ωₑxₑ");
    expect(constantSymbol("Y12")).toBe("Y₁₂");
    expect(relativeUrl("molecules/co/12C16O-296K/index.html", "assets/site.css")).toBe("../../../assets/site.css");
    expect(relativeUrl("index.html", speciesPagePath("co", "12C16O", 273.15))).toBe("molecules/co/12C16O-273.15K/index.html");
    expect(relativeUrl("molecules/co/index.html", "molecules/co/12C16O-296K/index.html")).toBe("12C16O-296K/index.html");
  });
});

describe("search indexes", () => {
  const names = MiniSearch.loadJSON(nameIndexJson(molecules), nameIndexOptions);
  const first = (q: string) => names.search(q, nameSearchOptions)[0]?.id;

  it("finds molecules by formula, name, alias and CAS number", () => {
    // CAS numbers as given in the molecule files (CAS Registry; HCl 7647-01-0, HI 10034-85-2, CO 630-08-0, from memory).
    expect(first("HCl")).toBe("hcl");
    expect(first("7647-01-0")).toBe("hcl");
    expect(names.search("7647-01-0", nameSearchOptions)).toHaveLength(1);
    expect(first("10034-85-2")).toBe("hi");
    expect(first("630-08-0")).toBe("co");
    expect(first("hydrogen iodide")).toBe("hi");
    expect(first("carbonic oxide")).toBe("co");
    expect(first("H37Cl")).toBe("hcl");
  });

  it("answers wavenumber queries exactly as findInAtlas (bandatlas find) does", () => {
    for (const temperatureK of standardTemperaturesK) {
      const file = lineIndex(molecules, temperatureK);
      expect(file.data.length).toBe(Math.ceil((file.count * lineIndexBytesPerLine) / 3) * 4);
      const index = decodeLineIndex(JSON.parse(JSON.stringify(file)));
      // Queries across every band region of the atlas, deterministic pseudo-random.
      let seed = 12345;
      for (let k = 0; k < 60; k++) {
        seed = (seed * 1103515245 + 12345) % 2 ** 31;
        const wavenumber = 1500 + (seed / 2 ** 31) * 10000;
        const windowCm = [0.3, 1, 5][k % 3];
        const expected = findInAtlas(molecules, wavenumber, windowCm, temperatureK, defaultFindMinRelative);
        const got = searchWavenumber(index, wavenumber, windowCm, defaultFindMinRelative).map(({ page, ...rest }) => rest);
        expect(got).toEqual(expected);
      }
      const near = searchWavenumber(index, 2143.3, 5, defaultFindMinRelative);
      expect(near.length).toBeGreaterThan(0);
      expect(near[0].page).toBe(speciesPagePath(near[0].molecule, near[0].species, temperatureK));
    }
  });
});

describe("the build", () => {
  const work = mkdtempSync(join(tmpdir(), "bandatlas-site-test-"));
  const hostileDir = join(root, "test/fixtures/hostile");
  const siteA = join(work, "a/site");
  const siteB = join(work, "b/site");
  const files = (dir: string): string[] =>
    readdirSync(dir, { recursive: true, withFileTypes: true })
      .filter((d) => d.isFile())
      .map((d) => relative(dir, join(d.parentPath, d.name)))
      .sort();

  beforeAll(async () => {
    await buildSite({ moleculesDir: hostileDir, outDir: siteA, sheets: false });
    await buildSite({ moleculesDir: hostileDir, outDir: siteB, sheets: false });
  });
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  it("gives byte-identical output for the same inputs", () => {
    const a = files(siteA);
    expect(a).toEqual(files(siteB));
    expect(a.length).toBeGreaterThan(20);
    for (const f of a) expect(readFileSync(join(siteA, f)).equals(readFileSync(join(siteB, f))), f).toBe(true);
  });

  it("escapes every text from a molecule file and allows no inline script", () => {
    const pages = files(siteA).filter((f) => f.endsWith(".html"));
    // home, method, cautions, contributing, the molecule page, one page per standard temperature
    // (and any further hand-written page in content/)
    expect(pages.length).toBeGreaterThanOrEqual(5 + standardTemperaturesK.length);
    for (const t of standardTemperaturesK) expect(pages).toContain(`molecules/hostile/12C16O-${t}K/index.html`);
    const molecule = readFileSync(join(siteA, "molecules/hostile/index.html"), "utf8");
    // The hostile fixture's name, formula, hazard sentence and citation arrive as text only.
    expect(molecule).toContain("&lt;img src=x onerror=alert(1)&gt;Evil&lt;/script&gt;&lt;script&gt;alert(2)&lt;/script&gt;");
    expect(molecule).toContain("&lt;b onmouseover=alert(4)&gt;Toxic&lt;/b&gt;");
    expect(molecule).toContain("{{ 7*7 }}"); // data is never rendered as a template
    for (const page of pages) {
      const html = readFileSync(join(siteA, page), "utf8");
      expect(html, page).not.toMatch(/<(img|b|svg) on/i);
      expect(html, page).not.toMatch(/alert\(\d\)<\/script>|<script>alert/);
      expect(html, page).toContain(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; script-src 'self';`);
      // Every script is an external file: no <script> element without src.
      for (const tag of html.match(/<script\b[^>]*>/g) ?? []) expect(tag, page).toMatch(/ src="[^"]+"/);
      expect(html, page).not.toMatch(/ on[a-z]+="/); // no inline event handlers
    }
  });

  it("keeps the previous site when a molecule file is bad, and leaves no temporary folder", async () => {
    const bad = join(work, "bad-molecules");
    mkdirSync(bad);
    cpSync(join(hostileDir, "hostile.yaml"), join(bad, "hostile.yaml"));
    writeFileSync(join(bad, "broken.yaml"), readFileSync(join(root, "test/fixtures/bad/negative-b.yaml")));
    const before = readFileSync(join(siteA, "index.html"));
    await expect(buildSite({ moleculesDir: bad, outDir: siteA, sheets: false })).rejects.toBeInstanceOf(MoleculeFileError);
    expect(readFileSync(join(siteA, "index.html")).equals(before)).toBe(true);
    expect(readdirSync(join(work, "a"))).toEqual(["site"]);
    expect(existsSync(join(siteA, "molecules/hostile/index.html"))).toBe(true);
  });
});
