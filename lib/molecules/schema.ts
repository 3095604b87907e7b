import { z } from "zod";
import { constantsSchema } from "./constantsSchema.ts";
import { describeInput } from "./describeInput.ts";
import { bandText, listOf, mapping, massNumbers, measuredIn, numberIn, sourceKey, text } from "./schemaParts.ts";

// The molecule file's shape. Every object is strict (unknown keys are errors with a suggestion),
// every number says its unit in the message when it is wrong. The building blocks are in
// schemaParts.ts, the constants blocks in constantsSchema.ts.
export * from "./schemaParts.ts";
export * from "./constantsSchema.ts";

const speciesSchema = mapping(
  {
    massNumbers,
    reference: z.boolean({ error: (i) => `expected true or false, got ${describeInput(i.input)}` }).optional(),
    constants: constantsSchema.optional(),
  },
  "a species",
);

export const sourceSchema = mapping(
  {
    citation: text("the full citation (authors, title, journal, volume, pages, year)"),
    url: text("a web address").optional(),
    doi: text("a DOI").optional(),
    // A certified standard (a metrology body's recommended values, a reference material's
    // certificate): its measured lines become the reference positions of their lines.
    certifiedPositions: z
      .union(
        [
          z.literal(true),
          mapping({ cellPressurePa: numberIn("Pa").nonnegative({ error: "a pressure cannot be negative" }) }, "the certified values' cell pressure"),
        ],
        {
          error: (issue) => `expected true, or { cellPressurePa } when the certified values apply to a filled cell, got ${describeInput(issue.input)}`,
        },
      )
      .optional(),
  },
  "a source",
);

const intensitySchema = mapping(
  {
    source: sourceKey,
    massNumbers,
    band: bandText,
    transitionDipoleDebye: measuredIn("debye").optional(),
    bandStrength: mapping(
      {
        cmPerMolecule: measuredIn("cm/molecule"),
        temperatureK: numberIn("K"),
        // true: the source's value is per molecule of the gas at natural abundance (already
        // multiplied by this species' abundance); default false: per molecule of this species.
        includesAbundance: z.boolean({ error: (i) => `expected true or false, got ${describeInput(i.input)}` }).optional(),
      },
      "a band strength",
    ).optional(),
    hermanWallis: mapping({ a1: numberIn("units of m (dimensionless)"), a2: numberIn("units of m² (dimensionless)") }, "Herman–Wallis coefficients").optional(),
  },
  "an intensity entry",
);

const broadeningCoefficientSchema = mapping(
  {
    source: sourceKey,
    hwhmCmPerAtm: numberIn("cm⁻¹/atm (HWHM at 296 K)").positive({ error: "a broadening coefficient is above 0" }),
    temperatureExponent: numberIn("the exponent n of (296/T)^n (dimensionless)"),
    byAbsM: listOf(
      mapping(
        {
          absM: numberIn("|m| (m = J''+1 in R, −J'' in P)").int({ error: "|m| is a whole number" }).positive({ error: "|m| is at least 1" }),
          hwhmCmPerAtm: numberIn("cm⁻¹/atm (HWHM at 296 K)").positive({ error: "a broadening coefficient is above 0" }),
        },
        "a J-dependent broadening value",
      ),
      "J-dependent values by |m|, in increasing |m|",
    ).optional(),
  },
  "a broadening coefficient",
);

const pressureShiftCoefficientSchema = mapping(
  {
    source: sourceKey,
    cmPerAtm: numberIn("cm⁻¹/atm near room temperature (negative: towards lower wavenumber)"),
    uncertaintyCmPerAtm: numberIn("cm⁻¹/atm").nonnegative({ error: "an uncertainty cannot be negative" }),
  },
  "a pressure-shift coefficient",
);

/** Pressure shift of the line centres by the gas itself and by air; either may be left out (then none is applied for it). */
export const pressureShiftSchema = mapping(
  { self: pressureShiftCoefficientSchema.optional(), air: pressureShiftCoefficientSchema.optional() },
  "a pressure-shift block",
);

/** Pressure broadening of the molecule's lines by itself and by air (HWHM per atm at 296 K). */
export const broadeningSchema = mapping({ self: broadeningCoefficientSchema, air: broadeningCoefficientSchema }, "a broadening block");

export const referenceLineSchema = mapping(
  {
    label: z
      .string({ error: (i) => `expected a line label like "R(0)" or "P(1)", got ${describeInput(i.input)}` })
      .regex(/^[PR]\(\d{1,3}\)$/, { error: `expected a line label like "R(0)" or "P(1)"` }),
    wavenumber: numberIn("cm⁻¹ (vacuum)"),
    uncertainty: numberIn("cm⁻¹").nonnegative({ error: "an uncertainty cannot be negative" }).optional(),
    heldOut: z.boolean({ error: (i) => `expected true or false, got ${describeInput(i.input)}` }).optional(),
  },
  "a reference line",
);

/** The parts every form of molecule file shares: identity, hazard note, sources, broadening. */
export const identityShape = {
  id: text("the molecule id"),
  name: text("the molecule's name"),
  formula: text("the formula"),
  casNumber: text("the CAS registry number"),
  aliases: listOf(text("an alias"), "other names").default([]),
  limitations: listOf(text("a known limitation of these constants"), "known limitations").default([]),
  electronicState: text('the electronic state, e.g. "X 1Σ+"'),
  atoms: listOf(text("an element symbol"), "element symbols"),
  hazard: mapping(
    {
      ghsPictograms: listOf(
        z
          .string({ error: (i) => `expected a GHS pictogram code like GHS06, got ${describeInput(i.input)}` })
          .regex(/^GHS0[1-9]$/, { error: "expected a GHS pictogram code GHS01 to GHS09" }),
        "GHS pictogram codes",
      ),
      sentences: listOf(text("a hazard sentence"), "hazard sentences").min(1, { error: "give at least one plain hazard sentence" }),
    },
    "the hazard note",
  ),
  sources: z.record(z.string().regex(/^[A-Za-z][A-Za-z0-9_-]{0,40}$/, { error: "a source key is a short word of letters, digits, - or _" }), sourceSchema, {
    error: (issue) => `expected the sources as a mapping of key: { citation, url, doi }, got ${describeInput(issue.input)}`,
  }),
  broadening: broadeningSchema.optional(),
  pressureShift: pressureShiftSchema.optional(),
};

/** A group of measured lines of one band (`"0-0"` for pure rotation) of one species. */
export const referenceLineGroupSchema = mapping(
  { source: sourceKey, massNumbers, band: bandText, lines: listOf(referenceLineSchema, "reference lines").min(1) },
  "a group of reference lines",
);

/**
 * The first form of molecule file, a ¹Σ⁺ diatomic (`structure: diatomic`, the default). The other
 * form, `structure: linear`, is in linearSchema.ts; both share `identityShape`.
 */
export const diatomicFileSchema = mapping(
  {
    structure: z.literal("diatomic", { error: () => "structure is diatomic (the default) or linear" }).optional(),
    ...identityShape,
    species: listOf(speciesSchema, "species").min(1, { error: "give at least the reference species" }),
    intensity: listOf(intensitySchema, "intensity entries").optional(),
    referenceLines: listOf(referenceLineGroupSchema, "groups of reference lines").optional(),
  },
  "a molecule file",
);

export type DiatomicMoleculeFile = z.infer<typeof diatomicFileSchema>;
/** The fields every form of file has (see `identityShape`). */
export type IdentityFields = Pick<DiatomicMoleculeFile, keyof typeof identityShape>;
export type Measured = number | { value: number; uncertainty: number };
