// Issue 21, "The contributor's path": check warns of a missing abundant species; a linear molecule
// has its own template and `new --linear`; molecule-level fields and the source check live in one place.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { loadMoleculesOrThrow, missingAbundantSpecies } from "../lib/molecules/index.ts";

const root = join(import.meta.dirname, "..");
const work = mkdtempSync(join(tmpdir(), "bandatlas-contributor-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe("check warns when an abundant isotopologue is missing", () => {
  it("names H37Cl (about 24 %) in an HCl file that lists only H35Cl, and still passes the file", async () => {
    // Natural abundance of 37Cl ≈ 0.24 (IUPAC isotopic composition, via chemical-elements).
    const dir = join(work, "only35");
    const text = readFileSync(join(root, "molecules/hcl.yaml"), "utf8").replace(/^  - massNumbers: \[1, 37\]\n/m, "");
    expect(text).not.toContain("[1, 37]");
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(dir);
    writeFileSync(join(dir, "hcl.yaml"), text);
    const r = await runCli(["check", join(dir, "hcl.yaml")]);
    expect(r.exitCode).toBe(0);
    expect(r.stdout).toMatch(/warning: .*hcl\.yaml: species 1H37Cl \(natural abundance 24 %\) is not listed/);
    expect(r.stdout).toContain("- massNumbers: [1, 37]");
  });
  it("says nothing of species below 1 % (D35Cl, 1.2·10⁻⁴) and nothing for the shipped diatomics", () => {
    for (const m of loadMoleculesOrThrow().filter((m) => m.structure === "diatomic")) expect(missingAbundantSpecies(m), m.id).toEqual([]);
  });
  it("counts a symmetric molecule's mirror arrangements once (H12C13CH = H13C12CH, about 2.1 %)", () => {
    // 13C abundance ≈ 0.0107 (IUPAC, via chemical-elements): 2 × 0.0107 × 0.9893 ≈ 0.021.
    const c2h2 = loadMoleculesOrThrow().find((m) => m.id === "c2h2")!;
    const missing = missingAbundantSpecies(c2h2);
    const mixed = missing.filter((s) => s.massNumbers.join(",") === "1,12,13,1" || s.massNumbers.join(",") === "1,13,12,1");
    expect(mixed).toHaveLength(1);
    expect(mixed[0].abundance).toBeCloseTo(0.021, 3);
  });
});

describe("a linear molecule's template", () => {
  it("writes it with new --linear, and check names its placeholders (no stack trace)", async () => {
    const dir = join(work, "linear");
    mkdirSync(dir, { recursive: true });
    expect((await runCli(["new", "ocs", "--linear", "--molecules", dir])).exitCode).toBe(0);
    const r = await runCli(["check", join(dir, "ocs.yaml")]);
    expect(r.exitCode).toBe(1);
    const out = r.stdout + r.stderr;
    expect(out).toMatch(/ocs\.yaml:\d+:\d+: `name`: still holds the template's placeholder REPLACE/);
    expect(out).toMatch(/`species\[0\]\.states\[1\]\.termEnergy`/);
    expect(out).not.toMatch(/\n\s+at /);
  });
  it("has a field table in DEVELOPERS.md naming every species field of the linear schema", () => {
    const guide = readFileSync(join(root, "DEVELOPERS.md"), "utf8");
    const section = guide.slice(guide.indexOf("## A linear molecule"), guide.indexOf("## Which sources"));
    for (const field of ["structure", "massNumbers", "nuclearSpinWeights", "vibrationalModes", "states[]", "bands[]", "fit", "referenceLines[]", "ownCells"])
      expect(section, field).toContain(field);
  });
  it("README's `new` example is a molecule the model can build", () => {
    const readme = readFileSync(join(root, "README.md"), "utf8");
    expect(readme).not.toMatch(/bandatlas new so2/);
    expect(readme).toMatch(/bandatlas new hbr/);
  });
});

describe("molecule-level fields and the source check, one place each", () => {
  it("builds broadening and pressure shift in moleculeIdentity for both forms", () => {
    const lib = (f: string) => readFileSync(join(root, "lib/molecules", f), "utf8");
    for (const f of ["buildMolecule.ts", "linearMolecule.ts"]) {
      expect(lib(f), f).not.toContain("gasBroadening(");
      expect(lib(f), f).not.toContain("gasPressureShift(");
    }
    expect(lib("moleculeIdentity.ts")).toContain("broadening: file.broadening ? gasBroadening(file.broadening) : null");
    // The one source check (identityChecks sourceChecker), not a copy in linearChecks.
    expect(lib("linearChecks.ts")).not.toContain("is not listed under");
    // c2h2 (linear) cites a self pressure shift (Swann & Gilbert 2000, as in c2h2.yaml): it arrives.
    const c2h2 = loadMoleculesOrThrow().find((m) => m.id === "c2h2")!;
    expect(c2h2.pressureShift?.self).toBeTruthy();
  });
});
