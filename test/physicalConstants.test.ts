import { describe, expect, it } from "vitest";
import { boltzmannJK, planckJs, secondRadiationConstantCmK, speedOfLightMs, avogadroPerMol, atomicMassUnitKg } from "../lib/core/index.ts";

// CODATA 2018: E. Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021), table of recommended values.
describe("physical constants (CODATA 2018)", () => {
  it("has the exact SI defining constants", () => {
    expect(planckJs).toBe(6.62607015e-34);
    expect(speedOfLightMs).toBe(299792458);
    expect(boltzmannJK).toBe(1.380649e-23);
    expect(avogadroPerMol).toBe(6.02214076e23);
  });
  it("gives the second radiation constant c2 = hc/k = 1.438776877... cm K", () => {
    // CODATA 2018 lists c2 = 1.438 776 877... × 10⁻² m K (exact, truncated in the table).
    expect(secondRadiationConstantCmK).toBeGreaterThanOrEqual(1.438776877);
    expect(secondRadiationConstantCmK).toBeLessThan(1.438776878);
  });
  it("uses the atomic mass constant 1.66053906660(50) × 10⁻²⁷ kg", () => {
    expect(atomicMassUnitKg).toBeCloseTo(1.6605390666e-27, 36);
  });
});
