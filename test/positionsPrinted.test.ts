// Issue 21, "Positions": every printed position carries its ± and its status and is rounded to
// its ± (two significant digits of it); band origins get the larger ± of their first P and R
// lines; one residual sign (atlas − measured); a band whose measured lines miss it reads
// "contradicted by measured lines"; `find` lists lines of unknown strength apart.
import { describe, expect, it } from "vitest";
import { atlasEntry, bandOriginBound, calibrationResolutionsCm, defaultTemperatureK } from "../lib/atlas/index.ts";
import { contradictionResidualLimitCm, defaultCalibrationCriteria } from "../lib/core/index.ts";
import { bandOriginText, linesDocument, positionWithUncertainty, residualSignText, roundedToUncertainty } from "../lib/format/index.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { accuracyRows } from "../lib/site/accuracyRows.ts";
import { nearInfraredRows } from "../lib/site/nearInfraredIndex.ts";
import { runCli } from "../lib/cli/main.ts";

const molecules = loadMoleculesOrThrow();
const entries = molecules.flatMap((m) => m.species.map((s) => atlasEntry(m, s, defaultTemperatureK)));
const entryOf = (id: string, species: string) => entries.find((e) => e.moleculeId === id && e.species === species)!;

describe("rounding a position to its ±", () => {
  it("keeps two significant digits of the ± and the position to the same decimal place", () => {
    // The rule of issue 21 (common practice, no source); the numbers are the examples.
    expect(positionWithUncertainty(3072.3345, 2.4)).toMatchObject({ value: "3072.3", sigma: "2.4" });
    expect(positionWithUncertainty(2752.0046, 0.51)).toMatchObject({ value: "2752.00", sigma: "0.51" });
    expect(positionWithUncertainty(11336.4, 90)).toMatchObject({ value: "11336", sigma: "90" });
    // A ± above 100 rounds the position to tens; 0.0996 rounds up to 0.10, not 0.100.
    expect(positionWithUncertainty(11336.4, 393)).toMatchObject({ value: "11340", sigma: "390" });
    expect(positionWithUncertainty(1.23456, 0.0996)).toMatchObject({ value: "1.23", sigma: "0.10" });
    expect(roundedToUncertainty(2147.0811287123, 0.0000048)).toBe(2147.0811287);
  });
});

describe("the lines table, CSV and JSON", () => {
  it("prints HCl P(6) as 2752.00 ± 0.51, not validated (issue 21's example)", async () => {
    const { stdout } = await runCli(["lines", "hcl"]);
    expect(stdout).toMatch(/^P\(6\)\s+2752\.00\s+0\.51\s+not validated\s/m);
    // The band origin carries its ± and status, and says where the ± comes from.
    expect(stdout).toMatch(/band origin 2886\.\d+ ± 0\.\d+ cm⁻¹ \(not validated\)/);
    expect(stdout).toContain("a band origin is no line");
  });
  it("gives the band origin its ± in the JSON, rounded like the lines", () => {
    const band = entryOf("hf", "1H19F").bands.find((b) => b.label === "3-0")!;
    const doc = linesDocument("hf", band.lines);
    const bound = bandOriginBound(band.lines);
    const p1 = band.lines.lines.find((l) => l.label === "P(1)")!;
    const r0 = band.lines.lines.find((l) => l.label === "R(0)")!;
    expect(bound.uncertainty).toBe(Math.max(p1.wavenumberUncertainty, r0.wavenumberUncertainty));
    expect(doc.bandOriginUncertainty).toBe(roundedToUncertainty(bound.uncertainty!, bound.uncertainty!));
    expect(doc.bandOrigin).toBe(roundedToUncertainty(band.lines.bandOrigin, bound.uncertainty!));
    expect(doc.bandOriginStatus).toBe("extrapolated");
    // HF 3-0: the issue saw "11336.4000 cm⁻¹" with a ± of tens of cm⁻¹; now no digit below the ±.
    expect(bandOriginText(bound)).toMatch(/^113\d0 ± \d{2,3} cm⁻¹ \(extrapolated\)$/);
  });
});

describe("bands by wavelength", () => {
  it("prints each origin in nm and cm⁻¹ with its ± and status", () => {
    const rows = nearInfraredRows(molecules, entries);
    const hf30 = rows.find((r) => r.species === "1H19F" && r.band === "3-0")!;
    expect(hf30.originCm).toMatch(/^113\d0 ± \d+$/);
    expect(hf30.originNm).toMatch(/^88\d ± \d+$/);
    expect(hf30.originStatus).toBe("extrapolated");
    for (const r of rows) expect(r.originCm).toContain("±");
  });
});

describe("status words say whether measured lines agree", () => {
  const rows = accuracyRows(molecules, entries);
  it("calls HF's pure-rotation band contradicted (largest residual 38 cm⁻¹), not validated", () => {
    // Hedderich, Walker and Bernath 1991, Table I, as cited in molecules/hf.yaml.
    const hf = rows.find((r) => r.species === "1H19F" && r.band.startsWith("0-0"))!;
    expect(hf.status).toBe("contradicted by measured lines");
    expect(Number(hf.largest)).toBeGreaterThan(30);
  });
  it("keeps CO 1-0 and acetylene validated, and lists acetylene's band once", () => {
    // Maki (CRC) CO lines and the BIPM acetylene lines agree with the model to 10⁻⁴ cm⁻¹ or better.
    expect(rows.filter((r) => r.species === "12C2H2")).toHaveLength(1);
    expect(rows.find((r) => r.species === "12C2H2")!.status).toBe("validated");
    expect(rows.find((r) => r.species === "12C16O" && r.band === "1-0")!.status).toBe("validated");
  });
  it("sets the contradiction limit at the calibration-grade ± of the coarsest marked resolution", () => {
    expect(contradictionResidualLimitCm).toBeCloseTo(defaultCalibrationCriteria.maxUncertaintyFraction * Math.max(...calibrationResolutionsCm), 12);
  });
});

describe("one residual sign", () => {
  it("prints atlas − measured in the fit report, as on the pages and in calibrate", async () => {
    const { stdout } = await runCli(["fit", "c2h2", "--format", "json"]);
    // One report per fitted species of the file (c2h2.yaml fits 12C2H2, 13C2H2 and 12C2HD).
    const reports = [JSON.parse(stdout)].flat();
    expect(reports.length).toBeGreaterThan(0);
    for (const report of reports) {
      expect(report.residualSign).toBe(residualSignText);
      for (const l of report.lines) expect(l.residual).toBeCloseTo(l.calculated - l.measured, 9);
    }
    const text = (await runCli(["fit", "c2h2"])).stdout;
    expect(text).toContain("calc − meas / cm⁻¹");
    expect(text).toContain(residualSignText);
  });
});

describe("calibration-lines", () => {
  it("prints each line's position to the decimal of its ±, in the text and the JSON", async () => {
    const { stdout } = await runCli(["calibration-lines", "co", "--resolution", "1"]);
    const rows = stdout.split("\n").filter((l) => /^12C16O\s+1-0\s+[PR]\(\d+\)/.test(l));
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      const [, , , position, sigma] = row.trim().split(/\s+/);
      expect(position.split(".")[1]?.length ?? 0, row).toBe(sigma.split(".")[1]?.length ?? 0);
    }
    const json = JSON.parse((await runCli(["calibration-lines", "co", "--resolution", "1", "--format", "json"])).stdout);
    for (const l of json.lines) expect(l.wavenumber).toBe(roundedToUncertainty(l.wavenumber, l.wavenumberUncertainty));
  });
});

describe("find", () => {
  it("prints HCl R(0) with its ± and status, and the offset no finer than the ±", async () => {
    const { stdout } = await runCli(["find", "2906.3", "--window", "1"]);
    // R(0) of H35Cl is not validated (no cited measured HCl line); its ± is 0.089 cm⁻¹.
    expect(stdout).toMatch(/R\(0\)\s+2906\.\d{3}\s+0\.\d{3}\s+not validated\s+\+0\.\d{3}\s/);
    const json = JSON.parse((await runCli(["find", "2906.3", "--window", "1", "--format", "json"])).stdout);
    expect(json.matches[0]).toMatchObject({ label: "R(0)", positionStatus: "not-validated", strengthKnown: true });
    expect(json.matches[0].wavenumberUncertainty).toBeGreaterThan(0);
  });
  it("lists lines whose strength is unknown apart from real ones, and says so (1532.41 nm in air)", async () => {
    const { stdout } = await runCli(["find", "1532.41", "nm", "--air"]);
    const [known, unknown] = stdout.split("Strength unknown:");
    expect(known).toMatch(/c2h2\s+12C2H2/);
    expect(known).not.toContain("1H127I");
    expect(unknown).toMatch(/hi\s+1H127I\s+3-0/);
    expect(unknown).toContain("unknown");
    const json = JSON.parse((await runCli(["find", "1532.41", "nm", "--air", "--format", "json"])).stdout);
    const flags = json.matches.map((m: { strengthKnown: boolean }) => m.strengthKnown);
    expect(flags[0]).toBe(true);
    expect(flags.indexOf(false)).toBeGreaterThan(flags.lastIndexOf(true));
  });
});
