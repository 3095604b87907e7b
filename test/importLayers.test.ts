// The folders of lib/ form layers (lib/README.md): each imports only folders below it, so no two
// folders import each other and lib/core stays runnable in the browser without Node. The graph is
// read by test/helpers/importGraph.ts (every import form, worker and bundle entries included).
import { readdirSync, readFileSync } from "node:fs";
import { builtinModules } from "node:module";
import { dirname, join, relative, resolve, sep } from "node:path";
import { describe, expect, it } from "vitest";
import { buildGraph, codeFilesUnder, folderCycles, folderOf, libDir, referencesOf } from "./helpers/importGraph.ts";

/** Lowest first; a folder may import only folders in an earlier row. */
const layers: string[][] = [
  ["core"], // physics: pure functions over plain data
  ["shared"], // build identity, site paths, ticks, index formats, GHS table, command results, job pool
  ["molecules", "spectrumFile"], // molecule files: schema, parsing, validation; measured spectrum files (JCAMP-DX, CSV)
  ["atlas"], // which species, bands, temperatures; AtlasEntry
  ["format"], // numbers, tables, CSV/JSON, notes, bench settings as text
  ["plot", "site", "sheet", "browser"], // renderers: only format what the atlas made
  ["build"], // puts the renderers' output together into site/
  ["cli"], // the command line, on top of everything
];
const renderers = new Set(layers[5]);
/**
 * The packages lib/core may import: plain JavaScript with no Node APIs, so the core still runs in
 * the browser bundle. ml-matrix: the decompositions behind the weighted least-squares fits.
 */
const corePackages = new Set(["ml-matrix"]);
const rankOf = new Map(layers.flatMap((row, rank) => row.map((folder) => [folder, rank] as const)));

const graph = buildGraph();
const evidenceOf = (from: string, to: string) => graph.edges.find((e) => e.from === from && e.to === to)!.evidence;
const isNodeModule = (specifier: string) => specifier.startsWith("node:") || builtinModules.includes(specifier.split("/")[0]);

describe("import layers of lib/", () => {
  it("reads every import form: static, type, re-export, dynamic, import() types and new URL(…, import.meta.url)", () => {
    const text = [
      'import { a } from "./a.ts";',
      'import type { B } from "../b/b.ts";',
      'export * from "./c.ts";',
      'const d = await import("./d.ts");',
      'type E = typeof import("./e.ts").e;',
      'const worker = new Worker(new URL("./f.mjs", import.meta.url));',
      'const name = "g.ts"; await import(name);',
      'const other = new URL("https://example.org/h");',
    ].join("\n");
    const { references, unreadable } = referencesOf("sample.ts", text);
    expect(references.map((r) => [r.kind, r.specifier, r.line])).toEqual([
      ["import", "./a.ts", 1],
      ["import", "../b/b.ts", 2],
      ["export", "./c.ts", 3],
      ["dynamic import", "./d.ts", 4],
      ["import type", "./e.ts", 5],
      ["new URL", "./f.mjs", 6],
    ]);
    expect(unreadable.map((r) => [r.kind, r.specifier, r.line])).toEqual([["dynamic import", "name", 7]]);
  });

  it("finds a cycle and names its folders in order", () => {
    const edges = [
      { from: "sheet", to: "build", evidence: "" },
      { from: "build", to: "site", evidence: "" },
      { from: "site", to: "sheet", evidence: "" },
      { from: "site", to: "core", evidence: "" },
    ];
    expect(folderCycles(edges)).toEqual([["build", "site", "sheet"]]);
  });

  it("can read where every import of lib/ goes (no computed import paths)", () => {
    expect(graph.unreadable, "write the path as a string literal so the layers can be checked").toEqual([]);
  });

  it("has every code file inside a folder that has a layer", () => {
    expect(graph.loose, "move the file into the lib/ folder that owns it").toEqual([]);
    const folders = new Set(codeFilesUnder(libDir).map(folderOf));
    const unlisted = [...folders].filter((f) => !rankOf.has(f));
    expect(unlisted, "add the folder to `layers` in test/importLayers.test.ts and to lib/README.md").toEqual([]);
  });

  it("has no import cycle between lib/ folders", () => {
    const described = folderCycles(graph.edges).map((cycle) => {
      const steps = cycle.map((from, i) => {
        const to = cycle[(i + 1) % cycle.length];
        return `  ${from} → ${to}: ${evidenceOf(from, to)}`;
      });
      return `${[...cycle, cycle[0]].join(" → ")}\n${steps.join("\n")}`;
    });
    expect(described, "folder cycles (move what both sides need into lib/shared or the lower folder)").toEqual([]);
  });

  it("keeps lib/core free of other folders, of Node's modules and of packages not listed as browser-safe", () => {
    const outside = [
      ...graph.edges.filter((e) => e.from === "core").map((e) => e.evidence),
      ...graph.external
        .filter((x) => x.file.startsWith("lib/core/") && !corePackages.has(x.specifier))
        .map((x) => `${x.file}:${x.line} imports ${x.specifier}${isNodeModule(x.specifier) ? " (a Node module)" : " (a package)"}`),
    ];
    expect(outside, "lib/core runs in the browser and in tests as pure functions: pass the data in (a package with no Node API may join corePackages)").toEqual(
      [],
    );
  });

  it("keeps the renderers (plot, site, sheet, browser) from importing one another", () => {
    const between = graph.edges.filter((e) => renderers.has(e.from) && renderers.has(e.to)).map((e) => `${e.from} → ${e.to}: ${e.evidence}`);
    expect(between, "what two renderers share belongs in lib/shared (or lib/format if it is text)").toEqual([]);
  });

  it("imports only downwards, in the order of lib/README.md", () => {
    const upwards = graph.edges
      .filter((e) => rankOf.has(e.from) && rankOf.has(e.to) && rankOf.get(e.to)! >= rankOf.get(e.from)! && !(renderers.has(e.from) && renderers.has(e.to)))
      .map((e) => `${e.from} → ${e.to}: ${e.evidence}`);
    expect(upwards, "a folder may import only the folders listed below it").toEqual([]);
  });

  it("sees the edges it is meant to see", () => {
    // Guards the check itself: were the graph read wrongly (no .mjs, no dynamic imports, nothing
    // followed outside lib/), the tests above would pass on an empty graph.
    const folders = new Set(graph.edges.map((e) => `${e.from}→${e.to}`));
    expect(folders.has("atlas→core")).toBe(true);
    expect(folders.has("cli→build")).toBe(true);
    expect(graph.external.some((x) => x.file.startsWith("lib/") && x.specifier.startsWith("node:"))).toBe(true);
    expect([...graph.followed]).toContain("eleventy.config.ts");
  });

  it("keeps lib/core's own folders in their layers: fitting, positions, intensities, bands, spectra, calibration", () => {
    // Lowest first; a core folder imports only earlier ones (and the shared types, constants and error at core's top).
    const coreLayers = ["fitting", "positions", "intensities", "bands", "spectra", "calibration"];
    const coreDir = join(libDir, "core");
    const subOf = (path: string) => relative(coreDir, path).split(sep);
    const wrong: string[] = [];
    for (const file of codeFilesUnder(coreDir).filter((f) => f.endsWith(".ts"))) {
      const [from, ...rest] = subOf(file);
      if (rest.length === 0) continue; // core's top-level files (index, types, constants, error) may import anything of core
      const fromRank = coreLayers.indexOf(from);
      const { references } = referencesOf(file, readFileSync(file, "utf8"));
      for (const r of references) {
        if (!r.specifier.startsWith(".")) continue;
        const [to, ...toRest] = subOf(resolve(dirname(file), r.specifier));
        if (toRest.length === 0 || to === from) continue; // core's top-level files, or the same folder
        const toRank = coreLayers.indexOf(to);
        if (toRank < 0 || fromRank < 0 || toRank > fromRank) wrong.push(`${relative(coreDir, file)}:${r.line} imports ${r.specifier}`);
      }
    }
    expect(wrong, "a core folder may import only the folders listed before it").toEqual([]);
    expect(
      readdirSync(coreDir, { withFileTypes: true })
        .filter((e) => e.isDirectory())
        .map((e) => e.name)
        .sort(),
    ).toEqual([...coreLayers].sort());
  });
});
