import {
  componentsFromCovariance,
  fitLinearStates,
  stateCoefficientPartial,
  weightedLeastSquares,
  type LinearFitObservation,
  type LinearSpeciesData,
  type LinearStateFitResult,
  type StateCoefficientKey,
} from "../core/index.ts";
import type { LinearMoleculeFile } from "./linearSchema.ts";
import { observationOf } from "./moleculeIdentity.ts";
import { speciesLabel } from "./speciesNames.ts";

type Path = Array<string | number>;
const fields = [
  ["termEnergy", "G", 0],
  ["b", "B", 1],
  ["d", "D", 2],
  ["h", "H", 3],
] as const;

export interface LinearFileFit {
  speciesIndex: number;
  fit: LinearStateFitResult;
  observations: LinearFitObservation[];
  /** The file's name of each fitted constant ("10100.B"), in the fit's parameter order. */
  names: string[];
  /** Each fitted constant as the file writes it (D = −c2) and its standard uncertainty. */
  values: number[];
  uncertainties: number[];
}

function numeric(m: unknown): number {
  return typeof m === "number" ? m : m && typeof m === "object" && "value" in m ? (m as { value: number }).value : 0;
}

/** Runs the fit one species of a linear-molecule file asks for; null when it marks no constant `fit`. */
export function runLinearFit(file: LinearMoleculeFile, speciesIndex: number): LinearFileFit | null {
  const entry = file.species[speciesIndex];
  if (!entry.fit) return null;
  const parameters: StateCoefficientKey[] = [];
  const names: string[] = [];
  entry.states.forEach((state, stateIndex) => {
    for (const [field, letter, l] of fields) {
      if (state[field] === "fit") {
        parameters.push({ stateIndex, l });
        names.push(`${state.id}.${letter}`);
      }
    }
  });
  const known = ({ stateIndex, l }: StateCoefficientKey) => {
    const [field] = fields[l];
    const value = numeric(entry.states[stateIndex][field]);
    return l === 2 ? -value : value;
  };
  const index = new Map(entry.states.map((s, i) => [s.id, i]));
  const observations: LinearFitObservation[] = [];
  for (const group of entry.referenceLines ?? []) {
    if (!entry.fit.lines.includes(group.source)) continue;
    const [upper, lower] = group.band.split("-");
    const species = entry.label ?? speciesLabel(file.atoms, entry.massNumbers);
    for (const line of group.lines) {
      observations.push({ ...observationOf(line, species, group.band, group.source), upperStateIndex: index.get(upper)!, lowerStateIndex: index.get(lower)! });
    }
  }
  const fit = fitLinearStates(observations, parameters, known, entry.states.length);
  const sign = (l: number) => (l === 2 ? -1 : 1);
  return {
    speciesIndex,
    fit,
    observations,
    names,
    values: parameters.map((p, i) => sign(p.l) * fit.solution.parameters[i]),
    uncertainties: fit.solution.uncertainties,
  };
}

/** Checks a linear fit block can run: named groups exist and every fitted line has an uncertainty. */
export function linearFitProblems(file: LinearMoleculeFile): Array<{ path: Path; message: string }> {
  const out: Array<{ path: Path; message: string }> = [];
  file.species.forEach((entry, i) => {
    const marked = entry.states.some((s) => fields.some(([field]) => s[field] === "fit"));
    if (!entry.fit) {
      if (marked)
        out.push({ path: ["species", i, "states"], message: "a constant is marked `fit` but the species has no `fit` block naming the measured lines to fit" });
      return;
    }
    if (!marked) out.push({ path: ["species", i, "fit"], message: "the species has a `fit` block but no state constant is marked `fit`" });
    entry.states.forEach((s, k) => {
      if (s.termEnergy === "fit" && entry.states.every((o) => o === s || o.termEnergy !== 0))
        out.push({ path: ["species", i, "states", k, "termEnergy"], message: "the ground state's term energy is 0 by definition; give termEnergy: 0 for it" });
    });
    const groups = new Set((entry.referenceLines ?? []).map((g) => g.source));
    entry.fit.lines.forEach((key, j) => {
      if (!groups.has(key))
        out.push({
          path: ["species", i, "fit", "lines", j],
          message: `no \`referenceLines\` group of this species has source "${key}" (groups: ${[...groups].join(", ") || "none"})`,
        });
    });
    (entry.referenceLines ?? []).forEach((group, g) => {
      if (!entry.fit!.lines.includes(group.source)) return;
      group.lines.forEach((line, j) => {
        if (!(line.uncertainty! > 0))
          out.push({
            path: ["species", i, "referenceLines", g, "lines", j, "uncertainty"],
            message: "a line that enters the fit needs its measured uncertainty (above 0 cm⁻¹) to be weighted",
          });
      });
    });
  });
  return out;
}

/** The file's data with every `fit` constant replaced by its fitted value and uncertainty. */
export function withFittedConstants(file: LinearMoleculeFile, fits: readonly LinearFileFit[]): LinearMoleculeFile {
  const species = file.species.map((entry, i) => {
    const fit = fits.find((f) => f.speciesIndex === i);
    if (!fit) return entry;
    const states = entry.states.map((state) => {
      const copy = { ...state };
      for (const [field, letter] of fields) {
        const k = fit.names.indexOf(`${state.id}.${letter}`);
        if (k >= 0) copy[field] = { value: fit.values[k], uncertainty: fit.uncertainties[k] };
      }
      return copy;
    });
    return { ...entry, states };
  });
  return { ...file, species };
}

/** Where a species' written result and a fresh fit disagree (value within 1 % of σ, σ within 1 %). */
export function linearFitResultProblems(file: LinearMoleculeFile, fit: LinearFileFit): Array<{ path: Path; message: string }> {
  const base: Path = ["species", fit.speciesIndex, "fit"];
  const written = file.species[fit.speciesIndex].fit!.result;
  const rerun = `run \`bandatlas fit ${file.id} --write\` to write the fit's result`;
  if (!written) return [{ path: base, message: `the fit has no \`result\`; ${rerun}` }];
  const out: Array<{ path: Path; message: string }> = [];
  fit.names.forEach((name, i) => {
    const given = written[name];
    const value = given === undefined ? null : typeof given === "number" ? given : given.value;
    const sigma = given === undefined || typeof given === "number" ? null : given.uncertainty;
    const u = fit.uncertainties[i];
    if (value === null || sigma === null || Math.abs(value - fit.values[i]) > 0.01 * u || Math.abs(sigma - u) > 0.01 * u) {
      out.push({
        path: [...base, "result", ...(given === undefined ? [] : [name])],
        message: `${name}: the file says ${value ?? "nothing"}${sigma === null ? "" : ` ± ${sigma}`} but the fit to the cited lines gives ${fit.values[i]} ± ${u.toPrecision(3)}; ${rerun}`,
      });
    }
  });
  for (const name of Object.keys(written))
    if (!fit.names.includes(name)) out.push({ path: [...base, "result", name], message: `${name} is not a fitted constant; ${rerun}` });
  return out;
}

/**
 * Position-error components of a fitted species: the fit's covariance, and for each state in the
 * fit the first power of J(J+1) it leaves out (size c_L²/|c_(L−1)|, the ratio rule of
 * positionErrors.ts) minus the part the fitted constants absorb over the fitted lines.
 */
export function linearFitErrors(fit: LinearFileFit, linear: LinearSpeciesData): NonNullable<LinearSpeciesData["positionErrors"]> {
  const keys = fit.fit.parameters;
  const components = componentsFromCovariance(
    keys.map((k) => ({ k: k.stateIndex, l: k.l })),
    fit.fit.solution.covariance,
  ).map((c) => ({ deltas: c.deltas.map((d) => ({ stateIndex: d.k, l: d.l, valueCm: d.valueCm })) }));
  const fitted = fit.observations.filter((o) => !o.heldOut);
  const sigmas = fitted.map((o) => o.uncertaintyCm);
  const states = new Set(keys.map((k) => k.stateIndex));
  for (const stateIndex of states) {
    const s = linear.states[stateIndex];
    const c = [s.termEnergy.valueCm, s.b.valueCm, -s.d.valueCm, s.h.valueCm];
    let top = 3;
    while (top > 1 && c[top] === 0) top--;
    if (c[top - 1] === 0) continue;
    const omitted = { stateIndex, l: top + 1 };
    const size = (c[top] * c[top]) / Math.abs(c[top - 1]);
    const target = fitted.map((o) => stateCoefficientPartial(omitted, o));
    const design = fitted.map((o) => keys.map((k) => stateCoefficientPartial(k, o)));
    const beta = weightedLeastSquares(design, target, sigmas).parameters;
    components.push({ deltas: [{ ...omitted, valueCm: size }, ...keys.map((k, j) => ({ stateIndex: k.stateIndex, l: k.l, valueCm: -beta[j] * size }))] });
  }
  return components;
}
