import { describe, expect, it } from "vitest";
import {
  airRefractiveIndexEdlen,
  airWavelengthNm,
  bandLines,
  frequencyThz,
  hermanWallisFactor,
  hoenlLondon,
  intensityPrefactorCgs,
  transitionDipoleFromBandStrength,
  vacuumWavelengthUm,
  type SpeciesModel,
} from "../lib/core/index.ts";
import { shippedSpecies } from "./helpers/shipped.ts";

describe("Hönl–London factors", () => {
  it("sum over P and R to 2J''+1 for every J''", () => {
    // Herzberg (1950), ch. IV: S_R + S_P = 2J''+1 for ¹Σ–¹Σ.
    for (let j = 0; j < 50; j++) expect(hoenlLondon("R", j) + hoenlLondon("P", j)).toBe(2 * j + 1);
  });
});

describe("Herman–Wallis factor", () => {
  it("is 1 without coefficients and 1 + a1 m + a2 m² with them", () => {
    expect(hermanWallisFactor(null, 7)).toBe(1);
    expect(hermanWallisFactor({ a1: 1e-3, a2: 1e-5 }, -3)).toBeCloseTo(1 - 3e-3 + 9e-5, 15);
  });
});

describe("unit conversions", () => {
  it("gives the refractive index of standard air by Edlén (1966)", () => {
    // B. Edlén, Metrologia 2, 71 (1966): (n − 1)·10⁸ = 27 652 for the He–Ne line 632.99 nm in standard
    // air; computed here from the published formula's constants (from memory: 2.7652e-4).
    const n = airRefractiveIndexEdlen(1e7 / 632.991);
    expect((n - 1) * 1e8).toBeCloseTo(27652, 0);
    // In the mid-infrared the dispersion terms flatten: n − 1 ≈ 2.73e-4 at 4.67 µm.
    expect((airRefractiveIndexEdlen(2143) - 1) * 1e4).toBeCloseTo(2.73, 2);
  });
  it("agrees with Ciddor's (1996) standard-air dispersion to a few parts in 10⁸", () => {
    // P. E. Ciddor, Appl. Opt. 35, 1566 (1996), standard air (15 °C, 101 325 Pa, 450 ppm CO2):
    // n − 1 = 0.05792105/(238.0185 − σ²) + 0.00167917/(57.362 − σ²), σ in µm⁻¹ (formula as reproduced
    // on refractiveindex.info, "Ciddor 1996"). Computed independently here; Edlén's 300 ppm CO2
    // and older data leave differences of order 1e-8 in n.
    const ciddor = (wavenumber: number) => {
      const s2 = (wavenumber * 1e-4) ** 2;
      return 1 + 0.05792105 / (238.0185 - s2) + 0.00167917 / (57.362 - s2);
    };
    for (const wavenumber of [1e7 / 632.991, 6500, 4000, 2143, 1000]) {
      expect(Math.abs(airRefractiveIndexEdlen(wavenumber) - ciddor(wavenumber)), `${wavenumber} cm⁻¹`).toBeLessThan(3e-8);
    }
  });
  it("converts wavenumbers to vacuum µm, air nm and THz", () => {
    expect(vacuumWavelengthUm(2000)).toBe(5);
    expect(airWavelengthNm(2000)).toBeCloseTo(5000 / airRefractiveIndexEdlen(2000), 9);
    // ν = c·ν̃ with c exact (CODATA 2018): 1 cm⁻¹ = 0.0299792458 THz.
    expect(frequencyThz(1)).toBeCloseTo(0.0299792458, 12);
  });
});

describe("absolute intensities", () => {
  it("has the cgs prefactor 8π³/3hc = 4.162e17 (debye² cm⁻¹)⁻¹ scale", () => {
    // 8π³/(3hc) with h, c from CODATA 2018 in cgs: 4.1623e17 erg⁻¹ cm⁻¹ s... (computed by hand).
    expect(intensityPrefactorCgs / 1e17).toBeCloseTo(4.1623, 3);
  });
  it("recovers a band strength it was given: Σ lines = S_band", () => {
    const co = shippedSpecies("co");
    const bandStrength = 1.0e-17;
    const dipole = transitionDipoleFromBandStrength(co, { vUpper: 1, vLower: 0 }, bandStrength, 296, null);
    const withDipole: SpeciesModel = {
      ...co,
      abundance: 1,
      intensities: [
        {
          band: { vUpper: 1, vLower: 0 },
          transitionDipoleDebye: dipole,
          transitionDipoleUncertaintyDebye: 0,
          hermanWallis: null,
          origin: "cited",
          sourceKey: "test",
        },
      ],
    };
    const lines = bandLines(withDipole, { vUpper: 1, vLower: 0 }, { temperatureK: 296, minRelative: 0 }).lines;
    const sum = lines.reduce((s, l) => s + (l.lineIntensity ?? 0), 0);
    expect(sum / bandStrength).toBeCloseTo(1, 9);
    // A 1e-17 cm/molecule band of CO corresponds to |μ10| ≈ 0.10 D (from memory: the CO fundamental
    // has |μ10| ≈ 0.105 D and S ≈ 1.0e-17 cm/molecule at 296 K).
    expect(dipole).toBeGreaterThan(0.095);
    expect(dipole).toBeLessThan(0.11);
  });
  it("multiplies by the isotopic abundance and drops with the Boltzmann factor for hot bands", () => {
    const co = shippedSpecies("co");
    const data = {
      band: { vUpper: 1, vLower: 0 },
      transitionDipoleDebye: 0.1,
      transitionDipoleUncertaintyDebye: 0,
      hermanWallis: null,
      origin: "cited" as const,
      sourceKey: "t",
    };
    const fundamental = bandLines({ ...co, intensities: [data] }, { vUpper: 1, vLower: 0 }, { temperatureK: 296 });
    const hot = bandLines({ ...co, intensities: [data] }, { vUpper: 2, vLower: 1 }, { temperatureK: 296 });
    const ratio = hot.strongestLineIntensity! / fundamental.strongestLineIntensity!;
    // Harmonic: 2 × exp(−c2·2143/296) ≈ 2 × 3.0e-5 (fact of the trade, computed by hand).
    expect(ratio).toBeGreaterThan(4e-5);
    expect(ratio).toBeLessThan(8e-5);
    expect(hot.intensityOrigin).toBe("harmonic-hot-band");
  });
});
