import { fft, nextPowerOfTwo } from "./fft.ts";
import { instrumentReachCm, instrumentTransfer, type Instrument } from "./instrumentLineShape.ts";

/**
 * Convolves samples on an even grid with the instrument line shape by the convolution theorem:
 * transform, multiply by the instrument's transfer function at each optical path difference
 * x_k = k/(M·step), transform back (see instrumentLineShape.ts). Values beyond both ends are taken
 * as zero, so pass a quantity that vanishes away from lines (absorptance 1 − T, or τ) and a grid
 * that extends instrumentReachCm beyond the window of interest.
 */
export function convolveWithInstrument(values: Float64Array, stepCm: number, instrument: Instrument): Float64Array {
  if (instrument.kind === "monochromatic") return Float64Array.from(values);
  const n = values.length;
  const pad = Math.ceil(instrumentReachCm(instrument) / stepCm);
  const m = nextPowerOfTwo(n + 2 * pad);
  const re = new Float64Array(m);
  const im = new Float64Array(m);
  re.set(values);
  fft(re, im);
  const dx = 1 / (m * stepCm);
  // The apodization may jump to zero at x = L (boxcar, Happ–Genzel, weak Norton–Beer): the bin
  // holding L gets its average over the bin, so the effective OPD is L and not L rounded to a bin.
  const edge = instrument.kind === "fourier-transform" ? 1 / instrument.resolutionCm : Infinity;
  const transferAt = (x: number) => {
    if (Math.abs(x - edge) >= dx) return instrumentTransfer(instrument, x);
    let sum = 0;
    for (let j = 0; j < 16; j++) sum += instrumentTransfer(instrument, x + ((j + 0.5) / 16 - 0.5) * dx);
    return sum / 16;
  };
  for (let k = 0; k <= m / 2; k++) {
    const t = transferAt(k * dx);
    re[k] *= t;
    im[k] *= t;
    if (k > 0 && k < m / 2) {
      re[m - k] *= t;
      im[m - k] *= t;
    }
  }
  fft(re, im, true);
  return re.slice(0, n);
}
