// The Faddeeva function w(z) = exp(−z²) erfc(−iz) for Im z ≥ 0, whose real part is the Voigt
// function K(x, y) used by every line profile. Two published approximations, each where it is
// accurate:
//  - |x| + y < 15: J. A. C. Weideman, "Computation of the complex error function",
//    SIAM J. Numer. Anal. 31, 1497–1518 (1994), the rational series in Z = (L + iz)/(L − iz) with
//    N = 32 terms and L = √(N/√2), coefficients from a discrete Fourier transform (his eq. 3.8
//    and the program in his appendix, re-derived here).
//  - |x| + y ≥ 15: the two-point Gauss–Hermite rational form used in region II of
//    J. Humlíček, "Optimized computation of the Voigt and complex probability functions",
//    JQSRT 27, 437–444 (1982): w ≈ t(1.410474 + 0.5641896 t²)/(0.75 + t²(3 + t²)), t = y − ix,
//    whose error falls as |z|⁻⁶ and is far below 1e-4 relative out there.
// Accuracy against an independent quadrature of the Voigt integral is measured in
// test/lineShapeVoigt.test.ts.

const termCount = 32;
const weidemanL = Math.sqrt(termCount / Math.SQRT2);
const invSqrtPi = 1 / Math.sqrt(Math.PI);
/** Beyond this |x| + y the two-point rational form is used. */
export const asymptoticRegionStart = 15;

/** a_1 … a_N of Weideman's series, a_n = (1/4N) Σ_k f(θ_k) cos(2π k n / 4N) over k = −2N+1 … 2N−1. */
const weidemanCoefficients: Float64Array = (() => {
  const m = 2 * termCount;
  const samples = 2 * m;
  const f = new Float64Array(samples);
  for (let k = -m + 1; k <= m - 1; k++) {
    const t = weidemanL * Math.tan((k * Math.PI) / m / 2);
    // fftshift: sample k sits at index k mod 4N; the k = −2N sample (t = ∞) is zero.
    f[(k + samples) % samples] = Math.exp(-t * t) * (weidemanL * weidemanL + t * t);
  }
  const a = new Float64Array(termCount + 1);
  for (let n = 1; n <= termCount; n++) {
    let sum = 0;
    for (let j = 0; j < samples; j++) sum += f[j] * Math.cos((2 * Math.PI * j * n) / samples);
    a[n] = sum / samples;
  }
  return a;
})();

export interface Complex {
  re: number;
  im: number;
}

function weideman(x: number, y: number): Complex {
  // z = x + iy;  L − iz = (L + y) − ix;  L + iz = (L − y) + ix.
  const dr = weidemanL + y;
  const di = -x;
  const nr = weidemanL - y;
  const ni = x;
  const dd = dr * dr + di * di;
  // Z = (L + iz)/(L − iz)
  const zr = (nr * dr + ni * di) / dd;
  const zi = (ni * dr - nr * di) / dd;
  // Horner: p = Σ_{n=1}^{N} a_n Z^{n−1}
  let pr = weidemanCoefficients[termCount];
  let pi = 0;
  for (let n = termCount - 1; n >= 1; n--) {
    const r = pr * zr - pi * zi + weidemanCoefficients[n];
    pi = pr * zi + pi * zr;
    pr = r;
  }
  // w = 2p/(L − iz)² + 1/(√π (L − iz))
  const sr = dr * dr - di * di;
  const si = 2 * dr * di;
  const ss = sr * sr + si * si;
  const qr = (2 * (pr * sr + pi * si)) / ss;
  const qi = (2 * (pi * sr - pr * si)) / ss;
  return { re: qr + (invSqrtPi * dr) / dd, im: qi - (invSqrtPi * di) / dd };
}

function twoPoint(x: number, y: number): Complex {
  // t = y − ix, u = t²
  const ur = y * y - x * x;
  const ui = -2 * x * y;
  const ar = 1.410474 + 0.5641896 * ur;
  const ai = 0.5641896 * ui;
  const numR = y * ar + x * ai;
  const numI = y * ai - x * ar;
  const denR = 0.75 + 3 * ur + ur * ur - ui * ui;
  const denI = 3 * ui + 2 * ur * ui;
  const dd = denR * denR + denI * denI;
  return { re: (numR * denR + numI * denI) / dd, im: (numI * denR - numR * denI) / dd };
}

/** w(x + iy) for y ≥ 0. */
export function faddeeva(x: number, y: number): Complex {
  if (!(y >= 0)) throw new RangeError(`faddeeva: y = ${y} must be ≥ 0 (upper half plane)`);
  return Math.abs(x) + y >= asymptoticRegionStart ? twoPoint(x, y) : weideman(x, y);
}

/**
 * Re w of Humlíček's two-point rational form (the real part of `twoPoint`), with no object made:
 * the far-wing branch of every spectrum's hot loop.
 */
export function twoPointReal(x: number, y: number): number {
  const ur = y * y - x * x;
  const ui = -2 * x * y;
  const ar = 1.410474 + 0.5641896 * ur;
  const ai = 0.5641896 * ui;
  const numR = y * ar + x * ai;
  const numI = y * ai - x * ar;
  const denR = 0.75 + 3 * ur + ur * ur - ui * ui;
  const denI = 3 * ui + 2 * ur * ui;
  return (numR * denR + numI * denI) / (denR * denR + denI * denI);
}

/** The Voigt function K(x, y) = Re w(x + iy), y ≥ 0; the hot loop of every spectrum. */
export function voigtFunction(x: number, y: number): number {
  const ax = x < 0 ? -x : x;
  return ax + y >= asymptoticRegionStart ? twoPointReal(x, y) : weideman(x, y).re;
}
