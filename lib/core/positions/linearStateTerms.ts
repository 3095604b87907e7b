import type { LinearState } from "./linearTypes.ts";

/**
 * The rotational series of one vibrational state of a linear molecule as the coefficients of
 * E(J) = Σ_l c_l x^l, x = J(J+1): c0 = G, c1 = B, c2 = −D, c3 = H (the usual power series of a
 * Σ state; Herzberg 1945, ch. IV). The layout is that of `levelExpansion` for a diatomic level.
 */
export function linearStateExpansion(state: LinearState): Float64Array {
  return Float64Array.from([state.termEnergy.valueCm, state.b.valueCm, -state.d.valueCm, state.h.valueCm]);
}
