// `bandatlas fit`, --write and the check's refusal of a stale or edited result, on an invented
// molecule file (test/fixtures/fit/xo.yaml; its lines are invented round numbers, not a gas).
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { loadMoleculeFiles } from "../lib/molecules/index.ts";

const fixture = new URL("./fixtures/fit/xo.yaml", import.meta.url).pathname;

function copy(): string {
  const dir = mkdtempSync(join(tmpdir(), "bandatlas-fit-"));
  const path = join(dir, "xo.yaml");
  copyFileSync(fixture, path);
  return path;
}

describe("bandatlas fit", () => {
  it("refuses a fit block without a result, then --write makes the file pass the check with every comment kept", async () => {
    const path = copy();
    const before = await runCli(["check", path]);
    expect(before.exitCode).toBe(1);
    expect(before.stderr).toMatch(/xo\.yaml:\d+:\d+: `species\[0\]\.constants\.fit`: the fit has no `result`; run `bandatlas fit xo --write`/);
    const fit = await runCli(["fit", path, "--write"]);
    expect(fit.exitCode).toBe(0);
    expect(fit.stdout).toMatch(/fit to 12 cited measured lines \(1 more held out to test it\)/);
    const text = readFileSync(path, "utf8");
    expect(text).toContain("# Invented test molecule");
    expect(text).toContain("massNumbers: [12, 16]");
    expect((await runCli(["check", path])).exitCode).toBe(0);
    const { molecules } = loadMoleculeFiles([path]);
    expect(molecules[0].species[0].model.constantsOrigin).toBe("fitted");
  });

  it("reports constants, uncertainties, correlations, residuals, χ²/ν and the support rule as JSON", async () => {
    const { stdout, exitCode } = await runCli(["fit", fixture, "--format", "json"]);
    expect(exitCode).toBe(0);
    const report = JSON.parse(stdout);
    expect(report.parameters.map((p: { name: string }) => p.name)).toEqual(["Y10", "Y20", "Y01", "Y11", "Y02"]);
    expect(report.correlation).toHaveLength(5);
    for (let i = 0; i < 5; i++) expect(report.correlation[i][i]).toBeCloseTo(1, 12);
    expect(report.lines).toHaveLength(13);
    expect(report.lines.filter((l: { heldOut: boolean }) => l.heldOut)).toHaveLength(1);
    // Residuals are observed − calculated and χ²/ν is their weighted mean square over ν = 12 − 5.
    expect(report.degreesOfFreedom).toBe(7);
    const chi2 = report.lines.filter((l: { heldOut: boolean }) => !l.heldOut).reduce((s: number, l: { normalized: number }) => s + l.normalized ** 2, 0);
    expect(report.reducedChiSquared).toBeCloseTo(chi2 / 7, 10);
    expect(report.rule).toMatch(/3 standard uncertainties/);
  });

  it("refuses a file whose written result was edited by hand, naming the line and the fitted value", async () => {
    const path = copy();
    await runCli(["fit", path, "--write"]);
    const text = readFileSync(path, "utf8");
    const edited = text.replace(/Y01: \{ ?value: ([\d.]+)/, (_, v) => `Y01: { value: ${(Number(v) + 1e-4).toFixed(8)}`);
    expect(edited).not.toBe(text);
    writeFileSync(path, edited);
    const { stderr, exitCode } = await runCli(["check", path]);
    expect(exitCode).toBe(1);
    expect(stderr).toMatch(
      /xo\.yaml:\d+:\d+: `species\[0\]\.constants\.fit\.result\.Y01`: the file says [\d.]+ ± [\d.e-]+ but the fit to the cited lines gives [\d.]+ ± /,
    );
  });

  it("says so plainly for a file without a fit and for one that does not exist", async () => {
    const cited = await runCli(["fit", "co"]);
    expect(cited.exitCode).toBe(2);
    expect(cited.stderr).toMatch(/has no `fit` block/);
    const missing = await runCli(["fit", "/nonexistent/none.yaml"]);
    expect(missing.exitCode).toBe(2);
    expect(missing.stderr).toMatch(/no molecule file/);
  });
});
