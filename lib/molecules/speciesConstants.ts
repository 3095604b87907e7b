import {
  componentsFromCovariance,
  componentsFromUncertainties,
  crossCheckComponent,
  electronMassU,
  isotopeScalingComponents,
  omittedTermComponents,
  omittedTerms,
  scaleDunhamToIsotopologue,
  speciesDunhamFromFit,
  speedOfLightMs,
  type DunhamCoefficient,
  type DunhamErrorComponent,
  type OmittedTerm,
} from "../core/index.ts";
import { dunhamFromBlock, type GivenConstant } from "./givenConstants.ts";
import type { FileFit, SpeciesMasses } from "./fileFit.ts";
import type { DiatomicMoleculeFile } from "./schema.ts";

type ConstantsBlock = NonNullable<DiatomicMoleculeFile["species"][number]["constants"]>;
type MassIndependent = NonNullable<ConstantsBlock["massIndependent"]>;

export interface SpeciesConstants {
  dunham: DunhamCoefficient[];
  positionErrors: DunhamErrorComponent[];
  origin: "cited" | "isotope-scaled" | "fitted";
  given: { form: "equilibrium" | "dunham" | "mass-independent" | "fit"; values: GivenConstant[] } | null;
}

/**
 * Y_kl of one species from a mass-independent set: Y_kl = μ^−(k/2+l) U_kl (1 + m_e Σ_atoms Δ_kl/M)
 * (J. K. G. Watson, J. Mol. Spectrosc. 80, 411 (1980); the form of the mass-independent fits of CO).
 */
export function dunhamFromMassIndependent(set: MassIndependent, atoms: readonly string[], masses: SpeciesMasses): DunhamCoefficient[] {
  // The U_kl were fitted with the source's own atomic masses; where it states them, use them.
  const atomMassesU = atoms.map((symbol, i) => set.atomMassesU?.[`${masses.massNumbers[i]}${symbol}`] ?? masses.atomMassesU[i]);
  const mu = (atomMassesU[0] * atomMassesU[1]) / (atomMassesU[0] + atomMassesU[1]);
  const me = set.electronMassU ?? electronMassU;
  // 1 cm⁻¹ = c × 100 Hz = 29 979.2458 MHz exactly (c is exact in the SI).
  const toCm = set.unit === "MHz" ? 1 / (speedOfLightMs * 1e-4) : 1;
  return Object.entries(set.coefficients).map(([name, raw]) => {
    const k = Number(name[1]);
    const l = Number(name[2]);
    const u = typeof raw === "number" ? { value: raw, uncertainty: 0 } : raw;
    let breakdown = 1;
    atoms.forEach((atom, i) => {
      const delta = set.breakdown?.[atom]?.[`D${k}${l}`];
      if (delta !== undefined) breakdown += (me * delta) / atomMassesU[i];
    });
    const factor = Math.pow(mu, -(k / 2 + l)) * breakdown * toCm;
    return { k, l, valueCm: u.value * factor, uncertaintyCm: u.uncertainty * factor };
  });
}

/**
 * Every species' Dunham table and position-error components, from whichever form the file uses:
 * a fit (covariance of the fitted parameters, the omitted terms minus what the fit absorbed), a
 * mass-independent set (every species from the same U_kl), or a handbook table (the species' own,
 * or the reference's scaled by Dunham's isotope relation, with a bound for what scaling misses).
 * A cross-check set from a second source adds their difference as one more component.
 */
export function speciesConstants(
  file: DiatomicMoleculeFile,
  entry: DiatomicMoleculeFile["species"][number],
  masses: SpeciesMasses,
  referenceBlock: ConstantsBlock,
  fileFit: FileFit | null,
): SpeciesConstants {
  const own = entry.constants ?? null;
  const block = own ?? referenceBlock;
  const crossCheck = (dunham: DunhamCoefficient[]): DunhamErrorComponent[] => {
    const other = block.crossCheck;
    if (!other) return [];
    const table = other.massIndependent
      ? dunhamFromMassIndependent(other.massIndependent, file.atoms, masses)
      : scaleDunhamToIsotopologue(dunhamFromBlock({ dunham: other.dunham }).table, masses.reducedMassU * masses.massRatio, masses.reducedMassU);
    return [crossCheckComponent(dunham, table)];
  };

  if (block.fit && fileFit) {
    const { dunham, covariance } = speciesDunhamFromFit(fileFit.fit, masses.massRatio, masses.inverseMassShifts);
    const keys = dunham.map(({ k, l }) => ({ k, l }));
    const inFit = fileFit.observations.some((o) => !o.heldOut && o.massRatio === masses.massRatio);
    const corrected = new Set(fileFit.fit.terms.filter((t) => t.atom !== undefined).map((t) => t.atom));
    const unscaledShifts = masses.inverseMassShifts.map((s, i) => (corrected.has(i) ? 0 : s));
    return {
      dunham,
      positionErrors: [
        ...componentsFromCovariance(keys, covariance),
        ...omittedTermComponents(fitOmittedTerms(fileFit), masses.massRatio),
        ...(inFit ? [] : isotopeScalingComponents(dunham, unscaledShifts)),
      ],
      origin: "fitted",
      given: own
        ? {
            form: "fit",
            values: fileFit.names.map((name, i) => ({
              name,
              valueCm: fileFit.fit.solution.parameters[i],
              uncertaintyCm: fileFit.fit.solution.uncertainties[i],
              uncertaintyImplied: false,
            })),
          }
        : null,
    };
  }
  if (block.massIndependent) {
    const dunham = dunhamFromMassIndependent(block.massIndependent, file.atoms, masses);
    return {
      dunham,
      positionErrors: [...componentsFromUncertainties(dunham), ...omittedTermComponents(omittedTerms(dunham, null)), ...crossCheck(dunham)],
      origin: "cited",
      given: own ? { form: "mass-independent", values: dunhamFromBlock(block).given } : null,
    };
  }
  const { table, given, form } = dunhamFromBlock(block);
  if (own) {
    return {
      dunham: table,
      positionErrors: [...componentsFromUncertainties(table), ...omittedTermComponents(omittedTerms(table, null)), ...crossCheck(table)],
      origin: "cited",
      given: { form, values: given },
    };
  }
  const scaled = scaleDunhamToIsotopologue(table, masses.reducedMassU * masses.massRatio, masses.reducedMassU);
  return {
    dunham: scaled,
    positionErrors: [
      ...componentsFromUncertainties(scaled),
      ...omittedTermComponents(omittedTerms(table, null), masses.massRatio),
      ...isotopeScalingComponents(scaled, masses.inverseMassShifts),
      ...crossCheck(scaled),
    ],
    origin: "isotope-scaled",
    given: null,
  };
}

const omittedCache = new WeakMap<FileFit, OmittedTerm[]>();

/** The fit's omitted terms, with what its own terms absorb over the fitted lines (reference species' units). */
function fitOmittedTerms(fileFit: FileFit): OmittedTerm[] {
  let cached = omittedCache.get(fileFit);
  if (cached) return cached;
  const fitted = fileFit.observations.filter((o) => !o.heldOut);
  const plain = fileFit.fit.terms.filter((t) => t.atom === undefined);
  const referenceTable = plain.map((t) => ({ k: t.k, l: t.l, valueCm: fileFit.fit.solution.parameters[fileFit.fit.terms.indexOf(t)], uncertaintyCm: 0 }));
  const column = ({ k, l }: { k: number; l: number }) =>
    fitted.map((o) => {
      const level = (v: number, j: number) => Math.pow(v + 0.5, k) * Math.pow(j * (j + 1), l);
      return Math.pow(o.massRatio, k / 2 + l) * (level(o.vUpper, o.jUpper) - level(o.vLower, o.jLower));
    });
  cached = omittedTerms(referenceTable, { keys: plain.map(({ k, l }) => ({ k, l })), column, sigmasCm: fitted.map((o) => o.uncertaintyCm) });
  omittedCache.set(fileFit, cached);
  return cached;
}
