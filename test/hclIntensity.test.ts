// HCl's cited intensities (Suzuki 1972, Table 2, from Toth, Hunt & Plyler 1970) against an
// independent band strength and against a real measured spectrum.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { Matrix, solve } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { calibrateMeasuredSpectrum, cellLinesOfModel, cellModel, defaultCellConditions, selectMolecule } from "../lib/atlas/index.ts";
import { boltzmannJK, hermanWallisFactor } from "../lib/core/index.ts";
import { readSpectrumText } from "../lib/spectrumFile/index.ts";
import { shippedMolecules } from "./helpers/shipped.ts";

const hcl = () => selectMolecule(shippedMolecules(), "hcl");

describe("HCl intensities", () => {
  it("the 1-0 band at natural abundance sums to 130 cm⁻² atm⁻¹ at 300 K within 10 % (value 'good to about 5 %' read in an abstract, attributed to W. S. Benedict et al., attribution not verified)", () => {
    const conditions = { ...defaultCellConditions, temperatureK: 300 };
    const set = cellLinesOfModel(cellModel(hcl()), conditions);
    const sum = set.lines.filter((l) => l.band === "1-0" && /^1H3[57]Cl$/.test(l.species)).reduce((s, l) => s + l.intensity, 0);
    // cm/molecule × molecules per cm³ at 1 atm and 300 K (ideal gas) = cm⁻² atm⁻¹.
    const perAtm = (sum * 101325) / (boltzmannJK * 300) / 1e6;
    expect(perAtm).toBeGreaterThan(130 * 0.9);
    expect(perAtm).toBeLessThan(130 * 1.1);
  });

  it("the Herman–Wallis factors explain the P/R asymmetry of a real spectrum: the peak-height scatter drops by at least 40 %", () => {
    // Teaching-lab FTIR spectrum (test/fixtures/spectra/hcl-dcl-hunter, MIT licence): peak heights
    // ≤ 0.14 absorbance, optically thin, at one resolution for all lines, so a height is the line's
    // intensity times one common factor. The fit allows a free scale and a free Boltzmann slope
    // (the cell's temperature is not stated), then compares the log residuals with and without
    // the factors (1 − 0.026 m + 0.00045 m²).
    const text = readFileSync(join(import.meta.dirname, "fixtures", "spectra", "hcl-dcl-hunter", "HCl_spectrum.csv"), "utf8");
    const spectrum = readSpectrumText(text, "HCl_spectrum.csv");
    const { result } = calibrateMeasuredSpectrum(
      cellModel(hcl()),
      { wavenumberCm: spectrum.wavenumberCm, absorbance: spectrum.absorbance, resolutionCm: null },
      { conditions: defaultCellConditions, apodization: "triangular", model: "scale" },
    );
    const coefficients = { a1: -0.026, a2: 0.00045 };
    const rows = result.lines
      .filter((l) => l.peak && l.reference.species === "1H35Cl" && l.peak.signalToNoise >= 20 && l.peak.heightAbsorbance < 0.5)
      .map((l) => {
        const j = Number(/\((\d+)\)/.exec(l.reference.label)![1]);
        const m = l.reference.label.startsWith("P") ? -j : j + 1;
        return { m, lowerJ: j, logHeight: Math.log(l.peak!.heightAbsorbance), logPredicted: Math.log(l.reference.relativeToStrongest) };
      });
    expect(rows.length).toBeGreaterThanOrEqual(16);
    const scatter = (withFactors: boolean) => {
      const design = new Matrix(rows.map((r) => [1, r.lowerJ * (r.lowerJ + 1)]));
      const y = Matrix.columnVector(rows.map((r) => r.logHeight - r.logPredicted + (withFactors ? 0 : Math.log(hermanWallisFactor(coefficients, r.m)))));
      const p = solve(design, y);
      const residuals = rows.map((r, i) => y.get(i, 0) - p.get(0, 0) - p.get(1, 0) * r.lowerJ * (r.lowerJ + 1));
      return Math.sqrt(residuals.reduce((s, v) => s + v * v, 0) / residuals.length);
    };
    expect(scatter(true)).toBeLessThan(0.6 * scatter(false));
  });
});
