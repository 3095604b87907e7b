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
  for (let k = 0; k <= m / 2; k++) {
    const t = instrumentTransfer(instrument, k * dx);
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
