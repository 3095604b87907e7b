import { beforeAll, describe, expect, it } from "vitest";
import { atlasEntry, selectMolecule, selectSpecies } from "../lib/atlas/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { lineCells } from "../lib/format/index.ts";
import type { Molecule } from "../lib/molecules/index.ts";
import { cautionDeferral, paperSizes, renderBenchSheet, type SheetBuildIdentity } from "../lib/sheet/index.ts";
import { branchStyle } from "../lib/sheet/sheetStyle.ts";
import { inkFraction, pdfFonts, pdfInfo, pdfText, pixelsNear, rasterPages, requireTool, scratchDir, writePdf } from "./sheetHelpers.ts";
import { shippedMolecules } from "./helpers/shipped.ts";

const build: SheetBuildIdentity = { version: "0.1.0", commit: "0123456789abcdef0123456789abcdef01234567", dateIso: "2025-03-14T09:30:00Z" };
const dir = scratchDir("sheet");

function co(): Molecule {
  return selectMolecule(shippedMolecules(), "co");
}

async function sheetOf(molecule: Molecule, species: string | undefined, temperatureK: number, paper: "a4" | "letter", name: string, b = build) {
  const entry = atlasEntry(molecule, selectSpecies(molecule, species), temperatureK);
  const bytes = await renderBenchSheet({ molecule, entry, paper, build: b });
  return { entry, bytes, path: writePdf(dir, name, bytes) };
}

/** The digits `bandatlas lines <molecule> --format csv` prints for a line label. */
async function linesCsvDigits(args: string[], label: string): Promise<{ wavenumber: string; sigma: string; status: string; um: string; rel: string }> {
  const { stdout, exitCode } = await runCli(["lines", ...args, "--format", "csv"]);
  expect(exitCode).toBe(0);
  const [head, ...rows] = stdout
    .trim()
    .split("\n")
    .filter((r) => !r.startsWith("#"))
    .map((r) => r.split(","));
  const row = rows.find((r) => r[0] === label)!;
  expect(row, `${label} in bandatlas lines`).toBeDefined();
  return {
    wavenumber: row[head.indexOf("wavenumber (cm-1)")],
    sigma: row[head.indexOf("wavenumberUncertainty (cm-1)")],
    // The sheet prints the status as its first letter (v, e, n, c), keyed in the legend.
    status: row[head.indexOf("positionStatus")][0],
    um: row[head.indexOf("wavelengthVacuum (um)")],
    rel: row[head.indexOf("relativeIntensity")],
  };
}

beforeAll(() => {
  for (const tool of ["pdftotext", "pdftoppm", "pdfinfo", "pdffonts"]) requireTool(tool);
});

describe("bench sheet of 12C16O at 296 K on A4", () => {
  let path = "";
  let text = "";
  let layout = "";
  beforeAll(async () => {
    path = (await sheetOf(co(), undefined, 296, "a4", "co-a4.pdf")).path;
    text = pdfText(path);
    layout = pdfText(path, true);
  });

  it("has the header: molecule, formula, species, band, temperature and the build", () => {
    expect(text).toContain("Carbon monoxide (CO)");
    expect(text).toContain("12C16O · band 1-0 (fundamental) · T = 296 K (22.85 °C)");
    expect(text).toContain("bandatlas 0.1.0 · 0123456 · 2025-03-14");
  });

  it("has the hazard caution: GHS codes, the file's sentences and the deferral", () => {
    const flat = text.replace(/\s+/g, " ");
    expect(flat).toContain("HAZARD CAUTION");
    for (const code of co().hazard.ghsPictograms) expect(flat).toContain(code);
    for (const sentence of co().hazard.sentences) expect(flat).toContain(sentence);
    expect(flat).toContain(cautionDeferral);
  });

  it("prints R(0) and P(1) with the digits of `bandatlas lines`, side by side on the J = 0 and 1 rows", async () => {
    const r0 = await linesCsvDigits(["co"], "R(0)");
    const p1 = await linesCsvDigits(["co"], "P(1)");
    const r1 = await linesCsvDigits(["co"], "R(1)");
    const rowJ = (j: number) => layout.split("\n").find((l) => new RegExp(`^\\s*${j}\\s`).test(l))!;
    // Each position with its ± and status (issue 21), then λ and the relative intensity.
    const cells = (d: typeof r0) => `${d.wavenumber}\\s+${d.sigma}\\s+${d.status}\\s+${d.um}\\s+${d.rel}`;
    expect(rowJ(0)).toMatch(new RegExp(`—\\s+${cells(r0)}`));
    expect(rowJ(1)).toMatch(new RegExp(`${cells(p1)}\\s+${cells(r1)}`));
    // The same digits come from lib/format lineCells (one formatting for every output).
    const line = atlasEntry(co(), co().species[0], 296).bands[0].lines.lines.find((l) => l.label === "R(0)")!;
    expect(lineCells(line).wavenumber).toBe(r0.wavenumber);
  });

  it("agrees with the measured R(0) and P(1) of CO to 0.0005 cm⁻¹", () => {
    // A. G. Maki and J. S. Wells, NIST Special Publication 821 (1991), as tabulated in the CRC
    // Handbook "Infrared and far-infrared absorption frequency standards": 12C16O 1-0 R(0) =
    // 2147.081132 cm⁻¹, P(1) = 2139.426071 cm⁻¹ (read from the table, also in molecules/co.yaml).
    const rowJ = (j: number) => layout.split("\n").find((l) => new RegExp(`^\\s*${j}\\s`).test(l))!;
    const r0 = Number(/—\s+(\d+\.\d{4})/.exec(rowJ(0))![1]);
    const p1 = Number(/^\s*1\s+(\d+\.\d{4})/.exec(rowJ(1))![1]);
    expect(Math.abs(r0 - 2147.081132)).toBeLessThan(5e-4);
    expect(Math.abs(p1 - 2139.426071)).toBeLessThan(5e-4);
  });

  it("names the sources with full citations, the model and its checked accuracy", () => {
    const flat = text.replace(/\s+/g, " ");
    for (const source of co().sources) expect(flat).toContain(source.citation);
    expect(flat).toContain("Dunham expansion of the term values");
    expect(flat).toContain("selection rule ΔJ = ±1"); // \s also matches the no-break spaces that keep it on one line
    expect(flat).toMatch(
      /Accuracy: validated against 9 cited measured lines of band 1-0, \|m\| 1–5 \[makiCrc\]: largest \|predicted − measured\| [\d.e-]+ cm⁻¹/,
    );
  });

  it("shows the units and symbols in an embedded DejaVu font, no system font", () => {
    for (const glyphs of ["ν̃ / cm⁻¹", "λ vac / µm", "22.85 °C", "ΔJ = ±1", "ν₀", "★", "⚠"]) expect(text.replace(/\u00a0/g, " ")).toContain(glyphs);
    const fonts = pdfFonts(path).split("\n").slice(2).filter(Boolean);
    expect(fonts.length).toBeGreaterThanOrEqual(2);
    for (const row of fonts) {
      expect(row).toMatch(/DejaVuSans/);
      expect(row).toMatch(/\byes\s+yes\s+yes\b/); // emb sub uni
    }
  });

  it("says nothing about calibration-grade lines while no flags are given", () => {
    expect(text).not.toContain("Recommended for calibration");
  });

  it("marks the strongest lines and keys the marks in a legend", () => {
    expect(text).toContain("★ bold: strong line, relative intensity ≥ 0.5");
    // R(7) is the band's strongest line at 296 K (relative intensity 1), so its row is marked.
    const row7 = layout.split("\n").find((l) => /^\s*7\s/.test(l))!;
    expect(row7).toMatch(/★.*★/);
  });

  it("continues the 35-row table on a second page with the column headings repeated", () => {
    const info = pdfInfo(path);
    expect(info.Pages).toBe("2");
    const pages = text.split("\f");
    expect(pages[0]).toContain("page 1 of 2");
    expect(pages[1]).toContain("page 2 of 2");
    expect(pages[1]).toContain("line table, continued");
    expect(pages[1]).toContain("ν̃ / cm⁻¹");
    expect(pages[1]).toContain("see the hazard caution on page 1");
    expect(layout).toMatch(/^\s*34\s/m); // J'' = 34, the last row, at 1e-4 of the strongest
  });

  it("is A4, dated by the build, titled", () => {
    const info = pdfInfo(path);
    // ISO 216: A4 is 210 mm × 297 mm = 595.28 pt × 841.89 pt.
    expect(info["Page size"]).toMatch(/^595\.2\d* x 841\.8\d* pts/);
    expect(info.CreationDate).toBe("2025-03-14T09:30:00Z");
    expect(info.Title).toContain("Carbon monoxide 12C16O 1-0 band at 296 K");
    expect(paperSizes.a4.widthPt).toBeCloseTo(595.276, 2);
  });

  it("renders to pages that are not blank and shows both branch colours", () => {
    const pages = rasterPages(path, 50);
    expect(pages).toHaveLength(2);
    // A4 at 50 dpi: 8.27 in × 11.69 in → 413 × 585 pixels (pdftoppm rounds up).
    expect(pages[0].width).toBeGreaterThanOrEqual(413);
    expect(pages[0].width).toBeLessThanOrEqual(414);
    expect(pages[0].height).toBeGreaterThanOrEqual(584);
    const ink = inkFraction(pages[0]);
    expect(ink).toBeGreaterThan(0.03); // text, plot and table
    expect(ink).toBeLessThan(0.4); // not a black page
    expect(inkFraction(pages[1])).toBeGreaterThan(0.01);
    expect(pixelsNear(pages[0], branchStyle.P.colour, 40)).toBeGreaterThan(20);
    expect(pixelsNear(pages[0], branchStyle.R.colour, 40)).toBeGreaterThan(20);
  });
});

describe("bench sheet on Letter, and short tables", () => {
  it("H37Cl at 298.15 K on Letter is one page of 8.5 in × 11 in", async () => {
    const hcl = selectMolecule(shippedMolecules(), "hcl");
    const { path } = await sheetOf(hcl, "H37Cl", 298.15, "letter", "h37cl-letter.pdf");
    const info = pdfInfo(path);
    // ANSI/ASME Y14.1 Letter: 8.5 in × 11 in = 612 pt × 792 pt.
    expect(info["Page size"]).toMatch(/^612 x 792 pts/);
    expect(info.Pages).toBe("1");
    const text = pdfText(path);
    expect(text).toContain("1H37Cl · band 1-0 (fundamental) · T = 298.15 K (25 °C)");
    expect(text).toContain("page 1 of 1");
    expect(text).toContain("Accuracy: not validated: no cited measured line stands behind these constants");
    const r0 = await linesCsvDigits(["hcl", "--species", "H37Cl", "--temperature", "298.15"], "R(0)");
    expect(text).toContain(r0.wavenumber);
    expect(inkFraction(rasterPages(path, 50)[0])).toBeGreaterThan(0.03);
  });

  it("a hot CO sheet (1000 K, Letter) runs to three pages, numbered, and names the hot bands it leaves out", async () => {
    const { path } = await sheetOf(co(), "13CO", 1000, "letter", "13co-1000-letter.pdf");
    const text = pdfText(path);
    expect(pdfInfo(path).Pages).toBe("3");
    expect(text).toContain("page 3 of 3");
    expect(text.replace(/\s+/g, " ")).toMatch(/hot bands 2-1 \(strongest line [\d.]+ of the fundamental's\)/);
  });
});

describe("calibration-grade flags (optional input)", () => {
  it("names the flagged lines under the plot when they are given", async () => {
    const entry = atlasEntry(co(), co().species[0], 296);
    const bytes = await renderBenchSheet({ molecule: co(), entry, paper: "a4", build, calibrationLineLabels: ["R(3)", "P(4)"] });
    const text = pdfText(writePdf(dir, "calibration.pdf", bytes)).replace(/\s+/g, " ");
    expect(text).toContain("Recommended for calibration (calibration-grade flags of the molecule file): R(3), P(4).");
  });
});

describe("determinism and untrusted text", () => {
  it("gives the same bytes for the same inputs, and different bytes for another build date", async () => {
    const a = await sheetOf(co(), "13CO", 273.15, "a4", "det-a.pdf");
    const b = await sheetOf(co(), "13CO", 273.15, "a4", "det-b.pdf");
    expect(Buffer.compare(a.bytes, b.bytes)).toBe(0);
    const c = await sheetOf(co(), "13CO", 273.15, "a4", "det-c.pdf", { ...build, dateIso: "2025-03-15T09:30:00Z" });
    expect(Buffer.compare(a.bytes, c.bytes)).not.toBe(0);
  });

  it("draws molecule-file strings as text only and links only http(s) addresses", async () => {
    const base = co();
    const hostile: Molecule = {
      ...base,
      name: "Carbon\u202e monoxide\u0007 (tampered)",
      hazard: { ghsPictograms: base.hazard.ghsPictograms, sentences: ["(Toxic) Tj ET BT /F1 99 Tf (x) Tj"] },
      sources: base.sources.map((s, i) => (i === 0 ? { ...s, url: "javascript:alert(1)" } : { ...s, url: "https://example.org/co-table" })),
    };
    const { bytes, path } = await sheetOf(hostile, undefined, 296, "a4", "hostile.pdf");
    const text = pdfText(path);
    expect(text).toContain("Carbon monoxide (tampered)");
    expect(text.replace(/\s+/g, " ")).toContain("(Toxic) Tj ET BT /F1 99 Tf (x) Tj");
    const raw = bytes.toString("latin1");
    expect(raw).not.toContain("javascript");
    expect(raw).toMatch(/\/URI \(https:\/\/example\.org\/co-table\)/);
  });
});
