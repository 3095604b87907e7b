import { CoreInputError } from "../coreInputError.ts";
import type { WavenumberCm } from "../types.ts";

export const apodizations = ["boxcar", "triangular", "happ-genzel", "norton-beer-weak", "norton-beer-medium", "norton-beer-strong"] as const;
export type Apodization = (typeof apodizations)[number];

/**
 * How the spectrum is seen. For a Fourier-transform instrument the resolution R sets the maximum
 * optical path difference L = 1/R (the convention of P. R. Griffiths and J. A. de Haseth,
 * Fourier Transform Infrared Spectrometry, ch. 2; from memory) — some makers quote 0.9/L or
 * 1/(2L), so a stated resolution is not comparable between makers without this. A grating
 * instrument is modelled by a Gaussian slit function whose FWHM is the resolution.
 */
export type Instrument =
  | { kind: "fourier-transform"; resolutionCm: WavenumberCm; apodization: Apodization }
  | { kind: "grating"; resolutionCm: WavenumberCm }
  | { kind: "monochromatic" };

// Norton–Beer apodization A(u) = Σ C_i (1 − u²)^i, u = x/L: R. H. Norton and R. Beer, "New
// apodizing functions for Fourier spectrometry", J. Opt. Soc. Am. 66, 259–264 (1976), with the
// coefficients as reproduced in D. A. Naylor and M. K. Tahic, JOSA A 24, 3644 (2007) (from memory;
// each set sums to 1, checked in test/lineShapeInstrument.test.ts).
const nortonBeer: Record<string, readonly number[]> = {
  "norton-beer-weak": [0.384093, -0.087577, 0.703484],
  "norton-beer-medium": [0.152442, -0.136176, 0.983734],
  "norton-beer-strong": [0.045335, 0, 0.554883, 0, 0.399782],
};

/** A(u) for u = x/L in [0, 1] (zero beyond). */
export function apodizationFunction(apodization: Apodization, u: number): number {
  const a = Math.abs(u);
  if (a > 1) return 0;
  switch (apodization) {
    case "boxcar":
      return 1;
    case "triangular":
      return 1 - a;
    case "happ-genzel":
      // H. Happ and L. Genzel, Infrared Phys. 1, 39 (1961): 0.54 + 0.46 cos(πu) (from memory).
      return 0.54 + 0.46 * Math.cos(Math.PI * a);
    default: {
      const c = nortonBeer[apodization];
      const s = 1 - a * a;
      let value = 0;
      let power = 1;
      for (const coefficient of c) {
        value += coefficient * power;
        power *= s;
      }
      return value;
    }
  }
}

export function checkInstrument(instrument: Instrument): void {
  if (instrument.kind === "monochromatic") return;
  if (!(Number.isFinite(instrument.resolutionCm) && instrument.resolutionCm > 0)) {
    throw new CoreInputError(`resolution ${instrument.resolutionCm} cm⁻¹ is not possible: it must be above 0`);
  }
  if (instrument.kind === "fourier-transform" && !apodizations.includes(instrument.apodization)) {
    throw new CoreInputError(`unknown apodization "${instrument.apodization}"; one of: ${apodizations.join(", ")}`);
  }
}

/**
 * The instrument's effect in the interferogram (optical path difference x, cm) domain: the
 * spectrum seen is the true one convolved with the ILS, i.e. its transform multiplied by this.
 * FT: A(|x|/L) for |x| ≤ L. Grating: the transform of a unit-area Gaussian of FWHM f,
 * exp(−π² f² x² / (4 ln 2)).
 */
export function instrumentTransfer(instrument: Instrument, opdCm: number): number {
  switch (instrument.kind) {
    case "monochromatic":
      return 1;
    case "grating": {
      const f = instrument.resolutionCm;
      return Math.exp((-Math.PI * Math.PI * f * f * opdCm * opdCm) / (4 * Math.LN2));
    }
    case "fourier-transform":
      return apodizationFunction(instrument.apodization, opdCm * instrument.resolutionCm);
  }
}

/**
 * ILS(ν̃) = ∫ transfer(x) cos(2πν̃x) dx over all x (unit area), by composite Gauss–Legendre over
 * [0, L] (FT) or the Gaussian closed form (grating). For plots, widths and tests; the spectra use
 * the transfer function directly.
 */
export function instrumentLineShape(instrument: Instrument, offsetCm: WavenumberCm): number {
  if (instrument.kind === "monochromatic") throw new CoreInputError("a monochromatic instrument has no line shape");
  if (instrument.kind === "grating") {
    const f = instrument.resolutionCm;
    return ((2 * Math.sqrt(Math.LN2 / Math.PI)) / f) * Math.exp((-4 * Math.LN2 * offsetCm * offsetCm) / (f * f));
  }
  const L = 1 / instrument.resolutionCm;
  const panels = Math.max(16, Math.ceil(4 * Math.abs(offsetCm) * L) + 16);
  const h = L / panels;
  // 5-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun, table 25.4).
  const nodes = [0, 0.5384693101056831, -0.5384693101056831, 0.906179845938664, -0.906179845938664];
  const weights = [0.5688888888888889, 0.47862867049936647, 0.47862867049936647, 0.23692688505618908, 0.23692688505618908];
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = (p + 0.5) * h;
    for (let k = 0; k < 5; k++) {
      const x = mid + (nodes[k] * h) / 2;
      sum += weights[k] * apodizationFunction(instrument.apodization, x / L) * Math.cos(2 * Math.PI * offsetCm * x);
    }
  }
  return 2 * sum * (h / 2);
}

/** Half the distance a convolution must look beyond a window's edge to see all of the ILS that matters. */
export function instrumentReachCm(instrument: Instrument): WavenumberCm {
  if (instrument.kind === "monochromatic") return 0;
  // FT sidelobes fall slowly (boxcar as 1/(2πν̃L), triangular on average as 1/(2π²ν̃²L)): beyond
  // 40 R a triangular ILS holds 1/(40π²) ≈ 0.25 % of its area, a Gaussian slit nothing beyond 3 FWHM.
  return instrument.kind === "grating" ? 3 * instrument.resolutionCm : 40 * instrument.resolutionCm;
}
