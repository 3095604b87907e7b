import { sameBand, vibrationalBand } from "./band.ts";
import { CoreInputError } from "./coreInputError.ts";
import { runningIndex } from "./hoenlLondon.ts";
import { linearStateExpansion } from "./linearStateTerms.ts";
import { termFromExpansion, termValue } from "./termValues.ts";
import type { Band, BandAccuracy, BandCheck, Branch, ReferenceLine, ResidualEnvelope, SpeciesModel, SpeciesValidation } from "./types.ts";

/** Branch and J'' of a label "R(3)" / "P(1)" (R: J' = J''+1, P: J' = J''−1). */
export function parseLineLabel(label: string): { branch: Branch; jLower: number; jUpper: number } {
  const match = /^([PR])\((\d{1,3})\)$/.exec(label);
  if (!match) throw new CoreInputError(`line label "${label}" is not of the form R(J'') or P(J'')`);
  const branch = match[1] as Branch;
  const jLower = Number(match[2]);
  return { branch, jLower, jUpper: branch === "R" ? jLower + 1 : jLower - 1 };
}

/** Predicted position of a measured line (any band, pure rotation included), cm⁻¹. */
export function referenceLinePosition(species: SpeciesModel, line: ReferenceLine): number {
  const { jLower, jUpper } = parseLineLabel(line.label);
  if (jUpper < 0) throw new CoreInputError(`line ${line.label} does not exist (J' would be below 0)`);
  if (species.structure === "linear") {
    const linear = species.linear;
    const entry = linear.bands.find((b) => sameBand(b.band, line.band));
    if (!entry) throw new CoreInputError(`${species.label} has no band ${line.band.label ?? ""} for line ${line.label}`);
    const upper = linearStateExpansion(linear.states[entry.upperStateIndex]);
    const lower = linearStateExpansion(linear.states[entry.lowerStateIndex]);
    return termFromExpansion(upper, jUpper) - termFromExpansion(lower, jLower);
  }
  const band = vibrationalBand(line.band);
  return termValue(species.dunham, band.vUpper, jUpper) - termValue(species.dunham, band.vLower, jLower);
}

export interface LineResidual {
  reference: ReferenceLine;
  predicted: number;
  /** Predicted minus measured, cm⁻¹. */
  predictedMinusMeasured: number;
}

/** Predicted minus measured for every cited measured line of a species (positions do not depend on T). */
export function lineResiduals(species: SpeciesModel): LineResidual[] {
  return species.referenceLines.map((reference) => {
    const predicted = referenceLinePosition(species, reference);
    return { reference, predicted, predictedMinusMeasured: predicted - reference.wavenumber };
  });
}

function absM(line: ReferenceLine): number {
  const { branch, jLower } = parseLineLabel(line.label);
  return Math.abs(runningIndex(branch, jLower));
}

/** Running maximum of |residual| over increasing |m|. */
export function residualEnvelope(points: ReadonlyArray<{ absM: number; residualCm: number }>): ResidualEnvelope {
  const sorted = [...points].sort((a, b) => a.absM - b.absM);
  const out: ResidualEnvelope = [];
  let running = 0;
  for (const p of sorted) {
    running = Math.max(running, Math.abs(p.residualCm));
    if (out.length && out[out.length - 1].absM === p.absM) out[out.length - 1].residualCm = running;
    else out.push({ absM: p.absM, residualCm: running });
  }
  return out;
}

/** The envelope's value at |m|: the last point at or below it (the first point below the range). */
export function envelopeAt(envelope: ResidualEnvelope, absMValue: number): number {
  if (envelope.length === 0) return 0;
  let value = envelope[0].residualCm;
  for (const p of envelope) {
    if (p.absM > absMValue) break;
    value = p.residualCm;
  }
  return value;
}

/** One check per band (pure-rotation lines, v' = v'', form a band of their own) of a species' measured lines. */
export function bandChecks(species: SpeciesModel): BandCheck[] {
  const groups: Array<{ band: Band; residuals: LineResidual[] }> = [];
  for (const r of lineResiduals(species)) {
    let group = groups.find((g) => sameBand(g.band, r.reference.band));
    if (!group) groups.push((group = { band: r.reference.band, residuals: [] }));
    group.residuals.push(r);
  }
  return groups.map(({ band, residuals }) => {
    const ms = residuals.map((r) => absM(r.reference));
    const deltas = residuals.map((r) => r.predictedMinusMeasured);
    return {
      band,
      lineCount: residuals.length,
      heldOutCount: residuals.filter((r) => r.reference.heldOut).length,
      absMMin: Math.min(...ms),
      absMMax: Math.max(...ms),
      rmsResidualCm: Math.sqrt(deltas.reduce((s, d) => s + d * d, 0) / deltas.length),
      maxAbsResidualCm: Math.max(...deltas.map(Math.abs)),
      sourceKeys: [...new Set(residuals.map((r) => r.reference.sourceKey))],
      envelope: residualEnvelope(residuals.map((r, i) => ({ absM: ms[i], residualCm: r.predictedMinusMeasured }))),
    };
  });
}

/**
 * The validation of every species of one molecule: its band checks, whether the constants were
 * tested against measured lines at all, and the largest residual seen anywhere in the molecule.
 */
export function moleculeValidation(species: readonly SpeciesModel[], constantsFitted: boolean): SpeciesValidation[] {
  const checks = species.map(bandChecks);
  const all = checks.flat();
  const moleculeEnvelope = residualEnvelope(all.flatMap((c) => c.envelope));
  const constantsTested = constantsFitted || all.length > 0;
  return checks.map((c) => ({ checks: c, constantsTested, moleculeEnvelope }));
}

/**
 * A band's status: validated when measured lines of this species and band were compared with it;
 * extrapolated when the constants were tested on other bands or species only; not validated when
 * no measured line stands behind them. The floor on a line's ± is the largest residual of measured
 * lines at its |m| or below (the band's own lines, or for a band without its own the molecule's),
 * and beyond the measured range the largest of all: a printed ± never claims more than the
 * measurements show.
 */
export function bandAccuracy(species: SpeciesModel, band: Band): BandAccuracy {
  const validation = species.validation;
  if (!validation) return { status: "not-validated", check: null, floor: [] };
  const check = validation.checks.find((c) => sameBand(c.band, band)) ?? null;
  if (check) return { status: "validated", check, floor: check.envelope };
  return { status: validation.constantsTested ? "extrapolated" : "not-validated", check: null, floor: validation.moleculeEnvelope };
}
