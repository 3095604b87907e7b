import { spawnSync } from "node:child_process";
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { Piscina } from "piscina";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { atlasEntry, selectMolecule } from "../lib/atlas/index.ts";
import { runCli } from "../lib/cli/main.ts";
import { renderBenchSheet, sheetFileName, temperatureLabel, writeBenchSheets } from "../lib/sheet/index.ts";
import { shippedMolecules } from "./helpers/shipped.ts";
import { pdfInfo, pdfText, requireTool, scratchDir } from "./sheetHelpers.ts";

const bin = fileURLToPath(new URL("../bin/bandatlas.js", import.meta.url));
const build = { version: "0.1.0", commit: "0123456789abcdef0123456789abcdef01234567", dateIso: "2025-03-14T09:30:00Z" };

beforeAll(() => {
  for (const tool of ["pdftotext", "pdfinfo"]) requireTool(tool);
});

/** Runs `bandatlas sheet …` in-process in a fresh folder; returns the result and what the folder holds after. */
async function sheetIn(args: (dir: string) => string[]) {
  const dir = scratchDir("sheetcli");
  const result = await runCli(["sheet", ...args(dir)]);
  return { ...result, dir, left: readdirSync(dir) };
}

describe("bandatlas sheet", () => {
  it("writes <molecule>-<species>-<T>K-<paper>.pdf in the working folder by default", () => {
    const dir = scratchDir("sheetcwd");
    const run = spawnSync(process.execPath, [bin, "sheet", "co"], { cwd: dir, encoding: "utf8" });
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    expect(readdirSync(dir)).toEqual(["co-12C16O-296K-a4.pdf"]);
    expect(run.stdout).toMatch(/^wrote co-12C16O-296K-a4\.pdf \(Carbon monoxide, 12C16O, 296 K, a4, \d+ kB\)\n$/);
    expect(pdfText(join(dir, "co-12C16O-296K-a4.pdf"))).toContain("12C16O · band 1-0 (fundamental) · T = 296 K");
  });

  it("takes the issue's own example: H37Cl at 298.15 K on Letter to a named file", async () => {
    const { exitCode, stderr, dir, left } = await sheetIn((d) => [
      "hcl",
      "--species",
      "H37Cl",
      "--temperature",
      "298.15",
      "--paper",
      "letter",
      "--out",
      join(d, "h37cl.pdf"),
    ]);
    expect(stderr).toBe("");
    expect(exitCode).toBe(0);
    expect(left).toEqual(["h37cl.pdf"]);
    expect(pdfInfo(join(dir, "h37cl.pdf"))["Page size"]).toMatch(/^612 x 792 pts/);
  });

  const bad: Array<[string, (dir: string) => string[], RegExp]> = [
    ["an unknown paper size", (d) => ["co", "--paper", "legal", "--out", join(d, "x.pdf")], /^bandatlas sheet: paper "legal" is not one of: a4, letter\n$/],
    [
      "a folder that does not exist",
      (d) => ["co", "--out", join(d, "missing", "x.pdf")],
      /^bandatlas sheet: cannot write .*missing\/x\.pdf: the folder .*missing does not exist\n$/,
    ],
    ["a folder as --out", (d) => ["co", "--out", d], /^bandatlas sheet: cannot write .*: it is a folder; give a file name, e.g. .*sheet\.pdf\n$/],
    [
      "a file name under a regular file",
      (d) => (writeFileSync(join(d, "plain"), "x"), ["co", "--out", join(d, "plain", "x.pdf")]),
      /^bandatlas sheet: cannot write .*plain\/x\.pdf: .*plain is not a folder\n$/,
    ],
    [
      "a temperature that is not a number",
      (d) => ["co", "--temperature", "warm", "--out", join(d, "x.pdf")],
      /^bandatlas sheet: --temperature expects a number in K, got "warm"\n$/,
    ],
    [
      "a negative temperature",
      (d) => ["co", "--temperature", "-5", "--out", join(d, "x.pdf")],
      /^bandatlas sheet: --temperature -5: a temperature must be above 0 K\n$/,
    ],
    [
      "an unknown species",
      (d) => ["co", "--species", "14CO", "--out", join(d, "x.pdf")],
      /^bandatlas sheet: Carbon monoxide has no species "14CO"; it has: 12C16O, 13C16O, 12C18O\n$/,
    ],
    ["an unknown molecule", (d) => ["xenon", "--out", join(d, "x.pdf")], /^bandatlas sheet: unknown molecule "xenon"; the atlas has: .*co.*\n$/],
    ["an empty --out", () => ["co", "--out", ""], /^bandatlas sheet: --out needs a file name, e.g. --out co-296K\.pdf\n$/],
  ];
  for (const [what, args, message] of bad) {
    it(`refuses ${what} with one plain line, exit 2, and leaves no file`, async () => {
      const { exitCode, stdout, stderr, left } = await sheetIn(args);
      expect(stderr).toMatch(message);
      expect(stderr.split("\n").filter(Boolean)).toHaveLength(1);
      expect(stdout).toBe("");
      expect(exitCode).toBe(2);
      expect(left.filter((f) => f !== "plain")).toEqual([]);
    });
  }
});

describe("writeBenchSheets", () => {
  it("names sheets <species>-<T>K-<paper>.pdf with the temperature's own digits", () => {
    expect([296, 298.15, 273.15, 1000].map(temperatureLabel)).toEqual(["296K", "298.15K", "273.15K", "1000K"]);
    expect(sheetFileName("1H35Cl", 298.15, "letter")).toBe("1H35Cl-298.15K-letter.pdf");
  });

  it("writes every entry in A4 and Letter under sheets/<molecule>/, on the main thread and a worker thread, with the same bytes as in-process", async () => {
    const molecules = shippedMolecules();
    const co = selectMolecule(molecules, "co");
    const hf = selectMolecule(molecules, "hf");
    const entries = [...co.species.map((s) => atlasEntry(co, s, 296)), atlasEntry(hf, hf.species[0], 1000)];
    const outDir = scratchDir("site");
    const paths = await writeBenchSheets({ molecules, entries, outDir, build, threads: 2 });
    const expected = ["co/12C16O-296K", "co/13C16O-296K", "co/12C18O-296K", "hf/1H19F-1000K"]
      .flatMap((n) => [`${n}-a4.pdf`, `${n}-letter.pdf`])
      .map((n) => join(outDir, "sheets", n));
    expect(paths).toEqual(expected);
    expect(readdirSync(join(outDir, "sheets", "co")).sort()).toEqual(
      expected
        .slice(0, 6)
        .map((p) => p.split("/").pop())
        .sort(),
    );
    const inProcess = await renderBenchSheet({ molecule: hf, entry: entries[3], paper: "letter", build });
    expect(Buffer.compare(readFileSync(paths[7]), inProcess)).toBe(0);
    expect(pdfText(paths[7])).toContain("1H19F · band 1-0 (fundamental) · T = 1000 K");
  });

  it("renders on a worker thread the same bytes as on the main thread", async () => {
    const hcl = selectMolecule(shippedMolecules(), "hcl");
    const entry = atlasEntry(hcl, hcl.species[1], 273.15);
    const path = join(scratchDir("worker"), "sheets", "hcl", "1H37Cl-273.15K-a4.pdf");
    const pool = new Piscina({ filename: fileURLToPath(new URL("../lib/sheet/sheetWorkerEntry.mjs", import.meta.url)), maxThreads: 1 });
    try {
      expect(await pool.run({ request: { molecule: hcl, entry, paper: "a4", build }, path })).toBe(path);
    } finally {
      await pool.destroy();
    }
    const inProcess = await renderBenchSheet({ molecule: hcl, entry, paper: "a4", build });
    expect(Buffer.compare(readFileSync(path), inProcess)).toBe(0);
  });

  it("fails with a plain message when the site folder cannot hold the sheets, leaving no partial file", async () => {
    const molecules = shippedMolecules();
    const hf = selectMolecule(molecules, "hf");
    const dir = scratchDir("blocked");
    writeFileSync(join(dir, "sheets"), "a file where the folder should be");
    await expect(writeBenchSheets({ molecules, entries: [atlasEntry(hf, hf.species[0], 296)], outDir: dir, build })).rejects.toThrow(
      /^cannot create the folder .*sheets\/hf: ENOTDIR$/,
    );
    mkdirSync(join(dir, "other"));
    expect(readdirSync(dir).sort()).toEqual(["other", "sheets"]);
  });
});
