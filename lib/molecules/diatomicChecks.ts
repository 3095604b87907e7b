import { CoreInputError, parseBand } from "../core/index.ts";
import { sourceChecker, type Found } from "./identityChecks.ts";
import { isKnownElement, isotope, stableMassNumbers } from "./isotopes.ts";
import type { DiatomicMoleculeFile } from "./schema.ts";

type Path = ReadonlyArray<string | number>;

export const modelledStates = /^(?:X\s*)?(?:1|¹)\s*(?:Σ|Sigma)\s*(?:\+|⁺)$/i;

function cmPerNumber(value: unknown): number | null {
  if (typeof value === "number") return value;
  if (value && typeof value === "object" && "value" in value) return (value as { value: number }).value;
  return null;
}

/** Checks of a diatomic file no schema can express: references between fields, physics sanity. */
export function diatomicProblems(file: DiatomicMoleculeFile): Found[] {
  const out: Found[] = [];
  const add = (path: Path, message: string) => out.push({ path, message });
  const checkSource = sourceChecker(file, add);

  if (!modelledStates.test(file.electronicState.trim())) {
    add(
      ["electronicState"],
      `electronic state "${file.electronicState}" is not modelled: only ¹Σ⁺ states (written "X 1Σ+") are; other states need spin and Λ-doubling terms and a Q branch that the model does not have yet`,
    );
  }
  if (file.atoms.length !== 2) add(["atoms"], `expected 2 atoms for a diatomic molecule, got ${file.atoms.length}`);
  const speciesKeys = new Set<string>();
  const checkMassNumbers = (path: Path, numbers: number[]) => {
    if (numbers.length !== file.atoms.length) {
      add(path, `expected ${file.atoms.length} mass numbers (one per atom: ${file.atoms.join(", ")}), got ${numbers.length}`);
      return false;
    }
    let ok = true;
    numbers.forEach((a, i) => {
      const symbol = file.atoms[i];
      if (!isKnownElement(symbol)) return;
      const found = isotope(symbol, a);
      if (!found) {
        add(
          [...path, i],
          `${a}${symbol} is not a known isotope (stable ones: ${stableMassNumbers(symbol)
            .map((n) => `${n}${symbol}`)
            .join(", ")})`,
        );
        ok = false;
      } else if (found.abundance === null) {
        add([...path, i], `${a}${symbol} has no natural abundance in the isotope library (it is not a stable isotope); only stable isotopes are modelled`);
        ok = false;
      }
    });
    return ok;
  };
  const references = file.species.filter((s) => s.reference === true).length;
  if (references !== 1) add(["species"], `exactly one species must have \`reference: true\`, found ${references}`);
  file.species.forEach((s, i) => {
    const path = ["species", i];
    if (checkMassNumbers([...path, "massNumbers"], s.massNumbers)) {
      const key = s.massNumbers.join(",");
      if (speciesKeys.has(key)) add([...path, "massNumbers"], `species ${s.massNumbers.join("/")} is listed twice`);
      speciesKeys.add(key);
    }
    if (s.reference === true && !s.constants) add([...path], "the reference species needs a `constants` block (the others can be scaled from it)");
    if (!s.constants) return;
    const c = s.constants;
    checkSource([...path, "constants", "source"], c.source);
    const forms = [c.equilibrium, c.dunham, c.massIndependent, c.fit].filter((f) => f !== undefined).length;
    if (forms !== 1) {
      add(
        [...path, "constants"],
        "give exactly one of `equilibrium` (ωe, ωexe, Be, …), `dunham` (Y10, Y01, …), `massIndependent` (U10, U01, …) or `fit` (constants fitted to the file's measured lines)",
      );
      return;
    }
    if (c.crossCheck) {
      checkSource([...path, "constants", "crossCheck", "source"], c.crossCheck.source);
      const crossForms = [c.crossCheck.dunham, c.crossCheck.massIndependent].filter((f) => f !== undefined).length;
      if (crossForms !== 1) add([...path, "constants", "crossCheck"], "a cross-check set gives exactly one of `dunham` or `massIndependent`");
    }
    if (c.massIndependent) {
      for (const atom of Object.keys(c.massIndependent.breakdown ?? {})) {
        if (!file.atoms.includes(atom))
          add([...path, "constants", "massIndependent", "breakdown", atom], `atom ${atom} is not among this molecule's atoms (${file.atoms.join(", ")})`);
      }
    }
    if (c.fit) {
      if (s.reference !== true)
        add(
          [...path, "constants", "fit"],
          "only the reference species carries a fit; the fit takes the measured lines of every species and the others follow from it by the isotope relations",
        );
      const groups = new Set((file.referenceLines ?? []).map((g) => g.source));
      (file.referenceLines ?? []).forEach((group, g) => {
        if (!c.fit!.lines.includes(group.source)) return;
        group.lines.forEach((line, j) => {
          if (line.uncertainty === undefined || line.uncertainty === 0)
            add(["referenceLines", g, "lines", j, "uncertainty"], "a line that enters the fit needs its measured uncertainty (above 0 cm⁻¹) to be weighted");
        });
      });
      c.fit.lines.forEach((key, j) => {
        if (!groups.has(key))
          add([...path, "constants", "fit", "lines", j], `no \`referenceLines\` group has source "${key}" (groups: ${[...groups].join(", ") || "none"})`);
      });
      c.fit.terms.forEach((name, j) => {
        if (c.fit!.terms.indexOf(name) !== j) add([...path, "constants", "fit", "terms", j], `${name} is listed twice`);
        if (name === "Y00") add([...path, "constants", "fit", "terms", j], "Y00 shifts every level alike and cannot be fitted to line positions");
      });
      for (const [atom, names] of Object.entries(c.fit.massCorrections ?? {})) {
        if (!file.atoms.includes(atom))
          add([...path, "constants", "fit", "massCorrections", atom], `atom ${atom} is not among this molecule's atoms (${file.atoms.join(", ")})`);
        names.forEach((name, j) => {
          if (!c.fit!.terms.includes(name))
            add([...path, "constants", "fit", "massCorrections", atom, j], `${name} has a mass correction but is not among the fitted terms`);
        });
      }
      return;
    }
    if (c.equilibrium) {
      const e = c.equilibrium;
      const we = cmPerNumber(e.omegaE)!;
      const be = cmPerNumber(e.bE)!;
      if (!(we > 0)) add([...path, "constants", "equilibrium", "omegaE"], `ωe must be above 0 cm⁻¹, got ${we}`);
      if (!(be > 0)) add([...path, "constants", "equilibrium", "bE"], `Be (rotational constant) must be above 0 cm⁻¹, got ${be}`);
      const wexe = e.omegaExe === undefined ? null : cmPerNumber(e.omegaExe)!;
      // ωexe/ωe is below 0.03 for every known diatomic (H2 ≈ 0.028); a much larger ratio is a typo or a unit slip.
      if (wexe !== null && we > 0 && (wexe < 0 || wexe > 0.1 * we)) {
        add(
          [...path, "constants", "equilibrium", "omegaExe"],
          `ωexe = ${wexe} cm⁻¹ does not make sense for ωe = ${we} cm⁻¹ (expected 0 ≤ ωexe ≤ 0.1·ωe; real molecules have under 0.03·ωe)`,
        );
      }
      const de = e.dE === undefined ? null : cmPerNumber(e.dE)!;
      if (de !== null && be > 0 && (de < 0 || de > 1e-2 * be))
        add([...path, "constants", "equilibrium", "dE"], `De = ${de} cm⁻¹ does not make sense for Be = ${be} cm⁻¹ (expected 0 ≤ De ≤ 0.01·Be)`);
    } else if (c.dunham) {
      const d = c.dunham;
      const y10 = d.Y10 === undefined ? null : cmPerNumber(d.Y10);
      const y01 = d.Y01 === undefined ? null : cmPerNumber(d.Y01);
      if (y10 === null || !(y10 > 0)) add([...path, "constants", "dunham", "Y10"], `Y10 (≈ ωe) is required and must be above 0 cm⁻¹`);
      if (y01 === null || !(y01 > 0)) add([...path, "constants", "dunham", "Y01"], `Y01 (≈ Be, the rotational constant) is required and must be above 0 cm⁻¹`);
      const y20 = d.Y20 === undefined ? null : cmPerNumber(d.Y20);
      if (y10 !== null && y10 > 0 && y20 !== null && (y20 > 0 || -y20 > 0.1 * y10)) {
        add([...path, "constants", "dunham", "Y20"], `Y20 = ${y20} cm⁻¹ (−ωexe) does not make sense for Y10 = ${y10} cm⁻¹ (expected −0.1·Y10 ≤ Y20 ≤ 0)`);
      }
    }
  });
  const checkBand = (path: Path, text: string) => {
    try {
      parseBand(text);
    } catch (error) {
      if (error instanceof CoreInputError) add(path, error.message);
      else throw error;
    }
  };
  const checkSpeciesRef = (path: Path, numbers: number[]) => {
    if (!speciesKeys.has(numbers.join(","))) add(path, `species ${numbers.join("/")} is not among the \`species\` of this file`);
  };
  (file.intensity ?? []).forEach((entry, i) => {
    const path = ["intensity", i];
    checkSource([...path, "source"], entry.source);
    checkSpeciesRef([...path, "massNumbers"], entry.massNumbers);
    checkBand([...path, "band"], entry.band);
    if ((entry.transitionDipoleDebye === undefined) === (entry.bandStrength === undefined)) {
      add(path, "give either `transitionDipoleDebye` or `bandStrength`, exactly one of them");
    }
    if (entry.transitionDipoleDebye !== undefined && !(cmPerNumber(entry.transitionDipoleDebye)! > 0))
      add([...path, "transitionDipoleDebye"], "a transition dipole must be above 0 debye");
    if (entry.bandStrength) {
      if (!(cmPerNumber(entry.bandStrength.cmPerMolecule)! > 0)) add([...path, "bandStrength", "cmPerMolecule"], "a band strength must be above 0 cm/molecule");
      if (!(entry.bandStrength.temperatureK > 0)) add([...path, "bandStrength", "temperatureK"], "the band strength's temperature must be above 0 K");
    }
  });
  (file.referenceLines ?? []).forEach((group, i) => {
    const path = ["referenceLines", i];
    checkSource([...path, "source"], group.source);
    checkSpeciesRef([...path, "massNumbers"], group.massNumbers);
    const [vUpper, vLower] = group.band.split("-").map(Number);
    // Measured lines may be pure rotation (v' = v'', e.g. "0-0"), which fix the rotational constants.
    if (vUpper < vLower) add([...path, "band"], `band "${group.band}": the upper level v' must not be below the lower level v''`);
    group.lines.forEach((line, j) => {
      if (!(line.wavenumber > 0)) add([...path, "lines", j, "wavenumber"], "a line position must be above 0 cm⁻¹");
      if (vUpper === vLower && line.label.startsWith("P")) add([...path, "lines", j, "label"], "a pure-rotation line is written R(J'') for J''+1 ← J''");
    });
  });
  return out;
}
