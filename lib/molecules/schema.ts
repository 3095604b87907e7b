import { z } from "zod";
import { describeInput, nearestKnown } from "./describeInput.ts";

// The molecule file's shape. Every object is strict (unknown keys are errors with a suggestion),
// every number says its unit in the message when it is wrong.

export function mapping<Shape extends z.ZodRawShape>(shape: Shape, what: string) {
  const known = Object.keys(shape);
  return z.strictObject(shape, {
    error: (issue) => {
      if (issue.code === "unrecognized_keys") {
        return issue.keys
          .map((key) => {
            const near = nearestKnown(key, known);
            return `unknown field "${key}"${near ? ` (did you mean "${near}"?)` : ""}; ${what} takes: ${known.join(", ")}`;
          })
          .join("; ");
      }
      if (issue.code === "invalid_type") return `expected ${what} (key: value pairs), got ${describeInput(issue.input)}`;
      return undefined;
    },
  });
}

export function numberIn(unit: string) {
  return z.number({ error: (issue) => `expected a number in ${unit}, got ${describeInput(issue.input)}` });
}

export function text(what: string) {
  return z
    .string({ error: (issue) => `expected ${what} as text, got ${describeInput(issue.input)}` })
    .trim()
    .min(1, { error: `${what} must not be empty` });
}

export function listOf<T extends z.ZodType>(item: T, what: string) {
  return z.array(item, { error: (issue) => `expected a list of ${what}, got ${describeInput(issue.input)}` });
}

/** A constant: a plain number, or { value, uncertainty } with one standard uncertainty. */
export function measuredIn(unit: string) {
  return z.union(
    [
      numberIn(unit),
      mapping(
        { value: numberIn(unit), uncertainty: numberIn(unit).nonnegative({ error: "an uncertainty cannot be negative" }) },
        "a value with its uncertainty",
      ),
    ],
    { error: (issue) => `expected a number in ${unit} or { value, uncertainty }, got ${describeInput(issue.input)}` },
  );
}

export const sourceKey = text("a source key (one of the keys under `sources`)");
const bandText = z
  .string({ error: (issue) => `expected a band like "1-0" (v'-v''), got ${describeInput(issue.input)}` })
  .regex(/^\d{1,2}-\d{1,2}$/, { error: `expected a band like "1-0" (v'-v'')` });
export const massNumbers = listOf(
  z
    .number({ error: (i) => `expected a mass number (a whole number), got ${describeInput(i.input)}` })
    .int({ error: "a mass number is a whole number" })
    .positive({ error: "a mass number is positive" }),
  "mass numbers, one per atom",
);

const cm = "cm⁻¹";
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
