// Every printed ± against measured lines: the cited ones in the molecule files, and a real FTIR
// spectrum of HCl from a teaching laboratory (test/fixtures/spectra/hcl-dcl-hunter, MIT licence).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { bandLines, lineResiduals, sameBand } from "../lib/core/index.ts";
import { loadMoleculesOrThrow } from "../lib/molecules/index.ts";
import { linearModel } from "./helpers/shipped.ts";

const molecules = loadMoleculesOrThrow(new URL("../molecules", import.meta.url).pathname);

describe("every ± covers the residuals of cited measured lines", () => {
  it("|predicted − measured| ≤ 3σ for every cited line of every shipped band, held-out lines included", () => {
    let checked = 0;
    for (const molecule of molecules) {
      for (const species of molecule.species) {
        for (const r of lineResiduals(species.model)) {
          if (r.reference.band.vUpper !== undefined && r.reference.band.vUpper === r.reference.band.vLower) continue; // pure rotation: no band table
          const lines = bandLines(species.model, r.reference.band, { temperatureK: 296, minRelative: 0 });
          const line = lines.lines.find((l) => l.label === r.reference.label);
          expect(line, `${molecule.id} ${species.model.label} ${r.reference.label}`).toBeDefined();
          expect(sameBand(lines.band, r.reference.band)).toBe(true);
          // A certified line prints the standard's ±; the model's own ± (kept beside it) is what must cover the miss.
          expect(Math.abs(r.predictedMinusMeasured), `${molecule.id} ${species.model.label} ${r.reference.label}`).toBeLessThanOrEqual(
            3 * (line!.model ?? line!).wavenumberUncertainty,
          );
          checked++;
        }
      }
    }
    // CO 1-0 (9 CRC lines), 12C2H2 ν1+ν3 (62 BIPM frequencies, Table 3), 13C2H2 ν1+ν3 (61, Table 1),
    // 13C2H2 (ν1+ν3+ν4+ν5) (43, Table 2) and 12C2HD 2ν1 (55, Table 4).
    expect(checked).toBe(71 + 61 + 43 + 55);
  });

  it("12C2H2: the lines held out of the fit are predicted within their ±, and the fit's residuals are published", () => {
    const c2h2 = linearModel(molecules.find((m) => m.id === "c2h2")!.species[0].model);
    const heldOut = lineResiduals(c2h2).filter((r) => r.reference.heldOut);
    expect(heldOut.length).toBe(14);
    const band = bandLines(c2h2, c2h2.linear.bands[0].band, { temperatureK: 296, minRelative: 0 });
    expect(band.accuracy.status).toBe("validated");
    for (const r of heldOut) {
      const line = band.lines.find((l) => l.label === r.reference.label)!;
      expect(Math.abs(r.predictedMinusMeasured)).toBeLessThanOrEqual((line.model ?? line).wavenumberUncertainty);
    }
    // P(13) at 195 580 979 370 kHz (BIPM recommended frequency): 6523.87875 cm⁻¹ = f/c.
    expect(band.lines.find((l) => l.label === "P(13)")!.wavenumber).toBeCloseTo(195580979370e3 / 29979245800, 4);
  });

  it("H35Cl: R(0) − P(1) ≈ 41.148 cm⁻¹ (published measurements, from memory) within the printed ±", () => {
    const hcl = molecules.find((m) => m.id === "hcl")!.species[0].model;
    const lines = bandLines(hcl, { vUpper: 1, vLower: 0 }, { temperatureK: 296 }).lines;
    const r0 = lines.find((l) => l.label === "R(0)")!;
    const p1 = lines.find((l) => l.label === "P(1)")!;
    expect(Math.abs(r0.wavenumber - p1.wavenumber - 41.148)).toBeLessThanOrEqual(3 * Math.hypot(r0.wavenumberUncertainty, p1.wavenumberUncertainty));
  });
});

/** Absorbance samples of the teaching-lab CSV (comment lines "#", a header, then "x, y"). */
function readSpectrum(path: string): { x: number[]; y: number[] } {
  const x: number[] = [];
  const y: number[] = [];
  for (const row of readFileSync(path, "utf8").split(/\r?\n/)) {
    const cells = row.split(",").map((c) => Number(c.trim()));
    if (cells.length >= 2 && Number.isFinite(cells[0]) && Number.isFinite(cells[1]) && row.trim() !== "") {
      x.push(cells[0]);
      y.push(cells[1]);
    }
  }
  return { x, y };
}

/** The absorbance maximum within ±halfWidth of a position, refined by the parabola through its neighbours. */
function peakNear(s: { x: number[]; y: number[] }, centre: number, halfWidth: number): number {
  let best = -1;
  for (let i = 1; i < s.x.length - 1; i++) if (Math.abs(s.x[i] - centre) <= halfWidth && (best < 0 || s.y[i] > s.y[best])) best = i;
  const [a, b, c] = [s.y[best - 1], s.y[best], s.y[best + 1]];
  const step = s.x[best + 1] - s.x[best];
  return s.x[best] + (0.5 * (a - c) * step) / (a - 2 * b + c);
}

describe("the HCl ± against a real FTIR spectrum (teaching laboratory, 0.125 cm⁻¹ sampling)", () => {
  const spectrum = readSpectrum(new URL("./fixtures/spectra/hcl-dcl-hunter/HCl_spectrum.csv", import.meta.url).pathname);
  const hcl = molecules.find((m) => m.id === "hcl")!.species[0].model;
  const lines = bandLines(hcl, { vUpper: 1, vLower: 0 }, { temperatureK: 296 }).lines.filter((l) => Math.abs(l.branch === "R" ? l.jLower + 1 : l.jLower) <= 10);

  it("finds the H35Cl lines up to |m| = 10 and every miss lies within 3σ plus the measurement's own 0.03 cm⁻¹", () => {
    expect(lines.length).toBe(20);
    for (const line of lines) {
      // ±0.6 cm⁻¹ keeps the H37Cl partner (about 2 cm⁻¹ lower, fact of the trade) out of the search.
      const measured = peakNear(spectrum, line.wavenumber, 0.6);
      const miss = Math.abs(measured - line.wavenumber);
      expect(miss, line.label).toBeLessThanOrEqual(3 * line.wavenumberUncertainty + 0.03);
      // And the ± is not a blanket: where the miss is small the ± is not hundreds of times larger.
      expect(line.wavenumberUncertainty, line.label).toBeLessThanOrEqual(20 * Math.max(miss, 0.03));
    }
  });

  it("says these lines are not validated (the spectrum is evidence, not a cited reference)", () => {
    for (const line of lines) expect(line.positionStatus).toBe("not-validated");
  });
});
