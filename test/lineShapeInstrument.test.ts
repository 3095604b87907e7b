import { describe, expect, it } from "vitest";
import { apodizationFunction, apodizations, convolveWithInstrument, instrumentLineShape, type Instrument } from "../lib/core/index.ts";

const ft = (apodization: (typeof apodizations)[number], resolutionCm = 1): Instrument => ({ kind: "fourier-transform", resolutionCm, apodization });

function fwhm(instrument: Instrument): number {
  const peak = instrumentLineShape(instrument, 0);
  let lo = 0;
  let hi = 5;
  for (let k = 0; k < 60; k++) {
    const m = (lo + hi) / 2;
    if (instrumentLineShape(instrument, m) > peak / 2) lo = m;
    else hi = m;
  }
  return 2 * lo;
}

describe("FT instrument line shapes (maximum optical path difference L = 1/resolution)", () => {
  it("Norton–Beer coefficient sets each sum to 1, so A(0) = 1 (Norton & Beer 1976)", () => {
    for (const a of ["norton-beer-weak", "norton-beer-medium", "norton-beer-strong"] as const) expect(apodizationFunction(a, 0)).toBeCloseTo(1, 6);
  });

  it("boxcar and triangular ILS equal their closed forms 2L sinc(2πν̃L) and L sinc²(πν̃L) (Griffiths & de Haseth, ch. 2; from memory)", () => {
    const L = 2; // resolution 0.5 cm⁻¹
    for (const nu of [0, 0.1, 0.37, 1.3, 4.05]) {
      const x = 2 * Math.PI * nu * L;
      const box = nu === 0 ? 2 * L : (2 * L * Math.sin(x)) / x;
      const y = Math.PI * nu * L;
      const tri = nu === 0 ? L : L * (Math.sin(y) / y) ** 2;
      expect(instrumentLineShape(ft("boxcar", 0.5), nu)).toBeCloseTo(box, 8);
      expect(instrumentLineShape(ft("triangular", 0.5), nu)).toBeCloseTo(tri, 8);
    }
  });

  it("has the textbook widths: FWHM·2L = 1.207 boxcar, 1.772 triangular, 1.816 Happ–Genzel (common practice; from memory)", () => {
    expect(fwhm(ft("boxcar")) * 2).toBeCloseTo(1.207, 3);
    expect(fwhm(ft("triangular")) * 2).toBeCloseTo(1.772, 3);
    expect(fwhm(ft("happ-genzel")) * 2).toBeCloseTo(1.816, 2);
  });

  it("Norton–Beer weak/medium/strong broaden the boxcar FWHM by 1.2, 1.4 and 1.6, as the functions were designed (Norton & Beer 1976; from memory)", () => {
    const box = fwhm(ft("boxcar"));
    expect(fwhm(ft("norton-beer-weak")) / box).toBeCloseTo(1.2, 2);
    expect(fwhm(ft("norton-beer-medium")) / box).toBeCloseTo(1.4, 2);
    expect(fwhm(ft("norton-beer-strong")) / box).toBeCloseTo(1.6, 2);
  });

  it("boxcar's first sidelobe is −21.7 % of the peak (sinc minimum −0.2172, fact of the trade)", () => {
    let minimum = 0;
    for (let nu = 0; nu < 3; nu += 0.0005) minimum = Math.min(minimum, instrumentLineShape(ft("boxcar"), nu));
    expect(minimum / instrumentLineShape(ft("boxcar"), 0)).toBeCloseTo(-0.2172, 3);
  });
});

describe("convolution with the instrument (FFT, transfer function in the OPD domain)", () => {
  const step = 0.002;
  const n = 20001;
  const spike = () => {
    const v = new Float64Array(n);
    v[(n - 1) / 2] = 1 / step; // unit area
    return v;
  };

  it("turns a unit-area spike into the sampled ILS, for every apodization and the grating", () => {
    const instruments: Instrument[] = [...apodizations.map((a) => ft(a, 0.5)), { kind: "grating", resolutionCm: 0.5 }];
    for (const inst of instruments) {
      const out = convolveWithInstrument(spike(), step, inst);
      for (const k of [0, 50, 173, 400, 1200]) {
        const expected = instrumentLineShape(inst, k * step);
        expect(Math.abs(out[(n - 1) / 2 + k] - expected), `${JSON.stringify(inst)} at ${k * step}`).toBeLessThan(2e-3 * instrumentLineShape(inst, 0));
      }
    }
  });

  it("keeps the area (the ILS has unit area) and gives the grating's Gaussian a FWHM equal to the resolution", () => {
    const out = convolveWithInstrument(spike(), step, { kind: "grating", resolutionCm: 0.8 });
    let area = 0;
    for (const v of out) area += v * step;
    expect(area).toBeCloseTo(1, 6);
    const peak = out[(n - 1) / 2];
    let k = 0;
    while (out[(n - 1) / 2 + k] > peak / 2) k++;
    expect(2 * k * step).toBeCloseTo(0.8, 2);
  });
});
