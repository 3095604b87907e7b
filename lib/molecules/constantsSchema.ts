import { z } from "zod";
import { describeInput } from "./describeInput.ts";
import { listOf, mapping, measuredIn, numberIn, sourceKey } from "./schemaParts.ts";

export const cm = "cm⁻¹";
export const equilibriumSchema = mapping(
  {
    omegaE: measuredIn(cm),
    omegaExe: measuredIn(cm).optional(),
    omegaEye: measuredIn(cm).optional(),
    omegaEze: measuredIn(cm).optional(),
    bE: measuredIn(cm),
    alphaE: measuredIn(cm).optional(),
    gammaE: measuredIn(cm).optional(),
    dE: measuredIn(cm).optional(),
    betaE: measuredIn(cm).optional(),
    hE: measuredIn(cm).optional(),
  },
  "the equilibrium constants",
);

const dunhamKey = z.string().regex(/^Y\d\d$/, { error: "Dunham coefficients are named Y followed by k and l, e.g. Y10, Y01, Y02" });
export const dunhamSchema = z.record(dunhamKey, measuredIn(cm), {
  error: (issue) => `expected Dunham coefficients (Y10: …, Y01: …), got ${describeInput(issue.input)}`,
});

const termName = z
  .string({ error: (i) => `expected a Dunham term name like Y10, got ${describeInput(i.input)}` })
  .regex(/^Y\d\d$/, { error: "a Dunham term is named Y followed by k and l, e.g. Y10, Y01, Y21" });
const fitResultKey = z.string().regex(/^Y\d\d(?:_[A-Z][a-z]?)?$/, { error: "a fitted parameter is named like Y10, or Y01_H for a mass correction of atom H" });

/** Constants fitted by `bandatlas fit` to the cited measured lines of this file (see DEVELOPERS.md). */
export const fitSchema = mapping(
  {
    lines: listOf(sourceKey, "source keys of the `referenceLines` groups to fit").min(1, { error: "name at least one group of measured lines to fit" }),
    terms: listOf(termName, "Dunham terms to fit").min(1, { error: "name at least one Dunham term to fit" }),
    massCorrections: z
      .record(
        z.string().regex(/^[A-Z][a-z]?$/, { error: "an atom is named by its element symbol" }),
        listOf(termName, "Dunham terms with a mass correction for this atom"),
        {
          error: (issue) => `expected mass corrections as { H: [Y10, Y01] }, got ${describeInput(issue.input)}`,
        },
      )
      .optional(),
    result: z
      .record(fitResultKey, measuredIn(cm), {
        error: (issue) => `expected the fitted values as { Y10: { value, uncertainty }, … }, got ${describeInput(issue.input)}`,
      })
      .optional(),
  },
  "a fit block",
);

const breakdownSchema = z.record(
  z.string().regex(/^[A-Z][a-z]?$/, { error: "an atom is named by its element symbol" }),
  z.record(
    z.string().regex(/^D\d\d$/, { error: "a Born–Oppenheimer breakdown coefficient is named D followed by k and l, e.g. D10, D01" }),
    numberIn("(dimensionless)"),
  ),
  { error: (issue) => `expected breakdown coefficients as { C: { D10: …, D01: … } }, got ${describeInput(issue.input)}` },
);

/** A mass-independent Dunham set: U_kl in cm⁻¹ u^(k/2+l), with optional breakdown terms Δ_kl per atom. */
export const massIndependentSchema = mapping(
  {
    coefficients: z.record(
      z.string().regex(/^U\d\d$/, { error: "mass-independent coefficients are named U followed by k and l, e.g. U10, U01" }),
      measuredIn("cm⁻¹·u^(k/2+l)"),
      {
        error: (issue) => `expected mass-independent coefficients (U10: …, U01: …), got ${describeInput(issue.input)}`,
      },
    ),
    breakdown: breakdownSchema.optional(),
    /** Electron mass the source used in (1 + m_e Δ/M), in u. */
    electronMassU: numberIn("u").positive().optional(),
    /** Atomic masses the source fitted with, by isotope ("12C": 12); others from the isotope library. */
    atomMassesU: z
      .record(z.string().regex(/^\d{1,3}[A-Z][a-z]?$/, { error: "an isotope is written mass number then symbol, e.g. 12C, 16O" }), numberIn("u").positive())
      .optional(),
    /** The unit the source prints U_kl in (times u^(k/2+l)); MHz is converted with the exact c. */
    unit: z.enum(["cm-1", "MHz"], { error: () => `expected the unit cm-1 or MHz` }).optional(),
  },
  "a mass-independent Dunham set",
);

/** A second published set for the same species, used only to say how far two sources agree. */
const crossCheckSchema = mapping(
  { source: sourceKey, dunham: dunhamSchema.optional(), massIndependent: massIndependentSchema.optional() },
  "a cross-check set",
);

export const constantsSchema = mapping(
  {
    source: sourceKey,
    equilibrium: equilibriumSchema.optional(),
    dunham: dunhamSchema.optional(),
    massIndependent: massIndependentSchema.optional(),
    fit: fitSchema.optional(),
    crossCheck: crossCheckSchema.optional(),
  },
  "a constants block",
);
