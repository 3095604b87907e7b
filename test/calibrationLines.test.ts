import { describe, expect, it } from "vitest";
import { calibrationApodization, calibrationMarks, calibrationResolutionsCm, defaultCellConditions, moleculeCalibrationLines } from "../lib/atlas/index.ts";
import { calibrationWavenumberDigits, peakShiftDigits } from "../lib/format/index.ts";
import { calibrationLines, cellSpectrum, defaultCalibrationCriteria, type AbsorbingLine } from "../lib/core/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";

const molecules = loadMoleculesOrThrow(new URL("../molecules", import.meta.url).pathname);
const co = molecules.find((m) => m.id === "co")!;
// Invented lines (demo values, not a gas): a strong line and a weaker neighbour.
const line = (wavenumber: number, intensity: number, label: string): AbsorbingLine => ({
  species: "invented",
  band: "1-0",
  label,
  wavenumber,
  wavenumberUncertainty: 1e-5,
  pressureShiftCm: 0,
  positionStatus: "validated",
  intensity,
  dopplerHwhmCm: 0.0025,
  lorentzHwhmCm: 0.002,
});
const thin = (lines: AbsorbingLine[], resolutionCm: number) =>
  cellSpectrum({
    lines,
    conditions: defaultCellConditions,
    intensityScale: "relative-thin",
    fromCm: 2090,
    toCm: 2130,
    instrument: { kind: "fourier-transform", resolutionCm, apodization: "triangular" },
  });

describe("calibration-grade lines", () => {
  it("an isolated symmetric line shows no peak shift (to 1e-5 cm⁻¹)", () => {
    const lines = [line(2110, 1, "R(0)")];
    const [only] = calibrationLines(lines, thin(lines, 1), 1);
    expect(Math.abs(only.peakShiftCm!)).toBeLessThan(1e-5);
  });

  it("a neighbour inside ±1 R disqualifies a line; outside it, the line counts and is pulled toward it", () => {
    const near = [line(2110, 1, "R(0)"), line(2110.8, 0.3, "R(1)")];
    expect(calibrationLines(near, thin(near, 1), 1).map((l) => l.label)).toEqual([]);
    const apart = [line(2110, 1, "R(0)"), line(2111.5, 0.3, "R(1)")];
    const found = calibrationLines(apart, thin(apart, 1), 1);
    expect(found.map((l) => l.label)).toEqual(["R(0)", "R(1)"]);
    expect(found[0].peakShiftCm!).toBeGreaterThan(0); // pulled up toward 2111.5
    expect(found[1].peakShiftCm!).toBeLessThan(0); // and the weaker one down, harder
    expect(Math.abs(found[1].peakShiftCm!)).toBeGreaterThan(Math.abs(found[0].peakShiftCm!));
  });

  it("a line below the strong fraction is not listed", () => {
    const lines = [line(2100, 1, "R(0)"), line(2120, 0.05, "R(1)")];
    expect(calibrationLines(lines, thin(lines, 1), 1).map((l) => l.label)).toEqual(["R(0)"]);
  });

  it("CO: fewer usable lines as the resolution coarsens, none of them within R of a counted neighbour", () => {
    const counts = calibrationResolutionsCm.map((r) => {
      const result = moleculeCalibrationLines(co, {
        conditions: defaultCellConditions,
        instrument: { kind: "fourier-transform", resolutionCm: r, apodization: "triangular" },
      });
      for (const l of result.lines)
        if (l.nearestNeighbourCm !== null) expect(l.nearestNeighbourCm).toBeGreaterThan(defaultCalibrationCriteria.isolationMultiple * r);
      return result.lines.length;
    });
    for (let i = 1; i < counts.length; i++) expect(counts[i]).toBeLessThanOrEqual(counts[i - 1]);
    // Only the cited CRC lines R(0)–R(4), P(1)–P(4) of 12C16O 1-0 validate the constants, so at
    // most those nine qualify; at 0.125 cm⁻¹ the strong ones among them all do.
    expect(counts[0]).toBeGreaterThanOrEqual(6);
    expect(counts[0]).toBeLessThanOrEqual(9);
    for (const r of calibrationResolutionsCm) {
      const result = moleculeCalibrationLines(co, {
        conditions: defaultCellConditions,
        instrument: { kind: "fourier-transform", resolutionCm: r, apodization: "triangular" },
      });
      for (const l of result.lines) {
        expect(l.species).toBe("12C16O");
        expect(l.wavenumberUncertainty).toBeLessThanOrEqual(defaultCalibrationCriteria.maxUncertaintyFraction * r);
      }
    }
  });

  it("a line outside the validated J range, or with a ± above R/50, is not calibration grade", () => {
    const lines = [
      line(2100, 1, "R(0)"),
      { ...line(2110, 1, "R(1)"), positionStatus: "extrapolated" as const },
      { ...line(2120, 1, "R(2)"), wavenumberUncertainty: 0.03 },
    ];
    expect(calibrationLines(lines, thin(lines, 1), 1).map((l) => l.label)).toEqual(["R(0)"]);
    expect(calibrationLines(lines, thin(lines, 2), 2).map((l) => l.label)).toEqual(["R(0)", "R(2)"]);
  });

  it("HCl: no line is calibration grade while no cited measured line validates its constants", () => {
    const hcl = molecules.find((m) => m.id === "hcl")!;
    for (const r of calibrationMarks(hcl).byResolution) expect(r.lines).toEqual([]);
  });

  it("the CLI lists the same lines and shifts as the atlas, to the printed digits", async () => {
    const r = await runCli(["calibration-lines", "co", "--resolution", "1", "--format", "json"]);
    expect(r.exitCode).toBe(0);
    const doc = JSON.parse(r.stdout);
    const marks = calibrationMarks(co).byResolution.find((b) => b.resolutionCm === 1)!;
    expect(doc.lines.map((l: { label: string }) => l.label)).toEqual(marks.lines.map((l) => l.label));
    expect(doc.lines[0].peakShiftCm).toBeCloseTo(marks.lines[0].peakShiftCm!, 4);
    expect(doc.caution).toMatch(/safety data sheet/);
  });
});

describe("calibration marks computed around their candidates only", () => {
  it("equal the full-range computation to the printed digits, for every shipped molecule and resolution", () => {
    for (const molecule of molecules) {
      const marks = calibrationMarks(molecule);
      for (const { resolutionCm, lines } of marks.byResolution) {
        const instrument = { kind: "fourier-transform" as const, resolutionCm, apodization: calibrationApodization };
        const full = moleculeCalibrationLines(molecule, { conditions: defaultCellConditions, instrument });
        const printed = (l: { species: string; label: string; wavenumber: number; peakShiftCm: number | null }) =>
          `${l.species} ${l.label} ${calibrationWavenumberDigits(l.wavenumber)} ${peakShiftDigits(l.peakShiftCm)}`;
        expect(lines.map(printed), `${molecule.id} at ${resolutionCm} cm⁻¹`).toEqual(full.lines.map(printed));
      }
    }
  });
});
