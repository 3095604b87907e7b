import { measuredGrade } from "../positions/certifiedPositions.ts";
import type { AbsorptionPeak } from "./absorptionPeaks.ts";
import type { CalibrationReference } from "./calibrationReferences.ts";
import type { SpectrumCalibrationRules } from "./spectrumCalibrationRules.ts";
import type { WavenumberCm } from "../types.ts";

export type RejectionReason = "weak" | "saturated" | "blended" | "uncertain-reference" | "residual";

export interface CalibratedLine {
  reference: CalibrationReference;
  peak: AbsorptionPeak | null;
  /** reference − corrected measured position, cm⁻¹ (null without a peak). */
  residualCm: WavenumberCm | null;
  /** Measured (with its floor) and reference ± in quadrature, cm⁻¹ (null without a peak). */
  sigmaCm: WavenumberCm | null;
  /** The peak's ± raised to the per-line floor, cm⁻¹ (null without a peak). */
  measurementSigmaCm: WavenumberCm | null;
  used: boolean;
  reason: RejectionReason | null;
  /** Why, in words, for an unused line. */
  detail: string | null;
}

const fmt = (x: number, digits: number) => x.toFixed(digits);

function strongNeighbour(peaks: readonly AbsorptionPeak[], own: AbsorptionPeak, resolutionCm: number, rules: SpectrumCalibrationRules): AbsorptionPeak | null {
  let found: AbsorptionPeak | null = null;
  for (const p of peaks) {
    if (p === own || Math.abs(p.wavenumberCm - own.wavenumberCm) > rules.strongNeighbourResolutions * resolutionCm) continue;
    if (p.heightAbsorbance >= 2 * own.heightAbsorbance && p.heightAbsorbance >= 0.5 * rules.saturationAbsorbance) {
      if (!found || p.heightAbsorbance > found.heightAbsorbance) found = p;
    }
  }
  return found;
}

/**
 * Every reference line with the peak assigned to it (if any), sorted into used and not used with
 * the reason in words: no peak, saturated, blended (by a listed line within R or a strong measured
 * neighbour), reference too uncertain or not validated when that is required, too weak. The
 * measurement σ is the peak's own, raised to the per-line floor.
 */
export function sortReferenceLines(
  references: readonly CalibrationReference[],
  peaks: readonly AbsorptionPeak[],
  peakOf: ReadonlyMap<CalibrationReference, number>,
  resolutionCm: WavenumberCm,
  rules: SpectrumCalibrationRules,
): CalibratedLine[] {
  return references.map((reference) => {
    const index = peakOf.get(reference);
    const peak = index === undefined ? null : peaks[index];
    const measurementSigma = peak ? Math.max(peak.wavenumberUncertaintyCm, rules.peakFloorFraction * resolutionCm) : null;
    const sigma = measurementSigma === null ? null : Math.hypot(measurementSigma, reference.referenceUncertaintyCm);
    const reject = (reason: RejectionReason, detail: string): CalibratedLine => ({
      reference,
      peak,
      residualCm: null,
      sigmaCm: sigma,
      measurementSigmaCm: measurementSigma,
      used: false,
      reason,
      detail,
    });
    if (!peak) return reject("weak", "no peak found there");
    if (peak.flatTop || peak.heightAbsorbance >= rules.saturationAbsorbance) {
      return reject("saturated", peak.flatTop ? "flat-topped peak" : `peak absorbance ${fmt(peak.heightAbsorbance, 2)} ≥ ${rules.saturationAbsorbance}`);
    }
    if (reference.blended || reference.referenceCm === null) {
      return reject(
        "blended",
        reference.referenceCm === null ? "no peak of its own at this resolution" : `a line within ${fmt(reference.nearestNeighbourCm!, 3)} cm⁻¹ (≤ resolution)`,
      );
    }
    const pulling = strongNeighbour(peaks, peak, resolutionCm, rules);
    if (pulling) {
      return reject(
        "blended",
        `beside a strong peak at ${fmt(pulling.wavenumberCm, 2)} cm⁻¹ (absorbance ${fmt(pulling.heightAbsorbance, 2)}) whose wing the prediction cannot give`,
      );
    }
    if (!reference.precise) return reject("uncertain-reference", `reference ± ${reference.referenceUncertaintyCm.toPrecision(2)} cm⁻¹ > resolution/4`);
    if (rules.requireValidated && !measuredGrade(reference.positionStatus)) {
      return reject(
        "uncertain-reference",
        `position ${reference.positionStatus === "extrapolated" ? "extrapolated beyond" : "not validated against"} measured lines, and validated references were required`,
      );
    }
    if (peak.signalToNoise < rules.minSignalToNoise) return reject("weak", `signal-to-noise ${fmt(peak.signalToNoise, 1)} < ${rules.minSignalToNoise}`);
    return { reference, peak, residualCm: null, sigmaCm: sigma, measurementSigmaCm: measurementSigma, used: true, reason: null, detail: null };
  });
}
