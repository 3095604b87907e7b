import { createHash } from "node:crypto";
import { execFileSync } from "node:child_process";
import { mkdirSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { calibrateRun } from "../lib/cli/commands/calibrate.ts";
import { runCli } from "../lib/cli/main.ts";
import { rejectionWords } from "../lib/format/index.ts";
import { renderCalibrationReport } from "../lib/sheet/index.ts";
import { pdfInfo, pdfText, requireTool, scratchDir, writePdf } from "./sheetHelpers.ts";

const spectrum = "test/fixtures/spectra/hcl-dcl-hunter/HCl_spectrum.csv";
const build = { version: "0.1.0", commit: "0123456789abcdef0123456789abcdef01234567", dateIso: "2025-03-14T09:30:00Z" };
/** pdftotext breaks lines where the page does; the checks read the words, not the line breaks. */
const words = (text: string) => text.replace(/\s+/g, " ");

beforeAll(() => {
  for (const tool of ["pdftotext", "pdfinfo", "pdftoppm"]) requireTool(tool);
});

describe("bandatlas calibrate --report", () => {
  const dir = scratchDir("calreport");
  const pdf = join(dir, "r.pdf");
  let stdout = "";
  let layoutText = "";
  let text = "";

  beforeAll(async () => {
    const result = await runCli(["calibrate", spectrum, "--gas", "hcl", "--report", pdf]);
    expect(result.stderr).toBe("");
    expect(result.exitCode).toBe(0);
    stdout = result.stdout;
    layoutText = pdfText(pdf, true);
    text = words(layoutText);
  }, 60_000);

  it("writes only the report and says so", () => {
    expect(readdirSync(dir)).toEqual(["r.pdf"]);
    expect(stdout.endsWith(`wrote ${pdf}\n`)).toBe(true);
  });

  it("names the file with its full SHA-256 and the correction exactly as the table prints it", () => {
    const sha = createHash("sha256").update(readFileSync(spectrum)).digest("hex");
    expect(text).toContain("HCl_spectrum.csv");
    expect(text).toContain(sha);
    const scale = /scale k = [^│]*? ppm/.exec(stdout)?.[0];
    expect(scale).toMatch(/^scale k = [+−]\d+(\.\d+)? ± \d+(\.\d+)? ppm$/);
    expect(text).toContain(scale);
    const rms = /RMS residual [^│]*?χ²\/ν = \S+/.exec(stdout)![0];
    expect(text).toContain(rms);
  });

  it("prints every line used with its reference, measured position and residual on one row, as the table does", () => {
    const used = stdout.split("\n").filter((l) => /^1H3[57]Cl\s.*\syes\s*$/.test(l));
    expect(used.length).toBeGreaterThanOrEqual(3);
    const rows = layoutText.split("\n");
    for (const row of used) {
      const [species, , label, reference, , measured, , residual] = row.trim().split(/\s+/);
      const found = rows.find((r) => r.includes(label) && r.includes(species) && r.includes(reference));
      expect(found, `${species} ${label}`).toBeDefined();
      expect(found).toContain(measured);
      expect(found).toContain(residual);
    }
  });

  it("gives the reason of every line left out, in the table's words", async () => {
    const json = JSON.parse((await runCli(["calibrate", spectrum, "--gas", "hcl", "--format", "json"])).stdout);
    const reasons = new Set<keyof typeof rejectionWords>(json.lines.filter((l: { used: boolean }) => !l.used).map((l: { reason: string }) => l.reason));
    expect(reasons.size).toBeGreaterThan(0);
    for (const reason of reasons) expect(text).toContain(rejectionWords[reason]);
    expect(text.includes("saturated")).toBe(reasons.has("saturated"));
  }, 30_000);

  it("carries the caution, the prediction notice and page numbers on every page", () => {
    expect(text).toContain("HAZARD CAUTION");
    expect(text).toContain("Hydrogen chloride: Gas under pressure");
    expect(text).toContain("does not certify an instrument");
    const pages = Number(pdfInfo(pdf).Pages);
    expect(pages).toBeGreaterThan(1);
    const pageTexts = layoutText.split("\f").filter((p) => p.trim() !== "");
    expect(pageTexts).toHaveLength(pages);
    pageTexts.forEach((page, i) => {
      expect(words(page)).toContain(`page ${i + 1} of ${pages}`);
      if (i > 0) expect(words(page)).toContain("see the hazard caution on page 1");
    });
  });

  it("renders page 1 as an image with something on it", () => {
    execFileSync("pdftoppm", ["-png", "-r", "60", "-f", "1", "-l", "1", pdf, join(dir, "page")]);
    const png = readdirSync(dir).find((f) => f.startsWith("page") && f.endsWith(".png"));
    expect(png).toBeDefined();
    const bytes = readFileSync(join(dir, png!));
    expect(bytes.subarray(1, 4).toString("latin1")).toBe("PNG");
    // A blank A4 page at 60 dpi compresses to about 1 kB; text, box and plot make it many times that.
    expect(bytes.length).toBeGreaterThan(15_000);
  });
});

describe("renderCalibrationReport", () => {
  it("draws letter paper when asked, and the same bytes for the same run and build", async () => {
    const request = calibrateRun([spectrum, "--gas", "hcl"]);
    if (typeof request === "string" || request.run === null) throw new Error("expected a run");
    const a = await renderCalibrationReport({ run: request.run, build, paper: "letter" });
    const b = await renderCalibrationReport({ run: request.run, build, paper: "letter" });
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
    const path = writePdf(scratchDir("calletter"), "letter.pdf", a);
    expect(pdfInfo(path)["Page size"]).toMatch(/^612 x 792 pts/);
    expect(pdfText(path)).toContain("Made by bandatlas 0.1.0 · 0123456 · 2025-03-14");
  }, 30_000);
});

describe("bandatlas calibrate --report, refused", () => {
  it("a folder that does not exist: exit 2, one sentence, nothing written", async () => {
    const dir = scratchDir("calmissing");
    const target = join(dir, "missing", "r.pdf");
    const { stdout, stderr, exitCode } = await runCli(["calibrate", spectrum, "--gas", "hcl", "--report", target]);
    expect(exitCode).toBe(2);
    expect(stdout).toBe("");
    expect(stderr).toBe(`bandatlas calibrate: cannot write ${target}: the folder ${join(dir, "missing")} does not exist\n`);
    expect(readdirSync(dir)).toEqual([]);
  }, 30_000);

  it("a path that is a folder: exit 2, one sentence, the folder left as it was", async () => {
    const dir = scratchDir("calfolder");
    const target = join(dir, "r.pdf");
    mkdirSync(target);
    const { stderr, exitCode } = await runCli(["calibrate", spectrum, "--gas", "hcl", "--report", target]);
    expect(exitCode).toBe(2);
    expect(stderr).toMatch(/^bandatlas calibrate: cannot write .*r\.pdf: it is a folder; [^\n]*\n$/);
    expect(readdirSync(dir)).toEqual(["r.pdf"]);
    expect(readdirSync(target)).toEqual([]);
  }, 30_000);
});
