/** Where a sampled peak's top lies, and how well the noise lets us say so. */
export interface PeakVertex {
  wavenumberCm: number;
  wavenumberUncertaintyCm: number;
}

/**
 * Weighted least squares y = a + b·u + c·u² (u = x − x0) through points with equal σ in y,
 * solved from the 3×3 normal equations; returns the vertex −b/(2c) and its standard uncertainty
 * by first-order propagation of the parameter covariance σ²(AᵀWA)⁻¹.
 */
function parabolaVertex(u: number[], y: number[], sigma: number[]): { vertex: number; variance: number; curvature: number } | null {
  const m = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  const v = [0, 0, 0];
  for (let i = 0; i < u.length; i++) {
    const w = 1 / (sigma[i] * sigma[i]);
    const row = [1, u[i], u[i] * u[i]];
    for (let a = 0; a < 3; a++) {
      v[a] += w * row[a] * y[i];
      for (let b = 0; b < 3; b++) m[a][b] += w * row[a] * row[b];
    }
  }
  const inv = invert3(m);
  if (!inv) return null;
  const p = [0, 1, 2].map((a) => inv[a][0] * v[0] + inv[a][1] * v[1] + inv[a][2] * v[2]);
  const [, b, c] = p;
  if (!(c < 0)) return null;
  const vertex = -b / (2 * c);
  const gb = -1 / (2 * c);
  const gc = b / (2 * c * c);
  const variance = gb * gb * inv[1][1] + gc * gc * inv[2][2] + 2 * gb * gc * inv[1][2];
  return { vertex, variance: Math.max(variance, 0), curvature: c };
}

function invert3(m: number[][]): number[][] | null {
  const [[a, b, c], [d, e, f], [g, h, k]] = m;
  const A = e * k - f * h;
  const B = -(d * k - f * g);
  const C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return null;
  return [
    [A / det, -(b * k - c * h) / det, (b * f - c * e) / det],
    [B / det, (a * k - c * g) / det, -(a * f - c * d) / det],
    [C / det, -(a * h - b * g) / det, (a * e - b * d) / det],
  ];
}

/**
 * The top of a peak from the points of its upper half (heights above baseline): a parabola
 * through the logarithm of the heights, which is exact for a Gaussian top and close for the
 * apodized instrument line shapes of an FTIR (the log-parabola "Caruana" estimator; R. A.
 * Caruana, R. B. Searle, T. Heller and S. I. Shupack, Anal. Chem. 58, 1162 (1986)). Each log
 * point weighs by (height/σ)², since var(ln h) = σ²/h². Falls back to the plain parabola through
 * the three highest points when the log fit has no maximum.
 */
export function peakVertex(x: ArrayLike<number>, height: ArrayLike<number>, top: number, first: number, last: number, noise: number): PeakVertex {
  const x0 = x[top];
  const u: number[] = [];
  const ly: number[] = [];
  const ls: number[] = [];
  for (let i = first; i <= last; i++) {
    if (!(height[i] > 0)) continue;
    u.push(x[i] - x0);
    ly.push(Math.log(height[i]));
    ls.push(noise / height[i]);
  }
  const spacing = Math.abs(x[Math.min(top + 1, x.length - 1)] - x[Math.max(top - 1, 0)]) / 2;
  if (u.length >= 3) {
    const fit = parabolaVertex(u, ly, ls);
    if (fit && Math.abs(fit.vertex) <= 1.5 * spacing) return { wavenumberCm: x0 + fit.vertex, wavenumberUncertaintyCm: Math.sqrt(fit.variance) };
  }
  const lo = Math.max(top - 1, 0);
  const hi = Math.min(top + 1, x.length - 1);
  const three = [lo, top, hi];
  const fit = parabolaVertex(
    three.map((i) => x[i] - x0),
    three.map((i) => height[i]),
    three.map(() => noise),
  );
  if (fit && Math.abs(fit.vertex) <= spacing) return { wavenumberCm: x0 + fit.vertex, wavenumberUncertaintyCm: Math.sqrt(fit.variance) };
  // A flat or one-sample top: the sample itself, uncertain by half a step either way.
  return { wavenumberCm: x0, wavenumberUncertaintyCm: spacing / Math.sqrt(3) };
}
