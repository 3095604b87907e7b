import type { HermanWallisCoefficients } from "../types.ts";

// Herman–Wallis factor: R. Herman and R. F. Wallis, J. Chem. Phys. 23, 637 (1955). The
// vibration–rotation interaction makes the squared transition moment depend on the running
// index m; written here to second order as F(m) = 1 + a1·m + a2·m².
export function hermanWallisFactor(coefficients: HermanWallisCoefficients | null, m: number): number {
  if (!coefficients) return 1;
  return 1 + coefficients.a1 * m + coefficients.a2 * m * m;
}
