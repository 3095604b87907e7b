import { z } from "zod";
import { describeInput } from "./describeInput.ts";
import {
  identityShape,
  listOf,
  mapping,
  massNumbers,
  measuredIn,
  numberIn,
  referenceLineSchema,
  sourceKey,
  text,
  type DiatomicMoleculeFile,
} from "./schema.ts";

// The second form of molecule file: a linear polyatomic molecule (`structure: linear`), given as
// its vibrational states (term energy, B, D, H, symmetry) and the Σ–Σ bands between them. The
// identity, hazard and sources fields are those of the diatomic form.

const cm = "cm⁻¹";

/** A state constant as read in a source, or `fit`: fitted by `bandatlas fit` to the species' measured lines. */
function measuredOrFit(unit: string) {
  return z.union([measuredIn(unit), z.literal("fit")], {
    error: (issue) => `expected a number in ${unit}, { value, uncertainty }, or fit (fitted to the species' measured lines), got ${describeInput(issue.input)}`,
  });
}

const stateSchema = mapping(
  {
    id: text("the state's vibrational label (e.g. 00011)"),
    symmetry: text("the state's symmetry (Σ+, or Σg+ / Σu+ for a molecule with a centre of symmetry)"),
    source: sourceKey,
    termEnergy: measuredOrFit(cm),
    b: measuredOrFit(cm),
    d: measuredOrFit(cm).optional(),
    h: measuredOrFit(cm).optional(),
  },
  "a vibrational state",
);

const bandSchema = mapping(
  {
    upper: text("the upper state's id"),
    lower: text("the lower state's id"),
    name: text("the band's usual name (e.g. ν3, 2ν3, ν1+ν3)"),
    kind: z.enum(["fundamental", "overtone", "combination", "hot"], {
      error: (issue) => `expected one of fundamental, overtone, combination, hot, got ${describeInput(issue.input)}`,
    }),
    source: sourceKey,
    bandOrigin: measuredIn(cm).optional(),
    bandStrength: mapping({ cmPerMolecule: measuredIn("cm/molecule"), temperatureK: numberIn("K"), source: sourceKey }, "a band strength").optional(),
  },
  "a band",
);

const modeSchema = mapping(
  {
    name: text("the mode's name (e.g. ν2)").optional(),
    wavenumber: numberIn(cm),
    degeneracy: z.number({ error: (i) => `expected a degeneracy of 1 or 2, got ${describeInput(i.input)}` }).int({ error: "a degeneracy is a whole number" }),
  },
  "a vibrational mode",
);

const linearSpeciesSchema = mapping(
  {
    massNumbers,
    label: text("the species label (e.g. 12C16O2)").optional(),
    reference: z.boolean({ error: (i) => `expected true or false, got ${describeInput(i.input)}` }).optional(),
    // true: a reference-cell gas of its own (an isotopically enriched cell, as a standard's), so its
    // lines are not weighed against the natural gas's strongest line.
    ownCells: z.boolean({ error: (i) => `expected true or false, got ${describeInput(i.input)}` }).optional(),
    nuclearSpinWeights: mapping(
      { evenJ: numberIn("(a statistical weight)"), oddJ: numberIn("(a statistical weight)"), source: sourceKey },
      "nuclear-spin weights of the ground state's even and odd J",
    ).optional(),
    vibrationalModes: mapping(
      { source: sourceKey, modes: listOf(modeSchema, "vibrational modes").min(1, { error: "give every normal mode" }) },
      "the vibrational modes",
    ).optional(),
    fit: mapping(
      {
        lines: listOf(sourceKey, "source keys of this species' `referenceLines` groups to fit").min(1, {
          error: "name at least one group of measured lines to fit",
        }),
        result: z
          .record(
            z.string().regex(/^[^.\s]+\.[GBDH]$/, { error: "a fitted constant is named state.G, state.B, state.D or state.H (e.g. 10100.B)" }),
            measuredIn(cm),
            {
              error: (issue) => `expected the fitted values as { "10100.B": { value, uncertainty }, … }, got ${describeInput(issue.input)}`,
            },
          )
          .optional(),
      },
      "a fit block",
    ).optional(),
    states: listOf(stateSchema, "vibrational states").min(2, { error: "give at least the ground state and one upper state" }),
    bands: listOf(bandSchema, "bands").min(1, { error: "give at least one band" }),
    referenceLines: listOf(
      mapping(
        { source: sourceKey, band: text("the band as upper-lower state ids"), lines: listOf(referenceLineSchema, "reference lines").min(1) },
        "a group of reference lines",
      ),
      "groups of reference lines",
    ).optional(),
  },
  "a species",
);

export const linearMoleculeFileSchema = mapping(
  {
    structure: z.literal("linear"),
    ...identityShape,
    species: listOf(linearSpeciesSchema, "species").min(1, { error: "give at least the reference species" }),
  },
  "a linear-molecule file",
);

export type LinearMoleculeFile = z.infer<typeof linearMoleculeFileSchema>;
export type LinearSpeciesEntry = LinearMoleculeFile["species"][number];

/** A molecule file of either form; `structure` tells them apart (absent: diatomic). */
export type MoleculeFile = DiatomicMoleculeFile | LinearMoleculeFile;
