import { execFileSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, relative } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildSite } from "../lib/build/index.ts";
import { csvCell, csvRow, numeric } from "../lib/format/index.ts";

// One hostile molecule file (test/fixtures/hostile/hostile.yaml, invented) through the whole
// build, sheets included: every format must carry its texts as inert text.
const root = join(import.meta.dirname, "..");
const work = mkdtempSync(join(tmpdir(), "bandatlas-hostile-"));
const site = join(work, "site");
const files = (ext: string) =>
  readdirSync(site, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile() && d.name.endsWith(ext))
    .map((d) => join(d.parentPath, d.name));

beforeAll(async () => {
  await buildSite({
    moleculesDir: join(root, "test/fixtures/hostile"),
    outDir: site,
    sheets: true,
    build: { version: "0.0.0-test", commit: "test", dateIso: "2026-01-01T00:00:00Z" },
  });
}, 240_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe("hostile molecule texts", () => {
  it("stay text inside every inline SVG plot", () => {
    for (const page of files(".html")) {
      for (const svg of readFileSync(page, "utf8").match(/<svg[\s\S]*?<\/svg>/g) ?? []) {
        expect(svg, relative(site, page)).not.toMatch(/<(img|script|b)\b|onload=|onerror=/i);
      }
    }
  });
  it("survive JSON as data: every JSON file parses and holds the name unchanged", () => {
    const json = files(".json");
    expect(json.length).toBeGreaterThan(0);
    let sawName = false;
    for (const file of json) {
      const text = readFileSync(file, "utf8");
      const data = JSON.parse(text);
      if (JSON.stringify(data).includes("<img src=x onerror=alert(1)>Evil")) sawName = true;
    }
    // The name search index carries the molecule's name as a plain string; it is fetched as data,
    // never inlined into a page, where "</script>" inside it could end a script element.
    expect(sawName).toBe(true);
    for (const page of files(".html")) expect(readFileSync(page, "utf8")).not.toMatch(/<script[^>]*type="application\/(ld\+)?json"/);
  });
  it("are printed as text on the PDF sheets, never as links or actions", () => {
    const pdfs = files(".pdf");
    expect(pdfs.length).toBe(8); // 4 standard temperatures × A4 and Letter
    const text = execFileSync("pdftotext", ["-layout", pdfs[0], "-"], { encoding: "utf8" });
    expect(text).toContain("<img src=x onerror=alert(1)>Evil");
    expect(text).toContain("<b onmouseover=alert(4)>Toxic</b>");
    const raw = readFileSync(pdfs[0]).toString("latin1");
    expect(raw).not.toMatch(/\/S\s*\/JavaScript|\/JS\s*\(/);
    expect(raw).not.toMatch(/\/S\s*\/Launch/);
  });
});

describe("CSV formula injection", () => {
  it("neutralises text cells that a spreadsheet would run, and never touches numbers", () => {
    // OWASP, "CSV Injection": cells starting with = + - @ (or tab/CR) are prefixed with a quote.
    expect(csvCell('=HYPERLINK("http://evil.example","click")')).toBe(`"'=HYPERLINK(""http://evil.example"",""click"")"`);
    expect(csvCell("+cmd|' /C calc'!A0")).toBe("'+cmd|' /C calc'!A0");
    expect(csvCell("@SUM(1+1)")).toBe("'@SUM(1+1)");
    expect(csvCell("-2+3")).toBe("'-2+3");
    expect(csvCell('"quoted", with comma')).toBe('"""quoted"", with comma"');
    expect(csvRow([numeric("-0.0025"), -1.5, "R(0)"])).toBe("-0.0025,-1.5,R(0)");
  });
  it("gives the hostile species' CSV downloads only labels and numbers", () => {
    for (const file of files(".csv")) {
      const lines = readFileSync(file, "utf8").trim().split("\n");
      const comments = lines.filter((l) => l.startsWith("#"));
      // Comment lines (accuracy, known limitations from the file) stay one cell: no comma, no quote.
      for (const c of comments) expect(c, file).not.toMatch(/[,"]/);
      const [, ...rows] = lines.filter((l) => !l.startsWith("#"));
      for (const row of rows) expect(row, file).toMatch(/^[PR]\(\d+\),[PR],[\d,.eE+-]*,(validated|extrapolated|not-validated)$/);
    }
  });
});
