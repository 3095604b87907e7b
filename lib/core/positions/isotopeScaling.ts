import type { DunhamCoefficient, MassU } from "../types.ts";

/** Reduced mass of a diatomic from its two atomic masses, u. */
export function reducedMassU(massA: MassU, massB: MassU): MassU {
  return (massA * massB) / (massA + massB);
}

// Dunham's isotope relation, Y_kl ∝ μ^−(k/2 + l): J. L. Dunham, Phys. Rev. 41, 721 (1932).
// Born–Oppenheimer breakdown corrections are neglected, which is why a species' own cited
// constants take precedence over scaled ones.
export function scaleDunhamToIsotopologue(reference: DunhamCoefficient[], referenceReducedMassU: MassU, targetReducedMassU: MassU): DunhamCoefficient[] {
  const rho = referenceReducedMassU / targetReducedMassU;
  return reference.map((c) => {
    const factor = Math.pow(rho, c.k / 2 + c.l);
    return { ...c, valueCm: c.valueCm * factor, uncertaintyCm: c.uncertaintyCm * factor };
  });
}
