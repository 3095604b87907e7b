import { readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { formatProblem, loadMoleculeFiles } from "../lib/molecules/index.ts";

const fixtures = join(import.meta.dirname, "fixtures");
const check = (path: string) => loadMoleculeFiles([path]);

describe("a valid molecule file", () => {
  it("loads, with the reference species first and the isotopologue scaled", () => {
    const { molecules, problems } = check(join(fixtures, "good-xo.yaml"));
    expect(problems).toEqual([]);
    expect(molecules[0].species.map((s) => s.model.label)).toEqual(["12C16O", "13C16O"]);
    expect(molecules[0].species[1].model.constantsOrigin).toBe("isotope-scaled");
    // Natural abundance of 12C16O from the isotope library: 0.9893 × 0.99757 (IUPAC 2013 values).
    expect(molecules[0].species[0].model.abundance).toBeCloseTo(0.9893 * 0.99757, 4);
  });
});

// Each class of malformed file: fixture, expected line (null = whole file), words the message must hold.
const cases: Array<[string, number | null, RegExp]> = [
  ["syntax-error", 5, /YAML syntax/],
  ["root-not-mapping", 1, /must be a mapping of fields/],
  ["duplicate-key", 6, /appears twice/],
  ["unknown-key", 6, /unknown field "formulae" \(did you mean "formula"\?\)/],
  ["string-for-number", 25, /`species\[0\]\.constants\.equilibrium\.bE`: expected a number in cm⁻¹ .*got the text "2\.0 cm-1"/],
  ["nan-constant", 25, /got NaN/],
  ["inf-constant", 24, /got infinity/],
  ["negative-b", 25, /Be \(rotational constant\) must be above 0/],
  ["zero-b", 25, /must be above 0 cm⁻¹, got 0/],
  ["wexe-too-large", 24, /ωexe = 1200 cm⁻¹ does not make sense/],
  ["missing-source", 20, /`species\[0\]\.constants\.source`: expected a source key/],
  ["unknown-source", 21, /source "hh1979" is not listed under `sources`/],
  ["unknown-element", 9, /"Xx" is not an element symbol/],
  ["unknown-isotope", 28, /19C has no natural abundance/],
  ["id-mismatch", 3, /must match the file name "id-mismatch\.yaml"/],
  ["id-path", 3, /lowercase letters, digits and single dashes/],
  ["state-not-modelled", 8, /"X 2Π" is not modelled/],
  ["hazard-missing", 3, /`hazard`: expected the hazard note/],
  ["alias-bomb", null, /aliases expand too far/],
  ["not-utf8", null, /not valid UTF-8/],
  ["too-large", null, /limited to 262144 bytes/],
  ["bad-url", 17, /must be an https: or http: link/],
  ["no-reference", 17, /exactly one species must have `reference: true`/],
  ["bad-cas", 6, /fails its check digit/],
  ["control-characters", 4, /invisible control character U\+202E/],
  ["wrong-type", 7, /`aliases`: expected a list of other names, got a mapping/],
  ["negative-mass-number", 28, /`species\[1\]\.massNumbers\[0\]`: a mass number is positive/],
  ["shift-uncertainty-negative", 15, /`pressureShift\.self\.uncertaintyCmPerAtm`: an uncertainty cannot be negative/],
  ["shift-unknown-source", 15, /`pressureShift\.air\.source`: source "swann2000" is not listed under `sources`/],
];

describe("malformed molecule files", () => {
  it("has a test case for every fixture", () => {
    const names = readdirSync(join(fixtures, "bad"))
      .map((n) => n.replace(/\.yaml$/, ""))
      .sort();
    // every-stage holds one problem of each kind at once: test/firstSteps.test.ts checks it.
    expect(names).toEqual([...cases.map((c) => c[0]), "every-stage"].sort());
  });
  for (const [name, line, pattern] of cases) {
    it(`reports ${name} with file, line and a plain message`, () => {
      const { molecules, problems } = check(join(fixtures, "bad", `${name}.yaml`));
      expect(molecules).toEqual([]);
      expect(problems).toHaveLength(1);
      const text = formatProblem(problems[0]);
      expect(text).toMatch(pattern);
      expect(text).toContain(`${name}.yaml`);
      expect(problems[0].line).toBe(line);
      expect(text).not.toMatch(/\n\s+at /);
    });
  }
  it("refuses two files with the same id", () => {
    const dir = join(fixtures, "duplicate-id");
    const { problems } = loadMoleculeFiles([join(dir, "a/same-xo.yaml"), join(dir, "b/same-xo.yaml")]);
    expect(problems.map(formatProblem)).toEqual([expect.stringMatching(/b\/same-xo\.yaml: `id`: id "same-xo" is already used by .*a\/same-xo\.yaml/)]);
  });
  it("refuses two files with the same CAS number", () => {
    const dir = join(fixtures, "duplicate-cas");
    const { problems } = loadMoleculeFiles(readdirSync(dir).map((n) => join(dir, n)));
    expect(problems.map(formatProblem).join("\n")).toMatch(/CAS number "630-08-0" is already used by .*first-xo\.yaml/);
  });
});
