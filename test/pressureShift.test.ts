// Pressure shifts of line centres (lib/core/pressureShift.ts) and the one cited in the shipped
// files: 12C2H2 ν1+ν3 self shift from W. C. Swann and S. L. Gilbert, J. Opt. Soc. Am. B 17, 1263
// (2000), abstract (NIST publication page): +0.008(2) pm/kPa for R1 to +0.043(2) pm/kPa for R27,
// many lines near +0.017 pm/kPa, "equivalently … −0.29 MHz/Torr".
import { describe, expect, it } from "vitest";
import { bandLines, lineCentreShift, speedOfLightCmS, standardAtmospherePa, type GasPressureShift } from "../lib/core/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { shippedMolecules, linearModel } from "./helpers/shipped.ts";

const c2h2 = shippedMolecules().find((m) => m.id === "c2h2")!;
const self = c2h2.pressureShift!.self!;
const torrPa = standardAtmospherePa / 760;
/** A wavelength shift per kPa (pm/kPa, + = to longer wavelength) as cm⁻¹/atm at wavenumber ν̃: δν̃ = −ν̃² δλ. */
const pmPerKpaToCmPerAtm = (pmPerKpa: number, wavenumberCm: number) => -(wavenumberCm ** 2) * pmPerKpa * 1e-10 * (standardAtmospherePa / 1000);

describe("line centre shift", () => {
  const shift: GasPressureShift = { self: { cmPerAtm: -0.01, uncertaintyCmPerAtm: 0.004, sourceKey: "invented" }, air: null };
  it("is linear in the partial pressure of each perturber, and names the perturbers without a cited shift", () => {
    expect(lineCentreShift(shift, standardAtmospherePa, 1)).toEqual({ shiftCm: -0.01, uncertaintyCm: 0.004, uncited: [], sourceKeys: ["invented"] });
    const mixed = lineCentreShift(shift, 2 * standardAtmospherePa, 0.25);
    expect(mixed.shiftCm).toBeCloseTo(-0.005, 12);
    expect(mixed.uncertaintyCm).toBeCloseTo(0.002, 12);
    expect(mixed.uncited).toEqual(["air"]);
    expect(lineCentreShift({ self: null, air: null }, standardAtmospherePa, 1)).toEqual({ shiftCm: 0, uncertaintyCm: 0, uncited: ["self"], sourceKeys: [] });
  });
});

describe("acetylene self shift against its source", () => {
  const model = linearModel(c2h2.species[0].model);
  const lines = bandLines(model, model.linear.bands[0].band, { temperatureK: 296, minRelative: 0 }).lines;
  const at = (label: string) => lines.find((l) => l.label === label)!.wavenumber;

  it("the abstract's two forms agree with each other (0.017 pm/kPa ≈ −0.29 MHz/Torr at 1.53 µm), so the conversion is right", () => {
    const cmPerAtm = pmPerKpaToCmPerAtm(0.017, at("P(13)"));
    const mhzPerTorr = ((cmPerAtm * speedOfLightCmS) / 1e6) * (torrPa / standardAtmospherePa);
    expect(mhzPerTorr).toBeCloseTo(-0.29, 2);
  });

  it("the shipped value ± covers R1, R27 (each with its printed ±) and the typical value, converted at each line's own wavenumber", () => {
    for (const [label, pmPerKpa] of [
      ["R(1)", 0.008 - 0.002],
      ["R(1)", 0.008 + 0.002],
      ["R(27)", 0.043 - 0.002],
      ["R(27)", 0.043 + 0.002],
      ["P(13)", 0.017],
    ] as const) {
      const cited = pmPerKpaToCmPerAtm(pmPerKpa, at(label));
      expect(Math.abs(cited - self.cmPerAtm), `${label} ${pmPerKpa} pm/kPa`).toBeLessThanOrEqual(self.uncertaintyCmPerAtm);
    }
    // …and is not a catch-all: it is under the size of the largest reported shift.
    expect(self.uncertaintyCmPerAtm).toBeLessThan(Math.abs(pmPerKpaToCmPerAtm(0.043, at("R(27)"))));
  });

  it("enters the centres of calibration-lines (50 Torr vs 1 Torr), not the zero-pressure positions of lines", async () => {
    const run = async (pressure: string) =>
      JSON.parse((await runCli(["calibration-lines", "c2h2", "--resolution", "0.125", "--pressure", pressure, "--format", "json"])).stdout);
    const high = await run("50 Torr");
    const low = await run("1 Torr");
    const expected = (torr: number) => (self.cmPerAtm * torr * torrPa) / standardAtmospherePa;
    // JSON prints the shift to two significant figures.
    const printed = (v: number) => Number(v.toPrecision(2));
    expect(high.pressureShift.shiftCm).toBe(printed(expected(50)));
    expect(low.pressureShift.shiftCm).toBe(printed(expected(1)));
    expect(high.pressureShift.uncertaintyCm).toBe(printed((self.uncertaintyCmPerAtm * 50) / 760));
    expect(high.notes.join(" ")).toMatch(/include the pressure shift cited in \[swann2000\]/);
    expect(high.pressureShift.sources).toEqual(["swann2000"]);
    expect(high.lines.length).toBeGreaterThan(10);
    for (const l of high.lines) {
      const zero = at(l.label);
      // Four printed decimals: within 5e-5 of the zero-pressure position plus the shift.
      expect(Math.abs(l.wavenumber - (zero + expected(50)))).toBeLessThanOrEqual(5.1e-5);
      expect(l.wavenumberUncertainty).toBeGreaterThanOrEqual(Number(((self.uncertaintyCmPerAtm * 50) / 760).toPrecision(2)));
    }
    const table = JSON.parse((await runCli(["lines", "c2h2", "--format", "json"])).stdout);
    expect(table.positions).toMatch(/^zero-pressure line centres/);
    // Printed rounded to its ± (a certified line's, 6.3e-7 cm⁻¹: eight decimals).
    expect(table.lines.find((l: { label: string }) => l.label === "P(13)").wavenumber).toBeCloseTo(at("P(13)"), 7);
  });

  it("a gas without a cited shift says its centres are zero-pressure positions", async () => {
    const doc = JSON.parse((await runCli(["calibration-lines", "co", "--resolution", "0.125", "--format", "json"])).stdout);
    expect(doc.pressureShift).toEqual({ shiftCm: 0, uncertaintyCm: 0, notCitedFor: ["self"], sources: [] });
    expect(doc.notes.join(" ")).toMatch(/zero-pressure positions: no pressure shift is cited for the gas itself/);
  });
});
