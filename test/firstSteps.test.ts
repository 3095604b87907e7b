// The first steps a new user takes, from the README down (issue 21, "First steps that fail or
// surprise"): each used to fail or answer with silence.
import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, readdirSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli } from "../lib/cli/main.ts";
import { pressureOptionPa } from "../lib/cli/cellOptions.ts";
import { parseSpectralPosition } from "../lib/core/index.ts";

const root = join(import.meta.dirname, "..");

/** The `npx bandatlas …` lines of the README's command-line block, as argument lists (comments cut). */
function readmeCommands(): string[][] {
  const readme = readFileSync(join(root, "README.md"), "utf8");
  const block = /## The command line\n+```\n([\s\S]*?)```/.exec(readme)![1];
  return block
    .split("\n")
    .filter((line) => line.startsWith("npx bandatlas "))
    .map((line) =>
      line
        .replace(/\s+#\s.*$/, "")
        .trim()
        .split(/\s+/)
        .slice(2),
    );
}
/** The README's command that is these words, or else the one that starts with them. */
function readmeCommand(start: string): string[] {
  const commands = readmeCommands().map((args) => args.join(" "));
  const found = commands.includes(start) ? [start] : commands.filter((c) => c.startsWith(`${start} `));
  expect(found, start).toHaveLength(1);
  return found[0].split(" ");
}

const cli = (...args: string[]) => runCli(args);
const json = async (...args: string[]) => {
  const r = await cli(...args);
  expect(r.stderr).toBe("");
  expect(r.exitCode).toBe(0);
  return JSON.parse(r.stdout);
};
const refused = async (...args: string[]) => {
  const r = await cli(...args);
  expect(r.exitCode).toBeGreaterThan(0);
  expect(r.stdout).toBe("");
  expect(r.stderr).not.toMatch(/\n\s+at /);
  return r.stderr;
};

// CRC Handbook, A. Maki, "Infrared and far-infrared absorption frequency standards", CO 1-0:
// R(0) = 2147.081132 cm⁻¹ (read directly, as test/cli.test.ts cites it); P(1) = 2139.4260 cm⁻¹
// (same table, from memory). The band origin lies between them, near 2143.27 cm⁻¹ (from memory).
const coR0Cm = 2147.081132;
const coP1Cm = 2139.426;

describe("find with nothing in the window says why, instead of silence", () => {
  it("names the CO band origin and the lines either side, with their ±", async () => {
    const { stdout, exitCode } = await cli("find", "2143.3", "--window", "0.6");
    expect(exitCode).toBe(0);
    expect(stdout).toMatch(/: 0\n/);
    expect(stdout).toContain("This is the band origin of 12C16O 1-0");
    expect(stdout).toContain("no line lies at a band origin");
    // Its own lines either side, each with a ± (R(0) and P(1), CRC Maki table above).
    const r0 = /R\(0\) at (\d+\.\d+) ± (\d\.\d+(?:e-\d+)?) cm⁻¹ \(validated/.exec(stdout);
    const p1 = /P\(1\) at (\d+\.\d+) ± (\d\.\d+(?:e-\d+)?) cm⁻¹ \(validated/.exec(stdout);
    expect(Math.abs(Number(r0![1]) - coR0Cm)).toBeLessThan(1e-3);
    expect(Math.abs(Number(p1![1]) - coP1Cm)).toBeLessThan(1e-3);
    expect(Number(r0![2])).toBeGreaterThan(0);
    expect(stdout).toMatch(/Nearest lines of the atlas: below, \S+ \S+ [PR]\(\d+\) at [\d.]+ ± /);
    // Silence is not evidence: the common absorbers it does not hold are named (fact of the trade).
    expect(stdout).toMatch(/no evidence that nothing absorbs here: the atlas does not hold water vapour .*methane .*carbon dioxide \(ν2 580–760/);
  });

  it("gives the same in JSON, as fields of our own, and nothing extra when lines are found", async () => {
    const { matches, whenNone } = await json("find", "2143.3", "--window", "0.6", "--format", "json");
    expect(matches).toEqual([]);
    expect(whenNone.originsInWindow[0]).toMatchObject({ molecule: "co", species: "12C16O", band: "1-0" });
    const origin = whenNone.originsInWindow[0];
    expect(Math.abs(origin.wavenumber - 2143.27)).toBeLessThan(0.01); // from memory, see above
    expect(origin.lineBelow).toMatchObject({ label: "P(1)" });
    expect(origin.lineAbove).toMatchObject({ label: "R(0)" });
    expect(origin.wavenumberUncertainty).toBeGreaterThan(0);
    expect(whenNone.nearestBelow.wavenumber).toBeLessThan(2143.3);
    expect(whenNone.nearestAbove.wavenumber).toBeGreaterThan(2143.3);
    for (const n of [whenNone.nearestBelow, whenNone.nearestAbove]) {
      expect(Object.keys(n)).toEqual(["molecule", "species", "band", "label", "wavenumber", "wavenumberUncertainty", "positionStatus", "offset"]);
      expect(n.wavenumberUncertainty).toBeGreaterThan(0);
    }
    // The atlas builds CO2's ν3 only, so its bending band (near 667 cm⁻¹, fact of the trade) is named.
    const co2 = whenNone.interferersNotInAtlas.find((g: { formula: string }) => g.formula === "CO2");
    expect(co2.regions.map((r: { band: string }) => r.band)).toEqual(["ν2", "ν1+ν3"]);
    expect(whenNone.interferersNotInAtlas.map((g: { formula: string }) => g.formula)).toEqual(["H2O", "CH4", "CO2"]);
    expect(whenNone.didYouMean).toBeNull();

    const found = await json("find", "2147.0811", "--window", "0.01", "--format", "json");
    expect(found.matches.length).toBeGreaterThan(0);
    expect(found).not.toHaveProperty("whenNone");
  });

  it("says when the position lies in a band the atlas does not hold", async () => {
    // CO2 ν2 bending band centre 667 cm⁻¹ (fact of the trade, from memory).
    const { stdout } = await cli("find", "667");
    expect(stdout).toContain("667 cm⁻¹ lies in water vapour's pure rotation band (10–1000 cm⁻¹) and in carbon dioxide's ν2 band (580–760 cm⁻¹)");
  });
});

describe("spectrum without --from/--to shows the band", () => {
  it("runs the README's spectrum command over CO 1-0", async () => {
    const { stdout, exitCode, stderr } = await cli(...readmeCommand("spectrum co"));
    expect(stderr).toBe("");
    expect(exitCode).toBe(0);
    const [header, ...rows] = stdout.trim().split("\n");
    expect(header).toBe("wavenumber_cm-1,transmittance_instrument,transmittance_monochromatic,optical_depth");
    const samples = rows.map((r) => r.split(",").map(Number));
    const first = samples[0][0];
    const last = samples.at(-1)![0];
    // The CO 1-0 branches peak near J'' = 7 at room temperature, ~2115 and ~2170 cm⁻¹, and their
    // 1 % lines reach past 2050 and 2220 cm⁻¹ (fact of the trade, from memory): the range holds them.
    expect(first).toBeLessThan(2060);
    expect(first).toBeGreaterThan(1950);
    expect(last).toBeGreaterThan(2215);
    expect(last).toBeLessThan(2300);
    // R(0) (CRC Maki table) is a clear dip in a 10 cm cell of 20 Torr CO.
    const nearR0 = samples.filter(([nu]) => Math.abs(nu - coR0Cm) < 0.3).map(([, t]) => t);
    expect(Math.min(...nearR0)).toBeLessThan(0.95);
  });

  it("says so in --help and in the JSON, and takes one end from the band when one is given", async () => {
    expect((await cli("spectrum", "--help")).stdout).toMatch(/default: the principal band/);
    const doc = await json("spectrum", "co", "--format", "json");
    expect(doc.rangeCm.endsFromBand).toEqual(["from", "to"]);
    const half = await json("spectrum", "co", "--from", "2140", "--format", "json");
    expect(half.rangeCm).toMatchObject({ from: 2140, endsFromBand: ["to"] });
    expect(half.rangeCm.to).toBe(doc.rangeCm.to);
    expect(await refused("spectrum", "co", "--to", "1900")).toMatch(/--to 1900: the range would be .* give both --from and --to/);
  });
});

describe("units a user types", () => {
  it("accepts bar, mbar, hPa, kPa, Pa, atm, Torr, mmHg and psi with exact factors", () => {
    // Exact by definition: 1 bar = 10⁵ Pa; 1 atm = 101325 Pa; 1 Torr = 101325/760 Pa.
    expect(pressureOptionPa("1 bar")).toBe(1e5);
    expect(pressureOptionPa("1 BAR")).toBe(1e5);
    expect(pressureOptionPa("20 mbar")).toBe(2000);
    expect(pressureOptionPa("13 hPa")).toBe(1300);
    expect(pressureOptionPa("2.5 kPa")).toBe(2500);
    expect(pressureOptionPa("500 Pa")).toBe(500);
    expect(pressureOptionPa("1 atm")).toBe(101325);
    expect(pressureOptionPa("760 Torr")).toBeCloseTo(101325, 9);
    // Exact by definition: 1 psi = 0.45359237 kg · 9.80665 m/s² / (0.0254 m)² = 6894.757293168… Pa.
    expect(pressureOptionPa("1 psi")).toBeCloseTo(6894.757293168, 9);
    // Exact by definition: conventional mmHg = 13.5951 g/cm³ · 9.80665 m/s² · 1 mm = 133.322387415 Pa.
    expect(pressureOptionPa("1 mmHg")).toBeCloseTo(133.322387415, 12);
    expect(pressureOptionPa("1 mmhg")).toBeCloseTo(133.322387415, 12);
  });

  it("runs a cell at '1 bar' and in psi from the command line, and lists the units in --help", async () => {
    const bar = await json("spectrum", "co", "--pressure", "1 bar", "--format", "json");
    expect(bar.conditions.pressurePa).toBe(1e5);
    const psi = await json("calibration-lines", "co", "--pressure", "2", "psi", "--format", "json");
    expect(psi.conditions.pressurePa).toBeCloseTo(2 * 6894.757293168, 6); // exact by definition, above
    expect((await cli("spectrum", "--help")).stdout).toMatch(/Pa, kPa, hPa, mbar, bar, Torr, mmHg, atm or psi/);
    expect(await refused("spectrum", "co", "--pressure", "20 inHg")).toMatch(/unknown unit "inHg"; use one of: Pa, kPa, hPa, mbar, bar, Torr, mmHg, atm, psi/);
  });

  it("reads a single decimal comma, and refuses one that could be a thousands separator", async () => {
    // Common practice, no source: many locales write 2143,3 for 2143.3.
    expect(parseSpectralPosition("2143,3")).toEqual({ value: 2143.3, unit: "cm-1", medium: "vacuum" });
    expect(parseSpectralPosition("1532,83 nm")).toEqual({ value: 1532.83, unit: "nm", medium: "vacuum" });
    const { query } = await json("find", "2143,3", "--format", "json");
    expect(query.wavenumber).toBe(2143.3);
    expect(await refused("find", "2,143")).toMatch(
      /"2,143": is the comma a decimal comma \(2\.143\) or a thousands separator \(2143\)\? Write the number with a decimal point/,
    );
    expect(await refused("find", "1,532.41")).toMatch(/write the number with a decimal point and no separators, e.g\. 2143\.3/);
  });

  it("asks whether a bare small number that finds nothing was meant in µm", async () => {
    // 1e4 / 4.66 µm = 2145.92 cm⁻¹ (exact arithmetic), inside the CO 1-0 R branch.
    const { stdout } = await cli("find", "4.66");
    // Its window is what the written digits allow: 4.66 µm is 4.655–4.665 µm (common practice, no source).
    expect(stdout).toContain("Did you mean 4.66 µm (2145.92 cm⁻¹)? Then run: bandatlas find 4.66 um --window 0.005");
    const { whenNone } = await json("find", "4.66", "--format", "json");
    expect(whenNone.didYouMean).toMatchObject({ position: 4.66, unit: "um", windowUm: 0.005 });
    expect(whenNone.didYouMean.wavenumber).toBeCloseTo(1e4 / 4.66, 9);
    // The suggested command finds CO R(0) (CRC Maki table, above).
    const suggested = await json("find", "4.66", "um", "--window", "0.005", "--format", "json");
    expect(suggested.matches.map((m: { species: string; label: string }) => `${m.species} ${m.label}`)).toContain("12C16O R(0)");
    // Not asked when a unit was written, nor of a number that is plausible as a wavenumber.
    expect((await cli("find", "4.66", "cm-1")).stdout).not.toContain("Did you mean");
    expect((await cli("find", "1700")).stdout).not.toContain("Did you mean");
  });

  it("prints both wavelengths of the lines table in µm; the CSV and JSON keep their nm key", async () => {
    const { stdout } = await cli("lines", "co");
    const header = stdout.split("\n").find((l) => l.startsWith("line "))!;
    expect(header).toContain("λ air / µm");
    expect(header).not.toContain("nm");
    const doc = await json("lines", "co", "--format", "json");
    const r0 = doc.lines.find((l: { label: string }) => l.label === "R(0)");
    const row = stdout.split("\n").find((l) => l.startsWith("R(0) "))!;
    expect(row).toContain((r0.wavelengthAirNm / 1000).toFixed(6));
    // Standard air's index is n − 1 ≈ 2.7·10⁻⁴ in the infrared (Edlén 1966, from memory).
    expect(r0.wavelengthVacuumUm / (r0.wavelengthAirNm / 1000) - 1).toBeCloseTo(2.7e-4, 5);
    const csvHeader = (await cli("lines", "co", "--format", "csv")).stdout.split("\n")[2];
    expect(csvHeader).toContain("wavelengthAir (nm)");
  });
});

describe("every README command that needs no file of the user's", () => {
  // Each README line, by its first words, and what it must print; test/cli.test.ts already checks
  // the CO JSON contract, the H37Cl CSV columns, R(0) in the CO table and check's exit codes, so
  // these check other values of the same commands. calibrate reads the user's spectrum and history
  // the user's calibration log: not here (test/calibrationRecords.test.ts runs both on files of its own).
  const notRunHere = ["calibrate ", "history "];
  const checks: Record<string, (stdout: string, dir: string) => void | Promise<void>> = {
    "lines co": (out) => {
      // CRC Handbook, Maki CO 1-0 table: P(1) = 2139.4260 cm⁻¹ (from memory).
      expect(out).toContain("species 12C16O, band 1-0, T = 296 K");
      const p1 = /^P\(1\)\s+(\d+\.\d+)/m.exec(out);
      expect(Math.abs(Number(p1![1]) - coP1Cm)).toBeLessThan(1e-3);
    },
    "lines hcl --species H37Cl --band 2-0 --temperature 500": async (out) => {
      // Boltzmann: at 500 K higher J are populated than at 296 K, so more lines pass the same threshold (fact of the trade).
      const at296 = (await cli("lines", "hcl", "--species", "H37Cl", "--band", "2-0", "--format", "csv")).stdout;
      expect(out.trim().split("\n").length).toBeGreaterThan(at296.trim().split("\n").length);
    },
    "lines co --format json": (out) => {
      // CO 1-0 band origin near 2143.27 cm⁻¹ (from memory); the positions are zero-pressure centres.
      const doc = JSON.parse(out);
      expect(Math.abs(doc.bandOrigin - 2143.27)).toBeLessThan(0.01);
      expect(doc.positions).toMatch(/^zero-pressure line centres/);
    },
    "find 2143.3 --window 0.6": (out) => expect(out).toContain("This is the band origin of 12C16O 1-0"),
    "find 1532.41 nm --air": (out) => {
      // BIPM 2007 (CIPM recommended frequencies, acetylene ν1+ν3, Table 3), as molecules/c2h2.yaml
      // cites it: 12C2H2 P(13) = 195 580 979 370 kHz = 6523.879242 cm⁻¹; 1532.41 nm in air is it.
      const first = out.split("\n").find((l) => l.startsWith("c2h2 "))!;
      expect(first).toMatch(/^c2h2\s+12C2H2\s+10100-00000\s+P\(13\)\s+6523\.879\d/);
    },
    "fit c2h2": (out) => {
      // The ν1+ν3 band origin of 12C2H2 lies near 6556.46 cm⁻¹ (from memory).
      expect(out).toMatch(/fit to \d+ cited measured lines/);
      const origin = /^10100\.G\s+(\d+\.\d+)/m.exec(out);
      expect(Math.abs(Number(origin![1]) - 6556.46)).toBeLessThan(0.01);
    },
    check: (out) => {
      const shipped = readdirSync(join(root, "molecules"))
        .filter((f) => f.endsWith(".yaml") && !f.startsWith("_"))
        .map((f) => f.replace(/\.yaml$/, ""));
      expect(out).toContain(`${shipped.length} molecule files valid: ${shipped.sort().join(", ")}`);
    },
    // Issue 21: the README's example is a molecule the model can build (a diatomic, a linear one),
    // never a bent one such as SO2.
    "new hbr": (out, dir) => {
      expect(out).toContain("hbr.yaml");
      expect(readFileSync(join(dir, "hbr.yaml"), "utf8")).toMatch(/^id: hbr$/m);
    },
    "new ocs --linear": (out, dir) => {
      expect(out).toContain("ocs.yaml");
      const text = readFileSync(join(dir, "ocs.yaml"), "utf8");
      expect(text).toMatch(/^structure: linear$/m);
      expect(text).toMatch(/^id: ocs$/m);
    },
    "sheet co --temperature 296 --paper a4": (_, dir) => {
      // pdftotext (poppler-utils) reads the sheet as a reader would; R(0) from the CRC Maki table.
      const text = execFileSync("pdftotext", [join(dir, "co-296K.pdf"), "-"], { encoding: "utf8" });
      expect(text).toContain("2147.0811");
    },
    "spectrum co": (out) => expect(out.split("\n")[0]).toBe("wavenumber_cm-1,transmittance_instrument,transmittance_monochromatic,optical_depth"),
    "calibration-lines co --resolution 1": (out) => {
      // CRC Handbook, Maki CO 1-0 table: R(1) = 2150.8560 cm⁻¹ (from memory).
      // Printed to the decimal of its ± (issue 21), so with more digits than four.
      expect(out).toMatch(/^12C16O\s+1-0\s+R\(1\)\s+2150\.856\d+\s+0\.0+\d+\s/m);
    },
    "--help": (out) => {
      for (const command of ["lines", "find", "fit", "check", "new", "sheet", "spectrum", "calibration-lines", "calibrate", "history"])
        expect(out).toMatch(new RegExp(`^  ${command}\\s`, "m"));
    },
  };

  it("has a check for every command line of the README", () => {
    const run = readmeCommands()
      .map((args) => args.join(" "))
      .filter((line) => !notRunHere.some((skip) => `${line} `.startsWith(skip)));
    // Each line's check is the longest start that fits it; each check is used by one line.
    const used = run.map(
      (line) =>
        Object.keys(checks)
          .filter((start) => line === start || line.startsWith(`${start} `))
          .sort((a, b) => b.length - a.length)[0],
    );
    expect(used).not.toContain(undefined);
    expect([...used].sort()).toEqual(Object.keys(checks).sort());
  });

  for (const [start, check] of Object.entries(checks)) {
    it(`runs \`bandatlas ${start}\` and prints what it should`, async () => {
      // Files go to a fresh folder: sheet's --out, new's molecule folder.
      const dir = mkdtempSync(join(tmpdir(), "bandatlas-readme-"));
      const args = readmeCommand(start).map((a) => (a.endsWith(".pdf") ? join(dir, a) : a));
      if (args[0] === "new") args.push("--molecules", dir);
      const { stdout, stderr, exitCode } = await cli(...args);
      expect(stderr).toBe("");
      expect(exitCode).toBe(0);
      await check(stdout, dir);
      expect(existsSync(join(root, "co-296K.pdf"))).toBe(false);
    });
  }
});

describe("check reports every problem of a file in one run", () => {
  it("lists the schema, placeholder, CAS, element, link and constant problems of one file together", async () => {
    // An invented file (see its comment): each line below is one kind of problem check used to
    // report only after the kinds before it were fixed.
    const file = join(root, "test/fixtures/bad/every-stage.yaml");
    const { stdout, stderr, exitCode } = await cli("check", file);
    expect(exitCode).toBe(1);
    expect(stdout).toBe("");
    const lines = stderr.trim().split("\n");
    const expected = [
      /:5:1: `formula`: expected the formula as text, got nothing/,
      /:7:1: `formulae`: unknown field "formulae" \(did you mean "formula"\?\)/,
      // CAS check digit of 630-08-? (carbon monoxide's number is 630-08-0; common practice: Σ i·dᵢ mod 10).
      /:8:1: `casNumber`: CAS number "630-08-1" fails its check digit \(expected 0 at the end\)/,
      /:9:1: `aliases`: expected a list of other names, got a mapping/,
      /:11:12: `atoms\[1\]`: "Xx" is not an element symbol/,
      /:18:5: `sources\.invented\.citation`: still holds the template's placeholder REPLACE/,
      /:19:5: `sources\.invented\.url`: a source address must be an https: or http: link/,
      /:28:9: `species\[0\]\.constants\.equilibrium\.bE`: Be \(rotational constant\) must be above 0 cm⁻¹, got -2/,
    ];
    expect(lines).toHaveLength(expected.length + 1);
    expected.forEach((pattern, i) => expect(lines[i]).toMatch(pattern));
    expect(lines.at(-1)).toBe(`${expected.length} problems in 1 of 1 file`);
    expect(stderr).not.toMatch(/\n\s+at /);
  });

  it("says a placeholder where a number belongs once, as the schema's wrong type", async () => {
    const dir = mkdtempSync(join(tmpdir(), "bandatlas-check-"));
    expect((await cli("new", "fresh", "--molecules", dir)).exitCode).toBe(0);
    const { stderr } = await cli("check", join(dir, "fresh.yaml"));
    expect(stderr).toMatch(/`species\[0\]\.constants\.equilibrium\.omegaE\.value`: expected a number in cm⁻¹, got the text "REPLACE"/);
    expect(stderr).not.toMatch(/omegaE\.value`: still holds the template's placeholder/);
    // The text placeholders (name, formula …) are reported in the same run.
    expect(stderr).toMatch(/`name`: still holds the template's placeholder REPLACE/);
  });
});
