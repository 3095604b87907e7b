import type { LinearStateSymmetry } from "../core/index.ts";
import { sourceChecker, type Found } from "./identityChecks.ts";
import { impliedUncertainty } from "./givenConstants.ts";
import { isotope, stableMassNumbers } from "./isotopes.ts";
import type { LinearMoleculeFile } from "./linearSchema.ts";
import type { Measured } from "./schema.ts";

type Path = ReadonlyArray<string | number>;

// Accepted spellings of the modelled symmetries; Π, Δ … are recognised so they can be refused clearly.
const symmetryPatterns: Array<[RegExp, LinearStateSymmetry]> = [
  [/^(?:Σ|Sigma)\s*(?:\+|⁺)$/i, "Σ+"],
  [/^(?:Σ|Sigma)\s*_?g\s*(?:\+|⁺)$/i, "Σg+"],
  [/^(?:Σ|Sigma)\s*_?u\s*(?:\+|⁺)$/i, "Σu+"],
];
const unmodelledSymmetry = /^(?:Π|Pi|Δ|Delta|Φ|Phi|Σ\s*(?:-|⁻)|Sigma\s*-)/i;

export function parseSymmetry(text: string): LinearStateSymmetry | null {
  for (const [pattern, symmetry] of symmetryPatterns) if (pattern.test(text.trim())) return symmetry;
  return null;
}

const linearElectronicState = /^(?:X\s*)?(?:1|¹)\s*(?:Σ|Sigma)\s*_?[gu]?\s*(?:\+|⁺)$/i;

// A state constant written `fit` is replaced by its fitted value before these run (linearFit.ts).
export type StateConstant = Measured | "fit" | undefined;

export function valueOf(m: StateConstant): number {
  return m === undefined ? 0 : m === "fit" ? Number.NaN : typeof m === "number" ? m : m.value;
}

export function withUncertainty(m: StateConstant) {
  if (m === undefined) return { valueCm: 0, uncertaintyCm: 0, implied: false };
  if (m === "fit") return { valueCm: Number.NaN, uncertaintyCm: Number.NaN, implied: false };
  // 0 is exact (the ground state's term energy is the zero of energy by definition).
  if (typeof m === "number") return { valueCm: m, uncertaintyCm: m === 0 ? 0 : impliedUncertainty(m), implied: m !== 0 };
  return { valueCm: m.value, uncertaintyCm: m.uncertainty, implied: false };
}

/** Checks of a linear-molecule file that no schema can express (the identity fields are checked by the caller). */
export function linearSemanticProblems(file: LinearMoleculeFile): Found[] {
  const out: Found[] = [];
  const add = (path: Path, message: string) => out.push({ path, message });
  const checkSource = sourceChecker(file, add);
  if (!linearElectronicState.test(file.electronicState.trim())) {
    add(["electronicState"], `electronic state "${file.electronicState}" is not modelled: only ¹Σ⁺ ground states (written "X 1Σ+" or "X 1Σg+") are`);
  }
  if (file.atoms.length < 3)
    add(
      ["atoms"],
      `a linear polyatomic molecule has at least 3 atoms, got ${file.atoms.length}; a diatomic uses the first form of molecule file (no \`structure\` field)`,
    );
  const references = file.species.filter((s) => s.reference === true).length;
  if (references !== 1) add(["species"], `exactly one species must have \`reference: true\`, found ${references}`);
  const seenSpecies = new Set<string>();

  file.species.forEach((s, i) => {
    const path = ["species", i];
    if (s.massNumbers.length !== file.atoms.length)
      add([...path, "massNumbers"], `expected ${file.atoms.length} mass numbers (one per atom: ${file.atoms.join(", ")}), got ${s.massNumbers.length}`);
    else
      s.massNumbers.forEach((a, k) => {
        const found = isotope(file.atoms[k], a);
        if (!found || found.abundance === null)
          add(
            [...path, "massNumbers", k],
            `${a}${file.atoms[k]} is not a stable isotope (stable ones: ${stableMassNumbers(file.atoms[k])
              .map((n) => `${n}${file.atoms[k]}`)
              .join(", ")})`,
          );
      });
    const key = s.massNumbers.join(",");
    if (seenSpecies.has(key)) add([...path, "massNumbers"], `species ${s.massNumbers.join("/")} is listed twice`);
    seenSpecies.add(key);

    // Normal modes: a linear molecule of N atoms has 3N − 5 vibrational degrees of freedom. Without
    // them Q_vib is taken as 1 (populations per molecule in the ground vibrational state).
    const modes = s.vibrationalModes?.modes ?? [];
    if (s.vibrationalModes) checkSource([...path, "vibrationalModes", "source"], s.vibrationalModes.source);
    const dof = modes.reduce((sum, m) => sum + m.degeneracy, 0);
    if (s.vibrationalModes && dof !== 3 * file.atoms.length - 5)
      add(
        [...path, "vibrationalModes", "modes"],
        `the modes' degeneracies add up to ${dof}, but a linear molecule of ${file.atoms.length} atoms has 3N−5 = ${3 * file.atoms.length - 5} vibrational degrees of freedom (bending modes count twice)`,
      );
    modes.forEach((m, k) => {
      if (!(m.wavenumber > 0)) add([...path, "vibrationalModes", "modes", k, "wavenumber"], "a mode's wavenumber must be above 0 cm⁻¹");
      if (m.degeneracy !== 1 && m.degeneracy !== 2)
        add([...path, "vibrationalModes", "modes", k, "degeneracy"], "a linear molecule's modes are single (stretches, 1) or doubly degenerate (bends, 2)");
    });

    const weights = s.nuclearSpinWeights;
    if (weights) {
      checkSource([...path, "nuclearSpinWeights", "source"], weights.source);
      if (!(weights.evenJ >= 0 && weights.oddJ >= 0) || weights.evenJ + weights.oddJ === 0)
        add([...path, "nuclearSpinWeights"], "nuclear-spin weights are at least 0 and not both 0");
    }

    const ids = new Map<string, number>();
    let grounds = 0;
    s.states.forEach((state, k) => {
      const sp = [...path, "states", k];
      checkSource([...sp, "source"], state.source);
      if (ids.has(state.id)) add([...sp, "id"], `state "${state.id}" is listed twice`);
      ids.set(state.id, k);
      const symmetry = parseSymmetry(state.symmetry);
      if (symmetry === null) {
        add(
          [...sp, "symmetry"],
          unmodelledSymmetry.test(state.symmetry.trim())
            ? `state symmetry "${state.symmetry}" is not modelled: only Σ+ states and the parallel Σ–Σ bands between them are; Π states (perpendicular bands, with a Q branch and l-type doubling) are not yet`
            : `state symmetry "${state.symmetry}" is not one of Σ+, Σg+, Σu+`,
        );
      } else if (weights && symmetry === "Σ+")
        add([...sp, "symmetry"], "this species has nuclear-spin weights (a centre of symmetry), so its states are Σg+ or Σu+");
      else if (!weights && symmetry !== "Σ+")
        add(
          [...sp, "symmetry"],
          `a ${symmetry} state needs \`nuclearSpinWeights\` on the species (a molecule with a centre of symmetry); without one write Σ+`,
        );
      const g = valueOf(state.termEnergy);
      const b = valueOf(state.b);
      const d = valueOf(state.d);
      if (g === 0) grounds++;
      if (g < 0) add([...sp, "termEnergy"], "term energies are measured from the ground state and cannot be negative");
      if (!(b > 0)) add([...sp, "b"], `B (rotational constant) must be above 0 cm⁻¹, got ${b}`);
      if (b > 0 && (d < 0 || d > 1e-2 * b)) add([...sp, "d"], `D = ${d} cm⁻¹ does not make sense for B = ${b} cm⁻¹ (expected 0 ≤ D ≤ 0.01·B)`);
    });
    if (grounds !== 1) add([...path, "states"], `exactly one state must be the ground state (termEnergy: 0), found ${grounds}`);

    const bandIds = new Set<string>();
    s.bands.forEach((band, k) => {
      const bp = [...path, "bands", k];
      checkSource([...bp, "source"], band.source);
      const u = ids.get(band.upper);
      const l = ids.get(band.lower);
      if (u === undefined) add([...bp, "upper"], `state "${band.upper}" is not among this species' states (${[...ids.keys()].join(", ")})`);
      if (l === undefined) add([...bp, "lower"], `state "${band.lower}" is not among this species' states (${[...ids.keys()].join(", ")})`);
      if (u === undefined || l === undefined) return;
      const id = `${band.upper}-${band.lower}`;
      if (bandIds.has(id)) add(bp, `band ${id} is listed twice`);
      bandIds.add(id);
      const upper = s.states[u];
      const lower = s.states[l];
      const gap = valueOf(upper.termEnergy) - valueOf(lower.termEnergy);
      if (!(gap > 0)) add(bp, `the upper state ${band.upper} must lie above the lower state ${band.lower} (absorption from lower to upper)`);
      const su = parseSymmetry(upper.symmetry);
      const sl = parseSymmetry(lower.symmetry);
      if (su && sl && su !== "Σ+" && su === sl)
        add(
          bp,
          `${su} ← ${sl} is forbidden for an electric-dipole transition (g ↔ u only); a parallel band of a centrosymmetric molecule joins a Σg+ and a Σu+ state`,
        );
      if (band.bandOrigin !== undefined) {
        const origin = withUncertainty(band.bandOrigin);
        const tu = withUncertainty(upper.termEnergy);
        const tl = withUncertainty(lower.termEnergy);
        const allowed = Math.max(1e-4, 3 * Math.hypot(origin.uncertaintyCm, tu.uncertaintyCm, tl.uncertaintyCm));
        if (Math.abs(gap - origin.valueCm) > allowed)
          add(
            [...bp, "bandOrigin"],
            `band origin ${origin.valueCm} cm⁻¹ disagrees with the states' term energies (${gap.toFixed(6)} cm⁻¹) by more than ${allowed.toPrecision(2)} cm⁻¹`,
          );
      }
      if (band.bandStrength) {
        checkSource([...bp, "bandStrength", "source"], band.bandStrength.source);
        if (!(valueOf(band.bandStrength.cmPerMolecule) > 0)) add([...bp, "bandStrength", "cmPerMolecule"], "a band strength must be above 0 cm/molecule");
        if (!(band.bandStrength.temperatureK > 0)) add([...bp, "bandStrength", "temperatureK"], "the band strength's temperature must be above 0 K");
      }
    });
    (s.referenceLines ?? []).forEach((group, k) => {
      const gp = [...path, "referenceLines", k];
      checkSource([...gp, "source"], group.source);
      if (!bandIds.has(group.band)) add([...gp, "band"], `band "${group.band}" is not among this species' bands (${[...bandIds].join(", ") || "none"})`);
      group.lines.forEach((line, j) => {
        if (!(line.wavenumber > 0)) add([...gp, "lines", j, "wavenumber"], "a line position must be above 0 cm⁻¹");
      });
    });
  });
  return out;
}
