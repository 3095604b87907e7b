import { describe, expect, it } from "vitest";
import { equilibriumToDunham, partitionFunction, rigidRotorPartitionFunctionExpansion, secondRadiationConstantCmK } from "../lib/core/index.ts";
import { shippedDiatomic } from "./helpers/shipped.ts";

describe("partition function", () => {
  it("matches Mulholland's high-temperature expansion for a rigid rotor (harmonic vibration factored out)", () => {
    // H. P. Mulholland, Proc. Cambridge Philos. Soc. 24, 280 (1928): Q_rot = kT/hcB + 1/3 + hcB/15kT + …;
    // harmonic vibration: Q_vib = 1/(1 − e^(−c2 ω/T)) (Herzberg 1950, ch. III). Tolerance 1e-6 relative:
    // the dropped terms are O((hcB/kT)³).
    for (const [bCm, omegaE, temperatureK] of [
      [1.93, 2170, 296],
      [10.59, 2991, 296],
      [1.93, 2170, 1000],
      [20.9, 4138, 1000],
    ]) {
      const q = partitionFunction(equilibriumToDunham({ omegaE, bE: bCm }), temperatureK);
      const vib = 1 / (1 - Math.exp((-secondRadiationConstantCmK * omegaE) / temperatureK));
      const expected = rigidRotorPartitionFunctionExpansion(bCm, temperatureK) * vib;
      expect(Math.abs(q / expected - 1), `B=${bCm} T=${temperatureK}`).toBeLessThan(1e-6);
    }
  });
  it("gives 12C16O at 296 K a partition function near kT/hcB", () => {
    // With distortion and vibration the sum exceeds the rigid-rotor value only slightly: kT/hcB0 + 1/3
    // with B0 = 1.9225 cm⁻¹ is 107.3; the full sum must lie within 0.5 % of it (fact of the trade).
    const q = partitionFunction(shippedDiatomic("co").dunham, 296);
    const rigid = rigidRotorPartitionFunctionExpansion(1.92253, 296);
    expect(Math.abs(q / rigid - 1)).toBeLessThan(5e-3);
  });
});
