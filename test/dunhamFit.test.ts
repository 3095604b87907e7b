// The Dunham fit against synthetic lines of known constants. The constants below are an invented
// test molecule (round numbers of the size of a light hydride, not any real gas); what is checked
// is the statistics of the fit, which must hold for any constants.
import { describe, expect, it } from "vitest";
import { fitDunham, speciesDunhamFromFit, termSupport, termValue, type DunhamCoefficient, type FitObservation } from "../lib/core/index.ts";

const truth: DunhamCoefficient[] = [
  { k: 1, l: 0, valueCm: 2900, uncertaintyCm: 0 },
  { k: 2, l: 0, valueCm: -50, uncertaintyCm: 0 },
  { k: 0, l: 1, valueCm: 10.5, uncertaintyCm: 0 },
  { k: 1, l: 1, valueCm: -0.3, uncertaintyCm: 0 },
  { k: 0, l: 2, valueCm: -5.2e-4, uncertaintyCm: 0 },
];
const terms = truth.map(({ k, l }) => ({ k, l }));

function rng(seed: number) {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(uniform() || 1e-300)) * Math.cos(2 * Math.PI * uniform());
}

function syntheticLines(gauss: () => number, sigmaCm: number): FitObservation[] {
  const out: FitObservation[] = [];
  for (const [vUpper, vLower] of [
    [1, 0],
    [2, 0],
  ]) {
    for (let jLower = 0; jLower <= 12; jLower++) {
      for (const jUpper of [jLower + 1, jLower - 1]) {
        if (jUpper < 0) continue;
        const exact = termValue(truth, vUpper, jUpper) - termValue(truth, vLower, jLower);
        out.push({
          species: "invented",
          massRatio: 1,
          inverseMassShifts: [0, 0],
          vUpper,
          jUpper,
          vLower,
          jLower,
          label: `${jUpper > jLower ? "R" : "P"}(${jLower})`,
          band: `${vUpper}-${vLower}`,
          wavenumberCm: exact + sigmaCm * gauss(),
          uncertaintyCm: sigmaCm,
          sourceKey: "synthetic",
          heldOut: false,
        });
      }
    }
  }
  return out;
}

describe("fitDunham (weighted least squares by SVD)", () => {
  it("recovers the constants exactly from noiseless lines", () => {
    const fit = fitDunham(
      syntheticLines(() => 0, 1e-3),
      terms,
    );
    fit.terms.forEach((t, i) => {
      const expected = truth.find((c) => c.k === t.k && c.l === t.l)!.valueCm;
      expect(fit.solution.parameters[i]).toBeCloseTo(expected, 8);
    });
    expect(fit.rmsCm).toBeLessThan(1e-9);
  });

  it("covers the true constants in about 68 % of 200 noisy trials, and the line ± matches the spread", () => {
    const gauss = rng(20261202);
    const sigmaCm = 0.002;
    let covered = 0;
    let total = 0;
    // An extrapolated line (v = 3 ← 0, J'' = 15) is predicted in each trial; its spread over the
    // trials is compared with the propagated uncertainty of the first trial.
    const probe = { vUpper: 3, jUpper: 16, vLower: 0, jLower: 15 };
    const predictions: number[] = [];
    let propagated = 0;
    for (let trial = 0; trial < 200; trial++) {
      const fit = fitDunham(syntheticLines(gauss, sigmaCm), terms);
      fit.terms.forEach((t, i) => {
        const expected = truth.find((c) => c.k === t.k && c.l === t.l)!.valueCm;
        total++;
        if (Math.abs(fit.solution.parameters[i] - expected) <= fit.solution.uncertainties[i]) covered++;
      });
      const { dunham, covariance } = speciesDunhamFromFit(fit, 1, [0, 0]);
      predictions.push(termValue(dunham, probe.vUpper, probe.jUpper) - termValue(dunham, probe.vLower, probe.jLower));
      if (trial === 0) {
        const g = dunham.map(
          (c) =>
            Math.pow(probe.vUpper + 0.5, c.k) * Math.pow(probe.jUpper * (probe.jUpper + 1), c.l) -
            Math.pow(probe.vLower + 0.5, c.k) * Math.pow(probe.jLower * (probe.jLower + 1), c.l),
        );
        propagated = Math.sqrt(g.reduce((s, gi, i) => s + gi * g.reduce((t, gj, j) => t + gj * covariance[i][j], 0), 0));
      }
    }
    // One standard uncertainty covers 68.3 % of a Gaussian; 1000 parameter draws (200 × 5,
    // correlated within a trial) leave a few per cent of sampling scatter.
    expect(covered / total).toBeGreaterThan(0.6);
    expect(covered / total).toBeLessThan(0.76);
    const mean = predictions.reduce((s, x) => s + x, 0) / predictions.length;
    const spread = Math.sqrt(predictions.reduce((s, x) => s + (x - mean) ** 2, 0) / (predictions.length - 1));
    expect(Math.abs(propagated / spread - 1)).toBeLessThan(0.2);
  });

  it("says which terms the lines support (|value| ≥ 3σ) and that a further term is not supported", () => {
    const observations = syntheticLines(rng(7), 0.002);
    const fit = fitDunham(observations, terms);
    const support = termSupport(observations, fit);
    expect(support.fitted.every((s) => s.supported)).toBe(true);
    // The truth has no Y30, Y21 or Y12: each added alone should come out consistent with zero.
    for (const s of support.next) expect(s.significance).toBeLessThan(4);
  });

  it("refuses terms the lines cannot determine and observations without an uncertainty", () => {
    const lines = syntheticLines(() => 0, 1e-3).filter((o) => o.vUpper === 1);
    // From the 1-0 band alone Y10 and Y20 enter only as one combination, Y10 + 2·Y20 (the origin).
    expect(() => fitDunham(lines, terms)).toThrow(/not independent/);
    expect(() =>
      fitDunham(
        lines.map((o) => ({ ...o, uncertaintyCm: 0 })),
        [{ k: 0, l: 1 }],
      ),
    ).toThrow(/uncertainty above 0/);
  });
});
