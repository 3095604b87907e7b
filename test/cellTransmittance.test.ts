import { describe, expect, it } from "vitest";
import { cellLineSet, defaultCellConditions, moleculeCellSpectrum } from "../lib/atlas/index.ts";
import { cellSpectrum, dopplerHwhmCm, lorentzHwhmCm, numberDensityPerCm3, typicalBroadening, type GasBroadening } from "../lib/core/index.ts";
import { pressureOptionPa, pathOptionCm } from "../lib/cli/cellOptions.ts";
import { runCli } from "../lib/cli/main.ts";
import { transmittanceDigits } from "../lib/format/index.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";

const molecules = loadMoleculesOrThrow(new URL("../molecules", import.meta.url).pathname);
const co = molecules.find((m) => m.id === "co")!;

describe("gas in the cell", () => {
  it("number density at 273.15 K and 101.325 kPa is the Loschmidt constant 2.686 780 111e25 m⁻³ (CODATA 2018, exact; from memory)", () => {
    expect(numberDensityPerCm3(101325, 273.15) / 2.686780111e19).toBeCloseTo(1, 9);
  });

  it("Doppler FWHM is 7.16e-7 ν̃0 √(T/M), M in g/mol (Demtröder, Laser Spectroscopy, eq. 3.43; from memory)", () => {
    const fwhm = 2 * dopplerHwhmCm(2143.27, 296, 27.9949);
    expect(fwhm / (7.16e-7 * 2143.27 * Math.sqrt(296 / 27.9949))).toBeCloseTo(1, 3);
  });

  it("Lorentz HWHM is linear in pressure, mixes self and air by mole fraction, and scales as (296/T)^n", () => {
    const b: GasBroadening = {
      self: {
        hwhmCmPerAtm: 0.06,
        byAbsM: [
          { absM: 1, hwhmCmPerAtm: 0.08 },
          { absM: 11, hwhmCmPerAtm: 0.05 },
        ],
        temperatureExponent: 0.7,
        sourceKey: "invented",
        origin: "cited",
      },
      air: { hwhmCmPerAtm: 0.05, byAbsM: null, temperatureExponent: 0.75, sourceKey: "invented", origin: "cited" },
    };
    // invented coefficients: the test checks the model's arithmetic, not a gas.
    expect(lorentzHwhmCm(b, 6, 101325, 1, 296)).toBeCloseTo(0.065, 12);
    expect(lorentzHwhmCm(b, 20, 101325 / 2, 0.5, 296)).toBeCloseTo(0.5 * (0.5 * 0.05 + 0.5 * 0.05), 12);
    expect(lorentzHwhmCm(b, 1, 101325, 0, 148)).toBeCloseTo(0.05 * 2 ** 0.75, 12);
  });

  it("pressure and path options accept the units in the issue, with or without a space, any case", () => {
    for (const t of ["20 Torr", "20Torr", "20 torr"]) expect(pressureOptionPa(t)).toBeCloseTo((20 * 101325) / 760, 9);
    expect(pressureOptionPa("1 atm")).toBe(101325);
    expect(pressureOptionPa("26.6 mbar")).toBeCloseTo(2660, 9);
    expect(pressureOptionPa("2.5 kPa")).toBe(2500);
    expect(pathOptionCm("1.5 m")).toBe(150);
    expect(pathOptionCm("25 mm")).toBeCloseTo(2.5, 12);
    expect(() => pressureOptionPa("20 inHg")).toThrow(/unknown unit "inHg"/);
    expect(() => pressureOptionPa("20")).toThrow(/number and a unit/);
  });
});

describe("CO cell spectrum", () => {
  const set = cellLineSet(co, defaultCellConditions);

  it("uses every species of CO at natural abundance and flags the typical broadening", () => {
    expect(set.intensityScale).toBe("absolute");
    expect(new Set(set.lines.map((l) => l.species))).toEqual(new Set(["12C16O", "13C16O", "12C18O"]));
    expect(set.broadeningTypical).toBe(true);
    expect(set.notes.join(" ")).toMatch(/typical pressure-broadening/);
    expect(set.broadeningTypical).toBe(typicalBroadening.self.origin === "typical");
  });

  it("integrates to Σ S·N·L over a window holding the whole fundamental (Beer–Lambert with unit-area profiles)", () => {
    const { spectrum } = moleculeCellSpectrum(co, { conditions: defaultCellConditions, fromCm: 1900, toCm: 2400, instrument: { kind: "monochromatic" } }, set);
    let integral = 0;
    for (let i = spectrum.windowFirst; i <= spectrum.windowLast; i++) integral += spectrum.opticalDepth[i] * spectrum.grid.stepCm;
    let expected = 0;
    for (const l of set.lines) if (l.wavenumber > 1900 && l.wavenumber < 2400) expected += l.intensity * spectrum.columnDensityPerCm2;
    // The 25 cm⁻¹ and 1e-6 wing cut-offs drop a little of each Lorentz tail.
    expect(integral / expected).toBeGreaterThan(0.995);
    expect(integral / expected).toBeLessThan(1.00001);
  });

  it("keeps the equivalent width of a line through the instrument (the ILS has unit area)", () => {
    // One invented line, saturated at its centre, in the middle of a 40 cm⁻¹ window.
    const line = {
      species: "invented",
      band: "1-0",
      label: "R(0)",
      wavenumber: 2110,
      wavenumberUncertainty: 1e-5,
      pressureShiftCm: 0,
      positionStatus: "validated" as const,
      intensity: 2e-19,
      dopplerHwhmCm: 0.0025,
      lorentzHwhmCm: 0.002,
    };
    for (const apodization of ["boxcar", "triangular", "happ-genzel", "norton-beer-medium"] as const) {
      const s = cellSpectrum({
        lines: [line],
        conditions: defaultCellConditions,
        intensityScale: "absolute",
        fromCm: 2090,
        toCm: 2130,
        instrument: { kind: "fourier-transform", resolutionCm: 0.5, apodization },
      });
      let mono = 0;
      let seen = 0;
      for (let i = 0; i < s.grid.count; i++) {
        mono += 1 - s.transmittance![i];
        seen += 1 - s.observedTransmittance![i];
      }
      // What leaves the grid is the ILS beyond 40 R: at most 1/(40π²) = 0.25 % (triangular tail).
      expect(seen / mono, apodization).toBeGreaterThan(0.997);
      expect(seen / mono, apodization).toBeLessThan(1.0005);
    }
  });

  it("sees the strong R(7) line saturated at its centre in 10 cm of 20 Torr CO (τ0 = S N L g(0) ≫ 1)", () => {
    const { spectrum } = moleculeCellSpectrum(
      co,
      { conditions: defaultCellConditions, fromCm: 2172, toCm: 2173.5, instrument: { kind: "monochromatic" } },
      set,
    );
    const r7 = set.lines.find((l) => l.species === "12C16O" && l.label === "R(7)" && l.band === "1-0")!;
    const i = Math.round((r7.wavenumber - spectrum.grid.startCm) / spectrum.grid.stepCm);
    expect(spectrum.transmittance![i]).toBeLessThan(1e-6);
  });

  it("refuses a transmittance for a molecule without a cited intensity, and the CLI says so plainly", async () => {
    // Hydrogen iodide: no band intensity could be cited for it (molecules/SOURCES-NOTES.md).
    const hi = molecules.find((m) => m.id === "hi")!;
    expect(cellLineSet(hi, defaultCellConditions).intensityScale).toBe("relative-thin");
    const r = await runCli(["spectrum", "hi", "--from", "2200", "--to", "2300"]);
    expect(r.exitCode).toBe(2);
    expect(r.stderr).toMatch(/no cited band intensity/);
    expect(r.stdout).toBe("");
  });

  it("CLI CSV prints the core's transmittance to the shared digits", async () => {
    const r = await runCli([
      "spectrum",
      "co",
      "--pressure",
      "20",
      "Torr",
      "--path",
      "10",
      "cm",
      "--resolution",
      "0.5",
      "--from",
      "2165",
      "--to",
      "2170",
      "--step",
      "0.01",
    ]);
    expect(r.exitCode).toBe(0);
    const rows = r.stdout
      .trim()
      .split("\n")
      .slice(1)
      .map((l) => l.split(","));
    const { spectrum } = moleculeCellSpectrum(co, {
      conditions: defaultCellConditions,
      fromCm: 2165,
      toCm: 2170,
      instrument: { kind: "fourier-transform", resolutionCm: 0.5, apodization: "triangular" },
    });
    const row = rows.find((c) => c[0] === "2167.5000")!;
    const i = Math.round((2167.5 - spectrum.grid.startCm) / spectrum.grid.stepCm);
    expect(row[1]).toBe(transmittanceDigits(spectrum.observedTransmittance![i]));
  });

  it("rejects impossible values with one plain line and a non-zero exit", async () => {
    for (const bad of [
      ["--pressure", "0 Pa"],
      ["--path", "-1 cm"],
      ["--mole-fraction", "1.5"],
      ["--resolution", "-1"],
      ["--pressure", "3 furlongs"],
    ]) {
      const r = await runCli(["spectrum", "co", "--from", "2100", "--to", "2110", ...bad]);
      expect(r.exitCode, bad.join(" ")).not.toBe(0);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).not.toMatch(/at .*\.ts:/);
    }
  });
});
