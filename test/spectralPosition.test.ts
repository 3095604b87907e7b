import { describe, expect, it } from "vitest";
import { airWavelengthNm, parseSpectralPosition, positionToWavenumber, windowToWavenumber } from "../lib/core/index.ts";

describe("positions in cm⁻¹, nm and µm", () => {
  it("reads a number with or without its unit", () => {
    expect(parseSpectralPosition("2143.3")).toEqual({ value: 2143.3, unit: "cm-1", medium: "vacuum" });
    expect(parseSpectralPosition("1532.83nm")).toMatchObject({ value: 1532.83, unit: "nm" });
    expect(parseSpectralPosition("1.53283 µm")).toMatchObject({ value: 1.53283, unit: "um" });
    expect(() => parseSpectralPosition("12 parsecs")).toThrow(/unknown unit "parsecs"/);
    expect(() => parseSpectralPosition("-5 nm")).toThrow(/not a position/);
    expect(() => parseSpectralPosition("2143", "cm-1", "air")).toThrow(/air position is a wavelength/);
  });

  it("converts vacuum wavelengths exactly and air wavelengths back through Edlén's n", () => {
    // 12C2H2 P(13): 195 580 979 370 kHz (BIPM recommended frequency) = 6523.878748 cm⁻¹ = 1532.8303 nm (c exact).
    const sigma = 195580979370e3 / 29979245800;
    expect(positionToWavenumber({ value: 1e7 / sigma, unit: "nm", medium: "vacuum" })).toBeCloseTo(sigma, 9);
    expect(positionToWavenumber({ value: 1e4 / sigma, unit: "um", medium: "vacuum" })).toBeCloseTo(sigma, 9);
    // Round trip with the atlas's own air wavelength (Edlén 1966): to 1e-9 cm⁻¹.
    for (const s of [1000, 2143.27, 6523.88, 15000]) expect(positionToWavenumber({ value: airWavelengthNm(s), unit: "nm", medium: "air" })).toBeCloseTo(s, 9);
  });

  it("turns a window in nm into cm⁻¹ at that wavelength (|dν̃| = |dλ|·10⁷/λ²)", () => {
    const p = { value: 1500, unit: "nm" as const, medium: "vacuum" as const };
    expect(windowToWavenumber(p, 0.1)).toBeCloseTo((0.1 * 1e7) / 1500 ** 2, 12);
    expect(windowToWavenumber({ value: 2143.3, unit: "cm-1", medium: "vacuum" }, 0.5)).toBe(0.5);
  });
});
