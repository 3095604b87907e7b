import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { loadMoleculeFiles, formatProblem } from "../lib/molecules/index.ts";

describe("bandatlas new", () => {
  it("writes a commented template that check rejects until the placeholders are replaced", async () => {
    const dir = mkdtempSync(join(tmpdir(), "bandatlas-new-"));
    const created = await runCli(["new", "test-gas", "--molecules", dir]);
    expect(created.exitCode).toBe(0);
    const path = join(dir, "test-gas.yaml");
    const text = readFileSync(path, "utf8");
    expect(text).toMatch(/^id: test-gas$/m);
    expect(text).toMatch(/cm⁻¹/);
    const before = await runCli(["check", path]);
    expect(before.exitCode).toBe(1);
    expect(before.stderr).toMatch(/omegaE\.value`: expected a number in cm⁻¹, got the text "REPLACE"/);

    // Filled in with invented numbers (labelled as such) but the name left as the placeholder.
    const filled = text
      .replace("formula: REPLACE", "formula: CO")
      .replace('casNumber: "REPLACE"', 'casNumber: "630-08-0"')
      .replace("atoms: [REPLACE, REPLACE]", "atoms: [C, O]")
      .replace('"REPLACE with one or two plain hazard sentences (e.g. toxic if inhaled; gas under pressure)."', '"Invented test gas."')
      .replace('"REPLACE: authors, title, journal volume, pages (year)."', '"Invented constants for a test, not a publication."')
      .replace('"10.0000/REPLACE"', '"10.0000/invented"')
      .replace("massNumbers: [0, 0]", "massNumbers: [12, 16]")
      .replace("{ value: REPLACE, uncertainty: REPLACE }", "{ value: 2000.0, uncertainty: 0.1 }")
      .replace(
        /(omegaExe|omegaEye|bE|alphaE|gammaE|dE|betaE): REPLACE/g,
        (_, k) => `${k}: ${{ omegaExe: 12, omegaEye: 0.01, bE: 2, alphaE: 0.02, gammaE: 1e-7, dE: 6e-6, betaE: 1e-9 }[k as string]}`,
      );
    writeFileSync(path, filled);
    const { problems } = loadMoleculeFiles([path]);
    expect(problems.map(formatProblem)).toEqual([expect.stringMatching(/`name`: still holds the template's placeholder REPLACE/)]);
    writeFileSync(path, filled.replace("name: REPLACE with the molecule's name", "name: Invented test gas"));
    expect(loadMoleculeFiles([path]).problems).toEqual([]);
    const lines = await runCli(["lines", "test-gas", "--molecules", dir]);
    expect(lines.exitCode).toBe(0);
    expect(lines.stdout).toMatch(/R\(0\)/);
  });
  it("refuses to overwrite an existing file and refuses bad ids", async () => {
    const dir = mkdtempSync(join(tmpdir(), "bandatlas-new-"));
    await runCli(["new", "gas", "--molecules", dir]);
    writeFileSync(join(dir, "gas.yaml"), "id: gas # edited\n");
    const again = await runCli(["new", "gas", "--molecules", dir]);
    expect(again.exitCode).toBe(2);
    expect(again.stderr).toMatch(/already exists/);
    expect(readFileSync(join(dir, "gas.yaml"), "utf8")).toBe("id: gas # edited\n");
    const bad = await runCli(["new", "../evil", "--molecules", dir]);
    expect(bad.stderr).toMatch(/lowercase letters, digits and single dashes/);
  });
});
