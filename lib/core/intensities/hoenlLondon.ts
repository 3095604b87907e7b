import type { Branch } from "../types.ts";

// Hönl–London factors of a ¹Σ–¹Σ transition (G. Herzberg, Spectra of Diatomic Molecules, 2nd ed.,
// 1950, ch. IV): S_R(J'') = J''+1, S_P(J'') = J''. Summed over both branches they give 2J''+1,
// so that with the lower level's degeneracy removed every J'' carries the whole band moment.
export function hoenlLondon(branch: Branch, jLower: number): number {
  return branch === "R" ? jLower + 1 : jLower;
}
