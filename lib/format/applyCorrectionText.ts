import { shiftAtWavenumber, verdictCoverageFactor } from "../core/index.ts";
import { checkWavenumbersCm } from "./calibrationVerdict.ts";
import type { CalibrationRun } from "./spectrumCalibrationText.ts";

const signed = (text: string) => (text.startsWith("-") ? text.replace("-", "−") : `+${text}`);

/** The factor 1 + k with as many digits as k's ± warrants (k printed to 0.1 ppm → 7 decimals). */
function scaleFactor(scale: number, scaleSigma: number): string {
  const ppmDecimals = scaleSigma > 0 ? Math.max(0, 1 - Math.floor(Math.log10(scaleSigma * 1e6))) : 2;
  return (1 + scale).toFixed(6 + ppmDecimals);
}

/**
 * How to apply the correction, one sentence for the run's model. A laser-referenced FTIR takes
 * its wavenumber scale from the reference laser's wavenumber, so changing that setting multiplies
 * every wavenumber, a pure scale (fact of the trade, common practice, no source); an offset or a
 * curvature can only be entered where the instrument's software takes an axis correction.
 */
export function applyCorrectionSentence(run: CalibrationRun): string {
  const c = run.calibration.result.correction;
  const factor = scaleFactor(c.scale, c.scaleUncertainty);
  const offset = signed(c.offsetCm.toPrecision(3));
  switch (c.model) {
    case "scale":
      return `To apply: on a laser-referenced FTIR set the reference-laser wavenumber to ν_laser × (1 + k) = ν_laser × ${factor}; on other instruments enter the scale factor ${factor} (true = measured × ${factor}) as the wavenumber-axis correction in the instrument's software.`;
    case "offset":
      return `To apply: enter the offset ${offset} cm⁻¹ (true = measured ${offset} cm⁻¹) as the wavenumber-axis correction in the instrument's software; a laser-referenced FTIR's laser setting corrects a scale only, not an offset.`;
    case "linear":
      return `To apply: enter true = measured × ${factor} ${offset} cm⁻¹ in the instrument's software; on a laser-referenced FTIR the laser setting ν_laser × ${factor} corrects the scale only, and the offset remains (see the residuals after correction).`;
    case "quadratic":
      return `To apply: enter true = measured × ${factor} ${offset} cm⁻¹ + q·(measured − ${c.centreCm.toFixed(2)})², q = ${signed(c.quadraticPerCm.toPrecision(3))} cm⁻¹ per cm⁻², where the instrument's software takes a polynomial axis correction; the laser setting ν_laser × ${factor} corrects the scale only, and the rest remains (see the residuals after correction).`;
  }
}

export interface ResidualAfterCorrection {
  wavenumberCm: number;
  /** What remains after the full correction: zero, with this expanded uncertainty (k = 2). */
  expandedCm: number;
  /** What remains after the laser setting alone (c + q·d²), for models with more than a scale; else null. */
  afterLaserOnlyCm: number | null;
}

/** The residual error after correction at the check wavenumbers (the tolerance's, else the band's ends). */
export function residualsAfterCorrection(run: CalibrationRun): ResidualAfterCorrection[] {
  const c = run.calibration.result.correction;
  return checkWavenumbersCm(run, run.record?.tolerance ?? null).map((nu) => {
    const s = shiftAtWavenumber(c, nu);
    return {
      wavenumberCm: nu,
      expandedCm: verdictCoverageFactor * s.sigmaCm,
      afterLaserOnlyCm: c.model === "scale" ? null : s.shiftCm - c.scale * nu,
    };
  });
}

/** The residuals after correction in words, one line per check wavenumber. */
export function residualLines(run: CalibrationRun): string[] {
  return residualsAfterCorrection(run).map((r) => {
    const full = `residual after correction at ${r.wavenumberCm.toFixed(2)} cm⁻¹: 0 ± ${r.expandedCm.toFixed(4)} cm⁻¹ (U, k = ${verdictCoverageFactor})`;
    if (r.afterLaserOnlyCm === null) return full;
    // Left to correct is a shift; the scale reads the opposite way (measured − true).
    const way = r.afterLaserOnlyCm > 0 ? "low" : "high";
    return `${full}; after the laser setting alone it still reads ${Math.abs(r.afterLaserOnlyCm).toFixed(4)} ± ${r.expandedCm.toFixed(4)} cm⁻¹ ${way}`;
  });
}
