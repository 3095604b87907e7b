import { equilibriumToDunham, type DunhamCoefficient, type EquilibriumConstants, type EquilibriumUncertainties } from "../core/index.ts";
import type { Measured, DiatomicMoleculeFile } from "./schema.ts";

/** A constant as the file gave it, for the pages that show "the constants used". */
export interface GivenConstant {
  name: string;
  valueCm: number;
  /** The cited uncertainty, or half a unit of the last quoted digit where the source gives none. */
  uncertaintyCm: number;
  uncertaintyImplied: boolean;
}

/**
 * Half a unit in the last digit of a number as written (2169.81358 → 5e-6): the uncertainty a
 * quoted value carries at least when its source states none. Trailing zeros lost by the YAML
 * parser only make this larger, never smaller.
 */
export function impliedUncertainty(value: number): number {
  const [mantissa, exponent] = Math.abs(value).toExponential().split("e");
  const decimals = (mantissa.split(".")[1] ?? "").length - Number(exponent);
  return 0.5 * Math.pow(10, -decimals);
}

export function split(m: Measured): { value: number; uncertainty: number | null } {
  return typeof m === "number" ? { value: m, uncertainty: null } : { value: m.value, uncertainty: m.uncertainty };
}

function constantOf(name: string, raw: Measured): GivenConstant {
  const { value, uncertainty } = split(raw);
  return { name, valueCm: value, uncertaintyCm: uncertainty ?? impliedUncertainty(value), uncertaintyImplied: uncertainty === null };
}

type ConstantsBlock = NonNullable<DiatomicMoleculeFile["species"][number]["constants"]>;

export function dunhamFromBlock(block: Pick<ConstantsBlock, "equilibrium" | "dunham" | "massIndependent">): {
  table: DunhamCoefficient[];
  given: GivenConstant[];
  form: "equilibrium" | "dunham";
} {
  if (block.equilibrium) {
    const values: Record<string, number> = {};
    const uncertainties: EquilibriumUncertainties = {};
    const given: GivenConstant[] = [];
    for (const [name, raw] of Object.entries(block.equilibrium)) {
      if (raw === undefined) continue;
      const constant = constantOf(name, raw);
      values[name] = constant.valueCm;
      uncertainties[name as keyof EquilibriumConstants] = constant.uncertaintyCm;
      given.push(constant);
    }
    return { table: equilibriumToDunham(values as unknown as EquilibriumConstants, uncertainties), given, form: "equilibrium" };
  }
  const given: GivenConstant[] = [];
  const table: DunhamCoefficient[] = [];
  // A mass-independent set's U_kl are shown as given; its per-species table is made elsewhere.
  if (block.massIndependent)
    return { table, given: Object.entries(block.massIndependent.coefficients).map(([name, raw]) => constantOf(name, raw)), form: "dunham" };
  for (const [name, raw] of Object.entries(block.dunham ?? {})) {
    const constant = constantOf(name, raw);
    given.push(constant);
    table.push({ k: Number(name[1]), l: Number(name[2]), valueCm: constant.valueCm, uncertaintyCm: constant.uncertaintyCm });
  }
  return { table, given, form: "dunham" };
}
