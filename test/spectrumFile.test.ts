// The spectrum-file reader on invented files (test/fixtures/spectrumFiles/README.md), on two real
// spectra from public teaching laboratories, and on each kind of bad input it must refuse.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { checkSpectrumFileSize, maxSpectrumFileBytes, readSpectrumText, SpectrumFileError, type SpectrumReadOptions } from "../lib/spectrumFile/index.ts";
import { buildGraph } from "./helpers/importGraph.ts";

const fixtures = join(import.meta.dirname, "fixtures");
const readFixture = (name: string, options?: SpectrumReadOptions) =>
  readSpectrumText(readFileSync(join(fixtures, "spectrumFiles", name), "utf8"), name, options);

/** The invented line's absorbance at 2000, 2001, …, 2019 cm⁻¹, as written (4 decimals) in the fixtures. */
const inventedAbsorbance = [
  0.0403, 0.0478, 0.0591, 0.0772, 0.1096, 0.1742, 0.3115, 0.5078, 0.4386, 0.2479, 0.1479, 0.1016, 0.0782, 0.0654, 0.0579, 0.0533, 0.0504, 0.0487, 0.0476,
  0.0471,
];
const wholeWavenumbers = Array.from({ length: 20 }, (_, i) => 2000 + i);

/** The message of the SpectrumFileError the text raises; fails unless it is one line starting with the file name. */
function refusal(text: string, fileName = "scan.csv", options?: SpectrumReadOptions): string {
  try {
    readSpectrumText(text, fileName, options);
  } catch (error) {
    expect(error).toBeInstanceOf(SpectrumFileError);
    const message = (error as Error).message;
    expect(message.startsWith(fileName)).toBe(true);
    expect(message).not.toContain("\n");
    return message;
  }
  throw new Error(`${fileName} was read, but a SpectrumFileError was expected`);
}

/** A CSV of `rows` [x, y] pairs under a header line, so data row i is on line i + 2. */
const csv = (rows: (string | number)[][], header = "Wavenumber (cm-1),Absorbance") => [header, ...rows.map((row) => row.join(","))].join("\n");
const goodRows = () => wholeWavenumbers.map((x, i) => [x, inventedAbsorbance[i]] as (string | number)[]);

/** A one-block JCAMP-DX text with the given records before ##XYDATA and the given data lines. */
const jcamp = (records: string[], dataLines: string[]) =>
  ["##TITLE=invented", "##JCAMP-DX=4.24", ...records, "##XYDATA=(X++(Y..Y))", ...dataLines, "##END="].join("\n");
const absorbanceRecords = (firstX: number, lastX: number, nPoints: number) => [
  "##DATA TYPE=INFRARED SPECTRUM",
  "##XUNITS=1/CM",
  "##YUNITS=ABSORBANCE",
  "##XFACTOR=1",
  "##YFACTOR=0.001",
  `##FIRSTX=${firstX}`,
  `##LASTX=${lastX}`,
  `##NPOINTS=${nPoints}`,
];

describe("JCAMP-DX files", () => {
  it("reads plain AFFN data with XFACTOR and YFACTOR, a falling x axis, ##RESOLUTION, title and instrument", () => {
    const s = readFixture("affn.jdx");
    expect(s.format).toBe("jcamp-dx");
    // The file writes x as 2·wavenumber (XFACTOR 0.5) from 2019 down, y as 10⁴·absorbance (YFACTOR 0.0001).
    expect(Array.from(s.wavenumberCm)).toEqual(wholeWavenumbers);
    s.absorbance.forEach((a, i) => expect(a).toBeCloseTo(inventedAbsorbance[i], 12));
    expect([s.ordinate, s.ordinateFrom, s.abscissaUnit, s.abscissaFrom]).toEqual(["absorbance", "file", "cm-1", "file"]);
    expect(s.resolutionCm).toBe(0.5);
    expect(s.title).toBe("invented AFFN absorbance");
    expect(s.instrument).toBe("Invented FTIR Mark 1");
    expect(s.notes).toContain("The points run from high to low wavenumber in the file; they were put in ascending order.");
    expect(s.notes.join(" ")).not.toMatch(/X values/);
  });

  it("decodes SQZ, DIF and DUP data written by hand, Y check values included", () => {
    const s = readFixture("compressed.jdx");
    const thousandths = [100, 100, 100, 100, 120, 150, 200, 300, 450, 600, 450, 300, 200, 150, 120, 100, 100, 100, 100, 100];
    s.absorbance.forEach((a, i) => expect(a).toBeCloseTo(thousandths[i] / 1000, 12));
    expect(s.absorbance).toHaveLength(20);
    expect(Array.from(s.wavenumberCm)).toEqual(Array.from({ length: 20 }, (_, i) => 2100 + 0.5 * i));
    // The check values (4207, 4213 and 4219 × XFACTOR 0.5) agree with the grid: no note about them.
    expect(s.notes.join(" ")).not.toMatch(/X values/);
    expect(s.resolutionCm).toBeNull();
    expect(s.instrument).toBeNull();
  });

  it("reports an X check value that is a whole point off", () => {
    const text = readFileSync(join(fixtures, "spectrumFiles", "compressed.jdx"), "utf8").replace("\n4219A00", "\n4220A00");
    const s = readSpectrumText(text, "off.jdx");
    expect(s.wavenumberCm[19]).toBe(2109.5);
    expect(s.notes.join(" ")).toMatch(
      /X values at the start of 1 of 4 data lines disagree .* by up to 0\.5 cm⁻¹ \(1 point spacings; line 19 says 2110 where the scale puts 2109\.5\)/,
    );
  });

  it("refuses X values written in SQZ form after DIF lines, which make the library count the Y check values as points", () => {
    const text = readFileSync(join(fixtures, "spectrumFiles", "compressed.jdx"), "utf8").replace(/\n42(\d\d)/g, "\nD2$1");
    expect(refusal(text, "sqz-x.jdx")).toBe(
      "sqz-x.jdx: ##NPOINTS=20 but the data lines hold 23 points, and the X values at the start of the data lines are not plain numbers, so the x values cannot be placed.",
    );
  });

  it("reads MICROMETERS and %T: wavenumber 10⁴/λ, absorbance −log10(T/100), a bare resolution taken as cm⁻¹", () => {
    const s = readFixture("micrometres-percent.jdx");
    expect([s.abscissaUnit, s.abscissaFrom, s.ordinate, s.ordinateFrom]).toEqual(["um", "file", "percent-transmittance", "file"]);
    expect(s.wavenumberCm[0]).toBeCloseTo(1e4 / 4.9975, 9);
    expect(s.wavenumberCm[19]).toBeCloseTo(1e4 / 4.95, 9);
    // λ = 4.98 µm (index 12 of the file, 7 once ascending in wavenumber) has T = 37.00 %.
    expect(s.wavenumberCm[7]).toBeCloseTo(1e4 / 4.98, 9);
    expect(s.absorbance[7]).toBeCloseTo(-Math.log10(0.37), 12);
    expect(s.resolutionCm).toBe(0.5);
    expect(s.notes.join(" ")).toMatch(/##RESOLUTION=0\.5 was taken as 0\.5 cm⁻¹: as a width in µm it would be 10\.05\d* % of the wavelength/);
  });

  it("reads TRANSMITTANCE, clamps a value below zero to 10⁻⁶ and says so, reads a resolution written with its unit", () => {
    const s = readFixture("transmittance.jdx");
    expect(s.ordinate).toBe("transmittance");
    expect(s.absorbance[0]).toBeCloseTo(-Math.log10(0.4764), 12);
    expect(s.absorbance[7]).toBe(6);
    expect(s.notes).toContain("1 point has a transmittance at or below zero (noise on a saturated line); it was set to 10⁻⁶, absorbance 6.");
    expect(s.resolutionCm).toBe(0.25);
  });

  it("keeps FIRSTX/LASTX/NPOINTS when the X check values on the data lines disagree with them, and says by how much", () => {
    const s = readFixture("bad-checkpoints.jdx");
    const step = 11.086 / 23;
    s.wavenumberCm.forEach((x, i) => expect(x).toBeCloseTo(2000 + i * step, 9));
    const note = s.notes.find((n) => n.includes("X values"));
    expect(note).toMatch(/^The X values at the start of 2 of 3 data lines disagree with the scale set by FIRSTX, LASTX and NPOINTS, by up to 0\.032 cm⁻¹/);
    expect(note).toMatch(/\(0\.06639 point spacings; line 17 says 2007\.68 where the scale puts 2007\.71\)/);
    expect(note).toMatch(/placed on the FIRSTX–LASTX scale/);
  });

  it("takes the x scale from the data lines when NPOINTS does not match the points and the check values lie on one line", () => {
    const s = readFixture("npoints-wrong.jdx");
    expect(s.wavenumberCm).toHaveLength(24);
    s.wavenumberCm.forEach((x, i) => expect(x).toBeCloseTo(2000 + 0.5 * i, 9));
    expect(s.notes.join(" ")).toMatch(
      /##NPOINTS=25 but the data lines hold 24 points; .*one straight scale from FIRSTX to LASTX .*\(2000 cm⁻¹ \+ i · 0\.5 cm⁻¹\), so NPOINTS was taken as wrong/,
    );
  });

  it("refuses when NPOINTS does not match and the data lines give no straight scale from FIRSTX to LASTX (a lost line)", () => {
    const line = (x: number) => `${x} ${Array(8).fill(100).join(" ")}`;
    // 32 points announced, the line that starts at 2016 missing.
    const lost = jcamp(absorbanceRecords(2000, 2031, 32), [line(2000), line(2008), line(2024)]);
    expect(refusal(lost, "lost.jdx")).toMatch(
      /^lost\.jdx: ##NPOINTS=32 but the data lines hold 24 points, and the X values on the data lines do not run on one straight scale from FIRSTX to LASTX/,
    );
    // Two lines left: their X values are straight, but they run past LASTX.
    const two = jcamp(absorbanceRecords(2000, 2023, 24), [line(2000), line(2016)]);
    expect(refusal(two, "two-lines.jdx")).toMatch(/^two-lines\.jdx: ##NPOINTS=24 but the data lines hold 16 points/);
  });

  it("refuses peak tables, XYPOINTS, several blocks, NMR, unknown x units and files without XYDATA", () => {
    const peaks = ["##TITLE=peaks", "##JCAMP-DX=4.24", "##DATA TYPE=INFRARED PEAK TABLE", "##PEAK TABLE=(XY..XY)", "2000,0.1 2010,0.5", "##END="].join("\n");
    expect(refusal(peaks, "peaks.jdx")).toMatch(/is a peak table, not a measured spectrum/);
    const xyPoints = ["##TITLE=p", "##JCAMP-DX=4.24", "##XUNITS=1/CM", "##XYPOINTS=(XY..XY)", "2000,0.1; 2010,0.5", "##END="].join("\n");
    expect(refusal(xyPoints, "points.jdx")).toMatch(/stores its points as ##XYPOINTS/);
    const block = jcamp(absorbanceRecords(2000, 2015, 16), ["2000 1 2 3 4 5 6 7 8", "2008 1 2 3 4 5 6 7 8"]);
    const linked = ["##TITLE=two", "##JCAMP-DX=4.24", "##DATA TYPE=LINK", "##BLOCKS=2", block, block, "##END="].join("\n");
    expect(refusal(linked, "two.jdx")).toMatch(/^two\.jdx holds 2 blocks of data; bandatlas reads JCAMP-DX files that hold one spectrum/);
    const nmr = jcamp(["##DATA TYPE=NMR SPECTRUM", ...absorbanceRecords(2000, 2015, 16).slice(1)], ["2000 1 2 3 4 5 6 7 8", "2008 1 2 3 4 5 6 7 8"]);
    expect(refusal(nmr, "nmr.jdx")).toBe(`nmr.jdx is not an infrared spectrum (##DATA TYPE=NMR SPECTRUM).`);
    const hertz = jcamp(
      absorbanceRecords(2000, 2015, 16).map((r) => r.replace("1/CM", "HZ")),
      ["2000 1 2 3 4 5 6 7 8", "2008 1 2 3 4 5 6 7 8"],
    );
    expect(refusal(hertz, "hz.jdx")).toMatch(/##XUNITS=HZ is not a wavenumber or wavelength unit/);
    expect(readSpectrumText(hertz, "hz.jdx", { abscissa: "cm-1" }).abscissaFrom).toBe("option");
    expect(refusal("##TITLE=nothing\n##JCAMP-DX=4.24\n##END=\n", "nothing.jdx")).toMatch(/has no ##XYDATA=\(X\+\+\(Y\.\.Y\)\) block/);
  });
});

describe("CSV, TSV and other column text", () => {
  const expectInvented = (s: ReturnType<typeof readFixture>, digits = 12) => {
    expect(Array.from(s.wavenumberCm)).toEqual(wholeWavenumbers);
    s.absorbance.forEach((a, i) => expect(a).toBeCloseTo(inventedAbsorbance[i], digits));
  };

  it("reads the units from a header", () => {
    const s = readFixture("header.csv");
    expectInvented(s);
    expect([s.format, s.abscissaUnit, s.abscissaFrom, s.ordinate, s.ordinateFrom]).toEqual(["csv", "cm-1", "file", "absorbance", "file"]);
    expect(s.notes).toContain('Line 1 was read as the column header ("Wavenumber (cm-1)", "Absorbance"): x in cm⁻¹, y absorbance.');
    expect([s.title, s.instrument, s.resolutionCm]).toEqual([null, null, null]);
  });

  it("detects the units of a file without a header and says how, naming --x and --y", () => {
    const s = readFixture("no-header.csv");
    expectInvented(s);
    expect([s.abscissaFrom, s.ordinateFrom, s.ordinate]).toEqual(["detected", "detected", "absorbance"]);
    expect(s.notes.join(" ")).toMatch(
      /x values \(2000–2019\) carry no unit; they were read as wavenumbers in cm⁻¹ because they all lie between 200 and 50 000 \(give --x um/,
    );
    expect(s.notes.join(" ")).toMatch(/y values \(0\.0403–0\.5078, median 0\.0713\) carry no unit; they were read as absorbance.*--y/);
  });

  it("skips comment lines, a blank line and free text before the data", () => {
    const s = readFixture("comments.csv");
    expectInvented(s);
    expect(s.notes).toContain("3 lines before the data (title, comments, header) were not read as data.");
    expect(s.notes.join(" ")).toMatch(/Line 4 was read as the column header/);
  });

  it("puts a falling x axis in ascending order", () => {
    const s = readFixture("descending.csv");
    expectInvented(s);
    expect(s.notes).toContain("The points run from high to low wavenumber in the file; they were put in ascending order.");
  });

  it("reads %T from the header and turns it into absorbance", () => {
    const s = readFixture("percent-t.csv");
    expect([s.ordinate, s.ordinateFrom]).toEqual(["percent-transmittance", "file"]);
    // T was written to 0.01 %, so the absorbance agrees with the invented one to about 10⁻⁴.
    expectInvented(s, 3);
    expect(s.absorbance[0]).toBeCloseTo(-Math.log10(0.9114), 12);
  });

  it("reads semicolons with decimal commas, tabs, and runs of spaces", () => {
    const semicolon = readFixture("semicolon.csv");
    expect(semicolon.wavenumberCm[0]).toBe(2000.5);
    expect(semicolon.absorbance[7]).toBe(0.5078);
    expect(semicolon.notes[0]).toBe("Columns separated by semicolons, with decimal commas (detected).");
    const tabs = readFixture("tabs.tsv");
    expectInvented(tabs);
    expect(tabs.notes[0]).toBe("Columns separated by tabs (detected).");
    const spaces = readFixture("whitespace.txt");
    expectInvented(spaces);
    expect(spaces.notes[0]).toBe("Columns separated by spaces (detected).");
  });

  it("ignores the empty column a trailing comma leaves, after an exporter's title line", () => {
    const s = readFixture("trailing-comma.csv");
    expectInvented(s);
    expect(s.notes).toContain("Every data line ended with a delimiter; the empty last column was ignored.");
    expect(s.notes.join(" ")).toMatch(/Line 2 was read as the column header \("cm-1", "A"\)/);
  });

  it("reads a CSV whose comments start with ## as a CSV, not as JCAMP-DX", () => {
    const s = readSpectrumText(`## exported by an invented program\n## 20 points\n${csv(goodRows())}`, "hashes.csv");
    expect(s.format).toBe("csv");
    expectInvented(s);
  });

  it("reads a file with a byte-order mark and CRLF line ends", () => {
    const text = readFileSync(join(fixtures, "spectrumFiles", "bom.csv"), "utf8");
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const s = readSpectrumText(text, "bom.csv");
    expectInvented(s);
    expect(s.abscissaFrom).toBe("file");
  });

  it("detects transmittance and percent transmittance from the values, and percent values under a plain T header", () => {
    const transmittance = inventedAbsorbance.map((a) => (10 ** -a).toFixed(4));
    const fraction = readSpectrumText(
      csv(
        wholeWavenumbers.map((x, i) => [x, transmittance[i]]),
        "cm-1,signal",
      ),
      "t.csv",
    );
    expect([fraction.ordinate, fraction.ordinateFrom]).toEqual(["transmittance", "detected"]);
    expect(fraction.notes.join(" ")).toMatch(/read as transmittance because they lie within 0–1 with a median above 0\.5/);
    const percent = readSpectrumText(
      csv(
        wholeWavenumbers.map((x, i) => [x, (100 * Number(transmittance[i])).toFixed(2)]),
        "cm-1,signal",
      ),
      "p.csv",
    );
    expect([percent.ordinate, percent.ordinateFrom]).toEqual(["percent-transmittance", "detected"]);
    expect(percent.absorbance[7]).toBeCloseTo(inventedAbsorbance[7], 3);
    const labelledT = readSpectrumText(
      csv(
        wholeWavenumbers.map((x, i) => [x, (100 * Number(transmittance[i])).toFixed(2)]),
        "cm-1,T",
      ),
      "t100.csv",
    );
    expect([labelledT.ordinate, labelledT.ordinateFrom]).toEqual(["percent-transmittance", "file"]);
    expect(labelledT.notes.join(" ")).toMatch(/The file says "T" but its values reach 91\.14, so they were read as percent transmittance/);
  });

  it("refuses a --x or --y that contradicts the file's own label (issue 20: a transmittance option on an absorbance file gave a confident wrong correction)", () => {
    expect(() => readFixture("percent-t.csv", { ordinate: "absorbance" })).toThrow(
      /percent-t\.csv: the file gives its y values as "%T" \(percent transmittance\), which --y absorbance contradicts; leave out --y/,
    );
    expect(() => readSpectrumText(csv(Array.from({ length: 20 }, (_, i) => [2.5 + i, 0.1])), "um.csv", { abscissa: "um" })).toThrow(
      /um\.csv: the file gives its x values as "Wavenumber \(cm-1\)" \(cm-1\), which --x um contradicts/,
    );
    // Transmittance on another scale is the same quantity: --y percent on a "%T"-labelled file is no contradiction.
    const s = readFixture("percent-t.csv", { ordinate: "percent-transmittance" });
    expect([s.ordinate, s.ordinateFrom]).toEqual(["percent-transmittance", "option"]);
  });
});

describe("real spectra from public teaching laboratories", () => {
  it("reads Freeman.csv (hcl-dcl-pitt): 40 001 points, 1000–6000 cm⁻¹, absorbance from its header", () => {
    const text = readFileSync(join(fixtures, "spectra", "hcl-dcl-pitt", "Freeman.csv"), "utf8");
    const s = readSpectrumText(text, "Freeman.csv");
    expect(s.wavenumberCm).toHaveLength(40_001);
    expect(s.wavenumberCm[0]).toBe(1000);
    expect(s.wavenumberCm[40_000]).toBe(6000);
    expect(s.wavenumberCm.every((x, i) => i === 0 || x > s.wavenumberCm[i - 1])).toBe(true);
    expect([s.ordinate, s.ordinateFrom, s.abscissaUnit, s.abscissaFrom]).toEqual(["absorbance", "file", "cm-1", "file"]);
    // The file's last row (1000,0.5163,) and first (6000,0.4617,).
    expect(s.absorbance[0]).toBe(0.5163);
    expect(s.absorbance[40_000]).toBe(0.4617);
    expect(s.notes).toContain("Every data line ended with a delimiter; the empty last column was ignored.");
  });

  it("reads HCl_spectrum.csv (hcl-dcl-hunter): 3601 points, 2650–3100 cm⁻¹, absorbance from its header", () => {
    const text = readFileSync(join(fixtures, "spectra", "hcl-dcl-hunter", "HCl_spectrum.csv"), "utf8");
    const s = readSpectrumText(text, "HCl_spectrum.csv");
    expect(s.wavenumberCm).toHaveLength(3601);
    expect([s.wavenumberCm[0], s.wavenumberCm[3600]]).toEqual([2650, 3100]);
    expect(s.wavenumberCm.every((x, i) => i === 0 || x > s.wavenumberCm[i - 1])).toBe(true);
    expect([s.ordinate, s.ordinateFrom]).toEqual(["absorbance", "file"]);
    expect([s.absorbance[0], s.absorbance[3600]]).toEqual([0.0244, 0.0238]);
    // The file prints 2650.125 as 2650.12 (two decimals): the even 0.125 cm⁻¹ grid is restored.
    expect(s.wavenumberCm[1]).toBeCloseTo(2650.125, 9);
    expect(s.notes.some((n) => /printed to 2 decimals .* even grid of step 0\.125000/.test(n))).toBe(true);
  });

  it("keeps x as printed when it is not within rounding of an even grid", () => {
    const rows = Array.from({ length: 20 }, (_, i) => `${(2000 + i * 0.5 + (i === 7 ? 0.01 : 0)).toFixed(2)},${(0.1 + 0.01 * i).toFixed(3)}`);
    const s = readSpectrumText(["cm-1,A", ...rows].join("\n"), "scan.csv");
    expect(s.wavenumberCm[7]).toBeCloseTo(2003.51, 9);
    expect(s.notes.some((n) => /even grid/.test(n))).toBe(false);
  });
});

describe("bad input: one sentence naming the file", () => {
  it("refuses an empty file", () => {
    expect(refusal("")).toBe("scan.csv is empty.");
    expect(refusal("\uFEFF  \n\n")).toBe("scan.csv is empty.");
  });

  it("refuses text that is not a spectrum: a paragraph, a molecule file", () => {
    const paragraph = "Spectra were recorded on Tuesday.\nThe cell was filled with HCl at 50 mbar, then evacuated.\n";
    expect(refusal(paragraph, "notes.txt")).toMatch(/^notes\.txt does not look like a spectrum/);
    const molecule = readFileSync(join(import.meta.dirname, "..", "molecules", "hcl.yaml"), "utf8");
    expect(refusal(molecule, "hcl.yaml")).toMatch(/^hcl\.yaml does not look like a spectrum/);
  });

  it("refuses a single column", () => {
    expect(refusal(wholeWavenumbers.join("\n"))).toBe("scan.csv has only one column of numbers; a spectrum needs two (x and y).");
  });

  it("names the line of a value that is not a number, or not finite", () => {
    const rows = goodRows();
    rows[12][1] = "abc"; // line 14: the header is line 1
    expect(refusal(csv(rows))).toBe('scan.csv line 14: "abc" is not a number.');
    const nan = goodRows();
    nan[7][1] = "NaN";
    expect(refusal(csv(nan))).toBe('scan.csv line 9: "NaN" is not a number.');
    const huge = goodRows();
    huge[3][0] = "1e999";
    expect(refusal(csv(huge))).toBe('scan.csv line 5: "1e999" is not a finite number.');
    const inf = goodRows();
    inf[4][1] = "-inf";
    expect(refusal(csv(inf))).toBe('scan.csv line 6: "-inf" is not a finite number.');
  });

  it("refuses fewer than 16 points", () => {
    expect(refusal(csv(goodRows().slice(0, 15)))).toBe("scan.csv: only 15 data points; a spectrum needs at least 16.");
  });

  it("refuses duplicate x values and x values that turn back, naming the line", () => {
    const duplicate = goodRows();
    duplicate[5][0] = 2004;
    expect(refusal(csv(duplicate))).toMatch(/^scan\.csv line 7: x = 2004 repeats the x value of the point before it/);
    const turning = goodRows();
    turning[7][0] = 2003.5;
    expect(refusal(csv(turning))).toMatch(/^scan\.csv line 9: x = 2003\.5 breaks the rising order/);
  });

  it("refuses x values at or below zero", () => {
    const rows = goodRows().map(([, y], i) => [i - 3, y]);
    expect(refusal(csv(rows))).toBe("scan.csv line 2: x = -3 cm-1 is not a positive wavenumber.");
    const wavelengths = Array.from({ length: 20 }, (_, i) => [i * 0.5, 0.1]);
    expect(refusal(csv(wavelengths, "Wavelength (um),Absorbance"))).toBe("scan.csv line 2: x = 0 um is not a positive wavelength.");
  });

  it("refuses x values without a unit that are not clearly wavenumbers, naming --x", () => {
    const micrometres = Array.from({ length: 19 }, (_, i) => [2.5 + i * 1.25, 0.1]);
    expect(refusal(csv(micrometres, "x,y"))).toBe(
      "scan.csv: the x values (2.5–25) look like micrometres, but the file does not say; give --x um (or --x cm-1)",
    );
    const unclear = Array.from({ length: 20 }, (_, i) => [120 + 3 * i, 0.1]);
    expect(refusal(csv(unclear, "x,y"))).toMatch(
      /^scan\.csv: the x values \(120–177\) carry no unit and are not clearly wavenumbers; give --x cm-1, --x um or --x nm/,
    );
  });

  it("refuses more than two columns and a data line with one value", () => {
    const three = goodRows().map((row) => [...row, 1]);
    expect(refusal(csv(three))).toBe("scan.csv line 2: 3 values where two columns (x and y) are expected.");
    const short = goodRows().map((row) => row.join(","));
    short[10] = "2010";
    expect(refusal(["cm-1,A", ...short].join("\n"))).toBe('scan.csv line 12: only one value ("2010"); each data line needs an x and a y value.');
  });

  it("refuses a file over 50 MB before reading it", () => {
    expect(maxSpectrumFileBytes).toBe(52_428_800);
    expect(() => checkSpectrumFileSize("big.csv", maxSpectrumFileBytes)).not.toThrow();
    expect(() => checkSpectrumFileSize("big.csv", 60 * 1024 * 1024)).toThrow(
      new SpectrumFileError("big.csv is 60.0 MB, more than the 50 MB a spectrum file may have."),
    );
  });
});

describe("lib/spectrumFile runs in the browser", () => {
  it("imports no Node module and no package but jcampconverter and papaparse, and no folder but core and shared", () => {
    const graph = buildGraph();
    const packages = graph.external.filter((x) => x.file.startsWith("lib/spectrumFile/")).map((x) => x.specifier);
    expect(new Set(packages)).toEqual(new Set(["jcampconverter", "papaparse"]));
    const folders = graph.edges.filter((e) => e.from === "spectrumFile").map((e) => e.to);
    expect(folders.every((to) => to === "core" || to === "shared")).toBe(true);
    expect(folders).toContain("core");
  });
});
