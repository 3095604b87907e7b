import { bandLabel, checkedBandAccuracy } from "../core/index.ts";
import type { Molecule } from "../molecules/index.ts";

/** A band of the atlas that cited measured lines validate or contradict. */
export interface CheckedBandSummary {
  moleculeName: string;
  species: string;
  band: string;
  status: "validated" | "contradicted";
  absMMin: number;
  absMMax: number;
}

/**
 * Which gases, bands and J ranges cited measured lines stand behind, from the molecules
 * themselves (the home page and README say it where they promise calibration; a test holds the
 * README to this text).
 */
export function validationSummary(molecules: readonly Molecule[]): { checked: CheckedBandSummary[]; withoutValidation: string[]; text: string } {
  const checked: CheckedBandSummary[] = [];
  for (const molecule of molecules)
    for (const species of molecule.species)
      for (const check of species.model.validation?.checks ?? []) {
        const status = checkedBandAccuracy(species.model, check.band).status;
        // A band with checks of its own is validated unless they contradict it (a standard's listed lines count as validating it).
        if (status === "extrapolated" || status === "not-validated") continue;
        checked.push({
          moleculeName: molecule.name,
          species: species.model.label,
          band: bandLabel(check.band),
          status: status === "contradicted" ? "contradicted" : "validated",
          absMMin: check.absMMin,
          absMMax: check.absMMax,
        });
      }
  const lines = (c: CheckedBandSummary) => {
    const pure = c.band.split("-").length === 2 && c.band.split("-")[0] === c.band.split("-")[1];
    if (pure) return `pure-rotation lines R(${c.absMMin - 1})–R(${c.absMMax - 1})`;
    return `band ${c.band}, R(${c.absMMin - 1})–R(${c.absMMax - 1}) and P(${c.absMMin})–P(${c.absMMax})`;
  };
  const validated = checked.filter((c) => c.status === "validated");
  const contradicted = checked.filter((c) => c.status === "contradicted");
  const withoutValidation = molecules.filter((m) => !validated.some((c) => c.moleculeName === m.name)).map((m) => m.name.toLowerCase());
  const list = (items: CheckedBandSummary[]) =>
    [...new Set(items.map((c) => c.moleculeName))]
      .map(
        (name) =>
          `${name.toLowerCase()} (${items
            .filter((c) => c.moleculeName === name)
            .map((c) => `${c.species} ${lines(c)}`)
            .join("; ")})`,
      )
      .join(", ");
  const text =
    `Validated against cited measured lines: ${validated.length ? list(validated) : "none"}. ` +
    (contradicted.length ? `Contradicted by measured lines: ${list(contradicted)}. ` : "") +
    `No band of ${withoutValidation.join(", ")} is validated: their positions are predictions with a ± from the constants alone, and no line of them is called calibration grade.`;
  return { checked, withoutValidation, text };
}
