// Calibration records (issue 24): the record's fields, the verdict against a tolerance, how to
// apply the correction, the JSON-lines log written safely, and `bandatlas history`.
// Every instrument, operator, cell and date below is INVENTED for these tests; the spectra are the
// real teaching-laboratory HCl files in test/fixtures/spectra (MIT, provenance beside them) and
// synthetic ones made by the project's own cell model (lib/atlas/syntheticSpectrum.ts).
import { execFileSync } from "node:child_process";
import { appendFileSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { checkVerdict, controlLimits, shiftAtWavenumber, trendBreaks, type WavenumberCorrection } from "../lib/core/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { calibrationLogSchema, parseCalibrationLog, type CalibrationLogEntry } from "../lib/format/index.ts";
import { jcampMeasuredOn } from "../lib/spectrumFile/jcampDate.ts";
import { coCellJcamp } from "./helpers/coCellJcamp.ts";
import { pdfText } from "./sheetHelpers.ts";

const hunter = join(import.meta.dirname, "fixtures", "spectra", "hcl-dcl-hunter", "HCl_spectrum.csv");
const pitt = join(import.meta.dirname, "fixtures", "spectra", "hcl-dcl-pitt", "Freeman.csv");
const dir = mkdtempSync(join(tmpdir(), "bandatlas-records-"));
const words = (text: string) => text.replace(/\s+/g, " ");
/** One page's text (pdftotext, poppler-utils). */
const pdfPage = (pdf: string, page: number) =>
  execFileSync("pdftotext", ["-layout", "-f", String(page), "-l", String(page), "-enc", "UTF-8", pdf, "-"], { encoding: "utf8" });

// Invented record fields.
const instrument = "FTIR-7 (invented)";
const operator = "R. Example (invented)";

async function ok(...args: string[]): Promise<string> {
  const { stdout, stderr, exitCode } = await runCli(args);
  expect(stderr).toBe("");
  expect(exitCode).toBe(0);
  return stdout;
}
async function refused(...args: string[]): Promise<string> {
  const { stdout, stderr, exitCode } = await runCli(args);
  expect(stdout).toBe("");
  expect(exitCode).toBe(2);
  expect(stderr).not.toMatch(/\n\s+at |internal error/);
  expect(stderr.trim().split("\n")).toHaveLength(1);
  return stderr;
}

/** A linear correction with the fields the verdict reads; invented numbers. */
function correction(scale: number, offsetCm: number, scaleSigma: number, offsetSigmaCm: number, rho: number): WavenumberCorrection {
  return {
    model: "linear",
    scale,
    scaleUncertainty: scaleSigma,
    offsetCm,
    offsetUncertaintyCm: offsetSigmaCm,
    quadraticPerCm: 0,
    quadraticUncertaintyPerCm: 0,
    centreCm: 2900,
    scaleOffsetCorrelation: rho,
    reducedChiSquared: 1,
    degreesOfFreedom: 8,
    maxTermCorrelation: Math.abs(rho),
  };
}

describe("the verdict rule (ILAC-G8:09/2019 §4.2.3, guard band w = U; invented numbers)", () => {
  const at = (shiftCm: number, sigmaCm: number) => ({ wavenumberCm: 2000, shiftCm, sigmaCm });
  const tol = { unit: "cm-1", valueCm: 0.01 } as const;
  it("passes only when |error| + 2σ ≤ T, fails when |error| − 2σ > T, else undecided", () => {
    expect(checkVerdict(at(0.006, 0.002), tol).verdict).toBe("pass"); // 0.006 + 0.004 = T exactly
    expect(checkVerdict(at(-0.0061, 0.002), tol).verdict).toBe("undecided");
    expect(checkVerdict(at(0.0139, 0.002), tol).verdict).toBe("undecided"); // 0.0139 − 0.004 < T
    expect(checkVerdict(at(-0.0141, 0.002), tol).verdict).toBe("fail");
    // ppm: 5 ppm at 2000 cm⁻¹ is 0.01 cm⁻¹.
    expect(checkVerdict(at(0.006, 0.002), { unit: "ppm", valuePpm: 5 }).toleranceCm).toBeCloseTo(0.01, 12);
  });

  it("propagates the shift's σ with the k–c correlation (GUM §5.2.2)", () => {
    // k = 10 ppm ± 1 ppm, c = −0.02 ± 0.002 cm⁻¹, ρ = −0.9: σ² = ν²σk² + σc² + 2νρσkσc.
    const c = correction(10e-6, -0.02, 1e-6, 0.002, -0.9);
    const s = shiftAtWavenumber(c, 2000);
    expect(s.shiftCm).toBeCloseTo(2000 * 10e-6 - 0.02, 15);
    expect(s.sigmaCm).toBeCloseTo(Math.sqrt(0.002 ** 2 + 0.002 ** 2 - 2 * 0.9 * 0.002 * 0.002), 12);
    // Without the correlation the σ would be 0.0028 cm⁻¹, 3.2× too large: the correlation is used.
    expect(s.sigmaCm).toBeLessThan(0.001);
  });
});

describe("trend limits (a control chart of individual runs; common practice, no source)", () => {
  it("flags a run outside mean ± 3 SD of the others, and not the others", () => {
    const k = [12.1, 11.4, 12.8, 11.9, 12.3, 25.0, 12.0]; // invented ppm
    expect(trendBreaks(k)).toEqual([false, false, false, false, false, true, false]);
    const limits = controlLimits([1, 2, 3]);
    expect(limits.mean).toBe(2);
    expect(limits.standardDeviation).toBe(1);
    expect([limits.lower, limits.upper]).toEqual([-1, 5]);
    // Fewer than 4 other runs: nothing is judged.
    expect(trendBreaks([1, 1, 1, 50])).toEqual([false, false, false, false]);
  });
});

describe("JCAMP-DX dates", () => {
  it("reads ##LONG DATE and a YY/MM/DD ##DATE, refuses what is ambiguous (JCAMP-DX 4.24 and 5 forms; from memory)", () => {
    expect(jcampMeasuredOn("2024/03/05 10:11:12", "98/07/21").date).toBe("2024-03-05");
    expect(jcampMeasuredOn(undefined, "98/07/21").date).toBe("1998-07-21");
    expect(jcampMeasuredOn(undefined, "24/02/30").date).toBeNull(); // no 30 February
    const dayFirst = jcampMeasuredOn(undefined, "21.07.1998");
    expect(dayFirst.date).toBeNull();
    expect(dayFirst.note).toMatch(/give --measured-on/);
    expect(jcampMeasuredOn(undefined, undefined)).toEqual({ date: null, note: null });
  });
});

/** A synthetic CO cell with a known scale error, written as JCAMP-DX with an (invented) date. */
function coJcamp(name: string, scale: number, seed: number, date: string | null): string {
  const path = join(dir, name);
  writeFileSync(path, coCellJcamp({ scale, seed, jcampVersion: "5.01", ...(date ? { longDate: date } : {}) }));
  return path;
}

describe("calibrate with a record (invented instrument, operator, cell and dates)", () => {
  let co150: string;
  beforeAll(() => {
    co150 = coJcamp("co-150ppm.jdx", 150e-6, 21, "2025/02/03");
  });

  it("takes the JCAMP-DX file's date unless --measured-on is given, and records the fields in the JSON", async () => {
    const doc = JSON.parse(
      await ok("calibrate", co150, "--gas", "co", "--instrument", instrument, "--operator", operator, "--cell", "CO-2:2024-12-01", "--format", "json"),
    );
    expect(doc.record).toEqual({
      instrument,
      operator,
      cell: { id: "CO-2", filledOn: "2024-12-01" },
      measuredOn: "2025-02-03",
      measuredOnFrom: "file",
      tolerance: null,
    });
    expect(doc.verdict).toBeNull();
    const typed = JSON.parse(await ok("calibrate", co150, "--gas", "co", "--measured-on", "2025-02-04", "--format", "json"));
    expect([typed.record.measuredOn, typed.record.measuredOnFrom]).toEqual(["2025-02-04", "option"]);
  }, 60_000);

  it("a +150 ppm error (synthetic, known truth) fails a 100 ppm tolerance and passes a 1000 ppm one; 150 ppm is undecided", async () => {
    const verdict = async (tolerance: string) => JSON.parse(await ok("calibrate", co150, "--gas", "co", "--tolerance", tolerance, "--format", "json"));
    const tight = await verdict("100 ppm");
    expect(tight.verdict).toBe("fail");
    expect(tight.verdictChecks).toHaveLength(2); // the band's lowest and highest line used
    // measured − true = −k·ν: the scale reads low by about 150 ppm × ν.
    for (const c of tight.verdictChecks) expect(c.errorCm / c.wavenumberCm / -1e-6).toBeCloseTo(tight.correction.scalePpm, -0.5);
    expect((await verdict("1000 ppm")).verdict).toBe("pass");
    // Unquoted, as a user types it: the unit word joins its number.
    expect(JSON.parse(await ok("calibrate", co150, "--gas", "co", "--tolerance", "1000", "ppm", "--format", "json")).verdict).toBe("pass");
    expect((await verdict("150 ppm")).verdict).toBe("undecided");
    const at = await verdict("0.5 cm-1 at 2100,2200");
    expect(at.verdictChecks.map((c: { wavenumberCm: number }) => c.wavenumberCm)).toEqual([2100, 2200]);
    expect(at.verdict).toBe("pass"); // 150 ppm × 2200 cm⁻¹ = 0.33 cm⁻¹ < 0.5
    expect(at.verdictRule).toMatch(/ILAC-G8:09\/2019 §4\.2\.3/);
  }, 60_000);

  it("the table says the verdict, the rule, how to apply k and the residual after correction; unset cell conditions are assumed", async () => {
    const out = await ok("calibrate", hunter, "--gas", "hcl", "--instrument", instrument, "--pressure", "20", "Torr", "--tolerance", "200 ppm");
    expect(out).toMatch(/^instrument: FTIR-7 \(invented\)$/m);
    expect(out).toMatch(/^verdict: (PASS|FAIL|UNDECIDED): /m);
    expect(out).toMatch(/^Rule: pass only when \|error\| \+ U ≤ tolerance, fail when \|error\| − U > tolerance, else undecided/m);
    expect(out).toMatch(/laser-referenced FTIR set the reference-laser wavenumber to ν_laser × \(1 \+ k\) = ν_laser × 1\.0000\d*/);
    expect(out).toMatch(/^residual after correction at \d+\.\d\d cm⁻¹: 0 ± \d\.\d{4} cm⁻¹ \(U, k = 2\)$/m);
    // Pressure given, the rest assumed (marked on the cell line and in a note).
    expect(out).toMatch(/cell: 10 cm cell \(assumed\), 296 K \(assumed\), 20\.00 Torr, mole fraction 1 \(assumed\)/);
    expect(out).toMatch(/note: The cell's path length, temperature and mole fraction were not given and are assumed/);
    const doc = JSON.parse(await ok("calibrate", hunter, "--gas", "hcl", "--pressure", "20", "Torr", "--format", "json"));
    expect(doc.conditionsAssumed).toEqual(["pathCm", "temperatureK", "moleFraction"]);
    expect(doc.apply).toMatch(/^To apply: on a laser-referenced FTIR/);
  }, 60_000);

  it("a linear model says the laser setting leaves the offset, and how much", async () => {
    const doc = JSON.parse(await ok("calibrate", co150, "--gas", "co", "--model", "linear", "--format", "json"));
    expect(doc.apply).toMatch(/corrects the scale only, and the offset remains/);
    for (const r of doc.residualsAfterCorrection) expect(r.afterLaserOnlyCm).toBeCloseTo(doc.correction.offsetCm, 2);
  }, 60_000);

  it("refuses bad record options in one sentence", async () => {
    expect(await refused("calibrate", hunter, "--gas", "hcl", "--measured-on", "2025-02-30")).toMatch(
      /--measured-on 2025-02-30: give a calendar date as YYYY-MM-DD/,
    );
    expect(await refused("calibrate", hunter, "--gas", "hcl", "--tolerance", "5 furlongs")).toMatch(
      /--tolerance "5 furlongs": give a value and a unit, cm-1 or ppm/,
    );
    expect(await refused("calibrate", hunter, "--gas", "hcl", "--tolerance", "0 ppm")).toMatch(/must be above 0/);
    expect(await refused("calibrate", hunter, "--gas", "hcl", "--cell", ":2025-01-01")).toMatch(/--cell :2025-01-01: give the cell's identifier/);
  });
});

describe("--log: one JSON line per run, appended safely", () => {
  const log = join(dir, "calibrations.jsonl");
  let entries: CalibrationLogEntry[];

  beforeAll(async () => {
    await ok(
      "calibrate",
      hunter,
      "--gas",
      "hcl",
      "--instrument",
      instrument,
      "--operator",
      operator,
      "--measured-on",
      "2025-01-06",
      "--tolerance",
      "200 ppm",
      "--log",
      log,
    );
    await ok("calibrate", pitt, "--gas", "hcl", "--instrument", instrument, "--measured-on", "2025-02-03", "--log", log, "--format", "json");
    // A refused run is logged too (CO has no lines in an HCl spectrum).
    await refused("calibrate", hunter, "--gas", "co", "--instrument", instrument, "--measured-on", "2025-03-03", "--log", log);
    const parsed = parseCalibrationLog(readFileSync(log, "utf8"));
    expect(parsed.problems).toEqual([]);
    entries = parsed.entries.map((e) => e.entry);
  }, 120_000);

  it("writes whole lines with the schema, version, SHA-256, correction with its budget, verdict and build", () => {
    const text = readFileSync(log, "utf8");
    expect(text.endsWith("\n")).toBe(true);
    expect(text.split("\n")).toHaveLength(4);
    const [first, second, third] = entries;
    expect(first.schema).toBe(calibrationLogSchema);
    expect(first.version).toBe(1);
    expect(first.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(first.correction!.budget.parts.length).toBeGreaterThan(0);
    expect(first.verdict).toMatch(/^(pass|fail|undecided)$/);
    expect(first.build.commit).toMatch(/^([0-9a-f]{40}|unknown)$/);
    expect(first.conditionsAssumed).toEqual(["pathCm", "temperatureK", "pressurePa", "moleFraction"]);
    expect(second.verdict).toBeNull();
    expect([third.outcome, third.correction]).toEqual(["refused", null]);
    expect(third.refusal).toMatch(/carbon monoxide has no lines/);
  });

  it("refuses to append after a cut last line, naming it, and leaves the file as it was", async () => {
    const cut = join(dir, "cut.jsonl");
    const whole = readFileSync(log, "utf8");
    const broken = whole + whole.split("\n")[0].slice(0, 120); // a fourth line cut short
    writeFileSync(cut, broken);
    const message = await refused("calibrate", hunter, "--gas", "hcl", "--log", cut);
    expect(message).toMatch(/--log .*cut\.jsonl: line 4 incomplete \(no line end\).*nothing was written/);
    expect(readFileSync(cut, "utf8")).toBe(broken);
  }, 60_000);

  it("refuses a file that is not a log (a foreign last line), naming the line", async () => {
    const foreign = join(dir, "foreign.jsonl");
    writeFileSync(foreign, '{"time": "2025-01-01", "value": 3}\n');
    expect(await refused("calibrate", hunter, "--gas", "hcl", "--log", foreign)).toMatch(/line 1 not a bandatlas calibration record/);
    const yaml = join(import.meta.dirname, "..", "molecules", "hcl.yaml");
    expect(await refused("calibrate", hunter, "--gas", "hcl", "--log", yaml)).toMatch(
      /hcl\.yaml: line \d+ not JSON: this file does not look like a calibration log/,
    );
  }, 60_000);

  it("reports malformed, foreign and newer lines with their numbers and keeps the rest", () => {
    const good = readFileSync(log, "utf8").split("\n")[0];
    const newer = JSON.stringify({ ...JSON.parse(good), version: 2 });
    const text = [good, "not json at all", "", '{"schema": "something else"}', newer, good].join("\n"); // no final line end
    const parsed = parseCalibrationLog(text);
    expect(parsed.entries.map((e) => e.line)).toEqual([1, 6]);
    expect(parsed.problems).toEqual([
      { line: 2, message: "not JSON: not json at all" },
      { line: 4, message: expect.stringMatching(/^not a bandatlas calibration record/) },
      { line: 5, message: expect.stringMatching(/newer bandatlas \(version 2; this one reads up to 1\)/) },
    ]);
    const cut = parseCalibrationLog(`${good}\n${good.slice(0, 50)}`);
    expect(cut.problems).toEqual([{ line: 2, message: expect.stringMatching(/^incomplete: the last line has no line end/) }]);
  });
});

describe("bandatlas history", () => {
  const log = join(dir, "history.jsonl");
  beforeAll(async () => {
    await ok("calibrate", hunter, "--gas", "hcl", "--instrument", instrument, "--measured-on", "2025-01-06", "--tolerance", "200 ppm", "--log", log);
    // Invented runs: the first record with k moved, one run far off the others.
    const first = JSON.parse(readFileSync(log, "utf8").split("\n")[0]) as CalibrationLogEntry;
    const kPpm = [3.1, 5.2, 4.4, 2.9, 4.0, 60.0];
    const lines = kPpm.map((k, i) =>
      JSON.stringify({ ...first, measuredOn: `2025-0${i + 2}-0${i + 1}`, correction: { ...first.correction, scalePpm: k, scalePpmUncertainty: 1.5 } }),
    );
    appendFileSync(log, lines.join("\n") + "\n");
    appendFileSync(log, '{"broken": \n'); // a malformed line: reported, never dropped in silence
  }, 60_000);

  it("prints every run, flags the one that breaks the trend and names the line it could not read", async () => {
    const { stdout, stderr, exitCode } = await runCli(["history", log]);
    expect([stderr, exitCode]).toEqual(["", 0]);
    expect(stdout).toMatch(/^NOT READ: history\.jsonl line 8: not JSON/m);
    const rows = stdout.split("\n").filter((l) => /^\s+\d+\s+20\d\d-/.test(l));
    expect(rows).toHaveLength(7);
    expect(rows.filter((r) => r.includes("BREAKS TREND")).map((r) => r.trim().split(/\s+/)[0])).toEqual(["7"]);
    expect(stdout).toContain("common practice, no source");
  }, 60_000);

  it("writes the same chart as SVG and in a PDF", async () => {
    const svg = join(dir, "chart.svg");
    await ok("history", log, "--out", svg);
    const text = readFileSync(svg, "utf8");
    expect(text).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
    expect(text).toContain("Wavenumber-scale history of FTIR-7 (invented)");
    expect(text).toContain("line 7: breaks the trend");
    expect(text).toMatch(/tolerance ±200 ppm/);
    expect(text).toMatch(/mean [\d.]+ ± 3 SD \(6 runs\)/);
    expect(text).not.toMatch(/<script/);
    const pdf = join(dir, "chart.pdf");
    await ok("history", log, "--out", pdf);
    const pdfWords = words(pdfText(pdf));
    expect(pdfWords).toContain("Wavenumber-scale history of FTIR-7 (invented)");
    expect(pdfWords).toContain("line 7: breaks the trend");
    expect(pdfWords).toContain("line 8: not JSON");
    expect(pdfWords).toMatch(/safety data sheet/);
  }, 60_000);

  it("refuses what it cannot chart in one sentence", async () => {
    expect(await refused("history", join(dir, "none.jsonl"))).toMatch(/cannot read .*none\.jsonl: no such file/);
    const foreign = join(dir, "foreign-only.jsonl");
    writeFileSync(foreign, "a,b\n1,2\n");
    expect(await refused("history", foreign)).toMatch(/holds no calibration record; line 1: not JSON: a,b; line 2: not JSON: 1,2/);
    expect(await refused("history", log, "--out", join(dir, "chart.png"))).toMatch(/ending in \.pdf or \.svg/);
    expect(await refused("history", log, "--instrument", "FTIR-0")).toMatch(/the log has no run of it; it has: FTIR-7 \(invented\)/);
  });
});

describe("the PDF report", () => {
  it("page 1 carries the record, the verdict, the budget and the review lines", async () => {
    const pdf = join(dir, "record.pdf");
    await ok(
      "calibrate",
      hunter,
      "--gas",
      "hcl",
      "--instrument",
      instrument,
      "--operator",
      operator,
      "--cell",
      "HC-3:2025-01-14",
      "--measured-on",
      "2025-03-14",
      "--tolerance",
      "0.05 cm-1 at 2886,2960",
      "--report",
      pdf,
    );
    const page1 = words(pdfPage(pdf, 1));
    for (const expected of [
      "instrument FTIR-7 (invented)",
      "operator R. Example (invented)",
      "cell HC-3, filled 2025-01-14",
      "measured on 2025-03-14",
      "Verdict:",
      "uncertainty budget",
      "Reviewed by",
      "Approved by",
      "signature",
      "(assumed)",
      "To apply:",
    ])
      expect(page1).toContain(expected);
  }, 60_000);

  it("a refused run writes a short report saying why, and the refusal names it", async () => {
    const pdf = join(dir, "refused.pdf");
    const message = await refused("calibrate", hunter, "--gas", "co", "--instrument", instrument, "--report", pdf);
    expect(message).toMatch(/carbon monoxide has no lines .*a report saying why is in .*refused\.pdf/);
    const text = words(pdfText(pdf, true));
    expect(text).toContain("Calibration refused");
    expect(text).toMatch(/carbon monoxide has no lines/);
    expect(text).toContain("instrument FTIR-7 (invented)");
    expect(text).toContain("Reviewed by");
    expect(text).toMatch(/HAZARD CAUTION/);
  }, 60_000);
});
