import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { buildHeapCapMb, heapCapArgs } from "../bin/heapCap.js";

const root = join(import.meta.dirname, "..");
const cli = (...args: string[]) => runCli(args);

describe("bandatlas lines", () => {
  it("prints the JSON contract for CO", async () => {
    const { stdout, exitCode } = await cli("lines", "co", "--format", "json");
    expect(exitCode).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc).toMatchObject({ molecule: "co", species: "12C16O", band: "1-0", temperatureK: 296 });
    const keys = [
      "label",
      "branch",
      "jLower",
      "jUpper",
      "wavenumber",
      "wavenumberUncertainty",
      "wavelengthVacuumUm",
      "wavelengthAirNm",
      "lowerStateEnergy",
      "relativeIntensity",
      "lineIntensity",
      "populationFraction",
      "positionStatus",
    ];
    for (const line of doc.lines) expect(Object.keys(line)).toEqual(keys);
    expect(doc.accuracy).toMatchObject({ status: "validated", measuredLines: 9, absMMin: 1, absMMax: 5, sources: ["makiCrc"] });
    expect(doc.limitations).toEqual([]);
    const r0 = doc.lines.find((l: { label: string }) => l.label === "R(0)");
    // CRC Handbook, Maki table of CO 1-0 wavenumbers: R(0) = 2147.081132 cm⁻¹ (read directly).
    expect(r0).toMatchObject({ branch: "R", jLower: 0, jUpper: 1 });
    expect(Math.abs(r0.wavenumber - 2147.081132)).toBeLessThan(5e-4);
    // Positions in the JSON are rounded to their ± (issue 21): the wavelength within a twentieth of
    // its own ± (10⁴σ/ν̃², the derivative of 10⁴/ν̃), the ± itself to two significant digits.
    const sigmaUm = (1e4 * r0.wavenumberUncertainty) / r0.wavenumber ** 2;
    expect(Math.abs(r0.wavelengthVacuumUm - 1e4 / r0.wavenumber)).toBeLessThanOrEqual(sigmaUm / 2);
    expect(
      String(r0.wavenumberUncertainty)
        .replace(/^[0.]+/, "")
        .replace(".", "").length,
    ).toBeLessThanOrEqual(2);
  });
  it("prints CSV with units in the header for another species, band and temperature", async () => {
    const { stdout, exitCode } = await cli("lines", "hcl", "--species", "H37Cl", "--band", "2-0", "--temperature", "500", "--format", "csv");
    expect(exitCode).toBe(0);
    const [comment, positions, header, ...rows] = stdout.trim().split("\n");
    expect(comment).toMatch(/^# accuracy: not validated/);
    expect(positions).toMatch(/^# positions: zero-pressure line centres/);
    expect(header).toContain("wavenumber (cm-1)");
    expect(header).toContain("wavelengthAir (nm)");
    // The HCl first overtone lies near 5668 cm⁻¹ for H35Cl (Huber & Herzberg 1979, from memory); H37Cl ~4 cm⁻¹ lower.
    const wavenumbers = rows.map((r) => Number(r.split(",")[4]));
    expect(Math.min(...wavenumbers)).toBeGreaterThan(5000);
    expect(Math.max(...wavenumbers)).toBeLessThan(6000);
    // The band centre lies midway between P(1) and R(0), across the gap where no line falls.
    const at = (label: string) => wavenumbers[rows.findIndex((r) => r.startsWith(`${label},`))];
    const centre = (at("P(1)") + at("R(0)")) / 2;
    expect(centre).toBeGreaterThan(5655);
    expect(centre).toBeLessThan(5675);
  });
  it("prints a readable table whose header carries the units", async () => {
    const { stdout } = await cli("lines", "co");
    expect(stdout).toMatch(/ν̃ \/ cm⁻¹/);
    expect(stdout).toMatch(/λ vac \/ µm/);
    expect(stdout).toMatch(/R\(0\)\s+2147\.081/);
  });
  const bad: Array<[string[], RegExp]> = [
    [["lines", "xenon"], /unknown molecule "xenon"; the atlas has: c2h2, co/],
    [["lines", "co", "--species", "14C16O"], /no species "14C16O"; it has: 12C16O/],
    [["lines", "co", "--band", "1-1"], /upper level v' must be above the lower level/],
    [["lines", "co", "--band", "0-1"], /upper level v' must be above the lower level/],
    [["lines", "co", "--band", "one"], /not of the form v'-v''/],
    [["lines", "co", "--temperature", "0"], /must be above 0 K/],
    [["lines", "co", "--temperature", "-20"], /must be above 0 K/],
    [["lines", "co", "--temperature", "warm"], /expects a number in K, got "warm"/],
    [["lines", "co", "--format", "xml"], /--format xml is not one of: table, csv, json/],
    [["lines", "co", "--frequency"], /unknown option --frequency/],
    [["lines"], /which molecule\?/],
    [["frobnicate"], /unknown command "frobnicate"/],
    [["find", "abc"], /"abc" is not a position: give a number with an optional unit/],
    [["find", "2143", "--window", "0"], /half-width must be above 0/],
  ];
  for (const [args, pattern] of bad) {
    it(`refuses ${args.join(" ")} with a plain message`, async () => {
      const { stdout, stderr, exitCode } = await cli(...args);
      expect(exitCode).toBeGreaterThan(0);
      expect(stdout).toBe("");
      expect(stderr).toMatch(pattern);
      expect(stderr).not.toMatch(/\n\s+at /);
    });
  }
});

describe("known limitations of a molecule file", () => {
  it("are printed above the table and on the bench sheet", async () => {
    const { stdout } = await cli("lines", "hf");
    expect(stdout).toMatch(/KNOWN LIMITATION: .*Do not calibrate against these HF and DF lines/);
    const dir = mkdtempSync(join(tmpdir(), "bandatlas-limit-"));
    const out = join(dir, "hf.pdf");
    expect((await cli("sheet", "hf", "--out", out)).exitCode).toBe(0);
    const text = execFileSync("pdftotext", [out, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("Known limitation of these constants");
    expect(text).toContain("Do not calibrate against these HF and DF lines");
  });
});

describe("bandatlas find", () => {
  it("lists the lines near 2150 cm⁻¹ nearest first, with their strength relative to the gas and to their band", async () => {
    const { stdout, exitCode } = await cli("find", "2150", "--window", "3", "--format", "json");
    expect(exitCode).toBe(0);
    const { query, matches } = JSON.parse(stdout);
    expect(query).toMatchObject({ wavenumber: 2150, window: 3, temperatureK: 296 });
    expect(matches.length).toBeGreaterThan(1);
    for (let i = 1; i < matches.length; i++) expect(Math.abs(matches[i].offset)).toBeGreaterThanOrEqual(Math.abs(matches[i - 1].offset));
    for (const m of matches) {
      expect(Math.abs(m.offset)).toBeLessThanOrEqual(3);
      expect(Object.keys(m)).toEqual([
        "molecule",
        "species",
        "band",
        "label",
        "wavenumber",
        "wavenumberUncertainty",
        "positionStatus",
        "relativeIntensity",
        "gasRelativeIntensity",
        "offset",
        "strengthKnown",
      ]);
      expect(m.gasRelativeIntensity).toBeGreaterThanOrEqual(1e-3);
    }
  });
  it("does not send a user after hot bands a millionth as strong: near H35Cl R(0) only the fundamental line is found", async () => {
    // At 296 K the v = 1 population of HCl is exp(−c2·2886/296) ≈ 1e-6 of v = 0 (fact of the trade),
    // so 2-1 lines near 2906 cm⁻¹ fall far below 1e-3 of the gas's strongest line.
    const { stdout } = await cli("find", "2906.25", "--window", "0.5", "--format", "json");
    const { matches } = JSON.parse(stdout);
    expect(matches.map((m: { species: string; band: string; label: string }) => `${m.species} ${m.band} ${m.label}`)).toEqual(["1H35Cl 1-0 R(0)"]);
    const all = JSON.parse((await cli("find", "2906.25", "--window", "0.5", "--min-relative", "0", "--format", "json")).stdout).matches;
    const hot = all.filter((m: { band: string }) => m.band === "2-1");
    expect(hot.length).toBeGreaterThan(0);
    for (const m of hot) expect(m.gasRelativeIntensity).toBeLessThan(1e-5);
  });
  it("finds CO R(0) when asked at its published position", async () => {
    // CRC Handbook, Maki CO 1-0 table: R(0) = 2147.081132 cm⁻¹.
    const { stdout } = await cli("find", "2147.0811", "--window", "0.01", "--format", "json");
    expect(JSON.parse(stdout).matches[0]).toMatchObject({ molecule: "co", species: "12C16O", band: "1-0", label: "R(0)" });
  });
});

describe("bandatlas check", () => {
  it("passes every shipped molecule file", async () => {
    const { stdout, exitCode } = await cli("check");
    expect(exitCode).toBe(0);
    expect(stdout).toMatch(/valid: .*co.*hcl/);
  });
  it("exits 1 with one line per problem for a bad file", async () => {
    const { stderr, exitCode } = await cli("check", join(root, "test/fixtures/bad/unknown-key.yaml"), join(root, "test/fixtures/bad/zero-b.yaml"));
    expect(exitCode).toBe(1);
    expect(stderr.trim().split("\n")).toHaveLength(3);
  });
});

describe("the installed command", () => {
  it("runs through bin/bandatlas.js with help and exit codes", () => {
    const help = execFileSync(process.execPath, [join(root, "bin/bandatlas.js"), "--help"], { encoding: "utf8" });
    expect(help).toMatch(/lines\s+predicted P and R lines/);
    const linesHelp = execFileSync(process.execPath, [join(root, "bin/bandatlas.js"), "lines", "--help"], { encoding: "utf8" });
    expect(linesHelp).toMatch(/--species/);
    const failed = spawnSync(process.execPath, [join(root, "bin/bandatlas.js"), "lines", "co", "--temperature", "0"], { encoding: "utf8" });
    expect(failed.status).toBe(2);
    expect(failed.stderr).toMatch(/above 0 K/);
  });

  it("builds under the heap cap in a second Node, passing on its message and exit code", () => {
    // bin/heapCap.js: build and serve run with --max-old-space-size unless the user chose a size.
    expect(heapCapArgs([], "")).toEqual([`--max-old-space-size=${buildHeapCapMb}`]);
    expect(heapCapArgs(["--max-old-space-size=2048"], "")).toEqual([]);
    expect(heapCapArgs([], "--max-old-space-size=100 --trace-warnings")).toEqual([]);
    const bad = spawnSync(process.execPath, [join(root, "bin/bandatlas.js"), "build", "--molecules", join(root, "test/fixtures/bad/negative-b.yaml")], {
      encoding: "utf8",
    });
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toMatch(/negative-b\.yaml/);
    expect(bad.stderr).not.toMatch(/\n\s+at /);
  });
});
