import { voigtFunction } from "./faddeeva.ts";
import type { AbsorbingLine } from "./absorbingLines.ts";
import type { SpectralGrid } from "./spectralGrid.ts";
import { voigtHwhm } from "./voigtProfile.ts";

const sqrtLn2 = Math.sqrt(Math.LN2);
const sqrtLn2OverPi = Math.sqrt(Math.LN2 / Math.PI);

export interface OpticalDepthOptions {
  /** No line is followed further than this from its centre (default 25 cm⁻¹, common practice, no source). */
  wingCutoffCm?: number;
  /**
   * A line's wing is dropped where its Lorentz tail, S·N·γ_L/(πΔ²), falls below this optical
   * depth (default 1e-6), so weak lines cost little; never closer than 50 Voigt HWHM.
   */
  negligibleOpticalDepth?: number;
}

export const defaultWingCutoffCm = 25;
export const defaultNegligibleOpticalDepth = 1e-6;

/**
 * Optical depth τ(ν̃) = Σ_lines S · N_col · g_V(ν̃ − ν̃0) on a grid, with N_col the column
 * density (molecules/cm²) and g_V the area-normalised Voigt profile (Beer–Lambert law;
 * e.g. Bernath, Spectra of Atoms and Molecules, ch. 1). Every line whose reach touches the grid
 * counts, wherever its centre lies.
 */
export function opticalDepth(
  lines: readonly AbsorbingLine[],
  grid: SpectralGrid,
  columnDensityPerCm2: number,
  options: OpticalDepthOptions = {},
): Float64Array {
  const cutoff = options.wingCutoffCm ?? defaultWingCutoffCm;
  const negligible = options.negligibleOpticalDepth ?? defaultNegligibleOpticalDepth;
  const tau = new Float64Array(grid.count);
  const { startCm, stepCm, count } = grid;
  const end = startCm + (count - 1) * stepCm;
  for (const line of lines) {
    const strength = line.intensity * columnDensityPerCm2;
    if (!(strength > 0)) continue;
    const gD = line.dopplerHwhmCm;
    const gL = line.lorentzHwhmCm;
    const width = voigtHwhm(gD, gL);
    const tailReach = Math.sqrt((strength * gL) / (Math.PI * negligible));
    const reach = Math.min(cutoff, Math.max(50 * width, tailReach));
    const nu0 = line.wavenumber;
    if (nu0 + reach < startCm || nu0 - reach > end) continue;
    const i0 = Math.max(0, Math.ceil((nu0 - reach - startCm) / stepCm));
    const i1 = Math.min(count - 1, Math.floor((nu0 + reach - startCm) / stepCm));
    if (gD <= 0) {
      const a = (strength * gL) / Math.PI;
      for (let i = i0; i <= i1; i++) {
        const d = startCm + i * stepCm - nu0;
        tau[i] += a / (d * d + gL * gL);
      }
      continue;
    }
    const scale = sqrtLn2 / gD;
    const y = gL * scale;
    const amplitude = (strength * sqrtLn2OverPi) / gD;
    const x0 = (startCm - nu0) * scale;
    const dx = stepCm * scale;
    for (let i = i0; i <= i1; i++) {
      const x = x0 + i * dx;
      tau[i] += amplitude * voigtFunction(x, y);
    }
  }
  return tau;
}
