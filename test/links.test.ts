// Every page of the site as shipped (with bench sheets) checked for broken internal links and
// duplicate ids; the checker itself checked on a page with known broken links.
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync, mkdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { standardTemperaturesK } from "../lib/atlas/index.ts";
import { checkInternalLinks } from "../lib/build/index.ts";

// The shipped atlas with its sheets, built once for the run (test/helpers/globalSetup.ts).
const report = inject("shippedSite");
let work: string;

beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), "bandatlas-links-"));
});
afterAll(() => work && rmSync(work, { recursive: true, force: true }));

describe("internal links of the built site", () => {
  it("has no broken link or missing anchor on any page", () => {
    const result = checkInternalLinks(report.outDir);
    expect(result.broken).toEqual([]);
    // home, method, cautions, contributing, one page per molecule, one per species and
    // temperature, and any further hand-written page in content/
    expect(result.pages).toBeGreaterThanOrEqual(4 + report.molecules + report.entries);
    for (const page of [
      "index.html",
      "method/index.html",
      "cautions/index.html",
      "contributing/index.html",
      "molecules/co/index.html",
      "molecules/co/12C16O-273.15K/index.html",
    ])
      expect(existsSync(join(report.outDir, page)), page).toBe(true);
    expect(report.entries % standardTemperaturesK.length).toBe(0);
    expect(result.links).toBeGreaterThan(result.pages * 10);
  });

  it("links each species page to its bench sheets when the sheets are built", () => {
    const html = readFileSync(join(report.outDir, "molecules/co/12C16O-296K/index.html"), "utf8");
    if (report.sheets > 0) {
      expect(html).toContain('href="../../../sheets/co/12C16O-296K-a4.pdf"');
      expect(html).toContain('href="../../../sheets/co/12C16O-296K-letter.pdf"');
    } else expect(html).not.toContain("sheets/");
  });

  it("has no duplicate id on any page", () => {
    for (const page of ["index.html", "molecules/co/12C16O-1000K/index.html", "molecules/hcl/index.html", "method/index.html"]) {
      const ids = [...readFileSync(join(report.outDir, page), "utf8").matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]);
      expect(ids.length).toBeGreaterThan(3);
      expect(
        ids.filter((id, i) => ids.indexOf(id) !== i),
        page,
      ).toEqual([]);
    }
  });

  it("reports a missing file, a missing anchor and a link out of the site", () => {
    const site = join(work, "broken");
    mkdirSync(join(site, "a"), { recursive: true });
    writeFileSync(
      join(site, "index.html"),
      '<p id="top"><a href="a/index.html#nowhere">x</a> <a href="missing.html">y</a> <a href="#top">ok</a> <a href="../outside.html">z</a> <a href="https://example.org/">ext</a></p>',
    );
    writeFileSync(join(site, "a/index.html"), '<p id="here"><a href="../index.html#top">back</a></p>');
    const result = checkInternalLinks(site);
    expect(result.links).toBe(5);
    expect(result.broken.map((b) => `${b.page} ${b.href}`).sort()).toEqual([
      "index.html ../outside.html",
      "index.html a/index.html#nowhere",
      "index.html missing.html",
    ]);
  });
});
