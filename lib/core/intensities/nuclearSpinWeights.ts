import type { LinearStateSymmetry, NuclearSpinWeights } from "../positions/linearTypes.ts";

// Nuclear-spin statistics of a linear molecule with a centre of symmetry (point group D∞h):
// exchanging the two identical nuclei leaves the even-J levels of a Σg+ state symmetric (s) and
// the odd-J levels antisymmetric (a); a Σu+ state has them the other way round (G. Herzberg,
// Molecular Spectra and Molecular Structure II: Infrared and Raman Spectra of Polyatomic
// Molecules, 1945, ch. I.3). With spin-½ nuclei (H in 12C2H2) the weights are a:s = 3:1, so the
// lines alternate 3:1; with spin-0 nuclei (16O in 12C16O2) the a levels have weight 0 and do not
// exist, so every other line is missing. Without a centre of symmetry (HCN, N2O, OCS) every level
// has the same weight, written here as 1.

/** Statistical weight of level J of a state; 0 means the level does not exist. */
export function nuclearSpinWeight(weights: NuclearSpinWeights | null, symmetry: LinearStateSymmetry, j: number): number {
  if (weights === null || symmetry === "Σ+") return 1;
  const even = j % 2 === 0;
  const symmetric = symmetry === "Σg+" ? even : !even;
  return symmetric ? weights.evenJ : weights.oddJ;
}
