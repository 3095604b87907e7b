import { z } from "zod";
import { describeInput, nearestKnown } from "./describeInput.ts";

// The building blocks of the molecule-file schemas: strict mappings (unknown keys are errors with
// a suggestion) and numbers whose message says their unit when they are wrong.

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
export const bandText = z
  .string({ error: (issue) => `expected a band like "1-0" (v'-v''), got ${describeInput(issue.input)}` })
  .regex(/^\d{1,2}-\d{1,2}$/, { error: `expected a band like "1-0" (v'-v'')` });
export const massNumbers = listOf(
  z
    .number({ error: (i) => `expected a mass number (a whole number), got ${describeInput(i.input)}` })
    .int({ error: "a mass number is a whole number" })
    .positive({ error: "a mass number is positive" }),
  "mass numbers, one per atom",
);
