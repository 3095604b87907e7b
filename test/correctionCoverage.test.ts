// Does the printed ± of a wavenumber correction hold where the truth is known? Synthetic cell
// spectra are made with a *different* model from the one the calibration uses (constants cut to
// the handbook's terms, a term the shipped table leaves out, another instrument line shape, an
// offset under a scale-only fit), every trial with its own scale error, offset and noise
// (invented measurements). Each case must give |estimate − truth| ≤ 2σ in at least 90 % of the
// trials, and a median σ at most 3× the observed spread (a ± too large is a defect too). Then the
// real teaching-laboratory spectra: halves and isotopologues calibrated separately must agree.
// Trials per case: 12 by default; BANDATLAS_FULL_TRIALS=1 runs 60.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import {
  correctionBudget,
  fitWavenumberCorrection,
  omittedTermComponents,
  omittedTerms,
  type Apodization,
  type CorrectionModel,
  type DiatomicSpeciesModel,
  type DunhamCoefficient,
} from "../lib/core/index.ts";
import { calibrateMeasuredSpectrum, cellModel, defaultCellConditions, selectMolecule, type CellModel } from "../lib/atlas/index.ts";
import { readSpectrumText } from "../lib/spectrumFile/index.ts";
import { shippedMolecules } from "./helpers/shipped.ts";
import { measuredSpectrum, seededRandom, trueSpectrum } from "../lib/atlas/syntheticSpectrum.ts";

const trials = process.env.BANDATLAS_FULL_TRIALS ? 60 : 12;
const cellOf = (id: string): CellModel => cellModel(selectMolecule(shippedMolecules(), id));

/** A cell model whose diatomic species' tables are changed by `change` (every species alike). */
function withTables(cell: CellModel, change: (s: DiatomicSpeciesModel) => Partial<DiatomicSpeciesModel>): CellModel {
  return {
    ...cell,
    species: cell.species.map(({ model, bands }) => {
      if (model.structure !== "diatomic") throw new Error("diatomic expected");
      return { model: { ...model, ...change(model) }, bands };
    }),
  };
}

// Huber & Herzberg's columns: ωe, ωexe, ωeye, Be, αe, γe, De, βe (fact of the trade).
const handbookTerms = new Set(["10", "20", "30", "01", "11", "21", "02", "12"]);

/** 12C16O & co. with their Dunham tables cut to the handbook's terms, the ± the omitted-term estimate, not validated. */
const cutCo = () =>
  withTables(cellOf("co"), (s) => {
    const dunham = s.dunham.filter((c) => handbookTerms.has(`${c.k}${c.l}`)).map((c) => ({ ...c, uncertaintyCm: 0 }));
    return { dunham, positionErrors: omittedTermComponents(omittedTerms(dunham, null)), validation: undefined, referenceLines: [] };
  });

/**
 * HCl with the ωeze term the shipped table lacks: Y40 = −0.0122 cm⁻¹ for H35Cl (Huber & Herzberg
 * 1979, from memory; a test truth, never shipped), scaled to each species by (μ_ref/μ)².
 */
const hclWithY40 = () => {
  const cell = cellOf("hcl");
  const reference = cell.species[0].model as DiatomicSpeciesModel;
  return withTables(cell, (s) => {
    const y40: DunhamCoefficient = { k: 4, l: 0, valueCm: -0.0122 * (reference.reducedMassU / s.reducedMassU) ** 2, uncertaintyCm: 0 };
    return { dunham: [...s.dunham, y40] };
  });
};

interface Case {
  name: string;
  truth: () => CellModel;
  model: () => CellModel;
  range: [number, number];
  resolutionCm: number;
  truthApodization: Apodization;
  fit: CorrectionModel;
  maxScale: number;
  maxOffsetCm: number;
  /** Where the correction is judged: k (scale), or the shift at the lines' centre. */
  judge: "scale" | "centre";
}

const cases: Case[] = [
  {
    name: "CO cut to the handbook's terms (truth: Farrenq et al. 1991 full set), 0.125 cm⁻¹, scale",
    truth: () => cellOf("co"),
    model: cutCo,
    range: [2000, 2260],
    resolutionCm: 0.125,
    truthApodization: "triangular",
    fit: "scale",
    maxScale: 300e-6,
    maxOffsetCm: 0,
    judge: "scale",
  },
  {
    name: "CO cut to the handbook's terms, 0.5 cm⁻¹, linear",
    truth: () => cellOf("co"),
    model: cutCo,
    range: [2000, 2260],
    resolutionCm: 0.5,
    truthApodization: "triangular",
    fit: "linear",
    maxScale: 300e-6,
    maxOffsetCm: 0.5,
    judge: "scale",
  },
  {
    name: "HCl whose truth has the ωeze term the shipped table lacks, 0.5 cm⁻¹, scale",
    truth: hclWithY40,
    model: () => cellOf("hcl"),
    range: [2620, 3100],
    resolutionCm: 0.5,
    truthApodization: "triangular",
    fit: "scale",
    maxScale: 300e-6,
    maxOffsetCm: 0,
    judge: "scale",
  },
  {
    name: "CO recorded with Happ–Genzel apodization, calibrated assuming triangular, 1 cm⁻¹, scale",
    truth: () => cellOf("co"),
    model: () => cellOf("co"),
    range: [2000, 2260],
    resolutionCm: 1,
    truthApodization: "happ-genzel",
    fit: "scale",
    maxScale: 300e-6,
    maxOffsetCm: 0,
    judge: "scale",
  },
  {
    name: "CO with an offset of up to 0.004 cm⁻¹ under a scale-only fit, 0.25 cm⁻¹ (judged at the lines' centre)",
    truth: () => cellOf("co"),
    model: () => cellOf("co"),
    range: [2000, 2260],
    resolutionCm: 0.25,
    truthApodization: "triangular",
    fit: "scale",
    maxScale: 300e-6,
    maxOffsetCm: 0.004,
    judge: "centre",
  },
];

describe("the correction's ± holds where the truth is known (synthetic spectra from a different model)", () => {
  for (const c of cases) {
    it(c.name, () => {
      const truthCell = c.truth();
      const modelCell = c.model();
      const [from, to] = c.range;
      const truth = trueSpectrum(truthCell, defaultCellConditions, c.resolutionCm, c.truthApodization, from - 5, to + 5);
      const random = seededRandom(c.name.length * 7919);
      const errors: number[] = [];
      const sigmas: number[] = [];
      for (let t = 0; t < trials; t++) {
        const error = {
          scale: (random() * 2 - 1) * c.maxScale,
          offsetCm: (random() * 2 - 1) * c.maxOffsetCm,
          noiseAbsorbance: 0.005 * truth.peakAbsorbance,
          tiltPerCm: 5e-5,
          baselineAbsorbance: 0.01,
        };
        const measured = measuredSpectrum(truth, from, to, c.resolutionCm / 4, error, seededRandom(t + 11));
        const { result } = calibrateMeasuredSpectrum(
          modelCell,
          { ...measured, resolutionCm: c.resolutionCm },
          { conditions: defaultCellConditions, apodization: "triangular", model: c.fit },
        );
        const k = result.correction;
        if (c.judge === "scale") {
          errors.push(k.scale - error.scale);
          sigmas.push(k.scaleUncertainty);
        } else {
          // The shift the correction gives at the lines' centre against the true one there.
          const x = k.centreCm;
          errors.push(k.scale * x + k.offsetCm - (error.scale * x + error.offsetCm));
          sigmas.push(Math.hypot(k.scaleUncertainty * x, k.offsetUncertaintyCm));
        }
      }
      const covered = errors.filter((e, i) => Math.abs(e) <= 2 * sigmas[i]).length / trials;
      const spread = Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / trials);
      const medianSigma = [...sigmas].sort((a, b) => a - b)[trials >> 1];
      expect(covered, `|error| ≤ 2σ in ${(100 * covered).toFixed(0)} % of trials`).toBeGreaterThanOrEqual(0.9);
      expect(medianSigma / spread, `median σ ${medianSigma.toExponential(2)} against spread ${spread.toExponential(2)}`).toBeLessThanOrEqual(3);
    });
  }
});

const spectra = join(import.meta.dirname, "fixtures", "spectra");
const hunterPath = join(spectra, "hcl-dcl-hunter", "HCl_spectrum.csv");

/** The Hunter HCl spectrum, or the part of it in [fromCm, toCm], calibrated with the scale model. */
function calibrateHunter(fromCm: number, toCm: number) {
  const spectrum = readSpectrumText(readFileSync(hunterPath, "utf8"), "HCl_spectrum.csv");
  const keep = Array.from(spectrum.wavenumberCm, (_, i) => i).filter((i) => spectrum.wavenumberCm[i] >= fromCm && spectrum.wavenumberCm[i] <= toCm);
  return calibrateMeasuredSpectrum(
    cellOf("hcl"),
    {
      wavenumberCm: Float64Array.from(keep, (i) => spectrum.wavenumberCm[i]),
      absorbance: Float64Array.from(keep, (i) => spectrum.absorbance[i]),
      resolutionCm: null,
    },
    // The whole file's resolution estimate (0.62 cm⁻¹), so both parts are read alike.
    { conditions: defaultCellConditions, apodization: "triangular", model: "scale", resolutionCm: 0.62 },
  ).result;
}

/** The scale correction and its budget from one species' used lines of a calibration. */
function speciesScale(result: ReturnType<typeof calibrateHunter>, species: string) {
  const lines = result.lines.filter((l) => l.used && l.reference.species === species);
  const correction = fitWavenumberCorrection(
    "scale",
    lines.map((l) => ({ measuredCm: l.peak!.wavenumberCm, referenceCm: l.reference.referenceCm!, sigmaCm: l.sigmaCm! })),
  );
  const budget = correctionBudget(
    correction,
    lines.map((l) => ({
      measuredCm: l.peak!.wavenumberCm,
      fitSigmaCm: l.sigmaCm!,
      measurementSigmaCm: l.measurementSigmaCm!,
      residualCm: l.reference.referenceCm! - l.peak!.wavenumberCm * (1 + correction.scale),
      shares: l.reference.shares,
    })),
  );
  return { scale: correction.scale, scaleUncertainty: budget.scaleSigma, lines: lines.length };
}

describe("real spectra: parts calibrated separately agree within their printed ±", () => {
  // Teaching-laboratory FTIR, GitHub mskblackbelt/Chem357 (see ../shared/spectra/README.md).
  it("HCl_spectrum.csv (Hunter): the P-branch half and the R-branch half", () => {
    const p = calibrateHunter(2650, 2885).correction;
    const r = calibrateHunter(2885, 3100).correction;
    expect(Math.abs(p.scale - r.scale)).toBeLessThanOrEqual(p.scaleUncertainty + r.scaleUncertainty);
  });

  it("HCl_spectrum.csv (Hunter): the H35Cl lines alone and the H37Cl lines alone", () => {
    const whole = calibrateHunter(2650, 3100);
    const a = speciesScale(whole, "1H35Cl");
    const b = speciesScale(whole, "1H37Cl");
    expect(Math.min(a.lines, b.lines)).toBeGreaterThanOrEqual(3);
    expect(Math.abs(a.scale - b.scale)).toBeLessThanOrEqual(a.scaleUncertainty + b.scaleUncertainty);
  });
});

describe("a shared error stays shared", () => {
  it("an invented acetylene cell at 50 Torr: the cited pressure shift's ± moves every line together and enters k whole, not averaged down", () => {
    const cell = cellOf("c2h2");
    const conditions = { ...defaultCellConditions, pressurePa: (50 * 101325) / 760 };
    const truth = trueSpectrum(cell, conditions, 0.1, "triangular", 6440, 6640);
    const m = measuredSpectrum(
      truth,
      6450,
      6630,
      0.025,
      { scale: 20e-6, offsetCm: 0, noiseAbsorbance: 0.003, tiltPerCm: 0, baselineAbsorbance: 0.01 },
      seededRandom(3),
    );
    const { result, set } = calibrateMeasuredSpectrum(cell, { ...m, resolutionCm: 0.1 }, { conditions, apodization: "triangular", model: "scale" });
    const shiftSigmaCm = set.pressureShift.uncertaintyCm;
    expect(shiftSigmaCm).toBeGreaterThan(0);
    // One common shift δ of every line moves a scale-only fit by δ/ν̄ (ν̄ ≈ 6550 cm⁻¹ here).
    const row = result.budget.rows.find((r) => r.part === "pressure-shift")!;
    const centre = result.correction.centreCm;
    expect(row.scaleSigma).toBeCloseTo(shiftSigmaCm / centre, 9);
    expect(result.correction.scaleUncertainty).toBeGreaterThanOrEqual(row.scaleSigma);
    expect(result.usedCount).toBeGreaterThan(20);
  });
});
