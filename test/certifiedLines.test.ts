import { describe, expect, it } from "vitest";
import { bandLines, lineErrorShares, speedOfLightMs } from "../lib/core/index.ts";
import { findInAtlas } from "../lib/atlas/index.ts";
import { parseMoleculeText } from "../lib/molecules/index.ts";
import { shippedMolecules, shippedSpecies } from "./helpers/shipped.ts";
import { readFileSync } from "node:fs";

const band = (label: string) => {
  const [u, l] = label.split("-");
  return { label, upperStateIndex: u === "10100" ? 1 : u === "10111" ? 2 : 1, lowerStateIndex: 0 } as never;
};

describe("certified line positions (issue 23)", () => {
  it("find 1542.383712 nm names 13C2H2 P(16) with a ± of at most 1e-5 cm⁻¹", () => {
    // BIPM/CIPM, Recommended values … Acetylene (λ ≈ 1.54 µm), 2007 (file of 2012), §1: 13C2H2 P(16)
    // of ν1+ν3 at λ = 1 542 383 712.38 (4) fm, f = 194 369 569 384 (5) kHz.
    const found = findInAtlas(shippedMolecules(), 1e7 / 1542.383712, 1, 296, 1e-3);
    const p16 = found.find((l) => l.species === "13C2H2" && l.band === "10100-00000" && l.label === "P(16)");
    expect(p16).toBeDefined();
    expect(p16!.positionStatus).toBe("certified");
    expect(p16!.wavenumberUncertainty).toBeLessThanOrEqual(1e-5);
    // ν̃ = f/c exactly (c = 299 792 458 m/s, CODATA, exact).
    expect(p16!.wavenumber).toBeCloseTo(194369569384e3 / (speedOfLightMs * 100), 9);
  });

  it("a certified line keeps the model's intensity and carries the model's own position as its check", () => {
    const model = shippedSpecies("c2h2", "13C2H2");
    const lines = bandLines(model, band("10100-00000"), { temperatureK: 296 }).lines;
    const p16 = lines.find((l) => l.label === "P(16)")!;
    expect(p16.positionStatus).toBe("certified");
    expect(p16.model).toBeDefined();
    // Our fit misses 13C2H2 ν1+ν3 by up to about 7e-3 cm⁻¹ (SOURCES-NOTES.md, seventh pass): the
    // model's ± there is that miss, the certified ± the source's (with the 3 Pa allowance).
    expect(Math.abs(p16.model!.wavenumber - p16.wavenumber)).toBeLessThanOrEqual(p16.model!.wavenumberUncertainty);
    expect(p16.relativeIntensity).toBeGreaterThan(0);
    // A line the table lacks is the model's, with the model's ±.
    const p40 = lines.find((l) => l.label === "P(40)")!;
    expect(p40.positionStatus).toBe("extrapolated");
    expect(p40.model).toBeUndefined();
  });

  it("a certified line's calibration error is its own measurement: one independent share", () => {
    const model = shippedSpecies("c2h2", "13C2H2");
    const shares = lineErrorShares(model, band("10100-00000"), "P", 16);
    expect(shares).toHaveLength(1);
    expect(shares[0].kind).toBe("certified");
    expect(shares[0].source).toBe("certified 13C2H2 10100-00000 P(16)");
    const other = lineErrorShares(model, band("10100-00000"), "P", 17);
    expect(other[0].source).not.toBe(shares[0].source);
  });

  it("without certifiedPositions on the source, the same lines only check the model", () => {
    const text = readFileSync("molecules/c2h2.yaml", "utf8").replace(/^\s*certifiedPositions: .*$/m, "");
    const parsed = parseMoleculeText(text, "c2h2.yaml", "c2h2");
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const species = parsed.molecule.species.find((s) => s.model.label === "13C2H2")!.model;
    const p16 = bandLines(species, band("10100-00000"), { temperatureK: 296 }).lines.find((l) => l.label === "P(16)")!;
    expect(p16.positionStatus).toBe("validated");
  });
});
