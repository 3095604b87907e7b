// `bandatlas calibrate` end to end: the two real teaching-laboratory HCl spectra (MIT-licensed
// copies in test/fixtures/spectra, provenance beside them) and every kind of bad input.
import { mkdtempSync, readdirSync, truncateSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { cellModel, defaultCellConditions, selectMolecule } from "../lib/atlas/index.ts";
import { shippedMolecules } from "./helpers/shipped.ts";
import { coCellJcamp } from "./helpers/coCellJcamp.ts";
import { measuredSpectrum, seededRandom, trueSpectrum } from "../lib/atlas/syntheticSpectrum.ts";

const spectra = join(import.meta.dirname, "fixtures", "spectra");
const hunter = join(spectra, "hcl-dcl-hunter", "HCl_spectrum.csv");
const pitt = join(spectra, "hcl-dcl-pitt", "Freeman.csv");
const dir = mkdtempSync(join(tmpdir(), "bandatlas-calibrate-"));

interface Document {
  correction: { scalePpm: number; scalePpmUncertainty: number; offsetCm: number; offsetCmUncertainty: number };
  rmsResidualCm: number;
  linesUsed: number;
  lines: Array<{
    label: string;
    species: string;
    reference: number;
    measured: number | null;
    residual: number | null;
    used: boolean;
    reason: string | null;
    referenceUncertainty: number;
    measuredUncertainty: number | null;
  }>;
}

async function calibrate(...args: string[]): Promise<Document> {
  const { stdout, stderr, exitCode } = await runCli(["calibrate", ...args, "--format", "json"]);
  expect(stderr).toBe("");
  expect(exitCode).toBe(0);
  return JSON.parse(stdout) as Document;
}

async function refusal(...args: string[]): Promise<string> {
  const { stdout, stderr, exitCode } = await runCli(["calibrate", ...args]);
  expect(stdout).toBe("");
  expect(exitCode).toBe(2);
  expect(stderr).not.toMatch(/\n\s+at |internal error/);
  expect(stderr.trim().split("\n")).toHaveLength(1);
  return stderr;
}

/** A synthetic spectrum (our own cell model, invented measurement) written as CSV. */
function syntheticCsv(name: string, conditions = defaultCellConditions, fromCm = 2000, toCm = 2260): string {
  const cell = cellModel(selectMolecule(shippedMolecules(), "co"));
  const truth = trueSpectrum(cell, conditions, 0.5, "triangular", fromCm - 5, toCm + 5);
  const m = measuredSpectrum(
    truth,
    fromCm,
    toCm,
    0.125,
    { scale: 0, offsetCm: 0, noiseAbsorbance: 0.002, tiltPerCm: 0, baselineAbsorbance: 0.01 },
    seededRandom(9),
  );
  const path = join(dir, name);
  writeFileSync(
    path,
    [
      "# invented spectrum made by the bandatlas cell model",
      "wavenumber (cm-1),absorbance",
      ...Array.from(m.wavenumberCm, (x, i) => `${x.toFixed(4)},${m.absorbance[i].toFixed(5)}`),
    ].join("\n"),
  );
  return path;
}

describe("real spectra from two teaching-laboratory FTIRs", () => {
  it("each used line's residual lies within 3σ, and the scale model agrees with the linear model", async () => {
    for (const file of [hunter, pitt]) {
      const scale = await calibrate(file, "--gas", "hcl");
      expect(scale.linesUsed).toBeGreaterThanOrEqual(3);
      for (const line of scale.lines.filter((l) => l.used)) {
        const sigma = Math.hypot(line.referenceUncertainty, line.measuredUncertainty!);
        expect(Math.abs(line.residual!)).toBeLessThan(3 * sigma + 1e-4);
      }
      // Freeman.csv leaves 3 lines (its strong H³⁵Cl lines are saturated): enough for a scale, too few for two terms.
      if (file === pitt) continue;
      const linear = await calibrate(file, "--gas", "hcl", "--model", "linear");
      // The two models describe the same instrument at the band: their corrections at 2900 cm⁻¹ agree within the linear model's ±.
      const atBand = (d: Document) => 2900 * d.correction.scalePpm * 1e-6 + d.correction.offsetCm;
      expect(Math.abs(atBand(scale) - atBand(linear))).toBeLessThan(
        3 * Math.hypot(2900e-6 * linear.correction.scalePpmUncertainty, linear.correction.offsetCmUncertainty) + 0.01,
      );
    }
  });

  it("after their corrections, the two instruments put H³⁵Cl R(0) and P(1) at the same wavenumber within the combined ±", async () => {
    const a = await calibrate(hunter, "--gas", "hcl");
    const b = await calibrate(pitt, "--gas", "hcl");
    // Raw, the two files disagree by ≈0.2 cm⁻¹ at these lines (a 7·10⁻⁵ scale difference).
    for (const label of ["R(0)", "P(1)"]) {
      const lineA = a.lines.find((l) => l.species === "1H35Cl" && l.label === label)!;
      const lineB = b.lines.find((l) => l.species === "1H35Cl" && l.label === label)!;
      const corrected = (d: Document, measured: number) => measured * (1 + d.correction.scalePpm * 1e-6) + d.correction.offsetCm;
      const raw = Math.abs(lineA.measured! - lineB.measured!);
      const after = Math.abs(corrected(a, lineA.measured!) - corrected(b, lineB.measured!));
      const sigma = Math.hypot(
        2906 * a.correction.scalePpmUncertainty * 1e-6,
        2906 * b.correction.scalePpmUncertainty * 1e-6,
        lineA.measuredUncertainty!,
        lineB.measuredUncertainty!,
      );
      expect(raw).toBeGreaterThan(0.1);
      expect(after).toBeLessThan(3 * sigma + 0.01);
    }
  });

  it("prints the correction box, every line's reason and the caution in the table", async () => {
    const { stdout, exitCode } = await runCli(["calibrate", pitt, "--gas", "hcl"]);
    expect(exitCode).toBe(0);
    expect(stdout).toMatch(/│ scale k = [+−]\d+(\.\d+)? ± \d+(\.\d+)? ppm\s+│/);
    expect(stdout).toMatch(/saturated: peak absorbance 1\.\d\d ≥ 1/);
    expect(stdout).toMatch(/blended: beside a strong peak/);
    expect(stdout).toMatch(/does not certify an instrument/);
    expect(stdout).toMatch(/safety data sheet/);
  });
});

describe("a JCAMP-DX file", () => {
  it("a synthetic CO cell written as JCAMP-DX (XFACTOR/YFACTOR, transmittance, ##RESOLUTION) with a +150 ppm scale error: recovered within 3σ", async () => {
    const path = join(dir, "co-cell.jdx");
    writeFileSync(path, coCellJcamp({ scale: 150e-6, seed: 21, jcampVersion: "4.24", firstY: true }));
    const doc = await calibrate(path, "--gas", "co");
    // true = measured·(1 + k): the file's scale is 150 ppm short, so k = +150 ppm.
    expect(Math.abs(doc.correction.scalePpm - 150)).toBeLessThan(3 * doc.correction.scalePpmUncertainty);
    expect(doc.correction.scalePpmUncertainty).toBeLessThan(5);
    const { stdout } = await runCli(["calibrate", path, "--gas", "co"]);
    expect(stdout).toMatch(/FT resolution 0\.5 cm⁻¹ \(file\)/);
  });
});

describe("a near-infrared spectrum in nm", () => {
  it("an invented acetylene cell written in descending vacuum nm with a +20 ppm scale error: recovered within 3σ, and the air-wavelength caveat is stated", async () => {
    const cell = cellModel(selectMolecule(shippedMolecules(), "c2h2"));
    const truth = trueSpectrum(cell, defaultCellConditions, 0.1, "triangular", 6440, 6640);
    const m = measuredSpectrum(
      truth,
      6450,
      6630,
      0.025,
      { scale: 20e-6, offsetCm: 0, noiseAbsorbance: 0.003, tiltPerCm: 0, baselineAbsorbance: 0.01 },
      seededRandom(3),
    );
    const rows = ["wavelength (nm),absorbance"];
    for (let i = m.wavenumberCm.length - 1; i >= 0; i--) rows.push(`${(1e7 / m.wavenumberCm[i]).toFixed(6)},${m.absorbance[i].toFixed(5)}`);
    const path = join(dir, "c2h2-nm.csv");
    writeFileSync(path, rows.join("\n"));
    const doc = await calibrate(path, "--gas", "c2h2", "--resolution", "0.1");
    expect(Math.abs(doc.correction.scalePpm - 20)).toBeLessThan(3 * doc.correction.scalePpmUncertainty + 0.01);
    const { stdout } = await runCli(["calibrate", path, "--gas", "c2h2", "--resolution", "0.1"]);
    expect(stdout).toMatch(/taken as vacuum wavelengths; an axis in standard air shows here as a scale error of about −273 ppm/);
  });
});

describe("bad input: one sentence, exit 2, nothing written", () => {
  it("not a spectrum, empty, one column, NaN, µm without a unit", async () => {
    expect(await refusal(join(import.meta.dirname, "..", "molecules", "hcl.yaml"), "--gas", "hcl")).toMatch(/hcl\.yaml does not look like a spectrum/);
    writeFileSync(join(dir, "empty.csv"), "");
    expect(await refusal(join(dir, "empty.csv"), "--gas", "hcl")).toMatch(/empty\.csv is empty/);
    writeFileSync(join(dir, "one.csv"), Array.from({ length: 30 }, (_, i) => `${2000 + i}`).join("\n"));
    expect(await refusal(join(dir, "one.csv"), "--gas", "co")).toMatch(/one\.csv has only one column/);
    writeFileSync(join(dir, "nan.csv"), ["x,y", ...Array.from({ length: 30 }, (_, i) => `${2000 + i},${i === 12 ? "NaN" : 0.1}`)].join("\n"));
    expect(await refusal(join(dir, "nan.csv"), "--gas", "co")).toMatch(/nan\.csv line 14: "NaN" is not a/);
    writeFileSync(join(dir, "um.csv"), Array.from({ length: 30 }, (_, i) => `${(4.5 + i * 0.01).toFixed(2)},0.1`).join("\n"));
    expect(await refusal(join(dir, "um.csv"), "--gas", "co")).toMatch(/um\.csv: the x values .* look like micrometres.*--x um/);
  });

  it("a file over 50 MB is refused before it is read", async () => {
    const big = join(dir, "big.csv");
    writeFileSync(big, "");
    truncateSync(big, 51 * 1024 * 1024);
    expect(await refusal(big, "--gas", "co")).toMatch(/big\.csv is 51\.0 MB, more than the 50 MB/);
  });

  it("the wrong gas, too few lines, saturated lines", async () => {
    expect(await refusal(hunter, "--gas", "co")).toMatch(/covers 2650\.0–3100\.0 cm⁻¹, where carbon monoxide has no lines/);
    expect(await refusal(syntheticCsv("co.csv"), "--gas", "n2o")).toMatch(/does not look like nitrous oxide|cannot be told apart|too few lines/);
    expect(await refusal(syntheticCsv("narrow.csv", defaultCellConditions, 2145, 2153), "--gas", "co", "--model", "linear", "--resolution", "0.5")).toMatch(
      /too few lines to calibrate: \d usable lines? of carbon monoxide/,
    );
    const black = syntheticCsv("black.csv", { temperatureK: 296, pressurePa: 101325, moleFraction: 1, pathCm: 100 });
    expect(await refusal(black, "--gas", "co", "--pressure", "1", "atm", "--path", "1", "m")).toMatch(
      /saturated.*lower the pressure, dilute the gas or shorten the path/,
    );
  });

  it("a refused calibration writes only a short report saying why (issue 24), and bad options none", async () => {
    const before = readdirSync(dir).filter((f) => f.endsWith(".pdf"));
    expect(await refusal(hunter, "--gas", "co", "--report", join(dir, "r.pdf"))).toMatch(/no lines .*\(a report saying why is in .*r\.pdf\)/);
    expect(readdirSync(dir).filter((f) => f.endsWith(".pdf"))).toEqual([...before, "r.pdf"].sort());
    await refusal(hunter, "--gas", "hcl", "--model", "cubic", "--report", join(dir, "bad.pdf"));
    expect(readdirSync(dir)).not.toContain("bad.pdf");
  });

  it("an enriched cell: --species keeps only those lines; DCl's isotope-scaled positions are too uncertain to calibrate with", async () => {
    expect(await refusal(pitt, "--gas", "hcl", "--species", "D35Cl")).toMatch(
      /no line of hydrogen chloride in .* is precise and isolated enough to serve as a reference/,
    );
    expect(await refusal(pitt, "--gas", "hcl", "--species", "H2O")).toMatch(/Hydrogen chloride has no species "H2O"; it has: 1H35Cl, 1H37Cl, 2H35Cl/);
    const h35 = await calibrate(hunter, "--gas", "hcl", "--species", "H35Cl");
    expect(h35.lines.every((l) => l.species === "1H35Cl")).toBe(true);
  });

  it("options: an unknown model, a missing gas, a missing file", async () => {
    expect(await refusal(hunter, "--gas", "hcl", "--model", "cubic")).toMatch(/--model cubic: use one of scale, offset, linear, quadratic/);
    expect(await refusal(hunter)).toMatch(/give --gas/);
    expect(await refusal(join(dir, "nothing.csv"), "--gas", "hcl")).toMatch(/cannot read .*nothing\.csv: no such file/);
  });
});

describe("the budget and the references' standing on every output (issue 20)", () => {
  it("HCl_spectrum.csv: the JSON carries the budget, whose total is the printed ±, and says the references are not validated", async () => {
    const { stdout, exitCode } = await runCli(["calibrate", hunter, "--gas", "hcl", "--format", "json"]);
    expect(exitCode).toBe(0);
    const doc = JSON.parse(stdout);
    const budget = doc.correction.budget;
    const parts = budget.parts.map((p: { part: string }) => p.part);
    expect(parts).toEqual(expect.arrayContaining(["measurement", "omitted-term"]));
    // The parts are independent: their quadrature sum is the total, and the total is the printed ±.
    const sum = Math.sqrt(budget.parts.reduce((s: number, p: { scalePpm: number }) => s + p.scalePpm ** 2, 0));
    expect(sum).toBeCloseTo(budget.totalScalePpm, 0);
    expect(doc.correction.scalePpmUncertainty).toBeCloseTo(budget.totalScalePpm, 0);
    // H35Cl P(1) printed from the handbook table misses the measured line by about 0.06 cm⁻¹
    // (2865.098 cm⁻¹, from memory): a shared 0.06 cm⁻¹ at 2885 cm⁻¹ is 21 ppm, which the ± must cover.
    expect(budget.totalScalePpm).toBeGreaterThan(15);
    expect(doc.correction.referenceStanding).toBe("not-validated");
    expect(doc.correction.referenceStandingNote).toMatch(/this correction is not traceable/);
  });

  it("the table prints the budget under the box and the standing line inside it", async () => {
    const { stdout } = await runCli(["calibrate", hunter, "--gas", "hcl"]);
    expect(stdout).toMatch(/│ references not validated against measured lines \(\d+ of \d+ used\): this correction is not traceable\s+│/);
    expect(stdout).toMatch(/uncertainty budget\s+σ\(k\) \/ ppm\s+σ\(c\) \/ cm⁻¹\s+sources/);
    expect(stdout).toMatch(/total \(quadrature sum\)\s+\d+/);
  });

  it("--require-validated refuses HCl, whose constants no measured line validates, and says why", async () => {
    const { stderr, exitCode } = await runCli(["calibrate", hunter, "--gas", "hcl", "--require-validated"]);
    expect(exitCode).not.toBe(0);
    expect(stderr).toMatch(/validated references were required: 0 of the \d+ lines of hydrogen chloride found .* are validated against measured lines/);
  });
});
