import { describe, expect, it } from "vitest";
import { bandLines, equilibriumToDunham, reducedMassU, type SpeciesModel } from "../lib/core/index.ts";
import { shippedDiatomic, shippedSpecies } from "./helpers/shipped.ts";

const at296 = { temperatureK: 296 };
const line = (result: ReturnType<typeof bandLines>, label: string) => {
  const found = result.lines.find((l) => l.label === label);
  if (!found) throw new Error(`no ${label}`);
  return found;
};

describe("12C16O 1-0 against published values", () => {
  const co = bandLines(shippedSpecies("co"), { vUpper: 1, vLower: 0 }, at296);
  it("puts the band origin at 2143.27 cm⁻¹", () => {
    // Huber & Herzberg (1979), X¹Σ⁺ of 12C16O: ν0(1-0) = 2143.27 cm⁻¹ (from memory; the 1-0 origin
    // quoted throughout the calibration literature).
    expect(co.bandOrigin).toBeCloseTo(2143.271, 2);
  });
  it("reproduces the low-J calibration lines to 5e-4 cm⁻¹", () => {
    // A. Maki, "Infrared and far-infrared absorption frequency standards", CRC Handbook of
    // Chemistry and Physics, table "Wavenumbers for the v = 1-0 band of CO" (from Maki & Wells,
    // NIST SP 821, 1991), read directly. Handbook constants are good to ~1e-4–1e-3 cm⁻¹ for CO.
    const published: Record<string, number> = {
      "R(0)": 2147.081132,
      "R(1)": 2150.856006,
      "R(2)": 2154.595581,
      "R(3)": 2158.29971,
      "P(1)": 2139.426071,
      "P(2)": 2135.546178,
      "P(3)": 2131.631574,
      "P(4)": 2127.682404,
    };
    for (const [label, wavenumber] of Object.entries(published)) {
      expect(Math.abs(line(co, label).wavenumber - wavenumber), label).toBeLessThan(5e-4);
    }
  });
  it("has R lines above and P lines below the origin, no line at the origin, P starting at P(1)", () => {
    // Fact of the trade (common practice, no source): ΔJ = ±1 only, no Q branch in ¹Σ–¹Σ.
    for (const l of co.lines) {
      if (l.branch === "R") expect(l.wavenumber).toBeGreaterThan(co.bandOrigin);
      else expect(l.wavenumber).toBeLessThan(co.bandOrigin);
    }
    expect(co.lines.some((l) => l.label === "P(0)")).toBe(false);
    expect(Math.min(...co.lines.filter((l) => l.branch === "P").map((l) => l.jLower))).toBe(1);
    expect(Math.min(...co.lines.map((l) => Math.abs(l.wavenumber - co.bandOrigin)))).toBeGreaterThan(3.5);
  });
  it("leaves a gap of about 4B between R(0) and P(1)", () => {
    // Fact of the trade (common practice, no source): R(0) − P(1) = 2(B'+B'') − … ≈ 4B.
    const gap = line(co, "R(0)").wavenumber - line(co, "P(1)").wavenumber;
    const bE = 1.93128087;
    expect(gap / (4 * bE)).toBeGreaterThan(0.97);
    expect(gap / (4 * bE)).toBeLessThan(1.0);
  });
  it("peaks near J'' = 7 at 296 K, as the rotational populations of CO do", () => {
    // J_max ≈ √(kT/2hcB) − ½ ≈ 7 for B ≈ 1.92 cm⁻¹ at 296 K (Herzberg 1950, ch. III).
    const strongestR = co.lines.filter((l) => l.branch === "R").reduce((a, b) => (a.relativeIntensity > b.relativeIntensity ? a : b));
    expect(strongestR.jLower).toBeGreaterThanOrEqual(6);
    expect(strongestR.jLower).toBeLessThanOrEqual(8);
    expect(Math.max(...co.lines.map((l) => l.relativeIntensity))).toBe(1);
  });
  it("propagates uncertainties that grow with J", () => {
    expect(line(co, "R(20)").wavenumberUncertainty).toBeGreaterThan(line(co, "R(0)").wavenumberUncertainty);
    expect(line(co, "R(0)").wavenumberUncertainty).toBeGreaterThan(0);
  });
});

describe("rigid rotor and harmonic oscillator limit", () => {
  const bCm = 10;
  const rigid: SpeciesModel = {
    structure: "diatomic",
    label: "rigid",
    massNumbers: [1, 35],
    atomMassesU: [1, 35],
    abundance: 1,
    reducedMassU: reducedMassU(1, 35),
    dunham: equilibriumToDunham({ omegaE: 3000, bE: bCm }),
    constantsOrigin: "cited",
    constantsSourceKey: "none",
    intensities: [],
    referenceLines: [],
  };
  const result = bandLines(rigid, { vUpper: 1, vLower: 0 }, at296);
  it("spaces the lines by exactly 2B within each branch", () => {
    // Fact of the trade (common practice, no source): with B' = B'' the lines are ν0 ± 2B·m.
    const r = result.lines.filter((l) => l.branch === "R");
    for (let i = 1; i < r.length; i++) expect(r[i].wavenumber - r[i - 1].wavenumber).toBeCloseTo(2 * bCm, 9);
    expect(result.bandOrigin).toBeCloseTo(3000, 9);
  });
});

describe("vibrational populations", () => {
  it("puts almost every CO molecule in v = 0 at room temperature", () => {
    // Fact of the trade (common practice, no source): exp(−hcω/kT) ≈ 3e-5 for CO at 296 K.
    const co = bandLines(shippedSpecies("co"), { vUpper: 1, vLower: 0 }, { temperatureK: 296, minRelative: 0 });
    const inV0 = co.lines.filter((l) => l.branch === "R").reduce((s, l) => s + l.populationFraction, 0);
    expect(inV0).toBeGreaterThan(0.9999);
    expect(inV0).toBeLessThanOrEqual(1 + 1e-12);
  });
});

describe("band heads", () => {
  it("finds the R-branch head of the CO 2-0 overtone without assuming monotonic branches", () => {
    // Since B1 < B0 the R branch turns back (a band head) near J'' ≈ B/(B0−B1) ~ 50 for 2-0;
    // sorted by wavenumber, lines past the head fall between earlier R lines.
    const co = bandLines(shippedSpecies("co"), { vUpper: 2, vLower: 0 }, { temperatureK: 3000, minRelative: 0 });
    const r = co.lines.filter((l) => l.branch === "R").sort((a, b) => a.jLower - b.jLower);
    const head = r.reduce((a, b) => (a.wavenumber > b.wavenumber ? a : b));
    expect(head.jLower).toBeGreaterThan(30);
    expect(head.jLower).toBeLessThan(r[r.length - 1].jLower);
    for (let i = 1; i < co.lines.length; i++) expect(co.lines[i].wavenumber).toBeGreaterThanOrEqual(co.lines[i - 1].wavenumber);
  });
});

describe("isotopologues", () => {
  it("scales the 12C16O constants to 13C16O with its published band origin", () => {
    // 13C16O ν0(1-0) = 2096.07 cm⁻¹ (from memory; Huber & Herzberg 1979 list 13C16O separately).
    const result = bandLines(shippedSpecies("co", "13C16O"), { vUpper: 1, vLower: 0 }, at296);
    expect(Math.abs(result.bandOrigin - 2096.07)).toBeLessThan(0.05);
  });
  it("scales H35Cl to D35Cl and widens the ± by the isotope-scaling bound", () => {
    // D35Cl carries no constants of its own (none could be cited): it is scaled from H35Cl, and its
    // ± must include the Born–Oppenheimer bound of positionErrors.ts (2·m_e·|1/M_D − 1/M_H| of each Y_kl).
    const d = shippedDiatomic("hcl", "D35Cl");
    expect(d.constantsOrigin).toBe("isotope-scaled");
    const result = bandLines(d, { vUpper: 1, vLower: 0 }, at296);
    const r0 = result.lines.find((l) => l.label === "R(0)")!;
    // m_e = 5.4858e-4 u (CODATA 2018); M(1H) = 1.00783 u, M(2H) = 2.01410 u (AME 2020, from memory).
    const bound = 2 * 5.4858e-4 * Math.abs(1 / 2.0141 - 1 / 1.00783) * r0.wavenumber;
    expect(r0.wavenumberUncertainty).toBeGreaterThan(0.5 * bound);
    // DCl fundamental near 2091 cm⁻¹ (from memory).
    expect(result.bandOrigin).toBeGreaterThan(2080);
    expect(result.bandOrigin).toBeLessThan(2100);
  });
  it("gives H37Cl lines below H35Cl by about 2 cm⁻¹ near the origin", () => {
    // The chlorine isotope splitting of the HCl fundamental, ~2.0 cm⁻¹ (from memory; visible as
    // doublets in any HCl gas-cell spectrum).
    const h35 = bandLines(shippedSpecies("hcl", "H35Cl"), { vUpper: 1, vLower: 0 }, at296).bandOrigin;
    const h37 = bandLines(shippedSpecies("hcl", "H37Cl"), { vUpper: 1, vLower: 0 }, at296).bandOrigin;
    expect(h35 - h37).toBeGreaterThan(1.9);
    expect(h35 - h37).toBeLessThan(2.3);
  });
});
